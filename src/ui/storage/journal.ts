// The write-ahead record of edits: between two full saves of the workbook, each edit is appended
// to the browser store as a small entry the moment it is made (the rows it changed, or the new
// title). A reload, a closed tab or a crash before the next full save loses nothing: the last
// full save plus its entries, applied in order, is the workbook as it was left.
//
// Entries are numbered in one sequence per writer. A full save says up to which number it
// includes the entries; only the entries right after it, without a gap, are applied. An edit that
// entries cannot describe (rows inserted, a sheet renamed, undo) skips a number, so nothing after
// it is applied to a save that does not hold it; such an edit is saved in full at once instead.
import type { CellContent, SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';

export type Rows = readonly (readonly CellContent[])[];

export type JournalEntry =
  | {
      readonly kind: 'rows';
      readonly sheet: string;
      /** The sheet's row count after the edit. */
      readonly length: number;
      /** [row index, the row's contents after the edit]. */
      readonly rows: ReadonlyArray<readonly [number, readonly CellContent[]]>;
    }
  | { readonly kind: 'title'; readonly title: string };

/** An entry as stored: its number in the writer's sequence, and the entry. */
export interface JournalRecord {
  readonly seq: number;
  readonly entry: JournalEntry;
}

/**
 * The rows of `after` that differ from `before`. The open workbook replaces a row it changes by a
 * new array and leaves the others in place, so most rows compare by identity.
 */
export function changedRows(before: Rows | undefined, after: Rows): Array<readonly [number, CellContent[]]> {
  const out: Array<readonly [number, CellContent[]]> = [];
  after.forEach((row, r) => {
    const old = before?.[r];
    if (old === row) return;
    if (old && old.length === row.length && old.every((v, c) => v === row[c])) return;
    out.push([r, [...row]]);
  });
  return out;
}

function applyOne(doc: WorkbookDoc, e: JournalEntry): WorkbookDoc | undefined {
  if (e.kind === 'title') return typeof e.title === 'string' ? { ...doc, title: e.title } : undefined;
  const i = doc.sheets.findIndex((s) => s.name === e.sheet);
  const sheet = doc.sheets[i];
  if (!sheet || !Number.isInteger(e.length) || e.length < 0 || !Array.isArray(e.rows)) return undefined;
  const cells = sheet.cells.slice(0, e.length);
  while (cells.length < e.length) cells.push([]);
  for (const [r, row] of e.rows as ReadonlyArray<readonly [number, unknown]>) {
    if (!Number.isInteger(r) || r < 0 || r >= e.length || !Array.isArray(row)) return undefined;
    cells[r] = [...(row as CellContent[])];
  }
  const next: SheetDoc = { ...sheet, cells };
  return { ...doc, sheets: doc.sheets.map((s, k) => (k === i ? next : s)) };
}

/**
 * The saved workbook with the entries that follow it (numbers through + 1, through + 2, … without
 * a gap) applied; `applied` counts them. An entry that does not fit stops the replay there.
 */
export function replay(
  doc: WorkbookDoc,
  through: number,
  records: readonly JournalRecord[],
): { doc: WorkbookDoc; applied: number; lastSeq: number } {
  let out = doc;
  let expected = through + 1;
  let applied = 0;
  for (const rec of [...records].sort((a, b) => a.seq - b.seq)) {
    if (rec.seq !== expected) break;
    const next = applyOne(out, rec.entry);
    if (!next) break;
    out = next;
    applied++;
    expected++;
  }
  return { doc: out, applied, lastSeq: expected - 1 };
}
