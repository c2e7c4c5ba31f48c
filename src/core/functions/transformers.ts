// Two-winding transformers: magnetising and leakage kvar, losses, minimum impedance.
import { defineFunction, type ParamSpec } from '../registry/spec.ts';
import { argAt, relation } from '../registry/messages.ts';
import { formatNumber } from '../registry/messages.ts';
import {
  MIN_IMPEDANCE_ABOVE_TABLE,
  MIN_IMPEDANCE_TABLE,
  transformerLeakageKvar,
  transformerLossKw,
  transformerMagnetisingKvar,
  transformerMinImpedancePct,
  transformerNoLoadApparent,
  transformerResistancePct,
} from '../elements/transformer.ts';
import { squareText } from './formulaText.ts';

const FAMILY = 'Transformers';
const num = (x: number | boolean | undefined): number => x as number;

const S: ParamSpec = { name: 's_kva', unit: 'kVA', doc: 'rated power', domain: { lo: 0, loOpen: true } };
const PCT_OPEN = { lo: 0, hi: 100, loOpen: true, hiOpen: true } as const;
const S_LOAD: ParamSpec = {
  name: 's_load_kva',
  unit: 'kVA',
  doc: 'apparent power carried',
  domain: { lo: 0 },
};

const MAG_PARAMS: readonly ParamSpec[] = [
  S,
  { name: 'i0_pct', unit: '%', doc: 'no-load current in % of rated current', domain: PCT_OPEN },
  {
    name: 'p0_kw',
    unit: 'kW',
    doc: 'no-load loss; 0 treats all no-load power as reactive',
    domain: { lo: 0 },
    default: 0,
  },
  {
    name: 'u_pu',
    unit: 'p.u.',
    doc: 'operating voltage / rated voltage',
    domain: { lo: 0, loOpen: true },
    default: 1,
  },
];

export const KVAR_XFMR_MAG = defineFunction({
  name: 'KVAR.XFMR.MAG',
  family: FAMILY,
  summary: 'Magnetising (no-load) reactive power of a transformer, kvar.',
  description:
    '√((i0/100·S)² − P0²)·u²: the reactive part of the no-load apparent power, scaled with the square of the voltage. ' +
    'Above rated voltage saturation makes the real rise steeper than u². Error when P0 exceeds i0/100·S.',
  params: MAG_PARAMS,
  result: { unit: 'kvar', doc: 'reactive power absorbed at any load (> 0)' },
  source: {
    kind: 'published',
    ref: 'IEC 60076-1 (no-load current and loss, measured at rated voltage); Q0 = √(S0² − P0²)',
  },
  examples: [
    {
      args: [1000, 1, 0.693],
      expect: 9.976,
      tol: 1e-4,
      note: '1 000 kVA, i0 1 %, P0 0.693 kW (EU 548/2014 Tier 2 from memory): 9.976 kvar',
    },
    {
      args: [630, 1.2, 0.54, 1.05],
      expect: 8.31361,
      tol: 1e-6,
      note: '630 kVA at 105 % voltage (recomputed in the tests)',
    },
    {
      args: [1000, 1, 12],
      expect: { error: 'argument 3 (p0_kw) must not exceed i0/100·S' },
      note: 'no-load loss above the no-load apparent power',
    },
  ],
  check: ([s, i0, p0]) => {
    const s0 = transformerNoLoadApparent(num(s), num(i0));
    return num(p0) > s0
      ? relation.notAboveLimit(argAt(MAG_PARAMS, 2, num(p0)), 'i0/100·S', s0, 'the no-load apparent power')
      : undefined;
  },
  compute: ([s, i0, p0, u]) => transformerMagnetisingKvar(num(s), num(i0), num(p0), num(u)),
  expand: ([s, i0, p0, u]) => {
    const s0 = `(${i0}/100*${s})`;
    return `SQRT((${s0}-${p0})*(${s0}+${p0}))*${squareText(u as string)}`;
  },
  expandGuards: ([s, i0, p0]) => [`${p0}>${i0}/100*${s}`],
});

const LEAK_PARAMS: readonly ParamSpec[] = [
  S,
  { name: 'uk_pct', unit: '%', doc: 'short-circuit impedance', domain: PCT_OPEN },
  S_LOAD,
  {
    name: 'pk_kw',
    unit: 'kW',
    doc: 'load loss at rated current; 0 treats uk as all reactance',
    domain: { lo: 0 },
    default: 0,
  },
];

export const KVAR_XFMR_LEAK = defineFunction({
  name: 'KVAR.XFMR.LEAK',
  family: FAMILY,
  summary: 'Leakage (series) reactive power of a transformer at a load, kvar.',
  description:
    'ux/100·S·(S_load/S)² with ux = √(uk² − ur²) and ur = 100·Pk/S: the reactive drop across the leakage reactance grows with ' +
    'the load squared. Error when the resistive part ur is not below uk.',
  params: LEAK_PARAMS,
  result: { unit: 'kvar', doc: 'reactive power absorbed (≥ 0)' },
  source: { kind: 'published', ref: 'IEC 60076-1 (short-circuit impedance and load loss); uk² = ur² + ux²' },
  examples: [
    {
      args: [1000, 6, 1000, 7.6],
      expect: 59.52,
      tol: 2e-4,
      note: 'derived check: 1 000 kVA, uk 6 %, Pk 7.6 kW (EU 548/2014 from memory) → ux 5.952 %, 59.52 kvar at full load',
    },
    {
      args: [1000, 6, 500, 7.6],
      expect: 14.88,
      tol: 2e-4,
      note: 'the same at half load: 14.88 kvar (recomputed in the tests)',
    },
    {
      args: [1600, 6, 1200],
      expect: 54,
      note: 'Pk omitted: all of uk reactive, 0.06·1600·0.75² (recomputed in the tests)',
    },
    {
      args: [100, 4, 50, 5],
      expect: { error: 'argument 4 (pk_kw) must be below uk·S/100' },
      note: 'ur = 5 % is not below uk = 4 %',
    },
  ],
  check: ([s, uk, , pk]) =>
    transformerResistancePct(num(s), num(pk)) >= num(uk)
      ? relation.belowLimit(
          argAt(LEAK_PARAMS, 3, num(pk)),
          'uk·S/100',
          (num(uk) * num(s)) / 100,
          'the resistive part ur = 100·Pk/S must be below uk',
        )
      : undefined,
  compute: ([s, uk, sl, pk]) => transformerLeakageKvar(num(s), num(uk), num(sl), num(pk)),
  expand: ([s, uk, sl, pk]) => `SQRT(POWER(${uk},2)-POWER(100*${pk}/${s},2))/100*${s}*POWER(${sl}/${s},2)`,
  expandGuards: ([s, uk, , pk]) => [`100*${pk}/${s}>=${uk}`],
});

export const KW_XFMR_LOSS = defineFunction({
  name: 'KW.XFMR.LOSS',
  family: FAMILY,
  summary: 'Losses of a transformer at a load, kW.',
  description:
    'P0 + Pk·(S_load/S)²: the no-load loss is constant, the load loss grows with the load squared (at reference temperature).',
  params: [
    S,
    { name: 'p0_kw', unit: 'kW', doc: 'no-load loss', domain: { lo: 0 } },
    { name: 'pk_kw', unit: 'kW', doc: 'load loss at rated current', domain: { lo: 0 } },
    S_LOAD,
  ],
  result: { unit: 'kW', doc: 'active power lost (≥ 0)' },
  source: { kind: 'published', ref: 'IEC 60076-1 (no-load and load loss); EU Regulation 548/2014 Annex I' },
  examples: [
    {
      args: [1000, 0.693, 7.6, 500],
      expect: 2.593,
      note: '1 000 kVA Tier 2 losses (EU 548/2014, from memory) at half load: 0.693 + 7.6/4',
    },
    {
      args: [2500, 1.575, 18.5, 2000],
      expect: 13.415,
      note: '2 500 kVA Tier 2 losses (EU 548/2014, from memory) at 80 % load',
    },
    {
      args: [0, 0.693, 7.6, 500],
      expect: { error: 'argument 1 (s_kva) must be > 0; got 0' },
      note: 'no rating',
    },
  ],
  compute: ([s, p0, pk, sl]) => transformerLossKw(num(s), num(p0), num(pk), num(sl)),
  expand: ([s, p0, pk, sl]) => `${p0}+${pk}*POWER(${sl}/${s},2)`,
});

/** Nested IF over the same table the compute uses, so both switch at the same ratings. */
function ukMinText(s: string): string {
  return MIN_IMPEDANCE_TABLE.reduceRight(
    (inner, [maxKva, uk]) => `IF(${s}<=${formatNumber(maxKva)},${formatNumber(uk)},${inner})`,
    formatNumber(MIN_IMPEDANCE_ABOVE_TABLE),
  );
}

export const XFMR_UKMIN = defineFunction({
  name: 'XFMR.UKMIN',
  family: FAMILY,
  summary: 'Minimum short-circuit impedance of a two-winding transformer by rated power, %.',
  description:
    'IEC 60076-5 Table 1: 4.0 % up to 630 kVA; 5.0 % to 1 250; 6.0 % to 2 500; 7.0 % to 6 300; 8.0 % to 25 000; 10.0 % to 40 000; ' +
    '11.0 % to 63 000; 12.5 % above (the table ends at 100 MVA; above it the value is agreed with the maker). ' +
    'Check the values against the edition of the standard you work to.',
  params: [S],
  result: { unit: '%', doc: 'minimum uk' },
  source: { kind: 'from memory', ref: 'IEC 60076-5 Table 1 (first row read, later rows from memory)' },
  examples: [
    { args: [630], expect: 4, note: 'IEC 60076-5 Table 1, up to 630 kVA (published, read)' },
    { args: [1000], expect: 5, note: 'IEC 60076-5 Table 1, 631–1 250 kVA (from memory)' },
    { args: [40000], expect: 10, note: 'IEC 60076-5 Table 1, 25 001–40 000 kVA (from memory)' },
    { args: [-5], expect: { error: 'argument 1 (s_kva) must be > 0; got -5' }, note: 'no rating' },
  ],
  compute: ([s]) => transformerMinImpedancePct(num(s)),
  expand: ([s]) => ukMinText(s as string),
});
