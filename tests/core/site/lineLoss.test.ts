// The series (I²R) loss of a line, counted at the loading of the bus it feeds before and after
// compensation, like a transformer's load loss: checked by hand (I = S/(√3·U), P = 3·I²·R·len)
// on 5 km of 20 kV line carrying 8 MVA with 0.12 Ω/km (a typical 240 mm² aluminium overhead
// conductor, from memory), through the one rule (compensate.ts) and through the workbook's
// formulas, live and expanded to classic functions as other programs read the export.
import { describe, expect, it } from 'vitest';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import { compensate } from '../../../src/core/site/compensate.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { busRow, close, liveEngine, num, portableEngine, sheet, valueAt } from '../workbook/engineDoc.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,to_bus,u_kv,r_ohm_km,l_mh_km,c_nf_km,len_km,p_kw,cos_phi,load:day,load:night';
const LOAD = 'X1,B2,load,,20,,,,,6400,0.8,1,0.5';
const lineRow = (r: string) => `L1,MV,line,B2,20,${r},1.2,10,5,,,,`;
const read = (r: string) =>
  siteFromCsv([HEAD, lineRow(r), LOAD].join('\n'), {
    cases: ['day', 'night'],
    requirement: { kind: 'cosphi', target: 0.95 },
  });

/** 3·I²·R·len in kW with I = S/(√3·U): written out here, not taken from the code. */
function handLossKw(sKva: number, uKv: number, rOhmKm: number, lenKm: number): number {
  const amps = (sKva * 1000) / (Math.sqrt(3) * uKv * 1000);
  return (3 * amps * amps * rOhmKm * lenKm) / 1000;
}

describe('line I²R loss at the loading of the bus it feeds', () => {
  const { site, problems } = read('0.12');
  it('site reads and validates without problems', () => {
    expect(problems).toEqual([]);
    expect(validateSite(site)).toEqual([]);
  });

  it('8 MVA (6 400 kW at cos φ 0.8) through 5 km at 20 kV: 231 A and 96 kW lost on top of the load', () => {
    const loss = handLossKw(8000, 20, 0.12, 5);
    expect(loss).toBeCloseTo(96, 9);
    const day = rollUp(site, 'day');
    expect(day.elements.find((e) => e.tag === 'L1')?.p_kw).toBeCloseTo(loss, 9);
    expect(day.root.p_kw).toBeCloseTo(6400 + loss, 9);
    // At half load a quarter of the loss.
    expect(rollUp(site, 'night').root.p_kw).toBeCloseTo(3200 + handLossKw(4000, 20, 0.12, 5), 9);
  });

  const banks: BankChoice[] = [{ bus: 'B2', step_kvar: 300, steps: 14 }];
  const [day, night] = compensate(site, banks);

  it('after compensation the line carries less kVA and loses less, by the same rule', () => {
    for (const r of [day, night]) {
      const out = r?.banks[0]?.output_kvar ?? 0;
      expect(out).toBeGreaterThan(0);
      const b2 = r?.after.buses.find((b) => b.bus === 'B2');
      const sAfter = Math.hypot(b2?.p_kw ?? NaN, b2?.q_kvar ?? NaN);
      // B2 after: the load's P, and Q = P·tan φ less the bank's output (load reference).
      const pLoad = r?.case === 'day' ? 6400 : 3200;
      expect(b2?.q_kvar).toBeCloseTo(pLoad * 0.75 - out, 9);
      const lossAfter = handLossKw(sAfter, 20, 0.12, 5);
      expect(r?.after.root.p_kw).toBeCloseTo(pLoad + lossAfter, 9);
      expect(lossAfter).toBeLessThan(handLossKw(pLoad / 0.8, 20, 0.12, 5));
    }
  });

  for (const flavour of ['live', 'portable'] as const)
    it(`the ${flavour} workbook counts the same loss before and after`, () => {
      const doc = buildWorkbook(site, { flavour, banks });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      const lineAt = sheet(doc, 'Lines').cells.findIndex((row) => row[0] === 'L1');
      for (const r of [day, night]) {
        const c = r?.case as string;
        const element = r?.before.elements.find((e) => e.tag === 'L1');
        const lossBefore = num(valueAt(hf, doc, 'Lines', lineAt, `P loss ${c} (kW)`));
        expect(close(lossBefore, element?.p_kw as number), c).toBe(true);
        const lossAfter = num(valueAt(hf, doc, 'Lines', lineAt, `P loss after ${c} (kW)`));
        const elementAfter = r?.after.elements.find((e) => e.tag === 'L1');
        expect(close(lossAfter, elementAfter?.p_kw as number), c).toBe(true);
        const root = busRow(doc, 'MV');
        expect(
          close(num(valueAt(hf, doc, 'Buses', root, `P ${c} (kW)`)), r?.before.root.p_kw as number),
        ).toBe(true);
        expect(
          close(num(valueAt(hf, doc, 'Buses', root, `P after ${c} (kW)`)), r?.after.root.p_kw as number),
        ).toBe(true);
      }
    });
});

describe('line resistance: blank, negative, implausible', () => {
  it('blank: no loss counted, and a warning on the row says so', () => {
    const { site } = read('');
    expect(rollUp(site, 'day').root.p_kw).toBe(6400);
    const found = validateSite(site);
    expect(found.map((p) => [p.severity, p.row, p.column])).toEqual([['warning', 2, 'r_ohm_km']]);
    expect(found[0]?.message).toBe(
      "row 2, column r_ohm_km: r_ohm_km is blank, so the kW losses of line L1 (3·I²·R) are not counted before or after compensation; enter the conductor's resistance per phase in Ω/km from the maker's data, or its cross-section in cu_mm2 or al_mm2",
    );
  });

  it('negative: refused with the allowed range and the value', () => {
    const found = validateSite(read('-0.12').site).filter((p) => p.severity === 'error');
    expect(found.map((p) => p.message)).toEqual([
      'row 2, column r_ohm_km: r_ohm_km must be ≥ 0 Ω/km (blank when not known); got -0.12',
    ]);
  });

  // IEC 60228 class 2 (from memory): 1.5 mm² copper 12.1 Ω/km, 2 500 mm² copper 0.0072 Ω/km at 20 °C.
  it.each([
    ['12.1', []],
    ['0.0072', []],
    ['20', ['20 Ω/km is outside the usual 0.005–15 Ω/km']],
    ['0.00012', ['0.00012 Ω/km is outside the usual', 'typed in Ω/m? 0.00012 Ω/m is 0.12 Ω/km']],
    ['0', ['0 Ω/km is outside the usual 0.005–15 Ω/km']],
  ] as const)('%s Ω/km: %j', (r, parts) => {
    const found = validateSite(read(r).site);
    if (parts.length === 0) return expect(found).toEqual([]);
    expect(found.map((p) => [p.severity, p.row, p.column])).toEqual([['warning', 2, 'r_ohm_km']]);
    for (const part of parts) expect(found[0]?.message).toContain(part);
  });
});
