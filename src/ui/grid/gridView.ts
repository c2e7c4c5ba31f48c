// The grid over the open workbook: one Handsontable showing the current sheet. The engine is the
// source of truth; the grid shows engine values through its renderer and hands every edit,
// paste, fill and row change to the session as one undoable step (see gridEdits.ts).
import type { GridSettings, HotInstance } from 'handsontable/base';
import type { ColumnInfo } from '../../core/workbook/document.ts';
import { columnLetters } from '../model/address.ts';
import type { SessionChange, WorkbookSession } from '../model/session.ts';
import { escapeHtml } from '../dom.ts';
import { makeCellRenderer } from './cellRenderer.ts';
import { decorateColumnHeader } from './columnHeaderView.ts';
import { gridData } from './gridData.ts';
import { GRID_LICENSE_KEY, Handsontable, registerGridModules } from './hotModules.ts';
import { installEditHandlers, type EditHost } from './gridEdits.ts';
import { attachContextMenu, type CellMenu } from './gridContextMenu.ts';
import { dataEdgeTarget, type Direction } from './dataEdge.ts';
import { CellNotes } from './cellNotes.ts';
import { attachChoiceClicks, installChoiceCheck, openChoiceList, type ChoiceHost } from './cellChoices.ts';
import { columnWidth, frozenColumns } from './gridColumns.ts';

export interface Selection {
  readonly sheetId: number;
  /** The active cell. */
  readonly row: number;
  readonly col: number;
  /** The selected block (ordered). */
  readonly top: number;
  readonly left: number;
  readonly bottom: number;
  readonly right: number;
}

export interface GridCallbacks {
  onSelect(sel: Selection): void;
  onEditorOpen(input: HTMLTextAreaElement | HTMLInputElement): void;
  onKey(e: KeyboardEvent): boolean;
  onNotice(text: string): void;
}

/** Only text ever reaches the grid's HTML sinks; pasted HTML is dropped so the TSV text is used. */
function textOnlySanitizer(content: string, source: string): string {
  return source.startsWith('CopyPaste') ? '' : escapeHtml(content);
}

const ARROWS: Readonly<Record<string, Direction>> = {
  ArrowUp: 'up',
  ArrowDown: 'down',
  ArrowLeft: 'left',
  ArrowRight: 'right',
};

export class GridView implements EditHost, ChoiceHost {
  readonly hot: HotInstance;
  private current = -1;
  private dataRows = 0;
  /** The grid's copy of the sheet: the array the grid holds (it edits it in place). */
  private data: string[][] = [['']];
  private cellNotes: CellNotes | undefined;
  private readonly menu: CellMenu;
  private readonly detachChoices: () => void;
  /** Set while the grid itself pushes a change, so the session echo does not reload the data. */
  applying = false;

  constructor(
    host: HTMLElement,
    readonly session: WorkbookSession,
    readonly callbacks: GridCallbacks,
  ) {
    registerGridModules();
    const renderer = makeCellRenderer({
      engine: session.engine,
      sheetId: () => this.current,
      columns: () => this.columns(),
      hasHeaderRow: () => this.hasHeaderRow(),
      dataRows: () => this.dataRows,
      isOverride: (row, col) => session.isOverride(this.current, row, col),
      notes: () => this.cellNotes,
    });
    const settings: GridSettings = {
      data: [['']],
      licenseKey: GRID_LICENSE_KEY,
      themeName: 'ht-theme-main',
      renderer,
      editor: 'text',
      rowHeaders: true,
      // Two lines: the letter, then the column's unit and number format.
      columnHeaderHeight: 34,
      colHeaders: (i: number) => columnLetters(i),
      afterGetColHeader: (col: number, th: HTMLTableCellElement) =>
        decorateColumnHeader(col, th, this.columns()),
      width: '100%',
      height: '100%',
      outsideClickDeselects: false,
      autoWrapRow: false,
      autoWrapCol: false,
      enterBeginsEditing: true,
      fillHandle: { autoInsertRow: false },
      manualColumnResize: true,
      copyPaste: { copyColumnHeaders: false },
      injectCoreCss: false,
      // One line per row keeps the sheet dense; the full text is in the formula bar.
      wordWrap: false,
      textEllipsis: true,
      sanitizer: textOnlySanitizer,
      minSpareRows: 5,
      afterSelection: () => this.reportSelection(),
      afterBeginEditing: () => {
        const editor = this.hot.getActiveEditor() as unknown as
          { TEXTAREA?: HTMLTextAreaElement | HTMLInputElement } | undefined;
        if (editor?.TEXTAREA) callbacks.onEditorOpen(editor.TEXTAREA);
      },
      beforeKeyDown: (e: KeyboardEvent) => {
        if (!this.ownKey(e) && !callbacks.onKey(e)) return;
        e.preventDefault();
        // The grid's own way of saying "handled": its key handling checks this flag, not the DOM's.
        (e as KeyboardEvent & { isImmediatePropagationEnabled?: boolean }).isImmediatePropagationEnabled =
          false;
        e.stopImmediatePropagation();
      },
    };
    this.hot = new Handsontable(host, settings) as HotInstance;
    // Before the edit handlers: a value a choice cell refuses never reaches the workbook.
    installChoiceCheck(this);
    installEditHandlers(this);
    this.menu = attachContextMenu(host, this);
    this.detachChoices = attachChoiceClicks(this, host);
    session.onChange((c) => this.onSessionChange(c));
  }

  get sheetId(): number {
    return this.current;
  }

  columns(): readonly ColumnInfo[] | undefined {
    return this.current < 0 ? undefined : this.session.meta(this.current).columns;
  }

  hasHeaderRow(): boolean {
    return (this.columns()?.length ?? 0) > 0;
  }

  notes(): CellNotes | undefined {
    return this.cellNotes;
  }

  notice(text: string): void {
    this.callbacks.onNotice(text);
  }

  /**
   * Keys the grid view handles itself (not while editing): Alt+↓ opens a choice cell's list,
   * Shift+F10 and the menu key the cell menu, Ctrl+Arrow moves to the data's edge.
   */
  private ownKey(e: KeyboardEvent): boolean {
    if (this.isEditing()) return false;
    const sel = this.selection();
    if (!sel) return false;
    if (e.altKey && e.key === 'ArrowDown') return openChoiceList(this, sel.row, sel.col);
    if ((e.shiftKey && e.key === 'F10') || e.key === 'ContextMenu') {
      this.menu.openAtActiveCell();
      return true;
    }
    const dir = ARROWS[e.key];
    if (dir && (e.ctrlKey || e.metaKey) && !e.altKey) {
      this.jumpToDataEdge(sel, dir, e.shiftKey);
      return true;
    }
    return false;
  }

  private jumpToDataEdge(sel: Selection, dir: Direction, extend: boolean): void {
    // The data's extent from the contents (trailing blanks trimmed): the engine's dimensions
    // keep counting a row that was filled and then undone.
    const contents = this.session.sheetContents(sel.sheetId);
    const size = { height: contents.length, width: contents.reduce((m, r) => Math.max(m, r.length), 0) };
    const filled = (row: number, col: number) => {
      const c = this.session.cellContent(sel.sheetId, row, col);
      return c !== null && c !== undefined && c !== '';
    };
    // With Shift the far corner of the block moves; its anchor (the active cell) stays.
    const from = extend
      ? {
          row: dir === 'up' || dir === 'down' ? (sel.top === sel.row ? sel.bottom : sel.top) : sel.row,
          col: dir === 'left' || dir === 'right' ? (sel.left === sel.col ? sel.right : sel.left) : sel.col,
        }
      : { row: sel.row, col: sel.col };
    const to = dataEdgeTarget(filled, from, dir, { rows: size.height, cols: size.width });
    if (!extend) return this.select(to.row, to.col);
    const rowEnd = dir === 'up' || dir === 'down' ? to.row : sel.row === sel.top ? sel.bottom : sel.top;
    const colEnd = dir === 'left' || dir === 'right' ? to.col : sel.col === sel.left ? sel.right : sel.left;
    this.hot.selectCell(sel.row, sel.col, rowEnd, colEnd, true);
  }

  private readNotes(): void {
    const n = this.current < 0 ? undefined : new CellNotes(this.session.meta(this.current));
    this.cellNotes = n && !n.empty ? n : undefined;
  }

  private measure(): void {
    this.dataRows = this.current < 0 ? 0 : this.session.engine.getSheetDimensions(this.current).height;
  }

  /** Show a sheet: its data, frozen header row, column widths. */
  show(sheetId: number): void {
    this.current = sheetId;
    this.measure();
    this.readNotes();
    const cols = this.columns();
    const frozen = frozenColumns(cols);
    // Selection first goes to a plain cell, so no frozen-row overlay is asked for a cell while
    // the number of frozen rows changes; then the new sheet; then its first data cell.
    this.hot.deselectCell();
    this.data = gridData(this.session.sheetContents(sheetId), cols?.length ?? 0);
    this.hot.updateSettings({
      data: this.data,
      fixedRowsTop: this.hasHeaderRow() ? 1 : 0,
      // Tag and Bus (and what lies between) stay in view on equipment sheets.
      fixedColumnsStart: frozen,
      colWidths: (i: number) => columnWidth(cols, i, frozen),
      // The header row holds two lines of wrapped header text.
      rowHeights: (i: number) => (i === 0 && cols ? 36 : undefined) as number,
    });
    this.hot.render();
    // A sheet opens at its top left: frozen columns never scroll, so selecting A2 alone would
    // leave the rest of the sheet where the last one was scrolled.
    this.hot.scrollViewportTo({ row: 0, col: frozen, verticalSnap: 'top', horizontalSnap: 'start' });
    this.hot.selectCell(this.hasHeaderRow() ? 1 : 0, 0);
    this.reportSelection();
  }

  /** Reload the grid's copy of the sheet from the engine (after pastes, fills, row changes, undo). */
  reload(): void {
    if (this.current < 0) return;
    if (!this.session.sheetIds().includes(this.current)) return;
    this.measure();
    this.readNotes();
    if (this.syncCopy()) this.hot.render();
    this.reportSelection();
  }

  /**
   * Bring the grid's copy in line with the contents. Of the same shape, only the cells that differ
   * are written, in place: giving the grid a whole new copy re-renders and re-measures everything.
   * Returns false when the grid has taken a new copy (which renders itself).
   */
  private syncCopy(): boolean {
    const next = gridData(this.session.sheetContents(this.current), this.columns()?.length ?? 0);
    const cur = this.data;
    const sameShape =
      this.hot.getSettings().data === cur &&
      cur.length === next.length &&
      cur.every((row, r) => row.length === next[r]?.length);
    if (!sameShape) {
      this.data = next;
      this.hot.updateData(next);
      return false;
    }
    next.forEach((row, r) => {
      const mine = cur[r] as string[];
      row.forEach((text, c) => {
        if (mine[c] !== text) mine[c] = text;
      });
    });
    return true;
  }

  private onSessionChange(c: SessionChange): void {
    if (c.kind === 'title') return;
    if (this.applying && (c.kind === 'cells' || c.kind === 'rows') && c.sheetId === this.current) {
      // The grid renders itself once the change is applied; rendering here would draw twice.
      // The edit may have marked cells (a bank proposed for a detuning typed alone): read them.
      this.measure();
      this.readNotes();
      // The model may have written more of this sheet than the edit (a row's typed defaults).
      if (c.kind === 'rows') this.syncCopy();
      return;
    }
    this.reload();
  }

  /** An edit the workbook refused: say why, and show the sheet as it is. */
  refuse(message: string): void {
    this.callbacks.onNotice(message);
    this.reload();
  }

  selection(): Selection | undefined {
    const range = this.hot.getSelectedRangeLast();
    if (!range || this.current < 0) return undefined;
    const tl = range.getTopStartCorner();
    const br = range.getBottomEndCorner();
    const clamp = (n: number | null | undefined) => Math.max(0, n ?? 0);
    return {
      sheetId: this.current,
      row: clamp(range.highlight.row),
      col: clamp(range.highlight.col),
      top: clamp(tl.row),
      left: clamp(tl.col),
      bottom: clamp(br.row),
      right: clamp(br.col),
    };
  }

  reportSelection(): void {
    const sel = this.selection();
    if (!sel) return;
    this.editorTextFor(sel.row, sel.col);
    this.callbacks.onSelect(sel);
  }

  /**
   * The grid's copy holds what was typed; a cell Kvar Ledger writes holds its formula in the
   * engine only. The editor starts from the grid's copy, so the active cell's is filled in.
   */
  private editorTextFor(row: number, col: number): void {
    if (this.current < 0 || this.hot.getSourceDataAtCell(row, col) !== '') return;
    const content = this.session.cellContent(this.current, row, col);
    if (typeof content === 'string' && content.startsWith('='))
      this.hot.setSourceDataAtCell(row, col, content, 'kl-sync');
  }

  select(row: number, col: number, row2 = row, col2 = col): void {
    this.hot.selectCell(row, col, row2, col2);
  }

  isEditing(): boolean {
    const editor = this.hot.getActiveEditor() as unknown as { isOpened?: () => boolean } | undefined;
    return editor?.isOpened?.() === true;
  }

  /**
   * Give the keyboard back to the grid from the click handler of a button outside it (toolbar,
   * menu item). The click is kept from reaching the page: the grid library takes any click that
   * reaches the page from outside it as a sign to stop listening to the keyboard.
   */
  focusAfterClick(click: Event): void {
    click.stopPropagation();
    this.focus();
  }

  /** Give the keyboard back to the grid (after the formula bar or a dialog had it). */
  focus(): void {
    const active = document.activeElement;
    if (active instanceof HTMLElement && !this.hot.rootElement.contains(active)) active.blur();
    this.hot.listen();
    const sel = this.selection();
    if (sel) this.hot.selectCell(sel.row, sel.col);
  }

  destroy(): void {
    this.menu.detach();
    this.detachChoices();
    this.hot.destroy();
  }
}
