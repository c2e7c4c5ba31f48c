// The rules of thumb and series a bank design is chosen from. Every threshold is a named
// constant with where it comes from: "published" (a standard says so) or "common practice"
// (the trade's habit, no single source). Change them here, nowhere else.
import { runCall } from './calls.ts';

import { CHARACTERISTIC_HARMONICS, RESONANCE_MARGIN } from './harmonics.ts';

export { CHARACTERISTIC_HARMONICS, RESONANCE_MARGIN } from './harmonics.ts';
import { LV_MAX_KV } from './capacitorRatings.ts';
export {
  LV_MAX_SECTIONS,
  LV_STEP_MAX_KVAR_AT_400V,
  MAX_STEPS,
  PREFERRED_STEPS_LV,
  PREFERRED_STEPS_MV,
  STEP_SERIES_KVAR,
  chooseStep,
  maxStepsAt,
  type StepPlan,
} from './stepRules.ts';
export {
  CAP_VOLTAGE_MARGIN,
  LV_MAX_KV,
  capacitorRatedVoltage,
  chooseCapacitorRating,
  ratedBelowMargin,
} from './capacitorRatings.ts';

/** Detuning factors offered (common practice; tuning orders 4.20, 3.78, 2.67). */
export const DETUNING_CHOICES: readonly number[] = [5.67, 7, 14];
/** Used when resonance forces detuning (common practice: 7 % for networks where the 5th dominates). */
export const DEFAULT_DETUNING_PCT = 7;
/** Used instead when the option says the 3rd harmonic is significant (common practice: 14 %). */
export const THIRD_HARMONIC_DETUNING_PCT = 14;

/** Fixed capacitor outputs, kvar (common practice; small units for transformer no-load compensation). */
export const FIXED_SERIES_KVAR: readonly number[] = [
  2.5, 5, 7.5, 10, 12.5, 15, 20, 25, 30, 40, 50, 60, 75, 100, 150, 200,
];
/** Shunt reactor ratings, kvar (common practice). */
export const REACTOR_SERIES_KVAR: readonly number[] = [
  50, 100, 150, 200, 250, 300, 400, 500, 600, 750, 1000, 1250, 1500, 2000, 2500, 3000, 4000, 5000, 6000, 8000,
  10000, 12500, 15000, 20000,
];

/** Made-to-order reactor ratings are rounded up to this, kvar (common practice). */
export const REACTOR_ROUNDING_KVAR = 50;

/** A bus whose share of the need stays below this is not given a bank of its own (common practice). */
export const MIN_BANK_KVAR_LV = 25;
export const MIN_BANK_KVAR_MV = 300;

/** Capacitors stand 1.10 Un for 8 h in 24 h only (published: IEC 60831-1 and IEC 60871-1). */
export const CAP_OVERVOLTAGE_LIMIT = 1.1;
/** Below this share of the rating a capacitor gives much less than its nameplate (it scales with U²; common practice). */
export const CAP_UNDERUSE = 0.9;

/** Steady-state voltage step on switching one step, %: above this, warn (common practice: ~3 %, cf. rapid voltage change limits). */
export const STEP_VRISE_LIMIT_PCT = 3;

export function isLowVoltage(uKv: number): boolean {
  return uKv <= LV_MAX_KV;
}

/** Smallest value of the series at or above q; the largest when q exceeds them all. */
export function roundUpToSeries(q: number, series: readonly number[]): number {
  return series.find((s) => s >= q - 1e-9) ?? (series[series.length - 1] as number);
}

/** Largest value of the series at or below q; 0 when q is below them all. */
export function roundDownToSeries(q: number, series: readonly number[]): number {
  let out = 0;
  for (const s of series) if (s <= q + 1e-9) out = s;
  return out;
}

/** The harmonic within RESONANCE_MARGIN of order h, if any. */
export function nearHarmonic(h: number): number | undefined {
  return CHARACTERISTIC_HARMONICS.find((n) => Math.abs(h - n) <= RESONANCE_MARGIN * n);
}

/** |KVAR.CAPBANK(1, ...)| as a call result: arguments the catalogue refuses give its message. */
function capbankPerNameplate(uRatedKv: number, uKv: number, pPct: number, hz: number) {
  return runCall({ fn: 'KVAR.CAPBANK', args: [1, uRatedKv, uKv, pPct, hz, hz], columns: [] });
}

/** Output magnitude per 1 kvar of nameplate at uRated, run at u with p % detuning: |KVAR.CAPBANK(1, ...)|. */
export function outputPerNameplateKvar(uRatedKv: number, uKv: number, pPct: number, hz: number): number {
  const r = capbankPerNameplate(uRatedKv, uKv, pPct, hz);
  if (!r.ok) throw new Error(r.message);
  return -r.value;
}

/** The same, or undefined for arguments the catalogue refuses (validation reports those rows). */
export function outputPerNameplateKvarIfValid(
  uRatedKv: number,
  uKv: number,
  pPct: number,
  hz: number,
): number | undefined {
  const r = capbankPerNameplate(uRatedKv, uKv, pPct, hz);
  return r.ok ? -r.value : undefined;
}

/** CAPBANK.UCAP through the catalogue. */
export function capacitorVoltage(uKv: number, pPct: number): number {
  const r = runCall({ fn: 'CAPBANK.UCAP', args: [uKv, pPct], columns: [] });
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

/** RESONANCE.ORDER through the catalogue; undefined when there is no capacitor. */
export function resonanceOrderOf(sscMva: number, qKvar: number, pPct: number): number | undefined {
  if (!(qKvar > 0)) return undefined;
  const r = runCall({ fn: 'RESONANCE.ORDER', args: [sscMva, qKvar, pPct], columns: [] });
  return r.ok ? r.value : undefined;
}

/** VRISE.PCT through the catalogue. */
export function voltageRise(qKvar: number, sscMva: number): number {
  const r = runCall({ fn: 'VRISE.PCT', args: [Math.max(qKvar, 0), sscMva], columns: [] });
  if (!r.ok) throw new Error(r.message);
  return r.value;
}
