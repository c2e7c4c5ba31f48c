// The options typed on a workbook's Design options sheet as the core takes them (compare.ts):
// each block's name, what it is and its banks, read by the Compensation sheet's rules
// (readBankInputs.ts), with what could not be read. Apart from optionInputs.ts, which the page's
// first download carries, so the value reader stays in the chunk that reads a whole site.
import type { Problem } from '../site/problems.ts';
import { shownText } from '../text/cellText.ts';
import { BANK_INPUTS } from './compensationColumns.ts';
import type { CellContent, SheetDoc } from './document.ts';
import { readOptionInputs, type OptionDraft } from './optionInputs.ts';
import { optionLabel, planOptionColumns } from './optionsLayout.ts';
import { readBankInputs } from './readBankInputs.ts';

const text = (v: CellContent | undefined) =>
  v === null || v === undefined ? '' : (typeof v === 'string' ? shownText(v) : String(v)).trim();

/** An option as typed on the sheet: its block, and what in its bank inputs could not be read. */
export interface SheetOptionDraft extends OptionDraft {
  readonly block: number;
  /** Each with its sheet, row and column; the option's figures wait until they are mended. */
  readonly problems: readonly Problem[];
}

/**
 * The options of a workbook's Design options sheet as the core takes them (compare.ts), block by
 * block; a block with neither a name nor a bank is left out. Bank inputs are read as on the
 * Compensation sheet (readBankInputs.ts): a value that cannot be read is one of the option's
 * problems, never a silent blank.
 */
export function optionDrafts(sheet: SheetDoc | undefined, cases: readonly string[]): SheetOptionDraft[] {
  if (!sheet) return [];
  const cols = planOptionColumns(cases);
  const columns = BANK_INPUTS.map((b) => ({ key: b.key, col: cols.input[b.key], header: b.header }));
  return readOptionInputs(sheet, cols).flatMap((o, j) => {
    if (text(o.name) === '' && o.banks.size === 0) return [];
    const problems: Problem[] = [];
    const banks = [...o.banks.keys()].map((key) => {
      const { inputs } = readBankInputs(sheet, o.rows.get(key) as number, columns, { problems });
      return { bus: o.buses.get(key) ?? key, ...inputs };
    });
    return [{ block: j, name: text(o.name) || optionLabel(j), summary: text(o.what), banks, problems }];
  });
}
