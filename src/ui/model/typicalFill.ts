// Which blank inputs of the equipment sheets can take a typical value, and the writes and
// assumed-marks that put them in (the session applies them as one step). Only motors and
// transformers have typical-value tables; only cells left blank are filled, never a typed value
// or a formula, and only from a typed rating (rated output, kVA).
import type { CellContent } from '../../core/workbook/document.ts';
import type { CellMark } from './sheetLayout.ts';
import type { EquipmentColumns } from '../../core/workbook/equipmentColumns.ts';
import type { NumericColumn } from '../../core/site/model.ts';
import { assumeTypical } from '../../core/site/typical/assume.ts';
import type { ContentStore } from './contentStore.ts';

export interface TypicalFillReport {
  /** How many values went in. */
  readonly filled: number;
  /** Per sheet: the cell writes and their marks. */
  readonly sheets: ReadonlyMap<number, { cells: Cell[]; marks: CellMark[] }>;
  /** Blanks that stay blank, and why ("Motors row 7 (M-12): eff: …"). */
  readonly notAssumed: readonly string[];
}

type Cell = { row: number; col: number; content: CellContent };

const KINDS = new Set(['motor', 'transformer']);

/** "assumed 0.914 (11 kW, 4-pole, class IE3; source)" → "11 kW, 4-pole, class IE3; source". */
const markNote = (note: string): string => note.replace(/^assumed \S+ \((.*)\)$/, '$1');

export function planTypicalFill(
  contents: ContentStore,
  sheetIds: readonly number[],
  plans: readonly EquipmentColumns[],
): TypicalFillReport {
  const sheets = new Map<number, { cells: Cell[]; marks: CellMark[] }>();
  const notAssumed: string[] = [];
  let filled = 0;
  plans.forEach((plan, i) => {
    const kind = plan.kinds.length === 1 ? plan.kinds[0]?.name : undefined;
    const sheetId = sheetIds[i];
    if (!kind || !KINDS.has(kind) || sheetId === undefined) return;
    const tagCol = plan.input.get('tag');
    const cells: Cell[] = [];
    const marks: CellMark[] = [];
    contents.get(sheetId).forEach((line, row) => {
      if (row === 0 || plan.inputCols.every((c) => (line[c] ?? null) === null)) return;
      const values: Partial<Record<NumericColumn, number>> = {};
      for (const [key, col] of plan.input) {
        const v = line[col];
        if (typeof v === 'number') values[key as NumericColumn] = v;
      }
      const tag = tagCol === undefined ? '' : String(line[tagCol] ?? '');
      const found = assumeTypical({ kind: kind as 'motor' | 'transformer', values });
      for (const a of found.assumed) {
        const col = plan.input.get(a.column);
        // A formula or text in the cell is the user's: never filled over.
        if (col === undefined || (line[col] ?? null) !== null) continue;
        cells.push({ row, col, content: a.value });
        marks.push({ row, col, kind: 'assumed', note: markNote(a.note), value: a.value });
      }
      for (const why of found.notAssumed)
        notAssumed.push(`${plan.sheet.name} row ${row + 1}${tag ? ` (${tag})` : ''}: ${why}`);
    });
    if (cells.length > 0) {
      sheets.set(sheetId, { cells, marks });
      filled += cells.length;
    }
  });
  return { filled, sheets, notAssumed };
}
