// Workbook-level commands: start from a template, open and save the native file, restore the
// previous autosaved state, import an equipment list, export the hand-off xlsx. Opening,
// importing and exporting (longWork.ts, and the xlsx code and library) load only when used.
import { el } from '../dom.ts';
import { confirmDialog, openDialog } from '../dialogs/dialog.ts';
import { pickFile, saveNativeFile } from '../storage/nativeFile.ts';
import { templateIds, templateInfo, templateWorkbook } from '../templates/templateCatalog.ts';
import { blankSiteWorkbook } from '../../core/workbook/blankSite.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { loadSetAside } from '../storage/storedSlots.ts';
import type { ImportHost } from '../import/importDialog.ts';
import type { WorkbookSession } from '../model/session.ts';
import type { StatusBar } from '../statusBar.ts';
import type { WorkbookStore } from '../storage/idbStore.ts';

/** What the workbook commands need of the page (the app passes itself). */
export interface FileHost extends ImportHost {
  readonly session: Pick<WorkbookSession, 'toDoc' | 'title' | 'engine'>;
  readonly store: WorkbookStore | undefined;
  readonly status: Pick<StatusBar, 'show'>;
  replaceWith(next: WorkbookDoc | WorkbookSession, note: string): Promise<boolean>;
}

const REPLACE_NOTE =
  'The open workbook is replaced. It is set aside in this browser (Workbook → Bring back the replaced workbook); save it to a file to keep it for good.';

/** Workbook → New blank site: settings with defaults and the cautions, empty equipment sheets. */
export async function newBlankSite(app: FileHost): Promise<void> {
  await app.replaceWith(
    blankSiteWorkbook(),
    'A new blank site: type equipment on the Motors, Loads … sheets; buses appear as you name them.',
  );
}

export async function newFromTemplate(app: FileHost): Promise<void> {
  const ids = templateIds();
  const infos = await Promise.all(ids.map((id) => templateInfo(id).catch(() => undefined)));
  const cards = infos.flatMap((info) => {
    if (!info) return [];
    const open = el('button', {
      className: 'kl-btn kl-btn-primary',
      text: 'Open',
      attrs: { type: 'button', 'data-testid': `template-${info.id}` },
    });
    open.addEventListener('click', async () => {
      dlg.close();
      try {
        await app.replaceWith(await templateWorkbook(info.id), `Opened the template "${info.title}".`);
      } catch (e) {
        app.status.show(e instanceof Error ? e.message : String(e), 'error', 0);
      }
    });
    return [
      el('article', { className: 'kl-template' }, [
        el('h3', { text: info.title }),
        el('p', {
          className: 'kl-muted',
          text: `${info.items} items · ${info.buses} buses · cases: ${info.cases.join(', ')}`,
        }),
        ...info.notes.slice(0, 2).map((n) => el('p', { text: n })),
        open,
      ]),
    ];
  });
  const dlg = openDialog(
    'New from template',
    [
      el('p', { className: 'kl-muted', text: REPLACE_NOTE }),
      el('div', { className: 'kl-template-list' }, cards),
    ],
    [{ label: 'Cancel' }],
    { wide: true, testId: 'templates' },
  );
}

/** Open the native file, or an xlsx (our own export comes back with its catalogue formulas). */
export async function openFile(app: FileHost): Promise<void> {
  const file = await pickFile(
    '.json,.kvar.json,application/json,.xlsx,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  );
  if (!file) return;
  const { openChosenFile } = await import('./longWork.ts');
  await openChosenFile(app, file);
}

export function saveFile(app: FileHost): void {
  const r = saveNativeFile(app.session.toDoc());
  if (r.ok) app.status.show(`Saved as ${r.name} in your downloads.`);
  else app.status.show(r.message, 'error', 0);
}

/** Swap the open workbook with the one set aside when it was last replaced. */
export async function bringBack(app: FileHost): Promise<void> {
  const aside = app.store && (await loadSetAside(app.store));
  if (!aside) {
    app.status.show('No workbook has been replaced in this browser yet.');
    return;
  }
  const when = new Date(aside.savedAt).toLocaleString();
  const ok = await confirmDialog(
    'Bring back the replaced workbook?',
    [
      `"${aside.doc.title}", as it was when it was replaced (${when}), takes the place of the open workbook.`,
      'The open workbook is set aside in turn, so this can be reversed the same way.',
    ],
    'Bring back',
  );
  if (ok) await app.replaceWith(aside.doc, `Brought back "${aside.doc.title}".`);
}

export async function exportXlsx(app: FileHost): Promise<void> {
  const { exportWorkbook } = await import('./longWork.ts');
  await exportWorkbook(app);
}

export async function importEquipmentList(app: FileHost): Promise<void> {
  const file = await pickFile(
    '.xlsx,.csv,.txt,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  );
  if (!file) return;
  try {
    const { runImport } = await import('../import/importDialog.ts');
    await runImport(app, file);
  } catch (e) {
    app.status.show(`Import failed: ${e instanceof Error ? e.message : String(e)}`, 'error', 0);
  }
}
