// Importing a tender-stage list with "fill blanks with typical values": the blanks are filled
// as the rows arrive (before the check, so the preview is clean), the preview shows them, and
// the accepted workbook marks each as assumed where the row lands, with a row left out for an
// error taking its assumptions with it. Outside value: IEC 60034-30-1 IE3 4-pole 50 Hz
// minimum efficiency, 11 kW 91.4 % (UK SI 2021/745 Sch. 16 Table 28, published).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { heldAssumptions } from '../../../src/core/workbook/cellMarks.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import {
  applyImport,
  previewImport,
  proposeMapping,
  tableFromCsvText,
} from '../../../src/io/import/index.ts';

const { site } = readSiteFile(readFileSync('templates/cold-store.json', 'utf8'));
const current = buildWorkbook(site, { flavour: 'live' });

const TENDER =
  'Item,Fed from,Type,Motor kW,Eff %,PF\n' +
  'FAN-9,LV-SVC,motor,11,,\n' +
  'BAD-9,LV-SVC,motor,-3,,\n' +
  'PMP-9,LV-SVC,motor,15,93,0.85\n';

function preview(fillTypical: boolean) {
  const t = tableFromCsvText('tender.csv', TENDER);
  if (!t.ok) throw new Error(t.problem.message);
  return previewImport(proposeMapping(t.value), {
    settings: siteFromWorkbook(current).site.settings,
    fillTypical,
  });
}

describe('import with typical values for blanks', () => {
  it('without the choice, blanks are errors; with it, the preview shows the typical values', () => {
    const plain = preview(false);
    expect(plain.problems.some((p) => /row 2, .*eff is required/.test(p.message))).toBe(true);
    expect(plain.assumed).toEqual([]);
    const filled = preview(true);
    const fan = filled.rows.find((r) => r.row === 2);
    expect(fan?.status).toBe('ok');
    expect(fan?.cells.eff).toBe(0.914);
    expect(filled.assumed.find((a) => a.tag === 'FAN-9' && a.column === 'eff')?.value).toBe(0.914);
    // A motor with a bad rating gets nothing, says why, and stays an error.
    expect(filled.rows.find((r) => r.row === 3)?.status).toBe('error');
    expect(filled.notAssumed.some((w) => w.startsWith('row 3 (BAD-9): eff:'))).toBe(true);
  });

  it('the accepted workbook marks each assumed value in its cell, in one new document', () => {
    const r = applyImport(current, preview(true), { mode: 'append', dropRowsWithErrors: true });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.dropped).toBe(1);
    const motors = r.doc.sheets.find((s) => s.name === 'Motors');
    if (!motors) throw new Error('no Motors sheet');
    const held = heldAssumptions(motors);
    expect(held.length).toBe(r.assumed);
    const header = motors.cells[0] ?? [];
    const tagCol = header.indexOf('Tag');
    const at = (tag: string, h: string) =>
      held.find((m) => motors.cells[m.row]?.[tagCol] === tag && header[m.col] === h);
    expect(at('FAN-9', 'Efficiency')).toMatchObject({ value: 0.914 });
    expect(motors.cells[at('FAN-9', 'Efficiency')!.row]?.[header.indexOf('Efficiency')]).toBe(0.914);
    // PMP-9's typed efficiency is not marked; only its blank no-load current is.
    expect(at('PMP-9', 'Efficiency')).toBeUndefined();
    expect(at('PMP-9', 'No-load current (%)')).toBeDefined();
    // The open site's own rows carry no new marks.
    expect(held.every((m) => ['FAN-9', 'PMP-9'].includes(String(motors.cells[m.row]?.[tagCol])))).toBe(true);
  });

  it('adding a list keeps the assumed marks the open workbook already held', async () => {
    const { WorkbookSession } = await import('../../../src/ui/model/session.ts');
    const s = WorkbookSession.fromDoc(current);
    const filled = await s.fillTypicalValues();
    expect(filled.filled).toBeGreaterThan(0);
    const open = s.toDoc();
    const heldBefore = open.sheets.flatMap((x) =>
      heldAssumptions(x).map((m) => `${x.name}:${m.note}:${String(m.value)}`),
    );
    const r = applyImport(open, preview(true), { mode: 'append', dropRowsWithErrors: true });
    if (!r.ok) throw new Error(r.message);
    const heldAfter = r.doc.sheets.flatMap((x) =>
      heldAssumptions(x).map((m) => `${x.name}:${m.note}:${String(m.value)}`),
    );
    expect(heldAfter).toHaveLength(heldBefore.length + r.assumed);
    for (const h of heldBefore) expect(heldAfter).toContain(h);
  });
});

describe('import of a line without inductance and capacitance', () => {
  // A typical single-circuit MV line: 1.1 mH/km and 10.5 nF/km (common practice, from memory;
  // checked against the line geometry in tests/core/site/typical/lineTypical.test.ts).
  const LINE_LIST = 'Tag,Bus,Kind,to_bus,u_kv,l_mh_km,c_nf_km,len_km\n' + 'OHL-9,MV-11,line,FAR-9,11,,,2\n';

  it('the preview fills L and C by voltage and lists them as assumed', () => {
    const t = tableFromCsvText('line.csv', LINE_LIST);
    if (!t.ok) throw new Error(t.problem.message);
    const opts = { settings: siteFromWorkbook(current).site.settings };
    const plain = previewImport(proposeMapping(t.value), { ...opts, fillTypical: false });
    expect(plain.problems.some((p) => /l_mh_km is required/.test(p.message))).toBe(true);
    const filled = previewImport(proposeMapping(t.value), { ...opts, fillTypical: true });
    expect(filled.rows[0]?.cells.l_mh_km).toBe(1.1);
    expect(filled.rows[0]?.cells.c_nf_km).toBe(10.5);
    expect(filled.assumed.map((a) => [a.tag, a.column, a.value])).toEqual([
      ['OHL-9', 'l_mh_km', 1.1],
      ['OHL-9', 'c_nf_km', 10.5],
    ]);
  });
});
