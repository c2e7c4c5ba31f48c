// Circular references among formula cells, found by a depth-first walk over what each formula
// refers to. Ranges are nodes of their own, so a thousand sums over one column walk it once.
// Linear in the size of the workbook: no engine is built and nothing is computed.
import type { CellContent, WorkbookDoc } from '../../core/workbook/document.ts';
import { areasOf, type Area } from './formulaRefs.ts';

export interface CellAt {
  readonly sheet: number;
  readonly row: number;
  readonly col: number;
}

const isFormula = (c: CellContent | undefined): c is string => typeof c === 'string' && c.startsWith('=');
const cellKey = (s: number, r: number, c: number) => `c${s}:${r}:${c}`;

/** Cells on a loop of references reachable from `starts` (all formula cells when omitted), in walk order. */
export function findCircularCells(doc: WorkbookDoc, starts?: readonly CellAt[]): CellAt[] {
  const sheetIndex = new Map(doc.sheets.map((s, i) => [s.name.toLowerCase(), i]));
  const state = new Map<string, 1 | 2>(); // 1: on the current path, 2: done
  const found = new Map<string, CellAt>();

  const cellsIn = (a: Area): string[] => {
    const s = sheetIndex.get(a.sheet.toLowerCase());
    if (s === undefined) return [];
    const rows = (doc.sheets[s] as WorkbookDoc['sheets'][number]).cells;
    const out: string[] = [];
    for (let r = Math.max(0, a.r0); r <= Math.min(a.r1, rows.length - 1); r++) {
      const row = rows[r] as CellContent[];
      for (let c = Math.max(0, a.c0); c <= Math.min(a.c1, row.length - 1); c++)
        if (isFormula(row[c])) out.push(cellKey(s, r, c));
    }
    return out;
  };

  const cellKeyOf = (a: Area): string | undefined => {
    const s = sheetIndex.get(a.sheet.toLowerCase());
    return s === undefined ? undefined : cellKey(s, a.r0, a.c0);
  };

  const next = (key: string): string[] => {
    if (key.startsWith('r')) return cellsIn(JSON.parse(key.slice(1)) as Area);
    const [s, r, c] = key.slice(1).split(':').map(Number) as [number, number, number];
    const sheet = doc.sheets[s] as WorkbookDoc['sheets'][number];
    const formula = sheet.cells[r]?.[c];
    if (!isFormula(formula)) return [];
    return areasOf(formula, sheet.name)
      .map((a) => (a.r0 === a.r1 && a.c0 === a.c1 ? cellKeyOf(a) : 'r' + JSON.stringify(a)))
      .filter((k): k is string => k !== undefined);
  };

  const walk = (start: string): void => {
    if (state.has(start)) return;
    const path: string[] = [start];
    const pending: string[][] = [next(start)];
    state.set(start, 1);
    while (path.length > 0) {
      const todo = pending[pending.length - 1] as string[];
      const k = todo.pop();
      if (k === undefined) {
        state.set(path.pop() as string, 2);
        pending.pop();
        continue;
      }
      const st = state.get(k);
      if (st === 2) continue;
      if (st === 1) {
        for (const p of path.slice(path.lastIndexOf(k))) {
          if (!p.startsWith('c')) continue;
          const [s, r, c] = p.slice(1).split(':').map(Number) as [number, number, number];
          found.set(p, { sheet: s, row: r, col: c });
        }
        continue;
      }
      state.set(k, 1);
      path.push(k);
      pending.push(next(k));
    }
  };

  if (starts) for (const s of starts) walk(cellKey(s.sheet, s.row, s.col));
  else
    doc.sheets.forEach((sheet, s) =>
      sheet.cells.forEach((row, r) => row.forEach((c, col) => isFormula(c) && walk(cellKey(s, r, col)))),
    );
  return [...found.values()].sort((a, b) => a.sheet - b.sheet || a.row - b.row || a.col - b.col);
}
