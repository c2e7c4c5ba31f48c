// Typical transformer data for a tender-stage list that gives only the rating: the losses the
// EU ecodesign rules allow at most (a new transformer bought in the EU meets them, so they are
// a fair upper estimate), the short-circuit impedance IEC 60076-5 recognises as a minimum, and
// a typical no-load current.
import { band, lookup, type RatingTable } from './interpolate.ts';
import { SOURCES, type TypicalSource } from './sources.ts';

export type Cooling = 'liquid' | 'dry';

/**
 * EU 548/2014 Annex I Table I.1 (liquid-immersed), Tier 2: rating kVA → [Pk max W, P0 max W].
 * Tier 2 is load losses class Ak and no-load losses Ao − 10 % (of EN 50464-1). From memory.
 */
export const ECODESIGN_LIQUID_TIER2: ReadonlyArray<readonly [number, number, number]> = [
  [25, 600, 63],
  [50, 750, 81],
  [100, 1250, 130],
  [160, 1750, 189],
  [250, 2350, 270],
  [315, 2800, 324],
  [400, 3250, 387],
  [500, 3900, 459],
  [630, 4600, 540],
  [800, 6000, 585],
  [1000, 7600, 693],
  [1250, 9500, 855],
  [1600, 12000, 1080],
  [2000, 15000, 1305],
  [2500, 18500, 1575],
  [3150, 23000, 1980],
];

/** EU 548/2014 Annex I Table I.2 (dry-type), Tier 2: rating kVA → [Pk max W, P0 max W]. From memory. */
export const ECODESIGN_DRY_TIER2: ReadonlyArray<readonly [number, number, number]> = [
  [50, 1500, 180],
  [100, 1800, 252],
  [160, 2600, 360],
  [250, 3400, 468],
  [400, 4500, 675],
  [630, 7100, 990],
  [800, 8000, 1170],
  [1000, 9000, 1395],
  [1250, 11000, 1620],
  [1600, 13000, 1980],
  [2000, 16000, 2340],
  [2500, 19000, 2790],
  [3150, 22000, 3420],
];

/** IEC 60076-5 Table 1: upper limit of the rating band, kVA → minimum uk %. From memory. */
export const UK_MIN_IEC_60076_5: RatingTable = [
  [630, 4.0],
  [1250, 5.0],
  [2500, 6.0],
  [6300, 7.0],
  [25000, 8.0],
  [40000, 10.0],
  [63000, 11.0],
  [100000, 12.5],
];

/** Typical no-load current by rating, % of rated current (common practice, from memory). */
export const TRANSFORMER_I0_TYPICAL: RatingTable = [
  [25, 2.5],
  [100, 2.0],
  [250, 1.6],
  [400, 1.4],
  [630, 1.2],
  [1000, 1.0],
  [1600, 0.9],
  [2500, 0.8],
  [4000, 0.7],
  [10000, 0.5],
  [40000, 0.3],
  [100000, 0.25],
];

export interface TypicalNumber {
  readonly value: number;
  readonly source: TypicalSource;
}

/**
 * Maximum losses under EU 548/2014 Tier 2, kW. Ratings between the table's rows are read by
 * linear interpolation (as the Regulation's note on intermediate ratings asks; from memory);
 * the smallest row covers every smaller rating ("≤ 25 kVA", "≤ 50 kVA"). Undefined above
 * 3 150 kVA, where the Regulation uses a different measure (peak efficiency index).
 */
export function ecodesignLosses(
  sKva: number,
  cooling: Cooling = 'liquid',
): { pk: TypicalNumber; p0: TypicalNumber } | undefined {
  const rows = cooling === 'dry' ? ECODESIGN_DRY_TIER2 : ECODESIGN_LIQUID_TIER2;
  const source = cooling === 'dry' ? SOURCES.ecoDesignDry : SOURCES.ecoDesignLiquid;
  const first = rows[0] as readonly [number, number, number];
  if (!(sKva > 0)) return undefined;
  const at = Math.max(sKva, first[0]);
  const pk = lookup(
    rows.map(([s, w]) => [s, w] as const),
    at,
    'linear',
  );
  const p0 = lookup(
    rows.map(([s, , w]) => [s, w] as const),
    at,
    'linear',
  );
  if (pk === undefined || p0 === undefined) return undefined;
  return { pk: { value: pk / 1000, source }, p0: { value: p0 / 1000, source } };
}

/** Minimum short-circuit impedance recognised by IEC 60076-5 for a two-winding transformer, %. */
export function ukMinimum(sKva: number): TypicalNumber | undefined {
  const v = band(UK_MIN_IEC_60076_5, sKva);
  return v === undefined ? undefined : { value: v, source: SOURCES.shortCircuitImpedance };
}

/** Typical no-load current, % of rated current; the smallest row covers smaller ratings. */
export function transformerNoLoadCurrent(sKva: number): TypicalNumber | undefined {
  const first = TRANSFORMER_I0_TYPICAL[0] as readonly [number, number];
  const v = sKva > 0 ? lookup(TRANSFORMER_I0_TYPICAL, Math.max(sKva, first[0])) : undefined;
  return v === undefined ? undefined : { value: v, source: SOURCES.transformerNoLoadCurrent };
}
