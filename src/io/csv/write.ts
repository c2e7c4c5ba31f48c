// CSV export of any table, safe to open in a spreadsheet program: text that a spreadsheet would
// take for a formula (starting with = + - @, tab or carriage return) gets a leading apostrophe
// (the common practice recommended by OWASP for CSV injection), numbers stay numbers, and
// fields are quoted per RFC 4180 when they hold the separator, a quote or a line break.

/** A cell value; an error value (e.g. the engine's, whose `value` is '#N/A') is written as its code. */
export type CsvValue = string | number | boolean | null | undefined | { readonly value: string };

export interface CsvWriteOptions {
  /** Field separator; default ','. */
  readonly separator?: ',' | ';' | '\t';
  /** Line ending; default '\r\n' (RFC 4180). */
  readonly eol?: '\r\n' | '\n';
  /** Start with a UTF-8 byte-order mark so that some spreadsheet programs detect UTF-8; default false. */
  readonly bom?: boolean;
}

/** Characters that make a spreadsheet program read a cell as a formula or command (and their
 * full-width forms, which some programs treat alike). */
const TRIGGER = /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;
/** A plain decimal number written as text is harmless and stays as it is ("-5", "+1.5e3"). */
const PLAIN_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Neutralise a text that would be run as a formula. Plain numbers in text form are left alone. */
export function neutraliseText(text: string): string {
  if (!TRIGGER.test(text) || PLAIN_NUMBER.test(text)) return text;
  return `'${text}`;
}

function fieldText(v: CsvValue): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') {
    // Non-finite numbers never reach a cell; should one arrive, write the spreadsheet error.
    return Number.isFinite(v) ? String(v) : '#NUM!';
  }
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (typeof v === 'object') return neutraliseText(String(v.value));
  return neutraliseText(v);
}

function quoteIfNeeded(text: string, separator: string): string {
  const needs =
    text.includes(separator) ||
    text.includes('"') ||
    text.includes('\n') ||
    text.includes('\r') ||
    /^\s|\s$/.test(text);
  return needs ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One CSV field: neutralised, then quoted when needed. */
export function csvField(v: CsvValue, separator: string = ','): string {
  return quoteIfNeeded(fieldText(v), separator);
}

/** A whole table to CSV text. Rows may have different lengths; nothing is padded. */
export function writeCsv(rows: ReadonlyArray<ReadonlyArray<CsvValue>>, opts: CsvWriteOptions = {}): string {
  const sep = opts.separator ?? ',';
  const eol = opts.eol ?? '\r\n';
  const body = rows.map((r) => r.map((v) => csvField(v, sep)).join(sep)).join(eol);
  return (opts.bom ? '\uFEFF' : '') + (rows.length > 0 ? body + eol : '');
}
