// The grid's own copy of a sheet: the contents as edit text, padded with spare rows and columns
// so there is room to type below and beside the data.
import type { CellContent } from '../../core/workbook/document.ts';
import { editText } from '../model/typedInput.ts';

export const SPARE_ROWS = 40;
export const SPARE_COLS = 4;
const MIN_ROWS = 60;
const MIN_COLS = 26;

export function gridShape(
  contents: readonly (readonly CellContent[])[],
  describedCols = 0,
): { rows: number; cols: number } {
  const widest = contents.reduce((m, r) => Math.max(m, r.length), 0);
  return {
    rows: Math.max(MIN_ROWS, contents.length + SPARE_ROWS),
    cols: Math.max(MIN_COLS, Math.max(widest, describedCols) + SPARE_COLS),
  };
}

export function gridData(contents: readonly (readonly CellContent[])[], describedCols = 0): string[][] {
  const { rows, cols } = gridShape(contents, describedCols);
  const out: string[][] = new Array<string[]>(rows);
  for (let r = 0; r < rows; r++) {
    const src = contents[r];
    const row: string[] = new Array<string>(cols);
    for (let c = 0; c < cols; c++) row[c] = src ? editText(src[c]) : '';
    out[r] = row;
  }
  return out;
}
