// The Tariff sheet: the utility's reactive charge, the energy price for losses and the hours each
// case runs, as the user enters them (Setting, Value, Unit, Note), found by the Setting text so
// rows may move. Like the Rates sheet it is the user's: written once in a new workbook with
// INVENTED demo values, marked so, and never again. Settings not given count as 0.
import { shownText, textContent } from '../text/cellText.ts';
import type { CellContent, SheetDoc, WorkbookDoc } from '../workbook/document.ts';
import type { Tariff } from './saving.ts';

export const TARIFF_SHEET = 'Tariff';

export const TARIFF_LABELS = {
  kvarh_price: 'Reactive energy price',
  kvarh_free_tan: 'Free reactive energy up to tan φ',
  demand_price: 'Reactive demand penalty',
  demand_free_tan: 'Free reactive demand up to tan φ',
  periods_per_year: 'Billing periods per year',
  energy_price: 'Energy price for losses',
} as const;
type TariffKey = keyof typeof TARIFF_LABELS;

const UNITS: Record<TariffKey, string> = {
  kvarh_price: 'per kvarh',
  kvarh_free_tan: 'tan φ',
  demand_price: 'per kvar and billing period',
  demand_free_tan: 'tan φ',
  periods_per_year: 'per year',
  energy_price: 'per kWh',
};

/**
 * Hours in a leap year (366 × 24): the cases of one site share one year, so hours above this
 * count some hour twice and overstate the saving. 8,784 rather than 8,760 so that a leap year's
 * hours typed as such are not refused.
 */
export const HOURS_PER_YEAR_MAX = 8784;

/** The Setting text of a case's hours. */
export const hoursLabel = (c: string) => `Hours per year: ${c}`;

export const TARIFF_HEADERS = ['Setting', 'Value', 'Unit', 'Note'] as const;

/** Where each column of the Tariff sheet is: the sheet is read by position, in header order. */
export const TARIFF_COL = {
  setting: TARIFF_HEADERS.indexOf('Setting'),
  value: TARIFF_HEADERS.indexOf('Value'),
  unit: TARIFF_HEADERS.indexOf('Unit'),
  note: TARIFF_HEADERS.indexOf('Note'),
} as const;

export interface TariffProblem {
  /** The sheet row (1-based, header = 1) of the Setting at fault; absent for a row that is missing. */
  readonly row?: number;
  readonly message: string;
}

const text = (v: CellContent | undefined): string =>
  v === null || v === undefined ? '' : typeof v === 'string' ? shownText(v).trim() : String(v);

/** The tariff from the sheet's rows (header first); a Setting with a value that is no number ≥ 0 is reported. */
export function readTariff(
  rows: readonly (readonly CellContent[])[],
  cases: readonly string[],
): { tariff: Tariff; problems: TariffProblem[] } {
  const values = new Map<string, number>();
  const problems: TariffProblem[] = [];
  rows.slice(1).forEach((r, i) => {
    const label = text(r[TARIFF_COL.setting]).toLowerCase();
    if (label === '' || values.has(label)) return;
    const raw = r[TARIFF_COL.value];
    const v = typeof raw === 'number' ? raw : Number(text(raw).replace(',', '.'));
    if (text(raw) === '' || !Number.isFinite(v) || v < 0) {
      const why =
        text(raw) === ''
          ? 'is blank and counts 0 until a number ≥ 0 is entered'
          : `must be a number ≥ 0; got "${text(raw)}"`;
      problems.push({
        row: i + 2,
        message: `tariff row ${i + 2}, column Value: "${text(r[TARIFF_COL.setting])}" ${why}`,
      });
      return;
    }
    values.set(label, v);
  });
  // A case with no hours row would count 0 hours without a word: say which row to add.
  const labels = new Set(rows.slice(1).map((r) => text(r[TARIFF_COL.setting]).toLowerCase()));
  for (const c of cases)
    if (!labels.has(hoursLabel(c).toLowerCase()))
      problems.push({
        message: `tariff: no row "${hoursLabel(c)}", so case ${c} counts 0 hours per year; add the row with the hours it runs`,
      });
  const get = (label: string) => values.get(label.toLowerCase()) ?? 0;
  const yearProblem = overfullYear(rows, cases, get);
  if (yearProblem) problems.push(yearProblem);
  const tariff: Tariff = {
    kvarh_price: get(TARIFF_LABELS.kvarh_price),
    kvarh_free_tan: get(TARIFF_LABELS.kvarh_free_tan),
    demand_price: get(TARIFF_LABELS.demand_price),
    demand_free_tan: get(TARIFF_LABELS.demand_free_tan),
    periods_per_year: get(TARIFF_LABELS.periods_per_year),
    energy_price: get(TARIFF_LABELS.energy_price),
    hours: new Map(cases.map((c) => [c, get(hoursLabel(c))])),
  };
  return { tariff, problems };
}

/** The cases' hours add up to more than a year: reported at the first hours row. */
function overfullYear(
  rows: readonly (readonly CellContent[])[],
  cases: readonly string[],
  get: (label: string) => number,
): TariffProblem | undefined {
  const total = cases.reduce((sum, c) => sum + get(hoursLabel(c)), 0);
  if (!(total > HOURS_PER_YEAR_MAX)) return undefined;
  const wanted = new Set(cases.map((c) => hoursLabel(c).toLowerCase()));
  const first = rows.findIndex((r, i) => i > 0 && wanted.has(text(r[TARIFF_COL.setting]).toLowerCase()));
  const each = cases.map((c) => `${c} ${get(hoursLabel(c)).toLocaleString('en-GB')} h`).join(', ');
  return {
    ...(first > 0 ? { row: first + 1 } : {}),
    message: `tariff${first > 0 ? ` row ${first + 1}, column Value` : ''}: the cases' hours add up to ${total.toLocaleString('en-GB')} h per year (${each}), more than a year has (${HOURS_PER_YEAR_MAX.toLocaleString('en-GB')} h in a leap year), so the saving counts some hours twice; share the year between the cases`,
  };
}

export const TARIFF_PURPOSE =
  "Your utility's reactive charge, the price of a kWh lost and the hours per year of each case, for the saving on the Quantities and cost sheet; found by the Setting text. A new workbook's values are INVENTED demo values: enter your tariff.";

const DEMO_NOTE = 'INVENTED demo value: replace with your tariff';

/** A new workbook's Tariff sheet: invented demo values, the year shared evenly between the cases. */
export function tariffSheetDoc(cases: readonly string[]): SheetDoc {
  const demo: Record<TariffKey, number> = {
    kvarh_price: 0.02,
    kvarh_free_tan: 0.4,
    demand_price: 0,
    demand_free_tan: 0.4,
    periods_per_year: 12,
    energy_price: 0.15,
  };
  const hours = Math.round(8760 / Math.max(1, cases.length));
  const rows: CellContent[][] = [
    [...TARIFF_HEADERS],
    ...(Object.keys(TARIFF_LABELS) as TariffKey[]).map((k) => [
      textContent(TARIFF_LABELS[k]),
      demo[k],
      UNITS[k],
      DEMO_NOTE,
    ]),
    ...cases.map((c) => [textContent(hoursLabel(c)), hours, 'h', DEMO_NOTE]),
  ];
  return {
    name: TARIFF_SHEET,
    cells: rows,
    columns: TARIFF_HEADERS.map((header, i) => ({ header, width: [34, 10, 26, 44][i] as number })),
    purpose: TARIFF_PURPOSE,
  };
}

/** The rows of the document's Tariff sheet, or undefined when it has none. */
export function tariffRowsOf(doc: WorkbookDoc): CellContent[][] | undefined {
  return doc.sheets.find((s) => s.name.toLowerCase() === TARIFF_SHEET.toLowerCase())?.cells;
}
