// buildWorkbook: a site becomes a workbook of live formulas. Sheets, in order: Site (settings),
// one sheet per equipment class, Buses, Compensation. The site's values are placed as a user
// would type them (inputsFromSite.ts) and every computed cell is written by render.ts: formulas
// of catalogue and classic functions that refer to the inputs by cell.
import type { BankChoice } from '../site/bankChoice.ts';
import { proposeChoices } from '../site/compensation.ts';
import type { Site } from '../site/model.ts';
import type { AssumedInput } from '../site/typical/fillSite.ts';
import type { WorkbookDoc } from './document.ts';
import { draftOptions } from '../site/designOptions.ts';
import type { OptionDraft } from './optionInputs.ts';
import { inputsFromSite } from './inputsFromSite.ts';
import { renderWorkbook } from './render.ts';
import type { Flavour } from './busSums.ts';

export type { Flavour } from './busSums.ts';
export type { BankChoice } from '../site/bankChoice.ts';

export interface BuildOptions {
  /**
   * 'live': bus totals by the engine's BUS.SUM functions (the page). 'portable': only catalogue
   * and classic functions (SUMIF/SUMIFS), for the xlsx export.
   */
  readonly flavour: Flavour;
  /** Banks on the Compensation sheet. Default: the compensation design's proposal for the site. */
  readonly banks?: readonly BankChoice[];
  /** Typical values the site's rows took for blanks: marked as assumed in their cells. */
  readonly assumed?: readonly AssumedInput[];
  /** The Design options sheet's options. Default: the standard options drafted by the design. */
  readonly options?: readonly OptionDraft[];
}

export function buildWorkbook(site: Site, opts: BuildOptions): WorkbookDoc {
  const banks = opts.banks ?? proposeChoices(site);
  const options = opts.options ?? draftOptions(site);
  return renderWorkbook(inputsFromSite(site, banks, opts.assumed, options), { flavour: opts.flavour }).doc;
}
