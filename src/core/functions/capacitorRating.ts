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
  IEEE_STAR_BANKS,
  LV_MAX_KV,
  capacitorRatedVoltage,
  unitsInSeriesFor,
} from '../site/capacitorRatings.ts';

const FAMILY = 'Compensation equipment';
const num = (x: number | boolean | undefined): number => x as number;

/** The rule's slack at the boundaries of a series (capacitorRatings.ts compares v ≥ wanted − 1e-9). */
const EPS = 1e-9;

/** A constant of the expansion in 12 significant digits: within 1e-11 of the rule's, short enough to fit. */
const short = (x: number) => String(Number(x.toPrecision(12)));

/**
 * The first value of the ascending list at or above (1 + margin) × `across` (the caller makes sure
 * one is): MIN of IF(across ≤ (v + 1e-9)/(1 + margin), v, above all) over the values, the bounds
 * worked out here. Flat, not nested IFs: other programs accept 64 levels of nesting, and the
 * argument appears once per value, so the formula stays within the xlsx length.
 */
function firstFitting(list: readonly number[], across: string): string {
  const above = short(2 * (list[list.length - 1] as number));
  const bound = (v: number) => short((v + EPS) / (1 + CAP_VOLTAGE_MARGIN));
  return `MIN(${list.map((v) => `IF(${across}<=${bound(v)},${short(v)},${above})`).join(',')})`;
}

/** chooseCapacitorRating(uc, hz).bank_rated_kv in classic functions. */
function ratingFormula(uc: string, hz: string): string {
  const w = `(${uc}*${1 + CAP_VOLTAGE_MARGIN})`;
  const below = (v: number) => `${uc}<=${short((v + EPS) / (1 + CAP_VOLTAGE_MARGIN))}`;
  const lastOf = (list: readonly number[]) => list[list.length - 1] as number;
  const madeToOrder = `ROUND(ROUNDUP(${w}/${IEC_MV_ROUNDING_KV}-1/1000000000,0)*${IEC_MV_ROUNDING_KV},3)`;
  const stars = IEEE_STAR_BANKS.map((b) => b.kv);
  return (
    `IF(AND(${hz}=60,${below(lastOf(IEEE18_LV_RATINGS_KV))}),${firstFitting(IEEE18_LV_RATINGS_KV, uc)},` +
    `IF(${below(LV_MAX_KV)},${firstFitting(IEC_LV_RATINGS_KV, uc)},` +
    `IF(AND(${hz}=60,${below(lastOf(stars))}),${firstFitting(stars, uc)},${madeToOrder})))`
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

/**
 * unitsInSeriesFor(ur, hz) in classic functions: 1 plus, for the star bank the rating is (within
 * 1e-9 kV), its units in series less one; a flat sum, since other programs nest 64 levels at most.
 */
function seriesFormula(ur: string, hz: string): string {
  const terms = IEEE_STAR_BANKS.filter((b) => b.n > 1).map(
    (b) => `(ABS(${ur}-${short(b.kv)})<=1/1000000000)*${b.n - 1}`,
  );
  return `IF(AND(${hz}=60,${ur}>${LV_MAX_KV + EPS}),1+${terms.join('+')},1)`;
}

export const CAPBANK_USERIES = defineFunction({
  name: 'CAPBANK.USERIES',
  family: FAMILY,
  summary: 'Capacitor units in series per phase of a bank of this rated voltage.',
  description:
    'At 60 Hz above 1 kV, a rating that a star of IEEE 18 single-phase units reaches with several units in series per phase ' +
    '(the fewest that reach it) gives that number; otherwise 1 (LV three-phase units, or MV units made to the rating).',
  params: [
    {
      name: 'u_rated_kv',
      unit: 'kV',
      doc: "the bank's rated voltage, line-to-line",
      domain: { lo: 0, loOpen: true },
    },
    {
      name: 'f_hz',
      unit: 'Hz',
      doc: 'system frequency (60: IEEE 18 units)',
      domain: { lo: 0, loOpen: true },
      default: 50,
    },
  ],
  result: { unit: '1', doc: 'units in series per phase' },
  source: {
    kind: 'from memory',
    ref: 'IEEE Std 18-2012 Table 1 (unit ratings, from memory); units in star, common practice',
  },
  examples: [
    {
      args: [46.003269449029375, 60],
      expect: 2,
      note: 'two 13.28 kV units a phase in star make 46 kV (recomputed in the tests)',
    },
    {
      args: [16.5, 60],
      expect: 1,
      note: 'no IEEE 18 star gives 16.5 kV: one unit made to it (recomputed in the tests)',
    },
    { args: [0.44], expect: 1, note: 'LV three-phase units (recomputed in the tests)' },
    { args: [0, 60], expect: { error: 'argument 1 (u_rated_kv) must be > 0; got 0' }, note: 'no rating' },
  ],
  compute: ([ur, hz]) => unitsInSeriesFor(num(ur), num(hz)),
  expand: ([ur, hz]) => seriesFormula(ur as string, hz as string),
});
