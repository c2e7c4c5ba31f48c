// Rated voltages of capacitor units, and the one rule that picks them:
//   rated voltage ≥ (1 + CAP_VOLTAGE_MARGIN) × the voltage across the capacitors,
// where a detuned step's capacitors see U/(1 − p) (CAPBANK.UCAP). The margin covers the 1.10 Un
// a capacitor stands only 8 h in 24 h (IEC 60831-1 and IEC 60871-1, table of admissible voltage
// levels in service; IEEE 18 allows 110 % of rated voltage continuously) so that harmonics and
// the steady voltage rise of the supply do not use it up. Makers' selection guides for detuned
// banks state the same +10 % (common practice).
//
// Which series: neither IEC 60831-1 (≤ 1 kV) nor IEC 60871-1 (> 1 kV) lists preferred rated
// voltages; the purchaser states one and the maker builds to it (from memory). So at 50 Hz the
// LV units come from the ratings makers list in their IEC ranges (common practice), and MV units
// are made to order at the voltage asked (rounded up to 0.1 kV). At 60 Hz the units come from
// IEEE Std 18-2012, Table 1 "Voltage and power ratings for capacitor units" (from memory): LV
// three-phase units, MV single-phase units connected in star, several in series per phase when
// one is not enough.

/** Low voltage is up to 1 kV AC (published: IEC 60038 / IEC 60050-601). */
export const LV_MAX_KV = 1;

/** Rated voltage at least this share above the voltage across the capacitors (see above). */
export const CAP_VOLTAGE_MARGIN = 0.1;

/** LV rated voltages in makers' IEC 60831-1 ranges, kV (common practice, from memory). */
export const IEC_LV_RATINGS_KV: readonly number[] = [
  0.23, 0.4, 0.415, 0.44, 0.48, 0.525, 0.55, 0.6, 0.69, 0.8, 0.9, 1.0,
];
/** MV units to IEC 60871-1 are built to the voltage asked: the bank's rating is rounded up to this, kV (common practice). */
export const IEC_MV_ROUNDING_KV = 0.1;

/** IEEE 18-2012 Table 1, low-voltage unit ratings, kV (from memory). */
export const IEEE18_LV_RATINGS_KV: readonly number[] = [0.216, 0.24, 0.48, 0.6];
/** IEEE 18-2012 Table 1, single-phase unit ratings above 1 kV, kV (from memory). */
export const IEEE18_MV_UNIT_RATINGS_KV: readonly number[] = [
  2.4, 2.77, 4.16, 4.8, 6.64, 7.2, 7.62, 7.96, 8.32, 9.54, 9.96, 11.4, 12.47, 13.28, 13.8, 14.4, 15.125,
  19.92, 20.8, 21.6, 22.8, 23.8, 24.94,
];
/** Most units in series per phase a proposed MV bank uses (common practice for distribution-class banks). */
export const MAX_UNITS_IN_SERIES = 4;

export type UnitArrangement = 'three-phase units' | 'single-phase units in star';

/** The capacitor rating a bank is built from: what a schedule of equipment needs. */
export interface CapacitorRating {
  /** The bank's rated voltage, line to line, kV (the Compensation sheet's "Capacitor rated voltage"). */
  readonly bank_rated_kv: number;
  /** Rated voltage on one unit's nameplate, kV. */
  readonly unit_rated_kv: number;
  readonly units_in_series: number;
  readonly arrangement: UnitArrangement;
  /** Which series the rating came from, as a reader would cite it. */
  readonly series: string;
}

const EPS = 1e-9;
const SQRT3 = Math.sqrt(3);

const threePhase = (u: number, series: string): CapacitorRating => ({
  bank_rated_kv: u,
  unit_rated_kv: u,
  units_in_series: 1,
  arrangement: 'three-phase units',
  series,
});

/** Smallest star bank of IEEE 18 single-phase units (1 to MAX_UNITS_IN_SERIES in series) at or above wanted. */
function ieeeStar(wantedKv: number): CapacitorRating | undefined {
  let best: CapacitorRating | undefined;
  for (let n = 1; n <= MAX_UNITS_IN_SERIES; n++) {
    const unit = IEEE18_MV_UNIT_RATINGS_KV.find((u) => SQRT3 * n * u >= wantedKv - EPS);
    if (unit === undefined) continue;
    const bank = SQRT3 * n * unit;
    if (best === undefined || bank < best.bank_rated_kv - EPS)
      best = {
        bank_rated_kv: bank,
        unit_rated_kv: unit,
        units_in_series: n,
        arrangement: 'single-phase units in star',
        series: 'IEEE 18 Table 1 (from memory)',
      };
  }
  return best;
}

function madeToOrder(wantedKv: number): CapacitorRating {
  const bank = Math.ceil(wantedKv / IEC_MV_ROUNDING_KV - EPS) * IEC_MV_ROUNDING_KV;
  const rounded = Math.round(bank * 1000) / 1000;
  return {
    bank_rated_kv: rounded,
    unit_rated_kv: Math.round((rounded / SQRT3) * 1000) / 1000,
    units_in_series: 1,
    arrangement: 'single-phase units in star',
    series: `made to order (IEC 60871-1), rounded up to ${IEC_MV_ROUNDING_KV} kV`,
  };
}

/** The rating for capacitors that see uCapKv at the site frequency, by the rule and series above. */
export function chooseCapacitorRating(uCapKv: number, hz: number): CapacitorRating {
  const wanted = uCapKv * (1 + CAP_VOLTAGE_MARGIN);
  const fits = (u: number) => u >= wanted - EPS;
  if (hz === 60) {
    const lv = IEEE18_LV_RATINGS_KV.find(fits);
    if (lv !== undefined) return threePhase(lv, 'IEEE 18 Table 1 (from memory)');
  }
  if (wanted <= LV_MAX_KV + EPS) {
    const lv = IEC_LV_RATINGS_KV.find(fits);
    if (lv !== undefined) return threePhase(lv, "makers' IEC 60831-1 ranges (common practice)");
  }
  if (hz === 60) {
    const star = ieeeStar(wanted);
    if (star !== undefined) return star;
  }
  return madeToOrder(wanted);
}

/** The bank's rated voltage (line to line) chosen for capacitors that see uCapKv. */
export function capacitorRatedVoltage(uCapKv: number, hz = 50): number {
  return chooseCapacitorRating(uCapKv, hz).bank_rated_kv;
}

/** True when capacitors rated uRatedKv are rated below the rule for the voltage uCapKv across them. */
export function ratedBelowMargin(uCapKv: number, uRatedKv: number): boolean {
  return uRatedKv < uCapKv * (1 + CAP_VOLTAGE_MARGIN) * (1 - EPS);
}

/**
 * Every bank voltage a star of 1 to MAX_UNITS_IN_SERIES IEEE 18 units in series can have,
 * ascending, each with the fewest units in series that reach it (values within 1e-9 kV are one).
 * The smallest of them at or above a wanted voltage is the best star ieeeStar finds.
 */
export const IEEE_STAR_BANKS: ReadonlyArray<{ readonly kv: number; readonly n: number }> = (() => {
  const all = Array.from({ length: MAX_UNITS_IN_SERIES }, (_, i) =>
    IEEE18_MV_UNIT_RATINGS_KV.map((u) => ({ kv: SQRT3 * (i + 1) * u, n: i + 1 })),
  )
    .flat()
    .sort((a, b) => a.kv - b.kv || a.n - b.n);
  const out: { kv: number; n: number }[] = [];
  for (const b of all) {
    const last = out[out.length - 1];
    if (last !== undefined && b.kv <= last.kv + EPS) {
      if (b.n < last.n) out[out.length - 1] = b;
    } else out.push(b);
  }
  return out;
})();

/**
 * Units in series per phase for a bank rated uRatedKv: at 60 Hz above LV, the fewest of a star of
 * IEEE 18 units that make that rating; otherwise 1 (LV three-phase units, MV units made to it).
 * For the design's own rating this is the count chooseCapacitorRating picks.
 */
export function unitsInSeriesFor(uRatedKv: number, hz: number): number {
  if (hz !== 60 || !(uRatedKv > LV_MAX_KV + EPS)) return 1;
  return IEEE_STAR_BANKS.find((b) => Math.abs(uRatedKv - b.kv) <= EPS)?.n ?? 1;
}
