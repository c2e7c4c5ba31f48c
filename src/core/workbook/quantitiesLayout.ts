// Where things sit on the "Quantities and cost" sheet: its columns, one block of rows per bus of
// the Compensation sheet (a bus line with the bank as the items read it, then one line per kind
// of item, blank where the bank has none), and the totals below the blocks. Every bus has its
// block whether or not it has a bank, so typing a bank never moves a row.
import type { ColumnInfo } from './document.ts';
import { FORMATS, SHEETS } from './layout.ts';

export const QUANTITIES_SHEET = SHEETS.quantities;

export const QUANT_HEADERS = [
  'Bus',
  'Item',
  'Description',
  'Count (pc)',
  'Quantity',
  'Unit',
  'Current (A)',
  'Rate',
  'Cost',
  'Bus subtotal',
  'Unpriced lines',
  'U (kV)',
  'Fixed (kvar)',
  'Step (kvar)',
  'Steps',
  'Detuning p (%)',
  'Capacitor rated voltage (kV)',
  'Nameplate per kvar of output',
  'Bank total (kvar)',
  'Reactor (kvar)',
  'Rates row',
  'Units in series',
  'Voltage across capacitors (kV)',
] as const;

/** Column indexes by meaning. */
export const QC = {
  bus: 0,
  item: 1,
  what: 2,
  count: 3,
  quantity: 4,
  unit: 5,
  amps: 6,
  rate: 7,
  cost: 8,
  subtotal: 9,
  unpriced: 10,
  u: 11,
  fixed: 12,
  step: 13,
  steps: 14,
  p: 15,
  uRated: 16,
  perKvar: 17,
  total: 18,
  reactor: 19,
  /** The Rates sheet row whose Item matches: one lookup per line, read by Rate. */
  rateRow: 20,
  /** Capacitor units in series per phase of the rating (CAPBANK.USERIES): MV units come in 3 × it. */
  inSeries: 21,
  /** CAPBANK.UCAP of the bus line, in a cell of its own: CAPBANK.URATED's expansion repeats its argument. */
  uCap: 22,
} as const;

const FORMAT: Partial<Record<number, string>> = {
  [QC.count]: FORMATS.count,
  [QC.quantity]: '0.##',
  [QC.amps]: '0.0',
  [QC.rate]: '#,##0.00',
  [QC.cost]: '#,##0.00',
  [QC.subtotal]: '#,##0.00',
  [QC.unpriced]: FORMATS.count,
  [QC.u]: FORMATS.kv,
  [QC.fixed]: FORMATS.kvar,
  [QC.step]: FORMATS.kvar,
  [QC.steps]: FORMATS.count,
  [QC.p]: '0.00',
  [QC.uRated]: '0.0##',
  [QC.perKvar]: '0.0000',
  [QC.total]: FORMATS.kvar,
  [QC.reactor]: FORMATS.kvar,
  [QC.rateRow]: FORMATS.count,
  [QC.inSeries]: FORMATS.count,
  [QC.uCap]: FORMATS.kv,
};
const WIDTH: Partial<Record<number, number>> = { [QC.bus]: 22, [QC.item]: 26, [QC.what]: 48 };

export const QUANT_COLUMNS: readonly ColumnInfo[] = QUANT_HEADERS.map((header, c) => ({
  header,
  width: WIDTH[c] ?? Math.max(9, Math.min(header.length + 1, 14)),
  ...(FORMAT[c] ? { format: FORMAT[c] } : {}),
  computed: true,
}));

/**
 * The kinds of item, one line each in a bus's block, in the order an offer lists them. Stages are
 * counted by size: a line per stage size of STAGE_RATIOS (1, 2, 4, 8 smallest steps, the suffix
 * is its index) for capacitor units, detuning reactors and switching devices.
 */
export const SLOTS = [
  'stageCapacitors0',
  'stageCapacitors1',
  'stageCapacitors2',
  'stageCapacitors3',
  'fixedCapacitors',
  'stageDetuning0',
  'stageDetuning1',
  'stageDetuning2',
  'stageDetuning3',
  'fixedDetuning',
  'stageSwitching0',
  'stageSwitching1',
  'stageSwitching2',
  'stageSwitching3',
  'controller',
  'enclosure',
  'incomer',
  'discharge',
  'shuntReactor',
  'reactorSwitching',
] as const;
export type Slot = (typeof SLOTS)[number];

/** Rows per bus: the bus line and one per kind of item. */
export const BLOCK_ROWS = 1 + SLOTS.length;

/**
 * Row of bus i's bus line (0-based bus index). `origin` is the row of the first bus line: 1 on
 * this sheet (row 0 is the header); the Design options sheet lays the same blocks out lower down.
 */
export const busLineRow = (i: number, origin = 1) => origin + i * BLOCK_ROWS;
/** Row of an item line of bus i. */
export const slotRow = (i: number, slot: Slot, origin = 1) => busLineRow(i, origin) + 1 + SLOTS.indexOf(slot);

/** The totals below n buses' blocks (one blank row between), and the note after them. */
export const SUMMARY_LABELS = [
  'Currency',
  'Equipment',
  'Installation',
  'Engineering',
  'Contingency',
  'Total',
] as const;
export type SummaryLine = (typeof SUMMARY_LABELS)[number];
export function summaryRowOf(busCount: number, line: SummaryLine, origin = 1): number {
  return busLineRow(busCount, origin) + 1 + SUMMARY_LABELS.indexOf(line);
}
/** Rows of the whole generated block (header included) for n buses and `cases` cases. */
export function quantitiesExtent(busCount: number, cases: number): number {
  return busCount === 0 ? 1 : savingCaseRow(busCount, cases) + SAVING_LABELS.length;
}

/** Texts a cost or rate cell shows instead of a number. */
export const UNPRICED_TEXT = {
  noRate: 'no rate',
  otherUnit: 'rate in another unit',
  otherCurrency: 'rate in another currency',
  noQuantity: 'quantity unknown',
  total: 'unpriced',
} as const;

/** What it saves, below the note: a heading line, one line per case, then the yearly figures. */
export const SAVING_HEADINGS: Partial<Record<number, string>> = {
  [QC.bus]: 'What it saves',
  [QC.what]: 'per year, with the Tariff sheet',
  [QC.count]: 'Hours per year',
  [QC.quantity]: 'kvarh charged before',
  [QC.unit]: 'kvarh charged after',
  [QC.amps]: 'Excess kvar before',
  [QC.rate]: 'Excess kvar after',
  [QC.cost]: 'Losses saved (kWh)',
};
export const SAVING_LABELS = [
  'Reactive charge before',
  'Reactive charge after',
  'Losses saved',
  'Annual saving',
  'Simple payback (years)',
] as const;
export type SavingLine = (typeof SAVING_LABELS)[number];

/** Row of the saving block's heading line for n buses. */
export const savingHeadRow = (busCount: number, origin = 1) => summaryRowOf(busCount, 'Total', origin) + 4;
/** Row of case k's line. */
export const savingCaseRow = (busCount: number, k: number, origin = 1) =>
  savingHeadRow(busCount, origin) + 1 + k;
/** Row of a yearly figure, with `cases` case lines above. */
export const savingRowOf = (busCount: number, cases: number, line: SavingLine, origin = 1) =>
  savingCaseRow(busCount, cases, origin) + SAVING_LABELS.indexOf(line);
