// Step series: every switching position the controller step count promises is reachable, checked
// by enumerating every on/off combination of the stages (an independent route from the
// controller's largest-first filling), and the counts against the closed forms of the series:
// N equal stages give N positions, 1:2:2… gives 2N − 1, binary 1:2:4… gives 2^N − 1.
import { describe, expect, it } from 'vitest';
import {
  STEP_SERIES,
  controllerSteps,
  seriesBank,
  stageRatios,
  stagesFor,
} from '../../../src/core/site/stepSeries.ts';

/** Every sum reachable by switching any subset of the stages. */
function reachable(ratios: readonly number[]): Set<number> {
  const out = new Set<number>();
  for (let mask = 0; mask < 1 << ratios.length; mask++) {
    let sum = 0;
    ratios.forEach((r, i) => {
      if (mask & (1 << i)) sum += r;
    });
    out.add(sum);
  }
  return out;
}

describe('step series', () => {
  it.each([1, 2, 3, 4, 5, 6])('closed forms for %i stages', (n) => {
    expect(controllerSteps('1:1:1', n)).toBe(n);
    expect(controllerSteps('1:2:2', n)).toBe(2 * n - 1);
    expect(controllerSteps('1:2:4', n)).toBe(2 ** n - 1);
  });

  it.each(STEP_SERIES.flatMap((s) => [1, 2, 3, 4, 5].map((n) => [s, n] as const)))(
    '%s with %i stages reaches every whole position, and the controller table gives each',
    (series, n) => {
      const ratios = stageRatios(series, n);
      const steps = controllerSteps(series, n);
      const sums = reachable(ratios);
      for (let k = 0; k <= steps; k++) {
        expect(sums.has(k)).toBe(true);
        const on = stagesFor(series, n, k);
        expect(ratios.reduce((a, r, i) => a + (on[i] ? r : 0), 0)).toBe(k);
      }
      expect(Math.max(...sums)).toBe(steps);
    },
  );

  it('a 1:2:4 bank of 3 stages and 25 kvar: 7 positions of 25 kvar up to 175 kvar', () => {
    expect(seriesBank('1:2:4', 3, 25)).toEqual({
      smallest_kvar: 25,
      stages_kvar: [25, 50, 100],
      controller_steps: 7,
      total_kvar: 175,
    });
    // 100 kvar asked: the 100 kvar stage alone.
    expect(stagesFor('1:2:4', 3, 4)).toEqual([false, false, true]);
  });
});
