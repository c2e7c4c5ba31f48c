// Active-power loss in the series resistance of a line (or a cable entered as a line).
import { defineFunction } from '../registry/spec.ts';
import { lineSeriesLossKw } from '../elements/line.ts';

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
