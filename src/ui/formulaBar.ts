// The bar above the grid: where the active cell is, what it holds (editable), what it computes
// to, and for an error the full message: which function, which argument, the allowed range and
// the value given.
import type { ColumnInfo } from '../core/workbook/document.ts';
import { el } from './dom.ts';
import { cellView, type EngineValue } from './grid/cellView.ts';
import { formatGeneral } from './format/numberFormat.ts';
import { unitOf } from './format/columnHeader.ts';
import { rangeLabel, sheetRef } from './model/address.ts';
import type { WorkbookSession } from './model/session.ts';
import { editText, typedContent } from './model/typedInput.ts';
import { completeTypedFormula } from '../io/formula/entry.ts';
import { parseFormula } from '../io/formula/parse.ts';
import type { Selection } from './grid/gridView.ts';
import type { FormulaAssist } from './autocomplete/formulaAssist.ts';

export interface FormulaBarHost {
  readonly session: WorkbookSession;
  readonly assist: FormulaAssist;
  columns(sheetId: number): readonly ColumnInfo[] | undefined;
  hasHeaderRow(sheetId: number): boolean;
  /** Give the keyboard back to the grid. */
  returnFocus(): void;
}

/**
 * For a formula the engine cannot read, our parser's message in words (where, what is expected,
 * why ';' is not read) instead of the engine's parser dump; undefined for anything else.
 */
export function readMessage(content: unknown): string | undefined {
  if (typeof content !== 'string' || !content.startsWith('=')) return undefined;
  const parsed = parseFormula(content);
  return parsed.ok ? undefined : `the formula cannot be read: ${parsed.message}`;
}

export class FormulaBar {
  readonly root: HTMLElement;
  private readonly address: HTMLOutputElement;
  readonly input: HTMLInputElement;
  private readonly value: HTMLOutputElement;
  private readonly problem: HTMLDivElement;
  private sel: Selection | undefined;
  private original = '';

  constructor(private readonly host: FormulaBarHost) {
    this.address = el('output', {
      className: 'kl-fb-address',
      attrs: { 'data-testid': 'fb-address', 'aria-label': 'Active cell' },
    });
    this.input = el('input', {
      className: 'kl-fb-input',
      attrs: {
        type: 'text',
        spellcheck: 'false',
        autocomplete: 'off',
        'aria-label': 'Cell content',
        'data-testid': 'fb-input',
        placeholder: 'Type a value or a formula starting with =',
      },
    });
    this.value = el('output', {
      className: 'kl-fb-value',
      attrs: { 'data-testid': 'fb-value', 'aria-label': 'Value' },
    });
    this.problem = el('div', {
      className: 'kl-fb-problem',
      attrs: { 'data-testid': 'fb-problem', role: 'status' },
    });
    this.problem.hidden = true;
    this.root = el('section', { className: 'kl-formula-bar', attrs: { 'aria-label': 'Formula bar' } }, [
      el('div', { className: 'kl-fb-row' }, [
        this.address,
        el('span', { className: 'kl-fb-eq', text: 'content' }),
        this.input,
        el('span', { className: 'kl-fb-eq', text: 'value' }),
        this.value,
      ]),
      this.problem,
    ]);
    host.assist.attach(this.input);
    this.input.addEventListener('keydown', (e) => this.onKey(e));
    this.input.addEventListener('focus', () => (this.original = this.input.value));
  }

  /** Show the active cell (after a selection change or a recalculation). */
  show(sel: Selection | undefined): void {
    this.sel = sel;
    if (!sel) return;
    const { session } = this.host;
    const name = session.sheetName(sel.sheetId);
    const block = sel.top !== sel.bottom || sel.left !== sel.right;
    this.address.textContent = `${sheetRef(name)}!${rangeLabel(sel.row, sel.col, sel.row, sel.col)}${block ? `  (${rangeLabel(sel.top, sel.left, sel.bottom, sel.right)})` : ''}`;
    if (document.activeElement !== this.input)
      this.input.value = editText(session.cellContent(sel.sheetId, sel.row, sel.col));
    const raw = session.engine.getCellValue({
      sheet: sel.sheetId,
      row: sel.row,
      col: sel.col,
    }) as EngineValue;
    const view = cellView(raw);
    const header = sel.row === 0 && this.host.hasHeaderRow(sel.sheetId);
    const info = header ? undefined : this.host.columns(sel.sheetId)?.[sel.col];
    const unit = info ? unitOf(info.header) : undefined;
    if (view.kind === 'number' && typeof raw === 'number') {
      this.value.textContent = `${formatGeneral(raw)}${unit ? ` ${unit}` : ''}`;
      this.value.title = String(raw);
    } else {
      this.value.textContent = view.text;
      this.value.title = view.text;
    }
    this.value.classList.toggle('is-error', view.kind === 'error');
    this.problem.hidden = !view.error;
    const unread =
      view.error?.code === '#ERROR!'
        ? readMessage(session.cellContent(sel.sheetId, sel.row, sel.col))
        : undefined;
    this.problem.textContent = view.error ? `${view.error.code}  ${unread ?? view.error.message}` : '';
  }

  /** While the cell editor is open, the bar shows the text being typed. */
  mirror(text: string): void {
    if (document.activeElement !== this.input) this.input.value = text;
  }

  /** Put text into the bar and start editing there (e.g. "insert into cell" from the reference). */
  begin(text: string): void {
    this.original = this.sel
      ? editText(this.host.session.cellContent(this.sel.sheetId, this.sel.row, this.sel.col))
      : '';
    this.input.focus();
    this.input.value = text;
    this.input.setSelectionRange(text.length, text.length);
    this.host.assist.follow(this.input);
  }

  private commit(): void {
    const sel = this.sel;
    if (!sel) return;
    // Brackets left open are closed and ';' between arguments read as ',', as on Enter elsewhere.
    const content = typedContent(completeTypedFormula(this.input.value).text);
    this.host.session.setCells(sel.sheetId, [{ row: sel.row, col: sel.col, content }]);
    this.original = this.input.value;
  }

  private onKey(e: KeyboardEvent): void {
    if (this.host.assist.handleKey(e)) {
      e.preventDefault();
      return;
    }
    if (e.key !== 'Enter' && e.key !== 'Escape') return;
    // The key is ours: it must not reach the grid, which would take it as its own once it has the focus.
    e.preventDefault();
    e.stopPropagation();
    if (e.key === 'Enter') this.commit();
    else this.input.value = this.original;
    this.host.assist.hide();
    setTimeout(() => this.host.returnFocus(), 0);
  }
}
