// CSV reader after RFC 4180: quoted fields with doubled quotes, commas and line breaks inside
// quotes, CRLF or LF line ends, an optional UTF-8 byte-order mark. Lists exported by spreadsheet
// programs in locales with a decimal comma use ';' instead of ',', and pasted grids use tabs,
// so the delimiter is detected from the first line unless given.

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

/**
 * Read CSV text into rows of fields (strings, never trimmed: a value is what was written).
 * A final line break does not make an extra empty row. Throws CsvSyntaxError for an
 * unterminated quote or text glued to a closing quote.
 */
export function readCsv(text: string, options: CsvReadOptions = {}): string[][] {
  const src = text.startsWith(BOM) ? text.slice(1) : text;
  const delim = options.delimiter ?? detectDelimiter(src);
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  // true once anything (a character, a delimiter or a quote) belongs to the current row.
  let rowStarted = false;
  let atStart = true;
  let line = 1;
  let col = 0;
  let i = 0;
  const endField = () => {
    row.push(field);
    field = '';
    atStart = true;
  };
  while (i < src.length) {
    const ch = src[i] as string;
    col += 1;
    if (ch === '"' && atStart) {
      // Quoted field: read to the closing quote; "" is a literal quote.
      const startLine = line;
      const startCol = col;
      rowStarted = true;
      i += 1;
      for (;;) {
        if (i >= src.length)
          throw new CsvSyntaxError('a quoted field is never closed (missing ")', startLine, startCol);
        const c = src[i] as string;
        i += 1;
        if (c === '"') {
          col += 1;
          if (src[i] !== '"') break;
          field += '"';
          i += 1;
          col += 1;
          continue;
        }
        if (c === '\n') {
          line += 1;
          col = 0;
        } else col += 1;
        field += c;
      }
      const next = src[i];
      if (next !== undefined && next !== delim && next !== '\n' && next !== '\r') {
        throw new CsvSyntaxError(
          `unexpected ${JSON.stringify(next)} after a closing quote; expected the delimiter or a line end`,
          line,
          col + 1,
        );
      }
      atStart = false;
      continue;
    }
    if (ch === delim) {
      rowStarted = true;
      endField();
    } else if (ch === '\r' || ch === '\n') {
      if (ch === '\r' && src[i + 1] === '\n') i += 1;
      endField();
      rows.push(row);
      row = [];
      rowStarted = false;
      line += 1;
      col = 0;
    } else {
      rowStarted = true;
      atStart = false;
      field += ch;
    }
    i += 1;
  }
  // The last row, unless the text ended with a line break (or was empty).
  if (rowStarted) {
    endField();
    rows.push(row);
  }
  return rows;
}
