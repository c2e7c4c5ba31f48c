// A cable that feeds a bus (kind feeder, Feeders sheet) carries that bus's apparent power like a
// line: 3·I²·R kW and 3·I²·X kvar at the loading of every case, before and after compensation,
// plus its charging ω·C·U². Checked by hand (I = S/(√3·U) written out here, not taken from the
// code) through the roll-up, the one after-compensation rule and the workbook's formulas, live
// and expanded to classic functions as other programs read the export.
import { describe, expect, it } from 'vitest';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import { compensate } from '../../../src/core/site/compensate.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { busRow, close, liveEngine, num, portableEngine, sheet, valueAt } from '../workbook/engineDoc.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,to_bus,u_kv,r_ohm_km,x_ohm_km,c_uf_km,len_km,p_kw,cos_phi,load:day,load:night';
const settings = { cases: ['day', 'night'], requirement: { kind: 'cosphi' as const, target: 0.95 } };

/** Phase current, A, of S kVA at U kV line to line: S/(√3·U). */
const amps = (sKva: number, uKv: number) => (sKva * 1000) / (Math.sqrt(3) * uKv * 1000);
/** 3·I²·Z·len in kW or kvar for Z in Ω/km. */
const threeI2 = (sKva: number, uKv: number, ohmKm: number, lenKm: number) =>
  (3 * amps(sKva, uKv) ** 2 * ohmKm * lenKm) / 1000;
/** Charging ω·C·U² in kvar for C in µF/km, U in kV (Q = 3·U_phase²·ωC = U²·ωC). */
const charging = (uKv: number, cUfKm: number, lenKm: number, hz = 50) =>
  (2 * Math.PI * hz * cUfKm * 1e-6 * lenKm * (uKv * 1000) ** 2) / 1000;

describe('a 400 V feeder cable: 200 m of 185 mm² copper to a 250 kW board at cos φ 0.85', () => {
  // R = 0.0991 Ω/km: IEC 60228 class 2, 185 mm² copper at 20 °C (from memory); X = 0.08 Ω/km,
  // typical of LV multicore cables (common practice); C = 0.6 µF/km (typical LV, from memory).
  const csv = [HEAD, 'F1,LV,feeder,DB1,0.4,0.0991,0.08,0.6,0.2,,,,', 'P1,DB1,load,,0.4,,,,,250,0.85,1,0.4'];
  const { site, problems } = siteFromCsv(csv.join('\n'), settings);
  const s = 250 / 0.85; // 294.1 kVA

  it('reads and validates without problems', () => {
    expect(problems).toEqual([]);
    expect(validateSite(site)).toEqual([]);
  });

  it('424.5 A through 0.2 km: 10.7 kW and 8.6 kvar in series, 0.006 kvar of charging', () => {
    expect(amps(s, 0.4)).toBeCloseTo(424.5, 1);
    const p = threeI2(s, 0.4, 0.0991, 0.2);
    const q = threeI2(s, 0.4, 0.08, 0.2);
    expect(p).toBeCloseTo(10.716, 3);
    expect(q).toBeCloseTo(8.651, 3);
    const day = rollUp(site, 'day');
    const f1 = day.elements.find((e) => e.tag === 'F1');
    expect(f1?.p_kw).toBeCloseTo(p, 9);
    expect(f1?.q_delivered_kvar).toBeCloseTo(charging(0.4, 0.6, 0.2), 12);
    expect(day.root.p_kw).toBeCloseTo(250 + p, 9);
    const qLoad = 250 * Math.tan(Math.acos(0.85));
    expect(day.root.q_kvar).toBeCloseTo(qLoad + q - charging(0.4, 0.6, 0.2), 9);
    // At 40 % load, 16 % of the series losses.
    const night = rollUp(site, 'night');
    expect(night.root.p_kw).toBeCloseTo(100 + threeI2(0.4 * s, 0.4, 0.0991, 0.2), 9);
  });
});

describe('the 5 km 20 kV feed at 8 MVA as a cable: 240 mm² aluminium', () => {
  // R = 0.125 Ω/km: IEC 60228 class 2, 240 mm² aluminium at 20 °C (from memory); X = 0.11 Ω/km
  // and C = 0.3 µF/km, typical of 20 kV XLPE cables of that size (common practice).
  const csv = [HEAD, 'F1,MV,feeder,B2,20,0.125,0.11,0.3,5,,,,', 'X1,B2,load,,20,,,,,6400,0.8,1,0.5'];
  const { site } = siteFromCsv(csv.join('\n'), settings);

  it('231 A: 100 kW of I²R, 88 kvar of I²X and 188 kvar of charging', () => {
    expect(amps(8000, 20)).toBeCloseTo(230.94, 2);
    const p = threeI2(8000, 20, 0.125, 5);
    const q = threeI2(8000, 20, 0.11, 5);
    expect(p).toBeCloseTo(100, 9);
    expect(q).toBeCloseTo(88, 9);
    expect(charging(20, 0.3, 5)).toBeCloseTo(188.5, 1);
    const day = rollUp(site, 'day');
    expect(day.root.p_kw).toBeCloseTo(6400 + p, 9);
    expect(day.root.q_kvar).toBeCloseTo(4800 + q - charging(20, 0.3, 5), 9);
  });

  const banks: BankChoice[] = [{ bus: 'B2', step_kvar: 300, steps: 14 }];
  const results = compensate(site, banks);

  it('after compensation the cable carries less kVA and loses less, by the same rule', () => {
    for (const r of results) {
      const out = r.banks[0]?.output_kvar ?? 0;
      expect(out).toBeGreaterThan(0);
      const b2 = r.after.buses.find((b) => b.bus === 'B2');
      const sAfter = Math.hypot(b2?.p_kw ?? NaN, b2?.q_kvar ?? NaN);
      const pLoad = r.case === 'day' ? 6400 : 3200;
      expect(r.after.root.p_kw).toBeCloseTo(pLoad + threeI2(sAfter, 20, 0.125, 5), 9);
      expect(r.after.root.q_kvar).toBeCloseTo(
        pLoad * 0.75 - out + threeI2(sAfter, 20, 0.11, 5) - charging(20, 0.3, 5),
        9,
      );
    }
  });

  for (const flavour of ['live', 'portable'] as const)
    it(`the ${flavour} workbook counts the same series losses before and after`, () => {
      const doc = buildWorkbook(site, { flavour, banks });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      const at = sheet(doc, 'Feeders').cells.findIndex((row) => row[0] === 'F1');
      expect(at).toBeGreaterThan(0);
      for (const r of results) {
        const c = r.case;
        const before = r.before.elements.find((e) => e.tag === 'F1');
        const after = r.after.elements.find((e) => e.tag === 'F1');
        expect(close(num(valueAt(hf, doc, 'Feeders', at, `P loss ${c} (kW)`)), before?.p_kw as number)).toBe(
          true,
        );
        expect(
          close(num(valueAt(hf, doc, 'Feeders', at, `P loss after ${c} (kW)`)), after?.p_kw as number),
        ).toBe(true);
        expect(
          close(
            num(valueAt(hf, doc, 'Feeders', at, `Q absorbed after ${c} (kvar)`)),
            after?.q_absorbed_kvar as number,
          ),
        ).toBe(true);
        const root = busRow(doc, 'MV');
        for (const [col, want] of [
          [`P ${c} (kW)`, r.before.root.p_kw],
          [`Q ${c} (kvar)`, r.before.root.q_kvar],
          [`P after ${c} (kW)`, r.after.root.p_kw],
          [`Q after ${c} (kvar)`, r.after.root.q_kvar],
        ] as const)
          expect(close(num(valueAt(hf, doc, 'Buses', root, col)), want), col).toBe(true);
      }
    });
});

describe('feeder series values: blank, negative, implausible', () => {
  const read = (r: string, x: string) =>
    siteFromCsv(
      [HEAD, `F1,LV,feeder,DB1,0.4,${r},${x},,0.2,,,,`, 'P1,DB1,load,,0.4,,,,,250,0.85,1,0.4'].join('\n'),
      settings,
    ).site;

  it('blank R and X: neither counted, and a warning on each column says so', () => {
    const site = read('', '');
    expect(rollUp(site, 'day').root.p_kw).toBeCloseTo(250, 12);
    const found = validateSite(site);
    expect(found.map((p) => [p.severity, p.row, p.column])).toEqual([
      ['warning', 2, 'r_ohm_km'],
      ['warning', 2, 'x_ohm_km'],
    ]);
    expect(found[1]?.message).toBe(
      "row 2, column x_ohm_km: x_ohm_km is blank, so the series kvar of feeder F1 (3·I²·X) is not counted before or after compensation; enter the cable's series reactance per phase in Ω/km from the maker's data",
    );
  });

  it('negative X: refused with the allowed range and the value', () => {
    const found = validateSite(read('0.0991', '-0.08')).filter((p) => p.severity === 'error');
    expect(found.map((p) => p.message)).toEqual([
      'row 2, column x_ohm_km: x_ohm_km must be ≥ 0 Ω/km (blank when not known); got -0.08',
    ]);
  });

  it('X typed in Ω/m: a warning with the reading in Ω/km', () => {
    const found = validateSite(read('0.0991', '0.00008'));
    expect(found.map((p) => p.column)).toEqual(['x_ohm_km']);
    expect(found[0]?.message).toContain('typed in Ω/m? 0.00008 Ω/m is 0.08 Ω/km');
  });
});

describe('a feeder whose charging leaves the connection leading at light load', () => {
  // 20 km of 33 kV cable at 0.2 µF/km (typical of 33 kV XLPE, common practice) charges
  // ω·C·U² = 2π·50·0.2e-6·20·33,000² / 1000 ≈ 1,368 kvar: far beyond a 200 kW night load's limit.
  const csv = [HEAD, 'F1,POC,feeder,FAR,33,0.1,0.12,0.2,20,,,,', 'P1,FAR,load,,33,,,,,2000,0.9,1,0.1'];
  const { site, problems } = siteFromCsv(csv.join('\n'), settings);

  it('names the feeder charging in the warning and puts the reactor where the charging is', async () => {
    expect(problems).toEqual([]);
    const { designCompensation } = await import('../../../src/core/site/compensation.ts');
    const design = designCompensation(site);
    const q = charging(33, 0.2, 20);
    expect(q).toBeCloseTo(1368.5, 0);
    const w = design.warnings.find((x) => x.code === 'charging-dominates' && x.message.includes('night'));
    const said = /cable and line charging (\d+) kvar/.exec(w?.message ?? '');
    expect(Number(said?.[1])).toBeCloseTo(q, -1);
    expect(design.reactors.map((r) => r.bus)).toEqual(['POC']);
  });
});
