// Start-up: open the browser storage, bring back the last good workbook (or the one before it),
// or open the demo template on a first visit; then keep saving.
import { HyperFormula } from 'hyperformula';
import { ENGINE_LANGUAGE } from '../../engine/config.ts';
import { ChecksPanel } from '../panels/checksPanel.ts';
import { LazyPanel } from './lazyPanel.ts';
import { SHEETS } from '../../core/workbook/buildLayout.ts';
import { WorkbookStore } from '../storage/idbStore.ts';
import { describeStorageError } from '../storage/storageErrors.ts';
import { DEMO_TEMPLATE, templateWorkbook } from '../templates/templateCatalog.ts';
import { App } from './app.ts';
import { saveFile } from './fileActions.ts';

async function openStore(): Promise<{ store?: WorkbookStore; problem?: string }> {
  try {
    if (typeof indexedDB === 'undefined') return { problem: 'This browser offers no IndexedDB storage.' };
    return { store: await WorkbookStore.open(indexedDB) };
  } catch (e) {
    return { problem: describeStorageError(e) };
  }
}

export async function boot(root: HTMLElement): Promise<App> {
  const { store, problem } = await openStore();
  const app = new App(root, store, HyperFormula.getRegisteredFunctionNames(ENGINE_LANGUAGE));
  const charts = new LazyPanel(
    async () => new (await import('../charts/chartsPanel.ts')).ChartsPanel(),
    'charts-host',
  );
  app.charts = charts;
  app.side.add('charts', 'Charts', charts.root, () => charts.draw());
  const checks = new ChecksPanel();
  app.checks = checks;
  app.side.add('checks', 'Checks', checks.root, () => checks.draw());
  checks.onJump = ({ sheet, row, col }) => {
    const id = app.session.engine.getSheetId(sheet);
    if (id === undefined) return;
    app.openSheet(id);
    app.grid.select(row - 1, col ?? 0);
  };

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

  const restored = store
    ? await store
        .load()
        .catch(() => ({ found: false as const, note: 'The saved workbook could not be read.' }))
    : undefined;
  let note = restored?.note;
  if (restored?.found) {
    try {
      app.open(restored.doc, {
        note: note ?? `Welcome back: your workbook as saved ${new Date(restored.savedAt).toLocaleString()}.`,
      });
    } catch (e) {
      // Never a dead page: the demo opens, and the stored workbook stays stored as the state before.
      note = `The workbook saved in this browser could not be opened (${e instanceof Error ? e.message : String(e)}).`;
    }
  }
  if (!app.hasWorkbook) {
    const demo = await templateWorkbook(DEMO_TEMPLATE);
    app.open(demo, {
      note: `${note ? `${note} ` : ''}A demo workbook of an invented site is open. Start your own from Workbook → New from template, or import an equipment list.`,
      changed: true,
    });
  }

  // After the welcome note, so it stays in sight.
  if (problem) app.status.show(problem, 'error', 0);

  // Keep what was typed when the tab is hidden or closed.
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'hidden') void app.flush();
  });
  window.addEventListener('pagehide', () => void app.flush());
  document.addEventListener('keydown', (e) => {
    if ((e.ctrlKey || e.metaKey) && !e.altKey && e.key.toLowerCase() === 's') {
      e.preventDefault();
      saveFile(app);
    }
  });
  root.dataset.ready = 'true';
  return app;
}
