// Workbook-level commands: start from a template, open and save the native file, restore the
// previous autosaved state, import an equipment list, export the hand-off xlsx. The xlsx code
// (and its library) is fetched only when one of the last two is used.
import { el } from '../dom.ts';
import { confirmDialog, openDialog } from '../dialogs/dialog.ts';
import { download, fileNameFor, pickFile, readNativeFile, saveNativeFile } from '../storage/nativeFile.ts';
import { templateIds, templateInfo, templateWorkbook } from '../templates/templateCatalog.ts';
import type { App } from './app.ts';
import { toResult } from '../../engine/index.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { WorkbookSession } from '../model/session.ts';
import { withProgress, type Task } from '../dialogs/progress.ts';

const CANCELLED = 'Cancelled: the open workbook is unchanged.';

function formulaCount(doc: WorkbookDoc): number {
  let n = 0;
  for (const s of doc.sheets)
    for (const row of s.cells) for (const c of row) if (typeof c === 'string' && c.startsWith('=')) n++;
  return n;
}

/**
 * Load a workbook with progress shown and a way to cancel: `load` gets the document, then the
 * engine computes it; only when all is done does it take the place of the open workbook.
 */
export async function openWithProgress(
  app: App,
  title: string,
  load: (task: Task) => Promise<{ doc: WorkbookDoc; note: string } | undefined>,
): Promise<boolean> {
  let failed: string | undefined;
  const done = await withProgress(title, async (task) => {
    const loaded = await load(task);
    if (!loaded) return undefined;
    await task.step(
      `Computing the workbook (${formulaCount(loaded.doc).toLocaleString('en')} formulas)…`,
      0.6,
    );
    let session: WorkbookSession;
    try {
      session = WorkbookSession.fromDoc(loaded.doc);
    } catch (e) {
      failed = `The workbook could not be opened: ${e instanceof Error ? e.message : String(e)}. The open workbook is unchanged.`;
      return undefined;
    }
    try {
      await task.step('Showing it…', 0.95);
    } catch (e) {
      session.destroy();
      throw e;
    }
    return { session, note: loaded.note };
  });
  if (failed) {
    app.status.show(failed, 'error', 0);
    return false;
  }
  if (!done) {
    app.status.show(CANCELLED, 'info', 8000);
    return false;
  }
  return app.replaceWith(done.session, done.note);
}

const REPLACE_NOTE =
  'The open workbook is replaced. It is set aside in this browser (Workbook → Bring back the replaced workbook); save it to a file to keep it for good.';

export async function newFromTemplate(app: App): Promise<void> {
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

function refused(app: App, message: string): void {
  app.status.show(message, 'error', 0);
  openDialog(
    'The file was not opened',
    [el('p', { text: message }), el('p', { className: 'kl-muted', text: 'The open workbook is unchanged.' })],
    [{ label: 'OK', kind: 'primary' }],
    { testId: 'open-failed' },
  );
}

/** Open the native file, or an xlsx (our own export comes back with its catalogue formulas). */
export async function openFile(app: App): Promise<void> {
  const file = await pickFile(
    '.json,.kvar.json,application/json,.xlsx,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  );
  if (!file) return;
  try {
    await openWithProgress(app, `Opening "${file.name}"`, async (task) => {
      await task.step('Reading the file…', 0.05);
      if (/\.xlsx$/i.test(file.name)) {
        const { openXlsx } = await import('./handOff.ts');
        const bytes = new Uint8Array(await file.arrayBuffer());
        await task.step('Reading the sheets and formulas of the xlsx…', 0.2);
        const x = await openXlsx(bytes);
        if (!x.ok) return void refused(app, `"${file.name}" cannot be opened: ${x.message}`);
        return { doc: x.doc, note: [`Opened "${file.name}".`, ...x.notes].join(' ') };
      }
      const r = await readNativeFile(file);
      if (!r.ok) return void refused(app, r.message);
      return { doc: r.doc, note: `Opened "${file.name}".` };
    });
  } catch (e) {
    refused(app, `"${file.name}" cannot be opened: ${e instanceof Error ? e.message : String(e)}`);
  }
}

export function saveFile(app: App): void {
  const r = saveNativeFile(app.session.toDoc());
  if (r.ok) app.status.show(`Saved as ${r.name} in your downloads.`);
  else app.status.show(r.message, 'error', 0);
}

/** Swap the open workbook with the one set aside when it was last replaced. */
export async function bringBack(app: App): Promise<void> {
  const aside = await app.store?.loadSetAside();
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

export async function exportXlsx(app: App): Promise<void> {
  try {
    const { session } = app;
    const valueAt = (sheet: string, row: number, col: number) => {
      const id = session.engine.getSheetId(sheet);
      const v = id === undefined ? undefined : session.engine.getCellValue({ sheet: id, row, col });
      return typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean' ? v : undefined;
    };
    const resultAt = (sheet: string, row: number, col: number) => {
      const id = session.engine.getSheetId(sheet);
      return id === undefined ? undefined : toResult(session.engine.getCellValue({ sheet: id, row, col }));
    };
    const r = await withProgress('Exporting for other spreadsheet programs', async (task) => {
      await task.step('Loading the xlsx writer…', 0.05);
      const { handOff } = await import('./handOff.ts');
      await task.step('Collecting the sheets…', 0.15);
      const doc = session.toDoc();
      await task.step('Writing the xlsx: formulas, formats and the cover sheet…', 0.3);
      const out = await handOff(doc, valueAt, resultAt);
      await task.step('Saving the file…', 0.95);
      return out;
    });
    if (!r) return app.status.show('Export cancelled: no file was saved.', 'info', 8000);
    const name = fileNameFor(session.title, '.xlsx');
    download(r.bytes as BlobPart, name, 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    const caveat = [
      r.note,
      r.issues > 0 ? `${r.issues} cell(s) were written as values (listed on the cover sheet)` : undefined,
    ]
      .filter(Boolean)
      .join('; ');
    app.status.show(
      caveat
        ? `Exported ${name}, but ${caveat}.`
        : `Exported ${name}: formulas stay live in other spreadsheet programs.`,
      caveat ? 'error' : 'info',
      caveat ? 0 : 8000,
    );
  } catch (e) {
    app.status.show(`Export failed: ${e instanceof Error ? e.message : String(e)}`, 'error', 0);
  }
}

export async function importEquipmentList(app: App): Promise<void> {
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
