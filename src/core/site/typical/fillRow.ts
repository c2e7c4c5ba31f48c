// The one rule for filling blanks with typical values, used by the page (its open workbook's
// cells), the import (the rows as they arrive) and the command line (a site read from a file).
// Motors, transformers, feeder cables and overhead lines have tables; only a blank input is filled, never a typed
// number, text or formula; and a value comes only from a typed rating (rated output, kVA, kV).
import type { NumericColumn } from '../model.ts';
import { assumeTypical } from './assume.ts';

/** What a row holds in one input: null or undefined is blank; anything else is the user's. */
export type RowCell = number | string | boolean | null | undefined;

export interface TypicalWrite {
  readonly column: NumericColumn;
  readonly value: number;
  /** The basis and source, for the cell's note: "11 kW, 4-pole, class IE3; IEC 60034-30-1 …". */
  readonly note: string;
}

export interface RowFill {
  readonly writes: readonly TypicalWrite[];
  /** Blanks that stay blank, and why ("eff: no typical value without the rated output (p_kw)"). */
  readonly notAssumed: readonly string[];
}

/** Kinds with typical-value tables. */
export const TYPICAL_KINDS: ReadonlySet<string> = new Set(['motor', 'transformer', 'feeder', 'line']);

/** The inputs the tables read or fill (motors: p_kw, eff, cos_phi, i0_pct; transformers: s_kva …; feeders: u_kv, x_ohm_km; lines: u_kv, l_mh_km, c_nf_km). */
const TABLE_INPUTS = [
  'p_kw',
  'eff',
  'cos_phi',
  'i0_pct',
  's_kva',
  'uk_pct',
  'p0_kw',
  'pk_kw',
  'u_kv',
  'x_ohm_km',
  'l_mh_km',
  'c_nf_km',
] as const;

/** "assumed 0.914 (11 kW, 4-pole, class IE3; source)" → "11 kW, 4-pole, class IE3; source". */
const basisOf = (note: string): string => note.replace(/^assumed \S+ \((.*)\)$/, '$1');

/** The typical values a row of `kind` takes for its blank inputs; `cell` reads the row by column key. */
export function typicalFillRow(kind: string, cell: (column: string) => RowCell): RowFill {
  if (!TYPICAL_KINDS.has(kind)) return { writes: [], notAssumed: [] };
  // Only numbers go to the tables; a blank input stays undefined, so it may be filled.
  const values: Partial<Record<NumericColumn, number>> = {};
  const given = new Set<string>();
  const read = (key: string) => {
    const v = cell(key);
    if (typeof v === 'number') values[key] = v;
    if (v !== null && v !== undefined) given.add(key);
  };
  for (const key of TABLE_INPUTS) read(key);
  const found = assumeTypical({ kind, values });
  return {
    // Text or a formula in the cell is the user's: never filled over.
    writes: found.assumed
      .filter((a) => !given.has(a.column))
      .map((a) => ({ column: a.column, value: a.value, note: basisOf(a.note) })),
    notAssumed: found.notAssumed.filter((why) => !given.has(why.slice(0, why.indexOf(':')))),
  };
}
