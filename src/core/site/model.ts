// The site as an estimator describes it: settings plus an equipment list in the interchange
// columns (one row per item). Pure data; parsing, validation and roll-up live beside this file.
// Which kinds exist and which columns each needs is the kind registry's (src/core/kinds).
import { COLUMN_SPECS, kindNames } from '../kinds/index.ts';

/** A kind's name as registered (motor, load, transformer ...); unknown names are refused when read. */
export type EquipmentKind = string;

/** The built-in kind names, in sheet order (the registry may hold more). */
export const EQUIPMENT_KINDS: readonly string[] = kindNames();

/** Numeric interchange columns (blank = not given). */
export const NUMERIC_COLUMNS: readonly string[] = COLUMN_SPECS.filter((c) => c.type === 'number').map(
  (c) => c.key,
);
export type NumericColumn = string;
export const TEXT_COLUMNS: readonly string[] = COLUMN_SPECS.filter((c) => c.type === 'text').map(
  (c) => c.key,
);
export type TextColumn = string;

/** One equipment row. `loads` holds the `load:<case>` columns by case name. */
export interface EquipmentRow {
  /** 1-based row number in the source (header = row 1 in a CSV/xlsx), for messages. */
  readonly row: number;
  readonly tag: string;
  readonly description?: string;
  readonly bus: string;
  readonly kind: EquipmentKind;
  readonly to_bus?: string;
  /** What feeds a motor or what a load is (src/core/kinds/supply.ts), as typed; blank = the default. */
  readonly supply?: string;
  readonly values: Readonly<Partial<Record<NumericColumn, number>>>;
  readonly loads: Readonly<Record<string, number>>;
}

/** The utility's requirement at the point of connection. */
export type Requirement = (
  | {
      readonly kind: 'cosphi';
      readonly target: number;
      /** Lagging only: the tariff charges drawn kvar alone and sets no leading limit. */
      readonly lagOnly?: boolean;
    }
  | { readonly kind: 'tanphi'; readonly lagMax: number; readonly leadMax: number }
) & {
  /**
   * The active power the limits are referred to at the point of connection, kW: for a site that
   * generates, its rated (registered) power, so the kvar allowed stays the same at night. Absent:
   * the site's own |P| in each case.
   */
  readonly refKw?: number;
};

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
