// Quantities for hand-worked designs. Each expected figure is worked out here from first
// principles, not from the code: a detuned step is a series L–C branch with X_L = p·X_C, so the
// output at U is Q_r·(U/U_r)²/(1 − p) and the nameplate for an output Q is Q·(1 − p)·(U_r/U)²
// (circuit theory); line current I = Q/(√3·U); switching devices carry 1.43 × the capacitor
// current (IEC 60831-1's 1.3 In times the 1.1 capacitance tolerance, as IEC 61921 states for LV
// banks); device classes from the R10 current series of IEC 60059. Unit sizes, section sizes and
// controller models are common practice (from memory) and named as such in itemRules.ts.
import { describe, expect, it } from 'vitest';
import { bankSpec, busSchedule, siteSchedule } from '../../../src/core/quote/index.ts';
import { siteFromCsv } from '../site/fixtures.ts';

const byCode = (items: ReturnType<typeof busSchedule>) => new Map(items.map((i) => [i.code, i]));

describe('a 6-step 300 kvar bank, 7 % detuned, at 400 V 50 Hz with 480 V capacitors', () => {
  const spec = bankSpec({ bus: 'LV1', step_kvar: 50, steps: 6, p_pct: 7, u_rated_kv: 0.48 }, 0.4, 50);
  const items = byCode(busSchedule(spec));

  it('capacitors: 66.96 kvar nameplate per step, two 33.48 kvar units each (LV units up to 50 kvar)', () => {
    const nameplate = 50 * (1 - 0.07) * (0.48 / 0.4) ** 2; // = 66.96
    expect(nameplate).toBeCloseTo(66.96, 9);
    const cap = items.get('LV capacitor');
    expect(cap?.count).toBe(12);
    expect(cap?.unit).toBe('kvar');
    expect(cap?.quantity).toBeCloseTo(6 * 66.96, 6);
    expect(cap?.what).toContain('12 × 33.48 kvar');
  });
  it('detuning reactors: one per step, 300 kvar carried, tuned to 1/√0.07 = 3.78 → 189 Hz', () => {
    const r = items.get('LV detuning reactor 7 %');
    expect(r?.count).toBe(6);
    expect(r?.quantity).toBe(300);
    expect(spec.tuning_order).toBeCloseTo(1 / Math.sqrt(0.07), 3);
    expect(r?.what).toContain('188.98 Hz');
  });
  it('step contactors: 50 kvar is 72.2 A, × 1.43 = 103.2 A → the 125 A class, six of them', () => {
    const amps = (50 / (Math.sqrt(3) * 0.4)) * 1.43;
    expect(amps).toBeCloseTo(103.2, 1);
    expect(items.get('LV contactor 125 A')?.count).toBe(6);
  });
  it('one 6-output controller, two 250 kvar detuned sections, a 630 A fuse-switch (433 A × 1.43 = 619 A)', () => {
    expect(items.get('Step controller 6 outputs')?.count).toBe(1);
    expect(items.get('LV section')?.count).toBe(2);
    expect((300 / (Math.sqrt(3) * 0.4)) * 1.43).toBeCloseTo(619.2, 1);
    expect(items.get('LV fuse-switch 630 A')?.count).toBe(1);
  });
  it('nothing else: no discharge devices (LV units discharge through their own resistors), no reactor', () => {
    expect([...items.keys()].sort()).toEqual(
      [
        'LV capacitor',
        'LV detuning reactor 7 %',
        'LV contactor 125 A',
        'Step controller 6 outputs',
        'LV section',
        'LV fuse-switch 630 A',
      ].sort(),
    );
  });
});

describe('an MV fixed bank: 1200 kvar plain at 11 kV with 12.1 kV capacitors', () => {
  const items = byCode(busSchedule(bankSpec({ bus: 'MV', fixed_kvar: 1200, u_rated_kv: 12.1 }, 11, 50)));
  it('1452 kvar nameplate (1200 × (12.1/11)²) in three single-phase units of 484 kvar', () => {
    const cap = items.get('MV capacitor');
    expect(cap?.quantity).toBeCloseTo(1200 * (12.1 / 11) ** 2, 6);
    expect(cap?.count).toBe(3);
    expect(cap?.what).toContain('3 × 484 kvar');
  });
  it('one frame, a 630 A breaker (63 A × 1.43 = 90 A; MV breakers start at 630 A), no steps, controller or VTs', () => {
    expect((1200 / (Math.sqrt(3) * 11)) * 1.43).toBeCloseTo(90.07, 2);
    expect([...items.keys()].sort()).toEqual(['MV breaker 630 A', 'MV capacitor', 'MV frame'].sort());
    expect(items.get('MV frame')?.count).toBe(1);
  });
});

describe('an MV stepped bank: 3 × 400 kvar at 6.6 kV, 7 % detuned', () => {
  const items = byCode(
    busSchedule(bankSpec({ bus: 'MV', step_kvar: 400, steps: 3, p_pct: 7, u_rated_kv: 7.8 }, 6.6, 50)),
  );
  it('per step 400/(√3·6.6) = 35 A × 1.43 = 50 A: a 200 A vacuum contactor; two discharge VTs per step', () => {
    expect(items.get('MV contactor 200 A')?.count).toBe(3);
    expect(items.get('MV discharge VT')?.count).toBe(6);
    expect(items.get('MV frame')?.count).toBe(3);
    expect(items.get('Step controller 6 outputs')?.count).toBe(1);
  });
  it('nameplate per step 400 × 0.93 × (7.8/6.6)² = 519.6 kvar: 3 units per step, 9 in all', () => {
    const cap = items.get('MV capacitor');
    expect(cap?.quantity).toBeCloseTo(3 * 400 * 0.93 * (7.8 / 6.6) ** 2, 6);
    expect(cap?.count).toBe(9);
  });
});

describe('a shunt reactor', () => {
  it('250 kvar at 11 kV: the reactor and one switching device for 13.1 A (a 200 A contactor)', () => {
    const items = busSchedule(bankSpec({ bus: 'MV', reactor_kvar: 250 }, 11, 50));
    expect(250 / (Math.sqrt(3) * 11)).toBeCloseTo(13.12, 2);
    expect(items.map((i) => [i.code, i.count, i.quantity])).toEqual([
      ['MV shunt reactor', 1, 250],
      ['MV contactor 200 A', 1, 1],
    ]);
  });
  it('above 12 kV a contactor is not offered: a 2 Mvar reactor at 33 kV takes a 630 A breaker', () => {
    const items = busSchedule(bankSpec({ bus: 'HV', reactor_kvar: 2000 }, 33, 50));
    expect(items.map((i) => i.code)).toEqual(['MV shunt reactor', 'MV breaker 630 A']);
  });
});

describe('what is not known is said, never counted as zero', () => {
  it("a blank capacitor rated voltage takes the design's rating: 1.1 × 400 V = 440 V (makers' IEC ranges, from memory)", () => {
    const spec = bankSpec({ bus: 'LV1', step_kvar: 50, steps: 6 }, 0.4, 50);
    expect([spec.u_rated_kv, spec.u_rated_from]).toEqual([0.44, 'design']);
    const cap = busSchedule(spec).find((i) => i.code === 'LV capacitor');
    // 50 · (0.44/0.4)² = 60.5 kvar nameplate a step: two units each, 12 in all
    expect(cap?.quantity).toBeCloseTo(6 * 50 * 1.1 ** 2, 9);
    expect(cap?.count).toBe(12);
    expect(cap?.what).toContain("at 0.44 kV rated (the design's rating)");
  });
  it('7 % detuned and blank: 400/(1 − 0.07) = 430 V across, × 1.1 = 473 V → 480 V, as if typed', () => {
    const blank = busSchedule(bankSpec({ bus: 'LV1', step_kvar: 50, steps: 6, p_pct: 7 }, 0.4, 50));
    const typed = busSchedule(
      bankSpec({ bus: 'LV1', step_kvar: 50, steps: 6, p_pct: 7, u_rated_kv: 0.48 }, 0.4, 50),
    );
    expect(blank.map((i) => [i.code, i.count, i.quantity])).toEqual(
      typed.map((i) => [i.code, i.count, i.quantity]),
    );
  });
  it('a detuning the catalogue refuses leaves the capacitors without a quantity and names the inputs', () => {
    const items = busSchedule(bankSpec({ bus: 'LV1', step_kvar: 50, steps: 6, p_pct: 100 }, 0.4, 50));
    const cap = items.find((i) => i.code === 'LV capacitor');
    expect(cap?.quantity).toBeNull();
    expect(cap?.missing).toMatch(/rated voltage is unknown for bus LV1/);
    expect(items.find((i) => i.code === 'LV contactor 125 A')?.count).toBe(6);
  });
  it('a site: buses without a bank are left out; a bus of unknown voltage says so', () => {
    const { site } = siteFromCsv(
      [
        'tag,bus,kind,qty,p_kw,cos_phi,u_kv,load',
        'M1,LV1,motor,1,200,0.8,0.4,1',
        'L1,LV2,load,1,50,0.9,0.4,1',
      ].join('\n'),
    );
    const s = siteSchedule(site, [
      { bus: 'LV1', step_kvar: 25, steps: 4, u_rated_kv: 0.44 },
      { bus: 'LV2' },
      { bus: 'GHOST', fixed_kvar: 10 },
    ]);
    expect(s.map((e) => e.bus)).toEqual(['LV1', 'GHOST']);
    expect(s[1]?.items[0]?.missing).toMatch(/voltage of bus GHOST is unknown/);
  });
});

describe('controllers follow the design’s sections (stepRules.ts: at most 12 steps a section)', () => {
  it('18 steps of 25 kvar at 400 V: two sections of 9, a 12-output controller each', () => {
    const spec = bankSpec({ bus: 'LV1', step_kvar: 25, steps: 18, u_rated_kv: 0.44 }, 0.4, 50);
    expect(spec.sections).toEqual([9, 9]);
    const c = busSchedule(spec).find((i) => i.code.startsWith('Step controller'));
    expect([c?.code, c?.count]).toEqual(['Step controller 12 outputs', 2]);
  });
  it('5 steps: one section, the 6-output model', () => {
    const spec = bankSpec({ bus: 'LV1', step_kvar: 25, steps: 5, u_rated_kv: 0.44 }, 0.4, 50);
    expect(spec.sections).toEqual([5]);
    expect(busSchedule(spec).find((i) => i.code.startsWith('Step controller'))?.code).toBe(
      'Step controller 6 outputs',
    );
  });
});

describe('a 1:2:2 bank of 3 stages, 25/50/50 kvar, plain at 400 V with 440 V capacitors', () => {
  // Stages 25 + 50 + 50 = 125 kvar, 5 controller steps of 25 kvar (the ratio notation). Each
  // stage is its own circuit: its units, its contactor, sized by its own current.
  const spec = bankSpec({ bus: 'LV', step_kvar: 25, steps: 3, series: '1:2:2', u_rated_kv: 0.44 }, 0.4, 50);
  const items = busSchedule(spec);
  const lines = (prefix: string) =>
    items.filter((i) => i.code.startsWith(prefix)).map((i) => [i.code, i.count, i.quantity]);

  it('capacitors per stage: 25·(0.44/0.4)² = 30.25 kvar nameplate, one unit; a 50 kvar stage two of 30.25', () => {
    const small = 25 * (0.44 / 0.4) ** 2;
    expect(small).toBeCloseTo(30.25, 9);
    const caps = items.filter((i) => i.code === 'LV capacitor');
    expect(caps.map((i) => i.count)).toEqual([1, 4]); // 1 stage × 1 unit; 2 stages × 2 units
    expect(caps[0]?.quantity).toBeCloseTo(small, 9);
    expect(caps[1]?.quantity).toBeCloseTo(2 * 2 * small, 9);
    expect(caps[1]?.what).toContain('2 stages of 50 kvar: 2 a stage, 4 × 30.25 kvar');
  });
  it('one contactor per stage by its own current: 25 kvar 51.6 A → 63 A once, 50 kvar 103.2 A → 125 A twice', () => {
    expect(spec.controller_steps).toBe(5);
    expect((25 / (Math.sqrt(3) * 0.4)) * 1.43).toBeCloseTo(51.6, 1);
    expect((50 / (Math.sqrt(3) * 0.4)) * 1.43).toBeCloseTo(103.2, 1);
    expect(lines('LV contactor')).toEqual([
      ['LV contactor 63 A', 1, 1],
      ['LV contactor 125 A', 2, 2],
    ]);
    expect(lines('Step controller')).toEqual([['Step controller 6 outputs', 1, 1]]);
  });
  it('the incomer carries all 125 kvar: 180.4 A × 1.43 = 258 A → 315 A fuse-switch; one section', () => {
    expect((125 / (Math.sqrt(3) * 0.4)) * 1.43).toBeCloseTo(258.0, 1);
    expect(lines('LV fuse-switch')).toEqual([['LV fuse-switch 315 A', 1, 1]]);
    expect(lines('LV section')).toEqual([['LV section', 1, 1]]);
  });
  it('7 % detuned, a reactor per stage: one for 25 kvar, two for 50 kvar, 125 kvar carried', () => {
    const detuned = busSchedule(
      bankSpec({ bus: 'LV', step_kvar: 25, steps: 3, series: '1:2:2', p_pct: 7, u_rated_kv: 0.48 }, 0.4, 50),
    );
    const r = detuned.filter((i) => i.code === 'LV detuning reactor 7 %');
    expect(r.map((i) => [i.count, i.quantity])).toEqual([
      [1, 25],
      [2, 100],
    ]);
  });
});

describe('a 1:2:4 bank of 4 stages, 10/20/40/80 kvar at 690 V: every stage size its own line', () => {
  // 150 kvar in 15 steps of 10; currents 10/(√3·0.69) = 8.37 A × 1.43 = 11.97 A → 16 A, then 23.9 →
  // 25 A, 47.9 → 50 A, 95.7 → 100 A (IEC 60059 R10 classes).
  const items = busSchedule(
    bankSpec({ bus: 'LV', step_kvar: 10, steps: 4, series: '1:2:4', u_rated_kv: 0.69 }, 0.69, 50),
  );
  it('four contactors of four classes and capacitors for 1 + 1 + 1 + 2 units (LV units up to 50 kvar)', () => {
    const amps = [10, 20, 40, 80].map((q) => (q / (Math.sqrt(3) * 0.69)) * 1.43);
    expect(amps.map((a) => Math.round(a * 10) / 10)).toEqual([12, 23.9, 47.9, 95.7]);
    expect(items.filter((i) => i.code.startsWith('LV contactor')).map((i) => [i.code, i.count])).toEqual([
      ['LV contactor 16 A', 1],
      ['LV contactor 25 A', 1],
      ['LV contactor 50 A', 1],
      ['LV contactor 100 A', 1],
    ]);
    const caps = items.filter((i) => i.code === 'LV capacitor');
    expect(caps.map((i) => i.count)).toEqual([1, 1, 1, 2]);
    expect(caps.reduce((a, i) => a + (i.quantity ?? 0), 0)).toBeCloseTo(150, 9);
  });
});

describe('a 60 Hz MV bank of IEEE 18 units: 1200 kvar fixed, plain, at 24.9 kV, rating blank', () => {
  // By hand: 1.1 × 24.9 = 27.39 kV wanted. IEEE 18 Table 1 single-phase units (from memory) in
  // star: 1 a phase needs ≥ 15.81 kV → 19.92 (bank 34.50 kV); 2 need ≥ 7.91 → 7.96 (27.57 kV);
  // 3 need ≥ 5.27 → 6.64 (34.50); 4 need ≥ 3.95 → 4.16 (28.82). Two 7.96 kV units a phase.
  const spec = bankSpec({ bus: 'MV', fixed_kvar: 1200 }, 24.9, 60);
  const bank = Math.sqrt(3) * 2 * 7.96;
  it("takes the design's 27.57 kV star of two 7.96 kV units in series a phase", () => {
    expect(spec.u_rated_kv).toBeCloseTo(bank, 9);
    expect(spec.units_in_series).toBe(2);
  });
  it('1200 · (27.57/24.9)² = 1471.6 kvar nameplate in 3 × 2 units of 245.3 kvar (up to 500 kvar a unit)', () => {
    const nameplate = 1200 * (bank / 24.9) ** 2;
    expect(nameplate).toBeCloseTo(1471.6, 1);
    const cap = busSchedule(spec).find((i) => i.code === 'MV capacitor');
    expect(cap?.count).toBe(6);
    expect(cap?.quantity).toBeCloseTo(nameplate, 6);
    expect(cap?.what).toContain('6 × 245.27 kvar');
    expect(cap?.what).toContain('units of 7.96 kV in star, 2 in series a phase');
  });
});
