// The workbook as a document: what the app shows, autosaves and saves as its native file,
// what templates become, and what the xlsx export writes. Pure data, engine-agnostic.

export interface ColumnInfo {
  /** Header text shown in the frozen header row, e.g. 'P (kW)'. */
  readonly header: string;
  /** Number format for display/export, e.g. '0.0', '0.000'; absent = general. */
  readonly format?: string;
  /** Width in characters. */
  readonly width?: number;
  /** true for computed columns (formulas the user normally does not type over). */
  readonly computed?: boolean;
}

/** A cell's content exactly as typed: a number, text, boolean, or a formula string starting with '='. */
export type CellContent = number | string | boolean | null;

export interface SheetDoc {
  readonly name: string;
  /** Row-major; row 0 is the header row when `columns` is given. */
  readonly cells: CellContent[][];
  readonly columns?: readonly ColumnInfo[];
  /** What the sheet is for, shown in the app and on the export's cover. */
  readonly purpose?: string;
}

export interface WorkbookDoc {
  readonly format: 'kvar-ledger-workbook';
  readonly version: 1;
  readonly title: string;
  readonly sheets: SheetDoc[];
}

export function emptyWorkbook(title = 'Untitled site'): WorkbookDoc {
  return { format: 'kvar-ledger-workbook', version: 1, title, sheets: [{ name: 'Site', cells: [[]] }] };
}
