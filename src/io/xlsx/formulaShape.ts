// A formula's shape: its text with each relative row number written as an offset from the
// formula's own row. Rows of a table repeat a handful of shapes, so a conversion done once per
// shape (catalogue expansion, storage names) serves every row: the export stays fast on big sites.

/**
 * Text literals and quoted sheet names (group 1, left exactly as they are), or a cell address's
 * column, '$' and row (groups 2-4), not part of a name, a function call or a sheet name.
 */
const PART =
  /("(?:[^"]|"")*"?|'(?:[^']|'')*'?)|(?<![A-Za-z0-9_.$])(\$?[A-Za-z]{1,3})(\$?)(\d+)(?![A-Za-z0-9_.(!])/g;
// eslint-disable-next-line no-control-regex -- NUL and SOH delimit our own placeholders
const OFFSET = /\u0000(-?\d+)\u0001/g;

export function toShape(formula: string, row1: number): string {
  return formula.replace(PART, (m, literal: string | undefined, col: string, abs: string, row: string) =>
    literal !== undefined || abs ? m : `${col}\u0000${Number(row) - row1}\u0001`,
  );
}

export function fromShape(shape: string, row1: number): string {
  return shape.replace(OFFSET, (_, k: string) => String(row1 + Number(k)));
}

/**
 * A shape split once into its fixed texts and row offsets, so that writing it out for each row
 * is a plain concatenation (no pattern matching on long formulas row after row).
 */
export interface ShapeTemplate {
  /** Fixed texts; one more than the offsets. */
  readonly texts: readonly string[];
  readonly offsets: readonly number[];
}

export function compileShape(shape: string): ShapeTemplate {
  const texts: string[] = [];
  const offsets: number[] = [];
  let last = 0;
  for (const m of shape.matchAll(OFFSET)) {
    texts.push(shape.slice(last, m.index));
    offsets.push(Number(m[1]));
    last = (m.index as number) + m[0].length;
  }
  texts.push(shape.slice(last));
  return { texts, offsets };
}

/** The same as fromShape(shape, row1), from the compiled shape. */
export function renderShape(t: ShapeTemplate, row1: number): string {
  let out = t.texts[0] as string;
  for (let i = 0; i < t.offsets.length; i++)
    out += String(row1 + (t.offsets[i] as number)) + (t.texts[i + 1] as string);
  return out;
}
