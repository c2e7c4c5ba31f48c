// Steps a panel builder would build: how large one switched step may be, how many steps one
// controller drives, how a large need is spread over sections (panels, each with its own
// controller), and what switches the steps. Every threshold is a named constant with its kind.
import { LV_MAX_KV } from './capacitorRatings.ts';

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

/** Steps of equal size: the rule after compensation switches equal whole steps (1:1:1…). */
export const STEP_RATIO = '1:1:1';

export type SwitchingDevice = 'capacitor-duty contactor' | 'vacuum contactor' | 'circuit breaker';

export interface StepPlan {
  readonly step: number;
  readonly steps: number;
  /** Steps of each section, in order (one section when one controller is enough). */
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
 * The smallest standard step, no larger than the voltage allows, that covers q in at most the
 * preferred number of steps (the largest allowed when none does); as many steps as that takes,
 * never more than maxStepsAt (`capped` says the bank covers less than q).
 */
export function chooseStep(qKvar: number, uKv: number): StepPlan {
  const preferred = uKv <= LV_MAX_KV ? PREFERRED_STEPS_LV : PREFERRED_STEPS_MV;
  const allowed = STEP_SERIES_KVAR.filter((s) => s <= maxStepKvar(uKv) + EPS);
  const series = allowed.length > 0 ? allowed : STEP_SERIES_KVAR.slice(0, 1);
  const step =
    series.find((s) => Math.ceil(qKvar / s - EPS) <= preferred) ?? (series[series.length - 1] as number);
  const wanted = Math.max(1, Math.ceil(qKvar / step - EPS));
  const most = maxStepsAt(uKv);
  // NaN or an overflowing need must not become a step count either.
  const capped = !(wanted <= most);
  const steps = capped ? most : wanted;
  return { step, steps, sections: sectionsOf(steps), switching: switchingDevice(uKv), capped };
}
