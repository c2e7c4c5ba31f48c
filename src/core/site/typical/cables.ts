// Typical series reactance of a feeder cable by voltage level, for a blank X at tender stage.
// Cable reactance depends mostly on the conductors' spacing, so it varies little with size:
// LV multicore cables about 0.08 Ω/km, MV single-core XLPE cables laid in trefoil about
// 0.11 Ω/km (common practice, values from memory). Above 36 kV the laying decides too much for
// one figure: no typical value, take the maker's data.
import type { TypicalNumber } from './transformers.ts';
import { SOURCES } from './sources.ts';

/** Highest voltage, kV, of each band, and its typical reactance, Ω/km. */
export const CABLE_X_BANDS = [
  { upToKv: 1, xOhmKm: 0.08 },
  { upToKv: 36, xOhmKm: 0.11 },
] as const;

/** Typical reactance of a cable at `uKv`, or undefined above the bands (or for no voltage). */
export function cableReactance(uKv: number): TypicalNumber | undefined {
  if (!(uKv > 0)) return undefined;
  const band = CABLE_X_BANDS.find((b) => uKv <= b.upToKv);
  return band && { value: band.xOhmKm, source: SOURCES.cableReactance };
}
