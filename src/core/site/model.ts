// The site as an estimator describes it: settings plus an equipment list in the interchange
// columns of the design (one row per item). Pure data; parsing, validation and roll-up live
// beside this file.

export const EQUIPMENT_KINDS = [
  'motor',
  'load',
  'generator',
  'transformer',
  'cable',
  'line',
  'capacitor',
  'reactor',
] as const;
export type EquipmentKind = (typeof EQUIPMENT_KINDS)[number];

/** Numeric interchange columns (blank = not given). */
export const NUMERIC_COLUMNS = [
  'qty',
  'running',
  'p_kw',
  'eff',
  'cos_phi',
  'load',
  'i0_pct',
  's_kva',
  'uk_pct',
  'p0_kw',
  'pk_kw',
  'u_kv',
  'c_uf_km',
  'len_km',
  'l_mh_km',
  'c_nf_km',
  'q_kvar',
  'u_rated_kv',
  'p_pct',
] as const;
export type NumericColumn = (typeof NUMERIC_COLUMNS)[number];
export const TEXT_COLUMNS = ['tag', 'description', 'bus', 'kind', 'to_bus'] as const;
export type TextColumn = (typeof TEXT_COLUMNS)[number];

/** One equipment row. `loads` holds the `load:<case>` columns by case name. */
export interface EquipmentRow {
  /** 1-based row number in the source (header = row 1 in a CSV/xlsx), for messages. */
  readonly row: number;
  readonly tag: string;
  readonly description?: string;
  readonly bus: string;
  readonly kind: EquipmentKind;
  readonly to_bus?: string;
  readonly values: Partial<Record<NumericColumn, number>>;
  readonly loads: Readonly<Record<string, number>>;
}

/** The utility's requirement at the point of connection. */
export type Requirement =
  | { readonly kind: 'cosphi'; readonly target: number }
  | { readonly kind: 'tanphi'; readonly lagMax: number; readonly leadMax: number };

export interface SiteSettings {
  readonly name: string;
  readonly hz: 50 | 60;
  /** Operating cases in order; the first is the default case (the `load` column). */
  readonly cases: readonly string[];
  readonly requirement: Requirement;
  /** Short-circuit power of the supply at the point of connection, MVA (for resonance). */
  readonly sscMva?: number;
  readonly notes?: readonly string[];
}

export interface Site {
  readonly settings: SiteSettings;
  readonly equipment: readonly EquipmentRow[];
}
