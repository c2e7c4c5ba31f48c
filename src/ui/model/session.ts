// The open workbook: the formula engine holds every cell and its undo history; the layout (tab
// order, column descriptions) sits beside it with a matching history. Every user action goes
// through one method here and becomes exactly one undo step.
import type { HyperFormula, SimpleCellRange } from 'hyperformula';
import type { CellContent, SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';
import { createWorkbookEngine, UNDO_LIMIT } from './engineBridge.ts';
import { LayoutHistory, type Layout, type SheetMeta } from './sheetLayout.ts';
import { sheetNameProblem } from './sheetNames.ts';

export type SessionChange =
  | { readonly kind: 'cells'; readonly sheetId: number }
  | { readonly kind: 'rows'; readonly sheetId: number }
  | { readonly kind: 'sheets' }
  | { readonly kind: 'history' }
  | { readonly kind: 'title' };

export class SessionError extends Error {}

function normalizeRow(row: readonly unknown[]): CellContent[] {
  const out = Array.from(row, (v): CellContent => (v === undefined || v === "" ? null : (v as CellContent)));
  while (out.length > 0 && out[out.length - 1] === null) out.pop();
  return out;
}

export class WorkbookSession {
  private layout: Layout;
  private readonly history = new LayoutHistory(UNDO_LIMIT);
  private readonly listeners = new Set<(c: SessionChange) => void>();

  private constructor(readonly engine: HyperFormula, private titleText: string, layout: Layout) {
    this.layout = layout;
  }

  static fromDoc(doc: WorkbookDoc): WorkbookSession {
    const engine = createWorkbookEngine(doc.sheets.map((s) => ({ name: s.name, cells: s.cells })));
    const order: number[] = [];
    const meta = new Map<number, SheetMeta>();
    for (const s of doc.sheets) {
      const id = engine.getSheetId(s.name) as number;
      order.push(id);
      meta.set(id, { ...(s.columns ? { columns: s.columns } : {}), ...(s.purpose ? { purpose: s.purpose } : {}) });
    }
    engine.clearUndoStack();
    return new WorkbookSession(engine, doc.title, { order, meta });
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
    this.emit({ kind: 'cells', sheetId });
  }

  /** Several scattered single-cell writes as one step (an edit, a cut, a clear). */
  setCells(sheetId: number, cells: ReadonlyArray<{ row: number; col: number; content: CellContent }>): void {
    if (cells.length === 0) return;
    this.act(() => this.engine.batch(() => {
      for (const c of cells) this.engine.setCellContents({ sheet: sheetId, row: c.row, col: c.col }, c.content);
    }));
    this.emit({ kind: 'cells', sheetId });
  }

  /** Fill `target` from `source` the way dragging a fill handle does: relative references move. */
  fill(source: SimpleCellRange, target: SimpleCellRange): void {
    const data = this.engine.getFillRangeData(source, target);
    this.setBlock(target.start.sheet, target.start.row, target.start.col, data as CellContent[][]);
  }

  /** Contents of `source` as they would read when pasted with their top-left at `at`. */
  movedContents(source: SimpleCellRange, at: { sheet: number; row: number; col: number }): CellContent[][] {
    const h = source.end.row - source.start.row, w = source.end.col - source.start.col;
    const target = { start: at, end: { sheet: at.sheet, row: at.row + h, col: at.col + w } };
    return this.engine.getFillRangeData(source, target, true) as CellContent[][];
  }

  insertRows(sheetId: number, at: number, count: number): void {
    this.act(() => this.engine.addRows(sheetId, [at, count]));
    this.emit({ kind: 'rows', sheetId });
  }

  removeRows(sheetId: number, at: number, count: number): void {
    this.act(() => this.engine.removeRows(sheetId, [at, count]));
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
    this.emit({ kind: 'sheets' });
    return id;
  }

  renameSheet(id: number, name: string): void {
    const current = this.sheetName(id);
    if (name === current) return;
    const problem = sheetNameProblem(name, this.sheetNames(), current);
    if (problem) throw new SessionError(problem);
    this.act(() => this.engine.renameSheet(id, name));
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
    this.layout = this.history.undo() ?? this.layout;
    this.emit({ kind: 'history' });
    return true;
  }

  redo(): boolean {
    if (!this.canRedo) return false;
    this.engine.redo();
    this.layout = this.history.redo() ?? this.layout;
    this.emit({ kind: 'history' });
    return true;
  }

  /**
   * The engine writes the values a formula spills over its neighbours (the bus roll-up returns
   * one array for all buses) as if they were typed there; they belong to the formula, not to the
   * cell, and saved as constants they would block the spill on reload. Only formula cells can
   * anchor a spill, so the search starts from them.
   */
  private clearSpills(id: number, rows: CellContent[][]): void {
    const isArray = (row: number, col: number) => this.engine.isCellPartOfArray({ sheet: id, row, col });
    const isFormula = (v: unknown) => typeof v === 'string' && v.startsWith('=');
    rows.forEach((cells, r) => cells.forEach((v, c) => {
      if (!isFormula(v) || !isArray(r, c)) return;
      for (let rr = r; rr < rows.length && (rr === r || (!isFormula(rows[rr]?.[c]) && isArray(rr, c))); rr++) {
        const line = rows[rr] as CellContent[];
        for (let cc = rr === r ? c + 1 : c; cc < line.length && !isFormula(line[cc]) && isArray(rr, cc); cc++) line[cc] = null;
        if (rr !== r && !isFormula(line[c])) line[c] = null;
      }
    }));
  }

  /** Raw contents of a sheet (formulas as typed), trailing blanks trimmed. */
  sheetContents(id: number): CellContent[][] {
    const rows = this.engine.getSheetSerialized(id).map((r) => normalizeRow(r as unknown[]));
    this.clearSpills(id, rows);
    const out = rows.map((r) => normalizeRow(r));
    while (out.length > 0 && (out[out.length - 1] as CellContent[]).length === 0) out.pop();
    return out;
  }

  private isSpilled(sheet: number, row: number, col: number, v: unknown): boolean {
    if (v === null || v === undefined || (typeof v === 'string' && v.startsWith('='))) return false;
    return this.engine.isCellPartOfArray({ sheet, row, col });
  }

  cellContent(sheetId: number, row: number, col: number): CellContent {
    const v = this.engine.getCellSerialized({ sheet: sheetId, row, col });
    if (v === undefined || v === '' || this.isSpilled(sheetId, row, col, v)) return null;
    return v as CellContent;
  }

  toDoc(): WorkbookDoc {
    const sheets: SheetDoc[] = this.layout.order.map((id) => {
      const m = this.meta(id);
      return {
        name: this.sheetName(id),
        cells: this.sheetContents(id),
        ...(m.columns ? { columns: m.columns } : {}),
        ...(m.purpose ? { purpose: m.purpose } : {}),
      };
    });
    return { format: 'kvar-ledger-workbook', version: 1, title: this.titleText, sheets };
  }

  destroy(): void {
    this.listeners.clear();
    this.engine.destroy();
  }
}
