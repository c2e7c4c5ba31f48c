// The charts panel: per operating case, absorbed vs delivered kvar and the net for every bus,
// and the power triangle at the point of connection before and after compensation. Redrawn
// after every recalculation while visible.
import { SHEETS } from '../../core/workbook/layout.ts';
import { clear, el } from '../dom.ts';
import { patchChildren } from '../domPatch.ts';
import type { WorkbookSession } from '../model/session.ts';
import { busBarChart } from './barChart.ts';
import { busesToDraw, readChartData, type ChartData, type Grid } from './chartData.ts';
import { triangleChart, triangleRows } from './triangleChart.ts';

function sheetValues(session: WorkbookSession, name: string): Grid | undefined {
  const id = session.engine.getSheetId(name);
  return id === undefined ? undefined : session.engine.getSheetValues(id);
}

export class ChartsPanel {
  readonly root: HTMLElement;
  private readonly cases: HTMLElement;
  private readonly body: HTMLElement;
  private chosen: string | undefined;
  /** The data last drawn: a click on a case draws it again for that case. */
  private data: ChartData | undefined;
  /** The case buttons on screen (their names and the chosen one), so unchanged ones are kept. */
  private casesShown = '';
  private session: WorkbookSession | undefined;
  private dirty = true;
  visible = false;

  constructor() {
    this.cases = el('div', {
      className: 'kl-segmented',
      attrs: { role: 'radiogroup', 'aria-label': 'Operating case' },
    });
    this.body = el('div', { className: 'kl-charts-body' });
    this.root = el('section', { className: 'kl-charts', attrs: { 'data-testid': 'charts' } }, [
      this.cases,
      this.body,
    ]);
  }

  private frame = 0;

  /** Called after every change; draws at the next frame when visible (a burst of changes draws once), else when next shown. */
  update(session: WorkbookSession): void {
    this.session = session;
    this.dirty = true;
    if (!this.visible || this.frame) return;
    this.frame = requestAnimationFrame(() => {
      this.frame = 0;
      this.draw();
    });
  }

  draw(): void {
    if (!this.session || !this.dirty) return;
    this.dirty = false;
    const data = readChartData(
      sheetValues(this.session, SHEETS.buses),
      sheetValues(this.session, SHEETS.compensation),
    );
    this.render(data);
  }

  /**
   * Draw into a detached copy, then patch the panel: after an edit most bars and numbers are as
   * they were, and the browser restyles and repaints only those that moved.
   */
  private render(data: ChartData): void {
    this.data = data;
    const body = el('div');
    this.fill(data, body);
    this.renderCases(data);
    patchChildren(this.body, body);
  }

  private renderCases(data: ChartData): void {
    const key = JSON.stringify([data.cases, this.chosen]);
    if (key === this.casesShown) return;
    this.casesShown = key;
    clear(this.cases);
    for (const c of data.cases) {
      const b = el('button', {
        className: `kl-seg${c === this.chosen ? ' is-on' : ''}`,
        text: c,
        attrs: { type: 'button', role: 'radio', 'aria-checked': String(c === this.chosen) },
      });
      b.addEventListener('click', () => {
        this.chosen = c;
        if (this.data) this.render(this.data);
      });
      this.cases.append(b);
    }
  }

  private fill(data: ChartData, body: HTMLElement): void {
    if (data.cases.length === 0) {
      body.append(
        el('p', {
          className: 'kl-muted',
          text: `No "${SHEETS.buses}" sheet with per-case totals in this workbook. Start from a template (Workbook → New from template) to get bus totals and charts.`,
        }),
      );
      return;
    }
    if (!this.chosen || !data.cases.includes(this.chosen)) this.chosen = data.cases[0];
    const c = this.chosen as string;
    const tri = data.triangles.get(c);
    const triError = data.triangleErrors.get(c);
    if (!tri && triError)
      body.append(
        el('h3', { className: 'kl-chart-title', text: `Point of connection — ${c}` }),
        el('p', {
          className: 'kl-text-error',
          attrs: { 'data-testid': 'triangle-error' },
          text: `No power triangle: the engine gives an error for ${triError}`,
        }),
      );
    if (tri) {
      const rows = triangleRows(tri);
      body.append(
        el('h3', { className: 'kl-chart-title', text: `Point of connection ${tri.bus} — ${c}` }),
        triangleChart(tri),
        el('table', { className: 'kl-chart-table', attrs: { 'data-testid': 'triangle-table' } }, [
          el('thead', {}, [
            el(
              'tr',
              {},
              ['', 'P kW', 'Q kvar', 'S kVA', 'cos φ'].map((h) => el('th', { text: h })),
            ),
          ]),
          el(
            'tbody',
            {},
            rows.map((r) =>
              el('tr', { className: `is-${r.label}` }, [
                el('th', { text: r.label }),
                el('td', { text: r.p }),
                el('td', { text: r.q }),
                el('td', { text: r.s }),
                el('td', { text: r.cos }),
              ]),
            ),
          ),
        ]),
      );
    }
    const all = data.bars.get(c) ?? [];
    const bars = busesToDraw(all);
    body.append(
      el('h3', { className: 'kl-chart-title', text: `kvar per bus — ${c}` }),
      bars.length < all.length
        ? el('p', {
            className: 'kl-muted',
            text: `The point of connection and the ${bars.length - 1} buses with the most kvar, of ${all.length}; every bus is on the Buses sheet.`,
          })
        : '',
      el('div', { className: 'kl-legend' }, [
        el('span', { className: 'kl-key is-absorbed', text: 'absorbed' }),
        el('span', { className: 'kl-key is-delivered', text: 'delivered' }),
        el('span', { className: 'kl-key is-net', text: 'net' }),
      ]),
      busBarChart(bars),
    );
  }
}
