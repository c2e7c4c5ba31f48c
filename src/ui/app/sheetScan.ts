// Reading a sheet's values in bulk: the error cells (for the status bar's count and jump) and
// the numbers of a selection (for its sum and mean).
import type { WorkbookSession } from '../model/session.ts';
import type { Selection } from '../grid/gridView.ts';

function isError(v: unknown): boolean {
  return typeof v === 'object' && v !== null && 'type' in v && 'value' in v;
}

/** [row, col] of every error cell, in reading order. */
export function scanErrors(session: WorkbookSession, sheetId: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  if (!session.sheetIds().includes(sheetId)) return out;
  const values = session.engine.getSheetValues(sheetId);
  values.forEach((row, r) => row.forEach((v, c) => {
    if (isError(v)) out.push([r, c]);
  }));
  return out;
}

export const SUMMARY_CELL_LIMIT = 20_000;

export function selectionNumbers(session: WorkbookSession, sel: Selection): number[] {
  const cells = (sel.bottom - sel.top + 1) * (sel.right - sel.left + 1);
  if (cells < 2 || cells > SUMMARY_CELL_LIMIT) return [];
  const out: number[] = [];
  for (let row = sel.top; row <= sel.bottom; row++) {
    for (let col = sel.left; col <= sel.right; col++) {
      const v = session.engine.getCellValue({ sheet: sel.sheetId, row, col });
      if (typeof v === 'number') out.push(v);
    }
  }
  return out;
}
