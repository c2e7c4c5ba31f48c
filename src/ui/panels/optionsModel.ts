// The design options of the open workbook (src/core/quote/options.ts): its site and banks read
// back as the CLI reads them, priced at its Rates sheet and saved at its Tariff sheet.
import { rateRowsOf, readRateTable, readTariff, tariffRowsOf } from '../../core/quote/index.ts';
import { compareOptions, standardOptions, type OptionFigures } from '../../core/quote/options.ts';
import { validateSite } from '../../core/site/validate.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';

/** `rows`: the site's equipment rows (the panel redoes large sites on request only). */
export type OptionsReport = { readonly rows: number } & (
  | { readonly ok: true; readonly options: readonly OptionFigures[] }
  | { readonly ok: false; readonly message: string }
);

export function optionsOfDoc(doc: WorkbookDoc): OptionsReport {
  const read = siteFromWorkbook(doc);
  const rows = read.site.equipment.length;
  // The inputs as Checks judges them: read back, then validated.
  const errors = [...read.problems, ...validateSite(read.site)].filter((p) => p.severity === 'error').length;
  if (errors > 0)
    return {
      rows,
      ok: false,
      message: `No options while the inputs have ${errors} error(s): correct the errors listed above first.`,
    };
  if (read.site.equipment.length === 0)
    return { rows, ok: false, message: 'No options: no equipment in this workbook yet.' };
  const cases = read.site.settings.cases;
  const rates = readRateTable(rateRowsOf(doc) ?? []).table;
  const tariff = readTariff(tariffRowsOf(doc) ?? [], cases).tariff;
  try {
    return {
      rows,
      ok: true,
      options: compareOptions(read.site, standardOptions(read.site, read.banks), rates, tariff),
    };
  } catch (e) {
    // A site that does not roll up (a loop, losses that run away) says why, as Checks does.
    return { rows, ok: false, message: `No options: ${e instanceof Error ? e.message : String(e)}` };
  }
}
