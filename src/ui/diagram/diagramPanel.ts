// The site diagram panel: the case switcher, the drawing, its size, and the SVG download. It
// redraws a moment after the last edit while visible (reading the site back takes a while on
// large sites, so not on every keystroke). A click on a bus (or Enter on it) shows the bus's
// row on the Buses sheet; "+N below" opens a collapsed branch.
import { clear, el } from '../dom.ts';
import type { WorkbookSession } from '../model/session.ts';
import { download, fileNameFor } from '../storage/nativeFile.ts';
import { readDiagramInputs, type DiagramInputs } from './diagramData.ts';
import { defaultCollapsed, layoutDiagram, MAX_SHOWN, type DiagramLayout } from './diagramLayout.ts';
import type { DiagramModel } from './diagramModel.ts';
import { standaloneSvg } from './diagramExport.ts';
import { diagramSvg } from './diagramSvg.ts';

const QUIET_MS = 250;
const MIN_SCALE = 0.3,
  MAX_SCALE = 1.6;

export class DiagramPanel {
  readonly root: HTMLElement;
  private readonly cases: HTMLElement;
  private readonly summary: HTMLElement;
  private readonly canvas: HTMLElement;
  private readonly downloadButton: HTMLButtonElement;
  private session: WorkbookSession | undefined;
  private inputs: DiagramInputs | undefined;
  private chosen: string | undefined;
  private scale = 1;
  private layout: DiagramLayout | undefined;
  /** Branches the user opened or closed, over the automatic choice. */
  private readonly toggled = new Map<string, boolean>();
  private timer: ReturnType<typeof setTimeout> | undefined;
  private dirty = true;
  private drawn: SVGSVGElement | undefined;
  visible = false;
  /** Set by the app: show a bus's row on the Buses sheet (0-based row). */
  onSelectBus: (bus: string, sheetRow: number) => void = () => {};
  /** Set by the app: widen or narrow the side panel. */
  onWide: () => void = () => {};
  /** Set by the app: the workbook's title, for the file name. */
  title: () => string = () => 'site';

  constructor() {
    this.cases = el('div', {
      className: 'kl-segmented',
      attrs: { role: 'radiogroup', 'aria-label': 'Operating case' },
    });
    const tool = (text: string, label: string, testId: string, run: () => void) => {
      const b = el('button', {
        className: 'kl-btn kl-btn-small',
        text,
        title: label,
        attrs: { type: 'button', 'aria-label': label, 'data-testid': testId },
      });
      b.addEventListener('click', run);
      return b;
    };
    const zoom = (factor: number) => () => {
      this.scale = Math.max(MIN_SCALE, Math.min(MAX_SCALE, this.scale * factor));
      this.render();
    };
    this.downloadButton = el('button', {
      className: 'kl-btn kl-btn-small',
      text: 'Download SVG',
      attrs: { type: 'button', 'data-testid': 'diagram-download' },
    });
    this.downloadButton.addEventListener('click', () => this.download());
    this.summary = el('p', {
      className: 'kl-muted kl-dg-summary',
      attrs: { 'data-testid': 'diagram-summary' },
    });
    this.canvas = el('div', { className: 'kl-dg-canvas', attrs: { 'data-testid': 'diagram-canvas' } });
    this.canvas.addEventListener('click', (e) => this.onActivate(e.target));
    this.canvas.addEventListener('keydown', (e) => {
      if (e.key !== 'Enter' && e.key !== ' ') return;
      e.preventDefault();
      this.onActivate(e.target);
    });
    this.root = el('section', { className: 'kl-diagram', attrs: { 'data-testid': 'diagram' } }, [
      el('div', { className: 'kl-dg-tools' }, [
        this.cases,
        el('span', { className: 'kl-spacer' }),
        tool('−', 'Smaller', 'diagram-smaller', zoom(1 / 1.25)),
        tool('+', 'Larger', 'diagram-larger', zoom(1.25)),
        tool('Fit', 'Fit the width of the panel', 'diagram-fit', () => this.fit()),
        tool('Wide', 'A wider panel for the diagram (again for the usual width)', 'diagram-wide', () =>
          this.onWide(),
        ),
        this.downloadButton,
      ]),
      this.summary,
      this.canvas,
    ]);
  }

  /** Called after every change; draws a moment later when visible, else when next shown. */
  update(session: WorkbookSession): void {
    if (session !== this.session) this.toggled.clear();
    this.session = session;
    this.dirty = true;
    if (!this.visible) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => this.draw(), QUIET_MS);
  }

  draw(): void {
    this.timer = undefined;
    if (!this.session || !this.dirty) return;
    this.dirty = false;
    try {
      this.inputs = readDiagramInputs(this.session);
    } catch (e) {
      this.inputs = undefined;
      clear(this.canvas);
      this.summary.textContent = `The diagram could not be drawn: ${e instanceof Error ? e.message : String(e)}`;
      return;
    }
    this.render();
  }

  private model(): DiagramModel | undefined {
    const inputs = this.inputs;
    if (!inputs) return undefined;
    if (!this.chosen || !inputs.cases.includes(this.chosen)) this.chosen = inputs.cases[0];
    return inputs.model(this.chosen ?? '');
  }

  private collapsed(model: DiagramModel): Set<string> {
    const out = defaultCollapsed(model);
    for (const [bus, open] of this.toggled) {
      if (open) out.delete(bus);
      else out.add(bus);
    }
    return out;
  }

  private render(): void {
    const inputs = this.inputs;
    const model = this.model();
    clear(this.cases);
    clear(this.canvas);
    this.drawn = undefined;
    if (!inputs || !model || model.buses.size === 0) {
      this.summary.textContent =
        'No buses yet: the diagram draws the buses named on the equipment sheets (Bus, and Feeds bus for transformers and lines).';
      this.downloadButton.disabled = true;
      return;
    }
    this.downloadButton.disabled = false;
    for (const c of inputs.cases) {
      const b = el('button', {
        className: `kl-seg${c === this.chosen ? ' is-on' : ''}`,
        text: c,
        attrs: { type: 'button', role: 'radio', 'aria-checked': String(c === this.chosen) },
      });
      b.addEventListener('click', () => {
        this.chosen = c;
        this.render();
      });
      this.cases.append(b);
    }
    const layout = layoutDiagram(model, this.collapsed(model));
    this.layout = layout;
    this.summary.textContent = summaryText(layout, model);
    this.drawn = diagramSvg(layout, `Site diagram, case ${this.chosen ?? ''}`, this.scale);
    this.canvas.append(this.drawn);
  }

  /** Scale the drawing to the canvas's width (never below the smallest readable size). */
  fit(): void {
    const width = this.canvas.clientWidth - 2;
    if (!this.layout || width <= 0) return;
    this.scale = Math.max(MIN_SCALE, Math.min(1, width / this.layout.width));
    this.render();
  }

  private onActivate(target: EventTarget | null): void {
    if (!(target instanceof Element)) return;
    const more = target.closest('[data-expand]');
    if (more) {
      const bus = more.getAttribute('data-expand') as string;
      this.toggled.set(bus, true);
      this.render();
      return;
    }
    const group = target.closest('[data-bus]');
    const bus = group?.getAttribute('data-bus');
    if (!bus) return;
    const row = this.inputs?.model(this.chosen ?? '').buses.get(bus)?.sheetRow;
    if (row !== undefined) this.onSelectBus(bus, row);
  }

  private download(): void {
    if (!this.drawn) return;
    const title = this.title();
    const text = standaloneSvg(this.drawn, `${title} — site diagram, case ${this.chosen ?? ''}`);
    download(text, fileNameFor(`${title} diagram ${this.chosen ?? ''}`, '.svg'), 'image/svg+xml');
  }
}

function summaryText(layout: DiagramLayout, model: DiagramModel): string {
  let errors = 0;
  for (const b of model.buses.values()) if (b.errors.length > 0) errors++;
  const parts = [`${layout.total} bus${layout.total === 1 ? '' : 'es'}`];
  if (layout.shown < layout.total)
    parts.push(`${layout.shown} shown (more than ${MAX_SHOWN} would not read; "+N below" opens a branch)`);
  if (errors > 0) parts.push(`${errors} in error (marked; hover for why)`);
  return `${parts.join(' · ')}. Click a bus to show its row on the Buses sheet.`;
}
