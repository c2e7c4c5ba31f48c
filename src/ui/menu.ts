// Drop-down command menus for the top bar. Items are text; each runs a command.
import { el } from './dom.ts';

export interface MenuItem {
  readonly label: string;
  readonly hint?: string;
  readonly run: () => void;
  readonly testId?: string;
  readonly enabled?: () => boolean;
}

export type MenuEntry = MenuItem | 'separator';

export function menuButton(label: string, entries: readonly MenuEntry[], testId?: string): HTMLElement {
  const button = el('button', {
    className: 'kl-menu-button',
    text: label,
    attrs: {
      type: 'button',
      'aria-haspopup': 'menu',
      'aria-expanded': 'false',
      ...(testId ? { 'data-testid': testId } : {}),
    },
  });
  const list = el('div', { className: 'kl-menu', attrs: { role: 'menu' } });
  list.hidden = true;
  const close = () => {
    list.hidden = true;
    button.setAttribute('aria-expanded', 'false');
    document.removeEventListener('mousedown', outside, true);
  };
  const outside = (e: Event) => {
    if (!wrap.contains(e.target as Node)) close();
  };
  const open = () => {
    list.replaceChildren(
      ...entries.map((entry) => {
        if (entry === 'separator')
          return el('div', { className: 'kl-menu-sep', attrs: { role: 'separator' } });
        const enabled = entry.enabled?.() ?? true;
        const item = el(
          'button',
          {
            className: 'kl-menu-item',
            attrs: {
              type: 'button',
              role: 'menuitem',
              ...(entry.testId ? { 'data-testid': entry.testId } : {}),
            },
          },
          [
            el('span', { text: entry.label }),
            entry.hint ? el('span', { className: 'kl-menu-hint', text: entry.hint }) : null,
          ],
        );
        item.disabled = !enabled;
        item.addEventListener('click', () => {
          close();
          entry.run();
        });
        return item;
      }),
    );
    list.hidden = false;
    button.setAttribute('aria-expanded', 'true');
    document.addEventListener('mousedown', outside, true);
    (list.querySelector('button:not(:disabled)') as HTMLButtonElement | null)?.focus();
  };
  button.addEventListener('click', () => (list.hidden ? open() : close()));
  list.addEventListener('keydown', (e) => {
    if (e.key === 'Escape') {
      close();
      button.focus();
    } else if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      const items = [...list.querySelectorAll<HTMLButtonElement>('button:not(:disabled)')];
      const i = items.indexOf(document.activeElement as HTMLButtonElement);
      items[(i + (e.key === 'ArrowDown' ? 1 : items.length - 1)) % items.length]?.focus();
      e.preventDefault();
    }
  });
  const wrap = el('div', { className: 'kl-menu-wrap' }, [button, list]);
  return wrap;
}
