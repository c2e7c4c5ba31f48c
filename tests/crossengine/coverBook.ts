// The cover's figures in another program: the cold-store export with one input changed in the
// file itself (the LV-REF bank's steps on the Compensation sheet, 6 → 3), as an estimator would
// change it in another spreadsheet, and the same change made in the app's document, whose
// engine gives the values the other program must show on the sheets and on the cover.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { planCompensationColumns } from '../../src/core/workbook/compensationColumns.ts';
import { createEngine, readCell, type CellResult } from '../../src/engine/index.ts';
import { coverFigures, type CoverFigure } from '../../src/io/xlsx/coverFigures.ts';
import type { Book } from './books.ts';

export const EDITED_COVER_BASE = 'cover-edited';
export const EDITED_BUS = 'LV-REF';
export const EDITED_STEPS = 3;

export interface CoverCheck {
  readonly figure: CoverFigure;
  /** The app's value before the edit and after it (its own engine on the edited document). */
  readonly before: CellResult;
  readonly after: CellResult;
}

function edited(doc: WorkbookDoc, row: number, col: number): WorkbookDoc {
  return {
    ...doc,
    sheets: doc.sheets.map((s) =>
      s.name !== 'Compensation'
        ? s
        : {
            ...s,
            cells: s.cells.map((r, i) => (i !== row ? r : r.map((c, j) => (j === col ? EDITED_STEPS : c)))),
          },
    ),
  };
}

/** Write `cover-edited.xlsx` next to the book's export; the figures with the app's values. */
export async function writeEditedCover(
  work: string,
  book: Book,
): Promise<{ file: string; checks: CoverCheck[] }> {
  const comp = book.doc.sheets.find((s) => s.name === 'Compensation');
  const cases = book.settings?.cases ?? [];
  const row = comp?.cells.findIndex((r) => r[0] === EDITED_BUS) ?? -1;
  if (!comp || row < 1) throw new Error(`${book.base} has no ${EDITED_BUS} on its Compensation sheet`);
  const col = planCompensationColumns(cases).input.steps;
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(readFileSync(join(work, `${book.base}.xlsx`)) as unknown as ArrayBuffer);
  wb.getWorksheet('Compensation')!.getCell(row + 1, col + 1).value = EDITED_STEPS;
  const file = join(work, `${EDITED_COVER_BASE}.xlsx`);
  writeFileSync(file, new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer));
  const before = createEngine(book.doc.sheets);
  const after = createEngine(edited(book.doc, row, col).sheets);
  const checks = coverFigures(book.doc).map((figure) => ({
    figure,
    before: readCell(before, figure.sheet, figure.row, figure.col),
    after: readCell(after, figure.sheet, figure.row, figure.col),
  }));
  before.destroy();
  after.destroy();
  return { file, checks };
}
