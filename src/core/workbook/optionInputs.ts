// What users type on the Design options sheet: per option its name, what it is, and per bus the
// bank's inputs (as on the Compensation sheet). Read back from the sheet by its block labels and
// bus names, so a block whose rows moved (a bus added, a case renamed) keeps what was typed; and
// written in compact form (title lines and bank lines only) for a new workbook, which render.ts
// lays out in full.
import { busKey } from '../site/busNames.ts';
import type { BankChoice } from '../site/bankChoice.ts';
import { shownText, textContent } from '../text/cellText.ts';
import { BANK_INPUTS } from './compensationColumns.ts';
import type { CellContent, CellMark, SheetDoc } from './document.ts';
import { proposedMark } from './cellMarks.ts';
import {
  OPTIONS_SHEET,
  OPTION_BLOCKS,
  TITLE,
  optionLabel,
  planOptionColumns,
  type OptionColumns,
} from './optionsLayout.ts';

export interface OptionInputs {
  readonly name: CellContent;
  readonly what: CellContent;
  /** Per bus key: input column → content (non-blank only). */
  readonly banks: ReadonlyMap<string, ReadonlyMap<number, CellContent>>;
  /** Per bus key: the marks on its bank's input cells (row left to the writer). */
  readonly marks: ReadonlyMap<string, readonly CellMark[]>;
  /** Per bus key: the bus as its line names it. */
  readonly buses: ReadonlyMap<string, string>;
  /** Per bus key: the row (0-based) of its line on the sheet read. */
  readonly rows: ReadonlyMap<string, number>;
}

/** An option as the design gives it: the shape of compare.ts's OptionSpec this module needs. */
export interface OptionDraft {
  readonly name: string;
  readonly summary: string;
  readonly banks: readonly BankChoice[];
}

const blank = (v: CellContent | undefined) =>
  v === null || v === undefined || (typeof v === 'string' && v.trim() === '');

const inputCols = (cols: OptionColumns) => BANK_INPUTS.map((b) => cols.input[b.key]);

/** The options typed on a sheet, block by block (blank blocks where the sheet has none). */
export function readOptionInputs(
  sheet:
    { readonly cells: readonly (readonly CellContent[])[]; readonly marks?: readonly CellMark[] } | undefined,
  cols: OptionColumns,
): OptionInputs[] {
  const out = Array.from({ length: OPTION_BLOCKS }, () => ({
    name: null as CellContent,
    what: null as CellContent,
    banks: new Map<string, Map<number, CellContent>>(),
    marks: new Map<string, CellMark[]>(),
    buses: new Map<string, string>(),
    rows: new Map<string, number>(),
  }));
  if (!sheet) return out;
  const labels = new Map(Array.from({ length: OPTION_BLOCKS }, (_, j) => [optionLabel(j), j]));
  const marksByRow = new Map<number, CellMark[]>();
  for (const m of sheet.marks ?? []) marksByRow.set(m.row, [...(marksByRow.get(m.row) ?? []), m]);
  const wanted = inputCols(cols);
  let block: (typeof out)[number] | undefined;
  for (let r = 1; r < sheet.cells.length; r++) {
    const line = sheet.cells[r] ?? [];
    const label = line[TITLE.label];
    const j = typeof label === 'string' ? labels.get(label.trim()) : undefined;
    if (j !== undefined) {
      block = out[j];
      if (block) {
        block.name = line[TITLE.name] ?? null;
        block.what = line[TITLE.what] ?? null;
      }
      continue;
    }
    const bus = line[0];
    if (!block || blank(bus)) continue;
    const values = new Map<number, CellContent>();
    for (const c of wanted) if (!blank(line[c])) values.set(c, line[c] ?? null);
    if (values.size === 0) continue;
    const name = (typeof bus === 'string' ? shownText(bus) : String(bus)).trim();
    const key = busKey(name);
    if (block.banks.has(key)) continue;
    block.banks.set(key, values);
    block.buses.set(key, name);
    block.rows.set(key, r);
    const marks = (marksByRow.get(r) ?? []).filter((m) => wanted.includes(m.col));
    if (marks.length > 0) block.marks.set(key, marks);
  }
  return out;
}

/** Has anything been typed in the option blocks (a name, what it is, a bank input)? */
export function anyOptionTyped(inputs: readonly OptionInputs[]): boolean {
  return inputs.some((o) => o.banks.size > 0 || !blank(o.name) || !blank(o.what));
}

/** The note of a proposed option input: where the value came from. */
const proposedNote = (option: string) =>
  `proposed by Kvar Ledger's design for the option "${option}" when the workbook was made; an ordinary input: change it freely`;

/**
 * The sheet in compact form for options drafted by the design: title lines and one line per bank,
 * every value marked proposed. render.ts lays it out in full and keeps the marks with their cells.
 */
export function optionInputsSheet(drafts: readonly OptionDraft[], cases: readonly string[]): SheetDoc {
  const cols = planOptionColumns(cases);
  const width = cols.columns.length;
  const cells: CellContent[][] = [cols.columns.map((c) => c.header)];
  const marks: CellMark[] = [];
  drafts.slice(0, OPTION_BLOCKS).forEach((d, j) => {
    const title = new Array<CellContent>(width).fill(null);
    title[TITLE.name] = textContent(d.name);
    title[TITLE.label] = optionLabel(j);
    title[TITLE.what] = textContent(d.summary);
    cells.push(title);
    for (const b of d.banks) {
      const line = new Array<CellContent>(width).fill(null);
      line[0] = textContent(b.bus);
      for (const i of BANK_INPUTS) {
        const v = b[i.key];
        if (v === undefined) continue;
        // The series is text the engine would read as a time of day ("1:2:2"): marked as text.
        const content = typeof v === 'string' ? textContent(v) : v;
        line[cols.input[i.key]] = content;
        marks.push(proposedMark(cells.length, cols.input[i.key], content, proposedNote(d.name)));
      }
      cells.push(line);
    }
  });
  return { name: OPTIONS_SHEET, cells, ...(marks.length > 0 ? { marks } : {}) };
}
