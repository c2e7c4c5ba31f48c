// What the engine does not hold about sheets: their order and their column descriptions. Kept as
// immutable snapshots beside the engine's own undo stack, one entry per user action, so undoing
// a sheet deletion brings back the sheet in its place with its headers, formats and widths.
import type { ColumnInfo } from '../../core/workbook/document.ts';

export interface SheetMeta {
  readonly columns?: readonly ColumnInfo[];
  readonly purpose?: string;
}

export interface Layout {
  /** Engine sheet ids in tab order. */
  readonly order: readonly number[];
  readonly meta: ReadonlyMap<number, SheetMeta>;
}

interface Entry {
  readonly before: Layout;
  readonly after: Layout;
}

export class LayoutHistory {
  private readonly undoStack: Entry[] = [];
  private readonly redoStack: Entry[] = [];

  constructor(private readonly limit: number) {}

  /** Record one action (which the engine recorded as one undo entry too). */
  record(before: Layout, after: Layout): void {
    this.undoStack.push({ before, after });
    if (this.undoStack.length > this.limit) this.undoStack.shift();
    this.redoStack.length = 0;
  }

  /** The layout to show after undoing the last action. */
  undo(): Layout | undefined {
    const e = this.undoStack.pop();
    if (!e) return undefined;
    this.redoStack.push(e);
    return e.before;
  }

  redo(): Layout | undefined {
    const e = this.redoStack.pop();
    if (!e) return undefined;
    this.undoStack.push(e);
    return e.after;
  }

  get canUndo(): boolean {
    return this.undoStack.length > 0;
  }

  get canRedo(): boolean {
    return this.redoStack.length > 0;
  }

  clear(): void {
    this.undoStack.length = 0;
    this.redoStack.length = 0;
  }
}
