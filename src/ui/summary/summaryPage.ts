// The one-page summary to hand over: site, cases, cos φ and tan φ at the point of connection
// before and after compensation, the banks per bus, cost, saving and payback, the chart of kvar
// per bus and the cautions, laid out for one printed page (A4 or Letter, summary.css). It is
// drawn from readSummary at the moment it opens, over the page, and printed with the browser's
// own print command (print to PDF included).
import '../styles/summary.css';
import { CAUTION_LINES } from '../../core/cautions.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { busBarChart } from '../charts/barChart.ts';
import { busesToDraw, type Grid } from '../charts/chartData.ts';
import { el } from '../dom.ts';
import {
  readSummary,
  shown,
  type BankLine,
  type Figure,
  type ItemLine,
  type Money,
  type SummaryData,
} from './summaryData.ts';

/** What the summary needs of the open workbook. */
export interface SummarySource {
  readonly engine: {
    getSheetId(name: string): number | undefined;
    getSheetValues(id: number): Grid;
  };
}

export type Paper = 'a4' | 'letter';

/** Buses per chart: enough for the demo sites, few enough to keep one page. */
const CHART_BUSES = 12;

const DEMO_CAUTION =
  'Rates or tariff values marked INVENTED on the Rates and Tariff sheets are demo values, not prices: replace them with your own before this page goes to anyone.';

const isError = (f: Figure) => typeof f === 'string' && f.startsWith('#');

function td(f: Figure, format: string, testId?: string): HTMLTableCellElement {
  return el('td', {
    className: isError(f) ? 'is-error' : '',
    text: shown(f, format),
    ...(testId ? { attrs: { 'data-testid': testId } } : {}),
  });
}

function table(head: readonly string[], rows: HTMLTableRowElement[], testId: string): HTMLTableElement {
  return el('table', { className: 'kl-sum-table', attrs: { 'data-testid': testId } }, [
    el('thead', {}, [
      el(
        'tr',
        {},
        head.map((h) => el('th', { text: h })),
      ),
    ]),
    el('tbody', {}, rows),
  ]);
}

function requirementText(d: SummaryData): string {
  const r = d.requirement;
  const parts = [`${shown(r.kind, '0')} at the point of connection`];
  if (r.kind === 'cos φ' || r.kind === 'cos φ lagging only')
    parts.push(`target cos φ ${shown(r.cosTarget, '0.00#')}`);
  parts.push(
    `tan φ limits in use: lagging ${shown(r.tanLag, '0.000')}, leading ${shown(r.tanLead, '0.000')}`,
  );
  return parts.join('; ');
}

function connection(d: SummaryData): HTMLElement {
  const rows = d.cases.map((c, k) =>
    el('tr', {}, [
      el('th', { text: c.name }),
      td(c.p, '#,##0'),
      td(c.qBefore, '#,##0'),
      td(c.cosBefore, '0.000', `cos-before-${k}`),
      td(c.tanBefore, '0.000', `tan-before-${k}`),
      td(c.qAfter, '#,##0'),
      td(c.cosAfter, '0.000', `cos-after-${k}`),
      td(c.tanAfter, '0.000', `tan-after-${k}`),
      td(c.within, '0', `within-${k}`),
    ]),
  );
  return el('section', { className: 'kl-sum-block' }, [
    el('h2', { text: `At the point of connection${d.connection ? ` ${d.connection}` : ''}` }),
    table(
      [
        'Case',
        'P (kW)',
        'Q before (kvar)',
        'cos φ before',
        'tan φ before',
        'Q after (kvar)',
        'cos φ after',
        'tan φ after',
        'Requirement met',
      ],
      rows,
      'summary-connection',
    ),
    el('p', { className: 'kl-sum-note', text: `Requirement: ${requirementText(d)}.` }),
  ]);
}

function bankText(b: BankLine): string {
  const parts: string[] = [];
  if (typeof b.fixed === 'number' && b.fixed > 0) parts.push(`${shown(b.fixed, '0.##')} fixed`);
  if (typeof b.steps === 'number' && b.steps > 0) {
    // A 1:2:2 or 1:2:4 bank: its smallest steps, then its stages and series.
    const series = typeof b.series === 'string' && b.series !== '' && b.series !== '1:1:1' ? b.series : '';
    const steps = series === '' ? b.steps : b.controllerSteps;
    parts.push(
      `${shown(steps, '0')} × ${shown(b.step, '0.##')}${series === '' ? '' : ` (${shown(b.steps, '0')} stages ${series})`}`,
    );
  }
  return parts.join(' + ') || '—';
}

function banks(d: SummaryData): HTMLElement {
  const body =
    d.banks.length === 0
      ? el('p', { className: 'kl-sum-note', text: 'No bank or reactor is chosen on the Compensation sheet.' })
      : table(
          [
            'Bus',
            'U (kV)',
            'Bank (kvar)',
            'Total (kvar)',
            'Detuning p (%)',
            'Tuning order',
            'Capacitor rated (kV)',
            'Reactor (kvar)',
            'Resonance check',
          ],
          d.banks.map((b) =>
            el('tr', {}, [
              el('th', { text: b.bus }),
              td(b.u, '0.0##'),
              el('td', { className: 'is-nowrap', text: bankText(b) }),
              td(b.total, '#,##0.#'),
              td(b.detuning, '0.##'),
              td(b.tuning, '0.00'),
              // A rating left blank is priced at the design's: say so beside it.
              b.uRatedByDesign
                ? el('td', { text: `${shown(b.uRated, '0.0##')} (design)` })
                : td(b.uRated, '0.0##'),
              td(b.reactor, '#,##0.#'),
              td(b.check ?? 'no finding', '0'),
            ]),
          ),
          'summary-banks',
        );
  return el('section', { className: 'kl-sum-block' }, [el('h2', { text: 'Compensation per bus' }), body]);
}

function moneyLine(label: string, value: string, testId: string, strong = false): HTMLElement {
  return el('div', { className: `kl-sum-figure${strong ? ' is-strong' : ''}` }, [
    el('span', { className: 'kl-sum-label', text: label }),
    el('span', { className: 'kl-sum-value', text: value, attrs: { 'data-testid': testId } }),
  ]);
}

/** An item as an offer line: "6 × LV contactor 63 A", or for items priced per kvar "LV capacitor 300 kvar (12 pc)". */
function itemText(l: ItemLine): string {
  const item = shown(l.item, '0');
  if (l.unit === 'kvar') return `${item} ${shown(l.quantity, '#,##0.##')} kvar (${shown(l.count, '0')} pc)`;
  return `${shown(l.count, '0')} × ${item}`;
}

/** The schedule per bus: its items in one cell, so the page stays one page; the bus's subtotal beside. */
function schedule(m: Money, cur: (f: Figure) => string): HTMLElement | null {
  if (m.schedule.length === 0) return null;
  const rows = m.schedule.map((b) =>
    el('tr', {}, [
      el('th', { text: b.bus }),
      el('td', { className: 'is-text', text: b.items.map(itemText).join('; ') }),
      el('td', { className: 'is-nowrap', text: cur(b.subtotal) }),
    ]),
  );
  return table(
    ['Bus', 'Equipment schedule (Quantities and cost sheet)', 'Subtotal'],
    rows,
    'summary-schedule',
  );
}

function money(m: Money | undefined): HTMLElement {
  const head = el('h2', { text: 'Cost and what it saves' });
  if (!m)
    return el('section', { className: 'kl-sum-block' }, [
      head,
      el('p', {
        className: 'kl-sum-note',
        text: `This workbook has no "${SHEETS.quantities}" sheet, so there is no cost or saving to show.`,
      }),
    ]);
  const cur = (f: Figure) =>
    typeof f === 'number' ? `${shown(f, '#,##0')} ${m.currency}`.trim() : shown(f, '0');
  const why =
    m.unpriced.length === 0
      ? null
      : el('p', {
          className: 'kl-sum-note is-warn',
          attrs: { 'data-testid': 'summary-unpriced' },
          text: `Unpriced because ${m.unpriced.length === 1 ? 'a line has' : `${m.unpriced.length} lines have`} no usable rate: ${m.unpriced.slice(0, 4).join('; ')}${m.unpriced.length > 4 ? '; …' : ''}.`,
        });
  return el('section', { className: 'kl-sum-block kl-sum-money' }, [
    head,
    el('div', { className: 'kl-sum-figures' }, [
      moneyLine('Equipment', cur(m.equipment), 'summary-equipment'),
      moneyLine('Total with installation, engineering, contingency', cur(m.total), 'summary-total', true),
      moneyLine('Annual saving', cur(m.saving), 'summary-saving', true),
      moneyLine(
        'Simple payback',
        typeof m.payback === 'number' ? `${shown(m.payback, '0.0')} years` : shown(m.payback, '0'),
        'summary-payback',
        true,
      ),
    ]),
    why,
    schedule(m, cur),
  ]);
}

function charts(d: SummaryData): HTMLElement {
  const figures = [...d.bars].map(([c, bars]) => {
    const drawn = busesToDraw(bars, CHART_BUSES);
    return el('figure', { className: 'kl-sum-chart' }, [
      el('figcaption', {
        text: `${c}${drawn.length < bars.length ? ` (${drawn.length} of ${bars.length} buses)` : ''}`,
      }),
      busBarChart(drawn, 420),
    ]);
  });
  return el('section', { className: 'kl-sum-block' }, [
    el('h2', { text: 'kvar per bus, before compensation' }),
    el('div', { className: 'kl-legend' }, [
      el('span', { className: 'kl-key is-absorbed', text: 'absorbed' }),
      el('span', { className: 'kl-key is-delivered', text: 'delivered' }),
      el('span', { className: 'kl-key is-net', text: 'net' }),
    ]),
    el('div', { className: 'kl-sum-charts' }, figures),
  ]);
}

function cautions(d: SummaryData): HTMLElement {
  const lines = [...CAUTION_LINES, ...(d.demoValues ? [DEMO_CAUTION] : [])];
  return el(
    'section',
    { className: 'kl-sum-block kl-sum-cautions', attrs: { 'data-testid': 'summary-cautions' } },
    [
      el('h2', { text: 'Cautions' }),
      el(
        'ul',
        {},
        lines.map((t) => el('li', { text: t })),
      ),
    ],
  );
}

/** The printable sheet itself. */
export function summarySheet(d: SummaryData, date: Date, paper: Paper): HTMLElement {
  return el('article', { className: `kl-sum-page is-${paper}`, attrs: { 'data-testid': 'summary-page' } }, [
    el('header', { className: 'kl-sum-head' }, [
      el('p', { className: 'kl-sum-kicker', text: 'Reactive power and compensation: summary' }),
      el('h1', { text: d.site || 'Site without a name', attrs: { 'data-testid': 'summary-site' } }),
      el('p', {
        className: 'kl-sum-note',
        text: `Operating cases: ${d.cases.map((c) => c.name).join(', ') || 'none'}. Figures as the workbook computes them on ${date.toISOString().slice(0, 10)}.`,
      }),
    ]),
    connection(d),
    banks(d),
    money(d.money),
    charts(d),
    cautions(d),
    el('footer', {
      className: 'kl-sum-foot',
      text: 'Made with Kvar Ledger. Every figure is a cell of the workbook: Buses, Compensation and Quantities and cost sheets.',
    }),
  ]);
}

/** Open the summary over the page; Escape or Close puts the page back. */
export function openSummary(source: SummarySource, date = new Date()): HTMLElement {
  const data = readSummary((name) => {
    const id = source.engine.getSheetId(name);
    return id === undefined ? undefined : source.engine.getSheetValues(id);
  });
  let paper: Paper = 'a4';
  const holder = el('div', { className: 'kl-sum-holder' });
  const draw = () => holder.replaceChildren(summarySheet(data, date, paper));
  const paperButton = (p: Paper, label: string) => {
    const b = el('button', {
      className: 'kl-seg',
      text: label,
      attrs: { type: 'button', role: 'radio', 'data-testid': `summary-paper-${p}` },
    });
    b.addEventListener('click', () => {
      paper = p;
      for (const other of papers.children) other.classList.toggle('is-on', other === b);
      for (const other of papers.children) other.setAttribute('aria-checked', String(other === b));
      draw();
    });
    b.classList.toggle('is-on', p === paper);
    b.setAttribute('aria-checked', String(p === paper));
    return b;
  };
  const papers = el(
    'div',
    { className: 'kl-segmented', attrs: { role: 'radiogroup', 'aria-label': 'Paper' } },
    [paperButton('a4', 'A4'), paperButton('letter', 'Letter')],
  );
  const print = el('button', {
    className: 'kl-btn kl-btn-primary',
    text: 'Print or save as PDF…',
    attrs: { type: 'button', 'data-testid': 'summary-print' },
  });
  print.addEventListener('click', () => window.print());
  const close = el('button', {
    className: 'kl-btn',
    text: 'Close',
    attrs: { type: 'button', 'data-testid': 'summary-close' },
  });
  const host = el(
    'div',
    {
      className: 'kl-sum-host',
      attrs: {
        role: 'dialog',
        'aria-modal': 'true',
        'aria-label': 'Summary to print',
        'data-testid': 'summary',
      },
    },
    [el('div', { className: 'kl-sum-tools' }, [el('span', { text: 'Paper' }), papers, print, close]), holder],
  );
  const previous = document.activeElement as HTMLElement | null;
  const shut = () => {
    host.remove();
    document.removeEventListener('keydown', onKey, true);
    previous?.focus();
  };
  const onKey = (e: KeyboardEvent) => {
    if (e.key === 'Escape') {
      e.preventDefault();
      shut();
    }
  };
  close.addEventListener('click', shut);
  document.addEventListener('keydown', onKey, true);
  draw();
  document.body.append(host);
  print.focus();
  return host;
}
