// Step series of an automatic bank: the sizes of its physical stages as multiples of the
// smallest, and what the controller makes of them. With 1:2:2… or 1:2:4… a few stages give
// many switching positions of the smallest size: the controller step count. The resolution the
// controller reaches is the smallest stage; the bank's total is that times the step count.
// Common practice (power-factor controllers offer these programmes; the names are the trade's
// ratio notation): 1:1:1… equal stages, 1:2:2… one small stage then double ones, 1:2:4…
// binary. A bank's step is its smallest stage and its step count its physical stages; the rule
// after compensation (compensate.ts) switches whole smallest steps up to the controller count.

export const STEP_SERIES = ['1:1:1', '1:2:2', '1:2:4'] as const;
export type StepSeries = (typeof STEP_SERIES)[number];

/**
 * Most stages a binary series is given (common practice: beyond 1:2:4:8 the largest stage is
 * eight times the smallest, past what one contactor-switched LV stage carries at useful steps).
 */
export const BINARY_MAX_STAGES = 4;

/** The series a blank cell means: equal stages, so workbooks saved before the column read as before. */
export const DEFAULT_STEP_SERIES: StepSeries = '1:1:1';

export function isStepSeries(text: string): text is StepSeries {
  return (STEP_SERIES as readonly string[]).includes(text);
}

/** Most physical stages a series allows (Infinity: no limit of its own). */
export function maxStagesOf(series: StepSeries): number {
  return series === '1:2:4' ? BINARY_MAX_STAGES : Infinity;
}

/** Stage sizes, in smallest steps, for `stages` physical stages (0 stages: none). */
export function stageRatios(series: StepSeries, stages: number): number[] {
  const n = Math.max(0, Math.floor(stages));
  return Array.from({ length: n }, (_, i) =>
    series === '1:1:1' ? 1 : series === '1:2:2' ? (i === 0 ? 1 : 2) : 2 ** i,
  );
}

/** What the series cell or key may hold, for messages. */
export const STEP_SERIES_ALLOWED = `${STEP_SERIES.join(', ')} (blank: ${'1:1:1'})`;

/**
 * Why a series typed beside a stage count cannot be built, or undefined when it can: an unknown
 * series, a binary series beyond BINARY_MAX_STAGES, a stage count that is not whole.
 */
export function seriesProblem(series: string, stages: number | undefined): string | undefined {
  if (!isStepSeries(series)) return `must be one of ${STEP_SERIES_ALLOWED}; got "${series}"`;
  if (series === '1:1:1' || stages === undefined) return undefined;
  if (!Number.isInteger(stages))
    return `a ${series} series needs a whole number of stages in Steps; got ${stages}`;
  if (stages > maxStagesOf(series))
    return `a ${series} series has at most ${maxStagesOf(series)} stages (BINARY_MAX_STAGES); Steps gives ${stages}`;
  return undefined;
}

/** The controller step count: switching positions above zero, in smallest steps. */
export function controllerSteps(series: StepSeries, stages: number): number {
  return stageRatios(series, stages).reduce((a, b) => a + b, 0);
}

/**
 * The controller step count in closed form, as the Compensation sheet writes it: n for 1:1:1
 * (any n, as sheets saved before the series column), 2n − 1 for 1:2:2, 2^n − 1 for 1:2:4; 0 for
 * n ≤ 0. Equal to controllerSteps for whole n (the tests enumerate it).
 */
export function controllerCount(series: StepSeries, n: number): number {
  if (!(n > 0)) return 0;
  if (series === '1:2:2') return 2 * n - 1;
  if (series === '1:2:4') return 2 ** n - 1;
  return n;
}

/**
 * The stage sizes any series may have, in smallest steps: 1, 2, 4 … up to the largest stage of
 * the longest binary series. Items are counted per stage size (one switching device class, one
 * capacitor make-up each), so a bank has at most this many kinds of stage.
 */
export const STAGE_RATIOS: readonly number[] = Array.from({ length: BINARY_MAX_STAGES }, (_, i) => 2 ** i);

/** How many of the `stages` physical stages of a series are `ratio` smallest steps large. */
export function stagesOfRatio(series: StepSeries, stages: number, ratio: number): number {
  return stageRatios(series, stages).filter((r) => r === ratio).length;
}

/** The largest stage, in smallest steps (0 without stages): what one switching operation adds at most. */
export function largestRatio(series: StepSeries, stages: number): number {
  return stageRatios(series, stages).reduce((m, r) => Math.max(m, r), 0);
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
