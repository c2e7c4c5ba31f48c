// Steps a panel builder would build (common practice, stated in src/core/site/stepRules.ts):
// contactor-switched LV steps of at most about 50 kvar at 400 V (~72 A), one controller of 12
// outputs per section; at LV a 1:2:2 or 1:2:4 series where it reaches the same smallest step with
// fewer stages and contactors; MV steps few, large and equal, switched by vacuum contactors up to
// 12 kV and by circuit breakers above.
import { describe, expect, it } from 'vitest';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { chooseStep } from '../../../src/core/site/bankRules.ts';
import { bankTotal } from '../../../src/core/site/bankChoice.ts';
import { choicesFromDesign } from '../../../src/core/site/compensation.ts';
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
      // Equal stages: a 1:2:2 bank at the same 50 kvar resolution would need 100 kvar stages,
      // twice what one contactor switches.
      series: '1:1:1',
      controller_steps: 24,
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

describe('step series a panel builder would choose', () => {
  it('300 kvar at 400 V: six equal 50 kvar stages (doubling one would pass the 50 kvar contactor limit)', () => {
    // Smallest standard step covering 300 kvar in at most 6 steps: 300/50 = 6. A 1:2:2 or 1:2:4
    // series at 50 kvar resolution needs a 100 kvar stage; at 25 kvar it needs 7 stages (1:2:2),
    // more than six.
    expect(chooseStep(300, 0.4)).toMatchObject({
      step: 50,
      steps: 6,
      series: '1:1:1',
      controller_steps: 6,
      sections: [6],
    });
  });

  it('100 kvar at 400 V: 20 kvar resolution in three 1:2:2 stages (20 + 40 + 40) instead of five', () => {
    // Steps of 15 kvar would take ceil(100/15) = 7 > 6, so 20 kvar: 5 positions. 1:2:2 with n
    // stages gives 2n − 1 positions: n = 3 gives 5, largest stage 40 kvar ≤ 50 (contactor limit).
    // 1:2:4 with 3 stages gives 7 positions (two steps more than needed) and an 80 kvar stage.
    expect(chooseStep(100, 0.4)).toMatchObject({
      step: 20,
      steps: 3,
      series: '1:2:2',
      controller_steps: 5,
      sections: [3],
    });
  });

  it('12.5 kvar resolution for 75 kvar at 400 V: 1:2:4 in three stages (12.5 + 25 + 50)', () => {
    // 75/12.5 = 6 positions; 1:2:2 needs 4 stages (7 positions); binary needs 3 (7 positions,
    // one more than six), largest stage 4 × 12.5 = 50 kvar, at the limit.
    expect(chooseStep(75, 0.4)).toMatchObject({ step: 12.5, steps: 3, series: '1:2:4', controller_steps: 7 });
  });

  it('MV: equal stages even where 1:2:2 would save one (doubling a stage doubles its voltage step)', () => {
    // 1,100 kvar at 6.6 kV: 3 × 400 kvar; 33 kV: 3 × 2,000 kvar.
    expect(chooseStep(1100, 6.6)).toMatchObject({
      step: 400,
      steps: 3,
      series: '1:1:1',
      controller_steps: 3,
    });
    expect(chooseStep(6000, 33)).toMatchObject({ series: '1:1:1', switching: 'circuit breaker' });
  });

  describe('a 480 V 60 Hz bus: 250 kW at cos φ 0.75, cos φ ≥ 0.95 required', () => {
    // By hand: Q = 250·tan(acos 0.75) = 220.48 kvar; allowed 250·tan(acos 0.95) = 82.17 kvar;
    // need 138.31 kvar. The contactor limit at 480 V is 50·480/400 = 60 kvar. Steps of 20 kvar
    // would take 7 > 6, so 25 kvar: ceil(138.31/25) = 6 positions. 1:2:2 in 4 stages gives
    // 2·4 − 1 = 7 positions of 25 kvar (175 kvar), the largest stage 50 kvar ≤ 60: four stages
    // and contactors instead of six, for one 25 kvar step more.
    const need = 250 * Math.tan(Math.acos(0.75)) - 250 * Math.tan(Math.acos(0.95));
    const { site, problems } = siteFromCsv('tag,bus,kind,p_kw,cos_phi,u_kv\nL1,LV,load,250,0.75,0.48', {
      hz: 60,
    });
    const design = designCompensation(site);
    const bank = design.banks[0];

    it('needs 138.3 kvar', () => {
      expect(problems).toEqual([]);
      expect(need).toBeCloseTo(138.31, 2);
      expect(design.cases[0]?.need.capacitive_kvar).toBeCloseTo(need, 6);
    });
    it('gets 4 stages of 1:2:2 with 25 kvar smallest: 7 controller steps, 175 kvar', () => {
      expect(bank).toMatchObject({ step_kvar: 25, steps: 4, series: '1:2:2', controller_steps: 7 });
      expect(bank?.total_kvar).toBe(175);
      expect(bank?.why).toContain('4 stages in the series 1:2:2 give 7 controller steps of 25 kvar');
      const [choice] = choicesFromDesign(design.banks, []);
      expect(choice).toMatchObject({ steps: 4, series: '1:2:2', step_kvar: 25 });
      expect(bankTotal(choice)).toBe(175);
    });
    it('switches ceil(138.31/25) = 6 smallest steps and meets the requirement', () => {
      expect(bank?.steps_in[site.settings.cases[0] as string]).toBe(6);
      expect(design.cases[0]?.met_after).toBe(true);
    });
  });
});
