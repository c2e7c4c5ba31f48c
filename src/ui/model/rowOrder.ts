// The order of rows sorted by one column's shown values, the way spreadsheet users expect it:
// ascending puts numbers first (smallest first), then text in a natural order ("M2" before
// "M10", case and accents ignored), then errors; blank cells always last, in either direction. Equal keys keep
// their order (a stable sort), so sorting by bus after sorting by tag keeps tags in order per bus.
import type { CellValue } from '../../engine/index.ts';

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });

type Key = { rank: 0; n: number } | { rank: 1; t: string } | { rank: 2; t: string } | { rank: 3 };

function keyOf(v: CellValue): Key {
  if (v === null || v === undefined || v === '') return { rank: 3 };
  if (typeof v === 'number') return { rank: 0, n: v };
  if (typeof v === 'boolean') return { rank: 1, t: v ? 'TRUE' : 'FALSE' };
  if (typeof v === 'string') return { rank: 1, t: v };
  return { rank: 2, t: String((v as { value?: unknown }).value ?? '') };
}

function compare(a: Key, b: Key): number {
  if (a.rank !== b.rank) return a.rank - b.rank;
  if (a.rank === 0 && b.rank === 0) return a.n - b.n;
  if (a.rank === 3) return 0;
  return collator.compare((a as { t: string }).t, (b as { t: string }).t);
}

/** Indices of `values` in sorted order. Descending reverses everything but the blanks, which stay last. */
export function sortedOrder(values: readonly CellValue[], descending: boolean): number[] {
  const keys = values.map(keyOf);
  const sign = descending ? -1 : 1;
  return keys
    .map((k, i) => ({ k, i }))
    .sort((a, b) => {
      if (a.k.rank === 3 || b.k.rank === 3) return a.k.rank === 3 ? (b.k.rank === 3 ? a.i - b.i : 1) : -1;
      return sign * compare(a.k, b.k) || a.i - b.i;
    })
    .map((x) => x.i);
}
