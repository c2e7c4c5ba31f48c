// The figures the cover shows at a glance, as the one-page summary does: per case cos φ before
// and after and tan φ before and after at the point of connection, the cost total, the annual saving and
// the simple payback. Each is a formula referring to the cell of the exported sheet that holds
// it (Buses, Quantities and cost), so the cover follows an edit made in another program.
import { shownText } from '../../core/text/cellText.ts';
import type { CellContent, SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';
import { BUS_HEADERS, SHEETS } from '../../core/workbook/layout.ts';
import { QC } from '../../core/workbook/quantitiesLayout.ts';
import { cellOn } from '../../core/workbook/refs.ts';

export interface CoverFigure {
  readonly label: string;
  /** The formula without its leading '=', as the xlsx stores it. */
  readonly formula: string;
  readonly format: string;
  /** The cell it refers to (0-based), for its cached value. */
  readonly sheet: string;
  readonly row: number;
  readonly col: number;
}

const text = (c: CellContent | undefined): string => (typeof c === 'string' ? shownText(c).trim() : '');

const find = (doc: WorkbookDoc, name: string): SheetDoc | undefined =>
  doc.sheets.find((s) => s.name === name);

function figure(label: string, sheet: string, row: number, col: number, format: string): CoverFigure {
  return { label, formula: cellOn(sheet, row, col, true), format, sheet, row, col };
}

function connection(buses: SheetDoc): CoverFigure[] {
  const header = (buses.cells[0] ?? []).map(text);
  const col = (h: string) => header.indexOf(h);
  const root = text(buses.cells[1]?.[0]);
  if (root === '') return [];
  // A case is a column "Sense <case>"; "Q absorbed after <case>" names no case of its own.
  const cases = header.flatMap((h) => {
    const m = /^Sense (.+)$/.exec(h);
    return m ? [m[1] as string] : [];
  });
  return cases.flatMap((c) =>
    (
      [
        [`cos φ before at ${root}, ${c}`, BUS_HEADERS.cos(c), '0.000'],
        [`tan φ before at ${root}, ${c}`, BUS_HEADERS.tan(c), '0.000'],
        [`cos φ after at ${root}, ${c}`, BUS_HEADERS.cosAfter(c), '0.000'],
        [`tan φ after at ${root}, ${c}`, BUS_HEADERS.tanAfter(c), '0.000'],
      ] as const
    ).flatMap(([label, h, format]) => (col(h) < 0 ? [] : [figure(label, SHEETS.buses, 1, col(h), format)])),
  );
}

/** The Quantities and cost sheet's lines found by their label in column A. */
function money(quantities: SheetDoc): CoverFigure[] {
  const rowOf = (label: string) => quantities.cells.findIndex((r) => text(r[QC.bus]) === label);
  const lines = [
    ['Currency', 'Currency of the cost and saving', 'General'],
    ['Total', 'Equipment cost total with surcharges', '#,##0.00'],
    ['Annual saving', 'Annual saving', '#,##0.00'],
    ['Simple payback (years)', 'Simple payback (years)', '0.0'],
  ] as const;
  return lines.flatMap(([label, shown, format]) => {
    const r = rowOf(label);
    return r < 0 ? [] : [figure(shown, SHEETS.quantities, r, QC.cost, format)];
  });
}

/** The cover's live figures for a site workbook; none for a workbook without the built-in sheets. */
export function coverFigures(doc: WorkbookDoc): CoverFigure[] {
  const buses = find(doc, SHEETS.buses);
  const quantities = find(doc, SHEETS.quantities);
  return [...(buses ? connection(buses) : []), ...(quantities ? money(quantities) : [])];
}
