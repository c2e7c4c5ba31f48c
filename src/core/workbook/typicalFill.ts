// Which blank inputs of the equipment sheets take a typical value, and the writes and
// assumed-marks that put them in. Pure: the page's session applies the plan to its open workbook
// as one step; the rule for each row is typicalFillRow, shared with the import and the CLI.
import { typicalFillRow } from '../site/typical/fillRow.ts';
import type { CellContent, CellMark } from './document.ts';
import { assumedMark } from './cellMarks.ts';
import type { EquipmentColumns } from './equipmentColumns.ts';

export type SheetRows = readonly (readonly CellContent[])[];

export interface TypicalFillCell {
  readonly row: number;
  readonly col: number;
  readonly content: number;
}

export interface TypicalFillPlan<K> {
  /** How many values go in. */
  readonly filled: number;
  /** Per sheet (keyed as the caller keyed it): the cell writes and their marks. */
  readonly sheets: ReadonlyMap<K, { cells: TypicalFillCell[]; marks: CellMark[] }>;
  /** Blanks that stay blank, and why ("Motors row 7 (M-12): eff: …"). */
  readonly notAssumed: readonly string[];
}

/**
 * Plan the fill of every equipment sheet with one kind: `sheets` gives, for each plan, the key
 * the caller knows the sheet by and its rows (header first).
 */
export function planTypicalFill<K>(
  sheets: ReadonlyArray<{ readonly key: K; readonly rows: SheetRows }>,
  plans: readonly EquipmentColumns[],
): TypicalFillPlan<K> {
  const out = new Map<K, { cells: TypicalFillCell[]; marks: CellMark[] }>();
  const notAssumed: string[] = [];
  let filled = 0;
  plans.forEach((plan, i) => {
    const kind = plan.kinds.length === 1 ? plan.kinds[0]?.name : undefined;
    const sheet = sheets[i];
    if (!kind || !sheet) return;
    const tagCol = plan.input.get('tag');
    const cells: TypicalFillCell[] = [];
    const marks: CellMark[] = [];
    sheet.rows.forEach((line, row) => {
      if (row === 0 || plan.inputCols.every((c) => (line[c] ?? null) === null)) return;
      const at = (key: string) => {
        const c = plan.input.get(key);
        return c === undefined ? undefined : line[c];
      };
      const fill = typicalFillRow(kind, at);
      const tag = tagCol === undefined ? '' : String(line[tagCol] ?? '');
      for (const w of fill.writes) {
        const col = plan.input.get(w.column);
        if (col === undefined) continue;
        cells.push({ row, col, content: w.value });
        marks.push(assumedMark(row, col, w.value, w.note));
      }
      for (const why of fill.notAssumed)
        notAssumed.push(`${plan.sheet.name} row ${row + 1}${tag ? ` (${tag})` : ''}: ${why}`);
    });
    if (cells.length > 0) {
      out.set(sheet.key, { cells, marks });
      filled += cells.length;
    }
  });
  return { filled, sheets: out, notAssumed };
}
