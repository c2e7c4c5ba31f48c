// siteFromWorkbook reads back exactly what buildWorkbook wrote, keeps the banks a user chose,
// and says where a value cannot be read.
import { describe, expect, it } from 'vitest';
import type { EquipmentRow, Site } from '../../../src/core/site/model.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { CellContent, WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { PLANT } from './sites.ts';
import { sheet, templateSites } from './engineDoc.ts';

/** Equipment without the source row numbers (a workbook numbers its rows its own way), by tag. */
function comparable(site: Site) {
  const strip = ({ row: _row, ...rest }: EquipmentRow) => rest;
  return {
    settings: site.settings,
    equipment: site.equipment.map(strip).sort((a, b) => a.tag.localeCompare(b.tag)),
  };
}

function edit(doc: WorkbookDoc, sheetName: string, tag: string, header: string, value: CellContent): void {
  const s = sheet(doc, sheetName);
  const col = s.cells[0]?.indexOf(header) ?? -1;
  const row = s.cells.find((r) => r[0] === tag);
  if (col < 0 || !row) throw new Error(`no ${header} for ${tag}`);
  row[col] = value;
}

const ODD: Site = {
  settings: {
    name: 'Odd values',
    hz: 60,
    cases: ['only'],
    requirement: { kind: 'tanphi', lagMax: 0.4, leadMax: 0.1 },
  },
  equipment: [
    {
      row: 2,
      tag: 'TX',
      bus: 'A',
      kind: 'transformer',
      to_bus: 'B',
      values: { s_kva: 500, uk_pct: 4, p0_kw: 0.8, pk_kw: 5, i0_pct: 1.5, load: 0.5 },
      loads: { only: 0.7 },
    },
    {
      row: 3,
      tag: 'M',
      bus: 'B',
      kind: 'motor',
      to_bus: 'nowhere',
      values: { p_kw: 30, eff: 0.92, cos_phi: 0.85, s_kva: 40, c_uf_km: 0.2 },
      loads: {},
    },
  ],
};

describe('siteFromWorkbook(buildWorkbook(site)) equals the site', () => {
  for (const { name, site } of [
    { name: 'invented plant', site: PLANT },
    { name: 'values the sheets have no column for', site: ODD },
    ...templateSites(),
  ]) {
    for (const flavour of ['live', 'portable'] as const) {
      it(`${name} (${flavour})`, () => {
        const back = siteFromWorkbook(buildWorkbook(site, { flavour }));
        expect(back.problems).toEqual([]);
        expect(comparable(back.site)).toEqual(comparable(site));
        expect(new Set(back.site.equipment.map((r) => r.row)).size).toBe(site.equipment.length);
        expect(back.origins).toHaveLength(site.equipment.length);
      });
    }
  }

  it('puts values a sheet has no column for into "Other values" and back', () => {
    const doc = buildWorkbook(ODD, { flavour: 'live' });
    const motors = sheet(doc, 'Motors');
    const col = motors.cells[0]?.indexOf('Other values') ?? -1;
    expect(motors.cells[1]?.[col]).toBe('to_bus=nowhere; s_kva=40; c_uf_km=0.2');
    const tx = sheet(doc, 'Transformers');
    expect(tx.cells[1]?.[tx.cells[0]?.indexOf('Other values') ?? -1]).toBe('load=0.5; load:only=0.7');
  });

  it('says where each row came from', () => {
    const back = siteFromWorkbook(buildWorkbook(PLANT, { flavour: 'live' }));
    const i = back.site.equipment.findIndex((r) => r.tag === 'CB1');
    expect(back.origins[i]).toEqual({ sheet: 'Capacitors and reactors', row: 1 });
  });
});

describe("a user's edits become the site", () => {
  it('reads edited inputs, a changed setting and a new row', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    edit(doc, 'Motors', 'M2', 'Rated output (kW)', 90);
    edit(doc, 'Loads', 'L1', 'Load: night', '0.25'); // typed as text: still a number
    sheet(doc, 'Site').cells[2]![1] = 60;
    const loads = sheet(doc, 'Loads');
    const blank = loads.cells[0]!.map(() => null as CellContent);
    const header = loads.cells[0] as string[];
    blank[header.indexOf('Tag')] = 'L9';
    blank[header.indexOf('Bus')] = 'PUMP';
    blank[header.indexOf('P (kW)')] = 12;
    blank[header.indexOf('cos φ')] = 0.9;
    loads.cells.push(
      blank,
      loads.cells[0]!.map(() => null),
    ); // a new row, then an empty one
    const back = siteFromWorkbook(doc);
    expect(back.problems).toEqual([]);
    expect(back.site.settings.hz).toBe(60);
    expect(back.site.equipment.find((r) => r.tag === 'M2')?.values.p_kw).toBe(90);
    expect(back.site.equipment.find((r) => r.tag === 'L1')?.loads.night).toBe(0.25);
    expect(back.site.equipment.find((r) => r.tag === 'L9')).toMatchObject({
      bus: 'PUMP',
      kind: 'load',
      values: { p_kw: 12, cos_phi: 0.9 },
    });
    expect(back.site.equipment).toHaveLength(PLANT.equipment.length + 1);
  });

  it('keeps the banks entered on the Compensation sheet through a rebuild', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    const comp = sheet(doc, 'Compensation');
    const h = comp.cells[0] as string[];
    const pump = comp.cells.find((r) => r[0] === 'PUMP') as CellContent[];
    pump[h.indexOf('Step (kvar)')] = 100;
    pump[h.indexOf('Steps')] = 3;
    pump[h.indexOf('Detuning p (%)')] = 7;
    const back = siteFromWorkbook(doc);
    expect(back.banks.find((b) => b.bus === 'PUMP')).toEqual({
      bus: 'PUMP',
      step_kvar: 100,
      steps: 3,
      p_pct: 7,
    });
    const rebuilt = buildWorkbook(back.site, { flavour: 'live', banks: back.banks });
    const again = siteFromWorkbook(rebuilt);
    expect(again.banks).toEqual(back.banks);
    // The design's bank on LV2 (400 V): steps within the 50 kvar contactor limit (stepRules.ts).
    expect(again.banks.find((b) => b.bus === 'LV2')).toMatchObject({
      fixed_kvar: 15,
      step_kvar: 50,
      steps: 7,
      p_pct: 7,
      u_rated_kv: 0.48,
    });
  });
});

describe('bad inputs are reported with sheet, row and column', () => {
  it('a word in a number column, a formula in an input, an unknown kind, a bad frequency', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    edit(doc, 'Motors', 'M1', 'Efficiency', 'high');
    edit(doc, 'Loads', 'L2', 'P (kW)', '=100*2');
    edit(doc, 'Capacitors and reactors', 'R1', 'Kind', 'inductor');
    sheet(doc, 'Site').cells[2]![1] = 55;
    const { problems, site } = siteFromWorkbook(doc);
    const messages = problems.map((p) => p.message);
    expect(messages).toContain('sheet Motors, row 2, column "Efficiency": must be a number; got "high"');
    expect(messages).toContain(
      'sheet Loads, row 3, column "P (kW)": holds the formula =100*2; inputs are read as typed numbers',
    );
    const r1 = sheet(doc, 'Capacitors and reactors').cells.findIndex((r) => r[0] === 'R1') + 1;
    expect(messages).toContain(
      `sheet Capacitors and reactors, row ${r1}, column "Kind": kind must be one of capacitor, reactor on this sheet; got "inductor"; row skipped`,
    );
    expect(messages).toContain(
      'sheet Site, row 3, column "Frequency": must be 50 or 60 (Hz); got 55; 50 Hz assumed',
    );
    expect(problems.find((p) => p.message.includes('Efficiency'))).toMatchObject({
      severity: 'error',
      row: 2,
      column: 'eff',
      tag: 'M1',
    });
    expect(site.equipment.some((r) => r.tag === 'R1')).toBe(false);
    expect(site.equipment.find((r) => r.tag === 'M1')?.values.eff).toBeUndefined();
  });

  it('reads a formula input through the engine values when the caller passes them', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    edit(doc, 'Loads', 'L2', 'P (kW)', '=100*2');
    const { problems, site } = siteFromWorkbook(doc, {
      valueAt: (s, r, c) => (s === 'Loads' && r === 2 && c === 5 ? 200 : undefined),
    });
    expect(problems).toEqual([]);
    expect(site.equipment.find((r) => r.tag === 'L2')?.values.p_kw).toBe(200);
  });

  it('a workbook without its Site sheet or cases falls back with an error', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    const without: WorkbookDoc = { ...doc, sheets: doc.sheets.filter((s) => s.name !== 'Site') };
    const r = siteFromWorkbook(without);
    expect(r.problems[0]?.message).toContain('the workbook has no Site sheet');
    expect(r.site.settings.cases).toEqual(['normal']);
  });
});
