// The rules of thumb and series a bank design is chosen from. Every threshold is a named
// constant with where it comes from: "published" (a standard says so) or "common practice"
// (the trade's habit, no single source). Change them here, nowhere else.
import { runCall } from './calls.ts';

import { CHARACTERISTIC_HARMONICS, RESONANCE_MARGIN } from './harmonics.ts';

export { CHARACTERISTIC_HARMONICS, RESONANCE_MARGIN } from './harmonics.ts';
import { LV_MAX_KV } from './capacitorRatings.ts';
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

/** Step outputs offered at the operating voltage, kvar (common practice: makers' usual step sizes). */
export const STEP_SERIES_KVAR: readonly number[] = [
  5, 10, 12.5, 15, 20, 25, 30, 40, 50, 60, 75, 100, 125, 150, 200, 250, 300, 400, 500, 600, 750, 1000, 1250,
  1500, 2000, 2500, 3000, 4000, 5000,
];
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

/** Steps aimed for: LV controllers commonly have 6 or 12 outputs, MV banks 1–4 stages (common practice). */
export const PREFERRED_STEPS_LV = 6;
export const PREFERRED_STEPS_MV = 3;
/**
 * Most steps one proposed bank may have (common practice: automatic controllers offer up to 12
 * outputs). A need beyond MAX_STEPS of the largest step is not sized further: the bank is capped
 * and the design says why, instead of proposing thousands of steps.
 */
export const MAX_STEPS = 12;
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

/** The largest bank chooseStep proposes, kvar: MAX_STEPS of the largest step. */
export const MAX_BANK_KVAR = MAX_STEPS * (STEP_SERIES_KVAR[STEP_SERIES_KVAR.length - 1] as number);

/**
 * Smallest standard step that covers q in at most the preferred number of steps for the voltage;
 * never more than MAX_STEPS steps (`capped` says the bank covers less than q).
 */
export function chooseStep(qKvar: number, uKv: number): { step: number; steps: number; capped: boolean } {
  const preferred = isLowVoltage(uKv) ? PREFERRED_STEPS_LV : PREFERRED_STEPS_MV;
  const step =
    STEP_SERIES_KVAR.find((s) => Math.ceil(qKvar / s - 1e-9) <= preferred) ??
    (STEP_SERIES_KVAR[STEP_SERIES_KVAR.length - 1] as number);
  const wanted = Math.max(1, Math.ceil(qKvar / step - 1e-9));
  // NaN or an overflowing need must not become a step count either.
  if (!(wanted <= MAX_STEPS)) return { step, steps: MAX_STEPS, capped: true };
  return { step, steps: wanted, capped: false };
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
