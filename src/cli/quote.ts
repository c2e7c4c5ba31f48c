// `kvar-ledger quote <file> [--rates rates.csv] [site options] [--json]`: the countable items of
// the compensation per bus and their cost at the user's rates. The site is read by the one loader
// (loadSite.ts); the schedule and the cost come from src/core/quote. Rates: --rates (a CSV in the
// Rates sheet's columns), else the workbook's Rates sheet, else the invented demo rates, said so.
import { readFileSync } from 'node:fs';
import { parseArgs } from './args.ts';
import type { CliIo } from './io.ts';
import { loadSite } from './loadSite.ts';
import { EXIT_HELP, EXIT_OK, inputError, oneLine, refuseErrors, usageError } from './report.ts';
import {
  SITE_FLAGS,
  SITE_LIST_OPTIONS,
  SITE_OPTIONS_HELP,
  SITE_VALUE_OPTIONS,
  oneSiteFile,
} from './siteOptions.ts';
import { reportAssumed } from './assumed.ts';
import { CAUTION_SHORT } from '../core/cautions.ts';
import { proposeChoices } from '../core/site/compensation.ts';
import { SiteStructureError } from '../core/site/rollup.ts';
import {
  demoRateTable,
  priceSchedule,
  readRateTable,
  siteSchedule,
  SURCHARGES,
  type Quote,
  type RateProblem,
  type RateTable,
} from '../core/quote/index.ts';
import { readCsv } from '../io/csv/read.ts';
import { quoteSaving, savingText, type SavingResult } from './quoteSaving.ts';
import { optionsJson, optionsText, siteOptions } from './quoteOptions.ts';
import type { OptionOutcome } from '../core/options/index.ts';

const USAGE = `usage: kvar-ledger quote <file> [--rates rates.csv] [--compare] [site options] [--json]
The items of the compensation per bus (capacitor units, detuning reactors, switching devices
by current class, controllers, sections, incomers, discharge devices, shunt reactors) and their
cost at your rates, with installation, engineering and contingency. The banks are the file's
(a workbook's Compensation sheet, a site file's "banks"), else the design's proposal.
  --rates FILE  a CSV with the columns Item, Unit (pc, kvar or %), Rate, Currency, Source and date;
                without it, the workbook's Rates sheet (none: every item unpriced);
                for a site file or a list, INVENTED demo rates
  --compare     add the design options side by side: the banks as the file gives them, then
                a workbook's own options (its Design options sheet), else the design's
                proposal, plain capacitors, every bank detuned 7 %, one bank at the point of
                connection; each with its cost, saving, payback, whether the requirement is
                met in every case, and its Checks findings
  --json        print {site, banks_from, rates_from, currency, buses, equipment, surcharges,
                total, unpriced, tariff_from, saving, options (with --compare)} as JSON
The saving per year (reactive charge before and after, losses saved, simple payback) uses the
workbook's Tariff sheet; a site file or a list takes an INVENTED demo tariff, said so.
${SITE_OPTIONS_HELP}
${EXIT_HELP}
`;

type RatesFrom = 'option' | 'workbook' | 'none' | 'demo';
const RATES_TEXT: Record<RatesFrom, string> = {
  option: 'rates from --rates',
  workbook: "rates from the workbook's Rates sheet",
  none: 'no rates: the workbook has no Rates sheet (give --rates FILE), so every item is unpriced',
  demo: 'INVENTED demo rates (no --rates given and the file holds no Rates sheet): not prices to quote',
};

function readRatesFile(file: string): { rows: string[][] } | { message: string } {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    return {
      message: `${file}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a directory, not a file' : String(e)}`,
    };
  }
  try {
    return { rows: readCsv(text) };
  } catch (e) {
    return { message: `${file}: ${e instanceof Error ? e.message : String(e)}` };
  }
}

const money = (x: number | null) =>
  x === null ? 'unpriced' : x.toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const qty = (x: number | null) => (x === null ? '–' : String(Math.round(x * 100) / 100));

function table(header: string[], rows: string[][], leftCols: number): string {
  const widths = header.map((h, i) => rows.reduce((w, r) => Math.max(w, (r[i] ?? '').length), h.length));
  const line = (cells: string[]) =>
    cells
      .map((c, i) => (i < leftCols ? c.padEnd(widths[i] as number) : c.padStart(widths[i] as number)))
      .join('  ')
      .trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n') + '\n';
}

function toText(
  name: string,
  from: string,
  ratesFrom: RatesFrom,
  q: Quote,
  rateProblems: readonly RateProblem[],
  saving: string,
): string {
  const out = [`${name}: quantities and cost\n${from}; ${RATES_TEXT[ratesFrom]}\n`];
  if (q.buses.length === 0) out.push('\nno bank or reactor: nothing to price\n');
  for (const b of q.buses) {
    out.push(`\nbus ${b.bus}\n`);
    const rows = b.lines.map((l) => [
      l.item.code || '–',
      l.item.what,
      qty(l.item.count),
      `${qty(l.item.quantity)} ${l.item.unit}`,
      l.rate === null ? '–' : money(l.rate.rate),
      money(l.cost),
    ]);
    rows.push(['subtotal', '', '', '', '', money(b.subtotal)]);
    out.push(table(['item', 'what', 'count', 'quantity', 'rate', `cost ${q.currency}`], rows, 2));
  }
  const sums = [
    ['equipment', money(q.equipment)],
    ...SURCHARGES.map((s) => [`${s.toLowerCase()} ${q.surcharges[s].pct} %`, money(q.surcharges[s].amount)]),
    [`total ${q.currency}`, money(q.total)],
  ];
  out.push('\n' + table(['', ''], sums, 1).split('\n').slice(2).join('\n'));
  for (const u of q.unpriced) out.push(`unpriced: ${oneLine(u)}\n`);
  for (const p of rateProblems) out.push(`rates: ${oneLine(p.message)}\n`);
  out.push(saving, `\n${CAUTION_SHORT}\n`);
  return out.join('');
}

function toJson(
  name: string,
  from: 'file' | 'proposed',
  ratesFrom: RatesFrom,
  q: Quote,
  rateProblems: readonly RateProblem[],
) {
  return {
    site: name,
    banks_from: from,
    rates_from: ratesFrom,
    currency: q.currency,
    buses: q.buses.map((b) => ({
      bus: b.bus,
      items: b.lines.map((l) => ({
        code: l.item.code,
        what: l.item.what,
        count: l.item.count,
        unit: l.item.unit,
        quantity: l.item.quantity,
        rate: l.rate?.rate ?? null,
        rate_source: l.rate?.source ?? null,
        cost: l.cost,
        unpriced: l.unpriced ?? null,
      })),
      subtotal: b.subtotal,
    })),
    equipment: q.equipment,
    surcharges: q.surcharges,
    total: q.total,
    unpriced: q.unpriced,
    rate_problems: rateProblems,
    caution: CAUTION_SHORT,
  };
}

export async function run(argv: string[], io: CliIo): Promise<number> {
  const parsed = parseArgs(argv, {
    command: 'quote',
    flags: ['--json', '--compare', ...SITE_FLAGS],
    values: [...SITE_VALUE_OPTIONS, '--rates'],
    lists: [...SITE_LIST_OPTIONS],
  });
  if (!parsed.ok) return usageError(io, 'quote', parsed.message);
  const { flags, values } = parsed.args;
  if (flags.has('--help')) {
    io.out(USAGE);
    return EXIT_OK;
  }
  const input = oneSiteFile(io, 'quote', parsed.args);
  if (typeof input === 'number') return input;
  const { file, options } = input;
  const ratesFile = values.get('--rates');
  let given: string[][] | undefined;
  if (ratesFile !== undefined) {
    const r = readRatesFile(ratesFile);
    if ('message' in r) return inputError(io, 'quote', r.message);
    given = r.rows;
  }
  const loaded = await loadSite(file, options);
  if (!loaded.ok)
    return loaded.usage
      ? usageError(io, 'quote', `quote: ${loaded.message}`)
      : inputError(io, 'quote', loaded.message);
  const { site, problems } = loaded.loaded;
  reportAssumed(io, file, site, loaded.loaded);
  if (problems.some((p) => p.severity === 'error'))
    return refuseErrors(io, 'quote', file, problems, 'nothing was priced');

  let rates: RateTable;
  let rateProblems: RateProblem[] = [];
  let ratesFrom: RatesFrom;
  if (given !== undefined) {
    const r = readRateTable(given);
    // A rates file the user names must be right: every bad row is refused, with its row and column.
    if (r.problems.length > 0) {
      for (const p of r.problems) io.err(`${ratesFile}: ${oneLine(p.message)}\n`);
      return inputError(
        io,
        'quote',
        `${ratesFile}: ${r.problems.length} bad row(s) in the rates; nothing was priced`,
      );
    }
    [rates, ratesFrom] = [r.table, 'option'];
  } else if (loaded.loaded.rateRows !== undefined) {
    const r = readRateTable(loaded.loaded.rateRows);
    [rates, rateProblems, ratesFrom] = [r.table, r.problems, 'workbook'];
  } else if (loaded.loaded.source === 'workbook' || loaded.loaded.source === 'own-xlsx') {
    // A workbook whose Rates sheet was removed or renamed is not priced at invented rates.
    [rates, ratesFrom] = [
      { rates: [], surcharges: { Installation: 0, Engineering: 0, Contingency: 0 } },
      'none',
    ];
  } else [rates, ratesFrom] = [demoRateTable(), 'demo'];

  let banks = loaded.loaded.banks;
  const from = banks ? 'file' : 'proposed';
  try {
    banks ??= proposeChoices(site);
  } catch (e) {
    if (e instanceof SiteStructureError) return inputError(io, 'quote', `${file}: ${e.message}`);
    throw e;
  }
  const quote = priceSchedule(siteSchedule(site, banks), rates);
  const isWorkbook = loaded.loaded.source === 'workbook' || loaded.loaded.source === 'own-xlsx';
  let saving: SavingResult;
  try {
    saving = quoteSaving(site, banks, loaded.loaded.tariffRows, isWorkbook, quote.total);
  } catch (e) {
    if (e instanceof SiteStructureError) return inputError(io, 'quote', `${file}: ${e.message}`);
    throw e;
  }
  let compared: OptionOutcome[] | undefined;
  try {
    if (flags.has('--compare'))
      compared = siteOptions(
        site,
        loaded.loaded.banks,
        rates,
        loaded.loaded.tariffRows,
        saving.from === 'none',
        loaded.loaded.optionSheet,
      );
  } catch (e) {
    if (e instanceof SiteStructureError) return inputError(io, 'quote', `${file}: ${e.message}`);
    throw e;
  }
  const fromText = from === 'file' ? 'banks as the file gives them' : 'banks proposed (the file gives none)';
  io.out(
    flags.has('--json')
      ? JSON.stringify(
          {
            ...toJson(site.settings.name, from, ratesFrom, quote, rateProblems),
            tariff_from: saving.from,
            saving: saving.saving,
            tariff_problems: saving.problems,
            ...(compared ? { options: optionsJson(compared) } : {}),
          },
          null,
          2,
        ) + '\n'
      : toText(
          site.settings.name,
          fromText,
          ratesFrom,
          quote,
          rateProblems,
          savingText(saving, quote.currency) + (compared ? optionsText(compared, table) : ''),
        ),
  );
  return EXIT_OK;
}
