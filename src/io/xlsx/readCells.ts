// Cells of an xlsx worksheet as the workbook document holds them (a number, text, TRUE/FALSE or
// a formula starting with '='), and as the fingerprint compares them.
import type { Cell, Worksheet } from 'exceljs';
import type { CellContent } from '../../core/workbook/document.ts';
import { textContent } from '../../core/text/cellText.ts';
import { fromFileFormula } from './functionNames.ts';
import type { FingerprintCell } from './metadata.ts';

/** exceljs ValueType numbers (lib/doc/enums.js), spelled out to avoid loading the library for them. */
const T = {
  Null: 0,
  Merge: 1,
  Number: 2,
  String: 3,
  Date: 4,
  Hyperlink: 5,
  Formula: 6,
  SharedString: 7,
  RichText: 8,
  Boolean: 9,
  Error: 10,
} as const;

const DAY_MS = 86_400_000;
const EPOCH_1900 = Date.UTC(1899, 11, 30);
const EPOCH_1904 = Date.UTC(1904, 0, 1);

function serialOf(d: Date, date1904: boolean): number {
  return (d.getTime() - (date1904 ? EPOCH_1904 : EPOCH_1900)) / DAY_MS;
}

function textOf(v: unknown): string {
  if (typeof v === 'string') return v;
  if (typeof v === 'object' && v !== null) {
    const o = v as { richText?: Array<{ text?: string }>; text?: unknown };
    if (Array.isArray(o.richText)) return o.richText.map((r) => r.text ?? '').join('');
    if (typeof o.text === 'string') return o.text;
    if (typeof o.text === 'object') return textOf(o.text);
  }
  return v === null || v === undefined ? '' : String(v);
}

export interface ReadCell {
  readonly content: CellContent;
  readonly print: FingerprintCell | undefined;
}

/** One cell: its content for the document and its form for the fingerprint. */
export function readCell(cell: Cell, col: number, date1904: boolean): ReadCell {
  switch (cell.type as number) {
    case T.Null:
    case T.Merge:
      return { content: null, print: undefined };
    case T.Number:
      return { content: cell.value as number, print: { col, value: cell.value as number } };
    case T.Boolean:
      return { content: cell.value as boolean, print: { col, value: cell.value as boolean } };
    case T.Date: {
      const n = serialOf(cell.value as Date, date1904);
      return { content: n, print: { col, value: n } };
    }
    case T.Error: {
      const code = (cell.value as { error?: string }).error ?? '#VALUE!';
      return { content: code, print: { col, error: code } };
    }
    case T.Formula: {
      const f = cell.formula;
      if (typeof f !== 'string' || f === '') return { content: null, print: undefined };
      return { content: fromFileFormula(f), print: { col, formula: f } };
    }
    default: {
      const text = textOf(cell.value);
      if (text === '') return { content: null, print: undefined };
      // Text stays text: where the engine would read it as a formula, number, date or truth
      // value ("=1+1", "007", "TRUE"), the leading apostrophe says so (core/text/cellText.ts).
      return { content: textContent(text), print: { col, value: text } };
    }
  }
}

export interface ReadRow {
  readonly cells: CellContent[];
  readonly prints: FingerprintCell[];
}

/** Row `r` (1-based) with trailing blanks dropped. */
export function readRow(ws: Worksheet, r: number, date1904: boolean): ReadRow {
  const row = ws.findRow(r);
  const cells: CellContent[] = [];
  const prints: FingerprintCell[] = [];
  if (!row) return { cells, prints };
  row.eachCell({ includeEmpty: false }, (cell, colNumber) => {
    const c = readCell(cell, colNumber - 1, date1904);
    if (c.content === null) return;
    while (cells.length < colNumber - 1) cells.push(null);
    cells.push(c.content);
    if (c.print) prints.push(c.print);
  });
  return { cells, prints };
}

/** A whole sheet as rows of contents, trailing blank rows dropped. */
export function readSheet(ws: Worksheet, date1904: boolean): CellContent[][] {
  const rows: CellContent[][] = [];
  for (let r = 1; r <= ws.rowCount; r++) rows.push(readRow(ws, r, date1904).cells);
  while (rows.length > 0 && (rows[rows.length - 1] as CellContent[]).length === 0) rows.pop();
  return rows;
}
