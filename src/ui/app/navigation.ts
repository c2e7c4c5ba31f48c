// Moving about the workbook from the keyboard: the next and previous sheet (Ctrl+PageDown /
// Ctrl+PageUp, and Alt+PageDown / Alt+PageUp where a browser keeps the Ctrl keys for its own
// tabs) and the go-to box (Ctrl+G or F5): an address such as Motors!F12, or a tag or bus name.
import { promptDialog } from '../dialogs/dialog.ts';
import type { GoToSheet } from '../model/goTo.ts';
import type { WorkbookSession } from '../model/session.ts';
import type { StatusBar } from '../statusBar.ts';

/** What moving about needs of the page. */
export interface NavigationHost {
  readonly session: Pick<WorkbookSession, 'sheetIds' | 'meta' | 'sheetName' | 'sheetContents'>;
  readonly grid: { focus(): void; select(row: number, col: number): void };
  readonly status: Pick<StatusBar, 'show'>;
  currentSheet(): number;
  openSheet(id: number): void;
}

/** Show the sheet `step` places away in the tab order (wrapping round). */
export function stepSheet(app: NavigationHost, step: number): void {
  const ids = app.session.sheetIds();
  const i = ids.indexOf(app.currentSheet());
  const next = ids[(i + step + ids.length) % ids.length];
  if (next !== undefined && next !== app.currentSheet()) app.openSheet(next);
  app.grid.focus();
}

function goToSheets(app: NavigationHost): GoToSheet[] {
  const s = app.session;
  return s.sheetIds().map((id) => {
    const cols = s.meta(id).columns;
    return {
      id,
      name: s.sheetName(id),
      ...(cols ? { headers: cols.map((c) => c.header) } : {}),
      cells: () => s.sheetContents(id),
    };
  });
}

export async function openGoTo(app: NavigationHost): Promise<void> {
  const { goTo } = await import('../model/goTo.ts');
  const sheets = goToSheets(app);
  const text = await promptDialog('Go to', 'Address (Motors!F12, F12) or a tag or bus name', '', (v) => {
    if (v.trim() === '') return undefined;
    const r = goTo(v, sheets, app.currentSheet());
    return r.ok ? undefined : r.message;
  });
  if (text === undefined || text.trim() === '') return app.grid.focus();
  const r = goTo(text, sheets, app.currentSheet());
  if (!r.ok) return app.status.show(r.message, 'error');
  if (r.sheet !== app.currentSheet()) app.openSheet(r.sheet);
  app.grid.select(r.row, r.col);
  app.grid.focus();
}

/** Keys for moving about, from the grid; true when handled. */
export function navigationKey(app: NavigationHost, e: KeyboardEvent): boolean {
  const page = e.key === 'PageDown' ? 1 : e.key === 'PageUp' ? -1 : 0;
  if (page !== 0 && !e.shiftKey && (e.ctrlKey || e.metaKey) !== e.altKey) {
    stepSheet(app, page);
    return true;
  }
  const mod = e.ctrlKey || e.metaKey;
  if ((mod && !e.altKey && !e.shiftKey && e.key.toLowerCase() === 'g') || (e.key === 'F5' && !mod)) {
    void openGoTo(app);
    return true;
  }
  return false;
}
