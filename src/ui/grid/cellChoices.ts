// Cells that take one of a list of values (SheetMeta.choices): a typed value outside the list is
// refused with the sheet's own explanation before it reaches the workbook, and Alt+↓ or a
// click on the cell's ▾ opens the list to pick from with the mouse or the keys.
import type { HotInstance } from 'handsontable/base';
import { el } from '../dom.ts';
import type { WorkbookSession } from '../model/session.ts';
import { contentOf } from '../model/typedInput.ts';
import { checkChoice, type CellNotes } from './cellNotes.ts';

export interface ChoiceHost {
  readonly hot: HotInstance;
  readonly session: WorkbookSession;
  readonly sheetId: number;
  notes(): CellNotes | undefined;
  notice(text: string): void;
  focus(): void;
  focusAfterClick(click: Event): void;
}

type Change = [number, string | number, unknown, unknown] | null;

/**
 * Call before the edit handlers are installed, so a refused value never reaches the workbook;
 * a value let through is written as the list has it ("TAN φ" → "tan φ").
 */
export function installChoiceCheck(host: ChoiceHost): void {
  host.hot.addHook('beforeChange', (changes: Change[], source: string) => {
    if (source === 'loadData' || source === 'updateData' || source === 'kl-sync') return;
    const notes = host.notes();
    if (!notes || notes.empty) return;
    changes.forEach((ch, i) => {
      if (!ch) return;
      const choice = notes.choice(ch[0], Number(ch[1]));
      if (!choice) return;
      const r = checkChoice(choice, ch[3]);
      if (r.ok) ch[3] = r.value ?? '';
      else {
        changes[i] = null;
        host.notice(r.message);
        // As a spreadsheet's data validation does: the text typed goes back into the cell's
        // editor to mend (Escape gives the cell back its value).
        if (source === 'edit' && changes.length === 1)
          reopen(host, ch[0], Number(ch[1]), String(ch[3] ?? ''));
      }
    });
  });
}

function reopen(host: ChoiceHost, row: number, col: number, text: string): void {
  setTimeout(() => {
    host.hot.selectCell(row, col);
    const editor = host.hot.getActiveEditor() as unknown as
      { beginEditing(initial?: string): void; isOpened(): boolean; enableFullEditMode(): void } | undefined;
    if (!editor || editor.isOpened()) return;
    // The editor takes a starting text only in its full edit mode (as after F2).
    editor.enableFullEditMode();
    editor.beginEditing(text);
  }, 0);
}

let open: { menu: HTMLElement; close(): void } | undefined;

/** The list of a choice cell under the cell; picking writes the value as one undoable step. */
export function openChoiceList(host: ChoiceHost, row: number, col: number): boolean {
  const choice = host.notes()?.choice(row, col);
  const td = host.hot.getCell(row, col);
  if (!choice || !td) return false;
  open?.close();
  const menu = el('div', {
    className: 'kl-menu kl-context-menu kl-choice-list',
    attrs: { role: 'listbox', 'data-testid': 'choice-list', 'aria-label': choice.message },
  });
  /** `by`: the click or key that closed the list; the keyboard goes back to the grid. */
  const close = (by?: Event) => {
    menu.remove();
    document.removeEventListener('mousedown', away, true);
    open = undefined;
    if (by?.type === 'click') host.focusAfterClick(by);
    else if (by) host.focus();
  };
  const away = (e: Event) => {
    if (!menu.contains(e.target as Node)) close();
  };
  const current = String(host.session.cellContent(host.sheetId, row, col) ?? '');
  const items = choice.options.map((o) => {
    const b = el('button', {
      className: `kl-menu-item${o === current ? ' is-current' : ''}`,
      text: o,
      attrs: { type: 'button', role: 'option', 'aria-selected': String(o === current) },
    });
    b.addEventListener('click', (e) => {
      close(e);
      if (o !== current) host.session.setCells(host.sheetId, [{ row, col, content: contentOf(o) }]);
    });
    return b;
  });
  menu.append(...items);
  menu.addEventListener('keydown', (e) => {
    const i = items.indexOf(document.activeElement as HTMLButtonElement);
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      const n = items.length;
      items[(i + (e.key === 'ArrowDown' ? 1 : n - 1) + n) % n]?.focus();
    } else if (e.key === 'Escape' || e.key === 'Tab') {
      e.preventDefault();
      close(e);
    }
  });
  document.body.append(menu);
  const box = td.getBoundingClientRect();
  menu.style.left = `${Math.min(box.left, window.innerWidth - 260)}px`;
  menu.style.top = `${Math.min(box.bottom + 2, window.innerHeight - menu.offsetHeight - 8)}px`;
  document.addEventListener('mousedown', away, true);
  open = { menu, close };
  host.hot.unlisten();
  (items.find((b) => b.classList.contains('is-current')) ?? items[0])?.focus();
  return true;
}

/** A click on the ▾ at the right edge of a choice cell opens its list. */
export function attachChoiceClicks(host: ChoiceHost, root: HTMLElement): () => void {
  const onDown = (e: MouseEvent) => {
    const td = (e.target as HTMLElement).closest('td.kl-choice');
    if (!(td instanceof HTMLTableCellElement)) return;
    if (e.clientX < td.getBoundingClientRect().right - 20) return;
    const coords = host.hot.getCoords(td);
    if (!coords || coords.row === null || coords.col === null) return;
    const { row, col } = coords;
    e.preventDefault();
    e.stopPropagation();
    host.hot.selectCell(row, col);
    setTimeout(() => openChoiceList(host, row, col), 0);
  };
  root.addEventListener('mousedown', onDown, true);
  return () => root.removeEventListener('mousedown', onDown, true);
}
