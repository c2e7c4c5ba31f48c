// The design options of a workbook (compare.ts): its site and banks read back as the CLI reads
// them, priced at its Rates sheet and saved at its Tariff sheet. The Checks panel shows them and
// the export writes them on a sheet of their own.
// Straight from the quote's modules, not its index: see the architecture test (first download).
import { readRateTable } from '../quote/rates.ts';
import { rateRowsOf } from '../quote/ratesSheet.ts';
import { readTariff, tariffRowsOf } from '../quote/tariffSheet.ts';
import { compareOptions, standardOptions, type OptionFigures } from './compare.ts';
import { validateSite } from '../site/validate.ts';
import type { WorkbookDoc } from '../workbook/document.ts';
import { siteFromWorkbook, type SiteFromWorkbook } from '../workbook/readSite.ts';

/**
 * Above this many equipment rows the options are worked out only when asked for: five designs
 * take seconds there (about 10 s at 10,000 rows on the bench machine). The Checks panel then
 * redoes them on request, and the export leaves them out and says so.
 */
export const OPTIONS_UNASKED_MAX_ROWS = 2_000;

/** `unasked`: the site is small enough for the options to be worked out without being asked. */
export type OptionsReport = { readonly unasked: boolean } & (
  | { readonly ok: true; readonly options: readonly OptionFigures[] }
  | { readonly ok: false; readonly message: string }
);

export function optionsOfDoc(doc: WorkbookDoc): OptionsReport {
  return optionsOfRead(doc, siteFromWorkbook(doc));
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
      options: compareOptions(read.site, standardOptions(read.site, read.banks), rates, tariff),
    };
  } catch (e) {
    // A site that does not roll up (a loop, losses that run away) says why, as Checks does.
    return { unasked, ok: false, message: `No options: ${e instanceof Error ? e.message : String(e)}` };
  }
}

/** What the export writes of the options: the options, or a line for the cover saying why not. */
export function optionsForExport(doc: WorkbookDoc): {
  options?: readonly OptionFigures[];
  optionsLeftOut?: string;
} {
  const read = siteFromWorkbook(doc);
  const rows = read.site.equipment.length;
  if (rows > OPTIONS_UNASKED_MAX_ROWS)
    return {
      optionsLeftOut: `Design options are not in this file: with ${rows.toLocaleString('en-GB')} equipment rows (more than ${OPTIONS_UNASKED_MAX_ROWS.toLocaleString('en-GB')}) they are worked out on request only (Checks → Compare design options, or kvar-ledger quote --compare).`,
    };
  const r = optionsOfRead(doc, read);
  return r.ok
    ? { options: r.options }
    : { optionsLeftOut: `Design options are not in this file. ${r.message}` };
}
