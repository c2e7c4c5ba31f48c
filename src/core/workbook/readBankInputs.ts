// One bank's inputs read from a line of cells: a bus row of the Compensation sheet, or a bus line
// of an option on the Design options sheet. Sizes are numbers ≥ 0 (text that reads as a number
// counts, as a spreadsheet's arithmetic takes it), the step series is text; every value that
// cannot be read is reported with its sheet, row and column and left out of the bank.
import type { BankChoice } from '../site/bankChoice.ts';
import { STEP_SERIES_ALLOWED, isStepSeries, seriesProblem, type StepSeries } from '../site/stepSeries.ts';
import type { BankInputKey } from './compensationColumns.ts';
import type { SheetDoc } from './document.ts';
import { readNumber, readText, report, type ReadContext, type Spot } from './readCells.ts';

/** Where one bank input sits on the sheet being read. */
export interface BankInputColumn {
  readonly key: BankInputKey;
  readonly col: number;
  readonly header: string;
}

export type BankInputs = { -readonly [K in Exclude<keyof BankChoice, 'bus' | 'note'>]?: BankChoice[K] };

/** A bank's step series (text); a number is what a spreadsheet makes of 1:2:2 typed plainly: a time. */
function readSeries(
  doc: SheetDoc,
  at: Spot,
  stages: number | undefined,
  ctx: ReadContext,
): StepSeries | undefined {
  const raw = doc.cells[at.row]?.[at.col];
  if (typeof raw === 'number') {
    report(
      ctx,
      'error',
      at,
      `must be one of ${STEP_SERIES_ALLOWED}; got the number ${raw} (a spreadsheet reads 1:2:2 typed plainly as a time of day: type '1:2:2 with a leading apostrophe)`,
    );
    return undefined;
  }
  const text = readText(doc, at, ctx);
  if (text === undefined) return undefined;
  const why = seriesProblem(text, stages);
  if (why !== undefined) report(ctx, 'error', at, why);
  return isStepSeries(text) ? text : undefined;
}

/**
 * The bank inputs of row `row` (0-based) in the given columns (in BANK_INPUTS order): what could
 * be read, and whether any input was given. A size below 0 is reported and kept as typed.
 */
export function readBankInputs(
  doc: SheetDoc,
  row: number,
  columns: readonly BankInputColumn[],
  ctx: ReadContext,
): { inputs: BankInputs; any: boolean } {
  const inputs: BankInputs = {};
  let any = false;
  const spot = (c: BankInputColumn): Spot => ({ sheet: doc.name, row, col: c.col, header: c.header });
  for (const c of columns) {
    if (c.key === 'series') {
      // After the step count in the columns' order: the series is checked against it.
      const series = readSeries(doc, spot(c), inputs.steps, ctx);
      if (series !== undefined) inputs.series = series;
      any ||= series !== undefined;
      continue;
    }
    const n = readNumber(doc, spot(c), ctx);
    if (n === undefined) continue;
    if (n < 0) report(ctx, 'error', spot(c), `must be ≥ 0; got ${n}`);
    inputs[c.key] = n;
    any = true;
  }
  return { inputs, any };
}
