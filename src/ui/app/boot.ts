// Start-up: open the browser storage, find out whether another tab already works on the workbook
// (this tab then works on a copy), bring back the last good workbook with the edits recorded
// since (or the one before it), or open the demo template on a first visit; then keep saving.
import { registeredFunctionNames } from '../../engine/index.ts';
import { ChecksPanel } from '../panels/checksPanel.ts';
import { COPY_PREFIX, LAST_GOOD, WorkbookStore, type LoadResult } from '../storage/idbStore.ts';
import { LazyPanel } from './lazyPanel.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { describeStorageError } from '../storage/storageErrors.ts';
import { claimWorkbook } from '../storage/tabClaim.ts';
import { TabStorage } from '../storage/tabStorage.ts';
import { DEMO_TEMPLATE, templateWorkbook } from '../templates/templateCatalog.ts';
import { App } from './app.ts';
import { fileCommand } from './lazyCommands.ts';
import { watchPageLife } from './pageLife.ts';
import { loadDetuningProposer } from '../model/designLoaders.ts';

const SECOND_TAB =
  'This workbook is already open in another tab. This tab works on a copy: its changes are saved apart in this browser (Workbook → Bring back a copy from another tab…) and never over the other tab’s work.';

async function openStore(late: { app?: App }): Promise<{ store?: WorkbookStore; problem?: string }> {
  try {
    if (typeof indexedDB === 'undefined') return { problem: 'This browser offers no IndexedDB storage.' };
    const store = await WorkbookStore.open(indexedDB, undefined, {
      beforeClose: () => late.app?.flushNow(),
      onClosed: (message) => late.app?.storeClosed(message),
    });
    return { store };
  } catch (e) {
    return { problem: describeStorageError(e) };
  }
}

/** A random name for this tab among the writers of the store. */
function tabName(): string {
  return globalThis.crypto?.randomUUID?.() ?? `${Date.now()}-${Math.random().toString(36).slice(2)}`;
}

export async function boot(root: HTMLElement): Promise<App> {
  const late: { app?: App } = {};
  const { store, problem } = await openStore(late);
  const claim = await claimWorkbook({
    locks: typeof navigator !== 'undefined' ? navigator.locks : undefined,
    onSecondTab: () =>
      late.app?.status.show(
        'This workbook is also open in another tab. That tab works on a copy and never saves over this one.',
        'info',
        0,
      ),
    onMainClosed: () =>
      late.app?.status.show(
        'The other tab with this workbook has closed. Reload this tab to go on with the workbook; the copy made here stays under Workbook → Bring back a copy from another tab….',
        'info',
        0,
      ),
  });
  const restored: LoadResult | undefined = store
    ? await store
        .load()
        .catch(() => ({ found: false as const, note: 'The saved workbook could not be read.' }))
    : undefined;
  const tab = tabName();
  const storage = store
    ? new TabStorage(store, {
        mode: claim.mode,
        tab,
        adopt: claim.locked && restored?.found === true && restored.from === LAST_GOOD,
        ...(restored?.found ? { opened: restored } : {}),
        onCopy: (message) => {
          late.app?.status.copyMode(true);
          late.app?.status.show(message, 'error', 0);
        },
      })
    : undefined;
  const app = new App(root, store, registeredFunctionNames(), storage);
  late.app = app;
  const charts = new LazyPanel(
    async () => new (await import('../charts/chartsPanel.ts')).ChartsPanel(),
    'charts-host',
  );
  app.charts = charts;
  app.side.add('charts', 'Charts', charts.root, () => charts.draw());
  const checks = new ChecksPanel();
  app.checks = checks;
  app.side.add('checks', 'Checks', checks.root, () => void checks.draw());
  checks.onJump = ({ sheet, row, col }) => {
    const id = app.session.engine.getSheetId(sheet);
    if (id === undefined) return;
    app.openSheet(id);
    app.grid.select(row - 1, col ?? 0);
  };
  if (claim.mode === 'copy') app.status.copyMode(true);

  app.side.onClosed = (click) => app.grid.focusAfterClick(click);
  const diagram = new LazyPanel(async () => {
    const { DiagramPanel } = await import('../diagram/diagramPanel.ts');
    const p = new DiagramPanel();
    p.title = () => app.session.title;
    p.onWide = () => {
      app.side.toggleWide();
      p.fit();
    };
    p.onSelectBus = (_bus, row) => {
      const id = app.session.engine.getSheetId(SHEETS.buses);
      if (id === undefined) return;
      app.openSheet(id);
      app.grid.select(row, 0);
    };
    return p;
  }, 'diagram-host');
  app.diagram = diagram;
  app.side.add('diagram', 'Site diagram', diagram.root, () => diagram.draw());

  let note = restored?.note;
  if (restored?.found) {
    try {
      const recovered =
        restored.recovered > 0
          ? ` ${restored.recovered} edit(s) made after the last full save were brought back too.`
          : '';
      app.open(restored.doc, {
        note:
          note ??
          `Welcome back: your workbook as saved ${new Date(restored.savedAt).toLocaleString()}.${recovered}`,
      });
    } catch (e) {
      // Never a dead page: the demo opens, and the stored workbook is kept as a copy to bring back.
      const kept = store
        ? await store.saveSlot(restored.doc, {
            slot: `${COPY_PREFIX}unopened-${tab}`,
            writer: tab,
            through: 0,
          })
        : undefined;
      note = `The workbook saved in this browser could not be opened (${e instanceof Error ? e.message : String(e)}).${kept?.ok ? ' It is kept: Workbook → Bring back a copy from another tab….' : ''}`;
    }
  }
  if (!app.hasWorkbook) {
    const demo = await templateWorkbook(DEMO_TEMPLATE);
    app.open(demo, {
      note: `${note ? `${note} ` : ''}A demo workbook of an invented site is open. Start your own from Workbook → New from template, or import an equipment list.`,
      changed: true,
    });
  }

  // After the welcome note, so these stay in sight.
  if (claim.mode === 'copy') app.status.show(SECOND_TAB, 'info', 0);
  if (problem) app.status.show(problem, 'error', 0);

  watchPageLife(app);
  const saveFile = fileCommand(app, (m) => m.saveFile(app));
  document.addEventListener('keydown', (e) => {
    if ((e.ctrlKey || e.metaKey) && !e.altKey && e.key.toLowerCase() === 's') {
      e.preventDefault();
      saveFile();
    }
  });
  root.dataset.ready = 'true';
  // The design behind a detuning typed alone, after the workbook is on screen (not in the first download).
  void loadDetuningProposer().then(() => (root.dataset.proposer = 'ready'));
  return app;
}
