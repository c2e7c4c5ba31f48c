// Loads and machines: general loads, induction motors, generators.
import { defineFunction, type ParamSpec } from '../registry/spec.ts';
import { argAt, relation } from '../registry/messages.ts';
import { loadReactivePower } from '../elements/load.ts';
import {
  motorCapacitorMax,
  motorInputPower,
  motorNoLoadTooHigh,
  motorReactivePower,
} from '../elements/motor.ts';
import { generatorReactiveCapability, generatorReactivePower } from '../elements/generator.ts';
import { boolText, squareText, tanText } from './formulaText.ts';

const FAMILY = 'Loads and machines';
const num = (x: number | boolean | undefined): number => x as number;

const COS: ParamSpec = {
  name: 'cos_phi',
  unit: '1',
  doc: 'power factor',
  domain: { lo: 0, hi: 1, loOpen: true },
};
const P_OUT: ParamSpec = { name: 'p_out_kw', unit: 'kW', doc: 'rated shaft output', domain: { lo: 0 } };
const EFF: ParamSpec = {
  name: 'eff',
  unit: '1',
  doc: 'efficiency at this load, as a fraction (0.95, not 95)',
  domain: { lo: 0, hi: 1, loOpen: true },
};
const LOAD: ParamSpec = {
  name: 'load',
  unit: '1',
  doc: 'shaft load as a fraction of rated output',
  domain: { lo: 0, hi: 1.5 },
  default: 1,
};

export const KVAR_LOAD = defineFunction({
  name: 'KVAR.LOAD',
  family: FAMILY,
  summary: 'Reactive power of a load from P and cos φ, kvar.',
  description:
    'Q = P·tan(acos cos φ), computed as P·√(1 − cos²φ)/cos φ. Positive (absorbed) for a lagging load; negated when the load is leading.',
  params: [
    { name: 'p_kw', unit: 'kW', doc: 'active power drawn', domain: { lo: 0 } },
    COS,
    {
      name: 'leading',
      unit: 'TRUE/FALSE',
      doc: 'TRUE when the load delivers kvar (leading power factor)',
      type: 'boolean',
      default: false,
    },
  ],
  result: { unit: 'kvar', doc: 'reactive power, > 0 absorbed, < 0 delivered' },
  source: {
    kind: 'published',
    ref: 'IEC 60050-131 (131-11-46 power factor); IEEE Std 141 ch. 8 (power factor and reactive power)',
  },
  examples: [
    {
      args: [650, 0.65],
      expect: 760,
      tol: 1e-3,
      note: 'a textbook worked example recalled from memory: 650 kW at 0.65 draws ≈ 760 kvar, all of it to be compensated for 1.00 (recomputed in the tests)',
    },
    {
      args: [400, 0.8, true],
      expect: -300,
      note: '3-4-5 triangle, leading: delivered kvar (recomputed in the tests)',
    },
    {
      args: [100, 1.2],
      expect: { error: 'argument 2 (cos_phi) must be in (0, 1]; got 1.2' },
      note: 'a power factor above 1 is a typing error',
    },
  ],
  compute: ([p, c, lead]) => loadReactivePower(num(p), num(c), lead === true),
  expand: ([p, c, lead]) => `IF(${boolText(lead)},-1,1)*${p}*${tanText(c as string)}`,
});

export const KW_MOTOR = defineFunction({
  name: 'KW.MOTOR',
  family: FAMILY,
  summary: 'Electrical input power of a motor, kW.',
  description:
    'P = P_out·load/η: the shaft output at the given load divided by the efficiency. Give the efficiency at that load if known; the rated efficiency is a fair estimate from half to full load.',
  params: [P_OUT, EFF, LOAD],
  result: { unit: 'kW', doc: 'active power drawn from the bus' },
  source: {
    kind: 'published',
    ref: 'IEC 60034-2-1 (efficiency = output/input); IEC 60034-30-1 efficiency classes',
  },
  examples: [
    {
      args: [11, 0.914],
      expect: 12.03501,
      tol: 1e-6,
      note: 'IE3 4-pole 11 kW minimum efficiency 91.4 % (IEC 60034-30-1, published); input = output/η',
    },
    {
      args: [37, 0.939, 0.75],
      expect: 29.55272,
      tol: 1e-6,
      note: 'IE3 4-pole 37 kW, 93.9 % (IEC 60034-30-1), at three-quarter load',
    },
    {
      args: [11, 91.4],
      expect: { error: 'argument 2 (eff) must be in (0, 1]; got 91.4' },
      note: 'efficiency typed in percent',
    },
    {
      args: [11, 0.914, 1.6],
      expect: { error: 'argument 3 (load) must be in [0, 1.5]; got 1.6' },
      note: 'overload beyond the modelled range',
    },
  ],
  compute: ([p, e, x]) => motorInputPower(num(p), num(e), num(x)),
  expand: ([p, e, x]) => `${p}*${x}/${e}`,
});

const MOTOR_PARAMS: readonly ParamSpec[] = [
  P_OUT,
  EFF,
  { ...COS, doc: 'rated power factor (nameplate, full load)' },
  LOAD,
  {
    name: 'i0_pct',
    unit: '%',
    doc: 'no-load current in % of rated current; omit to assume no-load kvar = 70 % of full-load kvar',
    domain: { lo: 0, hi: 100, loOpen: true, hiOpen: true },
    default: { omitted: 'no-load kvar = 0.7 × full-load kvar (common practice)' },
  },
];

export const KVAR_MOTOR = defineFunction({
  name: 'KVAR.MOTOR',
  family: FAMILY,
  summary: 'Reactive power of an induction motor at a load, kvar.',
  description:
    'Q(x) = Q0 + (Qr − Q0)·x², with full-load Qr = P_out/η·tan φ, Sr = P_out/(η·cos φ) and no-load Q0 = i0/100·Sr. ' +
    'The magnetising part Q0 barely changes with load; the leakage part grows with the current squared. ' +
    'Assumption when i0_pct is omitted: Q0 = 0.7·Qr (common practice for standard 4-pole motors; motors with more poles ' +
    'have a larger share). Error when i0 implies more kvar at no load than at full load (i0/100 > sin φ).',
  params: MOTOR_PARAMS,
  result: { unit: 'kvar', doc: 'reactive power absorbed (> 0)' },
  source: {
    kind: 'common practice',
    ref: 'induction motor equivalent circuit: magnetising kvar ≈ constant, leakage kvar ∝ I² (e.g. IEEE Std 141 ch. 8); Q0 = 0.7·Qr default is a rule of thumb',
  },
  examples: [
    {
      args: [90, 0.95, 0.85],
      expect: 58.71262,
      tol: 1e-6,
      note: 'full load: Qr = 90/0.95·tan(acos 0.85) (recomputed in the tests)',
    },
    {
      args: [90, 0.95, 0.85, 0.5],
      expect: 45.50228,
      tol: 1e-6,
      note: 'half load, assumed Q0 = 0.7·Qr: Q = 0.775·Qr (recomputed in the tests)',
    },
    {
      args: [90, 0.95, 0.85, 0.5, 30],
      expect: 39.75555,
      tol: 1e-6,
      note: 'half load with i0 = 30 %: Q0 = 0.3·90/(0.95·0.85) (recomputed in the tests)',
    },
    {
      args: [90, 0.95, 0.85, 1, 60],
      expect: { error: 'argument 5 (i0_pct) must not exceed 100·sin φ' },
      note: 'i0 = 60 % is inconsistent with cos φ 0.85 (sin φ = 0.527)',
    },
  ],
  check: ([, , c, , i0]) =>
    i0 !== undefined && motorNoLoadTooHigh(num(c), num(i0))
      ? relation.notAboveLimit(
          argAt(MOTOR_PARAMS, 4, num(i0)),
          '100·sin φ of argument 3 (cos_phi)',
          100 * Math.sqrt(1 - num(c) * num(c)),
          'no-load kvar cannot exceed full-load kvar',
        )
      : undefined,
  compute: ([p, e, c, x, i0]) =>
    motorReactivePower(num(p), num(e), num(c), num(x), i0 === undefined ? undefined : num(i0)),
  expand: ([p, e, c, x, i0]) => {
    const qr = `(${p}/${e}*${tanText(c as string)})`;
    const q0 = i0 === undefined ? `(0.7*${qr})` : `(${i0}/100*(${p}/(${e}*${c})))`;
    return `${q0}+(${qr}-${q0})*${squareText(x as string)}`;
  },
  expandGuards: ([, , c, , i0]) => (i0 === undefined ? [] : [`${i0}/100>SQRT(1-POWER(${c},2))`]),
});

export const KVAR_MOTORCAP_MAX = defineFunction({
  name: 'KVAR.MOTORCAP.MAX',
  family: FAMILY,
  summary: 'Largest capacitor switched with a motor without self-excitation risk, kvar.',
  description:
    "0.9·√3·U·I0: 90 % of the motor's no-load kvar. A larger capacitor left connected to a motor that is switched off can keep it " +
    "excited and raise its terminal voltage. Use the maker's maximum safe kvar where given.",
  params: [
    { name: 'u_kv', unit: 'kV', doc: 'rated voltage, line-to-line', domain: { lo: 0, loOpen: true } },
    { name: 'i0_a', unit: 'A', doc: 'no-load current', domain: { lo: 0, loOpen: true } },
  ],
  result: { unit: 'kvar', doc: 'capacitor rating limit (magnitude)' },
  source: {
    kind: 'common practice',
    ref: "capacitor ≤ 90 % of motor no-load kvar; NEMA MG 1 Part 14 warns against exceeding the maker's maximum safe kvar",
  },
  examples: [
    {
      args: [0.4, 60],
      expect: 37.4123,
      tol: 1e-6,
      note: '400 V motor with 60 A no-load current: 0.9·√3·0.4·60 (recomputed in the tests)',
    },
    {
      args: [6.6, 12],
      expect: 123.4606,
      tol: 1e-6,
      note: '6.6 kV motor, 12 A no-load current (recomputed in the tests)',
    },
    { args: [0, 60], expect: { error: 'argument 1 (u_kv) must be > 0; got 0' }, note: 'no voltage' },
  ],
  compute: ([u, i0]) => motorCapacitorMax(num(u), num(i0)),
  expand: ([u, i0]) => `0.9*SQRT(3)*${u}*${i0}`,
});

export const KVAR_GEN = defineFunction({
  name: 'KVAR.GEN',
  family: FAMILY,
  summary: 'Reactive power of a generator at P and cos φ, kvar (load reference).',
  description:
    '−P·tan(acos cos φ): an over-excited machine delivers kvar, so Q < 0 in the load reference of the catalogue. With absorbing TRUE (under-excited) the sign is positive.',
  params: [
    { name: 'p_kw', unit: 'kW', doc: 'active power output', domain: { lo: 0 } },
    { ...COS, doc: 'operating power factor' },
    {
      name: 'absorbing',
      unit: 'TRUE/FALSE',
      doc: 'TRUE when under-excited (the machine absorbs kvar)',
      type: 'boolean',
      default: false,
    },
  ],
  result: { unit: 'kvar', doc: '< 0 delivered (over-excited), > 0 absorbed' },
  source: {
    kind: 'common practice',
    ref: 'generators rated in kVA at 0.8 power factor lagging deliver Q = 0.75·P at rated output',
  },
  examples: [
    { args: [1000, 0.8], expect: -750, note: 'rated at 0.8: delivers 0.75·P (common practice rating)' },
    {
      args: [600, 0.95, true],
      expect: 197.2105,
      tol: 1e-6,
      note: 'under-excited at 0.95: absorbs P·0.3287, the edge of the FERC Order 827 band',
    },
    {
      args: [1000, 0],
      expect: { error: 'argument 2 (cos_phi) must be in (0, 1]; got 0' },
      note: 'cos φ = 0 has no active power',
    },
  ],
  compute: ([p, c, abs]) => generatorReactivePower(num(p), num(c), abs === true),
  expand: ([p, c, abs]) => `IF(${boolText(abs)},1,-1)*${p}*${tanText(c as string)}`,
});

const GEN_MAX_PARAMS: readonly ParamSpec[] = [
  { name: 's_kva', unit: 'kVA', doc: 'rated apparent power', domain: { lo: 0, loOpen: true } },
  { name: 'p_kw', unit: 'kW', doc: 'active power output, at most s_kva', domain: { lo: 0 } },
];

export const KVAR_GEN_MAX = defineFunction({
  name: 'KVAR.GEN.MAX',
  family: FAMILY,
  summary: 'Reactive capability of a generator at output P (stator-current limit), kvar.',
  description:
    "√(S² − P²), a magnitude: the stator-current limit only. Field-current, under-excitation and prime-mover limits can be tighter; use the maker's capability chart where it matters.",
  params: GEN_MAX_PARAMS,
  result: { unit: 'kvar', doc: 'reactive capability (magnitude, ≥ 0)' },
  source: {
    kind: 'published',
    ref: 'synchronous machine capability curve, armature-current limit (e.g. Kundur, Power System Stability and Control §5.4)',
  },
  examples: [
    {
      args: [1250, 1000],
      expect: 750,
      note: '1 250 kVA rated at 0.8 (common practice): 750 kvar at 1 000 kW',
    },
    {
      args: [2000, 500],
      expect: 1936.492,
      tol: 1e-6,
      note: 'light load: capability close to the rating (recomputed in the tests)',
    },
    {
      args: [100, 120],
      expect: { error: 'argument 2 (p_kw) must not exceed argument 1 (s_kva); got 120 > 100' },
      note: 'output above the rating',
    },
  ],
  check: ([s, p]) =>
    num(p) > num(s)
      ? relation.notAbove(argAt(GEN_MAX_PARAMS, 1, num(p)), argAt(GEN_MAX_PARAMS, 0, num(s)))
      : undefined,
  compute: ([s, p]) => generatorReactiveCapability(num(s), num(p)),
  expand: ([s, p]) => `SQRT((${s}-${p})*(${s}+${p}))`,
  expandGuards: ([s, p]) => [`${p}>${s}`],
});
