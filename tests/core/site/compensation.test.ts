// Compensation design against outside values (each check names its source and kind) and the
// stated rules.
import { describe, expect, it } from 'vitest';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { rollUpAll } from '../../../src/core/site/rollup.ts';
import { kvarNeeded, requirementBand } from '../../../src/core/site/requirement.ts';
import {
  capacitorRatedVoltage,
  capacitorVoltage,
  chooseStep,
  nearHarmonic,
  outputPerNameplateKvar,
  voltageRise,
  STEP_SERIES_KVAR,
} from '../../../src/core/site/bankRules.ts';
import { siteFromCsv } from './fixtures.ts';
import {
  capacitorStepKvar,
  detunedCapacitorKv,
  parallelResonanceOrder,
  qFromPowerFactor,
  shortCircuitMvaInOhms,
  voltageRiseApprox,
} from '../functions/independent.ts';

const HEAD =
  'tag,bus,kind,qty,p_kw,eff,cos_phi,i0_pct,s_kva,uk_pct,p0_kw,pk_kw,to_bus,u_kv,c_uf_km,len_km,q_kvar,u_rated_kv,p_pct,load:day,load:night';
const site = (rows: string[], settings = {}) => {
  const r = siteFromCsv([HEAD, ...rows].join('\n'), { cases: ['day', 'night'], ...settings });
  expect(r.problems).toEqual([]);
  return r.site;
};

describe('requirement', () => {
  it('650 kW at cos φ 0.65 raised to 1.00 needs about 760 kvar (a textbook worked example from memory; recomputed by Pythagoras)', () => {
    const q = qFromPowerFactor(650, 0.65);
    expect(Math.abs(q - 760)).toBeLessThan(0.5);
    expect(kvarNeeded(650, q, { kind: 'cosphi', target: 1 })).toEqual({
      capacitive_kvar: expect.closeTo(q, 9),
      inductive_kvar: 0,
    });
  });
  it('cos φ 0.95 both ways is |Q/P| ≤ 0.3287 (US FERC Order No. 827: 0.95 leading to 0.95 lagging)', () => {
    const band = requirementBand({ kind: 'cosphi', target: 0.95 });
    expect(band.lagTan).toBeCloseTo(0.3287, 4);
    expect(band.leadTan).toBe(band.lagTan);
    expect(kvarNeeded(1000, -500, { kind: 'cosphi', target: 0.95 })).toEqual({
      capacitive_kvar: 0,
      inductive_kvar: expect.closeTo(500 - qFromPowerFactor(1000, 0.95), 9),
    });
  });
  it('a tan φ band gives its own limits; exported power is judged by |P|', () => {
    const r = { kind: 'tanphi', lagMax: 0.4, leadMax: 0.1 } as const;
    expect(kvarNeeded(1000, 500, r)).toEqual({ capacitive_kvar: 100, inductive_kvar: 0 });
    expect(kvarNeeded(-1000, -300, r).inductive_kvar).toBeCloseTo(200, 9);
  });
});

describe('bank rules', () => {
  it('detuned step: 80 kvar / 525 V capacitors with a 7 % reactor give about 49.9 kvar at 400 V (a worked example from memory; recomputed as a series L–C branch)', () => {
    expect(80 * outputPerNameplateKvar(0.525, 0.4, 7, 50)).toBeCloseTo(49.9, 1);
    expect(80 * outputPerNameplateKvar(0.525, 0.4, 7, 50)).toBeCloseTo(
      -capacitorStepKvar(80, 0.525, 0.4, 7),
      9,
    );
  });
  it('capacitor voltage of a 6 % detuned step on 400 V is 425.5 V (recomputed: voltage divider of the L–C branch)', () => {
    expect(capacitorVoltage(0.4, 6) * 1000).toBeCloseTo(425.5, 1);
    expect(capacitorVoltage(0.4, 6)).toBeCloseTo(detunedCapacitorKv(0.4, 6), 12);
  });
  it('13.8 kV bus, 125 MVA, 5 Mvar: voltage rise 4 % and resonance at the 5th (the rules of IEEE Std 1036, from memory; order recomputed by bisection)', () => {
    expect(voltageRise(5000, 125)).toBeCloseTo(4, 9);
    expect(nearHarmonic(parallelResonanceOrder(125, 5000))).toBe(5);
    expect(nearHarmonic(9)).toBeUndefined();
  });
  it('step sizes come from the standard series, within the preferred number of steps (common practice)', () => {
    expect(chooseStep(300, 0.4)).toMatchObject({ step: 50, steps: 6, capped: false });
    // 310 kvar in 6 steps would need 60 kvar steps, above the 50 kvar contactor limit at 400 V.
    expect(chooseStep(310, 0.4)).toMatchObject({ step: 50, steps: 7, capped: false });
    expect(chooseStep(310, 0.48)).toMatchObject({ step: 60, steps: 6, capped: false });
    expect(chooseStep(1100, 6.6)).toMatchObject({ step: 400, steps: 3, capped: false });
    for (const q of [7, 99, 480, 2222]) expect(STEP_SERIES_KVAR).toContain(chooseStep(q, 0.4).step);
  });
  it('capacitor rated voltage leaves 10 % above the voltage across them (common practice)', () => {
    expect(capacitorRatedVoltage(0.4)).toBe(0.44);
    expect(capacitorRatedVoltage(0.4 / 0.93)).toBe(0.48);
    expect(capacitorRatedVoltage(6.6 / 0.93)).toBe(7.9);
  });
});

describe('designCompensation', () => {
  // 1 500 kVA, 5.5 % transformer on a 48 MVA supply: about 17.4 MVA at the bus; 350 kvar there
  // resonates at h ≈ 7.05, "right on the 7th" (a worked example from memory; both recomputed in
  // the first test below).
  const seventh = site(
    [
      'T1,MV,transformer,,,,,1.0,1500,5.5,1.6,16,LV,0.4',
      'L1,LV,load,,1000,,0.8,,,,,,,0.4,,,,,,1,0.5',
      'C1,LV,capacitor,,,,,,,,,,,0.4,,,350,0.4',
    ],
    { cases: ['day', 'night'], sscMva: 48 },
  );
  const d7 = designCompensation(seventh, rollUpAll(seventh));

  it('flags the installed bank that lands on the 7th harmonic', () => {
    const ssc = shortCircuitMvaInOhms(1500, 5.5, 48);
    expect(ssc.toFixed(2)).toBe('17.39');
    expect(parallelResonanceOrder(ssc, 350).toFixed(2)).toBe('7.05');
    const w = d7.warnings.find((x) => x.code === 'resonance' && x.row === 4);
    expect(w).toMatchObject({ severity: 'warning', bus: 'LV', column: 'q_kvar', tag: 'C1' });
    expect(w?.message).toContain('short-circuit power 17.39 MVA');
    expect(w?.message).toContain('order 7.05');
    expect(w?.message).toContain('7th harmonic');
  });
  it('detunes the added bank there, and says plain and detuned units should not be mixed', () => {
    const bank = d7.banks.find((b) => b.bus === 'LV');
    expect(bank?.p_pct).toBe(7);
    expect(bank?.why).toMatch(
      /but a plain bank with [\d.]+ kvar connected would resonate at order [\d.]+, near the (5th|7th)/,
    );
    expect(bank?.resonance.every((r) => r.near === null)).toBe(true);
    expect(d7.warnings.some((x) => x.code === 'detuned-and-plain-mixed' && x.bus === 'LV')).toBe(true);
    expect(bank?.u_cap_kv).toBeCloseTo(0.4 / 0.93, 12);
    expect(bank?.u_rated_kv).toBe(0.48);
    // Nameplate per step at 480 V that gives the step output at 400 V behind 7 %.
    expect(bank?.step_rated_kvar).toBeCloseTo(((bank?.step_kvar as number) * 0.93) / (0.4 / 0.48) ** 2, 9);
  });
  it('meets the requirement after, with steps following the need case by case', () => {
    expect(d7.cases.map((c) => [c.case, c.met_before, c.met_after])).toEqual([
      ['day', false, true],
      ['night', true, true],
    ]);
    const bank = d7.banks[0];
    expect((bank?.steps_in.night as number) < (bank?.steps_in.day as number)).toBe(true);
    // One switching operation adds at most the largest stage: twice the smallest in a 1:2:2 bank.
    const largest = (bank?.step_kvar as number) * (bank?.series === '1:1:1' ? 1 : 2);
    expect(bank?.series).toBe('1:2:2');
    expect(bank?.vrise_step_pct).toBeCloseTo(
      (100 * largest) / (shortCircuitMvaInOhms(1500, 5.5, 48) * 1000),
      9,
    );
  });

  it('flags a capacitor voltage above its rating (CAPBANK.UCAP against u_rated_kv)', () => {
    const s = site([
      'L1,LV,load,,100,,0.8,,,,,,,0.4',
      'C1,LV,capacitor,,,,,,,,,,,0.4,,,20,0.4,6',
      'C2,LV,capacitor,,,,,,,,,,,0.4,,,20,0.38,7',
      'C3,LV,capacitor,,,,,,,,,,,0.4,,,20,0.44,6',
    ]);
    const w = designCompensation(s).warnings.filter((x) => x.code === 'capacitor-overvoltage');
    expect(w.map((x) => [x.severity, x.row, x.column])).toEqual([
      ['error', 4, 'u_rated_kv'],
      ['warning', 3, 'u_rated_kv'],
    ]);
    // 400 V behind 6 %: U/(1 − p) across the capacitors (the L–C divider, recomputed).
    const uc = detunedCapacitorKv(0.4, 6).toFixed(3);
    expect(w[1]?.message).toContain(`sees ${uc} kV continuously, above its rating of 0.4 kV`);
  });

  it('motor self-excitation: individual capacitor above 90 % of the no-load kvar is an error (common practice, NEMA MG 1 Part 14)', () => {
    // 90 kW, η 0.94, cos φ 0.85, i0 35 %: Q0 = 0.35·90/(0.94·0.85) = 39.42 kvar; limit 0.9·Q0 = 35.48 kvar.
    const q0 = (0.35 * 90) / (0.94 * 0.85);
    const rows = (q: number) =>
      site([
        'T1,MV,transformer,,,,,1,630,4,0.6,6.5,LVM,0.4',
        'M1,LVM,motor,,90,0.94,0.85,35,,,,,,0.4,,,,,,1,1',
        `C1,LVM,capacitor,,,,,,,,,,,0.4,,,${q},0.4`,
      ]);
    const over = designCompensation(rows(40)).warnings.find((x) => x.code === 'self-excitation');
    expect(over).toMatchObject({ severity: 'error', row: 4, column: 'q_kvar', tag: 'C1', bus: 'LVM' });
    expect(over?.message).toContain(`KVAR.MOTORCAP.MAX = ${(0.9 * q0).toFixed(1)} kvar`);
    expect(
      designCompensation(rows(30)).warnings.some(
        (x) => x.code === 'self-excitation' && x.severity === 'error',
      ),
    ).toBe(false);
    const bank = designCompensation(rows(5)).banks.find((b) => b.bus === 'LVM');
    expect(bank?.self_excitation_limit_kvar).toBeCloseTo(0.9 * q0, 9);
    expect(bank?.steps).toBe(0);
    // The installed 5 kvar and the added fixed capacitor together stay within the limit.
    expect(bank?.fixed_kvar).toBeGreaterThan(0);
    expect((bank?.fixed_kvar as number) + 5).toBeLessThanOrEqual(0.9 * q0);
  });

  it('a shunt reactor where cable charging leaves the connection leading at light load, only in that case', () => {
    // 11 kV, 0.3 µF/km, 25 km: 2π·50·0.3e-6·25·11000²/1000 = 285.1 kvar of charging.
    const s = site(
      [
        'K1,MV,cable,,,,,,,,,,,11,0.3,25',
        'T1,MV,transformer,,,,,1,1000,6,0.7,7.6,LV,0.4',
        'L1,LV,load,,600,,0.95,,,,,,,0.4,,,,,,1,0.02',
      ],
      { requirement: { kind: 'tanphi', lagMax: 0.4, leadMax: 0.2 } },
    );
    const d = designCompensation(s);
    expect(d.banks).toEqual([]);
    expect(d.reactors).toHaveLength(1);
    expect(d.reactors[0]).toMatchObject({ bus: 'MV', u_kv: 11, in_service: { day: false, night: true } });
    expect(d.cases.map((c) => [c.case, c.met_before, c.met_after])).toEqual([
      ['day', true, true],
      ['night', false, true],
    ]);
    const w = d.warnings.find((x) => x.code === 'charging-dominates');
    expect(w).toMatchObject({ case: 'night', bus: 'MV' });
    expect(w?.message).toContain('cable and line charging 285 kvar');
  });

  it('warns about overcompensation by an installed capacitor in a light-load case', () => {
    const s = site([
      'T1,MV,transformer,,,,,1,1000,6,0.7,7.6,LV,0.4',
      'M1,LV,motor,4,75,0.95,0.86,,,,,,,0.4,,,,,,1,0',
      'C1,LV,capacitor,,,,,,,,,,,0.4,,,120,0.44',
    ]);
    const w = designCompensation(s).warnings.filter((x) => x.code === 'overcompensation');
    expect(w.map((x) => [x.case, x.bus])).toEqual([['night', 'LV']]);
    expect(w[0]?.message).toContain('installed capacitors C1 in service');
  });

  it('warns when switching one step raises the voltage by more than 3 % (VRISE.PCT)', () => {
    const s = site(['K1,MV,cable,,,,,,,,,,,13.8,0.3,0.5', 'L1,MV,load,,20000,,0.75,,,,,,,13.8,,,,,,1,1'], {
      sscMva: 125,
    });
    const d = designCompensation(s);
    const w = d.warnings.find((x) => x.code === 'voltage-rise');
    expect(d.banks[0]?.step_kvar).toBe(4000);
    // ΔU ≈ X·Q/U with X = U²/Ssc: one 4 Mvar step on 125 MVA (recomputed in ohms).
    expect(w?.message).toContain(`raises the voltage by ${voltageRiseApprox(4000, 125).toFixed(2)} %`);
  });

  it('says when resonance cannot be assessed (no supply short-circuit power)', () => {
    const s = site(['L1,LV,load,,100,,0.7,,,,,,,0.4']);
    expect(designCompensation(s).warnings.map((w) => w.code)).toContain('resonance-not-assessed');
  });
});
