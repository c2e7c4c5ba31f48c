// Remembers what this grid last put on the clipboard. When the same block comes back in a paste,
// it came from us, and the formulas are pasted (references moved) instead of their values.
import type { SimpleCellRange } from '../../engine/index.ts';
import type { CellContent } from '../../core/workbook/document.ts';

export interface ClipboardMemo {
  readonly values: readonly (readonly string[])[];
  readonly source: SimpleCellRange;
  /** A cut moves contents unchanged; a copy moves relative references. */
  readonly cut: boolean;
  readonly contents: readonly (readonly CellContent[])[];
}

export function sameBlock(a: readonly (readonly unknown[])[], b: readonly (readonly unknown[])[]): boolean {
  if (a.length !== b.length) return false;
  return a.every((row, r) => {
    const other = b[r] as readonly unknown[];
    return row.length === other.length && row.every((v, c) => String(v ?? '') === String(other[c] ?? ''));
  });
}

/** A pasted block of text as a rectangle (rows padded to the widest). */
export function rectangular(data: readonly (readonly unknown[])[]): string[][] {
  const width = data.reduce((m, r) => Math.max(m, r.length), 0);
  return data.map((r) =>
    Array.from({ length: width }, (_, c) => (r[c] === null || r[c] === undefined ? '' : String(r[c]))),
  );
}
