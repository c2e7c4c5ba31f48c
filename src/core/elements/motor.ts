// Induction motors: input power and reactive power against load. Operation order mirrors the
// plain-formula expansions of KW.MOTOR and KVAR.MOTOR so both agree to rounding.
import { tanFromCos } from './powerTriangle.ts';

/** Share of full-load magnetising demand a motor keeps at no load when i0 is unknown (common practice). */
export const NO_LOAD_SHARE_DEFAULT = 0.7;

/** Electrical input power, kW: shaft output × load / efficiency. */
export function motorInputPower(pOutKw: number, eff: number, load = 1): number {
  return (pOutKw * load) / eff;
}

/** Reactive power at full load, kvar: Qr = P_out/η · tan φ. */
export function motorRatedReactivePower(pOutKw: number, eff: number, cosPhi: number): number {
  return (pOutKw / eff) * tanFromCos(cosPhi);
}

/** Reactive power at no load, kvar: i0/100 · Sr with Sr = P_out/(η·cos φ); 0.7·Qr when i0 is not known. */
export function motorNoLoadReactivePower(
  pOutKw: number,
  eff: number,
  cosPhi: number,
  i0Pct?: number,
): number {
  if (i0Pct === undefined) return NO_LOAD_SHARE_DEFAULT * motorRatedReactivePower(pOutKw, eff, cosPhi);
  return (i0Pct / 100) * (pOutKw / (eff * cosPhi));
}

/** True when the stated no-load current implies more kvar than at full load: i0/100 > sin φ. */
export function motorNoLoadTooHigh(cosPhi: number, i0Pct: number): boolean {
  return i0Pct / 100 > Math.sqrt(1 - cosPhi * cosPhi);
}

/**
 * Reactive power at load x (fraction of rated output), kvar: Q0 + (Qr − Q0)·x².
 * The magnetising part Q0 barely changes with load; the leakage part grows with current squared.
 */
export function motorReactivePower(
  pOutKw: number,
  eff: number,
  cosPhi: number,
  load = 1,
  i0Pct?: number,
): number {
  const qr = motorRatedReactivePower(pOutKw, eff, cosPhi);
  const q0 = motorNoLoadReactivePower(pOutKw, eff, cosPhi, i0Pct);
  return q0 + (qr - q0) * (load * load);
}

/** Largest capacitor switched with a motor without self-excitation risk, kvar: 0.9·√3·U·I0. */
export function motorCapacitorMax(uKv: number, i0A: number): number {
  return 0.9 * Math.sqrt(3) * uKv * i0A;
}
