// The function reference panel, generated from the catalogue: search, then for one function its
// signature with units, description, arguments, published source and worked examples computed
// live by the workbook's engine, with "insert into cell".
import { CATALOGUE, findFunction } from '../../core/functions/index.ts';
import { describeInterval } from '../../core/registry/messages.ts';
import { isOptional, type FunctionSpec } from '../../core/registry/spec.ts';
import { evaluateFormula } from '../../engine/index.ts';
import { clear, el } from '../dom.ts';
import { formatGeneral } from '../format/numberFormat.ts';
import type { WorkbookSession } from '../model/session.ts';
import { signatureText } from '../autocomplete/suggest.ts';
import { byFamily, checkExample, exampleFormula, searchCatalogue } from './referenceModel.ts';

export interface ReferenceHost {
  session(): WorkbookSession;
  currentSheet(): number;
  insert(text: string): void;
}

export class FunctionReference {
  readonly root: HTMLElement;
  private readonly search: HTMLInputElement;
  private readonly list: HTMLElement;
  private readonly detail: HTMLElement;
  private selected: FunctionSpec | undefined = CATALOGUE[0];

  constructor(private readonly host: ReferenceHost) {
    this.search = el('input', {
      className: 'kl-input kl-ref-search',
      attrs: {
        type: 'search',
        placeholder: 'Search functions, units, arguments…',
        'aria-label': 'Search functions',
        'data-testid': 'ref-search',
      },
    });
    // The detail (and "Insert into cell") follow the search: a function the search hides is not
    // the one on show.
    this.search.addEventListener('input', () => {
      const before = this.selected;
      this.renderList();
      if (this.selected !== before) this.renderDetail();
    });
    this.list = el('div', { className: 'kl-ref-list', attrs: { 'data-testid': 'ref-list' } });
    this.detail = el('article', { className: 'kl-ref-detail', attrs: { 'data-testid': 'ref-detail' } });
    this.root = el('section', { className: 'kl-ref', attrs: { 'aria-label': 'Function reference' } }, [
      this.search,
      this.list,
      this.detail,
    ]);
    // The detail's examples need the engine: drawn when the panel is first shown (refresh).
    this.renderList();
  }

  show(name: string): void {
    this.selected = findFunction(name) ?? this.selected;
    this.renderList();
    this.renderDetail();
  }

  /** Examples are computed by the engine: refresh after the workbook is replaced. */
  refresh(): void {
    this.renderDetail();
  }

  private renderList(): void {
    const found = searchCatalogue(this.search.value);
    if (!this.selected || !found.includes(this.selected)) this.selected = found[0];
    clear(this.list);
    if (found.length === 0)
      this.list.append(el('p', { className: 'kl-muted', text: 'No function matches.' }));
    for (const g of byFamily(found)) {
      this.list.append(el('h3', { className: 'kl-ref-family', text: g.family }));
      for (const f of g.specs) {
        const b = el(
          'button',
          {
            className: `kl-ref-item${f === this.selected ? ' is-current' : ''}`,
            attrs: { type: 'button', 'data-fn': f.name },
          },
          [
            el('span', { className: 'kl-ref-name', text: f.name }),
            el('span', { className: 'kl-ref-summary', text: f.summary }),
          ],
        );
        b.addEventListener('click', () => this.show(f.name));
        this.list.append(b);
      }
    }
  }

  private renderDetail(): void {
    clear(this.detail);
    const f = this.selected;
    if (!f) {
      this.detail.append(el('p', { className: 'kl-muted', text: 'No function matches the search.' }));
      return;
    }
    const insert = el('button', {
      className: 'kl-btn kl-btn-primary',
      text: 'Insert into cell',
      attrs: { type: 'button', 'data-testid': 'ref-insert' },
    });
    insert.addEventListener('click', () => this.host.insert(`=${f.name}(`));
    const params = el('table', { className: 'kl-ref-params' }, [
      el('thead', {}, [
        el(
          'tr',
          {},
          ['#', 'argument', 'unit', 'allowed', 'meaning'].map((h) => el('th', { text: h })),
        ),
      ]),
      el(
        'tbody',
        {},
        f.params.map((p, i) =>
          el('tr', {}, [
            el('td', { text: String(i + 1) }),
            el('td', { className: 'kl-mono', text: isOptional(p) ? `[${p.name}]` : p.name }),
            el('td', { text: p.unit === '1' ? '—' : p.unit }),
            el('td', { text: p.type === 'boolean' ? 'TRUE/FALSE' : describeInterval(p.domain) }),
            el('td', { text: p.doc }),
          ]),
        ),
      ),
    ]);
    this.detail.append(
      el('div', { className: 'kl-ref-head' }, [el('h2', { className: 'kl-mono', text: f.name }), insert]),
      el('p', { className: 'kl-ref-sig kl-mono', text: signatureText(f) }),
      el('p', { className: 'kl-ref-summary-line', text: f.summary }),
      el('p', { text: f.description }),
      params,
      el('p', { className: 'kl-ref-result' }, [
        el('strong', { text: 'Result: ' }),
        `${f.result.doc} (${f.result.unit})`,
      ]),
      el('p', { className: 'kl-ref-source' }, [
        el('span', {
          className: `kl-badge kl-badge-${f.source.kind.replace(/\s+/g, '-')}`,
          text: f.source.kind,
        }),
        ' ',
        f.source.ref,
      ]),
      el('h3', { className: 'kl-ref-family', text: 'Examples, computed now by the engine' }),
      this.examples(f),
    );
  }

  private examples(f: FunctionSpec): HTMLElement {
    const session = this.host.session();
    const rows = f.examples.map((ex) => {
      const formula = exampleFormula(f, ex);
      const r = evaluateFormula(session.engine, formula, this.host.currentSheet());
      const got = r.ok ? { ok: true as const, value: r.value } : { ok: false as const, message: r.message };
      const check = checkExample(ex, got);
      const shown =
        check.kind === 'value' && typeof check.got === 'number'
          ? formatGeneral(check.got)
          : String(check.got);
      const use = el('button', {
        className: 'kl-link',
        text: 'use',
        title: 'Put this formula into the active cell',
        attrs: { type: 'button' },
      });
      use.addEventListener('click', () => this.host.insert(formula));
      return el('tr', { className: check.ok ? '' : 'is-off' }, [
        el('td', { className: 'kl-mono is-formula', text: formula }),
        el('td', { className: `kl-mono is-value ${r.ok ? '' : 'kl-text-error'}`, text: shown }),
        el('td', {
          className: 'kl-ref-note',
          text: ex.note + (check.ok ? '' : ' — differs from the stated result'),
        }),
        el('td', { className: 'is-use' }, [use]),
      ]);
    });
    return el('table', { className: 'kl-ref-examples', attrs: { 'data-testid': 'ref-examples' } }, [
      el('thead', {}, [
        el(
          'tr',
          {},
          ['formula', 'engine gives', 'note', ''].map((h) => el('th', { text: h })),
        ),
      ]),
      el('tbody', {}, rows),
    ]);
  }
}
