// The grid's right-click menu: row, fill and clipboard commands for the selection.
import type { HotInstance } from 'handsontable/base';
import { el } from '../dom.ts';
import { clearCells, deleteRows, fillDown, insertRows, type CommandHost } from './gridMenu.ts';

interface MenuHost extends CommandHost {
  readonly hot: HotInstance;
}

/** Returns a function that takes the menu off `host` again. */
export function attachContextMenu(host: HTMLElement, grid: MenuHost): () => void {
  let open: HTMLElement | undefined;
  const close = () => {
    open?.remove();
    open = undefined;
    document.removeEventListener('mousedown', away, true);
    document.removeEventListener('keydown', escape, true);
  };
  const away = (e: Event) => {
    if (open && !open.contains(e.target as Node)) close();
  };
  const escape = (e: KeyboardEvent) => {
    if (e.key === 'Escape') close();
  };
  const clipboard = (mode: 'copy' | 'cut') => {
    const plugin = grid.hot.getPlugin('copyPaste') as unknown as { copy(): void; cut(): void };
    if (mode === 'copy') plugin.copy();
    else plugin.cut();
  };
  const items: Array<[string, string, () => void] | 'sep'> = [
    ['Insert rows above', '', () => insertRows(grid, 'above')],
    ['Insert rows below', '', () => insertRows(grid, 'below')],
    ['Delete rows', '', () => deleteRows(grid)],
    'sep',
    ['Fill down', 'Ctrl+D', () => void fillDown(grid)],
    ['Clear contents', 'Del', () => clearCells(grid)],
    'sep',
    ['Copy', 'Ctrl+C', () => clipboard('copy')],
    ['Cut', 'Ctrl+X', () => clipboard('cut')],
  ];
  const onMenu = (e: MouseEvent) => {
    const cell = (e.target as HTMLElement).closest('td');
    if (!cell) return;
    e.preventDefault();
    close();
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
    const menu = el('div', {
      className: 'kl-menu kl-context-menu',
      attrs: { role: 'menu', 'data-testid': 'grid-menu' },
    });
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
      b.addEventListener('click', () => {
        close();
        run();
        grid.hot.listen();
      });
      menu.append(b);
    }
    document.body.append(menu);
    const x = Math.min(e.clientX, window.innerWidth - 260),
      y = Math.min(e.clientY, window.innerHeight - menu.offsetHeight - 8);
    menu.style.left = `${x}px`;
    menu.style.top = `${y}px`;
    open = menu;
    document.addEventListener('mousedown', away, true);
    document.addEventListener('keydown', escape, true);
  };
  host.addEventListener('contextmenu', onMenu);
  return () => {
    close();
    host.removeEventListener('contextmenu', onMenu);
  };
}
