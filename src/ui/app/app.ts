// The page: wires the open workbook (session) to the grid, formula bar, sheet index, panels,
// status bar and autosave. Replacing the workbook (template, file, restore) builds a new session
// and a new grid; everything else stays.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { CATALOGUE } from '../../core/functions/index.ts';
import { el } from '../dom.ts';
import { FormulaAssist } from '../autocomplete/formulaAssist.ts';
import { FormulaBar } from '../formulaBar.ts';
import { GridView, type Selection } from '../grid/gridView.ts';
import { fillDown } from '../grid/gridMenu.ts';
import { WorkbookSession, SessionError } from '../model/session.ts';
import { loadOptionDrafter } from '../model/designLoaders.ts';
import { LazyReference } from '../panels/lazyReference.ts';
import { SheetList } from '../sheetList.ts';
import { StatusBar } from '../statusBar.ts';
import type { WorkbookStore } from '../storage/idbStore.ts';
import type { TabStorage } from '../storage/tabStorage.ts';
import { Keeping } from './keeping.ts';
import { SidePanel } from './sidePanel.ts';
import { showAbout } from './lazyCommands.ts';
import { buildTopBar } from './topBar.ts';
import { selectionNumbers } from './sheetScan.ts';
import { ErrorTracker } from './errorTracker.ts';
import { navigationKey } from './navigation.ts';
import type { ChartsPanel } from '../charts/chartsPanel.ts';
import type { ChecksPanel } from '../panels/checksPanel.ts';
import type { DiagramPanel } from '../diagram/diagramPanel.ts';
import type { LazyPanel } from './lazyPanel.ts';

export class App {
  session!: WorkbookSession;
  grid!: GridView;
  readonly assist: FormulaAssist;
  readonly formulaBar: FormulaBar;
  readonly sheets: SheetList;
  readonly status: StatusBar;
  readonly side = new SidePanel();
  readonly reference: LazyReference;
  charts: LazyPanel<ChartsPanel> | undefined;
  checks: ChecksPanel | undefined;
  diagram: LazyPanel<DiagramPanel> | undefined;
  private readonly gridHost: HTMLElement;
  private readonly caption: HTMLElement;
  private readonly titleInput: HTMLInputElement;
  private readonly keeping: Keeping;
  private sheet = -1;
  private lastSelection: Selection | undefined;
  private scanQueued: ReturnType<typeof setTimeout> | undefined;
  private errors: ErrorTracker | undefined;

  constructor(
    readonly root: HTMLElement,
    readonly store: WorkbookStore | undefined,
    standardNames: readonly string[],
    /** Where this tab saves (the workbook's slot, or a copy when another tab has it open). */
    readonly storage?: TabStorage,
  ) {
    const app = this; // eslint-disable-line @typescript-eslint/no-this-alias -- getters below read the current session
    this.assist = new FormulaAssist(standardNames, (f) => this.formulaBar.mirror(f.value));
    this.formulaBar = new FormulaBar({
      get session() {
        return app.session;
      },
      assist: this.assist,
      columns: (id) => this.session.meta(id).columns,
      hasHeaderRow: (id) => (this.session.meta(id).columns?.length ?? 0) > 0,
      returnFocus: () => this.grid.focus(),
    });
    this.sheets = new SheetList({
      get session() {
        return app.session;
      },
      current: () => this.sheet,
      open: (id) => this.openSheet(id),
      notice: (t, k) => this.status.show(t, k),
    });
    this.status = new StatusBar(
      () => this.nextError(),
      () => showAbout(CATALOGUE.length),
    );
    this.reference = new LazyReference({
      session: () => this.session,
      currentSheet: () => this.sheet,
      insert: (text) => this.insertIntoCell(text),
    });
    this.side.add('functions', 'Function reference', this.reference.root, () => this.reference.refresh());
    this.gridHost = el('div', { className: 'kl-grid-host', attrs: { 'data-testid': 'grid' } });
    this.caption = el('div', { className: 'kl-caption', attrs: { 'data-testid': 'sheet-caption' } });
    const top = buildTopBar(this);
    this.titleInput = top.title;
    root.append(
      top.root,
      this.formulaBar.root,
      el('div', { className: 'kl-main' }, [
        this.sheets.root,
        el('section', { className: 'kl-work' }, [this.caption, this.gridHost]),
        this.side.root,
      ]),
      this.status.root,
    );
    this.keeping = new Keeping(
      store,
      storage,
      () => this.session.toDoc(),
      (st) => this.status.saveStatus(st),
    );
  }

  /** Show a workbook in place of the current one. `changed`: save it right away (a new workbook). */
  open(doc: WorkbookDoc, opts: { note?: string; changed?: boolean } = {}): void {
    this.show(WorkbookSession.fromDoc(doc), opts);
  }

  private show(next: WorkbookSession, opts: { note?: string; changed?: boolean }): void {
    this.errors?.dispose();
    this.grid?.destroy();
    this.session?.destroy();
    this.gridHost.replaceChildren();
    this.session = next;
    this.errors = new ErrorTracker(next.engine);
    this.grid = new GridView(this.gridHost, next, {
      onSelect: (sel) => this.onSelect(sel),
      onEditorOpen: (input) => this.onEditorOpen(input),
      onKey: (e) => this.onGridKey(e),
      onNotice: (t) => this.status.show(t),
    });
    next.onChange((c) => {
      // First of all, the edit goes to the journal in the browser store (the write is issued here).
      this.keeping.edited(c, next);
      if (c.kind !== 'cells' && c.kind !== 'title') this.errors?.invalidate();
      if (c.kind === 'sheets' || c.kind === 'history') this.afterSheetsChange();
      if (c.kind === 'title') this.titleInput.value = next.title;
      this.formulaBar.show(this.grid.selection());
      this.queueScan();
      this.charts?.update(next);
      this.checks?.update(next);
      this.diagram?.update(next);
    });
    this.titleInput.value = next.title;
    this.sheet = -1;
    this.openSheet(next.sheetIds()[0] as number);
    this.charts?.update(next);
    this.checks?.update(next);
    this.diagram?.update(next);
    if (this.side.shown === 'functions') this.reference.refresh();
    if (opts.note) this.status.show(opts.note, 'info', 10_000);
    this.keeping.opened(next, opts.changed === true);
    // A workbook saved before the Design options sheet: its blocks drafted once the design loads.
    if (next.awaitsOptionDraft)
      void loadOptionDrafter().then(() => {
        if (this.session === next) next.draftMissingOptions();
      });
  }

  /**
   * Replace the open workbook by another (template, file, import, bringing one back): the one on
   * screen is first set aside in the browser, so Workbook → Bring back returns it.
   */
  async replaceWith(doc: WorkbookDoc | WorkbookSession, note: string): Promise<boolean> {
    let next: WorkbookSession;
    try {
      // A session already built (with progress shown, see fileActions.ts) is taken as it is.
      next = doc instanceof WorkbookSession ? doc : WorkbookSession.fromDoc(doc);
    } catch (e) {
      this.status.show(
        `The workbook could not be opened: ${e instanceof Error ? e.message : String(e)}. The open workbook is unchanged.`,
        'error',
        0,
      );
      return false;
    }
    let aside = '';
    if (this.store) {
      await this.flush();
      const r = await this.store.setAside(this.session.toDoc());
      aside = r.ok
        ? ' The workbook it replaced is set aside: Workbook → Bring back the replaced workbook.'
        : ` The workbook it replaced could not be set aside (${r.message}).`;
    }
    this.show(next, { note: note + aside, changed: true });
    return true;
  }

  get hasWorkbook(): boolean {
    return this.session !== undefined;
  }

  currentSheet(): number {
    return this.sheet;
  }

  openSheet(id: number): void {
    this.sheet = id;
    this.grid.show(id);
    this.sheets.render();
    const name = this.session.sheetName(id);
    const purpose = this.session.meta(id).purpose;
    this.caption.replaceChildren(
      el('strong', { text: name }),
      purpose ? el('span', { text: ` — ${purpose}` }) : '',
    );
    this.queueScan();
  }

  private afterSheetsChange(): void {
    const ids = this.session.sheetIds();
    if (!ids.includes(this.sheet)) this.openSheet(ids[0] as number);
    else {
      this.sheets.render();
      this.openSheetCaption();
    }
  }

  private openSheetCaption(): void {
    const purpose = this.session.meta(this.sheet).purpose;
    this.caption.replaceChildren(
      el('strong', { text: this.session.sheetName(this.sheet) }),
      purpose ? el('span', { text: ` — ${purpose}` }) : '',
    );
  }

  private onSelect(sel: Selection): void {
    this.lastSelection = sel;
    this.formulaBar.show(sel);
    const cells = (sel.bottom - sel.top + 1) * (sel.right - sel.left + 1);
    this.status.selection(selectionNumbers(this.session, sel), cells);
  }

  private onEditorOpen(input: HTMLTextAreaElement | HTMLInputElement): void {
    this.assist.attach(input);
    if (!input.dataset.klMirror) {
      input.dataset.klMirror = '1';
      input.addEventListener('input', () => this.formulaBar.mirror(input.value));
    }
    this.formulaBar.mirror(input.value);
  }

  /** Keys the grid hands over first; true = handled here. */
  private onGridKey(e: KeyboardEvent): boolean {
    if (this.grid.isEditing()) {
      if (this.assist.handleKey(e)) return true;
      // Escape drops the edit: the bar goes back to the cell's content once the editor closed.
      if (e.key === 'Escape') setTimeout(() => this.formulaBar.show(this.grid.selection()), 0);
      return false;
    }
    if (navigationKey(this, e)) return true;
    const mod = e.ctrlKey || e.metaKey;
    if (!mod || e.altKey) return false;
    const k = e.key.toLowerCase();
    if (k === 'z' && !e.shiftKey) return (this.undo(), true);
    if (k === 'y' || (k === 'z' && e.shiftKey)) return (this.redo(), true);
    if (k === 'd') return (this.run(() => fillDown(this.grid)), true);
    return false;
  }

  /** Run a command, turning a refusal into a message instead of an exception. */
  run(fn: () => unknown): void {
    const refused = (e: unknown) =>
      this.status.show(e instanceof SessionError || e instanceof Error ? e.message : String(e), 'error');
    try {
      const r = fn();
      // A command that loads its code first (e.g. the typical-value tables) refuses later.
      if (r instanceof Promise) r.catch(refused);
    } catch (e) {
      refused(e);
    }
  }

  undo(): void {
    this.status.show(this.session.undo() ? 'Undone.' : 'Nothing to undo.', 'info', 2500);
  }

  redo(): void {
    this.status.show(this.session.redo() ? 'Redone.' : 'Nothing to redo.', 'info', 2500);
  }

  /** "Insert into cell": the text goes into the formula bar for the active cell, ready to finish and Enter. */
  insertIntoCell(text: string): void {
    this.formulaBar.begin(text);
  }

  /** Save what is pending and wait for it (before the workbook is replaced). */
  flush(): Promise<void> {
    return this.keeping.flush();
  }

  /** The page is being hidden or closed: issue the pending save now, synchronously. */
  flushNow(): void {
    this.keeping.flushNow();
  }

  /** The browser storage was closed for a newer page: say so, and keep saying it. */
  storeClosed(message: string): void {
    this.keeping.storeClosed(message);
  }

  /** Would closing the page now lose a change? (The page then asks before it closes.) */
  get unsafeToClose(): boolean {
    return this.keeping.unsafeToClose;
  }

  /** The error count: kept current from the engine's changes; a full scan waits for a pause. */
  private queueScan(): void {
    const tracker = this.errors;
    if (!tracker) return;
    if (!tracker.needsScan) return this.status.errorCount(tracker.count());
    if (this.scanQueued) clearTimeout(this.scanQueued);
    this.scanQueued = setTimeout(() => {
      this.scanQueued = undefined;
      if (this.errors === tracker) this.status.errorCount(tracker.count());
    }, 250);
  }

  /** The next error cell of the workbook after the active one, on whichever sheet it is. */
  private nextError(): void {
    const at = this.lastSelection;
    const next = this.errors?.next(
      this.session.sheetIds(),
      at && { sheet: at.sheetId, row: at.row, col: at.col },
    );
    if (!next) return;
    if (next.sheet !== this.sheet) this.openSheet(next.sheet);
    this.grid.select(next.row, next.col);
  }

  catalogueSize(): number {
    return CATALOGUE.length;
  }
}
