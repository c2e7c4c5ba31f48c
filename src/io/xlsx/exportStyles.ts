// How the exported sheets look: a frozen, tinted header row (inputs and computed columns tinted
// apart), number formats and widths from the workbook's column info, a readable cover.
import type { CellFormulaValue, Worksheet } from 'exceljs';
import type { SheetDoc } from '../../core/workbook/document.ts';
import type { CoverFigureRow, CoverRow } from './exportCover.ts';
import { xmlSafe } from './exportCells.ts';
import { heldAssumptions, heldProposals } from '../../core/workbook/cellMarks.ts';

const INK = 'FF1F2A33';
const INPUT_HEADER = 'FFE3E9EE';
const COMPUTED_HEADER = 'FFE6EFE3';
const RULE = 'FF8A99A6';

/** Cells whose value was typed over Kvar Ledger's formula: the page's copper mark. */
const OVERRIDE_FILL = 'FFFBF3DD';
const OVERRIDE_INK = 'FFB2632B';
export const OVERRIDE_NOTE =
  "Typed over: Kvar Ledger's formula for this cell was replaced by this value, which counts in the totals as typed.";

const MIN_WIDTH = 8;
const MAX_WIDTH = 48;

function solid(argb: string) {
  return { type: 'pattern' as const, pattern: 'solid' as const, fgColor: { argb } };
}

/** Before rows: widths and number formats by column. With headerOnly: after rows, the header and panes. */
export function styleDataSheet(ws: Worksheet, sheet: SheetDoc, opts: { headerOnly?: boolean } = {}): void {
  const cols = sheet.columns ?? [];
  if (!opts.headerOnly) {
    cols.forEach((c, i) => {
      const col = ws.getColumn(i + 1);
      col.width = Math.max(MIN_WIDTH, Math.min(MAX_WIDTH, c.width ?? c.header.length + 2));
      if (c.format) col.numFmt = c.format;
    });
    return;
  }
  if (cols.length === 0) return;
  const header = ws.getRow(1);
  cols.forEach((c, i) => {
    const cell = header.getCell(i + 1);
    cell.numFmt = 'General';
    cell.font = { bold: true, color: { argb: INK } };
    cell.fill = solid(c.computed ? COMPUTED_HEADER : INPUT_HEADER);
    cell.border = { bottom: { style: 'thin', color: { argb: RULE } } };
    cell.alignment = { vertical: 'bottom', wrapText: true };
  });
  ws.views = [{ state: 'frozen', xSplit: 0, ySplit: 1, topLeftCell: 'A2', activeCell: 'A2' }];
}

export function styleCover(ws: Worksheet, rows: readonly CoverRow[]): void {
  ws.getColumn(1).width = 30;
  ws.getColumn(2).width = 110;
  rows.forEach((r, i) => {
    if (!Array.isArray(r)) {
      const f = r as CoverFigureRow;
      const row = ws.addRow([xmlSafe(f.label)]);
      const cell = row.getCell(2);
      cell.value = { formula: f.formula, result: f.result ?? '' } as CellFormulaValue;
      cell.numFmt = f.format;
      cell.alignment = { horizontal: 'left', vertical: 'top' };
      row.getCell(1).alignment = { vertical: 'top' };
      return;
    }
    const row = ws.addRow((r as readonly string[]).map(xmlSafe));
    const heading = r.length === 1 && r[0] !== undefined;
    if (i === 0) row.getCell(1).font = { bold: true, size: 14, color: { argb: INK } };
    else if (heading) row.getCell(1).font = { bold: true, color: { argb: INK } };
    row.getCell(2).alignment = { wrapText: true, vertical: 'top' };
    row.getCell(1).alignment = { vertical: 'top' };
  });
}

const FUNCTION_WIDTHS = [34, 40, 52, 30, 90, 60, 16];

export function styleFunctionsSheet(ws: Worksheet, header: string[], rows: readonly string[][]): void {
  FUNCTION_WIDTHS.forEach((w, i) => (ws.getColumn(i + 1).width = w));
  const h = ws.addRow(header);
  h.eachCell((cell) => {
    cell.font = { bold: true, color: { argb: INK } };
    cell.fill = solid(INPUT_HEADER);
    cell.border = { bottom: { style: 'thin', color: { argb: RULE } } };
  });
  for (const r of rows) {
    const row = ws.addRow(r.map(xmlSafe));
    row.eachCell((cell) => (cell.alignment = { wrapText: true, vertical: 'top' }));
  }
  ws.views = [{ state: 'frozen', xSplit: 0, ySplit: 1, topLeftCell: 'A2', activeCell: 'A2' }];
}

/** Mark the cells typed over formulas: a fill, copper ink and a note saying what happened. */
const ASSUMED_FILL = 'FFFFF6CC';

export function markOverrides(ws: Worksheet, sheet: SheetDoc): void {
  for (const [row, col] of sheet.overrides ?? []) {
    const cell = ws.getCell(row + 1, col + 1);
    cell.fill = solid(OVERRIDE_FILL);
    cell.font = { color: { argb: OVERRIDE_INK } };
    cell.note = OVERRIDE_NOTE;
  }
}

/** Mark the typical values assumed for blanks: a pale amber fill and a note with their source. */
export function markAssumptions(ws: Worksheet, sheet: SheetDoc): void {
  for (const m of heldAssumptions(sheet)) {
    const cell = ws.getCell(m.row + 1, m.col + 1);
    cell.fill = solid(ASSUMED_FILL);
    cell.font = { italic: true };
    cell.note = `Assumed (typical value at tender stage): ${m.note}. Replace with nameplate or maker's data.`;
  }
}

const PROPOSED_FILL = 'FFDFEAE4';

/** Mark the bank sizes the design proposed for a row with a detuning typed alone: a pale fir fill and a note. */
export function markProposals(ws: Worksheet, sheet: SheetDoc): void {
  for (const m of heldProposals(sheet)) {
    const cell = ws.getCell(m.row + 1, m.col + 1);
    cell.fill = solid(PROPOSED_FILL);
    cell.font = { underline: 'single' };
    cell.note = `Proposed: ${m.note}. It counts as an input; check it against the makers' data.`;
  }
}
