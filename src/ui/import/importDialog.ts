// Importing a client's equipment list (loaded on demand): file → header mapping (suggested,
// remembered choices) → preview with every problem at its row and column → accept. Nothing in
// the open workbook changes before "accept". Reading, mapping, preview and the merge into a new
// workbook are src/io/import's work; this is the dialog around them.
import type { SiteSettings } from '../../core/site/model.ts';
import {
  applyImport,
  DEFAULT_IMPORT_SETTINGS,
  describeProblem,
  MAPPING_MEMORY_STORAGE_KEY,
  parseMappingMemory,
  previewImport,
  proposeMapping,
  readEquipmentFile,
  rememberMapping,
  type ImportPreview,
} from '../../io/import/index.ts';
import { columnLabel } from '../../core/kinds/index.ts';
import { el } from '../dom.ts';
import { kindForEveryRow, mappingTable, previewNodes } from './importTables.ts';
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
    ' Fill blanks of motors, transformers, feeder cables and lines with typical values (marked as assumed)',
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
        note.textContent = `Still needed: a column for ${proposal.missing.map((t) => columnLabel(t).label).join(', ')}${proposal.missing.includes('kind') ? ' (or choose below the kind every row is)' : ''}.`;
      const everyKind = kindForEveryRow(proposal, (p) => ((proposal = p), render()));
      body.replaceChildren(
        el('p', {
          text: `${file.name}${read.value.sheet ? `, sheet "${read.value.sheet}"` : ''}: header found in row ${proposal.headerRow}. Check what each column feeds and its unit.`,
        }),
        el('div', { className: 'kl-scroll' }, [
          mappingTable(proposal, settings.cases, (p) => ((proposal = p), render())),
        ]),
        ...(everyKind ? [everyKind] : []),
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
