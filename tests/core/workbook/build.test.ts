// The workbook of live formulas against the site roll-up (src/core/site/rollup.ts): every bus,
// every case, both flavours; and the portable flavour, expanded to classic functions and
// evaluated by an engine without our plugins, against the live one cell by cell.
import { describe, expect, it } from 'vitest';
import type { HyperFormula } from 'hyperformula';
import { rollUp } from '../../../src/core/site/rollup.ts';
import type { Site } from '../../../src/core/site/model.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { readCell } from '../../../src/engine/index.ts';
import { PLANT } from './sites.ts';
import {
  busRow,
  close,
  expandDoc,
  liveEngine,
  num,
  portableEngine,
  templateSites,
  valueAt,
} from './engineDoc.ts';

/** Bus names a conditional sum would read as patterns or comparisons, or as a number. */
const ODD_NAMES: Site = {
  settings: {
    name: 'Odd bus names',
    hz: 50,
    cases: ['one', 'two'],
    requirement: { kind: 'cosphi', target: 0.95 },
  },
  equipment: [
    {
      row: 2,
      tag: 'T1',
      bus: 'MV*1',
      kind: 'transformer',
      to_bus: 'LV?2',
      values: { s_kva: 630, uk_pct: 4, p0_kw: 0.9, pk_kw: 6.5, i0_pct: 1.2, u_kv: 0.4 },
      loads: {},
    },
    {
      row: 3,
      tag: 'T2',
      bus: 'MV*1',
      kind: 'transformer',
      to_bus: '>5',
      values: { s_kva: 400, uk_pct: 4, p0_kw: 0.6, pk_kw: 4.6, i0_pct: 1.4, u_kv: 0.4 },
      loads: {},
    },
    {
      row: 4,
      tag: 'T3',
      bus: 'MV*1',
      kind: 'transformer',
      to_bus: '12',
      values: { s_kva: 250, uk_pct: 4, p0_kw: 0.45, pk_kw: 3.2, i0_pct: 1.6, u_kv: 0.4 },
      loads: {},
    },
    {
      row: 5,
      tag: 'M1',
      bus: 'LV?2',
      kind: 'motor',
      values: { p_kw: 90, eff: 0.94, cos_phi: 0.86 },
      loads: { two: 0.5 },
    },
    { row: 6, tag: 'M2', bus: 'LVA2', kind: 'motor', values: { p_kw: 1, eff: 0.9, cos_phi: 0.8 }, loads: {} },
    { row: 7, tag: 'L1', bus: '>5', kind: 'load', values: { p_kw: 50, cos_phi: 0.9 }, loads: {} },
    { row: 8, tag: 'L2', bus: '12', kind: 'load', values: { p_kw: 20, cos_phi: 0.85 }, loads: {} },
    { row: 9, tag: 'L3', bus: 'MV*1', kind: 'load', values: { p_kw: 5, cos_phi: 0.7 }, loads: {} },
    {
      row: 10,
      tag: 'T4',
      bus: 'MV*1',
      kind: 'transformer',
      to_bus: 'LVA2',
      values: { s_kva: 100, uk_pct: 4, p0_kw: 0.2, pk_kw: 1.75, i0_pct: 2 },
      loads: {},
    },
  ],
};

const SITES: Array<{ name: string; site: Site }> = [
  { name: 'invented plant (tests/core/workbook/sites.ts)', site: PLANT },
  { name: 'bus names with *, ?, > and digits', site: ODD_NAMES },
  ...templateSites(),
];

function compareWithRollUp(site: Site, doc: WorkbookDoc, hf: HyperFormula): number {
  let checked = 0;
  for (const c of site.settings.cases) {
    const bal = rollUp(site, c);
    expect(bal.problems).toEqual([]);
    for (const b of bal.buses) {
      const r = busRow(doc, b.bus);
      const at = (h: string) => valueAt(hf, doc, 'Buses', r, h);
      const scale = Math.max(1, b.s_kva, b.q_absorbed_kvar, b.q_delivered_kvar);
      const pairs: Array<[string, number]> = [
        [`P ${c} (kW)`, b.p_kw],
        [`Q ${c} (kvar)`, b.q_kvar],
        [`Q absorbed ${c} (kvar)`, b.q_absorbed_kvar],
        [`Q delivered ${c} (kvar)`, b.q_delivered_kvar],
        [`S ${c} (kVA)`, b.s_kva],
        [`P own items ${c} (kW)`, b.own_p_kw],
        [`Q own items ${c} (kvar)`, b.own_q_kvar],
      ];
      for (const [h, want] of pairs) {
        const got = num(at(h));
        if (!close(got, want, 1e-9, scale)) expect.fail(`${b.bus} ${h}: workbook ${got}, roll-up ${want}`);
        checked++;
      }
      const cos = at(`cos φ ${c}`);
      if (b.cos_phi === null) expect(cos).toEqual({ ok: true, value: '' });
      else expect(close(num(cos), b.cos_phi, 1e-9)).toBe(true);
      const tan = at(`tan φ ${c}`);
      if (b.tan_phi === null) expect(tan).toEqual({ ok: true, value: '' });
      else expect(close(num(tan), b.tan_phi, 1e-9, 1e-6)).toBe(true);
      expect(at(`Sense ${c}`)).toEqual({ ok: true, value: b.sense });
      expect(at('Level')).toEqual({ ok: true, value: b.level });
      expect(at('Fed by')).toEqual({ ok: true, value: b.fed_by ?? null });
      // A bus whose voltage nothing states shows a blank cell.
      expect(at('U (kV)')).toEqual({ ok: true, value: b.u_kv ?? null });
    }
  }
  return checked;
}

describe('buildWorkbook: bus totals equal the site roll-up', () => {
  for (const { name, site } of SITES) {
    for (const flavour of ['live', 'portable'] as const) {
      it(`${name}, ${flavour}`, () => {
        const doc = buildWorkbook(site, { flavour });
        const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
        expect(compareWithRollUp(site, doc, hf)).toBeGreaterThan(0);
      });
    }
  }
});

describe('portable flavour: classic functions only, same values as live', () => {
  for (const { name, site } of SITES) {
    it(name, () => {
      const live = buildWorkbook(site, { flavour: 'live' });
      const portable = buildWorkbook(site, { flavour: 'portable' });
      const text = JSON.stringify(portable);
      expect(text).not.toContain('BUS.SUMS');
      expect(text).toMatch(/SUMIFS?\(/);
      // xlsx keeps formulas of at most 8192 characters.
      expect(expandDoc(portable).longest).toBeLessThanOrEqual(8192);
      const a = liveEngine(live);
      const b = portableEngine(portable);
      let compared = 0;
      // Every cell of the portable workbook; the live one adds only its layout check on the Site sheet.
      for (const s of portable.sheets) {
        s.cells.forEach((row, r) =>
          row.forEach((_, c) => {
            const x = readCell(a, s.name, r, c);
            const y = readCell(b, s.name, r, c);
            if (x.ok && y.ok && typeof x.value === 'number' && typeof y.value === 'number') {
              if (!close(x.value, y.value, 1e-9, 1e-6))
                expect.fail(`${s.name} row ${r + 1} col ${c + 1}: live ${x.value}, portable ${y.value}`);
            } else if (x.ok && y.ok) {
              expect([s.name, r, c, y.value]).toEqual([s.name, r, c, x.value]);
            } else {
              expect([s.name, r, c, y.ok ? y.value : y.error]).toEqual([
                s.name,
                r,
                c,
                x.ok ? x.value : x.error,
              ]);
            }
            compared++;
          }),
        );
      }
      expect(compared).toBeGreaterThan(100);
    });
  }
});

describe('workbook shape', () => {
  const doc = buildWorkbook(PLANT, { flavour: 'live' });

  it('has the settings, equipment, buses, compensation, quantities and options sheets in order, then the rates', () => {
    expect(doc.sheets.map((s) => s.name)).toEqual([
      'Site',
      'Motors',
      'Loads',
      'Generators',
      'Transformers',
      'Lines',
      'Cables',
      'Feeders',
      'Capacitors and reactors',
      'Buses',
      'Compensation',
      'Quantities and cost',
      'Design options',
      'Rates',
      'Tariff',
    ]);
    expect(doc.title).toBe(PLANT.settings.name);
  });

  it('gives every sheet a header row matching its column infos, with widths, and a purpose', () => {
    for (const s of doc.sheets) {
      expect(s.columns, s.name).toBeDefined();
      expect(s.cells[0]).toEqual(s.columns?.map((c) => c.header));
      for (const c of s.columns ?? []) expect(c.width, `${s.name}: ${c.header}`).toBeGreaterThan(0);
      expect(s.purpose?.length ?? 0).toBeGreaterThan(20);
      for (const row of s.cells) expect(row.length).toBe(s.columns?.length);
    }
  });

  it('puts units in the headers of computed power columns and formats on numbers', () => {
    const buses = doc.sheets.find((s) => s.name === 'Buses');
    const headers = buses?.columns?.map((c) => c.header) ?? [];
    expect(headers).toContain('P day (kW)');
    expect(headers).toContain('Q absorbed night (kvar)');
    expect(headers).toContain('S outage (kVA)');
    expect(buses?.columns?.find((c) => c.header === 'cos φ day')?.format).toBe('0.000');
  });

  it('writes a formula in every computed cell of every equipment row (no hidden values)', () => {
    for (const s of doc.sheets.slice(1, 8)) {
      s.columns?.forEach((info, c) => {
        if (!info.computed) return;
        for (const row of s.cells.slice(1)) {
          const v = row[c];
          if (v === null) continue; // a transformer or line that feeds no bus carries nothing
          expect(typeof v === 'string' && v.startsWith('='), `${s.name}: ${info.header}: ${String(v)}`).toBe(
            true,
          );
        }
      });
    }
  });

  it('refers to the frequency in use on the Site sheet instead of copying it', () => {
    const cables = doc.sheets.find((s) => s.name === 'Cables');
    expect(JSON.stringify(cables?.cells)).toMatch(/KVAR\.CABLE\([A-Z]+2,[A-Z]+2,[A-Z]+2,Site!\$B\$12\)/);
    const site = doc.sheets[0];
    expect(site?.cells[2]).toEqual(['Frequency', 50, 'Hz', expect.any(String)]);
    // 50 or 60, else #N/A in every formula that uses it.
    expect(site?.cells[11]?.slice(0, 2)).toEqual(['Frequency in use', '=IF(OR(B3=50,B3=60),B3,NA())']);
  });

  it('carries the cautions on the Site sheet', () => {
    const text = JSON.stringify(doc.sheets[0]?.cells);
    expect(text).toContain('licensed engineer');
    expect(text).toMatch(/resonance and switching overvoltage can hurt people/i);
  });

  it('sums each bus over the runs of its own rows in the live flavour, one call per case and part', () => {
    const buses = doc.sheets.find((s) => s.name === 'Buses');
    const motors = doc.sheets.find((s) => s.name === 'Motors');
    expect(motors?.cells.slice(1).map((r) => [r[0], r[2]])).toEqual([
      ['M1', 'LV1'],
      ['M2', 'LV1'],
      ['M3', 'LV2'],
      ['P1', 'PUMP'],
    ]);
    const lv1 = buses?.cells.find((r) => r[0] === 'LV1') ?? [];
    const calls = lv1.filter((c): c is string => typeof c === 'string' && c.startsWith('=BUS.SUM('));
    // Motors rows 2–3 (a run: a range) and the one load on LV1 (a run of one row: a cell), per case.
    expect(calls).toHaveLength(3);
    for (const c of calls) expect(c).toMatch(/^=BUS\.SUM\(Motors!\$([A-Z]+)\$2:\$\1\$3,Loads!\$[A-Z]+\$2\)$/);
    const text = JSON.stringify(buses?.cells);
    // P: the three buses with motors, loads or generators; kvar: all four (MV has a cable); per case.
    expect(text.match(/BUS\.SUM\(/g)).toHaveLength(3 * 3);
    expect(text.match(/BUS\.SUM\.ABS\(/g)).toHaveLength(4 * 3);
    expect(text.match(/BUS\.SUM\.DEL\(/g)).toHaveLength(4 * 3);
    expect(text).not.toContain('SUMIF');
  });

  it('keeps no notion of rebuilding: the Site sheet has settings, cases, assumptions and cautions only', () => {
    const labels = new Set(doc.sheets[0]?.cells.map((r) => r[0]));
    expect([...labels].filter((l) => typeof l === 'string' && /layout|rebuild/i.test(l))).toEqual([]);
  });
});

describe('a setting changed on the Site sheet flows through', () => {
  it('60 Hz raises cable charging by 60/50 (KVAR.CABLE ∝ f)', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    const hf = liveEngine(doc);
    const before = num(valueAt(hf, doc, 'Cables', 1, 'Q day (kvar)'));
    hf.setCellContents({ sheet: hf.getSheetId('Site') as number, row: 2, col: 1 }, [[60]]);
    const after = num(valueAt(hf, doc, 'Cables', 1, 'Q day (kvar)'));
    expect(before).toBeLessThan(0);
    expect(close(after, before * 1.2, 1e-12)).toBe(true);
  });
});

describe('a site that cannot be balanced still builds, and shows why', () => {
  it('a loop of buses gives #CYCLE! on those buses; an empty site gives empty sheets', () => {
    const loop: Site = {
      settings: { name: 'Loop', hz: 50, cases: ['a'], requirement: { kind: 'cosphi', target: 0.95 } },
      equipment: [
        {
          row: 2,
          tag: 'T1',
          bus: 'A',
          kind: 'transformer',
          to_bus: 'B',
          values: { s_kva: 100, uk_pct: 4, p0_kw: 0.3, pk_kw: 1.5, i0_pct: 2 },
          loads: {},
        },
        {
          row: 3,
          tag: 'T2',
          bus: 'B',
          kind: 'transformer',
          to_bus: 'A',
          values: { s_kva: 100, uk_pct: 4, p0_kw: 0.3, pk_kw: 1.5, i0_pct: 2 },
          loads: {},
        },
        {
          row: 4,
          tag: 'M',
          bus: 'B',
          kind: 'motor',
          values: { p_kw: 10, eff: 0.9, cos_phi: 0.8 },
          loads: {},
        },
      ],
    };
    for (const flavour of ['live', 'portable'] as const) {
      const doc = buildWorkbook(loop, { flavour });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      expect(valueAt(hf, doc, 'Buses', busRow(doc, 'A'), 'P a (kW)')).toMatchObject({
        ok: false,
        error: '#CYCLE!',
      });
      const empty = buildWorkbook({ settings: loop.settings, equipment: [] }, { flavour });
      expect(empty.sheets.find((s) => s.name === 'Buses')?.cells).toHaveLength(1);
      expect(() => (flavour === 'live' ? liveEngine(empty) : portableEngine(empty))).not.toThrow();
    }
  });
});
