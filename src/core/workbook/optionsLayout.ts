// Where things sit on the "Design options" sheet. At the top a table, one line per design (the
// banks as given on the Compensation sheet, then each option) with references into the blocks.
// Below it one block per option: a title line (its name and what it is, typed), then per bus of
// the Buses sheet the Quantities sheet's block (bus line and item lines, quantitiesLayout.ts)
// whose bus line also holds the option's bank for that bus as inputs and, per case, what that
// bank does and the option's roll-up after compensation; then the option's cost summary, what it
// saves, and whether it meets the requirement in every case. Every bus has its lines in every
// block, so typing a bank never moves a row.
import { BANK_INPUTS, columnAdder, type BankInputKey } from './compensationColumns.ts';
import type { ColumnInfo } from './document.ts';
import { FORMATS, SHEETS } from './layout.ts';
import {
  BLOCK_ROWS,
  QC,
  QUANT_COLUMNS,
  QUANT_HEADERS,
  SAVING_LABELS,
  busLineRow,
  savingCaseRow,
} from './quantitiesLayout.ts';

export const OPTIONS_SHEET = SHEETS.options;

/** Blocks on the sheet: the standard options less "Banks as given" (compare.ts). */
export const OPTION_BLOCKS = 4;

/** The generated label of a block's title line (column Item), by which a reader finds the block. */
export const optionLabel = (j: number) => `Option ${j + 1}`;

/** Headers of the summary table's columns (row TABLE_HEAD_ROW), and where each sits. */
export const TABLE = {
  option: { col: 0, header: 'Design' },
  what: { col: 2, header: 'What it is' },
  capacitor: { col: 3, header: 'Capacitors (kvar)' },
  reactor: { col: 4, header: 'Reactors (kvar)' },
  // Text in the blocks' unformatted Unit column; the money in their grouped Rate, Cost and Bus
  // subtotal columns (21,336.21), so each figure reads in the format it needs.
  met: { col: 5, header: 'Requirement in every case' },
  currency: { col: 6, header: 'Currency' },
  total: { col: 7, header: 'Total' },
  saving: { col: 8, header: 'Saving a year' },
  payback: { col: 9, header: 'Payback (years)' },
  errors: { col: 10, header: 'Errors (Checks)' },
  warnings: { col: 11, header: 'Warnings (Checks)' },
} as const;

export const TABLE_TITLE_ROW = 1;
export const TABLE_HEAD_ROW = 2;
/** Line of the banks as given (the Compensation and Quantities sheets). */
export const GIVEN_ROW = 3;
/** Line of option j in the table. */
export const tableRow = (j: number) => GIVEN_ROW + 1 + j;
/** Notes below the table: where the findings come from, and the cautions. */
export const FINDINGS_NOTE_ROW = tableRow(OPTION_BLOCKS);
export const CAUTION_ROW = FINDINGS_NOTE_ROW + 1;
const FIRST_BLOCK_ROW = CAUTION_ROW + 2;

/** Per-case columns of a bus line: what the option's bank does and the roll-up after it. */
const PER_CASE = [
  ['available', (c: string) => `Bank in service ${c} (kvar)`, FORMATS.kvar],
  ['stepsIn', (c: string) => `Steps in ${c}`, FORMATS.count],
  ['capOut', (c: string) => `Capacitor output ${c} (kvar)`, FORMATS.kvar],
  ['reactorIn', (c: string) => `Reactor in ${c} (kvar)`, FORMATS.kvar],
  ['pAfter', (c: string) => `P after ${c} (kW)`, FORMATS.kw],
  ['qAbsAfter', (c: string) => `Q absorbed after ${c} (kvar)`, FORMATS.kvar],
  ['qDelAfter', (c: string) => `Q delivered after ${c} (kvar)`, FORMATS.kvar],
  ['sAfter', (c: string) => `S after ${c} (kVA)`, FORMATS.kva],
  ['feederP', (c: string) => `Feeder P loss after ${c} (kW)`, FORMATS.kw],
  ['feederQ', (c: string) => `Feeder Q absorbed after ${c} (kvar)`, FORMATS.kvar],
] as const;
export type PerCaseKey = (typeof PER_CASE)[number][0];

/** Columns of the point of connection after compensation, on each case line of the saving block. */
const ROOT = [
  ['p', 'P after at the connection (kW)', FORMATS.kw],
  ['q', 'Q after at the connection (kvar)', FORMATS.kvar],
  ['cos', 'cos φ after at the connection', FORMATS.pf],
  ['needInd', 'Inductive need (kvar)', FORMATS.kvar],
  ['within', 'Within requirement', undefined],
] as const;
export type RootKey = (typeof ROOT)[number][0];

export interface OptionColumns {
  /** The option's bank inputs on a bus line, as on the Compensation sheet. */
  readonly input: Readonly<Record<BankInputKey, number>>;
  readonly controllerSteps: number;
  /** Fixed part plus every step, as the Compensation sheet adds it (compare.ts capacitor_kvar). */
  readonly bankTotal: number;
  readonly perCase: Readonly<Record<PerCaseKey, readonly number[]>>;
  readonly root: Readonly<Record<RootKey, number>>;
  readonly columns: readonly ColumnInfo[];
}

/** Quantities headers that name a bank input: on this sheet they read "as counted". */
const counted = (h: string) => (h === 'Steps' ? 'Steps as counted' : h.replace(' (', ' as counted ('));
const CLASHING = new Set<number>([QC.fixed, QC.step, QC.steps, QC.p, QC.uRated, QC.total, QC.reactor]);

export function planOptionColumns(cases: readonly string[]): OptionColumns {
  const columns: ColumnInfo[] = QUANT_COLUMNS.map((c, i) =>
    CLASHING.has(i) ? { ...c, header: counted(QUANT_HEADERS[i] as string) } : c,
  );
  const add = columnAdder(columns);
  const input = Object.fromEntries(
    BANK_INPUTS.map((b) => [b.key, add(b.header, b.format, b.width, false)]),
  ) as Record<BankInputKey, number>;
  const controllerSteps = add('Controller steps', FORMATS.count, 9);
  const bankTotal = add('Bank total (kvar)', FORMATS.kvar, 9);
  const perCase = Object.fromEntries(PER_CASE.map(([key]) => [key, [] as number[]])) as Record<
    PerCaseKey,
    number[]
  >;
  for (const c of cases) for (const [key, header, f] of PER_CASE) perCase[key].push(add(header(c), f, 10));
  const root = Object.fromEntries(ROOT.map(([key, header, f]) => [key, add(header, f, 11)])) as Record<
    RootKey,
    number
  >;
  return { input, controllerSteps, bankTotal, perCase, root, columns };
}

/** The line below the yearly figures: every case within the requirement? */
export const MET_LABEL = 'Requirement met in every case';

/** Rows of one block: title line, bus blocks, cost summary and note, saving, the line MET_LABEL. */
export function blockHeight(busCount: number, cases: number): number {
  return savingCaseRow(busCount, cases, 1) + SAVING_LABELS.length + 1;
}

/** Title line of option j's block. */
export function blockTitleRow(j: number, busCount: number, cases: number): number {
  return FIRST_BLOCK_ROW + j * (blockHeight(busCount, cases) + 1);
}

/** Row of the first bus line of option j's block: the `origin` of quantitiesLayout.ts. */
export const blockOrigin = (j: number, busCount: number, cases: number) =>
  blockTitleRow(j, busCount, cases) + 1;

/** Row of the MET_LABEL line of option j. */
export function metRow(j: number, busCount: number, cases: number): number {
  return savingCaseRow(busCount, cases, blockOrigin(j, busCount, cases)) + SAVING_LABELS.length;
}

/** Rows of the whole sheet, header included. */
export function optionsExtent(busCount: number, cases: number): number {
  return busCount === 0 ? CAUTION_ROW + 1 : blockTitleRow(OPTION_BLOCKS, busCount, cases) - 1;
}

/** Columns of a title line: the option's name and what it is are typed; the label is generated. */
export const TITLE = { name: QC.bus, label: QC.item, what: QC.what } as const;

/** Title line of option j when the blocks hold inputs only (a site too large for their formulas). */
export const compactTitleRow = (j: number, busCount: number) => CAUTION_ROW + 2 + j * (busCount + 2);

/** How the blocks sit: how many buses and cases, and whether they hold inputs only (compact). */
export interface OptionsShape {
  readonly busCount: number;
  readonly cases: number;
  readonly compact: boolean;
}

/** Title line of option j, in either layout. */
export const optionTitleRow = (j: number, at: OptionsShape) =>
  at.compact ? compactTitleRow(j, at.busCount) : blockTitleRow(j, at.busCount, at.cases);

/** The line of bus i (its bank inputs) in option j's block, in either layout. */
export const optionBusRow = (j: number, i: number, at: OptionsShape) =>
  at.compact ? compactTitleRow(j, at.busCount) + 1 + i : busLineRow(i, blockOrigin(j, at.busCount, at.cases));

/**
 * Where every block's title line and bus lines went when the sheet was laid out anew: old row →
 * new row, undefined where the line is gone (its bus, or every block when no bus is left). Lines
 * that stay where they were are left out. `busTo[i]`: the new index of old bus i (undefined: gone).
 */
export function optionRowMoves(
  before: OptionsShape,
  after: OptionsShape,
  busTo: readonly (number | undefined)[],
): Map<number, number | undefined> {
  const moves = new Map<number, number | undefined>();
  if (before.busCount === 0) return moves;
  const note = (from: number, to: number | undefined) => {
    if (from !== to) moves.set(from, to);
  };
  for (let j = 0; j < OPTION_BLOCKS; j++) {
    note(optionTitleRow(j, before), after.busCount === 0 ? undefined : optionTitleRow(j, after));
    for (let i = 0; i < before.busCount; i++) {
      const to = busTo[i];
      note(optionBusRow(j, i, before), to === undefined ? undefined : optionBusRow(j, to, after));
    }
  }
  return moves;
}

/**
 * Is (row, col) a cell users type on this sheet (an option's name or what it is, a bank input of
 * a bus line)? `compact`: the blocks hold inputs only.
 */
export function isOptionInput(
  cols: OptionColumns,
  busCount: number,
  cases: number,
  compact: boolean,
  row: number,
  col: number,
): boolean {
  const onTitle = col === TITLE.name || col === TITLE.what;
  const onBank = Object.values(cols.input).includes(col);
  if (!onTitle && !onBank) return false;
  for (let j = 0; j < OPTION_BLOCKS; j++) {
    const title = compact ? compactTitleRow(j, busCount) : blockTitleRow(j, busCount, cases);
    if (row === title) return onTitle;
    const i = compact ? row - title - 1 : (row - title - 1) / BLOCK_ROWS;
    if (Number.isInteger(i) && i >= 0 && i < busCount) return onBank;
  }
  return false;
}
