// What each sheet holds as typed (formulas as text), kept between saves. Reading a large sheet
// back from the engine means writing out every formula again (about a second for a 10,000-row
// site), so the contents are cached per sheet and patched cell by cell after edits; anything
// that can rewrite formulas elsewhere (rows, sheet names, undo) drops the cache.
// Rows are replaced, never changed in place, so a document handed out earlier stays as it was.
import type { HyperFormula } from 'hyperformula';
import type { CellContent } from '../../core/workbook/document.ts';

type Rows = CellContent[][];

const isFormula = (v: unknown): boolean => typeof v === 'string' && v.startsWith('=');

function cleanValue(v: unknown): CellContent {
  return v === undefined || v === '' ? null : (v as CellContent);
}

/** Blanks as null, trailing blanks of a row dropped. */
export function trimRow(row: readonly unknown[]): CellContent[] {
  const out = Array.from(row, cleanValue);
  while (out.length > 0 && out[out.length - 1] === null) out.pop();
  return out;
}

export function trimRows(rows: readonly (readonly unknown[])[]): Rows {
  const out = rows.map(trimRow);
  while (out.length > 0 && (out[out.length - 1] as CellContent[]).length === 0) out.pop();
  return out;
}

export class SheetContents {
  private readonly cache = new Map<number, Rows>();

  constructor(private readonly engine: HyperFormula) {}

  /** Seed a sheet with contents known to be what the engine holds (e.g. the opened document). */
  seed(id: number, rows: readonly (readonly unknown[])[]): void {
    this.cache.set(id, trimRows(rows));
  }

  forget(id?: number): void {
    if (id === undefined) this.cache.clear();
    else this.cache.delete(id);
  }

  get(id: number): Rows {
    const hit = this.cache.get(id);
    if (hit) return hit;
    const rows = this.engine.getSheetSerialized(id).map((r) => Array.from(r as unknown[], cleanValue));
    this.clearSpills(id, rows);
    const out = trimRows(rows);
    this.cache.set(id, out);
    return out;
  }

  /** After cells were written: take their contents from the engine into the cached sheet. */
  patch(id: number, cells: ReadonlyArray<{ row: number; col: number }>): void {
    const cached = this.cache.get(id);
    if (!cached) return;
    const rows = [...cached];
    const copied = new Set<number>();
    for (const { row, col } of cells) {
      const v = cleanValue(this.engine.getCellSerialized({ sheet: id, row, col }));
      // A formula that spills changes cells it was not written to: read the sheet again.
      if (isFormula(v) && this.engine.isCellPartOfArray({ sheet: id, row, col })) return this.forget(id);
      while (rows.length <= row) rows.push([]);
      if (!copied.has(row)) {
        rows[row] = [...(rows[row] as CellContent[])];
        copied.add(row);
      }
      const line = rows[row] as CellContent[];
      while (line.length <= col) line.push(null);
      line[col] = this.isSpilled(id, row, col, v) ? null : v;
    }
    for (const r of copied) rows[r] = trimRow(rows[r] as CellContent[]);
    while (rows.length > 0 && (rows[rows.length - 1] as CellContent[]).length === 0) rows.pop();
    this.cache.set(id, rows);
  }

  /** One cell as typed; values a formula spilled there count as nothing typed. */
  cell(id: number, row: number, col: number): CellContent {
    const v = cleanValue(this.engine.getCellSerialized({ sheet: id, row, col }));
    return this.isSpilled(id, row, col, v) ? null : v;
  }

  private isSpilled(sheet: number, row: number, col: number, v: unknown): boolean {
    if (v === null || isFormula(v)) return false;
    return this.engine.isCellPartOfArray({ sheet, row, col });
  }

  /**
   * The engine writes the values a formula spills over its neighbours (the bus roll-up returns
   * one array for all buses) as if they were typed there; they belong to the formula, and saved
   * as constants they would block the spill on reload. Only formula cells anchor a spill.
   */
  private clearSpills(id: number, rows: CellContent[][]): void {
    const isArray = (row: number, col: number) => this.engine.isCellPartOfArray({ sheet: id, row, col });
    rows.forEach((cells, r) =>
      cells.forEach((v, c) => {
        if (!isFormula(v) || !isArray(r, c)) return;
        for (
          let rr = r;
          rr < rows.length && (rr === r || (!isFormula(rows[rr]?.[c]) && isArray(rr, c)));
          rr++
        ) {
          const line = rows[rr] as CellContent[];
          for (
            let cc = rr === r ? c + 1 : c;
            cc < line.length && !isFormula(line[cc]) && isArray(rr, cc);
            cc++
          )
            line[cc] = null;
          if (rr !== r && !isFormula(line[c])) line[c] = null;
        }
      }),
    );
  }
}
