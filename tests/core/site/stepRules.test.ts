// Steps a panel builder would build (common practice, stated in src/core/site/stepRules.ts):
// contactor-switched LV steps of at most about 50 kvar at 400 V (~72 A), one controller of 12
// outputs per section, equal steps; MV steps few and large, switched by vacuum contactors up to
// 12 kV and by circuit breakers above.
import { describe, expect, it } from 'vitest';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { chooseStep } from '../../../src/core/site/bankRules.ts';
import { siteFromCsv } from './fixtures.ts';

describe('a site whose need is about 1,200 kvar at 400 V', () => {
  // One bus at 400 V with 1,000 kW at cos φ 0.548 and cos φ ≥ 0.95 required. By hand:
  // Q = 1000·tan(acos 0.548) = 1526.4 kvar; allowed 1000·tan(acos 0.95) = 328.7 kvar;
  // need 1197.7 kvar. Six steps would be 200 kvar each (289 A: a contactor cannot switch that);
  // 50 kvar steps (72 A) take ceil(1197.7/50) = 24 steps, two sections of 12.
  const need = 1000 * Math.tan(Math.acos(0.548)) - 1000 * Math.tan(Math.acos(0.95));
  const { site, problems } = siteFromCsv('tag,bus,kind,p_kw,cos_phi,u_kv\nL1,LV,load,1000,0.548,0.4');
  const design = designCompensation(site);
  const bank = design.banks[0];

  it('is read without problems and needs 1197.7 kvar', () => {
    expect(problems).toEqual([]);
    expect(need).toBeCloseTo(1197.7, 1);
    expect(design.cases[0]?.need.capacitive_kvar).toBeCloseTo(need, 6);
  });

  it('gets 24 steps of 50 kvar in two sections of 12, switched by contactors', () => {
    expect(bank).toMatchObject({
      bus: 'LV',
      fixed_kvar: 0,
      step_kvar: 50,
      steps: Math.ceil(need / 50),
      sections: [12, 12],
      switching: 'capacitor-duty contactor',
    });
    expect(50 / (Math.sqrt(3) * 0.4)).toBeCloseTo(72.2, 1); // amperes a step
    expect(bank?.why).toContain('2 sections of 12 + 12 steps');
    expect(design.cases[0]?.met_after).toBe(true);
  });
});

describe('step rules', () => {
  it('the LV limit scales with the voltage as the same current: 60 kvar at 480 V, 75 kvar (series) at 690 V', () => {
    // 50·480/400 = 60; 50·690/400 = 86.25 → the largest series step below is 75.
    expect(chooseStep(2000, 0.48)).toMatchObject({ step: 60, steps: 34, sections: [12, 11, 11] });
    expect(chooseStep(2000, 0.69).step).toBe(75);
  });
  it('a need beyond four sections is capped and said', () => {
    // 4 × 12 × 50 = 2,400 kvar at 400 V.
    expect(chooseStep(3000, 0.4)).toMatchObject({ step: 50, steps: 48, capped: true });
  });
  it('MV: few large steps, vacuum contactors up to 12 kV, breakers above', () => {
    expect(chooseStep(1100, 6.6)).toMatchObject({ step: 400, steps: 3, switching: 'vacuum contactor' });
    expect(chooseStep(6000, 33)).toMatchObject({ step: 2000, steps: 3, switching: 'circuit breaker' });
  });
});
