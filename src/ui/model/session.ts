// The open workbook: the formula engine holds every cell and its undo history; the layout (tab
// order, column descriptions) sits beside it with a matching history. Every user action goes
// through one method here and becomes exactly one undo step.
import type { HyperFormula, SimpleCellRange } from 'hyperformula';
import type { CellContent, SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';
import { createWorkbookEngine, UNDO_LIMIT } from './engineBridge.ts';
import { LayoutHistory, metaExtras, metaFromDoc, type Layout, type SheetMeta } from './sheetLayout.ts';
import { sheetNameProblem } from './sheetNames.ts';
import { SheetContents } from './sheetContents.ts';

export type SessionChange =
  | { readonly kind: 'cells'; readonly sheetId: number }
  | { readonly kind: 'rows'; readonly sheetId: number }
  | { readonly kind: 'sheets' }
  | { readonly kind: 'history' }
  | { readonly kind: 'title' };

export class SessionError extends Error {}

export class WorkbookSession {
  private layout: Layout;
  private readonly history = new LayoutHistory(UNDO_LIMIT);
  private readonly listeners = new Set<(c: SessionChange) => void>();
  private readonly contents: SheetContents;

  private constructor(
    readonly engine: HyperFormula,
    private titleText: string,
    layout: Layout,
  ) {
    this.layout = layout;
    this.contents = new SheetContents(engine);
  }

  static fromDoc(doc: WorkbookDoc): WorkbookSession {
    const engine = createWorkbookEngine(doc.sheets.map((s) => ({ name: s.name, cells: s.cells })));
    const order: number[] = [];
    const meta = new Map<number, SheetMeta>();
    for (const s of doc.sheets) {
      const id = engine.getSheetId(s.name) as number;
      order.push(id);
      meta.set(id, metaFromDoc(s));
    }
    engine.clearUndoStack();
    const session = new WorkbookSession(engine, doc.title, { order, meta });
    // What was opened is what the engine holds: no need to write every formula out again.
    doc.sheets.forEach((s, i) => session.contents.seed(order[i] as number, s.cells));
    return session;
  }

  onChange(fn: (c: SessionChange) => void): () => void {
    this.listeners.add(fn);
    return () => this.listeners.delete(fn);
  }

  private emit(c: SessionChange): void {
    for (const fn of this.listeners) fn(c);
  }

  get title(): string {
    return this.titleText;
  }

  setTitle(title: string): void {
    const t = title.trim() || 'Untitled site';
    if (t === this.titleText) return;
    this.titleText = t;
    this.emit({ kind: 'title' });
  }

  sheetIds(): readonly number[] {
    return this.layout.order;
  }

  sheetName(id: number): string {
    const name = this.engine.getSheetName(id);
    if (name === undefined) throw new SessionError(`no sheet with id ${id}`);
    return name;
  }

  sheetNames(): string[] {
    return this.layout.order.map((id) => this.sheetName(id));
  }

  meta(id: number): SheetMeta {
    return this.layout.meta.get(id) ?? {};
  }

  /** One undoable step: the engine work, then the layout it leaves. */
  private act(work: () => void, nextLayout?: (l: Layout) => Layout): void {
    const before = this.layout;
    work();
    this.layout = nextLayout ? nextLayout(before) : before;
    this.history.record(before, this.layout);
  }

  /** Write a block of contents with its top-left at (row, col). */
  setBlock(sheetId: number, row: number, col: number, block: CellContent[][]): void {
    if (block.length === 0) return;
    this.act(() => this.engine.setCellContents({ sheet: sheetId, row, col }, block));
    this.contents.patch(
      sheetId,
      block.flatMap((line, r) => line.map((_, c) => ({ row: row + r, col: col + c }))),
    );
    this.emit({ kind: 'cells', sheetId });
  }

  /** Several scattered single-cell writes as one step (an edit, a cut, a clear). */
  setCells(sheetId: number, cells: ReadonlyArray<{ row: number; col: number; content: CellContent }>): void {
    if (cells.length === 0) return;
    this.act(() =>
      this.engine.batch(() => {
        for (const c of cells)
          this.engine.setCellContents({ sheet: sheetId, row: c.row, col: c.col }, c.content);
      }),
    );
    this.contents.patch(sheetId, cells);
    this.emit({ kind: 'cells', sheetId });
  }

  /** Fill `target` from `source` the way dragging a fill handle does: relative references move. */
  fill(source: SimpleCellRange, target: SimpleCellRange): void {
    const data = this.engine.getFillRangeData(source, target);
    this.setBlock(target.start.sheet, target.start.row, target.start.col, data as CellContent[][]);
  }

  /** Contents of `source` as they would read when pasted with their top-left at `at`. */
  movedContents(source: SimpleCellRange, at: { sheet: number; row: number; col: number }): CellContent[][] {
    const h = source.end.row - source.start.row,
      w = source.end.col - source.start.col;
    const target = { start: at, end: { sheet: at.sheet, row: at.row + h, col: at.col + w } };
    return this.engine.getFillRangeData(source, target, true) as CellContent[][];
  }

  insertRows(sheetId: number, at: number, count: number): void {
    this.act(() => this.engine.addRows(sheetId, [at, count]));
    this.contents.forget();
    this.emit({ kind: 'rows', sheetId });
  }

  removeRows(sheetId: number, at: number, count: number): void {
    this.act(() => this.engine.removeRows(sheetId, [at, count]));
    this.contents.forget();
    this.emit({ kind: 'rows', sheetId });
  }

  addSheet(name: string, afterId?: number): number {
    const problem = sheetNameProblem(name, this.sheetNames());
    if (problem) throw new SessionError(problem);
    let id = -1;
    this.act(
      () => {
        this.engine.addSheet(name);
        id = this.engine.getSheetId(name) as number;
      },
      (l) => {
        const order = [...l.order];
        const pos = afterId === undefined ? order.length : order.indexOf(afterId) + 1;
        order.splice(pos, 0, id);
        const meta = new Map(l.meta);
        meta.set(id, {});
        return { order, meta };
      },
    );
    this.contents.forget(id);
    this.emit({ kind: 'sheets' });
    return id;
  }

  renameSheet(id: number, name: string): void {
    const current = this.sheetName(id);
    if (name === current) return;
    const problem = sheetNameProblem(name, this.sheetNames(), current);
    if (problem) throw new SessionError(problem);
    this.act(() => this.engine.renameSheet(id, name));
    this.contents.forget();
    this.emit({ kind: 'sheets' });
  }

  removeSheet(id: number): void {
    if (this.layout.order.length <= 1) throw new SessionError('A workbook keeps at least one sheet.');
    this.act(
      () => this.engine.removeSheet(id),
      (l) => {
        const meta = new Map(l.meta);
        meta.delete(id);
        return { order: l.order.filter((x) => x !== id), meta };
      },
    );
    this.contents.forget();
    this.emit({ kind: 'sheets' });
  }

  get canUndo(): boolean {
    return this.history.canUndo && this.engine.isThereSomethingToUndo();
  }

  get canRedo(): boolean {
    return this.history.canRedo && this.engine.isThereSomethingToRedo();
  }

  undo(): boolean {
    if (!this.canUndo) return false;
    this.engine.undo();
    this.contents.forget();
    this.layout = this.history.undo() ?? this.layout;
    this.emit({ kind: 'history' });
    return true;
  }

  redo(): boolean {
    if (!this.canRedo) return false;
    this.engine.redo();
    this.contents.forget();
    this.layout = this.history.redo() ?? this.layout;
    this.emit({ kind: 'history' });
    return true;
  }

  /** Contents of a sheet as typed (formulas as text), trailing blanks trimmed. Do not modify. */
  sheetContents(id: number): CellContent[][] {
    return this.contents.get(id);
  }

  cellContent(sheetId: number, row: number, col: number): CellContent {
    return this.contents.cell(sheetId, row, col);
  }

  toDoc(): WorkbookDoc {
    const sheets: SheetDoc[] = this.layout.order.map((id) => {
      const m = this.meta(id);
      return {
        name: this.sheetName(id),
        cells: this.sheetContents(id),
        ...(m.columns ? { columns: m.columns } : {}),
        ...(m.purpose ? { purpose: m.purpose } : {}),
        ...metaExtras(m),
      };
    });
    return { format: 'kvar-ledger-workbook', version: 1, title: this.titleText, sheets };
  }

  destroy(): void {
    this.listeners.clear();
    this.engine.destroy();
  }
}
