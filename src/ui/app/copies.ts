// Copies kept in this browser by a tab that found the workbook open in another tab (or by a
// start-up that could not open the stored workbook): listed with their title and time, and any
// of them can take the place of the open workbook (which is set aside, as for every replacement).
import { el } from '../dom.ts';
import { openDialog } from '../dialogs/dialog.ts';
import { copies, dropSlot } from '../storage/storedSlots.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import type { StatusBar } from '../statusBar.ts';
import type { WorkbookStore } from '../storage/idbStore.ts';

/** What bringing back a copy needs of the page. */
export interface CopyHost {
  readonly store: WorkbookStore | undefined;
  readonly status: Pick<StatusBar, 'show'>;
  replaceWith(doc: WorkbookDoc, note: string): Promise<boolean>;
  flush(): Promise<void>;
}

export async function bringBackCopy(app: CopyHost): Promise<void> {
  const store = app.store;
  const kept = store ? await copies(store) : [];
  if (!store || kept.length === 0) {
    app.status.show('No copy from another tab is kept in this browser.');
    return;
  }
  const rows = kept.map((c) => {
    const take = el('button', {
      className: 'kl-btn kl-btn-primary',
      text: 'Bring back',
      attrs: { type: 'button', 'data-testid': 'copy-bring-back' },
    });
    take.addEventListener('click', async () => {
      dlg.close();
      const copy = await store.loadSlot(c.slot);
      if (!copy) return app.status.show(`The copy "${c.title}" could not be read.`, 'error', 0);
      if (await app.replaceWith(copy.doc, `Brought back the copy "${c.title}".`)) {
        // Its work now lives in the open workbook, saved like any change.
        await app.flush();
        await dropSlot(store, c.slot);
      }
    });
    return el('li', { className: 'kl-copy' }, [
      el('strong', { text: c.title || 'Untitled' }),
      el('span', { className: 'kl-muted', text: ` — saved ${new Date(c.savedAt).toLocaleString()} ` }),
      take,
    ]);
  });
  const dlg = openDialog(
    'Bring back a copy from another tab',
    [
      el('p', {
        className: 'kl-muted',
        text: 'A copy takes the place of the open workbook, which is set aside (Workbook → Bring back the replaced workbook).',
      }),
      el('ul', { className: 'kl-copy-list', attrs: { 'data-testid': 'copies' } }, rows),
    ],
    [{ label: 'Close' }],
  );
}
