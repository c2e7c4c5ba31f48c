// Capacitor rated voltages: the rule "rated voltage ≥ 1.1 × the voltage across the capacitors"
// (the 1.10 Un that IEC 60831-1 / IEC 60871-1 allow only 8 h in 24 h, IEEE 18's 110 % continuous
// limit; makers' selection guides for detuned banks: common practice), the series it picks from
// (IEEE 18-2012 Table 1 at 60 Hz, makers' IEC ranges at 50 Hz; both from memory), and the
// findings for capacitors rated below it. Every expected value is worked by hand below.
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { chooseCapacitorRating, capacitorRatedVoltage } from '../../../src/core/site/bankRules.ts';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { capacitorStepKvar, detunedCapacitorKv } from '../functions/independent.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,p_kw,cos_phi,s_kva,uk_pct,p0_kw,pk_kw,i0_pct,to_bus,u_kv,q_kvar,u_rated_kv,p_pct';

function site(rows: string[], hz: 50 | 60 = 50) {
  const r = siteFromCsv([HEAD, ...rows].join('\n'), { hz });
  expect(r.problems).toEqual([]);
  return r.site;
}

describe('a 480 V 60 Hz bank with 7 % detuning', () => {
  // By hand: Uc = 480 / (1 − 0.07) = 516.1 V across the capacitors; 1.1 × 516.1 = 567.7 V.
  // IEEE 18 Table 1 LV ratings: 216, 240, 480, 600 V → 600 V units (not 690 V).
  const uc = 0.48 / (1 - 0.07);
  const lvSite = site(
    ['T1,MV,transformer,,,1500,5.75,2.5,14,1,LV,13.8', 'L1,LV,load,800,0.78,,,,,,,0.48'],
    60,
  );
  const design = designCompensation(lvSite, undefined, { detuning: { LV: 7 } });
  const bank = design.banks.find((b) => b.bus === 'LV');

  it('uses 600 V units from IEEE 18 Table 1', () => {
    expect(uc * 1.1).toBeCloseTo(0.5677, 4);
    expect(bank?.p_pct).toBe(7);
    expect(bank?.u_cap_kv).toBeCloseTo(detunedCapacitorKv(0.48, 7), 12);
    expect(bank?.u_rated_kv).toBe(0.6);
    expect(bank?.capacitor_units).toMatchObject({
      unit_rated_kv: 0.6,
      units_in_series: 1,
      arrangement: 'three-phase units',
    });
    expect(bank?.capacitor_units.series).toContain('IEEE 18 Table 1');
  });

  it('asks for about a third less nameplate kvar than 690 V units would', () => {
    // Output per nameplate kvar of a series L–C branch at 60 Hz (C from the nameplate):
    // at 600 V (516.1/600)²·0.93 = 0.688; at 690 V (516.1/690)²·0.93 = 0.520.
    const at600 = -capacitorStepKvar(1, 0.6, 0.48, 7, 60);
    const at690 = -capacitorStepKvar(1, 0.69, 0.48, 7, 60);
    expect(at600).toBeCloseTo((uc / 0.6) ** 2 * 0.93, 9);
    expect(at600).toBeCloseTo(0.688, 3);
    expect(at690 / at600).toBeCloseTo(0.756, 3);
    expect(bank?.step_kvar).toBeGreaterThan(0);
    expect(bank?.step_rated_kvar).toBeCloseTo((bank?.step_kvar ?? 0) / at600, 9);
  });
});

describe('the rating series', () => {
  it('50 Hz LV from the makers\u2019 IEC ranges: 400 V plain → 440 V, 400 V with 7 % → 480 V, 690 V with 14 % → 900 V', () => {
    // 1.1 × 400 = 440 V; 1.1 × 400/0.93 = 473.1 V → 480; 1.1 × 690/0.86 = 882.6 V → 900.
    expect(capacitorRatedVoltage(0.4, 50)).toBe(0.44);
    expect(capacitorRatedVoltage(0.4 / 0.93, 50)).toBe(0.48);
    expect(capacitorRatedVoltage(0.69 / 0.86, 50)).toBe(0.9);
  });
  it('50 Hz MV made to order, rounded up to 0.1 kV: 6.6 kV with 7 % → 7.9 kV', () => {
    // 1.1 × 6.6/0.93 = 7.806 kV → 7.9 kV; star of single-phase units of 7.9/√3 = 4.561 kV.
    const r = chooseCapacitorRating(6.6 / 0.93, 50);
    expect(r.bank_rated_kv).toBe(7.9);
    expect(r.unit_rated_kv).toBeCloseTo(4.561, 3);
    expect(r.arrangement).toBe('single-phase units in star');
  });
  it('60 Hz MV from IEEE 18 Table 1 units in star: 13.8 kV plain → one 9.54 kV unit per phase', () => {
    // 1.1 × 13.8 = 15.18 kV, 8.764 kV per phase → 9.54 kV units (16.52 kV as a bank); two in
    // series would need 4.8 kV units (16.63 kV), more.
    const r = chooseCapacitorRating(13.8, 60);
    expect(r).toMatchObject({ unit_rated_kv: 9.54, units_in_series: 1 });
    expect(r.bank_rated_kv).toBeCloseTo(Math.sqrt(3) * 9.54, 9);
  });
  it('60 Hz, 69 kV plain: three 15.125 kV units in series per phase', () => {
    // 1.1 × 69 = 75.9 kV, 43.82 kV per phase: no single unit reaches it; 2 × 22.8 = 45.6,
    // 3 × 15.125 = 45.375, 4 × 11.4 = 45.6 → three in series is the lowest rating above.
    expect(chooseCapacitorRating(69, 60)).toMatchObject({ unit_rated_kv: 15.125, units_in_series: 3 });
  });
});

describe('capacitors rated below the rule', () => {
  it('440 V units in a 7 % bank on 400 V: a warning that asks for 480 V', () => {
    // Uc = 400/0.93 = 430.1 V (below 440 V, so not an overvoltage) but 1.1 × 430.1 = 473.1 V > 440 V.
    const s = site(['L1,LV,load,100,0.8,,,,,,,0.4', 'C1,LV,capacitor,,,,,,,,,0.4,20,0.44,7']);
    const w = designCompensation(s).warnings.filter((x) => x.tag === 'C1');
    expect(w.map((x) => [x.code, x.severity, x.row, x.column])).toEqual([
      ['capacitor-rating-margin', 'warning', 3, 'u_rated_kv'],
    ]);
    expect(w[0]?.message).toContain(
      `the ${detunedCapacitorKv(0.4, 7).toFixed(3)} kV across it with 7 % detuning`,
    );
    expect(w[0]?.message).toContain('choose at least 0.48 kV');
  });
  it('the same rule for a bank typed on the Compensation sheet', () => {
    const s = site(['L1,LV,load,100,0.8,,,,,,,0.4']);
    const a = assessBanks(s, [{ bus: 'LV', step_kvar: 25, steps: 2, p_pct: 7, u_rated_kv: 0.44 }]);
    expect(a.warnings.filter((x) => x.code === 'capacitor-rating-margin').map((x) => x.bus)).toEqual(['LV']);
    const ok = assessBanks(s, [{ bus: 'LV', step_kvar: 25, steps: 2, p_pct: 7, u_rated_kv: 0.48 }]);
    expect(ok.warnings.some((x) => x.code === 'capacitor-rating-margin')).toBe(false);
  });
  it('525 V units in a 7 % bank on 400 V give 62.4 % of their nameplate, (Uc/Ur)²·(1 − p)', () => {
    // (430.1/525)² = 0.671, × 0.93 = 0.624; recomputed as a series L–C branch from the nameplate.
    const s = site(['L1,LV,load,100,0.8,,,,,,,0.4', 'C1,LV,capacitor,,,,,,,,,0.4,20,0.525,7']);
    const share = -capacitorStepKvar(1, 0.525, 0.4, 7);
    expect(share).toBeCloseTo(0.624, 3);
    const w = designCompensation(s).warnings.find((x) => x.code === 'capacitor-underrated-use');
    expect(w?.message).toContain(`only ${(100 * share).toFixed(1)} % of its nameplate kvar`);
  });
});
