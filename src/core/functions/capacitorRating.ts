// The rated voltage a bank's capacitors are bought at: the one rule of capacitorRatings.ts
// (rated ≥ 1.1 × the voltage across the capacitors, from the series of the site's frequency),
// as a catalogue function so the Quantities and cost sheet and other spreadsheet programs pick
// the rating the design picks. The expansion is written from the same named constants.
import { defineFunction } from '../registry/spec.ts';
import {
  CAP_VOLTAGE_MARGIN,
  IEC_LV_RATINGS_KV,
  IEC_MV_ROUNDING_KV,
  IEEE18_LV_RATINGS_KV,
  IEEE18_MV_UNIT_RATINGS_KV,
  LV_MAX_KV,
  MAX_UNITS_IN_SERIES,
  capacitorRatedVoltage,
} from '../site/capacitorRatings.ts';

const FAMILY = 'Compensation equipment';
const num = (x: number | boolean | undefined): number => x as number;

/** The rule's slack at the boundaries of a series (capacitorRatings.ts compares v ≥ wanted − 1e-9). */
const EPS = 1e-9;

/**
 * The first value of the ascending list at or above `wanted`, else `otherwise`: written as
 * wanted ≤ v + 1e-9 with v + 1e-9 worked out here, so the argument appears once per value.
 */
function firstFitting(list: readonly number[], wanted: string, otherwise: string): string {
  let f = otherwise;
  for (let i = list.length - 1; i >= 0; i--) {
    const v = list[i] as number;
    f = `IF(${wanted}<=${v + EPS},${v},${f})`;
  }
  return f;
}

/**
 * Every bank voltage a star of 1 to MAX_UNITS_IN_SERIES IEEE 18 units in series can have,
 * ascending: the smallest of them at or above the wanted voltage is the smallest of the best
 * banks for each count in series, which is what the rule takes.
 */
const IEEE_STAR_BANKS_KV: readonly number[] = [
  ...new Set(
    Array.from({ length: MAX_UNITS_IN_SERIES }, (_, i) =>
      IEEE18_MV_UNIT_RATINGS_KV.map((u) => Math.sqrt(3) * (i + 1) * u),
    ).flat(),
  ),
].sort((a, b) => a - b);

/** chooseCapacitorRating(uc, hz).bank_rated_kv in classic functions. */
function ratingFormula(uc: string, hz: string): string {
  const w = `(${uc}*${1 + CAP_VOLTAGE_MARGIN})`;
  const lastOf = (list: readonly number[]) => list[list.length - 1] as number;
  const madeToOrder = `ROUND(ROUNDUP(${w}/${IEC_MV_ROUNDING_KV}-1/1000000000,0)*${IEC_MV_ROUNDING_KV},3)`;
  const star = firstFitting(IEEE_STAR_BANKS_KV, w, madeToOrder);
  const iecLv = firstFitting(IEC_LV_RATINGS_KV, w, 'NA()');
  const ieeeLv = firstFitting(IEEE18_LV_RATINGS_KV, w, 'NA()');
  return (
    `IF(AND(${hz}=60,${w}<=${lastOf(IEEE18_LV_RATINGS_KV) + EPS}),${ieeeLv},` +
    `IF(${w}<=${LV_MAX_KV + EPS},${iecLv},IF(${hz}=60,${star},${madeToOrder})))`
  );
}

export const CAPBANK_URATED = defineFunction({
  name: 'CAPBANK.URATED',
  family: FAMILY,
  summary: 'Rated voltage of the capacitors a bank is bought with, kV (line-to-line).',
  description:
    'The smallest rating at least 1.1 × the voltage across the capacitors (CAPBANK.UCAP for a detuned step): at 60 Hz from IEEE 18 ' +
    "Table 1 (LV units, then MV single-phase units in star, up to 4 in series); otherwise from makers' IEC 60831-1 LV ranges, and " +
    'above 1 kV made to order (IEC 60871-1), rounded up to 0.1 kV.',
  params: [
    {
      name: 'u_cap_kv',
      unit: 'kV',
      doc: 'voltage across the capacitors, line-to-line',
      domain: { lo: 0, loOpen: true },
    },
    {
      name: 'f_hz',
      unit: 'Hz',
      doc: 'system frequency (60: IEEE 18 ratings)',
      domain: { lo: 0, loOpen: true },
      default: 50,
    },
  ],
  result: { unit: 'kV', doc: "the bank's rated voltage, line-to-line" },
  source: {
    kind: 'from memory',
    ref: "IEC 60831-1 and IEC 60871-1 (1.10 Un for 8 h in 24 h; ratings as the purchaser states them), IEEE Std 18-2012 Table 1 (unit ratings, from memory); makers' LV ranges (common practice)",
  },
  examples: [
    {
      args: [0.43],
      expect: 0.48,
      note: '400 V with 7 % detuning puts about 430 V across: × 1.1 = 473 V → 480 V units (recomputed in the tests)',
    },
    {
      args: [0.516, 60],
      expect: 0.6,
      note: '480 V with 7 % at 60 Hz puts about 516 V across: × 1.1 = 568 V → 600 V (IEEE 18 Table 1, from memory; recomputed in the tests)',
    },
    {
      args: [7.1],
      expect: 7.9,
      note: '6.6 kV with 7 % puts about 7.1 kV across: × 1.1 = 7.81 kV → made to order at 7.9 kV (recomputed in the tests)',
    },
    {
      args: [0, 50],
      expect: { error: 'argument 1 (u_cap_kv) must be > 0; got 0' },
      note: 'no voltage across the capacitors',
    },
  ],
  compute: ([uc, hz]) => capacitorRatedVoltage(num(uc), num(hz)),
  expand: ([uc, hz]) => ratingFormula(uc as string, hz as string),
});
