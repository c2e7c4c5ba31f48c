// Overhead lines (and long cables) as series inductance and shunt capacitance per km.
// Units: L in mH/km, C in nF/km, U in kV (line-to-line), S in kVA, results in kvar and MW.

/**
 * Net reactive power of a line, kvar (load reference): series absorption 3·I²·X minus the
 * charging ω·C·U², with I = S/(√3·U) and X = ω·L·len. In these units
 * 3·I²·X = ω·len·L·(S/U)²/10⁶ and ω·C·U² = ω·len·C·U²/10⁶, so Q = ω·len·(L·(S/U)² − C·U²)/10⁶:
 * zero at surge impedance loading, negative below it.
 */
export function lineNetKvar(
  uKv: number,
  sLoadKva: number,
  lMhKm: number,
  cNfKm: number,
  lenKm: number,
  fHz = 50,
): number {
  const ratio = sLoadKva / uKv;
  return (2 * Math.PI * fHz * lenKm * (lMhKm * (ratio * ratio) - cNfKm * (uKv * uKv))) / 1000000;
}

/** Surge impedance, Ω: √(L/C) = 1000·√(L_mH/C_nF). */
export function lineSurgeImpedance(lMhKm: number, cNfKm: number): number {
  return 1000 * Math.sqrt(lMhKm / cNfKm);
}

/** Surge impedance loading, MW: U²/Zc. */
export function lineSil(uKv: number, lMhKm: number, cNfKm: number): number {
  return (uKv * uKv) / lineSurgeImpedance(lMhKm, cNfKm);
}

/**
 * Three-phase series (I²R) loss of a line carrying sLoadKva, kW: 3·I²·R·len with
 * I = S/(√3·U). In these units S/U is kVA/kV, so (S/U)²·R·len is in W and /1000 gives kW:
 * P = S²·R·len/(U²·1000).
 */
export function lineSeriesLossKw(uKv: number, sLoadKva: number, rOhmKm: number, lenKm: number): number {
  const ratio = sLoadKva / uKv;
  return (ratio * ratio * rOhmKm * lenKm) / 1000;
}

/**
 * Three-phase series absorption of a line or cable carrying sLoadKva, kvar: 3·I²·X·len with
 * I = S/(√3·U) and X the series reactance per phase in Ω/km; the same units as the loss above.
 */
export function lineSeriesKvar(uKv: number, sLoadKva: number, xOhmKm: number, lenKm: number): number {
  const ratio = sLoadKva / uKv;
  return (ratio * ratio * xOhmKm * lenKm) / 1000;
}
