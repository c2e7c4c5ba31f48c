// A site (from a site file, a list or the design) as the cells a user would have typed: the
// Site sheet's values, each equipment row on its kind's sheet, and the banks per bus on the
// Compensation sheet. render.ts then writes every generated cell.
import { DEMO_SOURCE, demoRateTable, ratesSheetDoc, tariffSheetDoc } from '../quote/index.ts';
import { DEFAULT_CASE } from './render.ts';
import { findKind } from '../kinds/index.ts';
import { textContent } from '../text/cellText.ts';
import { entryOf } from '../text/nameTable.ts';
import type { BankChoice } from '../site/bankChoice.ts';
import { buildBusGraph } from '../site/graph.ts';
import type { EquipmentRow, Site } from '../site/model.ts';
import type { CellContent, CellMark, SheetDoc, WorkbookDoc } from './document.ts';
import type { AssumedInput } from '../site/typical/fillSite.ts';
import { assumedMark } from './cellMarks.ts';
import { BANK_INPUTS, NOTE_HEADER, planCompensationColumns } from './compensationColumns.ts';
import type { EquipmentColumns } from './equipmentColumns.ts';
import { SHEETS } from './layout.ts';
import { headerRow } from './renderEquipment.ts';
import { REQUIREMENT_TEXT } from './settingsLayout.ts';
import { settingsCells, type SettingsInputs } from './renderSettings.ts';
import { equipmentPlans } from './structure.ts';
import { optionInputsSheet, type OptionDraft } from './optionInputs.ts';

export function settingsInputsOf(site: Site): SettingsInputs {
  const s = site.settings;
  const r = s.requirement;
  return {
    name: textContent(s.name),
    hz: s.hz,
    requirement: REQUIREMENT_TEXT[r.kind === 'cosphi' && r.lagOnly ? 'cosphiLag' : r.kind],
    cosTarget: r.kind === 'cosphi' ? r.target : null,
    tanLag: r.kind === 'tanphi' ? r.lagMax : null,
    tanLead: r.kind === 'tanphi' ? r.leadMax : null,
    refKw: r.refKw ?? null,
    ssc: s.sscMva ?? null,
    cases: s.cases.map(textContent),
    notes: (s.notes ?? []).map(textContent),
  };
}

/** Values of a row that the sheet has no column for, as "name=value; ...". */
export function otherValues(
  cols: EquipmentColumns,
  row: EquipmentRow,
  cases: readonly string[],
): string | null {
  const pairs: string[] = [];
  if (row.to_bus !== undefined && row.to_bus !== '' && !cols.input.has('to_bus'))
    pairs.push(`to_bus=${row.to_bus}`);
  if (row.supply !== undefined && row.supply !== '' && !cols.input.has('supply'))
    pairs.push(`supply=${row.supply}`);
  for (const [k, v] of Object.entries(row.values)) {
    if (v === undefined || cols.input.has(k) || (k === 'load' && cols.loadDefault !== undefined)) continue;
    pairs.push(`${k}=${v}`);
  }
  if (cols.loadCase === undefined)
    for (const [c, v] of Object.entries(row.loads)) pairs.push(`load:${c}=${v}`);
  else for (const [c, v] of Object.entries(row.loads)) if (!cases.includes(c)) pairs.push(`load:${c}=${v}`);
  return pairs.length > 0 ? pairs.join('; ') : null;
}

function inputCells(cols: EquipmentColumns, row: EquipmentRow, cases: readonly string[]): CellContent[] {
  const out = new Array<CellContent>(cols.firstComputed).fill(null);
  for (const [key, c] of cols.input) {
    // Text stays text: a tag such as 007 or =1 is stored with the mark that keeps it text.
    if (key === 'tag') out[c] = textContent(row.tag);
    else if (key === 'bus') out[c] = textContent(row.bus);
    else if (key === 'kind') out[c] = row.kind;
    else if (key === 'description')
      out[c] = row.description === undefined ? null : textContent(row.description);
    else if (key === 'to_bus') out[c] = row.to_bus === undefined ? null : textContent(row.to_bus);
    else if (key === 'supply') out[c] = row.supply === undefined ? null : textContent(row.supply);
    else out[c] = row.values[key] ?? null;
  }
  if (cols.loadDefault !== undefined) out[cols.loadDefault] = row.values.load ?? null;
  cols.loadCase?.forEach((c, k) => (out[c] = entryOf(row.loads, cases[k] as string) ?? null));
  out[cols.other] = otherValues(cols, row, cases);
  return out;
}

/** Where each equipment row goes: per equipment sheet, the site's row indices in sheet order. */
export function equipmentPlacement(
  site: Site,
): Array<{ readonly cols: EquipmentColumns; readonly indices: readonly number[] }> {
  const graph = buildBusGraph(site.equipment.filter((r) => r.bus !== ''));
  const order = new Map(graph.order.map((b, i) => [b, i]));
  // Rows kept together by bus, in bus order (one run of rows per bus, and the sheet reads by bus).
  const rank = (r: EquipmentRow) => order.get(r.bus) ?? order.size;
  return equipmentPlans(site.settings.cases).map((cols) => ({
    cols,
    indices: site.equipment
      .map((r, i) => ({ r, i }))
      .filter(({ r }) => {
        const k = findKind(r.kind);
        return k !== undefined && cols.kinds.includes(k);
      })
      .sort((a, b) => rank(a.r) - rank(b.r) || a.i - b.i)
      .map(({ i }) => i),
  }));
}

/** Where an assumed value sits in the workbook of its site: sheet, 0-based row and column. */
export interface AssumedPlace {
  readonly sheet: string;
  readonly mark: CellMark;
  readonly item: AssumedInput;
}

/** The cells of the site's workbook that hold the assumed values, each with its mark. */
export function assumedPlaces(site: Site, assumed: readonly AssumedInput[]): AssumedPlace[] {
  if (assumed.length === 0) return [];
  const out: AssumedPlace[] = [];
  for (const { cols, indices } of equipmentPlacement(site)) {
    const rowOf = new Map(indices.map((index, k) => [index, k + 1]));
    for (const a of assumed) {
      const row = rowOf.get(a.index);
      const col = cols.input.get(a.column);
      if (row === undefined || col === undefined) continue;
      out.push({ sheet: cols.sheet.name, mark: assumedMark(row, col, a.value, a.note), item: a });
    }
  }
  return out;
}

/**
 * The compact workbook of a site: inputs only (headers included); render.ts fills in the rest.
 * Values in `assumed` (typical values put in for blanks) are marked as assumed where they sit.
 */
export function inputsFromSite(
  site: Site,
  banks: readonly BankChoice[],
  assumed: readonly AssumedInput[] = [],
  /** The Design options sheet's options, marked as proposed (none: its blocks start blank). */
  options: readonly OptionDraft[] = [],
): WorkbookDoc {
  const cases = site.settings.cases;
  const sheets: SheetDoc[] = [{ name: SHEETS.settings, cells: settingsCells(settingsInputsOf(site)) }];
  const places = assumedPlaces(site, assumed);
  for (const { cols, indices } of equipmentPlacement(site)) {
    const rows = indices.map((i) => inputCells(cols, site.equipment[i] as EquipmentRow, cases));
    const marks = places.filter((p) => p.sheet === cols.sheet.name).map((p) => p.mark);
    sheets.push({
      name: cols.sheet.name,
      cells: [headerRow(cols), ...rows],
      ...(marks.length > 0 ? { marks } : {}),
    });
  }
  const comp = planCompensationColumns(cases);
  const compRows: CellContent[][] = [comp.columns.map((c) => c.header)];
  for (const b of banks) {
    const line = new Array<CellContent>(comp.columns.length).fill(null);
    line[comp.bus] = textContent(b.bus);
    // The series is text the engine would read as a time of day ("1:2:2"): marked as text.
    for (const i of BANK_INPUTS) {
      const v = b[i.key];
      line[comp.input[i.key]] = typeof v === 'string' ? textContent(v) : (v ?? null);
    }
    line[comp.note] = b.note ?? null;
    compRows.push(line);
  }
  sheets.push({ name: SHEETS.buses, cells: [] });
  sheets.push({ name: SHEETS.compensation, cells: compRows });
  // The user's rates, started with invented demo rates (each row says so).
  sheets.push(ratesSheetDoc(demoRateTable(), DEMO_SOURCE));
  // The utility's charge and the hours per case, started with invented demo values (said so).
  sheets.push(tariffSheetDoc(cases.length > 0 ? cases : [DEFAULT_CASE]));
  if (options.length > 0) sheets.push(optionInputsSheet(options, cases.length > 0 ? cases : [DEFAULT_CASE]));
  return { format: 'kvar-ledger-workbook', version: 2, title: site.settings.name, sheets };
}

export { NOTE_HEADER };
