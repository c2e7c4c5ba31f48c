// The interchange columns of an equipment list: one home for each column's key (as in a CSV
// header), the header the workbook shows, its number format, width and what it means in words
// (for the import's mapping choices and the reference). Kinds and sheets pick from these.

export interface ColumnSpec {
  /** Interchange key, e.g. 'p_kw' (CSV header, site file field). */
  readonly key: string;
  /** Header text on the equipment sheets, e.g. 'Rated output (kW)'. */
  readonly header: string;
  /** What the column means, in words. */
  readonly words: string;
  readonly type: 'text' | 'number';
  readonly format?: string;
  readonly width: number;
  /** Holds a fraction: "95%" typed in a list means 0.95. */
  readonly fraction?: boolean;
}

const KV = '0.0##';

const text = (key: string, header: string, width: number, words: string): ColumnSpec => ({
  key,
  header,
  words,
  type: 'text',
  width,
});
const number = (
  key: string,
  header: string,
  width: number,
  format: string,
  words: string,
  fraction = false,
): ColumnSpec => ({ key, header, words, type: 'number', format, width, ...(fraction ? { fraction } : {}) });

/** Every interchange column, in the order a list usually gives them. */
export const COLUMN_SPECS: readonly ColumnSpec[] = [
  text('tag', 'Tag', 12, 'Unique tag of the item'),
  text('description', 'Description', 24, 'Free text'),
  text('bus', 'Bus', 12, 'Bus the item is connected to (a transformer or line: its upstream bus)'),
  text('kind', 'Kind', 11, 'Kind of equipment'),
  text('to_bus', 'Feeds bus', 12, 'Bus a transformer, line or feeder cable feeds'),
  text(
    'supply',
    'Supply',
    14,
    'What feeds a motor (direct-on-line when blank, star-delta, soft starter, VSD 6-pulse, VSD AFE) or what a load is (linear when blank, rectifier/UPS, electronic lighting, VSD 6-pulse)',
  ),
  number('qty', 'Qty', 6, '0', 'Installed quantity'),
  number('running', 'Running', 8, '0', 'Units in service in the cases'),
  number('p_kw', 'P (kW)', 10, '0.0', 'Rated active power (kW); a motor: rated output'),
  number('eff', 'Efficiency', 9, '0.000', 'Motor efficiency (0–1)', true),
  number('cos_phi', 'cos φ', 7, '0.000', 'Power factor (0–1)', true),
  number('load', 'Load (default)', 9, '0.00', 'Load factor in the first case', true),
  number('i0_pct', 'No-load current (%)', 10, '0.0', 'No-load current, % of rated current'),
  number('s_kva', 'Rating (kVA)', 10, '0', 'Transformer rated power (kVA)'),
  number('uk_pct', 'uk (%)', 7, '0.00', 'Transformer short-circuit impedance (%)'),
  number('p0_kw', 'No-load loss (kW)', 10, '0.00', 'Transformer no-load loss (kW)'),
  number('pk_kw', 'Load loss (kW)', 10, '0.00', 'Transformer load loss at rated current (kW)'),
  number('u_kv', 'U (kV)', 8, KV, 'Operating voltage, line to line (kV)'),
  number('c_uf_km', 'C (µF/km)', 9, '0.000', 'Cable capacitance per phase (µF/km)'),
  number('len_km', 'Length (km)', 9, '0.00', 'Route length (km)'),
  number('l_mh_km', 'L (mH/km)', 9, '0.000', 'Line inductance per phase (mH/km)'),
  number('c_nf_km', 'C (nF/km)', 9, '0.0', 'Line capacitance per phase (nF/km)'),
  number(
    'r_ohm_km',
    'R (Ω/km)',
    9,
    '0.0000',
    'Line or feeder cable conductor resistance per phase (Ω/km); blank: its kW losses are not counted',
  ),
  number(
    'cu_mm2',
    'Cu (mm²)',
    10,
    '0.#',
    'Copper conductor cross-section (mm², a standard IEC 60228 size); used for R when R is blank',
  ),
  number(
    'al_mm2',
    'Al (mm²)',
    10,
    '0.#',
    'Aluminium conductor cross-section (mm², a standard IEC 60228 size); used for R when R is blank',
  ),
  number(
    'theta_c',
    'θ conductor (°C)',
    9,
    '0',
    'Conductor temperature for R from the cross-section (°C; blank: 20 °C, the table value)',
  ),
  number(
    'x_ohm_km',
    'X (Ω/km)',
    9,
    '0.0000',
    'Feeder cable series reactance per phase (Ω/km); blank: its series kvar (3·I²·X) is not counted',
  ),
  number(
    'i_rated_a',
    'Rated current (A)',
    9,
    '0',
    "Line or feeder cable current rating per phase as installed (A, maker's or IEC 60287 rating); blank: no loading or overload check",
  ),
  number('q_kvar', 'Rated output (kvar)', 10, '0.0', 'Capacitor or reactor nameplate (kvar)'),
  number('u_rated_kv', 'Rated voltage (kV)', 9, KV, 'Capacitor or reactor rated voltage (kV)'),
  number('p_pct', 'Detuning p (%)', 9, '0.00', 'Detuning reactor, % of the capacitor reactance'),
];

const BY_KEY = new Map(COLUMN_SPECS.map((c) => [c.key, c]));

/** A column by key; throws for a key no kind declares (a programming error, not user input). */
export function columnSpec(key: string): ColumnSpec {
  const c = BY_KEY.get(key);
  if (!c) throw new Error(`no interchange column "${key}"`);
  return c;
}

/** Register a column a new kind brings (no-op for a key already known with the same type). */
export function registerColumn(spec: ColumnSpec): void {
  const known = BY_KEY.get(spec.key);
  if (known && known.type !== spec.type)
    throw new Error(`column "${spec.key}" is already a ${known.type} column`);
  if (!known) {
    BY_KEY.set(spec.key, spec);
    (COLUMN_SPECS as ColumnSpec[]).push(spec);
  }
}

export function isNumericColumn(key: string): boolean {
  return BY_KEY.get(key)?.type === 'number';
}

export function isTextColumn(key: string): boolean {
  return BY_KEY.get(key)?.type === 'text';
}
