// The grid's cell menu: row, sort, fill and clipboard commands for the selection. Opened by a
// right-click, or from the keyboard by Shift+F10 or the menu key at the active cell; arrow keys
// move through it, Enter runs a command, Escape closes it and the keyboard goes back to the grid.
import type { HotInstance } from 'handsontable/base';
import { el } from '../dom.ts';
import { clearCells, deleteRows, fillDown, insertRows, sortRows, type CommandHost } from './gridMenu.ts';

interface MenuHost extends CommandHost {
  readonly hot: HotInstance;
  notice(text: string): void;
  /** Give the keyboard back to the grid from a click handler. */
  focusAfterClick(click: Event): void;
  focus(): void;
}

export interface CellMenu {
  /** Open at the active cell (keyboard). */
  openAtActiveCell(): void;
  detach(): void;
}

export function attachContextMenu(host: HTMLElement, grid: MenuHost): CellMenu {
  let open: HTMLElement | undefined;
  /** `refocus`: the click (or key) that closed the menu; the keyboard goes back to the grid. */
  const close = (refocus?: Event) => {
    open?.remove();
    open = undefined;
    document.removeEventListener('mousedown', away, true);
    if (refocus?.type === 'click') grid.focusAfterClick(refocus);
    else if (refocus) grid.focus();
  };
  const away = (e: Event) => {
    if (open && !open.contains(e.target as Node)) close();
  };
  const plugin = () =>
    grid.hot.getPlugin('copyPaste') as unknown as { copy(): void; cut(): void; paste(text: string): void };
  const paste = async () => {
    let text: string;
    try {
      text = await navigator.clipboard.readText();
    } catch {
      grid.notice('The browser does not let the menu read the clipboard here: paste with Ctrl+V.');
      return;
    }
    plugin().paste(text);
  };
  const items: Array<[string, string, () => void] | 'sep'> = [
    ['Insert rows above', '', () => insertRows(grid, 'above')],
    ['Insert rows below', '', () => insertRows(grid, 'below')],
    ['Delete rows', '', () => deleteRows(grid)],
    ['Sort rows by this column, ascending', '', () => sortRows(grid, false)],
    ['Sort rows by this column, descending', '', () => sortRows(grid, true)],
    'sep',
    ['Fill down', 'Ctrl+D', () => void fillDown(grid)],
    ['Clear contents', 'Del', () => clearCells(grid)],
    'sep',
    ['Copy', 'Ctrl+C', () => plugin().copy()],
    ['Cut', 'Ctrl+X', () => plugin().cut()],
    ['Paste', 'Ctrl+V', () => void paste()],
  ];

  const show = (x: number, y: number) => {
    close();
    const menu = el('div', {
      className: 'kl-menu kl-context-menu',
      attrs: { role: 'menu', 'data-testid': 'grid-menu', 'aria-label': 'Cell commands' },
    });
    const buttons: HTMLButtonElement[] = [];
    for (const it of items) {
      if (it === 'sep') {
        menu.append(el('div', { className: 'kl-menu-sep', attrs: { role: 'separator' } }));
        continue;
      }
      const [label, hint, run] = it;
      const b = el('button', { className: 'kl-menu-item', attrs: { type: 'button', role: 'menuitem' } }, [
        el('span', { text: label }),
        hint ? el('span', { className: 'kl-menu-hint', text: hint }) : null,
      ]);
      b.addEventListener('click', (e) => {
        close(e);
        // A refused command (rows of a sheet that follows the site, say) says why, not a crash.
        try {
          run();
        } catch (err) {
          grid.notice(err instanceof Error ? err.message : String(err));
        }
      });
      buttons.push(b);
      menu.append(b);
    }
    menu.addEventListener('keydown', (e) => {
      const i = buttons.indexOf(document.activeElement as HTMLButtonElement);
      const n = buttons.length;
      if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
        e.preventDefault();
        buttons[(i + (e.key === 'ArrowDown' ? 1 : n - 1) + n) % n]?.focus();
      } else if (e.key === 'Home' || e.key === 'End') {
        e.preventDefault();
        buttons[e.key === 'Home' ? 0 : n - 1]?.focus();
      } else if (e.key === 'Escape' || e.key === 'Tab') {
        e.preventDefault();
        close(e);
      }
    });
    document.body.append(menu);
    menu.style.left = `${Math.max(0, Math.min(x, window.innerWidth - 260))}px`;
    menu.style.top = `${Math.max(0, Math.min(y, window.innerHeight - menu.offsetHeight - 8))}px`;
    open = menu;
    document.addEventListener('mousedown', away, true);
    grid.hot.unlisten();
    buttons[0]?.focus();
  };

  const openAtActiveCell = () => {
    const sel = grid.selection();
    const td = sel ? grid.hot.getCell(sel.row, sel.col, true) : null;
    const box = (td ?? host).getBoundingClientRect();
    show(box.left + Math.min(24, box.width / 2), box.bottom);
  };

  const onMenu = (e: MouseEvent) => {
    e.preventDefault();
    const cell = (e.target as HTMLElement).closest('td');
    // The menu key sends the event to the grid's focus, not to a cell: open at the active cell.
    if (!cell || (e.clientX === 0 && e.clientY === 0)) return openAtActiveCell();
    // A right-click outside the selection selects the cell under the pointer first.
    const coords = grid.hot.getCoords(cell);
    const sel = grid.selection();
    if (
      coords &&
      coords.row !== null &&
      coords.col !== null &&
      coords.row >= 0 &&
      coords.col >= 0 &&
      (!sel ||
        coords.row < sel.top ||
        coords.row > sel.bottom ||
        coords.col < sel.left ||
        coords.col > sel.right)
    ) {
      grid.select(coords.row, coords.col);
    }
    show(e.clientX, e.clientY);
  };
  host.addEventListener('contextmenu', onMenu);
  return {
    openAtActiveCell,
    detach: () => {
      close();
      host.removeEventListener('contextmenu', onMenu);
    },
  };
}
