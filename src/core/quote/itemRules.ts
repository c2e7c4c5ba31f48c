// The rules that turn a bank into countable items: unit sizes, current classes of switching
// devices, how many steps a section or a controller holds. Each is a named constant with where it
// comes from: "published" (a standard says so) or "common practice" (the trade's habit, from
// memory, no single source). Estimates only: the maker's offer decides the real make-up.
import { MAX_STEPS, MV_CONTACTOR_MAX_KV } from '../site/stepRules.ts';

/**
 * Preferred current ratings, A: the R10 series of IEC 60059 ("IEC standard current ratings",
 * published), from 16 A to 4000 A. Switching devices are named by the class they fall in.
 */
export const CURRENT_CLASSES_A: readonly number[] = [
  16, 20, 25, 31.5, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000,
  2500, 3150, 4000,
];

/**
 * Switching devices and fuses of a capacitor circuit carry at least 1.43 × its rated current:
 * 1.3 × for harmonics and overvoltage (published: IEC 60831-1 and IEC 60871-1 allow 1.3 In
 * continuously) times 1.1 for the capacitance tolerance (common practice: IEC 61921 states the
 * product 1.43 for LV banks).
 */
export const CAPACITOR_CURRENT_FACTOR = 1.43;
/** A shunt reactor draws its rated current: no margin beyond the class rounding (common practice). */
export const REACTOR_CURRENT_FACTOR = 1;

/** Largest LV three-phase capacitor unit, nameplate kvar (common practice: makers' ranges end near 50). */
export const MAX_UNIT_KVAR_LV = 50;
/** Largest MV single-phase capacitor unit, nameplate kvar (common practice: 500–600 kvar units are usual). */
export const MAX_UNIT_KVAR_MV = 500;
/** MV banks are built of single-phase units, a multiple of three per stage (common practice). */
export const MV_UNITS_MULTIPLE = 3;

/** kvar per LV cubicle section (common practice: detuned steps take more room than plain ones). */
export const SECTION_KVAR_LV_PLAIN = 400;
export const SECTION_KVAR_LV_DETUNED = 250;

/**
 * Outputs of the usual step controllers (common practice: 6 and 12 output models); the larger is
 * the design's steps per section (stepRules.ts), so the schedule has a controller per section.
 */
export const CONTROLLER_OUTPUTS: readonly number[] = [6, MAX_STEPS];

/** Largest LV fuse-switch taken as the bank's incomer; above it a circuit breaker (common practice). */
export const MAX_LV_FUSE_SWITCH_A = 630;
/** MV vacuum contactors switch steps up to this current and voltage (common practice: 400 A, 12 kV). */
export const MAX_MV_CONTACTOR_A = 400;
export const MAX_MV_CONTACTOR_KV = MV_CONTACTOR_MAX_KV; // the design's own limit (stepRules.ts)
/** MV circuit breakers start at this rating (common practice: 630 A is the smallest usual frame). */
export const MIN_MV_BREAKER_A = 630;
/** MV contactor ratings offered (common practice). */
export const MV_CONTACTOR_CLASSES_A: readonly number[] = [200, 400];

/**
 * Fast-discharge devices per switched MV step: two discharge voltage transformers across the
 * phases (common practice where a step recloses sooner than the 10 min its internal resistors
 * need to bring it to 75 V; published: IEC 60871-1 sets the 75 V in 10 min).
 */
export const MV_DISCHARGE_DEVICES_PER_STEP = 2;

/** The class a current falls in: the smallest rating of the list at or above it; null above them all. */
export function currentClass(amps: number, classes: readonly number[] = CURRENT_CLASSES_A): number | null {
  if (!(amps >= 0)) return null;
  return classes.find((c) => c >= amps - 1e-9) ?? null;
}

/** Line current of a three-phase circuit, A: I = Q / (√3 · U) with Q in kvar and U in kV. */
export function lineCurrentA(kvar: number, uKv: number): number {
  return kvar / (Math.sqrt(3) * uKv);
}
