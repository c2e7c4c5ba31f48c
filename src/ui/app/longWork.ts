// Long work on whole workbooks, loaded when first used: opening a file and exporting the xlsx,
// each under a progress dialog with Cancel (dialogs/progress.ts); the import dialog uses
// openWithProgress for the workbook it builds.
import { el } from '../dom.ts';
import { openDialog } from '../dialogs/dialog.ts';
import { withProgress, type Task } from '../dialogs/progress.ts';
import { download, fileNameFor, readNativeFile } from '../storage/nativeFile.ts';
import { WorkbookSession } from '../model/session.ts';
import { toResult } from '../../engine/index.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import type { StatusBar } from '../statusBar.ts';

/** What long work needs of the page: the open workbook, the status line, and a way to replace it. */
export interface LongWorkHost {
  readonly session: Pick<WorkbookSession, 'toDoc' | 'title' | 'engine'>;
  readonly status: Pick<StatusBar, 'show'>;
  replaceWith(next: WorkbookDoc | WorkbookSession, note: string): Promise<boolean>;
}

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
  app: LongWorkHost,
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

function refused(app: LongWorkHost, message: string): void {
  app.status.show(message, 'error', 0);
  openDialog(
    'The file was not opened',
    [el('p', { text: message }), el('p', { className: 'kl-muted', text: 'The open workbook is unchanged.' })],
    [{ label: 'OK', kind: 'primary' }],
    { testId: 'open-failed' },
  );
}

/** Open a chosen file: the native file, or an xlsx (our own export comes back with its catalogue formulas). */
export async function openChosenFile(app: LongWorkHost, file: File): Promise<void> {
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

export async function exportWorkbook(app: LongWorkHost): Promise<void> {
  try {
    const { session } = app;
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
      const out = await handOff(doc, resultAt);
      await task.step('Saving the file…', 0.95);
      return out;
    });
    if (!r) return app.status.show('Export cancelled: no file was saved.', 'info', 8000);
    const name = fileNameFor(session.title, '.xlsx');
    download(r.bytes as BlobPart, name, 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    const caveat =
      r.issues > 0 ? `${r.issues} cell(s) were written as values (listed on the cover sheet)` : undefined;
    const typed =
      r.overrides > 0 ? ` ${r.overrides} typed-over value(s) went out as typed, marked in the file.` : '';
    app.status.show(
      caveat
        ? `Exported ${name}, but ${caveat}.${typed}`
        : `Exported ${name}: formulas stay live in other spreadsheet programs.${typed}`,
      caveat ? 'error' : 'info',
      caveat ? 0 : 8000,
    );
  } catch (e) {
    app.status.show(`Export failed: ${e instanceof Error ? e.message : String(e)}`, 'error', 0);
  }
}
