// Two-winding transformers: magnetising and leakage reactive power, losses, minimum impedance.
// Operation order mirrors the plain-formula expansions so both agree to rounding.

/** No-load apparent power, kVA: i0/100 · S. */
export function transformerNoLoadApparent(sKva: number, i0Pct: number): number {
  return (i0Pct / 100) * sKva;
}

/** Magnetising reactive power, kvar: √((i0/100·S)² − P0²)·u². Caller checks P0 ≤ i0/100·S. */
export function transformerMagnetisingKvar(sKva: number, i0Pct: number, p0Kw = 0, uPu = 1): number {
  const s0 = transformerNoLoadApparent(sKva, i0Pct);
  return Math.sqrt((s0 - p0Kw) * (s0 + p0Kw)) * (uPu * uPu);
}

/** Resistive part of the short-circuit impedance, %: ur = 100·Pk/S. */
export function transformerResistancePct(sKva: number, pkKw: number): number {
  return (100 * pkKw) / sKva;
}

/** Leakage reactive power at a load, kvar: ux/100 · S · (S_load/S)², ux = √(uk² − ur²). Caller checks ur < uk. */
export function transformerLeakageKvar(sKva: number, ukPct: number, sLoadKva: number, pkKw = 0): number {
  const ur = transformerResistancePct(sKva, pkKw);
  const ratio = sLoadKva / sKva;
  return (Math.sqrt(ukPct * ukPct - ur * ur) / 100) * sKva * (ratio * ratio);
}

/** Losses at a load, kW: P0 + Pk·(S_load/S)². */
export function transformerLossKw(sKva: number, p0Kw: number, pkKw: number, sLoadKva: number): number {
  const ratio = sLoadKva / sKva;
  return p0Kw + pkKw * (ratio * ratio);
}

/**
 * IEC 60076-5 Table 1: minimum short-circuit impedance of two-winding transformers by rated
 * power. Rows: upper bound of the rating in kVA (inclusive) and the impedance in %. Above the
 * last row the standard leaves the value to agreement; the last row's value is returned.
 */
export const MIN_IMPEDANCE_TABLE: ReadonlyArray<readonly [maxKva: number, ukPct: number]> = [
  [630, 4.0],
  [1250, 5.0],
  [2500, 6.0],
  [6300, 7.0],
  [25000, 8.0],
  [40000, 10.0],
  [63000, 11.0],
];
export const MIN_IMPEDANCE_ABOVE_TABLE = 12.5;

export function transformerMinImpedancePct(sKva: number): number {
  for (const [maxKva, uk] of MIN_IMPEDANCE_TABLE) if (sKva <= maxKva) return uk;
  return MIN_IMPEDANCE_ABOVE_TABLE;
}
