// The two tables of the import dialog: the mapping (what each column of the file feeds, its
// unit, why) and the preview of the rows as they will arrive, with the problems and counts.
import { columnLabel, kindNames } from '../../core/kinds/index.ts';
import {
  kindColumnMapped,
  mappingTargets,
  unitChoicesFor,
  withColumnTarget,
  withColumnUnit,
  withDefaultKind,
  type ImportPreview,
  type MappingProposal,
} from '../../io/import/index.ts';
import { el } from '../dom.ts';

function samples(p: MappingProposal, index: number): string {
  const out: string[] = [];
  for (const row of p.table.rows.slice(p.headerRow)) {
    const v = row[index];
    if (v !== null && v !== undefined && String(v).trim() !== '') out.push(String(v));
    if (out.length === 3) break;
  }
  return out.join(' · ');
}

export function mappingTable(
  p: MappingProposal,
  cases: readonly string[],
  onChange: (next: MappingProposal) => void,
): HTMLElement {
  const targets = mappingTargets(cases);
  const rows = p.columns.map((c) => {
    const target = el('select', {
      className: 'kl-select',
      attrs: { 'aria-label': `Column ${c.letter} feeds`, 'data-testid': `map-${c.letter}` },
    });
    target.append(
      el('option', { text: '— ignore —', attrs: { value: '' } }),
      ...targets.map((t) => {
        const l = columnLabel(t, p.defaultKind);
        // Short as the sheets head it, so the menu stays narrow; the meaning shows on hover.
        return el('option', { text: l.label, attrs: { value: t, title: l.words } });
      }),
    );
    target.value = c.target ?? '';
    if (c.target) target.title = columnLabel(c.target, p.defaultKind).words;
    target.addEventListener('change', () =>
      onChange(withColumnTarget(p, c.index, target.value === '' ? null : target.value)),
    );
    const unit = el('select', {
      className: 'kl-select',
      attrs: { 'aria-label': `Unit of column ${c.letter}` },
    });
    const choices = c.target ? unitChoicesFor(c.target) : [];
    const textOnly = choices.length <= 1 && (choices[0]?.label ?? '') === '';
    unit.append(
      ...choices.map((u) =>
        el('option', {
          text: textOnly ? '—' : u.label === '' ? '(plain number)' : u.label,
          attrs: { value: u.label },
        }),
      ),
    );
    unit.value = c.unit.label;
    unit.disabled = choices.length <= 1;
    unit.addEventListener('change', () => onChange(withColumnUnit(p, c.index, unit.value)));
    return el('tr', { className: c.target ? '' : 'is-ignored' }, [
      el('td', { className: 'kl-mono', text: c.letter }),
      el('td', { text: c.header || '(no header)' }),
      el('td', { className: 'kl-muted', text: samples(p, c.index) }),
      el('td', {}, [target]),
      el('td', {}, [unit]),
      el('td', { className: 'kl-muted', text: c.note ?? (c.why === 'none' ? '' : c.why) }),
    ]);
  });
  return el('table', { className: 'kl-import-table' }, [
    el('thead', {}, [
      el(
        'tr',
        {},
        ['', 'header in the file', 'first values', 'feeds', 'unit', 'why'].map((h) => el('th', { text: h })),
      ),
    ]),
    el('tbody', {}, rows),
  ]);
}

export function previewNodes(pv: ImportPreview): Node[] {
  const { counts } = pv;
  const head = el('p', {
    attrs: { 'data-testid': 'import-counts' },
    text: `${counts.rows} rows: ${counts.ok} fine, ${counts.withWarnings} with warnings, ${counts.withErrors} with errors.`,
  });
  const problems = el(
    'ul',
    { className: 'kl-problems', attrs: { 'data-testid': 'import-problems' } },
    pv.problems.slice(0, 200).map((p) => el('li', { className: `is-${p.severity}`, text: p.message })),
  );
  const shown = pv.rows.slice(0, 60);
  const table = el('table', { className: 'kl-import-table' }, [
    el('thead', {}, [
      el('tr', {}, [
        el('th', { text: 'row' }),
        ...pv.targets.map((t) => {
          const l = columnLabel(t, pv.proposal.defaultKind);
          return el('th', { text: l.label, attrs: { title: l.words } });
        }),
      ]),
    ]),
    el(
      'tbody',
      {},
      shown.map((r) =>
        el('tr', { className: `is-${r.status}` }, [
          el('td', { text: String(r.row) }),
          ...pv.targets.map((t) =>
            el('td', { text: r.cells[t] === null || r.cells[t] === undefined ? '' : String(r.cells[t]) }),
          ),
        ]),
      ),
    ),
  ]);
  const assumed = pv.assumed.length
    ? [
        el('p', {
          attrs: { 'data-testid': 'import-assumed' },
          text: `${pv.assumed.length} blank value(s) take a typical value, marked as assumed (listed in Checks); replace them with nameplate data when known.${pv.notAssumed.length ? ` ${pv.notAssumed.length} blank(s) have no typical value (first: ${pv.notAssumed[0]}).` : ''}`,
        }),
      ]
    : [];
  return [
    head,
    ...assumed,
    ...(pv.problems.length ? [problems] : []),
    el('div', { className: 'kl-scroll' }, [table]),
    ...(pv.rows.length > shown.length
      ? [el('p', { className: 'kl-muted', text: `…and ${pv.rows.length - shown.length} more rows.` })]
      : []),
  ];
}

/**
 * For a list without a kind column: one kind for every row ("every row is a motor"), from the
 * kinds registry. Null when a column feeds kind (then the column decides).
 */
export function kindForEveryRow(
  p: MappingProposal,
  onChange: (next: MappingProposal) => void,
): HTMLElement | null {
  if (kindColumnMapped(p)) return null;
  const select = el('select', {
    className: 'kl-select',
    attrs: { 'aria-label': 'Kind of every row', 'data-testid': 'import-every-kind' },
  });
  select.append(
    el('option', { text: '— choose, or map a column to kind —', attrs: { value: '' } }),
    ...kindNames().map((k) => el('option', { text: k, attrs: { value: k } })),
  );
  select.value = p.defaultKind ?? '';
  select.addEventListener('change', () => {
    const r = withDefaultKind(p, select.value === '' ? null : select.value);
    // The menu offers registered kinds only; a refusal cannot come from it.
    if (r.ok) onChange(r.proposal);
  });
  return el('p', { className: 'kl-import-every-kind' }, [
    el('label', {}, ['No column gives the kind of equipment. Every row is a ', select]),
  ]);
}
