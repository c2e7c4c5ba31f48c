// Units an imported column may be written in, and the factor that brings them to the unit of the
// interchange column they feed (kW, kvar, kVA, kV, km, µF/km, nF/km, mH/km, Ω/km, fraction, %).
import { entryOf } from '../../core/text/nameTable.ts';
import { CASE_PREFIX } from '../../core/site/parse.ts';

export type Dimension =
  | 'power'
  | 'reactive'
  | 'apparent'
  | 'voltage'
  | 'length'
  | 'capacitance'
  | 'inductance'
  | 'resistance'
  | 'fraction'
  | 'percent'
  | 'count'
  | 'text';

export interface UnitChoice {
  /** As shown to the user, e.g. 'MW', 'V', 'nF/km', '%'. Empty for plain numbers. */
  readonly label: string;
  /** Multiply a value in this unit by `factor` to get the target column's unit. */
  readonly factor: number;
}

/** Each unit with its factor to the dimension's reference unit. */
const UNITS: Readonly<
  Record<Exclude<Dimension, 'text' | 'count'>, ReadonlyArray<readonly [string, number]>>
> = {
  power: [
    ['W', 1e-3],
    ['kW', 1],
    ['MW', 1e3],
  ],
  reactive: [
    ['var', 1e-3],
    ['kvar', 1],
    ['Mvar', 1e3],
  ],
  apparent: [
    ['VA', 1e-3],
    ['kVA', 1],
    ['MVA', 1e3],
  ],
  voltage: [
    ['V', 1e-3],
    ['kV', 1],
  ],
  length: [
    ['m', 1e-3],
    ['km', 1],
  ],
  capacitance: [
    ['pF/km', 1e-6],
    ['nF/km', 1e-3],
    ['µF/km', 1],
  ],
  inductance: [
    ['µH/km', 1e-3],
    ['mH/km', 1],
    ['H/km', 1e3],
  ],
  // Resistance per length: mΩ/m is the same as Ω/km.
  resistance: [
    ['mΩ/km', 1e-3],
    ['Ω/km', 1],
    ['mΩ/m', 1],
    ['Ω/m', 1e3],
  ],
  fraction: [
    ['', 1],
    ['%', 1e-2],
  ],
  percent: [
    ['%', 1],
    ['', 100],
  ],
};

/** Spellings met in headers, lower-cased, mapped to the labels above. */
const SPELLINGS: Readonly<Record<string, string>> = {
  w: 'W',
  kw: 'kW',
  mw: 'MW',
  var: 'var',
  kvar: 'kvar',
  mvar: 'Mvar',
  kvr: 'kvar',
  va: 'VA',
  kva: 'kVA',
  mva: 'MVA',
  v: 'V',
  kv: 'kV',
  volt: 'V',
  volts: 'V',
  m: 'm',
  km: 'km',
  metre: 'm',
  meter: 'm',
  metres: 'm',
  meters: 'm',
  'pf/km': 'pF/km',
  pf_km: 'pF/km',
  'nf/km': 'nF/km',
  nf: 'nF/km',
  'µf/km': 'µF/km',
  'uf/km': 'µF/km',
  'μf/km': 'µF/km',
  µf: 'µF/km',
  uf: 'µF/km',
  μf: 'µF/km',
  'µh/km': 'µH/km',
  'uh/km': 'µH/km',
  'mh/km': 'mH/km',
  mh: 'mH/km',
  'h/km': 'H/km',
  // 'Ω'.toLowerCase() is 'ω'; the ohm sign (U+2126) lower-cases to the same letter.
  'ω/km': 'Ω/km',
  'ohm/km': 'Ω/km',
  'ohms/km': 'Ω/km',
  'mω/km': 'mΩ/km',
  'mohm/km': 'mΩ/km',
  'mω/m': 'mΩ/m',
  'mohm/m': 'mΩ/m',
  'ω/m': 'Ω/m',
  'ohm/m': 'Ω/m',
  '%': '%',
  pct: '%',
  percent: '%',
  pu: '',
  'p.u.': '',
  'p.u': '',
  fraction: '',
};

/** Reference unit of each target, as a label of its dimension. */
const TARGET_UNIT: Readonly<Record<string, readonly [Dimension, string]>> = {
  tag: ['text', ''],
  description: ['text', ''],
  bus: ['text', ''],
  kind: ['text', ''],
  to_bus: ['text', ''],
  supply: ['text', ''],
  qty: ['count', ''],
  running: ['count', ''],
  p_kw: ['power', 'kW'],
  p0_kw: ['power', 'kW'],
  pk_kw: ['power', 'kW'],
  eff: ['fraction', ''],
  cos_phi: ['fraction', ''],
  load: ['fraction', ''],
  i0_pct: ['percent', '%'],
  uk_pct: ['percent', '%'],
  p_pct: ['percent', '%'],
  s_kva: ['apparent', 'kVA'],
  q_kvar: ['reactive', 'kvar'],
  u_kv: ['voltage', 'kV'],
  u_rated_kv: ['voltage', 'kV'],
  len_km: ['length', 'km'],
  c_uf_km: ['capacitance', 'µF/km'],
  c_nf_km: ['capacitance', 'nF/km'],
  l_mh_km: ['inductance', 'mH/km'],
  r_ohm_km: ['resistance', 'Ω/km'],
  x_ohm_km: ['resistance', 'Ω/km'],
};

export function dimensionOf(target: string): Dimension {
  if (target.startsWith(CASE_PREFIX)) return 'fraction';
  return entryOf(TARGET_UNIT, target)?.[0] ?? 'text';
}

function factorIn(dim: Dimension, label: string): number | undefined {
  if (dim === 'text' || dim === 'count') return label === '' ? 1 : undefined;
  return UNITS[dim].find(([l]) => l === label)?.[1];
}

/** The units a target column can be read from, its own unit first. */
export function unitChoicesFor(target: string): UnitChoice[] {
  const dim = dimensionOf(target);
  if (dim === 'text' || dim === 'count') return [{ label: '', factor: 1 }];
  const own = target.startsWith(CASE_PREFIX) ? '' : (entryOf(TARGET_UNIT, target)?.[1] ?? '');
  const base = factorIn(dim, own) ?? 1;
  const all = UNITS[dim].map(([label, f]) => ({ label, factor: f / base }));
  return [...all.filter((u) => u.label === own), ...all.filter((u) => u.label !== own)];
}

/** The choice for a unit label (as spelled in a header or picked by the user), if it fits the target. */
export function unitFor(target: string, label: string): UnitChoice | undefined {
  const canonical = entryOf(SPELLINGS, label.trim().toLowerCase()) ?? label.trim();
  return unitChoicesFor(target).find((u) => u.label === canonical);
}

/** A header's unit spelling → the dimension it belongs to (first match), for guessing a target. */
export function dimensionOfUnit(spelling: string): Dimension | undefined {
  const label = entryOf(SPELLINGS, spelling.trim().toLowerCase());
  if (label === undefined) return undefined;
  for (const [dim, list] of Object.entries(UNITS) as Array<
    [Dimension, ReadonlyArray<readonly [string, number]>]
  >) {
    if (label !== '' && list.some(([l]) => l === label)) return dim;
  }
  return label === '' ? 'fraction' : undefined;
}

export function isKnownUnitSpelling(text: string): boolean {
  return entryOf(SPELLINGS, text.trim().toLowerCase()) !== undefined;
}

/** The target's own unit label, e.g. 'kW' for p_kw, '' for a fraction. */
export function ownUnit(target: string): UnitChoice {
  return unitChoicesFor(target)[0] as UnitChoice;
}
