// The top bar: the product mark, the workbook title, the two command menus, undo/redo, and the
// switches for the side panel and the about box.
import { el, svg } from '../dom.ts';
import { menuButton } from '../menu.ts';
import { deleteRows, fillDown, insertRows, sortRows, type CommandHost } from '../grid/gridMenu.ts';
import type { WorkbookSession } from '../model/session.ts';
import type { ChartsPanel } from '../charts/chartsPanel.ts';
import type { ChecksPanel } from '../panels/checksPanel.ts';
import type { FileHost } from './fileActions.ts';
import type { PanelName, SidePanel } from './sidePanel.ts';
import {
  bringBackCopyCommand,
  fileCommand,
  showAbout,
  summaryCommand,
  type CopyHost,
} from './lazyCommands.ts';
import { openGoTo, stepSheet, type NavigationHost } from './navigation.ts';

/** What the top bar needs of the page (the app passes itself). */
export interface TopBarHost
  extends FileHost, Omit<CopyHost, 'replaceWith'>, Omit<NavigationHost, 'session' | 'grid'> {
  readonly session: FileHost['session'] &
    NavigationHost['session'] &
    Pick<WorkbookSession, 'setTitle' | 'canUndo' | 'canRedo' | 'fillTypicalValues' | 'engine'>;
  readonly grid: CommandHost &
    NavigationHost['grid'] & { focus(): void; focusAfterClick(e: MouseEvent): void };
  readonly side: Pick<SidePanel, 'toggle' | 'onToggle' | 'shown'>;
  readonly charts: Pick<ChartsPanel, 'visible' | 'draw'> | undefined;
  readonly checks: Pick<ChecksPanel, 'visible'> | undefined;
  readonly diagram: { visible: boolean } | undefined;
  undo(): void;
  redo(): void;
  run(fn: () => unknown): void;
  catalogueSize(): number;
}

function mark(): SVGSVGElement {
  // Our mark: a right triangle (P along, Q up) with its hypotenuse, in two strokes.
  const m = svg('svg', {
    viewBox: '0 0 24 24',
    width: 22,
    height: 22,
    class: 'kl-mark',
    'aria-hidden': 'true',
  });
  m.append(
    svg('path', { d: 'M3 20 H21 V6', class: 'kl-mark-legs' }),
    svg('path', { d: 'M3 20 L21 6', class: 'kl-mark-hyp' }),
  );
  return m;
}

export function buildTopBar(app: TopBarHost): { root: HTMLElement; title: HTMLInputElement } {
  const title = el('input', {
    className: 'kl-title',
    attrs: { type: 'text', 'aria-label': 'Workbook title', spellcheck: 'false', 'data-testid': 'title' },
  });
  const commitTitle = () => app.session.setTitle(title.value);
  title.addEventListener('change', commitTitle);
  title.addEventListener('keydown', (e) => {
    if (e.key === 'Enter') {
      commitTitle();
      app.grid.focus();
    }
  });
  const workbook = menuButton(
    'Workbook',
    [
      {
        label: 'New blank site',
        run: fileCommand(app, (m) => m.newBlankSite(app)),
        testId: 'menu-blank',
      },
      {
        label: 'New from template…',
        run: fileCommand(app, (m) => m.newFromTemplate(app)),
        testId: 'menu-template',
      },
      {
        label: 'Open file…',
        hint: '.kvar.json .xlsx',
        run: fileCommand(app, (m) => m.openFile(app)),
        testId: 'menu-open',
      },
      {
        label: 'Save file',
        hint: 'Ctrl+S',
        run: fileCommand(app, (m) => m.saveFile(app)),
        testId: 'menu-save',
      },
      {
        label: 'Bring back the replaced workbook…',
        run: fileCommand(app, (m) => m.bringBack(app)),
        testId: 'menu-bring-back',
        enabled: () => app.store !== undefined,
      },
      {
        label: 'Bring back a copy from another tab…',
        run: bringBackCopyCommand(app),
        testId: 'menu-bring-copy',
        enabled: () => app.store !== undefined,
      },
      'separator',
      {
        label: 'Import equipment list…',
        hint: '.xlsx .csv',
        run: fileCommand(app, (m) => m.importEquipmentList(app)),
        testId: 'menu-import',
      },
      {
        label: 'Export for other spreadsheet programs',
        hint: '.xlsx',
        run: fileCommand(app, (m) => m.exportXlsx(app)),
        testId: 'menu-export',
      },
      {
        label: 'Summary page to print…',
        hint: 'A4 / Letter',
        run: summaryCommand(app),
        testId: 'menu-summary',
      },
    ],
    'menu-workbook',
  );
  const edit = menuButton(
    'Edit',
    [
      { label: 'Undo', hint: 'Ctrl+Z', run: () => app.undo(), enabled: () => app.session.canUndo },
      { label: 'Redo', hint: 'Ctrl+Y', run: () => app.redo(), enabled: () => app.session.canRedo },
      'separator',
      { label: 'Fill down', hint: 'Ctrl+D', run: () => app.run(() => fillDown(app.grid)) },
      { label: 'Insert rows above', run: () => app.run(() => insertRows(app.grid, 'above')) },
      {
        label: 'Insert rows below',
        run: () => app.run(() => insertRows(app.grid, 'below')),
        testId: 'menu-insert-below',
      },
      { label: 'Delete rows', run: () => app.run(() => deleteRows(app.grid)) },
      {
        label: 'Sort rows by this column, ascending',
        run: () => app.run(() => sortRows(app.grid, false)),
      },
      {
        label: 'Sort rows by this column, descending',
        run: () => app.run(() => sortRows(app.grid, true)),
      },
      'separator',
      {
        label: 'Fill blanks with typical values',
        run: () => app.run(() => fillTypical(app)),
        testId: 'menu-typical',
      },
      'separator',
      { label: 'Go to…', hint: 'Ctrl+G', run: () => void openGoTo(app), testId: 'menu-goto' },
      { label: 'Next sheet', hint: 'Ctrl+PgDn', run: () => stepSheet(app, 1) },
      { label: 'Previous sheet', hint: 'Ctrl+PgUp', run: () => stepSheet(app, -1) },
    ],
    'menu-edit',
  );
  const iconButton = (text: string, label: string, run: () => void, testId: string) => {
    const b = el('button', {
      className: 'kl-icon-btn',
      text,
      title: label,
      attrs: { type: 'button', 'aria-label': label, 'data-testid': testId },
    });
    b.addEventListener('click', (e) => {
      run();
      app.grid.focusAfterClick(e);
    });
    return b;
  };
  const toggle = (name: PanelName, label: string) => {
    const b = el('button', {
      className: 'kl-toggle',
      text: label,
      attrs: { type: 'button', 'aria-pressed': 'false', 'data-testid': `toggle-${name}` },
    });
    b.addEventListener('click', (e) => {
      app.side.toggle(name);
      // The keyboard goes back to the grid: typing carries on where it was.
      app.grid.focusAfterClick(e);
    });
    return b;
  };
  const fnToggle = toggle('functions', 'Functions');
  const chartToggle = toggle('charts', 'Charts');
  const checksToggle = toggle('checks', 'Checks');
  const diagramToggle = toggle('diagram', 'Diagram');
  app.side.onToggle = (shown) => {
    fnToggle.setAttribute('aria-pressed', String(shown === 'functions'));
    chartToggle.setAttribute('aria-pressed', String(shown === 'charts'));
    if (app.charts) app.charts.visible = shown === 'charts';
    if (shown === 'charts') app.charts?.draw();
    checksToggle.setAttribute('aria-pressed', String(shown === 'checks'));
    if (app.checks) app.checks.visible = shown === 'checks';
    diagramToggle.setAttribute('aria-pressed', String(shown === 'diagram'));
    if (app.diagram) app.diagram.visible = shown === 'diagram';
  };
  const about = el('button', {
    className: 'kl-toggle kl-about-btn',
    text: 'About & cautions',
    attrs: { type: 'button', 'data-testid': 'about-open' },
  });
  about.addEventListener('click', () => showAbout(app.catalogueSize()));
  const root = el('header', { className: 'kl-top' }, [
    el('div', { className: 'kl-brand' }, [
      mark(),
      el('span', { className: 'kl-brand-name', text: 'Kvar Ledger' }),
    ]),
    title,
    el('nav', { className: 'kl-commands', attrs: { 'aria-label': 'Commands' } }, [
      workbook,
      edit,
      iconButton('↶', 'Undo (Ctrl+Z)', () => app.undo(), 'undo'),
      iconButton('↷', 'Redo (Ctrl+Y)', () => app.redo(), 'redo'),
    ]),
    el('span', { className: 'kl-spacer' }),
    fnToggle,
    chartToggle,
    checksToggle,
    diagramToggle,
    about,
  ]);
  return { root, title };
}

/** Typical values into the blanks of motors, transformers, feeders and lines, saying what went in and what did not. */
async function fillTypical(app: TopBarHost): Promise<void> {
  const r = await app.session.fillTypicalValues();
  const left =
    r.notAssumed.length === 0
      ? ''
      : ` ${r.notAssumed.length} blank(s) stay blank; first: ${r.notAssumed[0]}.`;
  if (r.filled === 0) {
    app.status.show(
      `No blank took a typical value: they exist for motors with a rated output and transformers with a rating.${left}`,
      'info',
      12_000,
    );
    return;
  }
  app.status.show(
    `${r.filled} blank value(s) filled with typical values, marked as assumed (listed in Checks); replace them with nameplate data when known.${left}`,
    'info',
    12_000,
  );
}
