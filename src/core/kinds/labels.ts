// A column's label in words, as the equipment sheets head it: for a known kind its sheet's own
// header ("Rated output (kW)" for a motor's p_kw), otherwise the interchange column's header
// ("P (kW)"). The import's mapping menus and preview use these instead of keys such as p_kw.
import { columnSpec, isNumericColumn, isTextColumn } from './columns.ts';
import { findKind } from './registry.ts';

/** The case prefix of per-case load columns (load:<case>), as the interchange format writes it. */
const CASE_PREFIX = 'load:';

export interface ColumnLabel {
  /** Short, as a sheet's header: "Rated output (kW)". */
  readonly label: string;
  /** What the column means, in a sentence: "Rated active power (kW); a motor: rated output". */
  readonly words: string;
}

export function columnLabel(key: string, kind?: string): ColumnLabel {
  if (key.startsWith(CASE_PREFIX)) {
    const c = key.slice(CASE_PREFIX.length);
    return { label: `Load: ${c}`, words: `Load factor in the case "${c}"` };
  }
  if (!isNumericColumn(key) && !isTextColumn(key)) return { label: key, words: key };
  const spec = columnSpec(key);
  const own = kind === undefined ? undefined : findKind(kind)?.sheet.inputs.find((i) => i.key === key);
  return { label: own?.header ?? spec.header, words: spec.words };
}
