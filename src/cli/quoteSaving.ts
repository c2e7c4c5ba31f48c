// The saving part of `kvar-ledger quote`: the tariff from the workbook's Tariff sheet (a site
// file or a list: the invented demo tariff, said so), P and Q at the point of connection before
// and after compensation from the one rule (compensate.ts), and src/core/quote/saving.ts.
import type { BankChoice } from '../core/site/bankChoice.ts';
import { compensate } from '../core/site/compensate.ts';
import type { Site } from '../core/site/model.ts';
import type { CellContent } from '../core/workbook/document.ts';
import {
  annualSaving,
  readTariff,
  tariffSheetDoc,
  type Saving,
  type TariffProblem,
} from '../core/quote/index.ts';

export type TariffFrom = 'workbook' | 'none' | 'demo';
export const TARIFF_TEXT: Record<TariffFrom, string> = {
  workbook: "tariff from the workbook's Tariff sheet",
  none: 'no saving: the workbook has no Tariff sheet',
  demo: 'INVENTED demo tariff (the file holds no Tariff sheet): not your utility’s charge',
};

export interface SavingResult {
  readonly from: TariffFrom;
  readonly saving: Saving | null;
  readonly problems: readonly TariffProblem[];
}

/** The saving for the site and banks; `rows`: the Tariff sheet's, undefined when the file has none. */
export function quoteSaving(
  site: Site,
  banks: readonly BankChoice[],
  rows: readonly (readonly CellContent[])[] | undefined,
  isWorkbook: boolean,
  total: number | null,
): SavingResult {
  if (rows === undefined && isWorkbook) return { from: 'none', saving: null, problems: [] };
  const from: TariffFrom = rows === undefined ? 'demo' : 'workbook';
  const cases = site.settings.cases;
  const { tariff, problems } = readTariff(rows ?? tariffSheetDoc(cases).cells, cases);
  const flows = compensate(site, banks).map((c) => ({
    case: c.case,
    p_kw: c.before.root.p_kw,
    q_kvar: c.before.root.q_kvar,
    p_after_kw: c.after.root.p_kw,
    q_after_kvar: c.after.root.q_kvar,
  }));
  return { from, saving: annualSaving(flows, tariff, total), problems };
}

const money = (x: number) =>
  x.toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });

/** The saving as lines of text, after the totals. */
export function savingText(r: SavingResult, currency: string): string {
  const out = [`\nwhat it saves per year; ${TARIFF_TEXT[r.from]}\n`];
  const s = r.saving;
  if (s !== null) {
    for (const c of s.cases)
      out.push(
        `  ${c.case}: ${c.hours} h, ${Math.round(c.kvarh_before)} kvarh charged before, ${Math.round(c.kvarh_after)} after, ${Math.round(c.loss_kwh_saved)} kWh of losses saved\n`,
      );
    out.push(`  reactive charge before  ${money(s.charge_before)} ${currency}\n`);
    out.push(`  reactive charge after   ${money(s.charge_after)} ${currency}\n`);
    out.push(`  losses saved            ${money(s.losses_saved)} ${currency}\n`);
    out.push(`  annual saving           ${money(s.annual_saving)} ${currency}\n`);
    out.push(
      `  simple payback          ${s.payback_years === null ? 'none (no priced total or no saving)' : `${s.payback_years.toFixed(2)} years`}\n`,
    );
  }
  for (const p of r.problems) out.push(`tariff: ${p.message}\n`);
  return out.join('');
}
