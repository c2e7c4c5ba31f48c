// What each sheet holds as typed: inputs, notes, typed-over cells and the constants Kvar Ledger
// writes (headers, bus names); generated formulas are left out (they are written again from the
// inputs when a workbook opens). Kept by the session on every write and row change, never read
// back from the engine, so saving a 10,000-row site does not write out every formula again.
// Sheets and rows are replaced, never changed in place: a snapshot is a map copy, and undo
// restores one.
import type { CellContent } from '../../core/workbook/document.ts';

export type Rows = readonly (readonly CellContent[])[];
export type Snapshot = ReadonlyMap<number, Rows>;

/** Blanks as null, trailing blanks of a row dropped. */
export function trimRow(row: readonly unknown[]): CellContent[] {
  const out = Array.from(row, (v) => (v === undefined || v === '' ? null : (v as CellContent)));
  while (out.length > 0 && out[out.length - 1] === null) out.pop();
  return out;
}

export function trimRows(rows: readonly (readonly unknown[] | undefined)[]): CellContent[][] {
  // Array.from, not map: a sparse array (a sheet whose first rows were never written) has holes
  // that map would keep, and a hole is not a row.
  const out = Array.from(rows, (r) => trimRow(r ?? []));
  while (out.length > 0 && (out[out.length - 1] as CellContent[]).length === 0) out.pop();
  return out;
}

export class ContentStore {
  private sheets = new Map<number, Rows>();
  /** Sheets and rows already copied in the current step (copy on first write). */
  private copiedSheets = new Set<number>();
  private copiedRows = new Map<number, Set<number>>();

  snapshot(): Snapshot {
    this.beginStep();
    return new Map(this.sheets);
  }

  restore(s: Snapshot): void {
    this.sheets = new Map(s);
    this.beginStep();
  }

  /** Writes after this copy again (the previous snapshot keeps its rows). */
  beginStep(): void {
    this.copiedSheets.clear();
    this.copiedRows.clear();
  }

  seed(id: number, rows: readonly (readonly unknown[])[]): void {
    this.sheets.set(id, trimRows(rows));
  }

  drop(id: number): void {
    this.sheets.delete(id);
  }

  get(id: number): Rows {
    return this.sheets.get(id) ?? [];
  }

  cell(id: number, row: number, col: number): CellContent {
    return this.get(id)[row]?.[col] ?? null;
  }

  private writable(id: number): CellContent[][] {
    if (!this.copiedSheets.has(id)) {
      this.sheets.set(id, [...this.get(id)]);
      this.copiedSheets.add(id);
      this.copiedRows.set(id, new Set());
    }
    return this.sheets.get(id) as CellContent[][];
  }

  set(id: number, row: number, col: number, v: CellContent): void {
    const rows = this.writable(id);
    const copied = this.copiedRows.get(id) as Set<number>;
    if (v === null && (rows[row]?.[col] ?? null) === null) return;
    while (rows.length <= row) rows.push([]);
    if (!copied.has(row)) {
      rows[row] = [...(rows[row] ?? [])];
      copied.add(row);
    }
    const line = rows[row] as CellContent[];
    while (line.length <= col) line.push(null);
    line[col] = v;
    if (v === null) {
      while (line.length > 0 && line[line.length - 1] === null) line.pop();
      while (rows.length > 0 && (rows[rows.length - 1] as CellContent[]).length === 0) rows.pop();
    }
  }

  insertRows(id: number, at: number, count: number): void {
    const rows = this.writable(id);
    if (at >= rows.length) return;
    rows.splice(at, 0, ...Array.from({ length: count }, () => [] as CellContent[]));
    this.copiedRows.set(id, new Set());
  }

  removeRows(id: number, at: number, count: number): void {
    const rows = this.writable(id);
    rows.splice(at, count);
    while (rows.length > 0 && (rows[rows.length - 1] as CellContent[]).length === 0) rows.pop();
    this.copiedRows.set(id, new Set());
  }

  /** Replace a whole sheet (a sheet written anew, e.g. after the cases changed). */
  replace(id: number, rows: readonly (readonly unknown[])[]): void {
    this.sheets.set(id, trimRows(rows));
    this.copiedSheets.add(id);
    this.copiedRows.set(id, new Set());
  }
}
