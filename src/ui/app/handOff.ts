// The xlsx hand-off of the open workbook (loaded on demand with the xlsx library). A site
// workbook goes out as render.ts writes it in its portable flavour: the same sheets, inputs,
// notes, typed-over cells and the user's own sheets as on screen, with the bus sums as classic
// SUMIF/SUMIFS that every program reads. Only those sums differ from the page, and they compute
// the same values, so the page's engine supplies every cached value.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import type { SiteSettings } from '../../core/site/model.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { isSiteDoc, renderWorkbook } from '../../core/workbook/render.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';
import { exportWorkbookXlsxWithReport, importKvarXlsx, describeProblem } from '../../io/xlsx/index.ts';
import type { CellResult } from '../../engine/index.ts';

export interface HandOffDoc {
  readonly doc: WorkbookDoc;
  readonly settings?: SiteSettings;
}

/** The document to export: a site workbook in its portable flavour, any other workbook as it is. */
export function handOffDoc(doc: WorkbookDoc): HandOffDoc {
  if (!isSiteDoc(doc)) return { doc };
  const portable = renderWorkbook(doc, { flavour: 'portable' }).doc;
  const site = portable.sheets.filter((s) => s.name === SHEETS.settings);
  return { doc: portable, settings: siteFromWorkbook({ ...portable, sheets: site }).site.settings };
}

/** Cached results as the app's engine holds them (value or error with its message). */
export type ResultReader = (sheet: string, row: number, col: number) => CellResult | undefined;

/**
 * Export the open workbook. `resultAt` reads the page's engine, which holds the same workbook in
 * its live flavour (same cells, the bus sums computed by BUS.SUM), so no second engine is built.
 */
export async function handOff(
  doc: WorkbookDoc,
  resultAt?: ResultReader,
): Promise<{ bytes: Uint8Array; issues: number; overrides: number }> {
  const out = handOffDoc(doc);
  // The design options, worked out from the live workbook (its code loads with the export).
  const options = isSiteDoc(doc) ? (await import('../../core/options/index.ts')).optionsForExport(doc) : {};
  const r = await exportWorkbookXlsxWithReport(out.doc, {
    ...options,
    ...(out.settings ? { settings: out.settings } : {}),
    ...(resultAt ? { valueAt: resultAt } : {}),
  });
  const overrides = out.doc.sheets.reduce((n, s) => n + (s.overrides?.length ?? 0), 0);
  return { bytes: r.bytes, issues: r.issues.length, overrides };
}

/** Open an xlsx (our own export comes back with its catalogue formulas). */
export async function openXlsx(
  bytes: Uint8Array,
): Promise<{ ok: true; doc: WorkbookDoc; notes: readonly string[] } | { ok: false; message: string }> {
  const r = await importKvarXlsx(bytes);
  return r.ok ? { ok: true, doc: r.doc, notes: r.notes } : { ok: false, message: describeProblem(r.problem) };
}
