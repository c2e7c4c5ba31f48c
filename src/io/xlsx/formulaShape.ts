// A formula's shape: its text with each relative row number written as an offset from the
// formula's own row. Rows of a table repeat a handful of shapes, so a conversion done once per
// shape (catalogue expansion, storage names) serves every row: the export stays fast on big sites.

/** A cell address's column and row, not part of a name, a function call or a sheet name. */
const CELL = /(?<![A-Za-z0-9_.$])(\$?[A-Za-z]{1,3})(\$?)(\d+)(?![A-Za-z0-9_.(!])/g;
/** Text literals and quoted sheet names are left exactly as they are. */
const LITERAL = /("(?:[^"]|"")*"?|'(?:[^']|'')*'?)/;
const OFFSET = /\u0000(-?\d+)\u0001/g;

export function toShape(formula: string, row1: number): string {
  return formula
    .split(LITERAL)
    .map((part, i) => (i % 2 === 1 ? part : part.replace(CELL, (m, col: string, abs: string, row: string) => (abs ? m : `${col}\u0000${Number(row) - row1}\u0001`))))
    .join('');
}

export function fromShape(shape: string, row1: number): string {
  return shape.replace(OFFSET, (_, k: string) => String(row1 + Number(k)));
}
