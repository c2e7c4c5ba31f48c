// Commands the page needs only when asked for (the workbook file commands, bringing back a copy,
// the about box) are fetched on first use, so a first visit downloads less.
import type { StatusBar } from '../statusBar.ts';
import type { FileHost } from './fileActions.ts';
import type { CopyHost } from './copies.ts';
import type { SummarySource } from '../summary/summaryPage.ts';

export type { CopyHost } from './copies.ts';

type FileActions = typeof import('./fileActions.ts');

function failed(app: { readonly status: Pick<StatusBar, 'show'> }, e: unknown): void {
  app.status.show(
    `The command could not be loaded (${e instanceof Error ? e.message : String(e)}); check the connection and try again.`,
    'error',
    0,
  );
}

/** A workbook command from fileActions.ts, loaded when first run. */
export function fileCommand<H extends FileHost>(
  app: H,
  run: (actions: FileActions, app: H) => unknown,
): () => void {
  return () => void import('./fileActions.ts').then((m) => run(m, app)).catch((e: unknown) => failed(app, e));
}

export function bringBackCopyCommand(app: CopyHost): () => void {
  return () =>
    void import('./copies.ts').then((m) => m.bringBackCopy(app)).catch((e: unknown) => failed(app, e));
}

/** The one-page summary to print, over the page. */
export function summaryCommand(app: {
  readonly session: SummarySource;
  readonly status: Pick<StatusBar, 'show'>;
}): () => void {
  return () =>
    void import('../summary/summaryPage.ts')
      .then((m) => m.openSummary(app.session))
      .catch((e: unknown) => failed(app, e));
}

export function showAbout(catalogueSize: number): void {
  void import('../dialogs/about.ts').then((m) => m.openAbout(catalogueSize));
}
