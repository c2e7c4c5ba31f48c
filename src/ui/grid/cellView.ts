// How one cell reads on screen: text, kind (number, text, error ...) and the error message.
// Pure: it takes the engine's value, not the engine, so it is tested without a browser.
import type { ColumnInfo } from '../../core/workbook/document.ts';
import { neutraliseText } from '../../io/csv/write.ts';
import { formatNumber } from '../format/numberFormat.ts';

export type CellKind = 'empty' | 'number' | 'text' | 'bool' | 'error';

export interface CellView {
  readonly text: string;
  readonly kind: CellKind;
  /** For errors: the code (e.g. '#N/A') and the full message. */
  readonly error?: { readonly code: string; readonly message: string };
}

/** What the engine hands back for a cell: a value or an error object with value/message. */
export type EngineValue =
  number | string | boolean | null | undefined | { readonly value: string; readonly message: string };

export function cellView(v: EngineValue, column?: ColumnInfo): CellView {
  if (v === null || v === undefined || v === '') return { text: '', kind: 'empty' };
  if (typeof v === 'number') return { text: formatNumber(v, column?.format), kind: 'number' };
  if (typeof v === 'boolean') return { text: v ? 'TRUE' : 'FALSE', kind: 'bool' };
  if (typeof v === 'string') return { text: v, kind: 'text' };
  return {
    text: v.value,
    kind: 'error',
    error: { code: v.value, message: v.message || `the formula evaluates to ${v.value}` },
  };
}

/**
 * The value as it goes to the clipboard for other programs: full precision, no formatting. Text
 * that another program would run as a formula (=1+1, +A1, -A1, @SUM(…)) goes out with a leading
 * apostrophe, the rule the CSV writer follows (src/io/csv/write.ts).
 */
export function clipboardText(v: EngineValue): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return String(v);
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (typeof v === 'string') return neutraliseText(v);
  return v.value;
}
