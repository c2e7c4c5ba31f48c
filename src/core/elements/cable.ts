// Screened cables: capacitance from the insulation geometry and the charging kvar it delivers.
// Operation order mirrors the plain-formula expansions.

/** Charging reactive power, kvar (load reference, so ≤ 0): −2π·f·C·len·U²/1000 with C in µF/km, U in kV. */
export function cableChargingKvar(uKv: number, cUfKm: number, lenKm: number, fHz = 50): number {
  return (-2 * Math.PI * fHz * cUfKm * lenKm * (uKv * uKv)) / 1000;
}

/** Capacitance per phase of a screened (radial-field) cable, µF/km: ε/(18·ln(Di/dc)) (IEC 60287-1-1). */
export function cableCapacitance(epsR: number, dInsMm: number, dCondMm: number): number {
  return epsR / (18 * Math.log(dInsMm / dCondMm));
}
