// The choices and marks of the sheet on screen, looked up by cell. Built from the sheet's
// description (SheetMeta) whenever the grid shows or reloads a sheet.
import type { CellContent } from '../../core/workbook/document.ts';
import { markHolds } from '../../core/workbook/cellMarks.ts';
import type { CellChoice, CellMark, SheetMeta } from '../model/sheetLayout.ts';

const key = (row: number, col: number) => `${row},${col}`;

export class CellNotes {
  private readonly choices = new Map<string, CellChoice>();
  private readonly marks = new Map<string, CellMark>();

  constructor(meta: SheetMeta) {
    for (const c of meta.choices ?? []) this.choices.set(key(c.row, c.col), c);
    for (const m of meta.marks ?? []) this.marks.set(key(m.row, m.col), m);
  }

  get empty(): boolean {
    return this.choices.size === 0 && this.marks.size === 0;
  }

  choice(row: number, col: number): CellChoice | undefined {
    return this.choices.get(key(row, col));
  }

  /** The mark of a cell while it still holds what was marked (a mark with a value). */
  mark(row: number, col: number, content: () => CellContent | undefined): CellMark | undefined {
    const m = this.marks.get(key(row, col));
    if (!m) return undefined;
    return markHolds(m, content()) ? m : undefined;
  }
}

export type ChoiceCheck = { ok: true; value: string | null } | { ok: false; message: string };

/** A typed value against the cell's choices: one of them (any case and spacing), or blank. */
export function checkChoice(choice: CellChoice, typed: unknown): ChoiceCheck {
  const text = typed === null || typed === undefined ? '' : String(typed).trim();
  if (text === '') return { ok: true, value: null };
  const norm = (s: string) => s.toLowerCase().replace(/\s+/g, ' ').trim();
  const found = choice.options.find((o) => norm(o) === norm(text));
  if (found !== undefined) return { ok: true, value: found };
  const shown = text.length > 40 ? `${text.slice(0, 40)}…` : text;
  return {
    ok: false,
    message: `${choice.message} (choose ${choice.options.map((o) => `"${o}"`).join(' or ')}; got "${shown}")`,
  };
}
