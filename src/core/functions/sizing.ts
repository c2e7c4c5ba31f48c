// Correction sizing: kvar to reach a power factor or tan φ target, and rounding to whole steps.
import { defineFunction, type ParamSpec } from '../registry/spec.ts';
import {
  kvarPerKw,
  kvarToPowerFactor,
  kvarToTan,
  roundUpToSteps,
  STEP_TOLERANCE,
} from '../elements/sizing.ts';
import { formatNumber } from '../registry/messages.ts';
import { tanText } from './formulaText.ts';

const FAMILY = 'Correction sizing';
const num = (x: number | boolean | undefined): number => x as number;

const COS_DOMAIN = { lo: 0, hi: 1, loOpen: true } as const;
const P: ParamSpec = { name: 'p_kw', unit: 'kW', doc: 'active power drawn', domain: { lo: 0 } };
const Q: ParamSpec = {
  name: 'q_kvar',
  unit: 'kvar',
  doc: 'reactive power now (> 0 absorbed, < 0 delivered)',
};

export const KVAR_PERKW = defineFunction({
  name: 'KVAR.PERKW',
  family: FAMILY,
  summary: 'kvar per kW to move from one lagging power factor to another.',
  description:
    'tan(acos cos_from) − tan(acos cos_to), the multiplier of the printed correction tables. Negative when cos_to is below cos_from.',
  params: [
    { name: 'cos_from', unit: '1', doc: 'present power factor (lagging)', domain: COS_DOMAIN },
    { name: 'cos_to', unit: '1', doc: 'target power factor (lagging)', domain: COS_DOMAIN },
  ],
  result: { unit: 'kvar/kW', doc: 'multiplier k' },
  source: {
    kind: 'published',
    ref: 'IEEE Std 141 ch. 8 power factor correction table; USDA RUS Bulletin 1724D-112 Table 1',
  },
  examples: [
    {
      args: [0.7, 0.95],
      expect: 0.691,
      tol: 2.2e-3,
      note: 'IEEE Std 141 ch. 8 table, 0.70 → 0.95: 0.691 (3 decimals)',
    },
    {
      args: [0.8, 0.95],
      expect: 0.421,
      tol: 3.6e-3,
      note: 'IEEE Std 141 ch. 8 table, 0.80 → 0.95: 0.421 (3 decimals)',
    },
    {
      args: [0.95, 0.8],
      expect: -0.421,
      tol: 3.6e-3,
      note: 'reversed direction: the negative of the IEEE Std 141 table value',
    },
    {
      args: [0.8, 0],
      expect: { error: 'argument 2 (cos_to) must be in (0, 1]; got 0' },
      note: 'cos φ = 0 target',
    },
  ],
  compute: ([a, b]) => kvarPerKw(num(a), num(b)),
  expand: ([a, b]) => `${tanText(a as string)}-${tanText(b as string)}`,
});

export const KVAR_TOPF = defineFunction({
  name: 'KVAR.TOPF',
  family: FAMILY,
  summary: 'kvar to add to reach a lagging power factor target.',
  description:
    'Q − P·tan(acos target): > 0 is the capacitive kvar to add, < 0 the inductive kvar to add (too much compensation or cable charging).',
  params: [P, Q, { name: 'cos_target', unit: '1', doc: 'target power factor (lagging)', domain: COS_DOMAIN }],
  result: { unit: 'kvar', doc: 'capacitive kvar to add (> 0) or inductive (< 0)' },
  source: { kind: 'published', ref: 'IEEE Std 141 ch. 8 (kvar required = P·(tan φ1 − tan φ2))' },
  examples: [
    {
      args: [650, 759.93, 1],
      expect: 760,
      tol: 1e-3,
      note: '650 kW at 0.65 raised to 1.00 needs ≈ 760 kvar (a textbook worked example from memory; recomputed in the tests)',
    },
    {
      args: [1000, 750, 0.95],
      expect: 421,
      tol: 1.5e-3,
      note: '1 000 kW at 0.80 to 0.95: 0.421 kvar/kW (IEEE Std 141 table, published)',
    },
    {
      args: [400, -100, 0.9],
      expect: -293.7288,
      tol: 1e-6,
      note: 'a leading site needs inductive kvar to reach 0.9 lagging (recomputed in the tests)',
    },
    {
      args: [100, 50, 1.5],
      expect: { error: 'argument 3 (cos_target) must be in (0, 1]; got 1.5' },
      note: 'target above 1',
    },
  ],
  compute: ([p, q, c]) => kvarToPowerFactor(num(p), num(q), num(c)),
  expand: ([p, q, c]) => `${q}-${p}*${tanText(c as string)}`,
});

export const KVAR_TOTAN = defineFunction({
  name: 'KVAR.TOTAN',
  family: FAMILY,
  summary: 'kvar to add to reach a tan φ target.',
  description:
    'Q − P·tan_target, for tariffs and grid codes written as a tan φ limit (a negative target for a leading limit).',
  params: [P, Q, { name: 'tan_target', unit: '1', doc: 'target tan φ = Q/P (negative for leading)' }],
  result: { unit: 'kvar', doc: 'capacitive kvar to add (> 0) or inductive (< 0)' },
  source: {
    kind: 'published',
    ref: 'tan φ = Q/P (IEC 60050-131); |Q/P| ≤ 0.3287 is the 0.95 band of US FERC Order 2003/827',
  },
  examples: [
    {
      args: [1000, 750, 0.4],
      expect: 350,
      note: 'tariff limit tan φ 0.4: 750 − 400 (recomputed in the tests)',
    },
    {
      args: [1000, -500, -0.3287],
      expect: -171.3,
      note: 'leading site against the 0.95 leading limit (FERC Order 827, Q/P = −0.3287): add 171.3 kvar inductive',
    },
    {
      args: [-5, 10, 0.4],
      expect: { error: 'argument 1 (p_kw) must be ≥ 0; got -5' },
      note: 'negative active power',
    },
  ],
  compute: ([p, q, t]) => kvarToTan(num(p), num(q), num(t)),
  expand: ([p, q, t]) => `${q}-${p}*${t}`,
});

export const BANK_ROUNDUP = defineFunction({
  name: 'BANK.ROUNDUP',
  family: FAMILY,
  summary: 'kvar rounded up to whole steps; 0 when nothing is needed.',
  description:
    `q rounded up to a whole number of steps of step_kvar; 0 when q ≤ 0. A quotient within ${formatNumber(STEP_TOLERANCE)} of a whole number ` +
    'counts as whole, so binary rounding (1.1/0.1 = 11.000000000000002) does not add a step.',
  params: [
    { name: 'q_kvar', unit: 'kvar', doc: 'kvar needed (from KVAR.TOPF or KVAR.TOTAN)' },
    { name: 'step_kvar', unit: 'kvar', doc: 'size of one step', domain: { lo: 0, loOpen: true } },
  ],
  result: { unit: 'kvar', doc: 'installed kvar, a whole number of steps' },
  source: {
    kind: 'common practice',
    ref: 'banks are built from equal steps; round the requirement up to whole steps',
  },
  examples: [
    {
      args: [421.3, 50],
      expect: 450,
      note: '421.3 kvar in 50 kvar steps: 9 steps (recomputed in the tests)',
    },
    {
      args: [1.1, 0.1],
      expect: 1.1,
      note: 'exact multiple despite binary rounding: 11 steps, not 12 (recomputed in the tests)',
    },
    { args: [-20, 25], expect: 0, note: 'nothing needed (recomputed in the tests)' },
    { args: [100, 0], expect: { error: 'argument 2 (step_kvar) must be > 0; got 0' }, note: 'zero step' },
  ],
  compute: ([q, step]) => roundUpToSteps(num(q), num(step)),
  expand: ([q, step]) => `IF(${q}<=0,0,CEILING(MAX(0,${q}/${step}-${tolText()}),1)*${step})`,
});

/** STEP_TOLERANCE as a plain decimal (no exponent), which every spreadsheet program reads. */
function tolText(): string {
  return STEP_TOLERANCE.toFixed(12).replace(/0+$/, '');
}
