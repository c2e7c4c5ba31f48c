// Network checks: short-circuit power behind a transformer, parallel resonance, voltage rise.
import { defineFunction, type ParamSpec } from '../registry/spec.ts';
import { resonanceOrder, shortCircuitMvaBehindTransformer, voltageRisePct } from '../elements/network.ts';

const FAMILY = 'Network checks';
const num = (x: number | boolean | undefined): number => x as number;

const POSITIVE = { lo: 0, loOpen: true } as const;
const SSC: ParamSpec = {
  name: 'ssc_mva',
  unit: 'MVA',
  doc: 'short-circuit power at the bus',
  domain: POSITIVE,
};
const CAUTION =
  'A screening estimate only: harmonic studies and switching checks belong to a licensed engineer and the utility.';

export const SC_MVA_XFMR = defineFunction({
  name: 'SC.MVA.XFMR',
  family: FAMILY,
  summary: "Short-circuit power at a transformer's secondary, MVA.",
  description:
    "1/((uk/100)/(S/1000) + 1/Ssc_up): the transformer's impedance in series with the supply's, in per unit of 1 MVA. " +
    'Omit ssc_up_mva for an infinite supply (S/(uk/100)). Resistance and voltage factors are neglected.',
  params: [
    { name: 's_kva', unit: 'kVA', doc: 'transformer rated power', domain: POSITIVE },
    {
      name: 'uk_pct',
      unit: '%',
      doc: 'short-circuit impedance',
      domain: { lo: 0, hi: 100, loOpen: true, hiOpen: true },
    },
    {
      name: 'ssc_up_mva',
      unit: 'MVA',
      doc: 'short-circuit power of the supply upstream; omit for an infinite supply',
      domain: POSITIVE,
      default: { omitted: 'infinite supply' },
    },
  ],
  result: { unit: 'MVA', doc: 'short-circuit power at the secondary' },
  source: {
    kind: 'published',
    ref: 'IEC 60909-0 (impedances of network feeder and transformer in series), simplified to reactances',
  },
  examples: [
    {
      args: [1500, 5.5, 48],
      expect: 17.4,
      tol: 3e-3,
      note: '1 500 kVA, 5.5 % on a 48 MVA supply: about 17.4 MVA (a worked example from memory; recomputed in the tests)',
    },
    {
      args: [1500, 5.5],
      expect: 27.27273,
      tol: 1e-6,
      note: 'infinite supply: 1.5/0.055 (recomputed in the tests)',
    },
    {
      args: [1500, 0],
      expect: { error: 'argument 2 (uk_pct) must be in (0, 100); got 0' },
      note: 'no impedance',
    },
  ],
  compute: ([s, uk, up]) =>
    shortCircuitMvaBehindTransformer(num(s), num(uk), up === undefined ? undefined : num(up)),
  expand: ([s, uk, up]) =>
    up === undefined ? `1/(${uk}/100/(${s}/1000))` : `1/(${uk}/100/(${s}/1000)+1/${up})`,
});

export const RESONANCE_ORDER = defineFunction({
  name: 'RESONANCE.ORDER',
  family: FAMILY,
  summary: 'Parallel-resonance harmonic order of a capacitor bank with the supply.',
  description:
    '√(Ssc·1000/Qc) without detuning; 1/√(p/100 + Qc/(Ssc·1000)) with a detuning reactor of p % (both are the same formula at p = 0). ' +
    'An order at or near a characteristic harmonic (5, 7, 11, 13) warns of amplification. ' +
    CAUTION,
  params: [
    SSC,
    { name: 'q_cap_kvar', unit: 'kvar', doc: 'capacitor kvar connected', domain: POSITIVE },
    {
      name: 'p_pct',
      unit: '%',
      doc: 'detuning factor (0 = none)',
      domain: { lo: 0, hi: 100, hiOpen: true },
      default: 0,
    },
  ],
  result: { unit: '1', doc: 'harmonic order of the parallel resonance' },
  source: { kind: 'published', ref: 'IEEE Std 1036 and IEEE Std 519 guidance: h = √(Ssc/Qc)' },
  examples: [
    {
      args: [125, 5000],
      expect: 5,
      tol: 1e-9,
      note: '13.8 kV bus, Ssc 125 MVA, 5 Mvar bank: h = 5.0 (a case study recalled from memory; recomputed in the tests)',
    },
    {
      args: [17.4, 350],
      expect: 7.05,
      tol: 2e-3,
      note: '350 kvar on 17.4 MVA: h ≈ 7.05, right on the 7th (a worked example from memory; recomputed in the tests)',
    },
    {
      args: [125, 5000, 7],
      expect: 3.015113,
      tol: 1e-6,
      note: 'the same bank detuned at 7 %: 1/√(0.07 + 0.04) (recomputed in the tests)',
    },
    { args: [125, 0], expect: { error: 'argument 2 (q_cap_kvar) must be > 0; got 0' }, note: 'no bank' },
  ],
  compute: ([ssc, q, p]) => resonanceOrder(num(ssc), num(q), num(p)),
  expand: ([ssc, q, p]) => `1/SQRT(${p}/100+${q}/(${ssc}*1000))`,
});

export const VRISE_PCT = defineFunction({
  name: 'VRISE.PCT',
  family: FAMILY,
  summary: 'Steady-state voltage rise when a capacitor bank is switched in, %.',
  description: '100·Qc/(Ssc·1000). The transient at switching is larger. ' + CAUTION,
  params: [{ name: 'q_cap_kvar', unit: 'kvar', doc: 'capacitor kvar switched', domain: { lo: 0 } }, SSC],
  result: { unit: '%', doc: 'voltage rise' },
  source: { kind: 'published', ref: 'IEEE Std 1036 (ΔV ≈ Qc/Ssc)' },
  examples: [
    {
      args: [5000, 125],
      expect: 4,
      tol: 1e-9,
      note: '5 Mvar on 125 MVA: about 4 % (a case study recalled from memory; recomputed in the tests)',
    },
    {
      args: [350, 17.39],
      expect: 2.012651,
      tol: 1e-6,
      note: '350 kvar on 17.39 MVA (recomputed in the tests)',
    },
    { args: [100, 0], expect: { error: 'argument 2 (ssc_mva) must be > 0; got 0' }, note: 'no supply' },
  ],
  compute: ([q, ssc]) => voltageRisePct(num(q), num(ssc)),
  expand: ([q, ssc]) => `100*${q}/(${ssc}*1000)`,
});
