// The gate in front of storage and the native file: a workbook is written or opened only when
// its shape is right. Every problem says where (sheet, row, column) and what was found.
import type { ColumnInfo, SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';
import { a1 } from './address.ts';
import { MAX_SHEET_NAME } from './sheetNames.ts';
import {
  MAX_EQUIPMENT_ROWS,
  MAX_SHEET_COLUMNS,
  MAX_SHEET_ROWS,
  tooManyText,
  workbookEquipmentRows,
} from '../../core/site/limits.ts';
import { equipmentSheets } from '../../core/kinds/index.ts';

/** Rows and columns are the engine's limits (the supported size, src/core/site/limits.ts). */
export const LIMITS = {
  sheets: 200,
  rows: MAX_SHEET_ROWS,
  cols: MAX_SHEET_COLUMNS,
  cellText: 32_767,
} as const;

type Problems = string[];

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function checkCells(sheet: string, cells: unknown, out: Problems): void {
  if (!Array.isArray(cells)) return void out.push(`Sheet "${sheet}": cells must be a list of rows.`);
  if (cells.length > LIMITS.rows)
    return void out.push(`Sheet "${sheet}": ${cells.length} rows; at most ${LIMITS.rows} are allowed.`);
  for (let r = 0; r < cells.length && out.length < 20; r++) {
    const row: unknown = cells[r];
    if (!Array.isArray(row)) {
      out.push(`Sheet "${sheet}", row ${r + 1}: must be a list of cells.`);
      continue;
    }
    if (row.length > LIMITS.cols) {
      out.push(`Sheet "${sheet}", row ${r + 1}: ${row.length} columns; at most ${LIMITS.cols}.`);
      continue;
    }
    for (let c = 0; c < row.length; c++) {
      const v: unknown = row[c];
      const ok =
        v === null ||
        typeof v === 'boolean' ||
        typeof v === 'string' ||
        (typeof v === 'number' && Number.isFinite(v));
      if (!ok)
        out.push(
          `Sheet "${sheet}", cell ${a1(r, c)}: ${v === undefined ? 'a hole in the row' : `a value of type ${typeof v}`}; expected a number, text, TRUE/FALSE or blank.`,
        );
      else if (typeof v === 'string' && v.length > LIMITS.cellText)
        out.push(
          `Sheet "${sheet}", cell ${a1(r, c)}: text of ${v.length} characters; at most ${LIMITS.cellText}.`,
        );
    }
  }
}

function checkColumns(sheet: string, columns: unknown, out: Problems): void {
  if (columns === undefined) return;
  if (!Array.isArray(columns)) return void out.push(`Sheet "${sheet}": columns must be a list.`);
  columns.forEach((c: unknown, i) => {
    const col = c as Partial<ColumnInfo>;
    if (!isRecord(c) || typeof col.header !== 'string')
      out.push(`Sheet "${sheet}", column ${i + 1}: needs a header text.`);
    else if (col.width !== undefined && !(typeof col.width === 'number' && col.width > 0 && col.width < 500))
      out.push(
        `Sheet "${sheet}", column ${i + 1}: width must be a number of characters in (0, 500); got ${String(col.width)}.`,
      );
  });
}

/** Typed-over cells: a list of [row, col] pairs inside the sheet's limits. */
function checkOverrides(sheet: string, overrides: unknown, out: Problems): void {
  if (overrides === undefined) return;
  if (!Array.isArray(overrides))
    return void out.push(`Sheet "${sheet}": overrides must be a list of [row, column] pairs.`);
  overrides.forEach((o: unknown, i) => {
    const ok =
      Array.isArray(o) &&
      o.length === 2 &&
      o.every((n: unknown) => Number.isInteger(n) && (n as number) >= 0) &&
      (o[0] as number) < LIMITS.rows &&
      (o[1] as number) < LIMITS.cols;
    if (!ok)
      out.push(
        `Sheet "${sheet}", override ${i + 1}: must be [row, column] with whole numbers in range; got ${JSON.stringify(o)}.`,
      );
  });
}

/** All problems, or [] when the value is a valid WorkbookDoc. */
export function workbookProblems(doc: unknown): string[] {
  const out: Problems = [];
  if (!isRecord(doc)) return ['Not a Kvar Ledger workbook: expected a JSON object.'];
  if (doc.format !== 'kvar-ledger-workbook')
    return [
      `Not a Kvar Ledger workbook: "format" is ${JSON.stringify(doc.format) ?? 'missing'}; expected "kvar-ledger-workbook".`,
    ];
  if (doc.version !== 1 && doc.version !== 2)
    out.push(`Unsupported workbook version ${JSON.stringify(doc.version)}; this app reads versions 1 and 2.`);
  if (typeof doc.title !== 'string') out.push('The workbook title must be text.');
  const sheets = doc.sheets;
  if (!Array.isArray(sheets) || sheets.length === 0) return [...out, 'A workbook needs at least one sheet.'];
  if (sheets.length > LIMITS.sheets)
    out.push(`${sheets.length} sheets; at most ${LIMITS.sheets} are allowed.`);
  const seen = new Set<string>();
  sheets.forEach((s: unknown, i) => {
    if (!isRecord(s) || typeof s.name !== 'string' || s.name.trim() === '')
      return void out.push(`Sheet ${i + 1}: needs a name.`);
    const name = s.name;
    if (name.length > MAX_SHEET_NAME)
      out.push(`Sheet "${name}": the name is longer than ${MAX_SHEET_NAME} characters.`);
    if (seen.has(name.toLowerCase())) out.push(`Sheet "${name}" appears twice.`);
    seen.add(name.toLowerCase());
    checkCells(name, s.cells, out);
    checkColumns(name, s.columns, out);
    checkOverrides(name, s.overrides, out);
  });
  if (out.length === 0) {
    const rows = workbookEquipmentRows(
      sheets as Array<{ name: string; cells: unknown[] }>,
      equipmentSheets().map((l) => l.sheet.name),
    );
    if (rows > MAX_EQUIPMENT_ROWS)
      out.push(`The workbook has ${tooManyText('equipment rows', rows, MAX_EQUIPMENT_ROWS)}.`);
  }
  return out;
}

export function isWorkbookDoc(doc: unknown): doc is WorkbookDoc {
  return workbookProblems(doc).length === 0;
}

/** Parse the native file text; a clear message instead of an exception. */
export function parseWorkbookText(
  text: string,
): { ok: true; doc: WorkbookDoc } | { ok: false; message: string } {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    return {
      ok: false,
      message: `The file is not valid JSON (${e instanceof Error ? e.message : String(e)}).`,
    };
  }
  const problems = workbookProblems(value);
  if (problems.length > 0)
    return {
      ok: false,
      message:
        problems.slice(0, 5).join(' ') + (problems.length > 5 ? ` (and ${problems.length - 5} more)` : ''),
    };
  return { ok: true, doc: value as WorkbookDoc };
}

export type { SheetDoc };
