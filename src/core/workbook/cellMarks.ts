// A cell mark with a value holds only while the cell still contains that value: typing over an
// assumed value ends the assumption. One rule for the grid, Checks and the export.
import type { CellContent, CellMark, SheetDoc } from './document.ts';

/** Does the cell's content still say what was marked? Numbers compare as numbers, text trimmed. */
export function sameContent(a: CellContent | undefined, b: CellContent | undefined): boolean {
  if (a === b) return true;
  if (typeof a === 'number' || typeof b === 'number')
    return Number(a) === Number(b) && String(a).trim() !== '';
  return String(a ?? '').trim() === String(b ?? '').trim();
}

/** Does a mark still hold for a cell whose content is `content`? */
export function markHolds(mark: CellMark, content: CellContent | undefined): boolean {
  return mark.value === undefined || sameContent(mark.value, content);
}

/** The assumed-value marks of a sheet that still hold, in row order. */
export function heldAssumptions(sheet: SheetDoc): CellMark[] {
  return (sheet.marks ?? [])
    .filter((m) => m.kind === 'assumed' && markHolds(m, sheet.cells[m.row]?.[m.col] ?? null))
    .sort((a, b) => a.row - b.row || a.col - b.col);
}

/** The assumed-value mark of a cell: its note names the basis and the source. */
export function assumedMark(row: number, col: number, value: number, note: string): CellMark {
  return { row, col, kind: 'assumed', note, value };
}

/** The proposed-value marks of a sheet that still hold, in row order. */
export function heldProposals(sheet: SheetDoc): CellMark[] {
  return (sheet.marks ?? [])
    .filter((m) => m.kind === 'proposed' && markHolds(m, sheet.cells[m.row]?.[m.col] ?? null))
    .sort((a, b) => a.row - b.row || a.col - b.col);
}

/** The proposed-value mark of a cell: its note says what the design proposed and when. */
export function proposedMark(row: number, col: number, value: CellContent, note: string): CellMark {
  return { row, col, kind: 'proposed', note, value };
}
