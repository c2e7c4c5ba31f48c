// The grid's one renderer: reads the engine's value for the cell and writes it as text
// (textContent, never HTML), with classes that make errors, formulas and headers visible.
import type { HyperFormula } from '../../engine/index.ts';
import type { ColumnInfo } from '../../core/workbook/document.ts';
import { cellView, type CellKind, type EngineValue } from './cellView.ts';

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
}

const KIND_CLASS: Readonly<Record<CellKind, string>> = {
  number: 'kl-num',
  text: 'kl-text',
  bool: 'kl-bool',
  error: 'kl-err',
  empty: 'kl-empty',
};
const ALL_CLASSES = [...Object.values(KIND_CLASS), 'kl-head', 'kl-calc', 'kl-formula', 'kl-override'];
const OVERRIDE_TITLE =
  "Typed over: Kvar Ledger's formula is replaced by this value. Clear the cell (Delete) to bring the formula back.";

export function makeCellRenderer(ctx: RenderContext) {
  return function renderCell(_hot: unknown, td: HTMLTableCellElement, row: number, col: number): void {
    const sheet = ctx.sheetId();
    const address = { sheet, row, col };
    const header = row === 0 && ctx.hasHeaderRow();
    const info = ctx.columns()?.[col];
    let view;
    try {
      view = cellView(ctx.engine.getCellValue(address) as EngineValue, header ? undefined : info);
    } catch {
      view = cellView(undefined);
    }
    td.classList.remove(...ALL_CLASSES);
    td.classList.add(header ? 'kl-head' : KIND_CLASS[view.kind]);
    if (!header && info?.computed && row < ctx.dataRows()) td.classList.add('kl-calc');
    if (!header && ctx.engine.doesCellHaveFormula(address)) td.classList.add('kl-formula');
    const typedOver = !header && (ctx.isOverride?.(row, col) ?? false);
    if (typedOver) td.classList.add('kl-override');
    td.textContent = view.text;
    if (view.error) td.title = `${view.error.code} ${view.error.message}`;
    else if (typedOver) td.title = OVERRIDE_TITLE;
    else if (td.title) td.removeAttribute('title');
  };
}
