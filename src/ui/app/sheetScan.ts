// The numbers of a selection, for the status line's sum and mean.
import type { WorkbookSession } from '../model/session.ts';
import type { Selection } from '../grid/gridView.ts';

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
