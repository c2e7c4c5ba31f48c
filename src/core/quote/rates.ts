// The rate table the user owns: one row per item (the schedule's item code), what it is per,
// the rate, its currency and where the rate came from. Rows whose unit is "%" are surcharges:
// Installation and Engineering on the equipment, Contingency on equipment plus both. The same
// table is the workbook's Rates sheet and the CLI's rates.csv.
import { shownText } from '../text/cellText.ts';
import type { CellContent } from '../workbook/document.ts';
import type { PricedUnit } from './schedule.ts';

export interface Rate {
  /** The item code it prices (matched without regard to case or surrounding spaces). */
  readonly item: string;
  readonly unit: PricedUnit;
  readonly rate: number;
  readonly currency: string;
  /** Where the rate comes from and when (an offer, a price list, "invented demo rate"). */
  readonly source: string;
}

export type SurchargeName = 'Installation' | 'Engineering' | 'Contingency';
export const SURCHARGES: readonly SurchargeName[] = ['Installation', 'Engineering', 'Contingency'];

export interface RateTable {
  readonly rates: readonly Rate[];
  /** Percentages; a surcharge not given is 0 % (it is optional). */
  readonly surcharges: Readonly<Record<SurchargeName, number>>;
  /**
   * The quote's currency: the Currency of the table's first row, which is where the Quantities
   * sheet reads it. Absent (a table built in code): the first rate's.
   */
  readonly currency?: string;
}

export interface RateProblem {
  /** 1-based row of the table (the header is row 1). */
  readonly row: number;
  readonly column: string;
  readonly message: string;
}

/** The table's columns, in the order the Rates sheet and rates.csv hold them. */
export const RATE_HEADERS = ['Item', 'Unit', 'Rate', 'Currency', 'Source and date'] as const;
export const RATE_UNITS: readonly string[] = ['pc', 'kvar', '%'];

const text = (v: CellContent | undefined): string =>
  v === null || v === undefined ? '' : typeof v === 'string' ? shownText(v).trim() : String(v);

export const itemKey = (item: string) => item.trim().replace(/\s+/g, ' ').toLowerCase();

/** Column index of each header, by name without regard to case; the standard order when absent. */
function columnsOf(header: readonly CellContent[]): Record<(typeof RATE_HEADERS)[number], number> {
  const names = header.map((h) => text(h).toLowerCase());
  const find = (name: string, i: number) => {
    const k = names.indexOf(name.toLowerCase());
    return k >= 0 ? k : i;
  };
  return {
    Item: find('Item', 0),
    Unit: find('Unit', 1),
    Rate: find('Rate', 2),
    Currency: find('Currency', 3),
    'Source and date': find('Source and date', 4),
  };
}

/**
 * Rates from a table whose first row is the header. Blank rows are skipped; a row with an item
 * but a bad unit or rate is reported (row, column, value given) and left out, so its items show
 * as unpriced rather than priced at zero.
 */
export function readRateTable(rows: readonly (readonly CellContent[])[]): {
  table: RateTable;
  problems: RateProblem[];
} {
  const col = columnsOf(rows[0] ?? []);
  const rates: Rate[] = [];
  const surcharges: Record<SurchargeName, number> = { Installation: 0, Engineering: 0, Contingency: 0 };
  const problems: RateProblem[] = [];
  const seen = new Set<string>();
  /** The sheet row of each rate, for problems found once all are read. */
  const rateRows: number[] = [];
  rows.slice(1).forEach((r, i) => {
    const row = i + 2;
    const item = text(r[col.Item]);
    const unit = text(r[col.Unit]).toLowerCase();
    const raw = r[col.Rate];
    if (item === '' && unit === '' && text(raw) === '') return;
    const bad = (column: string, message: string) => problems.push({ row, column, message });
    if (item === '') return bad('Item', `rates row ${row}: the item is blank`);
    // The sheet finds an item's rate by its exact name (spreadsheet MATCH, any case): a name with
    // spaces at its ends or doubled inside matches nothing there, so it matches nothing here.
    const typed = typeof r[col.Item] === 'string' ? shownText(r[col.Item] as string) : item;
    const tidy = typed.trim().replace(/\s+/g, ' ');
    if (typed !== tidy)
      return bad(
        'Item',
        `rates row ${row}, column Item: "${typed}" has spaces at its ends or doubled inside, so no item matches it; write it as "${tidy}"`,
      );
    if (seen.has(itemKey(item)))
      return bad(
        'Item',
        `rates row ${row}: "${item}" is priced already on an earlier row; this row is ignored`,
      );
    if (!RATE_UNITS.includes(unit))
      return bad(
        'Unit',
        `rates row ${row}, column Unit: must be one of ${RATE_UNITS.join(', ')}; got "${text(r[col.Unit])}"`,
      );
    const value = typeof raw === 'number' ? raw : Number(text(raw).replace(',', '.'));
    if (text(raw) === '' || !Number.isFinite(value) || value < 0)
      return bad('Rate', `rates row ${row}, column Rate: must be a number ≥ 0; got "${text(raw)}"`);
    seen.add(itemKey(item));
    if (unit === '%') {
      const name = SURCHARGES.find((s) => s.toLowerCase() === itemKey(item));
      if (name === undefined)
        return bad(
          'Item',
          `rates row ${row}: a "%" row must be one of ${SURCHARGES.join(', ')}; got "${item}"`,
        );
      surcharges[name] = value;
      return;
    }
    rateRows.push(row);
    rates.push({
      item,
      unit: unit as PricedUnit,
      rate: value,
      currency: text(r[col.Currency]),
      source: text(r[col['Source and date']]),
    });
  });
  const currency = text(rows[1]?.[col.Currency]);
  const problem = currencyProblem(rates, rateRows, currency);
  if (problem) problems.push(problem);
  return { table: { rates, surcharges, currency }, problems };
}

/**
 * Rates in another currency than the quote's (the first row's, compared as spreadsheets compare
 * text) are unpriced: said at the first row to change. A blank first currency is that row.
 */
function currencyProblem(
  rates: readonly Rate[],
  rateRows: readonly number[],
  currency: string,
): RateProblem | undefined {
  const others = rates.flatMap((r, i) =>
    r.currency.toLowerCase() === currency.toLowerCase() ? [] : [{ rate: r, row: rateRows[i] as number }],
  );
  const first = others[0];
  if (first === undefined) return undefined;
  const more = others.length > 1 ? `, as are ${others.length - 1} other rate(s) in another currency` : '';
  const fix = 'give every rate the same currency, or put the currency of the quote on the first row';
  if (currency === '')
    return {
      row: 2,
      column: 'Currency',
      message: `rates row 2, column Currency: the quote is in the currency of the first row, which is blank, so "${first.rate.item}" (in "${first.rate.currency}") is unpriced${more}; ${fix}`,
    };
  const its = first.rate.currency === '' ? 'no currency' : `"${first.rate.currency}"`;
  return {
    row: first.row,
    column: 'Currency',
    message: `rates row ${first.row}, column Currency: "${first.rate.item}" is in ${its}, not in "${currency}", the currency of the quote (the first row's), so it is unpriced${more}; ${fix}`,
  };
}

/** The table as rows (header first), surcharges last: what the Rates sheet and rates.csv hold. */
export function rateTableRows(table: RateTable, surchargeSource = ''): CellContent[][] {
  return [
    [...RATE_HEADERS],
    ...table.rates.map((r) => [r.item, r.unit, r.rate, r.currency, r.source]),
    ...SURCHARGES.map((s) => [s, '%', table.surcharges[s], '', surchargeSource]),
  ];
}
