// The "Design options" sheet: the table of designs at the top (the banks as given, then each
// option, figures by reference into the blocks and the Compensation and Quantities sheets), then
// one block per option (optionBlock.ts). Errors and warnings are not spreadsheet maths: the
// export writes Checks' counts beside the table as values and says so.
import { CAUTION_SHORT } from '../cautions.ts';
import { textContent } from '../text/cellText.ts';
import { summaryRow } from './renderCompensation.ts';
import type { CellContent, CellMark } from './document.ts';
import { SHEETS } from './layout.ts';
import { renderBlock, type BlockInput } from './optionBlock.ts';
import type { OptionInputs } from './optionInputs.ts';
import {
  CAUTION_ROW,
  FINDINGS_NOTE_ROW,
  GIVEN_ROW,
  OPTION_BLOCKS,
  TABLE,
  TABLE_HEAD_ROW,
  TABLE_TITLE_ROW,
  TITLE,
  blockOrigin,
  blockTitleRow,
  compactTitleRow,
  metRow,
  optionLabel,
  tableRow,
} from './optionsLayout.ts';
import { QC, QUANTITIES_SHEET, busLineRow, savingRowOf, summaryRowOf } from './quantitiesLayout.ts';
import { cell, cellOn, rangeOn, textLiteral } from './refs.ts';

/** A block's input, and what the user typed on the sheet. */
export interface OptionsInput extends BlockInput {
  readonly typed: readonly OptionInputs[];
  /**
   * Why the blocks hold no formulas (a site too large for them to be worked out unasked): the
   * typed inputs are kept, the table says why.
   */
  readonly leftOut?: string;
}

export const GIVEN_NAME = 'Banks as given';
export const FINDINGS_NOTE =
  'Errors and warnings: counted by Checks for each design when the file was exported (values, not formulas); in Kvar Ledger, Checks lists them.';

/** The table's line for the banks as given: the Compensation and Quantities sheets' own figures. */
function givenLine(input: OptionsInput, line: CellContent[]): void {
  const { s, comp } = input;
  const n = s.buses.length;
  const C = s.cases.length;
  const quant = (row: number) => cellOn(QUANTITIES_SHEET, row, QC.cost, true);
  line[TABLE.option.col] = GIVEN_NAME;
  line[TABLE.what.col] = 'the banks on the Compensation sheet: the chosen design';
  line[TABLE.capacitor.col] = `=${cellOn(SHEETS.compensation, summaryRow(n), comp.total, true)}`;
  line[TABLE.reactor.col] =
    `=SUM(${rangeOn(SHEETS.compensation, 1, comp.input.reactor_kvar, n, comp.input.reactor_kvar)})`;
  line[TABLE.total.col] = `=${quant(summaryRowOf(n, 'Total'))}`;
  line[TABLE.currency.col] = `=${quant(summaryRowOf(n, 'Currency'))}`;
  line[TABLE.saving.col] = `=${quant(savingRowOf(n, C, 'Annual saving'))}`;
  line[TABLE.payback.col] = `=${quant(savingRowOf(n, C, 'Simple payback (years)'))}`;
  const within = comp.within.map((c) => `${cellOn(SHEETS.compensation, 1, c, true)}="yes"`);
  line[TABLE.met.col] = `=IF(AND(${within.join(',')}),"yes","no")`;
}

/** Option j's line in the table: references into its block. */
function optionLine(input: OptionsInput, j: number, line: CellContent[]): void {
  const { s, cols } = input;
  const n = s.buses.length;
  const C = s.cases.length;
  const title = input.leftOut !== undefined ? compactTitleRow(j, n) : blockTitleRow(j, n, C);
  const origin = blockOrigin(j, n, C);
  const [name, what] = [cell(title, TITLE.name), cell(title, TITLE.what)];
  line[TABLE.option.col] = `=IF(ISBLANK(${name}),${textLiteral(optionLabel(j))},${name})`;
  line[TABLE.what.col] = `=IF(ISBLANK(${what}),"",${what})`;
  if (input.leftOut !== undefined) return;
  // The bus blocks' rows: item lines leave these columns blank.
  const bankRows = (col: number) => `SUM(${rangeOn(undefined, origin, col, busLineRow(n, origin) - 1, col)})`;
  line[TABLE.capacitor.col] = `=${bankRows(cols.bankTotal)}`;
  line[TABLE.reactor.col] = `=${bankRows(cols.input.reactor_kvar)}`;
  const at = (row: number) => cell(row, QC.cost);
  line[TABLE.total.col] = `=${at(summaryRowOf(n, 'Total', origin))}`;
  line[TABLE.currency.col] = `=${at(summaryRowOf(n, 'Currency', origin))}`;
  line[TABLE.saving.col] = `=${at(savingRowOf(n, C, 'Annual saving', origin))}`;
  line[TABLE.payback.col] = `=${at(savingRowOf(n, C, 'Simple payback (years)', origin))}`;
  line[TABLE.met.col] = `=${at(metRow(j, n, C))}`;
}

/** Every generated cell of the sheet, and the marks of the typed inputs where they now sit. */
export function renderOptionsSheet(input: OptionsInput): { cells: CellContent[][]; marks: CellMark[] } {
  const { s, cols } = input;
  const width = cols.columns.length;
  const n = s.buses.length;
  const C = s.cases.length;
  const blank = () => new Array<CellContent>(width).fill(null);
  const cells: CellContent[][] = [cols.columns.map((c) => c.header)];
  const marks: CellMark[] = [];
  const put = (r: number, line: CellContent[]) => {
    while (cells.length < r) cells.push(blank());
    cells[r] = line;
  };
  const title = blank();
  title[0] = 'Designs side by side';
  title[TABLE.what.col] =
    "each option's figures are formulas over its block below; the requirement is judged at the point of connection";
  put(TABLE_TITLE_ROW, title);
  const head = blank();
  for (const t of Object.values(TABLE)) head[t.col] = t.header;
  put(TABLE_HEAD_ROW, head);
  const given = blank();
  if (n > 0) givenLine(input, given);
  else given[TABLE.option.col] = GIVEN_NAME;
  put(GIVEN_ROW, given);
  for (let j = 0; j < OPTION_BLOCKS; j++) {
    const line = blank();
    if (n > 0) optionLine(input, j, line);
    put(tableRow(j), line);
  }
  const note = blank();
  note[0] = input.leftOut ?? FINDINGS_NOTE;
  put(FINDINGS_NOTE_ROW, note);
  const caution = blank();
  caution[0] = CAUTION_SHORT;
  put(CAUTION_ROW, caution);
  if (n === 0) return { cells, marks };
  if (input.leftOut !== undefined) {
    inputsOnly(input, put, blank, marks);
    return { cells, marks };
  }
  for (let j = 0; j < OPTION_BLOCKS; j++) {
    const t = blockTitleRow(j, n, C);
    const block = renderBlock(input, j, t, input.typed[j] as OptionInputs);
    block.rows.forEach((row, k) => put(t + k, row));
    marks.push(...block.marks);
  }
  return { cells, marks };
}

/**
 * The blocks without formulas, compact: each option's title line and a line per bus with its
 * typed bank, so what was typed stays and can be edited (the reader goes by labels and bus names).
 */
function inputsOnly(
  input: OptionsInput,
  put: (r: number, line: CellContent[]) => void,
  blank: () => CellContent[],
  marks: CellMark[],
): void {
  input.typed.forEach((typed, j) => {
    let r = compactTitleRow(j, input.s.buses.length);
    const head = blank();
    head[TITLE.name] = typed.name;
    head[TITLE.label] = optionLabel(j);
    head[TITLE.what] = typed.what;
    put(r++, head);
    for (const b of input.s.buses) {
      const line = blank();
      line[0] = textContent(b.name);
      for (const [c, v] of typed.banks.get(b.key) ?? []) line[c] = v;
      marks.push(...(typed.marks.get(b.key) ?? []).map((m) => ({ ...m, row: r })));
      put(r++, line);
    }
  });
}

export const OPTIONS_PURPOSE =
  "Design options side by side: the table at the top compares the banks as given (Compensation and Quantities sheets) with each option on capacitor and reactor kvar, total, saving, payback and the requirement. Each option's block holds its name, what it is and its bank per bus (inputs, as on the Compensation sheet; blank = no bank), then as formulas what each bank does per case, the roll-up after it, its items priced at the Rates sheet, and what it saves with the Tariff sheet. Estimate only: local codes, the utility and a licensed engineer decide.";
