// Formulas an opened workbook cannot compute: calls of functions the engine does not have (from
// another program, or misspelt) and references that loop back on themselves. Found by building
// the engine over the document and reading the error type of every formula cell.
import { DetailedCellError, ErrorType } from 'hyperformula';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { createEngine, type OwnPlugin } from '../../engine/index.ts';
import type { FileProblem } from './fileProblem.ts';
import { columnLetter } from './sheetNames.ts';

/** At most this many problems are listed; the count says how many more. */
export const MAX_LISTED_PROBLEMS = 50;

const UNKNOWN_NAME = /(?:Function name|Named expression) (.+?) not recognized/i;

export function checkFormulas(doc: WorkbookDoc, plugins?: readonly OwnPlugin[]): FileProblem[] {
  let hf;
  try {
    hf = createEngine(doc.sheets, plugins ? { plugins } : {});
  } catch (e) {
    return [{ code: 'wrong-layout', message: `the workbook cannot be opened: ${e instanceof Error ? e.message : String(e)}` }];
  }
  const problems: FileProblem[] = [];
  let more = 0;
  doc.sheets.forEach((sheet) => {
    const id = hf.getSheetId(sheet.name) as number;
    sheet.cells.forEach((row, r) =>
      row.forEach((content, c) => {
        if (typeof content !== 'string' || !content.startsWith('=')) return;
        const v = hf.getCellValue({ sheet: id, row: r, col: c });
        if (!(v instanceof DetailedCellError)) return;
        const where = `${sheet.name}!${columnLetter(c)}${r + 1}`;
        let p: FileProblem | undefined;
        if (v.type === ErrorType.NAME) {
          const name = UNKNOWN_NAME.exec(v.message)?.[1] ?? 'a name';
          p = { code: 'unknown-function', message: `the formula ${content} uses ${name}, which Kvar Ledger does not know`, where };
        } else if (v.type === ErrorType.CYCLE) {
          p = { code: 'circular-reference', message: `the formula ${content} refers to itself through a loop of references`, where };
        }
        if (!p) return;
        if (problems.length < MAX_LISTED_PROBLEMS) problems.push(p);
        else more++;
      }),
    );
  });
  hf.destroy();
  if (more > 0) problems.push({ code: problems[0]?.code ?? 'unknown-function', message: `and ${more} more formula problems` });
  return problems;
}
