// The Rates sheet: the rate table as a sheet of the workbook, typed and kept by the user like any
// sheet of their own (never written again by Kvar Ledger once it exists). A new site workbook
// starts with the invented demo rates, marked as such on every row.
import { textContent } from '../text/cellText.ts';
import type { CellContent, SheetDoc, WorkbookDoc } from '../workbook/document.ts';
import { RATE_HEADERS, rateTableRows, type RateTable } from './rates.ts';

export const RATES_SHEET = 'Rates';

export const RATES_PURPOSE =
  'Your rates, which `kvar-ledger quote` prices the compensation schedule with: one row per item of the schedule (Item as the schedule names it, Unit pc or kvar, Rate, Currency, Source and date), and Installation, Engineering and Contingency as % rows. The rates a new workbook starts with are INVENTED demo rates: replace them with your own. An item without a rate here stays unpriced, never zero.';

const WIDTHS = [30, 7, 10, 9, 44];

export function ratesSheetDoc(table: RateTable, surchargeSource = ''): SheetDoc {
  const rows = rateTableRows(table, surchargeSource);
  const cells: CellContent[][] = rows.map((r) => r.map((v) => (typeof v === 'string' ? textContent(v) : v)));
  return {
    name: RATES_SHEET,
    cells,
    columns: RATE_HEADERS.map((header, i) => ({
      header,
      width: WIDTHS[i] as number,
      ...(i === 2 ? { format: '#,##0.00' } : {}),
    })),
    purpose: RATES_PURPOSE,
  };
}

/** The rows of the document's Rates sheet (header first), or undefined when it has none. */
export function rateRowsOf(doc: WorkbookDoc): CellContent[][] | undefined {
  const sheet = doc.sheets.find((s) => s.name.toLowerCase() === RATES_SHEET.toLowerCase());
  return sheet?.cells;
}
