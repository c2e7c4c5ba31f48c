// Checks on the sheets the price and the saving are read from, which are the user's own: a Rates
// row that prices nothing (bad unit or rate, a repeated item, a name the lookup cannot match),
// a Tariff Setting left blank or not a number, and a case with no "Hours per year" row. Each
// would leave a line unpriced or make the saving count 0, and the sheets alone do not say why.
import {
  RATES_SHEET,
  rateRowsOf,
  readRateTable,
  readTariff,
  tariffRowsOf,
  TARIFF_COL,
  TARIFF_SHEET,
} from '../../core/quote/index.ts';
import { shownText } from '../../core/text/cellText.ts';
import type { CellContent, WorkbookDoc } from '../../core/workbook/document.ts';
import type { CheckItem } from './checksWhere.ts';

const sheetNamed = (doc: WorkbookDoc, name: string) =>
  doc.sheets.find((s) => s.name.toLowerCase() === name.toLowerCase())?.name ?? name;

export function tariffItems(doc: WorkbookDoc, cases: readonly string[]): CheckItem[] {
  const rows = tariffRowsOf(doc);
  if (rows === undefined) return [];
  const sheet = sheetNamed(doc, TARIFF_SHEET);
  return readTariff(rows, cases).problems.map((p) => ({
    severity: 'warning' as const,
    code: 'tariff',
    where: p.row !== undefined ? `${sheet} row ${p.row}, column Value` : `${sheet} sheet`,
    text: p.message.replace(/^tariff( row \d+, column Value)?: /, ''),
    ...(p.row !== undefined ? { target: { sheet, row: p.row, col: TARIFF_COL.value } } : {}),
  }));
}

const header = (v: CellContent | undefined) =>
  typeof v === 'string' ? shownText(v).trim().toLowerCase() : '';

export function rateItems(doc: WorkbookDoc): CheckItem[] {
  const rows = rateRowsOf(doc);
  if (rows === undefined) return [];
  const sheet = sheetNamed(doc, RATES_SHEET);
  const heads = (rows[0] ?? []).map(header);
  return readRateTable(rows).problems.map((p) => {
    const col = heads.indexOf(p.column.toLowerCase());
    return {
      severity: 'warning' as const,
      code: 'rates',
      where: `${sheet} row ${p.row}, column ${p.column}`,
      text: p.message.replace(/^rates row \d+(, column [^:]+)?: /, ''),
      ...(col >= 0 ? { target: { sheet, row: p.row, col } } : {}),
    };
  });
}
