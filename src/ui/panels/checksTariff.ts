// Checks on the Tariff sheet: a Setting whose value is blank or no number, and a case with no
// "Hours per year" row. Either would make the saving count 0 without a word.
import { readTariff, tariffRowsOf, TARIFF_SHEET } from '../../core/quote/index.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import type { CheckItem } from './checksModel.ts';

/** The Value column of the Tariff sheet (Setting, Value, Unit, Note). */
const VALUE_COL = 1;

export function tariffItems(doc: WorkbookDoc, cases: readonly string[]): CheckItem[] {
  const rows = tariffRowsOf(doc);
  if (rows === undefined) return [];
  const sheet =
    doc.sheets.find((s) => s.name.toLowerCase() === TARIFF_SHEET.toLowerCase())?.name ?? TARIFF_SHEET;
  return readTariff(rows, cases).problems.map((p) => ({
    severity: 'warning' as const,
    code: 'tariff',
    where: p.row !== undefined ? `${sheet} row ${p.row}, column Value` : `${sheet} sheet`,
    text: p.message.replace(/^tariff( row \d+, column Value)?: /, ''),
    ...(p.row !== undefined ? { target: { sheet, row: p.row, col: VALUE_COL } } : {}),
  }));
}
