// Compensation equipment: capacitor steps (plain or detuned) and shunt reactors.
import { defineFunction, type ParamSpec } from '../registry/spec.ts';
import { argLabel, formatNumber } from '../registry/messages.ts';
import {
  capacitorBankKvar,
  detunedCapacitorVoltage,
  detuningAtFrequency,
  tuningOrder,
} from '../elements/capacitor.ts';
import { shuntReactorKvar } from '../elements/reactor.ts';
import { squareText } from './formulaText.ts';

const FAMILY = 'Compensation equipment';
const num = (x: number | boolean | undefined): number => x as number;

const POSITIVE = { lo: 0, loOpen: true } as const;
const Q_RATED: ParamSpec = {
  name: 'q_rated_kvar',
  unit: 'kvar',
  doc: 'nameplate rating at the rated voltage (and frequency)',
  domain: POSITIVE,
};
const U_RATED: ParamSpec = {
  name: 'u_rated_kv',
  unit: 'kV',
  doc: 'rated voltage of the unit, line-to-line',
  domain: POSITIVE,
};
const U_OP: ParamSpec = {
  name: 'u_kv',
  unit: 'kV',
  doc: 'operating voltage, line-to-line (default: the rated voltage)',
  domain: POSITIVE,
  default: { sameAs: 'u_rated_kv' },
};
const P_DETUNE: ParamSpec = {
  name: 'p_pct',
  unit: '%',
  doc: 'detuning factor of the series reactor, X_L/X_C in % (0 = none)',
  domain: { lo: 0, hi: 100, hiOpen: true },
};

const BANK_PARAMS: readonly ParamSpec[] = [
  Q_RATED,
  U_RATED,
  U_OP,
  { ...P_DETUNE, default: 0 },
  { name: 'f_rated_hz', unit: 'Hz', doc: 'frequency of the nameplate rating', domain: POSITIVE, default: 50 },
  {
    name: 'f_hz',
    unit: 'Hz',
    doc: 'operating frequency (default: the rated frequency)',
    domain: POSITIVE,
    default: { sameAs: 'f_rated_hz' },
  },
];

export const KVAR_CAPBANK = defineFunction({
  name: 'KVAR.CAPBANK',
  family: FAMILY,
  summary: 'Output of a capacitor step at the operating voltage and frequency, kvar (delivered, so < 0).',
  description:
    "−Qr·(U/Ur)²·(f/fr)/(1 − p/100·(f/fr)²). A capacitor's output scales with the voltage squared and with the frequency; " +
    "a series detuning reactor of p % raises the voltage across the capacitors and the step's output by 1/(1 − p/100). " +
    'Error when the branch is at or past its series resonance (p/100·(f/fr)² ≥ 1). ' +
    "Capacitors run above rated voltage age fast and can fail violently: keep within the maker's and IEC 60831-1 limits.",
  params: BANK_PARAMS,
  result: { unit: 'kvar', doc: 'reactive power, < 0 (delivered)' },
  source: {
    kind: 'published',
    ref: 'IEC 60831-1 (rated output at rated voltage and frequency); Q = ω·C·U² with a series reactor X_L = p·X_C',
  },
  examples: [
    {
      args: [50, 0.44, 0.4],
      expect: -41.3,
      tol: 1.5e-3,
      note: '50 kvar / 440 V unit at 400 V gives 41.3 kvar (output ∝ U²; recomputed in the tests)',
    },
    {
      args: [50, 0.44, 0.4, 0, 60, 50],
      expect: -34.4,
      tol: 1.5e-3,
      note: 'the same unit rated at 60 Hz, run at 50 Hz: 34.4 kvar (output ∝ f; recomputed in the tests)',
    },
    {
      args: [80, 0.525, 0.4, 7],
      expect: -49.9,
      tol: 1.5e-3,
      note: '80 kvar / 525 V capacitors with a 7 % reactor at 400 V: about 49.9 kvar (a worked example from memory; recomputed in the tests)',
    },
    {
      args: [50, 0.4, 0.4, 14, 50, 150],
      expect: { error: 'the detuned branch is at or past resonance' },
      note: 'a 14 % step (tuned to 2.67) at 150 Hz is past its resonance',
    },
  ],
  check: ([, , , p, fr, f]) => {
    const k = detuningAtFrequency(num(p), num(fr), num(f));
    if (k < 1) return undefined;
    return `the detuned branch is at or past resonance: p/100·(f/f_rated)² must be below 1 for ${argLabel(4, BANK_PARAMS[3] as ParamSpec)} and ${argLabel(6, BANK_PARAMS[5] as ParamSpec)}; got ${formatNumber(k)}`;
  },
  compute: ([q, ur, u, p, fr, f]) => capacitorBankKvar(num(q), num(ur), num(u), num(p), num(fr), num(f)),
  expand: ([q, ur, u, p, fr, f]) => `-${q}*POWER(${u}/${ur},2)*(${f}/${fr})/(1-${p}/100*POWER(${f}/${fr},2))`,
  expandGuards: ([, , , p, fr, f]) => [`${p}/100*POWER(${f}/${fr},2)>=1`],
});

export const CAPBANK_UCAP = defineFunction({
  name: 'CAPBANK.UCAP',
  family: FAMILY,
  summary: 'Voltage across the capacitors of a detuned step, kV.',
  description:
    "U/(1 − p/100): the series reactor's voltage adds to the capacitor's, so capacitors of a detuned step must be rated above the bus voltage " +
    '(plus margin for harmonics and overvoltage).',
  params: [{ name: 'u_kv', unit: 'kV', doc: 'bus voltage, line-to-line', domain: POSITIVE }, P_DETUNE],
  result: { unit: 'kV', doc: 'fundamental voltage across the capacitors, line-to-line' },
  source: {
    kind: 'common practice',
    ref: 'circuit theory of the series L–C branch: U_C = U·X_C/(X_C − X_L) = U/(1 − p)',
  },
  examples: [
    {
      args: [0.4, 6],
      expect: 0.4255,
      tol: 2e-4,
      note: '400 V with a 6 % reactor: 425.5 V across the capacitors (recomputed in the tests)',
    },
    {
      args: [0.69, 7],
      expect: 0.7419355,
      tol: 1e-6,
      note: '690 V with 7 %: 0.69/0.93 (recomputed in the tests)',
    },
    {
      args: [0.4, 100],
      expect: { error: 'argument 2 (p_pct) must be in [0, 100); got 100' },
      note: 'p = 100 % is resonance at the fundamental',
    },
  ],
  compute: ([u, p]) => detunedCapacitorVoltage(num(u), num(p)),
  expand: ([u, p]) => `${u}/(1-${p}/100)`,
});

export const CAPBANK_TUNE = defineFunction({
  name: 'CAPBANK.TUNE',
  family: FAMILY,
  summary: 'Tuning order of a detuned step, n = 1/√(p/100).',
  description:
    'Harmonic order at which the series reactor and the capacitors resonate: 5.67 % tunes to 4.2 (210 Hz at 50 Hz), 7 % to 3.78, 14 % to 2.67.',
  params: [{ ...P_DETUNE, domain: { lo: 0, hi: 100, loOpen: true, hiOpen: true } }],
  result: { unit: '1', doc: 'tuning order (multiple of the fundamental frequency)' },
  source: {
    kind: 'common practice',
    ref: 'circuit theory, series resonance of L and C: n = √(X_C/X_L) = 1/√p (5.67, 7 and 14 % are the usual detuning factors)',
  },
  examples: [
    {
      args: [5.67],
      expect: 4.2,
      tol: 1.5e-3,
      note: '5.67 % → 4.20 (210 Hz at 50 Hz), common practice; recomputed in the tests',
    },
    {
      args: [7],
      expect: 3.78,
      tol: 1.5e-3,
      note: '7 % → 3.78 (189 Hz), common practice; recomputed in the tests',
    },
    {
      args: [14],
      expect: 2.67,
      tol: 2e-3,
      note: '14 % → 2.67 (134 Hz), common practice; recomputed in the tests',
    },
    {
      args: [0],
      expect: { error: 'argument 1 (p_pct) must be in (0, 100); got 0' },
      note: 'no reactor, no tuning',
    },
  ],
  compute: ([p]) => tuningOrder(num(p)),
  expand: ([p]) => `1/SQRT(${p}/100)`,
});

export const KVAR_REACTOR = defineFunction({
  name: 'KVAR.REACTOR',
  family: FAMILY,
  summary: 'Absorbed reactive power of a shunt reactor at the operating voltage, kvar (> 0).',
  description:
    '+Qr·(U/Ur)²: a fixed reactance absorbs kvar in proportion to the voltage squared. Used where cable or line charging wins at light load.',
  params: [{ ...Q_RATED, doc: 'nameplate rating at the rated voltage' }, U_RATED, U_OP],
  result: { unit: 'kvar', doc: 'reactive power absorbed (> 0)' },
  source: { kind: 'published', ref: 'IEC 60076-6 (shunt reactors rated at rated voltage); Q = U²/X' },
  examples: [
    {
      args: [1000, 33, 34.65],
      expect: 1102.5,
      note: '1 Mvar / 33 kV reactor at 105 % voltage absorbs 1.05² as much (recomputed in the tests)',
    },
    { args: [500, 20], expect: 500, note: 'operating voltage omitted: the rating (recomputed in the tests)' },
    {
      args: [500, 0],
      expect: { error: 'argument 2 (u_rated_kv) must be > 0; got 0' },
      note: 'no rated voltage',
    },
  ],
  compute: ([q, ur, u]) => shuntReactorKvar(num(q), num(ur), num(u)),
  expand: ([q, ur, u]) => `${q}*${squareText(`${u}/${ur}`)}`,
});
