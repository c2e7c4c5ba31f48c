// Typical inductance and capacitance of an overhead line by voltage level, for a blank L or C
// at tender stage. Both follow from the line's geometry: per phase L = 0.2·ln(D/r′) mH/km and
// C = 55.6/ln(D/r) nF/km (D the mean phase spacing, r the conductor radius, r′ ≈ 0.78·r), so
// they vary only with the logarithm of the spacing and change little within a voltage level.
// Single-circuit lines, one conductor per phase (common practice, values from memory):
// - up to 36 kV: spacing about 1.2 m, 50–150 mm² conductors (r ≈ 6 mm): 1.1 mH/km
//   (0.35 Ω/km at 50 Hz) and 10.5 nF/km;
// - up to 145 kV (66–132 kV): spacing about 4.5 m, 240 mm² class conductors (r ≈ 10.5 mm):
//   1.25 mH/km (0.39 Ω/km at 50 Hz) and 9.2 nF/km.
// None at or below 1 kV, where open-wire lines (about 0.3 Ω/km) and aerial bundled cables
// (about 0.1 Ω/km) differ threefold, nor above 145 kV, where bundled conductors and double
// circuits decide: take the maker's or the utility's data.
import type { TypicalNumber } from './transformers.ts';
import { SOURCES } from './sources.ts';

/** Lowest voltage, kV, with a typical value: at or below it a line may be open-wire or bundled. */
export const LINE_TYPICAL_ABOVE_KV = 1;

/** Highest voltage, kV, of each band, with its typical inductance (mH/km) and capacitance (nF/km). */
export const LINE_BANDS = [
  { upToKv: 36, lMhKm: 1.1, cNfKm: 10.5 },
  { upToKv: 145, lMhKm: 1.25, cNfKm: 9.2 },
] as const;

function band(uKv: number) {
  if (!(uKv > LINE_TYPICAL_ABOVE_KV)) return undefined;
  return LINE_BANDS.find((b) => uKv <= b.upToKv);
}

/** Typical inductance per phase of an overhead line at `uKv`, mH/km, or undefined outside the bands. */
export function lineInductance(uKv: number): TypicalNumber | undefined {
  const b = band(uKv);
  return b && { value: b.lMhKm, source: SOURCES.lineGeometry };
}

/** Typical capacitance per phase of an overhead line at `uKv`, nF/km, or undefined outside the bands. */
export function lineCapacitance(uKv: number): TypicalNumber | undefined {
  const b = band(uKv);
  return b && { value: b.cNfKm, source: SOURCES.lineGeometry };
}
