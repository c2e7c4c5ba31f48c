// What the engine does not hold about sheets: their order and their column descriptions. Kept as
// immutable snapshots beside the engine's own undo stack, one entry per user action, so undoing
// a sheet deletion brings back the sheet in its place with its headers, formats and widths.
import type { CellChoice, CellMark, ColumnInfo } from '../../core/workbook/document.ts';

export type { CellChoice, CellMark };

export interface SheetMeta {
  readonly columns?: readonly ColumnInfo[];
  readonly purpose?: string;
  readonly choices?: readonly CellChoice[];
  readonly marks?: readonly CellMark[];
}

const isCell = (v: unknown): v is { row: number; col: number } =>
  typeof v === 'object' &&
  v !== null &&
  Number.isInteger((v as { row?: unknown }).row) &&
  Number.isInteger((v as { col?: unknown }).col) &&
  (v as { row: number }).row >= 0 &&
  (v as { col: number }).col >= 0;

function choicesOf(v: unknown): CellChoice[] {
  if (!Array.isArray(v)) return [];
  return v.filter(
    (c): c is CellChoice =>
      isCell(c) &&
      Array.isArray((c as CellChoice).options) &&
      (c as CellChoice).options.every((o) => typeof o === 'string') &&
      typeof (c as CellChoice).message === 'string',
  );
}

function marksOf(v: unknown): CellMark[] {
  if (!Array.isArray(v)) return [];
  return v.filter(
    (m): m is CellMark =>
      isCell(m) &&
      ['assumed', 'override', 'proposed'].includes((m as CellMark).kind) &&
      typeof (m as CellMark).note === 'string',
  );
}

/**
 * A sheet's description as a document carries it. Choices and marks are optional extras a
 * document may carry beside its columns; malformed entries are dropped, never trusted.
 */
export function metaFromDoc(sheet: {
  readonly columns?: readonly ColumnInfo[];
  readonly purpose?: string;
  readonly choices?: unknown;
  readonly marks?: unknown;
}): SheetMeta {
  const choices = choicesOf(sheet.choices);
  const marks = marksOf(sheet.marks);
  return {
    ...(sheet.columns ? { columns: sheet.columns } : {}),
    ...(sheet.purpose ? { purpose: sheet.purpose } : {}),
    ...(choices.length > 0 ? { choices } : {}),
    ...(marks.length > 0 ? { marks } : {}),
  };
}

/** The choices and marks of a sheet, to write back beside its columns. */
export function metaExtras(m: SheetMeta): Pick<SheetMeta, 'choices' | 'marks'> {
  return {
    ...(m.choices && m.choices.length > 0 ? { choices: m.choices } : {}),
    ...(m.marks && m.marks.length > 0 ? { marks: m.marks } : {}),
  };
}

export interface Layout {
  /** Engine sheet ids in tab order. */
  readonly order: readonly number[];
  readonly meta: ReadonlyMap<number, SheetMeta>;
}

/** Marks after rows were inserted (count > 0) or removed (count < 0) at `at`: they stay with their cells. */
export function marksAfterRows(marks: readonly CellMark[], at: number, count: number): CellMark[] {
  return marks.flatMap((m) => {
    if (m.row < at) return [m];
    if (count < 0 && m.row < at - count) return [];
    return [{ ...m, row: m.row + count }];
  });
}

/** Marks after rows were reordered: `order[i]` is the old row now at row i (0-based within `first`…). */
export function marksAfterOrder(
  marks: readonly CellMark[],
  first: number,
  order: readonly number[],
): CellMark[] {
  const now = new Map(order.map((from, i) => [from + first, i + first]));
  return marks.map((m) => {
    const row = now.get(m.row);
    return row === undefined ? m : { ...m, row };
  });
}

/** Marks after rows moved to other rows: `moves` maps an old row to its new one (undefined: gone). */
export function marksAfterMoves(
  marks: readonly CellMark[],
  moves: ReadonlyMap<number, number | undefined>,
): CellMark[] {
  return marks.flatMap((m) => {
    if (!moves.has(m.row)) return [m];
    const row = moves.get(m.row);
    return row === undefined ? [] : [{ ...m, row }];
  });
}
