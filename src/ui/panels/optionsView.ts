// The cards of the design options (loaded with their figures, on first use).
import { clear, el } from '../dom.ts';
import {
  isUnread,
  type OptionFigures,
  type OptionsReport,
  type UnreadOption,
} from '../../core/options/index.ts';

const money = (x: number | null) =>
  x === null ? 'unpriced' : x.toLocaleString('en-GB', { maximumFractionDigits: 0 });
const kvar = (x: number) => `${Math.round(x).toLocaleString('en-GB')}`;

const ABOUT =
  'The banks as the Compensation sheet holds them, the proposed design, plain capacitors, every bank detuned 7 %, and one bank at the point of connection, each priced at the Rates sheet, saved at the Tariff sheet and judged by the same rules.';

export function renderOptions(body: HTMLElement, r: OptionsReport): void {
  clear(body);
  body.append(
    el('h3', { text: 'Design options side by side' }),
    el('p', { className: 'kl-muted', text: ABOUT }),
  );
  if (!r.ok) {
    body.append(el('p', { className: 'kl-muted', text: r.message }));
    return;
  }
  const currency = r.options.find((o): o is OptionFigures => !isUnread(o))?.currency ?? '';
  body.append(
    el(
      'ul',
      { className: 'kl-option-list' },
      r.options.map((o) => (isUnread(o) ? unreadCard(o) : card(o, currency))),
    ),
    el('p', {
      className: 'kl-muted',
      text: 'Each option is also live formulas on the Design options sheet: type its banks there (the options proposed when the workbook was made are marked). Estimates only: the final design follows local codes, the utility and a licensed engineer.',
    }),
  );
}

/** An option with inputs that could not be read: what is wrong, where, and no figures. */
function unreadCard(o: UnreadOption): HTMLElement {
  return el('li', { className: 'kl-option', attrs: { 'data-option': o.id, 'data-unread': 'true' } }, [
    el('strong', { text: o.name }),
    el('span', { className: 'kl-muted', text: ` — ${o.summary}` }),
    el('p', { text: 'Not worked out until its inputs are mended:' }),
    el(
      'ul',
      {},
      o.unread.map((m) => el('li', { text: m })),
    ),
  ]);
}

function card(o: OptionFigures, currency: string): HTMLElement {
  const facts: [string, string][] = [
    ['Capacitors', `${kvar(o.capacitor_kvar)} kvar`],
    ['Reactors', `${kvar(o.reactor_kvar)} kvar`],
    ['Total', `${money(o.total)} ${o.total === null ? '' : currency}`.trim()],
    ['Saving a year', `${money(o.annual_saving)} ${currency}`.trim()],
    ['Payback', o.payback_years === null ? '–' : `${o.payback_years.toFixed(2)} years`],
    ['Requirement', o.meets_every_case ? 'met in every case' : 'missed in some case'],
    [
      'Findings',
      `${o.errors} error${o.errors === 1 ? '' : 's'}, ${o.warnings} warning${o.warnings === 1 ? '' : 's'}`,
    ],
  ];
  return el('li', { className: 'kl-option', attrs: { 'data-option': o.id } }, [
    el('strong', { text: o.name }),
    el('span', {
      className: 'kl-muted',
      text: ` — ${o.summary}${o.sameAs ? `; the same banks as “${o.sameAs}”` : ''}`,
    }),
    // The figures of an option that installs the same banks as one above are those figures.
    o.sameAs
      ? null
      : el(
          'dl',
          {},
          facts.flatMap(([k, v]) => [el('dt', { text: k }), el('dd', { text: v })]),
        ),
  ]);
}

/** The cards below no longer describe the workbook (a large site): say so and offer to redo them. */
export function renderStale(host: HTMLElement, redo: () => void): void {
  const again = el('button', {
    className: 'kl-btn',
    text: 'Compare again',
    attrs: { type: 'button', 'data-testid': 'options-redo' },
  });
  again.addEventListener('click', () => {
    clear(host);
    redo();
  });
  clear(host);
  host.append(
    el('p', { className: 'kl-options-stale' }, [
      'The workbook changed since these options were worked out (on a site this large they are not redone after every edit). ',
      again,
    ]),
  );
}
