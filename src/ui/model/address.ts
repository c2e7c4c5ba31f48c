// Spreadsheet addresses as the user sees them: column letters and A1 references.
import { columnLetters } from '../../core/workbook/refs.ts';

export { columnLetters };

/** 'C5' for row 4, column 2 (both 0-based). */
export function a1(row: number, col: number): string {
  return `${columnLetters(col)}${row + 1}`;
}

/** A range label: 'B2' for one cell, 'B2:D9' for a block. */
export function rangeLabel(r1: number, c1: number, r2: number, c2: number): string {
  const top = Math.min(r1, r2),
    left = Math.min(c1, c2),
    bottom = Math.max(r1, r2),
    right = Math.max(c1, c2);
  return top === bottom && left === right ? a1(top, left) : `${a1(top, left)}:${a1(bottom, right)}`;
}

/** Sheet names that need quoting in a formula reference: anything but letters, digits, _ and . */
export function sheetRef(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}
