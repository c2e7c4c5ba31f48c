// The design options of a workbook (compare.ts): its site, its banks and the options typed on its
// Design options sheet read back as the CLI reads them, priced at its Rates sheet and saved at its
// Tariff sheet. The Checks panel shows them; the export writes Checks' counts beside the sheet's table.
// Straight from the quote's modules, not its index: see the architecture test (first download).
import { readRateTable } from '../quote/rates.ts';
import { rateRowsOf } from '../quote/ratesSheet.ts';
import { readTariff, tariffRowsOf } from '../quote/tariffSheet.ts';
import {
  BLOCK_IDS,
  weighOptions,
  isUnread,
  draftOptions,
  givenOption,
  sheetOptions,
  standardOptions,
  type OptionOutcome,
  type OptionSpec,
} from './compare.ts';
import { GIVEN_ROW, OPTIONS_SHEET, TABLE, tableRow } from '../workbook/optionsLayout.ts';
import { validateSite } from '../site/validate.ts';
import type { WorkbookDoc } from '../workbook/document.ts';
import { siteFromWorkbook, type SiteFromWorkbook } from '../workbook/readSite.ts';
import { OPTIONS_UNASKED_MAX_ROWS } from '../site/limits.ts';

export { OPTIONS_UNASKED_MAX_ROWS };

/** `unasked`: the site is small enough for the options to be worked out without being asked. */
export type OptionsReport = { readonly unasked: boolean } & (
  | { readonly ok: true; readonly options: readonly OptionOutcome[] }
  | { readonly ok: false; readonly message: string }
);

export function optionsOfDoc(doc: WorkbookDoc): OptionsReport {
  return optionsOfRead(doc, siteFromWorkbook(doc));
}

/**
 * The designs a workbook compares: the banks it holds, then the options typed on its Design
 * options sheet; a workbook without that sheet (saved before it) gets the standard options.
 */
export function workbookOptions(doc: WorkbookDoc, read: SiteFromWorkbook): OptionSpec[] {
  const sheet = doc.sheets.find((s) => s.name === OPTIONS_SHEET);
  if (!sheet) return standardOptions(read.site, read.banks);
  return [givenOption(read.banks), ...sheetOptions(sheet, read.site.settings.cases)];
}

/**
 * The standard options for a workbook that has no Design options sheet yet (render.ts
 * draftOptions): none while its inputs have errors or above OPTIONS_UNASKED_MAX_ROWS rows.
 */
export function draftOptionsOfDoc(doc: WorkbookDoc): OptionSpec[] {
  const read = siteFromWorkbook(doc);
  if ([...read.problems, ...validateSite(read.site)].some((p) => p.severity === 'error')) return [];
  return draftOptions(read.site);
}

/** The options of a workbook already read back (the export reads it once for both questions). */
function optionsOfRead(doc: WorkbookDoc, read: SiteFromWorkbook): OptionsReport {
  const unasked = read.site.equipment.length <= OPTIONS_UNASKED_MAX_ROWS;
  // The inputs as Checks judges them: read back, then validated.
  const errors = [...read.problems, ...validateSite(read.site)].filter((p) => p.severity === 'error').length;
  if (errors > 0)
    return {
      unasked,
      ok: false,
      message: `No options while the inputs have ${errors} error(s): correct the errors listed above first.`,
    };
  if (read.site.equipment.length === 0)
    return { unasked, ok: false, message: 'No options: no equipment in this workbook yet.' };
  const cases = read.site.settings.cases;
  const rates = readRateTable(rateRowsOf(doc) ?? []).table;
  const tariff = readTariff(tariffRowsOf(doc) ?? [], cases).tariff;
  try {
    return {
      unasked,
      ok: true,
      options: weighOptions(read.site, workbookOptions(doc, read), rates, tariff),
    };
  } catch (e) {
    // A site that does not roll up (a loop, losses that run away) says why, as Checks does.
    return { unasked, ok: false, message: `No options: ${e instanceof Error ? e.message : String(e)}` };
  }
}

/**
 * What the export adds to the Design options sheet: Checks' counts beside its table, or a line
 * for the cover saying why there are none.
 */
export function optionsForExport(doc: WorkbookDoc): {
  optionFindings?: ReadonlyArray<readonly [number, number, number]>;
  optionsLeftOut?: string;
} {
  const read = siteFromWorkbook(doc);
  const rows = read.site.equipment.length;
  if (rows > OPTIONS_UNASKED_MAX_ROWS)
    return {
      optionsLeftOut: `Design options: the sheet ${OPTIONS_SHEET} holds the options' inputs only, no figures: with ${rows.toLocaleString('en-GB')} equipment rows (more than ${OPTIONS_UNASKED_MAX_ROWS.toLocaleString('en-GB')}) they are worked out on request only (Checks → Compare design options, or kvar-ledger quote --compare).`,
    };
  const r = optionsOfRead(doc, read);
  return r.ok
    ? { optionFindings: findingsCells(r.options) }
    : {
        optionsLeftOut: `Design options: no counts of Checks' findings beside the table of ${OPTIONS_SHEET}. ${r.message}`,
      };
}

/**
 * Checks' counts of errors and warnings per design, as values for the Design options sheet's
 * table: [row, column, value]. Spreadsheet maths cannot give them; the sheet says when they were counted.
 */
export function findingsCells(options: readonly OptionOutcome[]): Array<readonly [number, number, number]> {
  return options.flatMap((o) => {
    // An option not worked out has no findings to count: its cells stay blank.
    if (isUnread(o)) return [];
    const block = (BLOCK_IDS as readonly string[]).indexOf(o.id);
    const row = o.id === 'current' ? GIVEN_ROW : block < 0 ? undefined : tableRow(block);
    if (row === undefined) return [];
    return [[row, TABLE.errors.col, o.errors] as const, [row, TABLE.warnings.col, o.warnings] as const];
  });
}
