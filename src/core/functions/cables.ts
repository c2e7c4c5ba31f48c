// Cables and overhead lines: charging, capacitance from geometry, net line kvar, SIL.
import { defineFunction, type ParamSpec } from '../registry/spec.ts';
import { argAt, relation } from '../registry/messages.ts';
import { cableCapacitance, cableChargingKvar } from '../elements/cable.ts';
import { lineNetKvar, lineSil } from '../elements/line.ts';
import { squareText } from './formulaText.ts';

const FAMILY = 'Cables and lines';
const num = (x: number | boolean | undefined): number => x as number;

const U: ParamSpec = {
  name: 'u_kv',
  unit: 'kV',
  doc: 'operating voltage, line-to-line',
  domain: { lo: 0, loOpen: true },
};
const LEN: ParamSpec = { name: 'len_km', unit: 'km', doc: 'route length', domain: { lo: 0 } };
const F: ParamSpec = {
  name: 'f_hz',
  unit: 'Hz',
  doc: 'system frequency',
  domain: { lo: 0, loOpen: true },
  default: 50,
};
const L_MH: ParamSpec = {
  name: 'l_mh_km',
  unit: 'mH/km',
  doc: 'series inductance per phase',
  domain: { lo: 0, loOpen: true },
};
const C_NF: ParamSpec = {
  name: 'c_nf_km',
  unit: 'nF/km',
  doc: 'capacitance per phase (to earth, positive sequence)',
  domain: { lo: 0, loOpen: true },
};

export const KVAR_CABLE = defineFunction({
  name: 'KVAR.CABLE',
  family: FAMILY,
  summary: 'Charging reactive power of a cable, kvar (delivered, so < 0).',
  description:
    '−2π·f·C·len·U²/1000 with C in µF/km and U in kV line-to-line: the kvar a cable delivers at no load. ' +
    'It flows whether or not the cable carries load and can make a lightly loaded site export kvar.',
  params: [
    U,
    {
      name: 'c_uf_km',
      unit: 'µF/km',
      doc: "capacitance per phase (maker's data or CABLE.CAP)",
      domain: { lo: 0, loOpen: true },
    },
    LEN,
    F,
  ],
  result: { unit: 'kvar', doc: 'reactive power, ≤ 0 (delivered)' },
  source: {
    kind: 'published',
    ref: 'Q = ω·C·U² (three-phase, U line-to-line); capacitance per IEC 60287-1-1',
  },
  examples: [
    {
      args: [20, 0.31, 1],
      expect: -39,
      tol: 0.013,
      note: '20 kV XLPE cable of 0.31 µF/km charges ≈ 39 kvar/km at 50 Hz (derived from the formula with IEC 60502-2 insulation)',
    },
    {
      args: [33, 0.22, 4.5, 60],
      expect: -406.4379,
      tol: 1e-6,
      note: '4.5 km of 33 kV cable at 60 Hz (recomputed in the tests)',
    },
    {
      args: [20, 0.31, -1],
      expect: { error: 'argument 3 (len_km) must be ≥ 0; got -1' },
      note: 'negative length',
    },
  ],
  compute: ([u, c, len, f]) => cableChargingKvar(num(u), num(c), num(len), num(f)),
  expand: ([u, c, len, f]) => `-2*PI()*${f}*${c}*${len}*${squareText(u as string)}/1000`,
});

const CAP_PARAMS: readonly ParamSpec[] = [
  {
    name: 'eps_r',
    unit: '1',
    doc: 'relative permittivity of the insulation (XLPE 2.5, EPR 3, PVC 8, paper 4)',
    domain: { lo: 0, loOpen: true },
  },
  {
    name: 'd_ins_mm',
    unit: 'mm',
    doc: 'diameter over the insulation (excluding the outer screen)',
    domain: { lo: 0, loOpen: true },
  },
  {
    name: 'd_cond_mm',
    unit: 'mm',
    doc: 'diameter of the conductor including its screen, below d_ins_mm',
    domain: { lo: 0, loOpen: true },
  },
];

export const CABLE_CAP = defineFunction({
  name: 'CABLE.CAP',
  family: FAMILY,
  summary: 'Capacitance per phase of a screened cable, µF/km.',
  description:
    'ε/(18·ln(Di/dc)) (IEC 60287-1-1): the radial-field capacitance between conductor and screen. The constant 18 is 1/(2π·ε0) in these units, rounded.',
  params: CAP_PARAMS,
  result: { unit: 'µF/km', doc: 'capacitance per phase' },
  source: {
    kind: 'published',
    ref: 'IEC 60287-1-1, capacitance of a screened cable; permittivities from its Table 3 (from memory)',
  },
  examples: [
    {
      args: [2.5, 30.4, 19.4],
      expect: 0.31,
      tol: 0.01,
      note: '12/20 kV XLPE, 5.5 mm insulation (IEC 60502-2) on a 19.4 mm screened conductor: ≈ 0.31 µF/km (derived)',
    },
    {
      args: [8, 20, 10],
      expect: 0.6411978,
      tol: 1e-6,
      note: 'PVC, Di/dc = 2: 8/(18·ln 2) (recomputed in the tests)',
    },
    {
      args: [2.5, 20, 25],
      expect: { error: 'argument 3 (d_cond_mm) must be less than argument 2 (d_ins_mm); got 25 ≥ 20' },
      note: 'diameters swapped',
    },
  ],
  check: ([, di, dc]) =>
    num(dc) >= num(di)
      ? relation.below(argAt(CAP_PARAMS, 2, num(dc)), argAt(CAP_PARAMS, 1, num(di)))
      : undefined,
  compute: ([eps, di, dc]) => cableCapacitance(num(eps), num(di), num(dc)),
  expand: ([eps, di, dc]) => `${eps}/(18*LN(${di}/${dc}))`,
  expandGuards: ([, di, dc]) => [`${dc}>=${di}`],
});

export const KVAR_LINE = defineFunction({
  name: 'KVAR.LINE',
  family: FAMILY,
  summary: 'Net reactive power of a line at a load, kvar.',
  description:
    'Series absorption 3·I²·X minus the charging ω·C·U², with I = S/(√3·U) and X = ω·L·len: ' +
    'Q = 2π·f·len·(L·(S/U)² − C·U²)/10⁶ in kvar for L in mH/km, C in nF/km, S in kVA, U in kV. ' +
    'Negative (delivered) below surge impedance loading, zero at it, positive above. Lumped model, good for lines up to a few hundred km.',
  params: [
    U,
    { name: 's_load_kva', unit: 'kVA', doc: 'apparent power carried', domain: { lo: 0 } },
    L_MH,
    C_NF,
    LEN,
    F,
  ],
  result: { unit: 'kvar', doc: 'net reactive power, > 0 absorbed, < 0 delivered' },
  source: {
    kind: 'published',
    ref: 'line series reactance I²X and shunt charging ωCU²; net zero at surge impedance loading (e.g. Kundur, Power System Stability and Control §6.1)',
  },
  examples: [
    {
      args: [400, 0, 1, 10, 1],
      expect: -500,
      tol: 0.01,
      note: '400 kV line, 1 mH/km and 10 nF/km, no load: ≈ 0.50 Mvar/km delivered (common practice)',
    },
    {
      args: [220, 150000, 1.3, 8.8, 60],
      expect: 3363.116,
      tol: 1e-6,
      note: '60 km of 220 kV line carrying 150 MVA, above its SIL: absorbs (recomputed in the tests)',
    },
    {
      args: [400, 0, 0, 10, 1],
      expect: { error: 'argument 3 (l_mh_km) must be > 0; got 0' },
      note: 'no inductance',
    },
  ],
  compute: ([u, s, l, c, len, f]) => lineNetKvar(num(u), num(s), num(l), num(c), num(len), num(f)),
  expand: ([u, s, l, c, len, f]) => `2*PI()*${f}*${len}*(${l}*POWER(${s}/${u},2)-${c}*POWER(${u},2))/1000000`,
});

export const LINE_SIL = defineFunction({
  name: 'LINE.SIL',
  family: FAMILY,
  summary: 'Surge impedance loading of a line, MW.',
  description:
    'U²/Zc with Zc = √(L/C) = 1000·√(L/C) Ω for L in mH/km and C in nF/km. At this loading (unity power factor) the line absorbs as many kvar as it delivers.',
  params: [U, L_MH, C_NF],
  result: { unit: 'MW', doc: 'surge impedance loading' },
  source: {
    kind: 'published',
    ref: 'surge impedance loading U²/Zc (e.g. Kundur, Power System Stability and Control §6.1, Table 6.1)',
  },
  examples: [
    {
      args: [400, 1, 10],
      expect: 506,
      tol: 1e-3,
      note: '400 kV, 1 mH/km, 10 nF/km: Zc ≈ 316 Ω, SIL ≈ 506 MW (common practice)',
    },
    {
      args: [230, 1.29445, 8.9417],
      expect: 140,
      tol: 0.01,
      note: 'Kundur Table 6.1, 230 kV (x 0.488 Ω/km, b 3.371 µS/km at 60 Hz): SIL 140 MW (from memory)',
    },
    {
      args: [400, 1, 0],
      expect: { error: 'argument 3 (c_nf_km) must be > 0; got 0' },
      note: 'no capacitance',
    },
  ],
  compute: ([u, l, c]) => lineSil(num(u), num(l), num(c)),
  expand: ([u, l, c]) => `POWER(${u},2)/(1000*SQRT(${l}/${c}))`,
});
