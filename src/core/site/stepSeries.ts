// Step series of an automatic bank: the sizes of its physical stages as multiples of the
// smallest, and what the controller makes of them. With 1:2:2… or 1:2:4… a few stages give
// many switching positions of the smallest size: the controller step count. The resolution the
// controller reaches is the smallest stage; the bank's total is that times the step count.
// Common practice (power-factor controllers offer these programmes; the names are the trade's
// ratio notation): 1:1:1… equal stages, 1:2:2… one small stage then double ones, 1:2:4…
// binary. Not yet used by the design or the sheets: bankChoice.ts still holds equal steps.

export const STEP_SERIES = ['1:1:1', '1:2:2', '1:2:4'] as const;
export type StepSeries = (typeof STEP_SERIES)[number];

/**
 * Most stages a binary series is given (common practice: beyond 1:2:4:8 the largest stage is
 * eight times the smallest, past what one contactor-switched LV stage carries at useful steps).
 */
export const BINARY_MAX_STAGES = 4;

export function isStepSeries(text: string): text is StepSeries {
  return (STEP_SERIES as readonly string[]).includes(text);
}

/** Stage sizes, in smallest steps, for `stages` physical stages (0 stages: none). */
export function stageRatios(series: StepSeries, stages: number): number[] {
  const n = Math.max(0, Math.floor(stages));
  return Array.from({ length: n }, (_, i) =>
    series === '1:1:1' ? 1 : series === '1:2:2' ? (i === 0 ? 1 : 2) : 2 ** i,
  );
}

/** The controller step count: switching positions above zero, in smallest steps. */
export function controllerSteps(series: StepSeries, stages: number): number {
  return stageRatios(series, stages).reduce((a, b) => a + b, 0);
}

/**
 * The stages in service for `k` smallest steps (0 ≤ k ≤ controllerSteps), largest stages first
 * as a controller fills them; every whole k is reachable in these series.
 */
export function stagesFor(series: StepSeries, stages: number, k: number): boolean[] {
  const ratios = stageRatios(series, stages);
  const on = ratios.map(() => false);
  let left = Math.max(0, Math.min(Math.round(k), controllerSteps(series, stages)));
  for (let i = ratios.length - 1; i >= 0; i--) {
    const r = ratios[i] as number;
    if (r <= left) {
      on[i] = true;
      left -= r;
    }
  }
  return on;
}

export interface SeriesBank {
  /** The smallest stage, kvar: the resolution the controller reaches. */
  readonly smallest_kvar: number;
  /** Each physical stage, kvar, in order. */
  readonly stages_kvar: readonly number[];
  /** Switching positions above zero. */
  readonly controller_steps: number;
  /** All stages in, kvar. */
  readonly total_kvar: number;
}

/** A bank of `stages` physical stages of `series` whose smallest stage is `smallestKvar`. */
export function seriesBank(series: StepSeries, stages: number, smallestKvar: number): SeriesBank {
  const ratios = stageRatios(series, stages);
  const steps = controllerSteps(series, stages);
  return {
    smallest_kvar: smallestKvar,
    stages_kvar: ratios.map((r) => r * smallestKvar),
    controller_steps: steps,
    total_kvar: steps * smallestKvar,
  };
}
