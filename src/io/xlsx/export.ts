// exportWorkbookXlsx: the hand-off file. Every sheet of the workbook with plain formulas and the
// app's cached results, styled (header row, number formats, widths, frozen header), a cover, the
// list of catalogue functions used, and the hidden metadata that lets our import restore it all.
// The xlsx library is loaded on first use only (see loadExcelJs.ts).
import type { Workbook, Worksheet, XlsxWriteOptions } from 'exceljs';
import type { SiteSettings } from '../../core/site/model.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { columnLetters } from '../../core/workbook/refs.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';
import { createEngine, readCell, type CellResult, type OwnPlugin } from '../../engine/index.ts';
import { coverRows, functionRows, FUNCTION_HEADER, type CoverFigureRow } from './exportCover.ts';
import { coverFigures } from './coverFigures.ts';
import {
  exportSheetCells,
  fileError,
  xmlSafe,
  type CellIssue,
  type ExportCell,
  type SheetCells,
} from './exportCells.ts';
import {
  markAssumptions,
  markOverrides,
  markProposals,
  styleCover,
  styleDataSheet,
  styleFunctionsSheet,
} from './exportStyles.ts';
import { heldAssumptions, heldProposals } from '../../core/workbook/cellMarks.ts';
import { loadExcelJs } from './loadExcelJs.ts';
import {
  META_MARKER,
  META_SHEET_NAME,
  META_VERSION,
  metaChunks,
  rowFingerprint,
  type ExportMeta,
  type FingerprintCell,
  type SheetMeta,
} from './metadata.ts';
import { sheetNameProblem, uniqueSheetName } from './sheetNames.ts';
import { OPTIONS_SHEET } from '../../core/workbook/optionsLayout.ts';

export interface XlsxExportOptions {
  /** The site's settings, for the cover (name, frequency, requirement, cases, notes). */
  readonly settings?: SiteSettings;
  /** Date on the cover; default now. */
  readonly date?: Date;
  /** Engine plugins of ours the workbook's formulas need to compute their cached values. */
  readonly plugins?: readonly OwnPlugin[];
  /**
   * Where the cached results come from. Default: an engine built over the document itself.
   * `valueAt`: the caller's own engine (e.g. the app's, already computed; no engine is built).
   * `valuesFrom`: a document of the same layout that computes faster and gives the same values
   * cell by cell (the live flavour of the same site); ignored unless sheet names and row counts match.
   */
  readonly valueAt?: (sheet: string, row: number, col: number) => CellResult | undefined;
  readonly valuesFrom?: WorkbookDoc;
  /** Refuse (throw XlsxExportError) when any formula has to be written as a value. */
  readonly strict?: boolean;
  /** Program name and version on the cover. */
  readonly generator?: string;
  /**
   * Checks' counts of errors and warnings per design, written as values beside the Design
   * options sheet's table: [row, column, value] (core/options findingsCells).
   */
  readonly optionFindings?: ReadonlyArray<readonly [number, number, number]>;
  /** Why the options have no figures or counts in the file, for the cover (e.g. a site too large). */
  readonly optionsLeftOut?: string;
}

export interface XlsxExportReport {
  readonly bytes: Uint8Array;
  /** Cells whose formula could not be written for other programs (their value was written). */
  readonly issues: readonly CellIssue[];
  /** Later functions that were stored with the `_xlfn.` prefix. */
  readonly newerFunctions: readonly string[];
  readonly catalogueFunctions: readonly string[];
}

export class XlsxExportError extends Error {
  constructor(
    message: string,
    readonly issues: readonly CellIssue[] = [],
  ) {
    super(message);
    this.name = 'XlsxExportError';
  }
}

export const COVER_SHEET_NAME = 'Cover';
export const FUNCTIONS_SHEET_NAME = 'Functions used';
export const DEFAULT_GENERATOR = 'Kvar Ledger 0.1.0';
/** Cells written as values that the cover lists one by one. */
export const MAX_COVER_ISSUES = 20;

function checkNames(doc: WorkbookDoc): void {
  const seen = new Set<string>();
  for (const s of doc.sheets) {
    const p = sheetNameProblem(s.name);
    if (p) throw new XlsxExportError(`cannot export: ${p}; rename the sheet and export again`);
    if (seen.has(s.name.toLowerCase()))
      throw new XlsxExportError(
        `cannot export: two sheets are named "${s.name}" (names must differ, ignoring case)`,
      );
    seen.add(s.name.toLowerCase());
  }
  if (doc.sheets.length === 0) throw new XlsxExportError('cannot export: the workbook has no sheets');
}

const BLANK: CellResult = { ok: true, value: null };

/** The site settings of a workbook made by the builder (as the app reads them), for the cover. */
function settingsOf(doc: WorkbookDoc): SiteSettings | undefined {
  const sheets = doc.sheets.filter((s) => s.name === SHEETS.settings);
  if (sheets.length === 0) return undefined;
  try {
    // The settings sheet alone: reading every equipment row only to drop it took a second on big sites.
    return siteFromWorkbook({ ...doc, sheets }).site.settings;
  } catch {
    return undefined;
  }
}

/** A1 address of a 0-based cell. */
const a1Of = (r: number, c: number): string => `${columnLetters(c)}${r + 1}`;

const isFormula = (c: unknown): boolean => typeof c === 'string' && c.startsWith('=');

/**
 * Can `source` stand in for `doc`? Same sheets in order and every typed value identical; where
 * `doc` has a formula the source may compute the value otherwise (e.g. one roll-up filling a
 * block of cells), and it may have more rows below.
 */
export function alignedWith(doc: WorkbookDoc, source: WorkbookDoc): boolean {
  if (doc.sheets.length !== source.sheets.length) return false;
  return doc.sheets.every((s, i) => {
    const t = source.sheets[i];
    if (!t || t.name !== s.name) return false;
    return s.cells.every((row, r) =>
      row.every((c, col) => {
        const u = t.cells[r]?.[col] ?? null;
        return isFormula(c) || c === u || ((c === null || c === '') && (u === null || u === ''));
      }),
    );
  });
}

/** Run `use` with a reader of cached results, building (and then freeing) an engine if needed. */
function withValues<T>(
  doc: WorkbookDoc,
  opts: XlsxExportOptions,
  use: (valueAt: (sheet: string, row: number, col: number) => CellResult | undefined) => T,
): T {
  if (opts.valueAt) return use(opts.valueAt);
  const source = opts.valuesFrom && alignedWith(doc, opts.valuesFrom) ? opts.valuesFrom : doc;
  const hf = createEngine(source.sheets, opts.plugins ? { plugins: opts.plugins } : {});
  try {
    return use((sheet, row, col) => readCell(hf, sheet, row, col));
  } finally {
    hf.destroy();
  }
}

type ExcelValue =
  | number
  | string
  | boolean
  | null
  | { formula: string; result?: number | string | boolean | { error: string } }
  | { error: string };

function excelValue(c: ExportCell | undefined): ExcelValue {
  if (!c || c.kind === 'empty') return null;
  if (c.kind === 'value') return c.value;
  if (c.kind === 'error') return { error: c.error };
  const r = c.result;
  if (!r.ok) return { formula: c.formula, result: { error: fileError(r.error) } };
  if (r.value === null) return { formula: c.formula };
  return { formula: c.formula, result: typeof r.value === 'string' ? xmlSafe(r.value) : r.value };
}

function fingerprintCells(row: readonly ExportCell[]): FingerprintCell[] {
  const out: FingerprintCell[] = [];
  row.forEach((c, col) => {
    if (c.kind === 'formula') out.push({ col, normalised: c.normalised });
    else if (c.kind === 'value') out.push({ col, value: c.value });
    else if (c.kind === 'error') out.push({ col, error: c.error });
  });
  return out;
}

function writeDataSheet(ws: Worksheet, cells: SheetCells): string[] {
  const fingerprints: string[] = [];
  for (const row of cells.rows) {
    ws.addRow(row.map(excelValue));
    fingerprints.push(rowFingerprint(fingerprintCells(row)));
  }
  return fingerprints;
}

function writeMeta(wb: Workbook, meta: ExportMeta): void {
  const ws = wb.addWorksheet(META_SHEET_NAME, { state: 'veryHidden' });
  const chunks = metaChunks(meta);
  ws.addRow([META_MARKER, chunks.length]);
  for (const c of chunks) ws.addRow([c]);
}

/** Export with a report of what could not be written as a live formula. */
export async function exportWorkbookXlsxWithReport(
  doc: WorkbookDoc,
  opts: XlsxExportOptions = {},
): Promise<XlsxExportReport> {
  checkNames(doc);
  const figures = coverFigures(doc);
  let figureRows: CoverFigureRow[] = [];
  const converted = withValues(doc, opts, (valueAt) => {
    // The cover's figures cache the value of the cell they refer to, as the sheets do.
    figureRows = figures.map((f) => {
      const v = valueAt(f.sheet, f.row, f.col) ?? BLANK;
      return {
        label: f.label,
        formula: f.formula,
        format: f.format,
        result: v.ok ? v.value : { error: fileError(v.error) },
      };
    });
    return doc.sheets.map((s) => exportSheetCells((r, c) => valueAt(s.name, r, c) ?? BLANK, s));
  });
  const issues = converted.flatMap((c) => c.issues);
  if (opts.strict && issues.length > 0) {
    throw new XlsxExportError(
      `cannot export: ${issues.length} formula(s) cannot be written for other programs; first: ${issues[0]?.where}: ${issues[0]?.message}`,
      issues,
    );
  }
  const catalogue = new Set(converted.flatMap((c) => [...c.catalogue]));
  const newer = [...new Set(converted.flatMap((c) => [...c.newer]))].sort();

  const taken = doc.sheets.map((s) => s.name);
  const coverName = uniqueSheetName(COVER_SHEET_NAME, taken);
  const functionsName = uniqueSheetName(FUNCTIONS_SHEET_NAME, [...taken, coverName]);
  const optionsAt = doc.sheets.findIndex((s) => s.name === OPTIONS_SHEET);
  const findings = optionsAt >= 0 ? (opts.optionFindings ?? []) : [];
  const optionRows = (converted[optionsAt] as SheetCells | undefined)?.rows;
  for (const [r, c, value] of findings) {
    const line = optionRows?.[r];
    if (!line) continue;
    while (line.length <= c) line.push({ kind: 'empty' });
    line[c] = { kind: 'value', value };
  }
  const typedOver = doc.sheets.flatMap((s) => (s.overrides ?? []).map(([r, c]) => `${s.name}!${a1Of(r, c)}`));
  const assumed = doc.sheets.flatMap((s) => heldAssumptions(s).map((m) => `${s.name}!${a1Of(m.row, m.col)}`));
  const proposed = doc.sheets.flatMap((s) => heldProposals(s).map((m) => `${s.name}!${a1Of(m.row, m.col)}`));
  const notes = [
    ...(assumed.length > 0
      ? [
          `${assumed.length} value(s) are typical values assumed for blanks at tender stage (marked, with their source in a note): ${assumed.slice(0, MAX_COVER_ISSUES).join(', ')}${assumed.length > MAX_COVER_ISSUES ? ' …' : ''}. Replace them with nameplate or maker's data.`,
        ]
      : []),
    ...(proposed.length > 0
      ? [
          `${proposed.length} value(s) are bank sizes the design proposed (a Compensation row with only a detuning typed, or a design option's bank; marked, with a note): ${proposed.slice(0, MAX_COVER_ISSUES).join(', ')}${proposed.length > MAX_COVER_ISSUES ? ' …' : ''}. Check them or type your own.`,
        ]
      : []),
    ...(typedOver.length > 0
      ? [
          `${typedOver.length} cell(s) hold a value typed over Kvar Ledger's formula and count as typed (marked, with a note): ${typedOver.slice(0, MAX_COVER_ISSUES).join(', ')}${typedOver.length > MAX_COVER_ISSUES ? ' …' : ''}.`,
        ]
      : []),
    ...(newer.length > 0
      ? [
          `Uses functions newer than the 2007 file format (${newer.join(', ')}); they need a recent spreadsheet program.`,
        ]
      : []),
    ...(optionsAt >= 0
      ? [
          `Design options side by side as live formulas: sheet ${OPTIONS_SHEET}${findings.length > 0 ? '; the errors and warnings beside its table were counted by Checks at export (values)' : ''}.`,
        ]
      : []),
    ...(opts.optionsLeftOut ? [opts.optionsLeftOut] : []),
    ...issues.slice(0, MAX_COVER_ISSUES).map((i) => `${i.where}: ${i.message}.`),
    ...(issues.length > MAX_COVER_ISSUES
      ? [`… and ${issues.length - MAX_COVER_ISSUES} more cells written as values.`]
      : []),
  ];

  const ExcelJS = await loadExcelJs();
  const wb = new ExcelJS.Workbook();
  wb.creator = opts.generator ?? DEFAULT_GENERATOR;
  wb.title = xmlSafe(doc.title);
  wb.calcProperties.fullCalcOnLoad = true;

  const cover = wb.addWorksheet(coverName);
  const date = opts.date ?? new Date();
  const settings = opts.settings ?? settingsOf(doc);
  styleCover(
    cover,
    coverRows({
      doc,
      date,
      generator: opts.generator ?? DEFAULT_GENERATOR,
      notes,
      functionsSheet: functionsName,
      figures: figureRows,
      ...(settings ? { settings } : {}),
    }),
  );

  const sheetsMeta: SheetMeta[] = [];
  doc.sheets.forEach((s, i) => {
    const ws = wb.addWorksheet(s.name);
    const cells = converted[i] as SheetCells;
    styleDataSheet(ws, s);
    sheetsMeta.push({ doc: s.name, file: s.name, rows: writeDataSheet(ws, cells) });
    styleDataSheet(ws, s, { headerOnly: true });
    markOverrides(ws, s);
    markAssumptions(ws, s);
    markProposals(ws, s);
  });

  styleFunctionsSheet(wb.addWorksheet(functionsName), [...FUNCTION_HEADER], functionRows(catalogue));
  writeMeta(wb, {
    format: META_MARKER,
    version: META_VERSION,
    doc,
    sheets: sheetsMeta,
    generated: [coverName, functionsName],
  });

  // Fastest deflate level: the file grows by about a third, the export is much quicker.
  const buffer = await wb.xlsx.writeBuffer({
    zip: { compression: 'DEFLATE', compressionOptions: { level: 1 } },
  } as XlsxWriteOptions);
  return {
    bytes: new Uint8Array(buffer as ArrayBuffer),
    issues,
    newerFunctions: newer,
    catalogueFunctions: [...catalogue],
  };
}

/** The hand-off xlsx as bytes. */
export async function exportWorkbookXlsx(
  doc: WorkbookDoc,
  opts: XlsxExportOptions = {},
): Promise<Uint8Array> {
  return (await exportWorkbookXlsxWithReport(doc, opts)).bytes;
}
