// Series losses of a line or feeder cable at a load: I²R in kW, I²X in kvar, per km values in Ω.
import { defineFunction } from '../registry/spec.ts';
import { lineSeriesKvar, lineSeriesLossKw } from '../elements/line.ts';

const FAMILY = 'Cables and lines';
const num = (x: number | boolean | undefined): number => x as number;

export const KW_LINE_LOSS = defineFunction({
  name: 'KW.LINE.LOSS',
  family: FAMILY,
  summary: 'Series (I²R) loss of a three-phase line at a load, kW.',
  description:
    '3·I²·R·len with I = S/(√3·U): P = S²·R·len/(U²·1000) in kW for S in kVA, U in kV line-to-line and R in Ω/km per phase. ' +
    "Use the conductor's AC resistance at its operating temperature where the maker gives it; the DC value at 20 °C reads a few per cent low. " +
    'Shunt (corona, dielectric) losses are neglected.',
  params: [
    { name: 'u_kv', unit: 'kV', doc: 'operating voltage, line-to-line', domain: { lo: 0, loOpen: true } },
    { name: 's_load_kva', unit: 'kVA', doc: 'apparent power carried', domain: { lo: 0 } },
    { name: 'r_ohm_km', unit: 'Ω/km', doc: 'conductor resistance per phase', domain: { lo: 0 } },
    { name: 'len_km', unit: 'km', doc: 'route length', domain: { lo: 0 } },
  ],
  result: { unit: 'kW', doc: 'active power lost (≥ 0)' },
  source: {
    kind: 'published',
    ref: 'Joule loss 3·I²·R of a balanced three-phase circuit, I = S/(√3·U); series resistance per km as in Kundur, Power System Stability and Control §6.1',
  },
  examples: [
    {
      args: [20, 8000, 0.12, 5],
      expect: 96,
      tol: 1e-9,
      note: '5 km of 20 kV line, 240 mm² aluminium conductor (about 0.12 Ω/km, typical, from memory), carrying 8 MVA: 231 A, 96 kW (recomputed in the tests)',
    },
    {
      args: [0.4, 250, 0.206, 0.12],
      expect: 9.65625,
      tol: 1e-9,
      note: '120 m of 150 mm² aluminium at 400 V (0.206 Ω/km, IEC 60228 class 2 at 20 °C, from memory) carrying 250 kVA: 361 A (recomputed in the tests)',
    },
    {
      args: [20, 8000, -0.12, 5],
      expect: { error: 'argument 3 (r_ohm_km) must be ≥ 0; got -0.12' },
      note: 'negative resistance',
    },
  ],
  compute: ([u, s, r, len]) => lineSeriesLossKw(num(u), num(s), num(r), num(len)),
  expand: ([u, s, r, len]) => `POWER(${s}/${u},2)*${r}*${len}/1000`,
});

export const KVAR_SERIES = defineFunction({
  name: 'KVAR.SERIES',
  family: FAMILY,
  summary: 'Series (I²X) absorption of a three-phase line or cable at a load, kvar.',
  description:
    '3·I²·X·len with I = S/(√3·U): Q = S²·X·len/(U²·1000) in kvar for S in kVA, U in kV line-to-line and X in Ω/km per phase ' +
    "(the positive-sequence reactance from the maker's data). Absorbed (load reference, ≥ 0); the charging is counted apart (KVAR.CABLE, KVAR.LINE).",
  params: [
    { name: 'u_kv', unit: 'kV', doc: 'operating voltage, line-to-line', domain: { lo: 0, loOpen: true } },
    { name: 's_load_kva', unit: 'kVA', doc: 'apparent power carried', domain: { lo: 0 } },
    { name: 'x_ohm_km', unit: 'Ω/km', doc: 'series reactance per phase', domain: { lo: 0 } },
    { name: 'len_km', unit: 'km', doc: 'route length', domain: { lo: 0 } },
  ],
  result: { unit: 'kvar', doc: 'reactive power absorbed (≥ 0)' },
  source: {
    kind: 'published',
    ref: 'reactive power 3·I²·X of a balanced three-phase series reactance, I = S/(√3·U); series reactance per km as in Kundur, Power System Stability and Control §6.1',
  },
  examples: [
    {
      args: [0.4, 300, 0.08, 0.15],
      expect: 6.75,
      tol: 1e-9,
      note: '150 m of 400 V cable with 0.08 Ω/km (typical of LV cables, common practice) carrying 300 kVA: 433 A (recomputed in the tests)',
    },
    {
      args: [20, 8000, 0.35, 5],
      expect: 280,
      tol: 1e-9,
      note: '5 km of 20 kV overhead line with 0.35 Ω/km (typical of MV overhead lines, common practice) carrying 8 MVA (recomputed in the tests)',
    },
    {
      args: [0.4, 300, -0.08, 0.15],
      expect: { error: 'argument 3 (x_ohm_km) must be ≥ 0; got -0.08' },
      note: 'negative reactance',
    },
  ],
  compute: ([u, s, x, len]) => lineSeriesKvar(num(u), num(s), num(x), num(len)),
  expand: ([u, s, x, len]) => `POWER(${s}/${u},2)*${x}*${len}/1000`,
});
