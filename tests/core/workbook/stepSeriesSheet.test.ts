// Banks typed with a step series on the Compensation sheet: Steps counts physical stages, Step
// series says how they grow, and the sheet's formulas switch whole smallest steps up to the
// controller step count, as the core's one rule for after compensation does (compensate.ts).
// The counts are worked by hand from the ratio notation: 1:2:2 in 4 stages is 1 + 2 + 2 + 2 = 7
// steps, 1:2:4 in 3 stages is 1 + 2 + 4 = 7, equal stages count one each.
import { describe, expect, it } from 'vitest';
import { compensate } from '../../../src/core/site/compensate.ts';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { siteFromCsv } from '../site/fixtures.ts';
import { busRow, close, liveEngine, num, portableEngine, sheet, valueAt } from './engineDoc.ts';

const { site } = siteFromCsv(
  [
    'tag,bus,kind,p_kw,cos_phi,u_kv,s_kva,uk_pct,i0_pct,p0_kw,pk_kw,to_bus,load:day,load:night',
    'T1,MV,transformer,,,20,1600,6,0.5,1.5,14,LV,1,1',
    'L1,LV,load,300,0.72,0.4,,,,,,,1,0.3',
  ].join('\n'),
  { sscMva: 250 },
);

const BANKS: BankChoice[] = [{ bus: 'LV', step_kvar: 25, steps: 4, series: '1:2:2' }];

function withSeries(doc: WorkbookDoc, bus: string, series: string | number, steps?: number): WorkbookDoc {
  const comp = sheet(doc, 'Compensation');
  const head = comp.cells[0] as unknown[];
  const r = busRow(doc, bus, 'Compensation');
  const cells = comp.cells.map((row, i) => {
    if (i !== r) return row;
    const out = [...row];
    out[head.indexOf('Step series')] = series;
    if (steps !== undefined) out[head.indexOf('Steps')] = steps;
    return out;
  });
  return { ...doc, sheets: doc.sheets.map((s) => (s === comp ? { ...comp, cells } : s)) };
}

describe('a 1:2:2 bank of 4 stages, 25 kvar smallest, typed on the Compensation sheet', () => {
  const doc = buildWorkbook(site, { flavour: 'live', banks: BANKS });
  const core = compensate(site, BANKS);
  for (const [flavour, hf] of [
    ['live', liveEngine(doc)],
    ['portable', portableEngine(buildWorkbook(site, { flavour: 'portable', banks: BANKS }))],
  ] as const) {
    const r = busRow(doc, 'LV', 'Compensation');
    const at = (h: string) => num(valueAt(hf, doc, 'Compensation', r, h));
    it(`${flavour}: 7 controller steps, 175 kvar in all, a largest stage of 50 kvar`, () => {
      expect(at('Steps')).toBe(4);
      expect(at('Controller steps')).toBe(1 + 2 + 2 + 2);
      expect(at('Bank total (kvar)')).toBe(7 * 25);
      expect(at('Largest stage (kvar)')).toBe(2 * 25);
    });
    it(`${flavour}: steps in and outputs per case are the core's (compensate.ts)`, () => {
      for (const c of core) {
        const bank = c.banks.find((b) => b.bus === 'LV');
        expect(at(`Steps in ${c.case}`)).toBe(bank?.steps_in);
        expect(close(at(`Capacitor output ${c.case} (kvar)`), bank?.output_kvar ?? NaN)).toBe(true);
        // Whole smallest steps: the need rounded up to 25 kvar, never beyond the 7 positions.
        expect(bank?.steps_in).toBe(Math.min(7, Math.ceil(c.need.capacitive_kvar / 25 - 1e-9)));
      }
    });
  }
  it('the day needs more than six 25 kvar steps, so the seventh position is used', () => {
    // 300 kW at cos φ 0.72 (+ the transformer's own kvar): 300·tan(acos 0.72) = 289.2 kvar
    // against 300·tan(acos 0.95) = 98.6 kvar allowed: more than 150 kvar to cover.
    expect(core[0]?.need.capacitive_kvar).toBeGreaterThan(150);
    expect(core[0]?.banks[0]?.steps_in).toBe(7);
  });
  it('reads back with its series', () => {
    const back = siteFromWorkbook(doc);
    expect(back.problems).toEqual([]);
    expect(back.banks).toEqual([expect.objectContaining({ bus: 'LV', steps: 4, series: '1:2:2' })]);
  });
});

describe('bad series input says what and where', () => {
  const doc = buildWorkbook(site, { flavour: 'live', banks: BANKS });
  const col = (sheet(doc, 'Compensation').cells[0] as unknown[]).indexOf('Step series');
  const row = busRow(doc, 'LV', 'Compensation') + 1;
  const messages = (d: WorkbookDoc) => siteFromWorkbook(d).problems.map((p) => p.message);

  it('an unknown series: the allowed values and the value given; the sheet shows #N/A', () => {
    const bad = withSeries(doc, 'LV', '1:3:3');
    expect(messages(bad)).toEqual([
      `sheet Compensation, row ${row}, column "Step series": must be one of 1:1:1, 1:2:2, 1:2:4 (blank: 1:1:1); got "1:3:3"`,
    ]);
    const steps = valueAt(liveEngine(bad), bad, 'Compensation', row - 1, 'Controller steps');
    expect(steps.ok).toBe(false);
    expect(col).toBeGreaterThan(0);
  });
  it('a binary series beyond 4 stages', () => {
    expect(messages(withSeries(doc, 'LV', "'1:2:4", 5))).toEqual([
      `sheet Compensation, row ${row}, column "Step series": a 1:2:4 series has at most 4 stages (BINARY_MAX_STAGES); Steps gives 5`,
    ]);
  });
  it('a series a spreadsheet took for a time of day', () => {
    // 1:2:2 typed plainly is 1 h 2 min 2 s: (3600 + 120 + 2)/86400 of a day.
    const time = (3600 + 120 + 2) / 86400;
    expect(messages(withSeries(doc, 'LV', time))[0]).toContain(
      `got the number ${time} (a spreadsheet reads 1:2:2 typed plainly as a time of day`,
    );
  });
});
