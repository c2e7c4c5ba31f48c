// Importing a client's equipment list (loaded on demand): file → header mapping (suggested,
// remembered choices) → preview with every problem at its row and column → accept. Nothing in
// the open workbook changes before "accept". Reading and mapping are src/io/import's work.
import type { SiteSettings } from '../../core/site/model.ts';
import { buildWorkbook } from '../../core/workbook/build.ts';
import { describeProblem } from '../../io/xlsx/fileProblem.ts';
import { readEquipmentFile } from '../../io/import/table.ts';
import { mappingTargets, proposeMapping, rememberMapping, withColumnTarget, withColumnUnit, type MappingProposal } from '../../io/import/mapping.ts';
import { MAPPING_MEMORY_STORAGE_KEY, parseMappingMemory } from '../../io/import/memory.ts';
import { DEFAULT_IMPORT_SETTINGS, previewImport, type ImportPreview } from '../../io/import/preview.ts';
import { unitChoicesFor } from '../../io/import/units.ts';
import { el } from '../dom.ts';
import { openDialog } from '../dialogs/dialog.ts';
import type { App } from '../app/app.ts';
import { currentSite } from './currentSite.ts';

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

function mappingTable(p: MappingProposal, cases: readonly string[], onChange: (next: MappingProposal) => void): HTMLElement {
  const targets = mappingTargets(cases);
  const rows = p.columns.map((c) => {
    const target = el('select', { className: 'kl-select', attrs: { 'aria-label': `Column ${c.letter} feeds`, 'data-testid': `map-${c.letter}` } });
    target.append(el('option', { text: '— ignore —', attrs: { value: '' } }), ...targets.map((t) => el('option', { text: t, attrs: { value: t } })));
    target.value = c.target ?? '';
    target.addEventListener('change', () => onChange(withColumnTarget(p, c.index, target.value === '' ? null : target.value)));
    const unit = el('select', { className: 'kl-select', attrs: { 'aria-label': `Unit of column ${c.letter}` } });
    const choices = c.target ? unitChoicesFor(c.target) : [];
    unit.append(...choices.map((u) => el('option', { text: u.label === '' ? '(plain number)' : u.label, attrs: { value: u.label } })));
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
    el('thead', {}, [el('tr', {}, ['', 'header in the file', 'first values', 'feeds', 'unit', 'why'].map((h) => el('th', { text: h })))]),
    el('tbody', {}, rows),
  ]);
}

function previewNodes(pv: ImportPreview): Node[] {
  const { counts } = pv;
  const head = el('p', { attrs: { 'data-testid': 'import-counts' }, text: `${counts.rows} rows: ${counts.ok} fine, ${counts.withWarnings} with warnings, ${counts.withErrors} with errors.` });
  const problems = el('ul', { className: 'kl-problems', attrs: { 'data-testid': 'import-problems' } },
    pv.problems.slice(0, 200).map((p) => el('li', { className: `is-${p.severity}`, text: p.message })));
  const shown = pv.rows.slice(0, 60);
  const table = el('table', { className: 'kl-import-table' }, [
    el('thead', {}, [el('tr', {}, ['row', ...pv.targets].map((h) => el('th', { text: h })))]),
    el('tbody', {}, shown.map((r) => el('tr', { className: `is-${r.status}` }, [el('td', { text: String(r.row) }), ...pv.targets.map((t) => el('td', { text: r.cells[t] === null || r.cells[t] === undefined ? '' : String(r.cells[t]) }))]))),
  ]);
  return [head, ...(pv.problems.length ? [problems] : []), el('div', { className: 'kl-scroll' }, [table]), ...(pv.rows.length > shown.length ? [el('p', { className: 'kl-muted', text: `…and ${pv.rows.length - shown.length} more rows.` })] : [])];
}

export async function runImport(app: App, file: File): Promise<void> {
  const read = await readEquipmentFile(file.name, new Uint8Array(await file.arrayBuffer()));
  if (!read.ok) {
    openDialog('The list was not imported', [el('p', { text: `"${file.name}": ${describeProblem(read.problem)}` }), el('p', { className: 'kl-muted', text: 'The open workbook is unchanged.' })], [{ label: 'OK', kind: 'primary' }], { testId: 'import-failed' });
    return;
  }
  const current = currentSite(app.session.toDoc());
  const settings: SiteSettings = current?.site.settings ?? DEFAULT_IMPORT_SETTINGS;
  const existing = current?.site.equipment ?? [];
  const existingTags = new Set(existing.map((r) => r.tag.toLowerCase()));
  let proposal = proposeMapping(read.value, loadMemory());
  const body = el('div', { className: 'kl-import' });
  const missing = el('p', { className: 'kl-field-problem', attrs: { role: 'alert' } });
  let step: 'map' | 'preview' = 'map';
  let preview: ImportPreview | undefined;

  const render = () => {
    if (step === 'map') {
      missing.textContent = proposal.missing.length ? `Still needed: a column for ${proposal.missing.join(', ')}.` : '';
      body.replaceChildren(
        el('p', { text: `${file.name}${read.value.sheet ? `, sheet "${read.value.sheet}"` : ''}: header found in row ${proposal.headerRow}. Check what each column feeds and its unit.` }),
        missing,
        el('div', { className: 'kl-scroll' }, [mappingTable(proposal, settings.cases, (next) => ((proposal = next), render()))]),
      );
    } else if (preview) {
      const clashes = preview.equipment.filter((r) => existingTags.has(r.tag.toLowerCase())).map((r) => r.tag);
      body.replaceChildren(
        ...previewNodes(preview),
        el('p', { className: 'kl-muted', text: existing.length === 0 ? 'The workbook has no equipment yet.' : clashes.length > 0 ? `Adding is not offered: ${clashes.length} tag(s) already in the workbook (${clashes.slice(0, 5).join(', ')}${clashes.length > 5 ? ', …' : ''}).` : `The workbook holds ${existing.length} items: add the list to them, or replace them.` }),
      );
      add.hidden = existing.length === 0;
      add.disabled = !preview.canApply || clashes.length > 0;
    }
    next.textContent = step === 'map' ? 'Preview' : 'Accept: replace the equipment';
    next.disabled = step === 'map' ? proposal.missing.length > 0 : !preview?.canApply;
    back.hidden = step === 'map';
    if (step === 'map') add.hidden = true;
  };
  const back = el('button', { className: 'kl-btn', text: 'Back to the mapping', attrs: { type: 'button' } });
  const add = el('button', { className: 'kl-btn kl-btn-primary', text: 'Accept: add to the equipment', attrs: { type: 'button', 'data-testid': 'import-add' } });
  add.addEventListener('click', () => accept('add'));
  const next = el('button', { className: 'kl-btn kl-btn-primary', attrs: { type: 'button', 'data-testid': 'import-next' } });
  back.addEventListener('click', () => ((step = 'map'), render()));
  next.addEventListener('click', () => {
    if (step === 'map') {
      preview = previewImport(proposal, { settings });
      step = 'preview';
      render();
      return;
    }
    accept('replace');
  });
  const accept = (how: 'add' | 'replace') => {
    if (!preview?.canApply) return;
    try {
      localStorage.setItem(MAPPING_MEMORY_STORAGE_KEY, JSON.stringify(rememberMapping(loadMemory(), proposal)));
    } catch {
      // Remembering the mapping is a convenience; a full or blocked localStorage must not stop the import.
    }
    const equipment = how === 'add' ? [...existing, ...preview.equipment] : [...preview.equipment];
    const cases = [...new Set([...settings.cases, ...preview.cases])];
    const doc = buildWorkbook({ settings: { ...settings, cases }, equipment }, { flavour: 'live', ...(current ? { banks: current.banks } : {}) });
    dlg.close();
    app.open({ ...doc, title: app.session.title }, { note: `Imported ${preview.equipment.length} items from "${file.name}" (${how === 'add' ? 'added' : 'replacing the equipment'}). The workbook before the import: Workbook → Restore the previous state.`, changed: true });
  };
  const dlg = openDialog(`Import equipment list`, [body, el('div', { className: 'kl-dialog-actions' }, [back, add, next])], [{ label: 'Cancel' }], { wide: true, testId: 'import' });
  render();
}
