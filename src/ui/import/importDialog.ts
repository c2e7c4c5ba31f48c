// Importing a client's equipment list (loaded on demand): file → header mapping (suggested,
// remembered choices) → preview with every problem at its row and column → accept. Nothing in
// the open workbook changes before "accept". Reading, mapping, preview and the merge into a new
// workbook are src/io/import's work; this is the dialog around them.
import type { SiteSettings } from '../../core/site/model.ts';
import {
  applyImport,
  DEFAULT_IMPORT_SETTINGS,
  describeProblem,
  mappingTargets,
  MAPPING_MEMORY_STORAGE_KEY,
  parseMappingMemory,
  previewImport,
  proposeMapping,
  readEquipmentFile,
  rememberMapping,
  unitChoicesFor,
  withColumnTarget,
  withColumnUnit,
  type ImportPreview,
  type MappingProposal,
} from '../../io/import/index.ts';
import { el } from '../dom.ts';
import { openDialog } from '../dialogs/dialog.ts';
import type { WorkbookSession } from '../model/session.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { currentSite } from './currentSite.ts';
import { withProgress } from '../dialogs/progress.ts';
import { openWithProgress } from '../app/longWork.ts';

function loadMemory() {
  try {
    return parseMappingMemory(localStorage.getItem(MAPPING_MEMORY_STORAGE_KEY));
  } catch {
    return parseMappingMemory(null);
  }
}

function samples(p: MappingProposal, index: number): string {
  const out: string[] = [];
  for (const row of p.table.rows.slice(p.headerRow)) {
    const v = row[index];
    if (v !== null && v !== undefined && String(v).trim() !== '') out.push(String(v));
    if (out.length === 3) break;
  }
  return out.join(' · ');
}

function mappingTable(
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
      ...targets.map((t) => el('option', { text: t, attrs: { value: t } })),
    );
    target.value = c.target ?? '';
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

function previewNodes(pv: ImportPreview): Node[] {
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
      el(
        'tr',
        {},
        ['row', ...pv.targets].map((h) => el('th', { text: h })),
      ),
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

/** What the import needs of the page: the open workbook, and a way to replace it. */
export interface ImportHost {
  readonly session: Pick<WorkbookSession, 'toDoc' | 'title' | 'engine'>;
  readonly status: { show(text: string, kind?: 'info' | 'error', ms?: number): void };
  replaceWith(next: WorkbookDoc | WorkbookSession, note: string): Promise<boolean>;
}

export async function runImport(app: ImportHost, file: File): Promise<void> {
  const read = await withProgress(`Reading "${file.name}"`, async (task) => {
    await task.step('Reading the file…', 0.1);
    const bytes = new Uint8Array(await file.arrayBuffer());
    await task.step('Finding the header row and the equipment rows…', 0.4);
    return readEquipmentFile(file.name, bytes);
  });
  if (!read) return app.status.show('Import cancelled: the open workbook is unchanged.', 'info', 8000);
  if (!read.ok) {
    openDialog(
      'The list was not imported',
      [
        el('p', { text: `"${file.name}": ${describeProblem(read.problem)}` }),
        el('p', { className: 'kl-muted', text: 'The open workbook is unchanged.' }),
      ],
      [{ label: 'OK', kind: 'primary' }],
      { testId: 'import-failed' },
    );
    return;
  }
  const currentDoc = app.session.toDoc();
  const current = currentSite(currentDoc);
  const settings: SiteSettings = current?.site.settings ?? DEFAULT_IMPORT_SETTINGS;
  const existing = current?.site.equipment.length ?? 0;
  let proposal = proposeMapping(read.value, loadMemory());
  let step: 'map' | 'preview' = 'map';
  let preview: ImportPreview | undefined;
  const body = el('div', { className: 'kl-import' });
  const note = el('p', {
    className: 'kl-field-problem',
    attrs: { role: 'alert', 'data-testid': 'import-note' },
  });
  const dropBox = el('input', { attrs: { type: 'checkbox', 'data-testid': 'import-drop' } });
  const drop = el('label', { className: 'kl-tick' }, [dropBox, ' Leave out the rows with errors']);
  // Tender-stage lists lack nameplates: the same fill as Edit → Fill blanks, as the rows arrive.
  const fillBox = el('input', { attrs: { type: 'checkbox', 'data-testid': 'import-fill-typical' } });
  const fill = el('label', { className: 'kl-tick' }, [
    fillBox,
    ' Fill blanks of motors and transformers with typical values (marked as assumed)',
  ]);
  // Replacing the equipment asks what becomes of the site settings; adding always keeps them.
  const keepBox = el('input', {
    attrs: {
      type: 'radio',
      name: 'kl-import-settings',
      value: 'keep',
      'data-testid': 'import-keep-settings',
    },
  });
  const defaultsBox = el('input', {
    attrs: {
      type: 'radio',
      name: 'kl-import-settings',
      value: 'defaults',
      'data-testid': 'import-default-settings',
    },
  });
  keepBox.checked = true;
  const settingsChoice = el('fieldset', { className: 'kl-import-settings' }, [
    el('legend', { text: 'When replacing the equipment, the site settings:' }),
    el('label', { className: 'kl-tick' }, [keepBox, ` keep this site's (${settingsSummary(settings)})`]),
    el('label', { className: 'kl-tick' }, [
      defaultsBox,
      ' take the defaults of a new site (50 Hz, cos φ ≥ 0.95, no short-circuit power, one case)',
    ]),
  ]);
  const back = el('button', { className: 'kl-btn', text: 'Back to the mapping', attrs: { type: 'button' } });
  const add = el('button', {
    className: 'kl-btn kl-btn-primary',
    text: 'Accept: add to the equipment',
    attrs: { type: 'button', 'data-testid': 'import-add' },
  });
  const next = el('button', {
    className: 'kl-btn kl-btn-primary',
    attrs: { type: 'button', 'data-testid': 'import-next' },
  });

  const render = () => {
    note.textContent = '';
    if (step === 'map') {
      if (proposal.missing.length)
        note.textContent = `Still needed: a column for ${proposal.missing.join(', ')}.`;
      body.replaceChildren(
        el('p', {
          text: `${file.name}${read.value.sheet ? `, sheet "${read.value.sheet}"` : ''}: header found in row ${proposal.headerRow}. Check what each column feeds and its unit.`,
        }),
        el('div', { className: 'kl-scroll' }, [
          mappingTable(proposal, settings.cases, (p) => ((proposal = p), render())),
        ]),
      );
    } else if (preview) {
      body.replaceChildren(
        fill,
        ...previewNodes(preview),
        el('p', {
          className: 'kl-muted',
          text:
            existing === 0
              ? 'The workbook has no equipment yet.'
              : `The workbook holds ${existing} items: add the list to them, or replace them.`,
        }),
        ...(current ? [settingsChoice] : []),
      );
    }
    const hasErrors = preview?.counts.withErrors ? preview.counts.withErrors > 0 : false;
    drop.hidden = step === 'map' || !hasErrors;
    const acceptable =
      step === 'preview' &&
      !!preview &&
      preview.proposal.missing.length === 0 &&
      (preview.canApply || (hasErrors && dropBox.checked));
    next.textContent = step === 'map' ? 'Preview' : 'Accept: replace the equipment';
    next.disabled = step === 'map' ? proposal.missing.length > 0 : !acceptable;
    add.hidden = step === 'map' || existing === 0;
    add.disabled = !acceptable;
    back.hidden = step === 'map';
  };

  const accept = (mode: 'append' | 'replace') => {
    if (!preview) return;
    const r = applyImport(currentDoc, preview, {
      mode,
      dropRowsWithErrors: dropBox.checked,
      settings: defaultsBox.checked ? 'defaults' : 'keep',
    });
    if (!r.ok) {
      note.textContent = r.message;
      return;
    }
    try {
      localStorage.setItem(
        MAPPING_MEMORY_STORAGE_KEY,
        JSON.stringify(rememberMapping(loadMemory(), proposal)),
      );
    } catch {
      // Remembering the mapping is a convenience; a full or blocked localStorage must not stop the import.
    }
    dlg.close();
    const left = r.dropped > 0 ? `, ${r.dropped} row(s) with errors left out` : '';
    const assumed = r.assumed > 0 ? `, ${r.assumed} typical value(s) assumed for blanks` : '';
    const done = `Imported ${r.added} items from "${file.name}" (${mode === 'append' ? 'added' : 'replacing the equipment'}${left}${assumed}).`;
    void openWithProgress(app, `Importing "${file.name}"`, async () => ({ doc: r.doc, note: done }));
  };

  back.addEventListener('click', () => ((step = 'map'), render()));
  add.addEventListener('click', () => accept('append'));
  dropBox.addEventListener('change', render);
  const previewNow = () => previewImport(proposal, { settings, fillTypical: fillBox.checked });
  fillBox.addEventListener('change', () => {
    preview = previewNow();
    render();
  });
  next.addEventListener('click', () => {
    if (step === 'preview') return accept('replace');
    preview = previewNow();
    step = 'preview';
    render();
  });
  const dlg = openDialog('Import equipment list', [body, note], [{ label: 'Cancel' }], {
    wide: true,
    testId: 'import',
    footer: [drop, back, add, next],
  });
  render();
}

/** The settings a replacing import can keep, in a few words. */
function settingsSummary(s: SiteSettings): string {
  const r = s.requirement;
  const req = r.kind === 'cosphi' ? `cos φ ≥ ${r.target}` : `tan φ from −${r.leadMax} to ${r.lagMax}`;
  const ssc = s.sscMva === undefined ? 'no short-circuit power' : `${s.sscMva} MVA short-circuit power`;
  const cases = s.cases.length === 1 ? 'one case' : `${s.cases.length} cases`;
  return `${s.hz} Hz, ${req}, ${ssc}, ${cases}`;
}
