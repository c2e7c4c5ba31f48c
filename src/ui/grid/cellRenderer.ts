// The grid's one renderer: reads the engine's value for the cell and writes it as text
// (textContent, never HTML), with classes that make errors, formulas, headers, assumed values
// and choice cells visible. Numbers are rounded to fit their column (the full value on hover);
// text cut at the column's edge shows in full on hover; header texts wrap onto two lines.
import type { HyperFormula } from '../../engine/index.ts';
import type { ColumnInfo } from '../../core/workbook/document.ts';
import { fitNumber } from '../format/fitNumber.ts';
import { formatGeneral } from '../format/numberFormat.ts';
import { cellView, type CellKind, type EngineValue } from './cellView.ts';
import type { CellNotes } from './cellNotes.ts';
import { textWidth } from './textMeasure.ts';

export interface RenderContext {
  readonly engine: HyperFormula;
  readonly sheetId: () => number;
  readonly columns: () => readonly ColumnInfo[] | undefined;
  /** Row 0 is the header row of this sheet. */
  readonly hasHeaderRow: () => boolean;
  /** Rows holding data; computed columns are tinted only there. */
  readonly dataRows: () => number;
  /** A cell Kvar Ledger writes that holds a value the user typed over it. */
  readonly isOverride?: (row: number, col: number) => boolean;
  /** Choices and marks of the sheet on screen. */
  readonly notes: () => CellNotes | undefined;
}

/** What the renderer asks of the grid that calls it. */
interface GridWidths {
  getColWidth(col: number): number;
}

const KIND_CLASS: Readonly<Record<CellKind, string>> = {
  number: 'kl-num',
  text: 'kl-text',
  bool: 'kl-bool',
  error: 'kl-err',
  empty: 'kl-empty',
};
const ALL_CLASSES = [
  ...Object.values(KIND_CLASS),
  'kl-head',
  'kl-calc',
  'kl-formula',
  'kl-mark-assumed',
  'kl-mark-override',
  'kl-mark-proposed',
  'kl-choice',
];
const OVERRIDE_TITLE =
  "Typed over: Kvar Ledger's formula is replaced by this value, which counts as typed. Clear the cell (Delete) to bring the formula back.";
const MARK_TITLE = { assumed: 'Assumed', override: 'Typed over', proposed: 'Proposed' } as const;
/** Horizontal padding and border of a cell, px. */
const CELL_CHROME = 13;

export function makeCellRenderer(ctx: RenderContext) {
  return function renderCell(hot: GridWidths, td: HTMLTableCellElement, row: number, col: number): void {
    const sheet = ctx.sheetId();
    const address = { sheet, row, col };
    const header = row === 0 && ctx.hasHeaderRow();
    const info = ctx.columns()?.[col];
    let value: EngineValue;
    try {
      value = ctx.engine.getCellValue(address) as EngineValue;
    } catch {
      value = undefined;
    }
    const view = cellView(value, header ? undefined : info);
    const classes = [header ? 'kl-head' : KIND_CLASS[view.kind]];
    if (!header && info?.computed && row < ctx.dataRows()) classes.push('kl-calc');
    if (!header && ctx.engine.doesCellHaveFormula(address)) classes.push('kl-formula');

    const hover: string[] = [];
    let text = view.text;
    const room = hot.getColWidth(col) - CELL_CHROME;
    if (view.kind === 'number' && typeof value === 'number') {
      text = fitNumber(value, info?.format, room / textWidth('0'));
      if (text !== view.text) hover.push(formatGeneral(value));
    } else if ((view.kind === 'text' || header) && text !== '' && textWidth(text) > room) {
      hover.push(text);
    }
    if (header) showHeaderText(td, text);
    else showText(td, text);

    const notes = ctx.notes();
    // A value typed over one of Kvar Ledger's formulas, known to the living model.
    if (!header && (ctx.isOverride?.(row, col) ?? false)) {
      classes.push('kl-mark-override');
      hover.unshift(OVERRIDE_TITLE);
    }
    if (notes && !header) {
      const mark = notes.mark(row, col, () => ctx.engine.getCellSerialized(address) as never);
      if (mark) {
        classes.push(`kl-mark-${mark.kind}`);
        hover.unshift(`${MARK_TITLE[mark.kind]}: ${mark.note}`);
      }
      const choice = notes.choice(row, col);
      if (choice) {
        classes.push('kl-choice');
        hover.push(`${choice.message} Choose with Alt+↓ or the ▾.`);
      }
    }
    if (view.error) hover.push(`${view.error.code} ${view.error.message}`);
    // The grid clears a cell's classes before it calls the renderer; one write puts ours back.
    if (td.classList.length > 0) td.classList.remove(...ALL_CLASSES);
    td.classList.add(...classes);
    const title = hover.join('\n');
    if (td.title !== title) {
      if (title) td.title = title;
      else td.removeAttribute('title');
    }
  };
}

/*
 * The grid renders every cell in view after each change. Text written again unchanged would still
 * make the browser lay the cell out anew, so a cell whose text is the same is left alone.
 */
function showText(td: HTMLTableCellElement, text: string): void {
  const only = td.firstChild;
  if (only === null) {
    if (text !== '') td.textContent = text;
  } else if (only === td.lastChild && only.nodeType === Node.TEXT_NODE) {
    if ((only as Text).data !== text) {
      if (text === '') td.textContent = '';
      else (only as Text).data = text;
    }
  } else td.textContent = text;
}

/** Header texts sit in a span, so they can wrap onto two lines. */
function showHeaderText(td: HTMLTableCellElement, text: string): void {
  const only = td.firstChild;
  if (only instanceof HTMLSpanElement && only === td.lastChild && only.className === 'kl-head-text') {
    if (only.textContent !== text) only.textContent = text;
    return;
  }
  const span = document.createElement('span');
  span.className = 'kl-head-text';
  span.textContent = text;
  td.replaceChildren(span);
}
