// A Compensation row with only a detuning p (%) typed (no bank sizes, no reactor): the page writes
// the bank the design proposes for that bus (designWithSheet, the rule Checks and `kvar-ledger
// balance` follow) into the row's blank inputs, each cell marked as proposed. From then on they are
// ordinary inputs, so the page, the export, Checks and the CLI count the same bank without a design
// run after every edit.
import type { CellContent, CellMark, WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook } from '../../core/workbook/readSite.ts';
import { mergeProblems, validateSite } from '../../core/site/validate.ts';
import { designWithSheet, isDetuningOnly } from '../../core/site/sheetChoices.ts';
import { bankTotal, hasBankChoice, type BankChoice } from '../../core/site/bankChoice.ts';
import type { CompensationColumns } from '../../core/workbook/compensationColumns.ts';
import { proposedMark } from '../../core/workbook/cellMarks.ts';
import { SHEETS } from '../../core/workbook/layout.ts';
import { textContent } from '../../core/text/cellText.ts';

/** The inputs the design's bank fills (the detuning stays as typed; a proposal has no reactor). */
const PROPOSED_INPUTS = ['fixed_kvar', 'step_kvar', 'steps', 'series', 'u_rated_kv'] as const;

export interface DetuningProposal {
  readonly cells: ReadonlyArray<{
    readonly row: number;
    readonly col: number;
    readonly content: CellContent;
  }>;
  readonly marks: readonly CellMark[];
}

const NONE: DetuningProposal = { cells: [], marks: [] };

const stamp = (when: Date) => `${when.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

function noteFor(bank: BankChoice, when: Date): string {
  const total = Math.round(bankTotal(bank) * 10) / 10;
  return (
    `proposed by the design on ${stamp(when)} for bus ${bank.bus}, detuned ${bank.p_pct ?? 0} % ` +
    `(a bank of ${total} kvar in all), because only the detuning was typed on this row; ` +
    `typing over it makes the value yours`
  );
}

/**
 * The writes and marks that put the design's bank into the given Compensation rows (0-based, as
 * on the sheet) that hold a detuning alone. Only blank inputs are written: what the user typed
 * (a capacitor rating, say) stays. Nothing when the inputs have errors, the design proposes no
 * bank on that bus, or the design cannot run: Checks says why in each case.
 */
export function detuningProposal(
  doc: WorkbookDoc,
  rows: readonly number[],
  comp: CompensationColumns,
  when: Date = new Date(),
): DetuningProposal {
  const sheet = doc.sheets.find((s) => s.name === SHEETS.compensation);
  if (!sheet) return NONE;
  const busOf = (r: number) => sheet.cells[r]?.[0];
  const read = siteFromWorkbook(doc);
  const alone = new Map<string, number>();
  for (const r of rows) {
    const bus = busOf(r);
    const choice = read.banks.find((c) => c.bus === String(bus));
    if (r > 0 && bus != null && choice && isDetuningOnly(choice)) alone.set(choice.bus, r);
  }
  if (alone.size === 0) return NONE;
  if (mergeProblems(read.problems, validateSite(read.site)).some((p) => p.severity === 'error')) return NONE;
  let design: readonly BankChoice[];
  try {
    design = designWithSheet(read.site, read.banks).choices;
  } catch (e) {
    // The design refuses sites it cannot balance (losses that run away, a broken bus graph);
    // Checks runs the same design and says why, so the row is left as typed.
    if (e instanceof Error) return NONE;
    throw e;
  }
  const cells: Array<{ row: number; col: number; content: CellContent }> = [];
  const marks: CellMark[] = [];
  for (const [bus, row] of alone) {
    const bank = design.find((c) => c.bus === bus && hasBankChoice(c));
    if (!bank) continue;
    const note = noteFor(bank, when);
    for (const key of PROPOSED_INPUTS) {
      const value = bank[key];
      const col = comp.input[key];
      const typed = sheet.cells[row]?.[col];
      if (value === undefined || value === 0 || (typed !== null && typed !== undefined && typed !== ''))
        continue;
      // A series (1:2:2) goes in as the sheet holds typed text, marked so the engine keeps it as
      // text: the mark's value must be the cell's content, or the mark would not hold.
      const content = typeof value === 'string' ? textContent(value) : value;
      cells.push({ row, col, content });
      marks.push(proposedMark(row, col, content, note));
    }
  }
  return { cells, marks };
}
