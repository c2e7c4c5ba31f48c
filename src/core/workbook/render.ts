// A workbook document with every generated cell written from its inputs: the one place that
// turns what the user typed (Site values, equipment rows, banks per bus, own sheets, typed-over
// cells) into the full live or exported workbook. Opening a document, building one from a site
// file and exporting all come through here, so the page, the CLI and the xlsx agree.
import { busKey } from '../site/busNames.ts';
import { shownText } from '../text/cellText.ts';
import type { CellAt, CellContent, SheetDoc, WorkbookDoc } from './document.ts';
import { planBusColumns, type BusColumns } from './busColumns.ts';
import { busRowIndex, type Flavour } from './busSums.ts';
import {
  BANK_INPUTS,
  NOTE_HEADER,
  compensationInputCols,
  planCompensationColumns,
  type CompensationColumns,
} from './compensationColumns.ts';
import type { EquipmentColumns } from './equipmentColumns.ts';
import { SHEETS } from './layout.ts';
import { BUSES_PURPOSE, renderBusesSheet } from './renderBuses.ts';
import { COMPENSATION_PURPOSE, renderCompensationSheet } from './renderCompensation.ts';
import { QUANTITIES_SHEET, QUANT_COLUMNS } from './quantitiesLayout.ts';
import { QUANTITIES_PURPOSE, renderQuantitiesSheet } from './renderQuantities.ts';
import { RATES_SHEET, TARIFF_SHEET } from '../quote/index.ts';
import { MAX_SHEET_ROWS, OPTIONS_UNASKED_MAX_ROWS } from '../site/limits.ts';
import { optionInputsSheet, readOptionInputs, type OptionDraft } from './optionInputs.ts';
import { OPTIONS_SHEET, optionsExtent, planOptionColumns } from './optionsLayout.ts';
import { OPTIONS_PURPOSE, renderOptionsSheet, type OptionsInput } from './renderOptions.ts';
import { busLookup, computedCells, headerRow } from './renderEquipment.ts';
import {
  SETTINGS_COLUMNS,
  SETTINGS_PURPOSE,
  isCanonicalSettings,
  readSettingsInputs,
  settingsCells,
  settingsGenerated,
  type SettingsInputs,
} from './renderSettings.ts';
import {
  equipmentPlans,
  readSheetRows,
  structureOf,
  type ValueOf,
  type WorkbookStructure,
} from './structure.ts';

export const DEFAULT_CASE = 'normal';

export interface RenderOptions {
  readonly flavour: Flavour;
  /**
   * The options a workbook without a Design options sheet (made or saved before it) starts with:
   * core/options draftOptionsOfDoc. Passed in, not imported, so the page's first download does
   * not carry the design; without it such a workbook's option blocks start blank.
   */
  readonly draftOptions?: (doc: WorkbookDoc) => readonly OptionDraft[];
  /** Values of formula cells in input places (the page passes its engine's), for reading the structure. */
  readonly valueReader?: (sheet: string) => ValueOf | undefined;
}

const blank = (v: CellContent | undefined) =>
  v === null || v === undefined || (typeof v === 'string' && v.trim() === '');

function findSheet(doc: WorkbookDoc, name: string): SheetDoc | undefined {
  return (
    doc.sheets.find((s) => s.name === name) ??
    doc.sheets.find((s) => s.name.toLowerCase() === name.toLowerCase())
  );
}

/** A workbook of a site (not a plain spreadsheet): it has a Site sheet of settings, or a Buses sheet. */
export function isSiteDoc(doc: WorkbookDoc): boolean {
  const site = doc.sheets.find((s) => s.name === SHEETS.settings);
  return (
    (site !== undefined && site.cells[0]?.[0] === 'Setting') ||
    doc.sheets.some((s) => s.name === SHEETS.buses)
  );
}

/** Case names from the Site inputs (text, trimmed, first of equal names); one default case when none. */
export function casesOf(inputs: SettingsInputs): string[] {
  const out: string[] = [];
  for (const c of inputs.cases) {
    const t = (typeof c === 'string' ? shownText(c) : String(c)).trim();
    if (t !== '' && !out.some((x) => x.toLowerCase() === t.toLowerCase())) out.push(t);
  }
  return out.length > 0 ? out : [DEFAULT_CASE];
}

function copyRows(cells: readonly (readonly CellContent[])[]): CellContent[][] {
  return cells.map((r) => [...r]);
}

function put(cells: CellContent[][], r: number, c: number, v: CellContent): void {
  while (cells.length <= r) cells.push([]);
  const line = cells[r] as CellContent[];
  while (line.length <= c) line.push(null);
  line[c] = v;
}

/**
 * A value found where Kvar Ledger writes a formula is one a user typed over it (in the page, or in
 * another program before the file came back): it is kept and listed as typed over.
 */
function typedOver(found: CellContent, generated: CellContent): boolean {
  if (found === null || typeof generated !== 'string' || !generated.startsWith('=')) return false;
  return !(typeof found === 'string' && (found.startsWith('=') || found.trim() === ''));
}

function overridesOf(sheet: SheetDoc | undefined): Set<string> {
  return new Set((sheet?.overrides ?? []).map(([r, c]) => `${r},${c}`));
}

/**
 * An equipment sheet's cells in the plan's layout. A sheet laid out for this plan is taken as it
 * is; an older or foreign layout has its input columns moved by header text (computed columns
 * are written again anyway).
 */
function equipmentCells(
  sheet: SheetDoc | undefined,
  cols: EquipmentColumns,
): { cells: CellContent[][]; moved: boolean } {
  const header = headerRow(cols);
  if (!sheet) return { cells: [header], moved: false };
  const given = sheet.cells[0] ?? [];
  const same = header.every((h, c) => given[c] === h) && given.length <= header.length + 64;
  if (same) return { cells: copyRows(sheet.cells), moved: false };
  const index = new Map<string, number>();
  given.forEach((h, c) => {
    if (typeof h === 'string' && !index.has(h.trim().toLowerCase())) index.set(h.trim().toLowerCase(), c);
  });
  const out: CellContent[][] = [header];
  for (let r = 1; r < sheet.cells.length; r++) {
    const line = new Array<CellContent>(header.length).fill(null);
    for (const c of cols.inputCols) {
      const from = index.get((header[c] as string).toLowerCase());
      if (from !== undefined) line[c] = sheet.cells[r]?.[from] ?? null;
    }
    out.push(line);
  }
  return { cells: out, moved: true };
}

/** Bank inputs per bus from a Compensation sheet (by header text), keyed by bus. */
export function bankInputsOf(
  sheet: SheetDoc | undefined,
  cols: CompensationColumns,
): Map<string, Map<number, CellContent>> {
  const out = new Map<string, Map<number, CellContent>>();
  if (!sheet) return out;
  const index = new Map<string, number>();
  (sheet.cells[0] ?? []).forEach((h, c) => {
    if (typeof h === 'string') index.set(h.trim().toLowerCase(), c);
  });
  const wanted = [
    ...BANK_INPUTS.map((b) => [b.header, cols.input[b.key]] as const),
    [NOTE_HEADER, cols.note] as const,
  ];
  for (let r = 1; r < sheet.cells.length; r++) {
    const bus = sheet.cells[r]?.[0];
    if (blank(bus)) break; // the bus list ends at the first blank row; a summary follows
    const values = new Map<number, CellContent>();
    for (const [header, to] of wanted) {
      const from = index.get(header.toLowerCase());
      const v = from === undefined ? null : (sheet.cells[r]?.[from] ?? null);
      if (!blank(v)) values.set(to, v);
    }
    const key = busKey((typeof bus === 'string' ? shownText(bus) : String(bus)).trim());
    if (values.size > 0 && !out.has(key)) out.set(key, values);
  }
  return out;
}

/**
 * Generated cells over a sheet's own: cells inside the generated block are replaced unless the
 * user typed over them (overrides); cells outside it (notes) stay.
 */
function overlay(
  own: SheetDoc | undefined,
  generated: readonly (readonly CellContent[])[],
  over: Set<string>,
): CellContent[][] {
  const cells = copyRows(own?.cells ?? []);
  const width = generated.reduce((m, r) => Math.max(m, r.length), 0);
  for (let r = 0; r < generated.length; r++) {
    for (let c = 0; c < width; c++) {
      const v = generated[r]?.[c] ?? null;
      if (over.has(`${r},${c}`) || typedOver(cells[r]?.[c] ?? null, v)) {
        over.add(`${r},${c}`);
        continue;
      }
      if (v !== null || (cells[r]?.[c] ?? null) !== null) put(cells, r, c, v);
    }
    while (cells.length <= r) cells.push([]);
    const line = cells[r] as CellContent[];
    while (line.length < width) line.push(null);
  }
  return cells;
}

export interface Rendered {
  readonly doc: WorkbookDoc;
  readonly structure: WorkbookStructure;
  readonly busCols: BusColumns;
  readonly compCols: CompensationColumns;
  /** The Design options sheet holds inputs only (optionsLeftOut says why), no formulas. */
  readonly optionsCompact: boolean;
}

/** The full workbook for a document: every built-in sheet with its generated cells. */
export function renderWorkbook(doc: WorkbookDoc, opts: RenderOptions): Rendered {
  const siteSheet = findSheet(doc, SHEETS.settings);
  const typed = readSettingsInputs(siteSheet);
  const cases = casesOf(typed);
  const inputs: SettingsInputs = { ...typed, cases };
  const plans = equipmentPlans(cases);
  const equipment = plans.map((cols) => {
    const sheet = findSheet(doc, cols.sheet.name);
    const { cells, moved } = equipmentCells(sheet, cols);
    const value = opts.valueReader?.(cols.sheet.name);
    return { cols, sheet, cells, moved, rows: readSheetRows(cells, cols, moved ? undefined : value) };
  });
  const structure = structureOf(
    cases,
    equipment.map((e) => e.rows),
  );
  const busCols = planBusColumns(cases);
  const compCols = planCompensationColumns(cases);
  const busRows = busRowIndex(structure);
  const busRow = (bus: string) => {
    const i = structure.busIndex.get(busKey(bus));
    return i === undefined ? undefined : i + 1;
  };
  const lookup = busLookup(busCols.s, busCols.sAfter, busRow);

  const sheets: SheetDoc[] = [];
  // Site: its own layout when it has it, else written anew from the values it holds.
  const siteCells =
    siteSheet && typed.cases.length > 0 && isCanonicalSettings(siteSheet, inputs)
      ? overlayCells(siteSheet, settingsGenerated(inputs))
      : settingsCells(inputs);
  sheets.push(
    sheetDoc(
      SHEETS.settings,
      siteCells,
      SETTINGS_COLUMNS,
      SETTINGS_PURPOSE,
      overridesOf(siteSheet),
      siteSheet,
    ),
  );

  for (const e of equipment) {
    const over = e.moved ? new Set<string>() : overridesOf(e.sheet);
    const cells = e.cells;
    const computedCols = e.cols.columns.length;
    for (let r = 1; r < Math.max(cells.length, e.rows.length + 1); r++) {
      const info = e.rows[r - 1];
      const generated = new Map<number, CellContent>(
        info?.present ? computedCells(e.cols, r, info, cases, lookup) : [],
      );
      for (let c = e.cols.firstComputed; c < computedCols; c++) {
        const v = generated.get(c) ?? null;
        if (over.has(`${r},${c}`) || typedOver(cells[r]?.[c] ?? null, v)) {
          over.add(`${r},${c}`);
          continue;
        }
        if (v !== null || (cells[r]?.[c] ?? null) !== null) put(cells, r, c, v);
      }
      // Every row as wide as the sheet's columns, as a reader of the document expects.
      const line = cells[r];
      if (line) while (line.length < computedCols) line.push(null);
    }
    sheets.push(
      sheetDoc(
        e.cols.sheet.name,
        cells,
        e.cols.columns,
        e.cols.sheet.purpose,
        over,
        e.moved ? undefined : e.sheet,
      ),
    );
  }

  const busesSheet = findSheet(doc, SHEETS.buses);
  const buses = renderBusesSheet({
    s: structure,
    cols: busCols,
    comp: compCols,
    flavour: opts.flavour,
    busRows,
  });
  const busesOver = overridesOf(busesSheet);
  sheets.push(
    sheetDoc(
      SHEETS.buses,
      overlay(busesSheet, buses, busesOver),
      busCols.columns,
      BUSES_PURPOSE,
      busesOver,
      busesSheet,
    ),
  );

  const compSheet = findSheet(doc, SHEETS.compensation);
  const comp = renderCompensationSheet({
    s: structure,
    cols: compCols,
    busCols,
    flavour: opts.flavour,
    busRows,
    inputs: bankInputsOf(compSheet, compCols),
  });
  // Bank inputs are placed by bus; whatever the sheet held in the table before is written anew.
  const compOver = overridesOf(compSheet);
  sheets.push(
    sheetDoc(
      SHEETS.compensation,
      overlay(compSheet, comp, compOver),
      compCols.columns,
      COMPENSATION_PURPOSE,
      compOver,
      compSheet,
    ),
  );

  const quantSheet = findSheet(doc, QUANTITIES_SHEET);
  const quant = renderQuantitiesSheet({
    s: structure,
    comp: compCols,
    hasRates: findSheet(doc, RATES_SHEET) !== undefined,
    hasTariff: findSheet(doc, TARIFF_SHEET) !== undefined,
  });
  const quantOver = overridesOf(quantSheet);
  sheets.push(
    sheetDoc(
      QUANTITIES_SHEET,
      overlay(quantSheet, quant, quantOver),
      QUANT_COLUMNS,
      QUANTITIES_PURPOSE,
      quantOver,
      quantSheet,
    ),
  );

  const rows = equipment.reduce((sum, e) => sum + e.rows.filter((r) => r.present).length, 0);
  const optionsCompact = optionsLeftOut(rows, structure) !== undefined;
  sheets.push(
    optionsSheet(doc, opts, {
      s: structure,
      busCols,
      comp: compCols,
      hasRates: findSheet(doc, RATES_SHEET) !== undefined,
      hasTariff: findSheet(doc, TARIFF_SHEET) !== undefined,
      rows,
    }),
  );

  const builtIn = new Set(sheets.map((s) => s.name.toLowerCase()));
  for (const s of doc.sheets) if (!builtIn.has(s.name.toLowerCase())) sheets.push(s);
  return {
    doc: { format: 'kvar-ledger-workbook', version: 2, title: doc.title, sheets },
    structure,
    busCols,
    compCols,
    optionsCompact,
  };
}

/**
 * The Design options sheet: laid out anew from the inputs typed on it. Cells a user typed over a
 * formula are kept while the layout stays (same buses and cases); the input marks move with
 * their bus. A site above OPTIONS_UNASKED_MAX_ROWS equipment rows keeps the inputs only.
 */
function optionsSheet(
  doc: WorkbookDoc,
  opts: RenderOptions,
  at: Omit<OptionsInput, 'cols' | 'typed' | 'leftOut'> & { readonly rows: number },
): SheetDoc {
  const cols = planOptionColumns(at.s.cases);
  const leftOut = optionsLeftOut(at.rows, at.s);
  // A workbook made or saved before the sheet existed starts with the standard options.
  const own =
    findSheet(doc, OPTIONS_SHEET) ?? (leftOut !== undefined ? undefined : drafted(doc, opts, at.s.cases));
  const { cells, marks } = renderOptionsSheet({
    ...at,
    cols,
    typed: readOptionInputs(own, cols),
    ...(leftOut !== undefined ? { leftOut } : {}),
  });
  const same = own !== undefined && sameLayout(own.cells, cells);
  const over = same ? overridesOf(own) : new Set<string>();
  const out = sheetDoc(
    OPTIONS_SHEET,
    same ? overlay(own, cells, over) : cells,
    cols.columns,
    OPTIONS_PURPOSE,
    over,
  );
  return marks.length > 0 ? { ...out, marks } : out;
}

/**
 * Why the Design options sheet holds inputs only, for a site of `rows` equipment rows: above
 * OPTIONS_UNASKED_MAX_ROWS, or when its blocks would not fit a sheet; undefined when they fit.
 */
export function optionsLeftOut(rows: number, s: WorkbookStructure): string | undefined {
  if (rows <= OPTIONS_UNASKED_MAX_ROWS && optionsExtent(s.buses.length, s.cases.length) <= MAX_SHEET_ROWS)
    return undefined;
  return `The options' figures are not formulas here: with ${rows.toLocaleString('en-GB')} equipment rows (more than ${OPTIONS_UNASKED_MAX_ROWS.toLocaleString('en-GB')}) or ${s.buses.length.toLocaleString('en-GB')} buses they are worked out on request (Checks → Compare design options, or kvar-ledger quote --compare). The inputs below are kept.`;
}

/** The drafted options in compact form, when a drafter is given and drafts any. */
function drafted(doc: WorkbookDoc, opts: RenderOptions, cases: readonly string[]): SheetDoc | undefined {
  const drafts = opts.draftOptions?.(doc) ?? [];
  return drafts.length > 0 ? optionInputsSheet(drafts, cases) : undefined;
}

/** Do two layouts of the Design options sheet put the same lines in the same rows? Labels and bus names decide. */
function sameLayout(
  old: readonly (readonly CellContent[])[],
  now: readonly (readonly CellContent[])[],
): boolean {
  if (old.length !== now.length) return false;
  for (let r = 0; r < now.length; r++)
    for (const c of [0, 1]) {
      const v = now[r]?.[c] ?? null;
      if (typeof v === 'string' && !v.startsWith('=') && v !== (old[r]?.[c] ?? null)) return false;
    }
  return true;
}

function sheetDoc(
  name: string,
  cells: CellContent[][],
  columns: SheetDoc['columns'],
  purpose: string,
  over: ReadonlySet<string>,
  /** The sheet as the document had it: its cell marks and choices stay with it. */
  source?: SheetDoc,
): SheetDoc {
  const overrides: CellAt[] = [...over]
    .map((k) => k.split(',').map(Number) as unknown as CellAt)
    .sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  return {
    name,
    cells,
    ...(columns ? { columns } : {}),
    purpose,
    ...(overrides.length > 0 ? { overrides } : {}),
    ...(source?.choices && source.choices.length > 0 ? { choices: source.choices } : {}),
    ...(source?.marks && source.marks.length > 0 ? { marks: source.marks } : {}),
  };
}

/** Listed generated cells over a sheet's own (the Site sheet: labels, units, notes, limits in use, cautions). */
function overlayCells(
  own: SheetDoc,
  list: ReadonlyArray<readonly [number, number, CellContent]>,
): CellContent[][] {
  const cells = copyRows(own.cells);
  const over = overridesOf(own);
  for (const [r, c, v] of list) if (!over.has(`${r},${c}`)) put(cells, r, c, v);
  return cells;
}

export { compensationInputCols };
