// `kvar-ledger quote --compare`: the design options side by side (src/core/options), priced at
// the same rates and judged by the same rules as the quote itself: a workbook's own option blocks
// (its Design options sheet), else the standard options.
import {
  givenOption,
  isUnread,
  sheetOptions,
  standardOptions,
  weighOptions,
  type OptionFigures,
  type OptionOutcome,
} from '../core/options/index.ts';
import { readTariff, tariffSheetDoc, type RateTable } from '../core/quote/index.ts';
import type { BankChoice } from '../core/site/bankChoice.ts';
import type { Site } from '../core/site/model.ts';
import type { CellContent, SheetDoc } from '../core/workbook/document.ts';

/**
 * The options for the site, with the tariff the quote's saving uses (none: no charge, no saving):
 * the banks held, then the workbook's option blocks when `optionSheet` is given.
 */
export function siteOptions(
  site: Site,
  held: readonly BankChoice[] | undefined,
  rates: RateTable,
  tariffRows: readonly (readonly CellContent[])[] | undefined,
  hasNoTariff: boolean,
  optionSheet?: SheetDoc,
): OptionOutcome[] {
  const cases = site.settings.cases;
  const rows = hasNoTariff ? [] : (tariffRows ?? tariffSheetDoc(cases).cells);
  const specs = optionSheet
    ? [...(held ? [givenOption(held)] : []), ...sheetOptions(optionSheet, cases)]
    : standardOptions(site, held);
  return weighOptions(site, specs, rates, readTariff(rows, cases).tariff);
}

const money = (x: number | null) =>
  x === null ? 'unpriced' : x.toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const kvar = (x: number) => `${Math.round(x).toLocaleString('en-GB')} kvar`;

function row(o: OptionOutcome): string[] {
  if (isUnread(o)) return [o.name, 'not worked out: see below', '', '', '', '', '', ''];
  const f: OptionFigures = o;
  return [
    f.name,
    kvar(f.capacitor_kvar),
    kvar(f.reactor_kvar),
    money(f.total),
    money(f.annual_saving),
    f.payback_years === null ? '–' : `${f.payback_years.toFixed(2)} y`,
    f.meets_every_case ? 'met' : 'missed',
    `${f.errors} / ${f.warnings}`,
  ];
}

/** The options as a table, then what each one is; `table` lays out rows as the quote does. */
export function optionsText(
  figures: readonly OptionOutcome[],
  table: (header: string[], rows: string[][], leftCols: number) => string,
): string {
  if (figures.length === 0) return '\nno design options: the site does not roll up\n';
  const currency = figures.find((f): f is OptionFigures => !isUnread(f))?.currency ?? '';
  const header = [
    'option',
    'capacitors',
    'reactors',
    `total ${currency}`,
    'saving / year',
    'payback',
    'requirement',
    'errors / warnings',
  ];
  const out = ['\ndesign options side by side (same rates, tariff and rules)\n'];
  out.push(table(header, figures.map(row), 1));
  for (const f of figures) {
    if (isUnread(f)) {
      out.push(`  ${f.name}: not worked out until its inputs are mended: ${f.unread.join('; ')}\n`);
      continue;
    }
    out.push(`  ${f.name}: ${f.summary}${f.sameAs ? `; the same banks as "${f.sameAs}"` : ''}\n`);
  }
  out.push('  errors / warnings: the findings Checks lists for the option once its banks are typed in\n');
  return out.join('');
}

/** The options for --json. */
export function optionsJson(figures: readonly OptionOutcome[]) {
  return figures.map((f) =>
    isUnread(f)
      ? { id: f.id, name: f.name, summary: f.summary, banks: f.banks, unread: f.unread }
      : figuresJson(f),
  );
}

function figuresJson(f: OptionFigures) {
  return {
    id: f.id,
    name: f.name,
    summary: f.summary,
    same_as: f.sameAs ?? null,
    banks: f.banks,
    capacitor_kvar: f.capacitor_kvar,
    reactor_kvar: f.reactor_kvar,
    total: f.total,
    unpriced_lines: f.unpriced_lines,
    currency: f.currency,
    annual_saving: f.annual_saving,
    payback_years: f.payback_years,
    meets_every_case: f.meets_every_case,
    errors: f.errors,
    warnings: f.warnings,
  };
}
