// The open workbook: the formula engine holds every cell and its undo history; beside it the
// layout (tab order, column descriptions), what each sheet holds as typed, and for a site
// workbook the living model that keeps generated cells in step with the inputs. Every user action
// goes through one method here and becomes exactly one undo step, whatever the model wrote to
// follow it.
import type { HyperFormula, SimpleCellRange } from '../../engine/index.ts';
import type { CellAt, CellContent, SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';
import { isBuiltInSheet } from '../../core/workbook/layout.ts';
import { RATES_SHEET, TARIFF_SHEET } from '../../core/quote/index.ts';
import { renderWorkbook, type RenderOptions } from '../../core/workbook/render.ts';
import { anyOptionTyped, readOptionInputs } from '../../core/workbook/optionInputs.ts';
import { OPTIONS_SHEET, planOptionColumns } from '../../core/workbook/optionsLayout.ts';
import { createWorkbookEngine, UNDO_LIMIT } from './engineBridge.ts';
import {
  marksAfterMoves,
  marksAfterOrder,
  marksAfterRows,
  metaExtras,
  type CellMark,
  type Layout,
  type SheetMeta,
} from './sheetLayout.ts';
import { sheetNameProblem } from './sheetNames.ts';
import { ContentStore, type Snapshot } from './contentStore.ts';
import { History } from './history.ts';
import { SiteModel, type Write } from './siteModel.ts';
import { stateOf, type SiteState } from './siteState.ts';
import { isSiteDoc, openSite, siteTitle, stripGenerated } from './siteOpen.ts';
import { layoutOf } from './layoutOf.ts';
import { readSettingsInputs } from '../../core/workbook/renderSettings.ts';
import { renameCaseColumns } from './caseRenames.ts';
import { siteEdit } from './siteEdits.ts';
import { toBlocks } from './writeBlocks.ts';
import { SessionError } from './sessionError.ts';
import { tariffNewCaseWrites, tariffRenameWrites } from './tariffCases.ts';
import { sortedOrder } from './rowOrder.ts';
import type { TypicalFillReport } from './typicalFill.ts';
import { equipmentPlans } from '../../core/workbook/structure.ts';
import { loadedDetuningProposal, loadedOptionDrafter } from './designLoaders.ts';

export type SessionChange =
  | { readonly kind: 'cells'; readonly sheetId: number }
  | { readonly kind: 'rows'; readonly sheetId: number }
  | { readonly kind: 'sheets' }
  | { readonly kind: 'history' }
  | { readonly kind: 'title' };

export { SessionError } from './sessionError.ts';

interface Saved {
  readonly layout: Layout;
  readonly contents: Snapshot;
  readonly site: SiteState | undefined;
  readonly title: string;
}

const isFormula = (v: CellContent): v is string => typeof v === 'string' && v.startsWith('=');

export class WorkbookSession {
  private readonly history = new History<Saved>(UNDO_LIMIT);
  private readonly listeners = new Set<(c: SessionChange) => void>();

  private constructor(
    readonly engine: HyperFormula,
    private titleText: string,
    private layout: Layout,
    readonly contents: ContentStore,
    /** The living model, for a site workbook; undefined for any other workbook. */
    readonly site: SiteModel | undefined,
    /** A site workbook opened without a Design options sheet: its blocks wait for a draft. */
    private optionsToDraft = false,
  ) {}

  static fromDoc(doc: WorkbookDoc): WorkbookSession {
    if (isSiteDoc(doc)) {
      const o = openSite(doc);
      const missing = !doc.sheets.some((s) => s.name.toLowerCase() === OPTIONS_SHEET.toLowerCase());
      return new WorkbookSession(o.engine, o.title, o.layout, o.contents, o.site, missing);
    }
    const engine = createWorkbookEngine(doc.sheets.map((s) => ({ name: s.name, cells: s.cells })));
    const layout = layoutOf(engine, doc.sheets);
    engine.clearUndoStack();
    const contents = new ContentStore();
    doc.sheets.forEach((s, i) => contents.seed(layout.order[i] as number, s.cells));
    return new WorkbookSession(engine, doc.title, layout, contents, undefined);
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

  /** The workbook title; for a site workbook it is the site name on the Site sheet. */
  setTitle(title: string): void {
    const t = title.trim() || 'Untitled site';
    if (t === this.titleText) return;
    if (this.site) {
      const { site } = this.site.ids;
      this.setCells(site, [{ row: 1, col: 1, content: t }]);
      return;
    }
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

  /** Is this sheet one Kvar Ledger keeps in step with the equipment (not deletable or renamable)? */
  isBuiltIn(id: number): boolean {
    return this.site !== undefined && this.site.role(id).kind !== 'user';
  }

  // ------------------------------------------------------------------ steps

  private saved(): Saved {
    return {
      layout: this.layout,
      contents: this.contents.snapshot(),
      site: this.site?.state,
      title: this.titleText,
    };
  }

  private restore(s: Saved): void {
    this.layout = s.layout;
    this.contents.restore(s.contents);
    if (this.site && s.site) this.site.state = s.site;
    this.titleText = s.title;
  }

  /**
   * Run `work` with the engine's evaluation held until it ends: the user's cells and what the
   * living model writes after them are evaluated once, not once per write (each evaluation walks
   * every figure after compensation, ~8,500 cells on a 300-bus site). Nested calls join the outer one.
   */
  private deferred<T>(work: () => T): T {
    if (this.engine.isEvaluationSuspended()) return work();
    this.engine.suspendEvaluation();
    try {
      return work();
    } finally {
      // A whole-sheet rewrite inside (an engine batch) may have evaluated and resumed already.
      if (this.engine.isEvaluationSuspended()) this.engine.resumeEvaluation();
    }
  }

  /** One undoable step: `work` returns how many engine undo entries it used. */
  private step(work: () => number): void {
    const before = this.saved();
    let entries = 0;
    try {
      entries = this.deferred(work);
    } catch (e) {
      // Put everything back as it was: the engine's entries of this step, then the state beside it.
      for (let i = 0; i < entries; i++) this.engine.undo();
      this.restore(before);
      throw e;
    }
    if (entries === 0) return;
    this.history.record({ engineEntries: entries, before, after: this.saved() });
  }

  /** Write cells to the engine and the contents; returns how many engine undo entries that took. */
  private write(writes: readonly Write[], generated = false): number {
    if (writes.length === 0) return 0;
    const blocks = toBlocks(writes);
    const apply = () => {
      for (const b of blocks)
        this.engine.setCellContents({ sheet: b.sheet, row: b.row, col: b.col }, b.cells);
    };
    let entries = 1;
    if (blocks.length === 1) apply();
    // Held evaluation (a step): an engine batch would evaluate at its end; one entry per block instead.
    else if (this.engine.isEvaluationSuspended()) {
      apply();
      entries = blocks.length;
    } else this.engine.batch(apply);
    for (const w of writes) {
      // Generated formulas are not kept as typed: the model writes them again when the file opens.
      this.contents.set(w.sheet, w.row, w.col, generated && isFormula(w.content) ? null : w.content);
    }
    // Marks on the derived sheets' rows follow their bus when a rewrite moved it.
    const moves = generated ? this.site?.takeRowMoves() : undefined;
    for (const [sheet, rows] of moves ?? []) this.moveMarks(sheet, (m) => marksAfterMoves(m, rows));
    return entries;
  }

  /** Several scattered single-cell writes as one step (an edit, a cut, a clear, a paste). */
  setCells(sheetId: number, cells: ReadonlyArray<{ row: number; col: number; content: CellContent }>): void {
    if (cells.length === 0) return;
    const bad = cells.find(
      (c) => !Number.isInteger(c.row) || !Number.isInteger(c.col) || c.row < 0 || c.col < 0,
    );
    if (bad)
      throw new RangeError(`No cell at row ${bad.row}, column ${bad.col}: rows and columns count from 0`);
    let structural = false;
    const title = this.titleText;
    this.step(() => {
      const done = this.writeCells(sheetId, cells);
      structural = done.structural;
      return done.entries;
    });
    this.emit(structural ? { kind: 'rows', sheetId } : { kind: 'cells', sheetId });
    if (this.titleText !== title) this.emit({ kind: 'title' });
  }

  /** The work of setCells inside a step: the user's writes and what the living model writes after them. */
  private writeCells(
    sheetId: number,
    cells: ReadonlyArray<{ row: number; col: number; content: CellContent }>,
  ): { entries: number; structural: boolean } {
    if (!this.site)
      return { entries: this.write(cells.map((c) => ({ sheet: sheetId, ...c }))), structural: false };
    const edit = siteEdit(this.site, this.contents, sheetId, cells);
    let entries = this.write(edit.writes);
    const follow = edit.follow();
    if (follow.rebuild) {
      entries += this.write(this.tariffRenames(follow.rebuild.caseRenames));
      entries += this.rebuild(renameCaseColumns(this.toDoc(), follow.rebuild.caseRenames)) ? 1 : 0;
      entries += this.write(this.tariffNewCases());
    } else entries += this.write(follow.writes, true);
    this.titleText = siteTitle(this.contents, this.site.ids.site, this.titleText);
    let structural = follow.structural;
    if (sheetId === this.site.ids.comp) {
      this.setMarks(sheetId, cells, []);
      const proposed = this.proposeForDetuning(cells.map((c) => c.row));
      entries += proposed.entries;
      structural ||= proposed.structural;
    }
    return { entries, structural };
  }

  /**
   * Compensation rows the edit left with a detuning alone get the design's bank, marked as
   * proposed, in the same step (detuningProposal.ts). The gate (a number in p (%), no size or
   * reactor typed) keeps the whole-workbook read off every other edit.
   */
  private proposeForDetuning(rows: readonly number[]): { entries: number; structural: boolean } {
    const site = this.site;
    if (!site) return { entries: 0, structural: false };
    const comp = site.plans().comp;
    const typed = (r: number, c: number) => {
      const v = this.contents.cell(site.ids.comp, r, c);
      return v !== null && v !== '';
    };
    const sizes = [comp.input.fixed_kvar, comp.input.step_kvar, comp.input.steps, comp.input.reactor_kvar];
    const candidates = [...new Set(rows)].filter(
      (r) =>
        r > 0 &&
        typed(r, comp.input.p_pct) &&
        Number.isFinite(Number(this.contents.cell(site.ids.comp, r, comp.input.p_pct))) &&
        sizes.every((c) => !typed(r, c) || this.contents.cell(site.ids.comp, r, c) === 0),
    );
    const detuningProposal = loadedDetuningProposal();
    if (candidates.length === 0 || !detuningProposal) return { entries: 0, structural: false };
    const proposal = detuningProposal(this.toDoc(), candidates, comp);
    if (proposal.cells.length === 0) return { entries: 0, structural: false };
    const edit = siteEdit(site, this.contents, site.ids.comp, proposal.cells);
    let entries = this.write(edit.writes);
    const follow = edit.follow();
    entries += this.write(follow.writes, true);
    this.setMarks(site.ids.comp, proposal.cells, proposal.marks);
    return { entries, structural: follow.structural };
  }

  /** The proposed marks of the written cells go (typing over makes a value the user's); `added` come in. */
  private setMarks(
    sheetId: number,
    written: ReadonlyArray<{ row: number; col: number }>,
    added: readonly CellMark[],
  ): void {
    const m = this.layout.meta.get(sheetId) ?? {};
    const at = new Set(written.map((c) => `${c.row},${c.col}`));
    const kept = (m.marks ?? []).filter((k) => k.kind !== 'proposed' || !at.has(`${k.row},${k.col}`));
    if (kept.length === (m.marks ?? []).length && added.length === 0) return;
    const meta = new Map(this.layout.meta);
    const marks = [...kept, ...added];
    const { marks: _old, ...rest } = m;
    meta.set(sheetId, marks.length > 0 ? { ...rest, marks } : rest);
    this.layout = { ...this.layout, meta };
  }

  /**
   * Put typical values into the blank inputs of motors, transformers and feeders that have a rating, each
   * marked as assumed with its source, as one step. Returns how many values went in and why
   * other blanks stay blank. The tables load on first use (not needed to open a workbook).
   */
  async fillTypicalValues(): Promise<TypicalFillReport> {
    const site = this.site;
    if (!site) throw new SessionError('Typical values fill the equipment sheets of a site workbook.');
    const { planPageFill } = await import('./typicalFill.ts');
    const plan = planPageFill(this.contents, site.ids.equipment, equipmentPlans(site.state.cases));
    if (plan.filled === 0) return plan;
    this.step(() => {
      let entries = 0;
      const meta = new Map(this.layout.meta);
      for (const [sheetId, fill] of plan.sheets) {
        entries += this.writeCells(sheetId, fill.cells).entries;
        const m = meta.get(sheetId) ?? {};
        const at = new Set(fill.marks.map((k) => `${k.row},${k.col}`));
        const kept = (m.marks ?? []).filter((k) => !at.has(`${k.row},${k.col}`));
        meta.set(sheetId, { ...m, marks: [...kept, ...fill.marks] });
      }
      this.layout = { ...this.layout, meta };
      return entries;
    });
    for (const sheetId of plan.sheets.keys()) this.emit({ kind: 'cells', sheetId });
    return plan;
  }

  /** Write a block of contents with its top-left at (row, col). */
  setBlock(sheetId: number, row: number, col: number, block: CellContent[][]): void {
    if (block.length === 0) return;
    const cells = block.flatMap((line, r) =>
      line.map((content, c) => ({ row: row + r, col: col + c, content })),
    );
    this.setCells(sheetId, cells);
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

  private rowsRefused(sheetId: number, at: number): void {
    if (!this.site) return;
    const role = this.site.role(sheetId);
    const name = this.sheetName(sheetId);
    if (role.kind === 'site' || role.kind === 'buses' || role.kind === 'compensation') {
      throw new SessionError(
        `Rows of the ${name} sheet follow the site (one row per setting, case or bus); add or remove equipment instead.`,
      );
    }
    if (role.kind === 'quantities') {
      throw new SessionError(
        `Rows of the ${name} sheet follow the buses (a block of item lines per bus); change the banks on the Compensation sheet or the rates on the Rates sheet instead.`,
      );
    }
    if (role.kind === 'options') {
      throw new SessionError(
        `Rows of the ${name} sheet follow the buses (a block per option, a bus line per bus); type an option's banks on its bus lines instead.`,
      );
    }
    if (role.kind === 'equipment' && at === 0) {
      throw new SessionError(
        `The header row of ${name} names the columns the formulas and the export rely on; it stays.`,
      );
    }
  }

  insertRows(sheetId: number, at: number, count: number): void {
    this.rowsRefused(sheetId, at);
    this.step(() => {
      this.engine.addRows(sheetId, [at, count]);
      this.contents.insertRows(sheetId, at, count);
      this.moveMarks(sheetId, (m) => marksAfterRows(m, at, count));
      const role = this.site?.role(sheetId);
      if (!this.site || role?.kind !== 'equipment') return 1;
      return 1 + this.write(this.site.afterEquipmentRows(role.index, at, count), true);
    });
    this.emit({ kind: 'rows', sheetId });
  }

  removeRows(sheetId: number, at: number, count: number): void {
    this.rowsRefused(sheetId, at);
    this.step(() => {
      this.engine.removeRows(sheetId, [at, count]);
      this.contents.removeRows(sheetId, at, count);
      this.moveMarks(sheetId, (m) => marksAfterRows(m, at, -count));
      const role = this.site?.role(sheetId);
      if (!this.site || role?.kind !== 'equipment') return 1;
      return 1 + this.write(this.site.afterEquipmentRows(role.index, at, -count), true);
    });
    this.emit({ kind: 'rows', sheetId });
  }

  /**
   * Sort the rows of an equipment sheet (below its header) by the values shown in one column, as
   * one step. Rows move whole: what was typed, typed-over cells and typed formulas (their relative
   * references move with the row, as in any spreadsheet); the generated cells follow the inputs.
   */
  sortRows(sheetId: number, col: number, descending: boolean): void {
    const role = this.site?.role(sheetId);
    if (role?.kind !== 'equipment')
      throw new SessionError(
        `Sorting rows works on the equipment sheets; ${this.sheetName(sheetId)} keeps its order.`,
      );
    const rows = this.contents.get(sheetId);
    const last = rows.length - 1;
    if (last < 2) return;
    const values = [];
    for (let row = 1; row <= last; row++) values.push(this.engine.getCellValue({ sheet: sheetId, row, col }));
    const order = sortedOrder(values, descending);
    if (order.every((from, i) => from === i)) return;
    const width = Math.max(...rows.map((r) => r.length));
    const cells: Array<{ row: number; col: number; content: CellContent }> = [];
    order.forEach((from, i) => {
      const row = i + 1,
        source = from + 1;
      const line = rows[source] ?? [];
      for (let c = 0; c < width; c++) {
        const typed = line[c] ?? null;
        const range = {
          start: { sheet: sheetId, row: source, col: c },
          end: { sheet: sheetId, row: source, col: c },
        };
        const content = isFormula(typed)
          ? (this.movedContents(range, { sheet: sheetId, row, col: c })[0]?.[0] ?? typed)
          : typed;
        if (content !== (rows[row]?.[c] ?? null)) cells.push({ row, col: c, content });
      }
    });
    this.step(() => {
      this.moveMarks(sheetId, (m) => marksAfterOrder(m, 1, order));
      return this.writeCells(sheetId, cells).entries;
    });
    this.emit({ kind: 'rows', sheetId });
  }

  /** Keep a sheet's cell marks with their cells when rows move (inside a step). */
  private moveMarks(sheetId: number, move: (marks: readonly CellMark[]) => CellMark[]): void {
    const m = this.layout.meta.get(sheetId);
    if (!m?.marks || m.marks.length === 0) return;
    const meta = new Map(this.layout.meta);
    meta.set(sheetId, { ...m, marks: move(m.marks) });
    this.layout = { ...this.layout, meta };
  }

  // ------------------------------------------------------------------ sheets

  addSheet(name: string, afterId?: number): number {
    const problem = sheetNameProblem(name, this.sheetNames());
    if (problem) throw new SessionError(problem);
    let id = -1;
    this.step(() => {
      this.engine.addSheet(name);
      id = this.engine.getSheetId(name) as number;
      const order = [...this.layout.order];
      const pos = afterId === undefined ? order.length : order.indexOf(afterId) + 1;
      order.splice(pos, 0, id);
      const meta = new Map(this.layout.meta);
      meta.set(id, {});
      this.layout = { order, meta };
      this.contents.seed(id, []);
      return 1 + this.pricingFollows([name]);
    });
    this.emit({ kind: 'sheets' });
    return id;
  }

  renameSheet(id: number, name: string): void {
    const current = this.sheetName(id);
    if (name === current) return;
    if (this.isBuiltIn(id)) {
      throw new SessionError(
        `${current} is one of the site's own sheets: formulas, the CLI and the export find it by this name.`,
      );
    }
    const problem = sheetNameProblem(name, this.sheetNames(), current);
    if (problem) throw new SessionError(problem);
    if (this.site && isBuiltInSheet(name, []))
      throw new SessionError(`"${name}" is the name of one of the site's own sheets.`);
    this.step(() => {
      this.engine.renameSheet(id, name);
      this.refreshFormulas();
      return 1 + this.pricingFollows([current, name]);
    });
    this.emit({ kind: 'sheets' });
  }

  removeSheet(id: number): void {
    if (this.layout.order.length <= 1) throw new SessionError('A workbook keeps at least one sheet.');
    if (this.isBuiltIn(id)) {
      throw new SessionError(
        `${this.sheetName(id)} is one of the site's own sheets: it can be emptied but not deleted, since the buses, the compensation and the export are built from it.`,
      );
    }
    const removed = this.sheetName(id);
    this.step(() => {
      // Written while the sheet is still there, so undo restores the sheet before the lookups into it.
      const follow = this.pricingFollows([removed], removed);
      this.engine.removeSheet(id);
      const meta = new Map(this.layout.meta);
      meta.delete(id);
      this.layout = { order: this.layout.order.filter((x) => x !== id), meta };
      this.contents.drop(id);
      this.refreshFormulas();
      return 1 + follow;
    });
    this.emit({ kind: 'sheets' });
  }

  /**
   * A sheet named Rates or Tariff came or went (added, renamed, removed): the Quantities and cost
   * sheet is written anew, so its lookups point at the sheet of that name or say there is none,
   * as the command line reads the workbook; `going`: a sheet about to be removed, taken as absent.
   * Returns the engine entries written (one per sheet written while a step holds evaluation).
   */
  private pricingFollows(names: readonly string[], going?: string): number {
    if (!this.site || !names.some(isPricingSheet)) return 0;
    return this.write(this.site.quantitiesWrites(going), true);
  }

  /** After the engine rewrote references (a sheet renamed or removed): formulas as it now holds them. */
  private refreshFormulas(): void {
    for (const id of this.layout.order) {
      this.contents.get(id).forEach((line, r) =>
        line.forEach((v, c) => {
          if (isFormula(v))
            this.contents.set(id, r, c, this.engine.getCellFormula({ sheet: id, row: r, col: c }) ?? v);
        }),
      );
    }
  }

  // ------------------------------------------------------------------ undo

  get canUndo(): boolean {
    return this.history.canUndo;
  }

  get canRedo(): boolean {
    return this.history.canRedo;
  }

  undo(): boolean {
    const s = this.history.undo();
    if (!s) return false;
    this.deferred(() => {
      for (let i = 0; i < s.engineEntries; i++) this.engine.undo();
    });
    this.restore(s.before);
    this.emit({ kind: 'history' });
    return true;
  }

  redo(): boolean {
    const s = this.history.redo();
    if (!s) return false;
    this.deferred(() => {
      for (let i = 0; i < s.engineEntries; i++) this.engine.redo();
    });
    this.restore(s.after);
    this.emit({ kind: 'history' });
    return true;
  }

  // ------------------------------------------------------------------ contents

  /** Contents of a sheet as typed (generated formulas left out), trailing blanks trimmed. Do not modify. */
  sheetContents(id: number): readonly (readonly CellContent[])[] {
    return this.contents.get(id);
  }

  /** A cell as the user would edit it: what was typed, or the formula Kvar Ledger wrote there. */
  cellContent(sheetId: number, row: number, col: number): CellContent {
    const typed = this.contents.cell(sheetId, row, col);
    if (typed !== null)
      return isFormula(typed) ? (this.engine.getCellFormula({ sheet: sheetId, row, col }) ?? typed) : typed;
    return this.engine.getCellFormula({ sheet: sheetId, row, col }) ?? null;
  }

  /** Is this cell one Kvar Ledger writes, holding what the user typed over it? */
  isOverride(sheetId: number, row: number, col: number): boolean {
    return this.site?.isOverride(sheetId, row, col) ?? false;
  }

  /** The workbook as saved: what was typed (formulas as the engine holds them now) and the typed-over cells. */
  toDoc(): WorkbookDoc {
    const sheets: SheetDoc[] = this.layout.order.map((id) => {
      const m = this.meta(id);
      const cells = this.contents
        .get(id)
        .map((line, r) =>
          line.map((v, c) =>
            isFormula(v) ? (this.engine.getCellFormula({ sheet: id, row: r, col: c }) ?? v) : v,
          ),
        );
      const over = [...(this.site?.state.overrides.get(id) ?? [])].map(
        (k) => k.split(',').map(Number) as unknown as CellAt,
      );
      return {
        name: this.sheetName(id),
        cells,
        ...(m.columns ? { columns: m.columns } : {}),
        ...(m.purpose ? { purpose: m.purpose } : {}),
        ...(over.length > 0 ? { overrides: over.sort((a, b) => a[0] - b[0] || a[1] - b[1]) } : {}),
        ...metaExtras(m),
      };
    });
    return { format: 'kvar-ledger-workbook', version: this.site ? 2 : 1, title: this.titleText, sheets };
  }

  /** The Tariff sheet's hours rows of renamed cases, renamed with them (tariffCases.ts). */
  private tariffRenames(renames: ReadonlyMap<string, string>): Write[] {
    const id = this.tariffSheetId();
    if (renames.size === 0 || id === undefined) return [];
    return tariffRenameWrites(id, this.contents.get(id), renames);
  }

  /** An hours row on the Tariff sheet for each case that has none (tariffCases.ts). */
  private tariffNewCases(): Write[] {
    const id = this.tariffSheetId();
    if (!this.site || id === undefined) return [];
    return tariffNewCaseWrites(id, this.contents.get(id), this.site.state.cases);
  }

  private tariffSheetId(): number | undefined {
    return this.sheetIds().find((i) => this.sheetName(i).toLowerCase() === TARIFF_SHEET.toLowerCase());
  }

  /**
   * Every built-in sheet written anew from the inputs of `doc` (the cases or the Site layout
   * changed, or option blocks drafted); the Design options sheet's marks come with its cells.
   */
  private rebuild(doc: WorkbookDoc, draftOptions?: RenderOptions['draftOptions']): boolean {
    const site = this.site as SiteModel;
    const r = renderWorkbook(doc, { flavour: 'live', ...(draftOptions ? { draftOptions } : {}) });
    const ids = site.ids;
    const builtIn = [ids.site, ...ids.equipment, ids.buses, ids.comp, ids.quant, ids.opts];
    this.engine.batch(() => {
      for (const id of builtIn) {
        const sheet = r.doc.sheets.find((s) => s.name === this.sheetName(id)) as SheetDoc;
        this.engine.setSheetContent(id, sheet.cells);
      }
    });
    const meta = new Map(this.layout.meta);
    const overrides = new Map<number, Set<string>>();
    for (const id of builtIn) {
      const sheet = r.doc.sheets.find((s) => s.name === this.sheetName(id)) as SheetDoc;
      // The options sheet's marks come laid out with its cells; the other sheets keep theirs.
      const { marks: was, ...rest } = meta.get(id) ?? {};
      const marks = id === ids.opts ? sheet.marks : was;
      meta.set(id, {
        ...rest,
        ...(marks && marks.length > 0 ? { marks } : {}),
        ...(sheet.columns ? { columns: sheet.columns } : {}),
        purpose: sheet.purpose ?? '',
      });
      overrides.set(id, new Set((sheet.overrides ?? []).map(([a, b]) => `${a},${b}`)));
    }
    this.layout = { order: this.layout.order, meta };
    const notes = readSettingsInputs(r.doc.sheets[0]).notes.length;
    const { retired, retiredOptions } = site.state;
    site.state = { ...stateOf(r, overrides, notes), retired, retiredOptions };
    for (const id of builtIn) {
      const sheet = r.doc.sheets.find((s) => s.name === this.sheetName(id)) as SheetDoc;
      this.contents.replace(id, stripGenerated(site, id, sheet.cells));
    }
    return true;
  }

  /** Opened without a Design options sheet, its blocks not drafted yet (draftMissingOptions). */
  get awaitsOptionDraft(): boolean {
    return this.optionsToDraft;
  }

  /**
   * A site workbook opened without a Design options sheet (made or saved before it) has blank
   * option blocks: once the design has loaded (loadOptionDrafter), the standard options are
   * drafted into them, marked as proposed, as one undoable step, as the CLI and a new workbook
   * have them. Nothing when something was typed there meanwhile, or the inputs have errors (the
   * design cannot run; Checks says why). True when the options were drafted.
   */
  draftMissingOptions(): boolean {
    const site = this.site;
    const optionDrafter = loadedOptionDrafter();
    if (!site || !this.optionsToDraft || !optionDrafter) return false;
    this.optionsToDraft = false;
    const cols = planOptionColumns(site.state.cases);
    if (anyOptionTyped(readOptionInputs({ cells: this.contents.get(site.ids.opts) }, cols))) return false;
    const doc = this.toDoc();
    const drafts = optionDrafter(doc);
    if (drafts.length === 0) return false;
    // Without its sheet, the workbook is drafted as render.ts drafts one saved before the sheet.
    const without = { ...doc, sheets: doc.sheets.filter((s) => s.name !== this.sheetName(site.ids.opts)) };
    this.step(() => (this.rebuild(without, () => drafts) ? 1 : 0));
    this.emit({ kind: 'rows', sheetId: site.ids.opts });
    return true;
  }

  destroy(): void {
    this.listeners.clear();
    this.engine.destroy();
  }
}

const isPricingSheet = (name: string) =>
  [RATES_SHEET, TARIFF_SHEET].some((s) => s.toLowerCase() === name.toLowerCase());
