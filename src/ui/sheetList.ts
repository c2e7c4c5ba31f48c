// The sheet index on the left: every sheet of the workbook as a tab, with add, rename and delete.
// Deleting asks first and can be undone.
import { el } from './dom.ts';
// The dialogs load on first use (they are not needed to show the page).
const dialogs = () => import('./dialogs/dialog.ts');
import type { WorkbookSession } from './model/session.ts';
import { freshSheetName, sheetNameProblem } from './model/sheetNames.ts';

export interface SheetListHost {
  readonly session: WorkbookSession;
  current(): number;
  open(sheetId: number): void;
  notice(text: string, kind?: 'info' | 'error'): void;
}

export class SheetList {
  readonly root: HTMLElement;
  private readonly list: HTMLElement;

  constructor(private readonly host: SheetListHost) {
    this.list = el('div', {
      className: 'kl-sheet-tabs',
      attrs: { role: 'tablist', 'aria-orientation': 'vertical', 'aria-label': 'Sheets' },
    });
    const add = el('button', {
      className: 'kl-icon-btn',
      text: '+',
      title: 'Add a sheet',
      attrs: { type: 'button', 'data-testid': 'sheet-add', 'aria-label': 'Add a sheet' },
    });
    add.addEventListener('click', () => void this.add());
    this.root = el('nav', { className: 'kl-sheets', attrs: { 'aria-label': 'Sheets of the workbook' } }, [
      el('div', { className: 'kl-pane-head' }, [el('span', { text: 'Sheets' }), add]),
      this.list,
    ]);
  }

  render(): void {
    const { session } = this.host;
    const current = this.host.current();
    const tabs = session.sheetIds().map((id) => {
      const name = session.sheetName(id);
      const purpose = session.meta(id).purpose;
      const tab = el(
        'button',
        {
          className: `kl-sheet-tab${id === current ? ' is-current' : ''}`,
          attrs: {
            type: 'button',
            role: 'tab',
            'aria-selected': String(id === current),
            'data-testid': 'sheet-tab',
            'data-sheet': name,
          },
          // The name in full first: a narrow index cuts long names.
          title: purpose ? `${name} — ${purpose}` : name,
        },
        [el('span', { className: 'kl-sheet-name', text: name })],
      );
      tab.addEventListener('click', () => this.host.open(id));
      tab.addEventListener('dblclick', () => void this.rename(id));
      const more = el('button', {
        className: 'kl-sheet-more',
        text: '⋯',
        title: `Rename or delete "${name}"`,
        attrs: { type: 'button', 'aria-label': `Actions for sheet ${name}`, 'data-testid': 'sheet-more' },
      });
      more.addEventListener('click', (e) => {
        e.stopPropagation();
        this.actions(id, more);
      });
      return el('div', { className: 'kl-sheet-row' }, [tab, more]);
    });
    this.list.replaceChildren(...tabs);
  }

  private actions(id: number, anchor: HTMLElement): void {
    const pop = el('div', { className: 'kl-menu kl-sheet-menu', attrs: { role: 'menu' } });
    const item = (label: string, run: () => void, testId: string) => {
      const b = el('button', {
        className: 'kl-menu-item',
        text: label,
        attrs: { type: 'button', role: 'menuitem', 'data-testid': testId },
      });
      b.addEventListener('click', () => {
        pop.remove();
        run();
      });
      return b;
    };
    pop.append(
      item('Rename…', () => void this.rename(id), 'sheet-rename'),
      item('Delete…', () => void this.remove(id), 'sheet-delete'),
    );
    anchor.after(pop);
    const away = (e: Event) => {
      if (!pop.contains(e.target as Node)) {
        pop.remove();
        document.removeEventListener('mousedown', away, true);
      }
    };
    document.addEventListener('mousedown', away, true);
    (pop.firstElementChild as HTMLButtonElement).focus();
  }

  async add(): Promise<void> {
    const { session } = this.host;
    const names = session.sheetNames();
    const { promptDialog } = await dialogs();
    const name = await promptDialog('Add a sheet', 'Name of the new sheet', freshSheetName(names), (v) =>
      sheetNameProblem(v, names),
    );
    if (name === undefined) return;
    const id = session.addSheet(name, this.host.current());
    this.host.open(id);
  }

  async rename(id: number): Promise<void> {
    const { session } = this.host;
    if (session.isBuiltIn(id)) {
      this.host.notice(
        `${session.sheetName(id)} is one of the site's own sheets: formulas, the command line and the export find it by this name.`,
        'error',
      );
      return;
    }
    const current = session.sheetName(id);
    const names = session.sheetNames();
    const { promptDialog } = await dialogs();
    const name = await promptDialog(`Rename "${current}"`, 'New name', current, (v) =>
      sheetNameProblem(v, names, current),
    );
    if (name === undefined || name === current) return;
    session.renameSheet(id, name);
    this.host.notice(`Sheet renamed to "${name}"; formulas that refer to it follow the new name.`);
  }

  async remove(id: number): Promise<void> {
    const { session } = this.host;
    if (session.sheetIds().length <= 1) {
      this.host.notice('A workbook keeps at least one sheet.', 'error');
      return;
    }
    const name = session.sheetName(id);
    if (session.isBuiltIn(id)) {
      this.host.notice(
        `${name} is one of the site's own sheets: it can be emptied but not deleted, since the buses, the compensation and the export are built from it.`,
        'error',
      );
      return;
    }
    const filled = session.sheetContents(id).reduce((n, r) => n + r.filter((c) => c !== null).length, 0);
    const { confirmDialog } = await dialogs();
    const ok = await confirmDialog(
      `Delete sheet "${name}"?`,
      [
        `The sheet holds ${filled} filled cell${filled === 1 ? '' : 's'}. Formulas on other sheets that refer to it will show #REF!.`,
        'You can bring it back with Undo (Ctrl+Z).',
      ],
      'Delete sheet',
      true,
    );
    if (!ok) return;
    const order = session.sheetIds();
    const next =
      order[Math.max(0, order.indexOf(id) - 1)] === id ? order[1] : order[Math.max(0, order.indexOf(id) - 1)];
    session.removeSheet(id);
    if (next !== undefined) this.host.open(next);
    this.host.notice(`Sheet "${name}" deleted. Undo (Ctrl+Z) brings it back.`);
  }
}
