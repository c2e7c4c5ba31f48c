// Cell writes grouped into rectangles, so the engine takes a sheet written anew as one block
// instead of thousands of single cells (each write is an operation in its undo history, and the
// engine's history work grows with the number of operations).
import type { CellContent } from '../../core/workbook/document.ts';

export interface CellWrite {
  readonly sheet: number;
  readonly row: number;
  readonly col: number;
  readonly content: CellContent;
}

export interface Block {
  readonly sheet: number;
  readonly row: number;
  readonly col: number;
  readonly cells: CellContent[][];
}

/** Rectangles covering exactly the written cells (the last write to a cell wins). */
export function toBlocks(writes: readonly CellWrite[]): Block[] {
  const bySheet = new Map<number, Map<number, Map<number, CellContent>>>();
  for (const w of writes) {
    let rows = bySheet.get(w.sheet);
    if (!rows) bySheet.set(w.sheet, (rows = new Map<number, Map<number, CellContent>>()));
    let cols = rows.get(w.row);
    if (!cols) rows.set(w.row, (cols = new Map<number, CellContent>()));
    cols.set(w.col, w.content);
  }
  const out: Block[] = [];
  for (const [sheet, rows] of bySheet) {
    // Runs of consecutive columns in each row.
    const runs: Array<{ row: number; col: number; values: CellContent[] }> = [];
    for (const row of [...rows.keys()].sort((a, b) => a - b)) {
      const cols = rows.get(row) as Map<number, CellContent>;
      let run: { row: number; col: number; values: CellContent[] } | undefined;
      for (const col of [...cols.keys()].sort((a, b) => a - b)) {
        if (run && col === run.col + run.values.length) run.values.push(cols.get(col) ?? null);
        else runs.push((run = { row, col, values: [cols.get(col) ?? null] }));
      }
    }
    // Runs with the same columns in consecutive rows make one rectangle.
    let block: { row: number; col: number; cells: CellContent[][] } | undefined;
    for (const r of runs) {
      const width = block?.cells[0]?.length;
      if (
        block &&
        r.col === block.col &&
        r.values.length === width &&
        r.row === block.row + block.cells.length
      ) {
        block.cells.push(r.values);
      } else {
        if (block) out.push({ sheet, ...block });
        block = { row: r.row, col: r.col, cells: [r.values] };
      }
    }
    if (block) out.push({ sheet, ...block });
  }
  return out;
}
