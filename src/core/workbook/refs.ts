// A1-style references for the formulas the workbook builder writes. Rows and columns are
// 0-based here (as in SheetDoc.cells) and become 1-based letters and numbers in the text.

// Letters and sheet prefixes are asked for once per reference, tens of thousands of times when
// a paste rewrites every bus's sums: each is worked out once.
const letters: string[] = [];
const prefixes = new Map<string, string>();

/** 0 → A, 25 → Z, 26 → AA. */
export function columnLetters(col: number): string {
  const known = letters[col];
  if (known !== undefined) return known;
  const s = lettersOf(col);
  if (Number.isInteger(col) && col >= 0 && col < 16_384) letters[col] = s;
  return s;
}

function lettersOf(col: number): string {
  let n = col + 1;
  let s = '';
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/** Sheet name as a formula prefix: bare when it is a plain word, quoted otherwise. */
export function sheetPrefix(sheet: string): string {
  let p = prefixes.get(sheet);
  if (p === undefined) {
    p = /^[A-Za-z_][A-Za-z0-9_]*$/.test(sheet) ? `${sheet}!` : `'${sheet.replace(/'/g, "''")}'!`;
    if (prefixes.size < 1_000) prefixes.set(sheet, p);
  }
  return p;
}

/** A cell on the same sheet, relative: F12. */
export function cell(row: number, col: number): string {
  return `${columnLetters(col)}${row + 1}`;
}

/** A cell fixed in place: $F$12. */
export function absCell(row: number, col: number): string {
  return `$${columnLetters(col)}$${row + 1}`;
}

/** A cell on another sheet: Motors!F12 (or the absolute form). */
export function cellOn(sheet: string | undefined, row: number, col: number, absolute = false): string {
  const ref = absolute ? absCell(row, col) : cell(row, col);
  return sheet === undefined ? ref : sheetPrefix(sheet) + ref;
}

/** A fixed block: Motors!$C$2:$C$51 (rows and columns inclusive). */
export function rangeOn(
  sheet: string | undefined,
  row0: number,
  col0: number,
  row1: number,
  col1: number,
): string {
  const ref = `${absCell(row0, col0)}:${absCell(row1, col1)}`;
  return sheet === undefined ? ref : sheetPrefix(sheet) + ref;
}

/** A text literal inside a formula. */
export function textLiteral(text: string): string {
  return `"${text.replace(/"/g, '""')}"`;
}

/** A whole column: Motors!$C:$C (rows added below the last one are still inside). */
export function columnOn(sheet: string, col: number): string {
  const c = columnLetters(col);
  return `${sheetPrefix(sheet)}$${c}:$${c}`;
}
