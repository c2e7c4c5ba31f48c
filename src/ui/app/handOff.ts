// The xlsx hand-off of the open workbook (loaded on demand with the xlsx library). A workbook
// made by the builder is rebuilt in its portable flavour (classic SUMIF instead of the app's fast
// roll-up) from the inputs as typed, with the banks chosen, so other programs can recompute every
// bus; sheets the user added travel unchanged.
import type { CellContent, WorkbookDoc } from '../../core/workbook/document.ts';
import type { SiteSettings } from '../../core/site/model.ts';
import { buildWorkbook } from '../../core/workbook/build.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';
import { alignedWith, exportWorkbookXlsxWithReport } from '../../io/xlsx/export.ts';
import type { CellResult } from '../../engine/index.ts';
import { importKvarXlsx } from '../../io/xlsx/importKvar.ts';
import { describeProblem } from '../../io/xlsx/fileProblem.ts';

export type ValueReader = (sheet: string, row: number, col: number) => CellContent | undefined;

export interface HandOffDoc {
  readonly doc: WorkbookDoc;
  readonly settings?: SiteSettings;
  /** Why the workbook went out as it is (not rebuilt), if so. */
  readonly note?: string;
  /** Builds the live flavour from the same inputs (when rebuilt); only the export from the page needs it. */
  readonly liveTwin?: () => WorkbookDoc;
}

/** The document to export: the portable rebuild for a builder workbook, else the workbook itself. */
export function handOffDoc(doc: WorkbookDoc, valueAt?: ValueReader): HandOffDoc {
  const hasBuses = doc.sheets.some((s) => s.name === SHEETS.buses);
  if (!hasBuses) return { doc };
  const read = siteFromWorkbook(doc, valueAt ? { valueAt } : {});
  const errors = read.problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) {
    return {
      doc,
      settings: read.site.settings,
      note: `the inputs could not all be read (${errors[0]?.message}${errors.length > 1 ? `, and ${errors.length - 1} more` : ''}), so bus totals go out as values`,
    };
  }
  const portable = buildWorkbook(read.site, { flavour: 'portable', banks: read.banks });
  const extra = doc.sheets.filter(
    (s) => !portable.sheets.some((p) => p.name.toLowerCase() === s.name.toLowerCase()),
  );
  const liveTwin = () => buildWorkbook(read.site, { flavour: 'live', banks: read.banks });
  return {
    doc: { ...portable, title: doc.title, sheets: [...portable.sheets, ...extra] },
    settings: read.site.settings,
    liveTwin,
  };
}

/**
 * The open engine's results serve the export only when the open workbook is, cell for cell, what
 * the builder makes from its inputs (formulas included): then live and portable agree cell by
 * cell. A row added or a formula typed over in the grid sends the export the slow, safe way.
 */
function engineMatches(out: HandOffDoc, doc: WorkbookDoc): boolean {
  if (!out.liveTwin || !alignedWith(out.doc, doc)) return false;
  return out.liveTwin().sheets.every((t) => {
    const s = doc.sheets.find((d) => d.name === t.name);
    return (
      s !== undefined &&
      s.cells.length === t.cells.length &&
      t.cells.every((row, r) => row.every((c, k) => (s.cells[r]?.[k] ?? null) === c))
    );
  });
}

/** Cached results as the app's engine holds them (value or error with its message). */
export type ResultReader = (sheet: string, row: number, col: number) => CellResult | undefined;

/**
 * Export the open workbook. When the rebuilt document has the open one's layout (the usual case:
 * the builder made both), the cached results come straight from the app's engine, already
 * computed; otherwise the exporter computes them itself (slower on large sites).
 */
export async function handOff(
  doc: WorkbookDoc,
  valueAt?: ValueReader,
  resultAt?: ResultReader,
): Promise<{ bytes: Uint8Array; issues: number; note?: string }> {
  const out = handOffDoc(doc, valueAt);
  const cached = resultAt && engineMatches(out, doc) ? { valueAt: resultAt } : {};
  const r = await exportWorkbookXlsxWithReport(out.doc, {
    ...(out.settings ? { settings: out.settings } : {}),
    ...cached,
  });
  return { bytes: r.bytes, issues: r.issues.length, ...(out.note ? { note: out.note } : {}) };
}

/** Open an xlsx (our own export comes back with its catalogue formulas). */
export async function openXlsx(
  bytes: Uint8Array,
): Promise<{ ok: true; doc: WorkbookDoc; notes: readonly string[] } | { ok: false; message: string }> {
  const r = await importKvarXlsx(bytes);
  return r.ok ? { ok: true, doc: r.doc, notes: r.notes } : { ok: false, message: describeProblem(r.problem) };
}
