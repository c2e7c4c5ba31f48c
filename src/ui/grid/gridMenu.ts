// Row and fill commands, from the grid's right-click menu, the keyboard and the menu bar.
import type { WorkbookSession } from '../model/session.ts';

/**
 * The selected block the commands act on. The grid's own Selection has this shape; it is written
 * out here so the commands do not import the grid view, which imports them (through its menu).
 */
export interface BlockSelection {
  readonly sheetId: number;
  /** The active cell. */
  readonly row: number;
  readonly col: number;
  readonly top: number;
  readonly left: number;
  readonly bottom: number;
  readonly right: number;
}

export interface CommandHost {
  readonly session: WorkbookSession;
  selection(): BlockSelection | undefined;
  select(row: number, col: number, row2?: number, col2?: number): void;
}

export function insertRows(host: CommandHost, where: 'above' | 'below'): void {
  const sel = host.selection();
  if (!sel) return;
  const count = sel.bottom - sel.top + 1;
  const at = where === 'above' ? sel.top : sel.bottom + 1;
  host.session.insertRows(sel.sheetId, at, count);
  host.select(at, sel.left, at + count - 1, sel.right);
}

export function deleteRows(host: CommandHost): void {
  const sel = host.selection();
  if (!sel) return;
  host.session.removeRows(sel.sheetId, sel.top, sel.bottom - sel.top + 1);
  host.select(sel.top, sel.col);
}

/** Fill down: the top row of the selection into the rest; with one row selected, the row above into it. */
export function fillDown(host: CommandHost): boolean {
  const sel = host.selection();
  if (!sel) return false;
  const sheet = sel.sheetId;
  const sourceRow = sel.bottom > sel.top ? sel.top : sel.top - 1;
  if (sourceRow < 0) return false;
  const targetTop = sel.bottom > sel.top ? sel.top + 1 : sel.top;
  host.session.fill(
    { start: { sheet, row: sourceRow, col: sel.left }, end: { sheet, row: sourceRow, col: sel.right } },
    { start: { sheet, row: targetTop, col: sel.left }, end: { sheet, row: sel.bottom, col: sel.right } },
  );
  return true;
}

export function clearCells(host: CommandHost): void {
  const sel = host.selection();
  if (!sel) return;
  const cells = [];
  for (let row = sel.top; row <= sel.bottom; row++)
    for (let col = sel.left; col <= sel.right; col++) cells.push({ row, col, content: null });
  host.session.setCells(sel.sheetId, cells);
}

/** Sort the sheet's rows below the header by the active cell's column; the same cell stays selected. */
export function sortRows(host: CommandHost, descending: boolean): void {
  const sel = host.selection();
  if (!sel) return;
  host.session.sortRows(sel.sheetId, sel.col, descending);
  host.select(sel.row, sel.col);
}
