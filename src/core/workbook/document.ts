// The workbook as a document: what the app shows, autosaves and saves as its native file,
// what templates become, and what the xlsx export writes. Pure data, engine-agnostic.
//
// Version 2: a built-in sheet's generated cells (headers, computed columns, the Buses and
// Compensation formulas) are Kvar Ledger's and are written again from the inputs whenever the
// document is opened (src/core/workbook/render.ts), so a saved file may leave them out.
// `overrides` lists the cells in generated places that hold what the user typed instead.

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

/** A cell address in a sheet: [row, col], 0-based. */
export type CellAt = readonly [number, number];

export interface SheetDoc {
  readonly name: string;
  /** Row-major; row 0 is the header row when `columns` is given. */
  readonly cells: CellContent[][];
  readonly columns?: readonly ColumnInfo[];
  /** What the sheet is for, shown in the app and on the export's cover. */
  readonly purpose?: string;
  /** Cells in generated places whose content the user typed (kept, marked, listed by Checks). */
  readonly overrides?: readonly CellAt[];
  /** Cells that take one of a list of values. */
  readonly choices?: readonly CellChoice[];
  /** Cells whose value deserves a second look (assumed, typed over). */
  readonly marks?: readonly CellMark[];
}

/** A cell that takes one of a list of values: the grid offers them and refuses anything else. */
export interface CellChoice {
  readonly row: number;
  readonly col: number;
  readonly options: readonly string[];
  /** Why only these, shown when something else is typed. */
  readonly message: string;
}

/**
 * A cell whose value deserves a second look: 'assumed' (a typical value put in for a blank),
 * 'override' (typed over what the workbook would give) or 'proposed' (a bank size the design put
 * into a Compensation row that had only a detuning typed). With `value`, the mark holds only while
 * the cell still contains that value: typing over an assumed or proposed value ends the mark.
 */
export interface CellMark {
  readonly row: number;
  readonly col: number;
  readonly kind: 'assumed' | 'override' | 'proposed';
  readonly note: string;
  readonly value?: CellContent;
}

export interface WorkbookDoc {
  readonly format: 'kvar-ledger-workbook';
  readonly version: 1 | 2;
  readonly title: string;
  readonly sheets: SheetDoc[];
}

export const DOC_VERSION = 2;

export function emptyWorkbook(title = 'Untitled site'): WorkbookDoc {
  return { format: 'kvar-ledger-workbook', version: 2, title, sheets: [{ name: 'Site', cells: [[]] }] };
}
