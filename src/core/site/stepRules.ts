// Steps a panel builder would build: how large one switched step may be, how many steps one
// controller drives, how a large need is spread over sections (panels, each with its own
// controller), and what switches the steps. Every threshold is a named constant with its kind.
import { LV_MAX_KV } from './capacitorRatings.ts';
import { STEP_SERIES, controllerSteps, largestRatio, maxStagesOf, type StepSeries } from './stepSeries.ts';

/** Step outputs offered at the operating voltage, kvar (common practice: makers' usual step sizes). */
export const STEP_SERIES_KVAR: readonly number[] = [
  5, 10, 12.5, 15, 20, 25, 30, 40, 50, 60, 75, 100, 125, 150, 200, 250, 300, 400, 500, 600, 750, 1000, 1250,
  1500, 2000, 2500, 3000, 4000, 5000,
];

/**
 * Largest contactor-switched LV step, kvar at 400 V (common practice, from memory: capacitor-duty
 * contactors are offered up to about 50–60 kvar at 400 V, ~72 A; larger steps take contactors
 * in parallel, which panel builders avoid). It scales with the voltage as the same current:
 * 60 kvar at 480 V, 86 kvar at 690 V.
 */
export const LV_STEP_MAX_KVAR_AT_400V = 50;
/** Steps aimed for: LV controllers commonly have 6 or 12 outputs, MV banks 1–4 stages (common practice). */
export const PREFERRED_STEPS_LV = 6;
export const PREFERRED_STEPS_MV = 3;
/** Outputs of one power-factor controller: the steps of one section (common practice: 6 or 12). */
export const MAX_STEPS = 12;
/** Sections (panels with a controller each) one proposed LV bank may have (common practice for one bus bar). */
export const LV_MAX_SECTIONS = 4;
/** Vacuum contactors switch MV steps up to this voltage, kV; above it circuit breakers (common practice: 7.2 and 12 kV contactors). */
export const MV_CONTACTOR_MAX_KV = 12;

/**
 * A series other than equal stages is taken only when it carries at most this many smallest
 * steps more than equal stages would (common practice: a panel builder saves stages and
 * contactors, not by adding capacitors; 1:2:2 adds at most one, binary may add many).
 */
export const SERIES_MAX_EXTRA_STEPS = 1;

export type SwitchingDevice = 'capacitor-duty contactor' | 'vacuum contactor' | 'circuit breaker';

export interface StepPlan {
  /** The smallest stage, kvar: the resolution the controller reaches. */
  readonly step: number;
  /** Physical stages, each with its switching device and controller output. */
  readonly steps: number;
  readonly series: StepSeries;
  /** Positions the controller switches, in smallest steps (stepSeries.ts controllerSteps). */
  readonly controller_steps: number;
  /** Stages of each section, in order (one section when one controller is enough). */
  readonly sections: readonly number[];
  readonly switching: SwitchingDevice;
  /** true when the need exceeds the largest bank proposed: it covers less than asked. */
  readonly capped: boolean;
}

const EPS = 1e-9;

/** Largest step at this voltage, kvar: the LV contactor limit, none at MV. */
export function maxStepKvar(uKv: number): number {
  return uKv <= LV_MAX_KV ? (LV_STEP_MAX_KVAR_AT_400V * uKv) / 0.4 : Infinity;
}

/** Most steps one bank may have at this voltage: one controller at MV, LV_MAX_SECTIONS of them at LV. */
export function maxStepsAt(uKv: number): number {
  return uKv <= LV_MAX_KV ? MAX_STEPS * LV_MAX_SECTIONS : MAX_STEPS;
}

export function switchingDevice(uKv: number): SwitchingDevice {
  if (uKv <= LV_MAX_KV) return 'capacitor-duty contactor';
  return uKv <= MV_CONTACTOR_MAX_KV ? 'vacuum contactor' : 'circuit breaker';
}

/** n steps over as few sections of at most MAX_STEPS as will hold them, as even as can be. */
export function sectionsOf(n: number): number[] {
  const count = Math.max(1, Math.ceil(n / MAX_STEPS));
  return Array.from({ length: count }, (_, i) => Math.floor(n / count) + (i < n % count ? 1 : 0));
}

/**
 * The series a panel builder would take for `positions` smallest steps of `step` kvar at LV: the one
 * with the fewest physical stages that reaches as many positions (at most SERIES_MAX_EXTRA_STEPS
 * more), no stage above the largest step the voltage allows and a binary series no longer than
 * BINARY_MAX_STAGES (stepSeries.ts); equal stages when nothing saves a stage (ties go to the simpler series).
 */
export function chooseSeries(
  step: number,
  positions: number,
  uKv: number,
): { series: StepSeries; stages: number } {
  let best: { series: StepSeries; stages: number } = { series: '1:1:1', stages: positions };
  // MV stages are few and each already large: doubling one doubles the voltage step of switching
  // it (common practice: MV banks are built of equal stages or a fixed part).
  if (uKv > LV_MAX_KV) return best;
  for (const series of STEP_SERIES) {
    let stages = 1;
    while (controllerSteps(series, stages) < positions) stages++;
    const fits =
      stages <= maxStagesOf(series) &&
      controllerSteps(series, stages) <= positions + SERIES_MAX_EXTRA_STEPS &&
      step * largestRatio(series, stages) <= maxStepKvar(uKv) + EPS;
    if (fits && stages < best.stages) best = { series, stages };
  }
  return best;
}

/**
 * The smallest standard step, no larger than the voltage allows, that covers q in at most the
 * preferred number of steps (the largest allowed when none does); as many steps as that takes,
 * never more than maxStepsAt (`capped` says the bank covers less than q); then the series that
 * reaches those steps with the fewest stages (chooseSeries).
 */
export function chooseStep(qKvar: number, uKv: number): StepPlan {
  const preferred = uKv <= LV_MAX_KV ? PREFERRED_STEPS_LV : PREFERRED_STEPS_MV;
  const allowed = STEP_SERIES_KVAR.filter((s) => s <= maxStepKvar(uKv) + EPS);
  const sizes = allowed.length > 0 ? allowed : STEP_SERIES_KVAR.slice(0, 1);
  const step =
    sizes.find((s) => Math.ceil(qKvar / s - EPS) <= preferred) ?? (sizes[sizes.length - 1] as number);
  const wanted = Math.max(1, Math.ceil(qKvar / step - EPS));
  const most = maxStepsAt(uKv);
  // NaN or an overflowing need must not become a step count either.
  const capped = !(wanted <= most);
  const positions = capped ? most : wanted;
  // A bank beyond one controller already steps at the largest size allowed: it stays 1:1:1.
  const { series, stages } = chooseSeries(step, positions, uKv);
  return {
    step,
    steps: stages,
    series,
    controller_steps: controllerSteps(series, stages),
    sections: sectionsOf(stages),
    switching: switchingDevice(uKv),
    capped,
  };
}
