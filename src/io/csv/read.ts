// CSV reader after RFC 4180: quoted fields with doubled quotes, commas and line breaks inside
// quotes, an optional UTF-8 byte-order mark. The parsing itself is papaparse's; around it we keep
// three things it does not do the way an equipment list needs:
// - line ends: CR, LF and CRLF are all accepted, even mixed in one file (papaparse picks one kind
//   per file and would glue rows together); they are read as LF, inside quotes too;
// - the delimiter: lists exported in decimal-comma locales use ';' and pasted grids use tabs, so
//   it is taken from the first line (papaparse's guess reads "M1;0,86" as two comma fields);
// - errors: a quote that never closes, or text glued to a closing quote, is refused with the line
//   and character, never read leniently into a wrong row.
import Papa from 'papaparse';

export type CsvDelimiter = ',' | ';' | '\t';

export interface CsvReadOptions {
  /** Force a delimiter instead of detecting it from the first line. */
  readonly delimiter?: CsvDelimiter;
}

/** A CSV that cannot be read, with the 1-based line and column where it went wrong. */
export class CsvSyntaxError extends Error {
  constructor(
    message: string,
    readonly line: number,
    readonly column: number,
  ) {
    super(`CSV line ${line}, character ${column}: ${message}`);
    this.name = 'CsvSyntaxError';
  }
}

const BOM = '\uFEFF';

/**
 * Pick the delimiter that occurs most often outside quotes in the first line.
 * Ties (including none at all) go to ',' as RFC 4180 defines it.
 */
export function detectDelimiter(text: string): CsvDelimiter {
  const counts: Record<CsvDelimiter, number> = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of text.startsWith(BOM) ? text.slice(1) : text) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === '\n' || ch === '\r')) break;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch] += 1;
  }
  let best: CsvDelimiter = ',';
  for (const d of [';', '\t'] as const) if (counts[d] > counts[best]) best = d;
  return best;
}

/** 1-based line and character of an offset into LF-only text. */
function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = text.indexOf('\n'); i >= 0 && i < offset; i = text.indexOf('\n', i + 1)) {
    line += 1;
    lineStart = i + 1;
  }
  return { line, column: offset - lineStart + 1 };
}

/** Where the closing quote of the quoted field opened at `open` is followed by stray text. */
function afterClosingQuote(text: string, open: number): number | undefined {
  const body = /(?:[^"]|"")*"/y;
  body.lastIndex = open + 1;
  return body.exec(text) ? body.lastIndex : undefined;
}

function refuse(text: string, error: Papa.ParseError, delim: string): never {
  // papaparse's index is the first character inside the opening quote.
  const open = (error.index ?? 1) - 1;
  const glued = afterClosingQuote(text, open);
  if (error.code === 'InvalidQuotes' && glued !== undefined) {
    const at = lineAndColumn(text, glued);
    const what = JSON.stringify(text[glued]);
    throw new CsvSyntaxError(
      `unexpected ${what} after a closing quote; expected the delimiter ${JSON.stringify(delim)} or a line end`,
      at.line,
      at.column,
    );
  }
  const at = lineAndColumn(text, open);
  throw new CsvSyntaxError('a quoted field is never closed (missing ")', at.line, at.column);
}

/**
 * Read CSV text into rows of fields (strings, never trimmed: a value is what was written).
 * A final line break does not make an extra empty row; a blank line inside is one empty field.
 * Throws CsvSyntaxError for an unterminated quote or text glued to a closing quote.
 */
export function readCsv(text: string, options: CsvReadOptions = {}): string[][] {
  const src = (text.startsWith(BOM) ? text.slice(1) : text).replace(/\r\n?/g, '\n');
  if (src === '') return [];
  const delimiter = options.delimiter ?? detectDelimiter(src);
  const parsed = Papa.parse<string[]>(src, {
    delimiter,
    newline: '\n',
    quoteChar: '"',
    escapeChar: '"',
    header: false,
    dynamicTyping: false,
    skipEmptyLines: false,
  });
  const quoteError = parsed.errors.find((e) => e.type === 'Quotes');
  if (quoteError) refuse(src, quoteError, delimiter);
  const rows = parsed.data;
  if (src.endsWith('\n')) rows.pop();
  return rows;
}
