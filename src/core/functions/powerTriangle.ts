import { defineFunction } from '../registry/spec.ts';
import { apparentPower, powerFactor, tanPhi } from '../elements/powerTriangle.ts';

const FAMILY = 'Power triangle';
const P = {
  name: 'p_kw',
  unit: 'kW',
  doc: 'active power (load reference: negative when delivered)',
} as const;
const Q = { name: 'q_kvar', unit: 'kvar', doc: 'reactive power (> 0 absorbed, < 0 delivered)' } as const;

export const KVA_TOTAL = defineFunction({
  name: 'KVA.TOTAL',
  family: FAMILY,
  summary: 'Apparent power √(P² + Q²), kVA.',
  description: 'Apparent power of a three-phase balanced load from its active and reactive power.',
  params: [P, Q],
  result: { unit: 'kVA', doc: 'apparent power, never negative' },
  source: {
    kind: 'published',
    ref: 'IEC 60050-131 (131-11-41 apparent power; S² = P² + Q² for sinusoidal quantities)',
  },
  examples: [
    { args: [300, 400], expect: 500, note: 'the 3-4-5 triangle; exact (recomputed in the tests)' },
    {
      args: [650, -760],
      expect: 1000.0499987500625,
      tol: 1e-12,
      note: 'delivered Q gives the same magnitude as absorbed (recomputed in the tests)',
    },
    {
      args: [1.5e308, 1.5e308],
      expect: { error: 'argument 1 (p_kw) must be 0 or between 1e-30 and 1e+30 in size' },
      note: 'beyond any physical size (and near the range of floating-point numbers): an error, never a wrong number',
    },
  ],
  compute: ([p, q]) => apparentPower(p as number, q as number),
  expand: ([p, q]) => `SQRT(POWER(${p},2)+POWER(${q},2))`,
});

export const COSPHI = defineFunction({
  name: 'COSPHI',
  family: FAMILY,
  summary: 'Power factor |P| / √(P² + Q²).',
  description:
    'Displacement power factor at fundamental frequency. Whether it is lagging or leading follows from the sign of Q (Q > 0 lagging). Error when P and Q are both 0.',
  params: [P, Q],
  result: { unit: '1', doc: 'power factor in [0, 1]' },
  source: { kind: 'published', ref: 'IEC 60050-131 (131-11-46 power factor); IEEE Std 1459-2010 §3.1.1.5' },
  examples: [
    {
      args: [400, 300],
      expect: 0.8,
      tol: 1e-12,
      note: '3-4-5 triangle: cos φ = 0.8 (recomputed in the tests)',
    },
    {
      args: [0, 0],
      expect: { error: 'argument 1 (p_kw) and argument 2 (q_kvar) are both 0' },
      note: 'no power, no power factor',
    },
  ],
  check: ([p, q]) =>
    p === 0 && q === 0
      ? 'argument 1 (p_kw) and argument 2 (q_kvar) are both 0; a power factor needs some power'
      : undefined,
  compute: ([p, q]) => powerFactor(p as number, q as number) as number,
  expand: ([p, q]) => `ABS(${p})/SQRT(POWER(${p},2)+POWER(${q},2))`,
  expandGuards: ([p, q]) => [`AND(${p}=0,${q}=0)`],
});

export const TANPHI = defineFunction({
  name: 'TANPHI',
  family: FAMILY,
  summary: 'tan φ = Q / P.',
  description:
    'Ratio of reactive to active power, the form many tariffs use. Positive for absorbed (lagging) kvar with consumed kW. Error when P = 0.',
  params: [P, Q],
  result: { unit: '1', doc: 'tan φ, signed' },
  source: { kind: 'published', ref: 'IEC 60050-131 (131-11-46; tan φ = Q/P for sinusoidal quantities)' },
  examples: [
    { args: [400, 300], expect: 0.75, tol: 1e-12, note: '3-4-5 triangle (recomputed in the tests)' },
    {
      args: [0, 10],
      expect: { error: 'argument 1 (p_kw) must not be 0' },
      note: 'no active power, no ratio',
    },
  ],
  check: ([p]) => (p === 0 ? 'argument 1 (p_kw) must not be 0; got 0' : undefined),
  compute: ([p, q]) => tanPhi(p as number, q as number) as number,
  expand: ([p, q]) => `${q}/${p}`,
  expandGuards: ([p]) => [`${p}=0`],
});
