// The "Quantities and cost" sheet: per bus of the Compensation sheet, the bank as the items read
// it (bus line), its countable items (quantityFormulas.ts), each priced from the Rates sheet; then
// the equipment sum, the surcharges and the total. All plain formulas over the Compensation and
// Rates sheets, so every edit reaches the cost in the same step. An item without a usable rate
// shows why instead of a number, and the totals then say "unpriced", never a smaller sum.
import { controllerStepsFormula } from './renderCompensation.ts';
import { RATES_SHEET } from '../quote/index.ts';
import { textContent } from '../text/cellText.ts';
import type { BankInputKey, CompensationColumns } from './compensationColumns.ts';
import type { CellContent } from './document.ts';
import { SHEETS } from './layout.ts';
import {
  QC,
  QUANT_COLUMNS,
  SLOTS,
  SUMMARY_LABELS,
  UNPRICED_TEXT,
  busLineRow,
  slotRow,
  summaryRowOf,
} from './quantitiesLayout.ts';
import { itemCells, itemRow } from './quantityFormulas.ts';
import { savingRows } from './renderSaving.ts';
import { absCell, cell, cellOn, rangeOn, sheetPrefix } from './refs.ts';
import { settingRef } from './settingsLayout.ts';
import type { WorkbookStructure } from './structure.ts';

export interface QuantitiesInput {
  readonly s: WorkbookStructure;
  readonly comp: CompensationColumns;
  /** Does the workbook have a Rates sheet? Without one every item shows "no rate". */
  readonly hasRates: boolean;
  /** Does it have a Tariff sheet? Without one the saving is 0. */
  readonly hasTariff: boolean;
}

/** What pricing needs to know of the workbook. */
export interface Priced {
  /** Does the workbook have a Rates sheet? Without one every item shows "no rate". */
  readonly hasRates: boolean;
}

const WIDTH = QUANT_COLUMNS.length;
const q = (t: string) => `"${t}"`;

/** A number typed in an input cell, else 0 (blank, text); never below 0. */
const nonNegative = (ref: string) => `MAX(0,IF(ISNUMBER(${ref}),${ref},0))`;

/** Where a bank's bus line sits and where it reads the bank from (this sheet, or an option's block). */
export interface BankLinePlace {
  /** Row of the bus line. */
  readonly row: number;
  /** Row of the last item line below it. */
  readonly lastRow: number;
  readonly busName: CellContent;
  /** The bus voltage, kV. */
  readonly u: string;
  /** A bank input cell (the Compensation sheet's, or the option's own). */
  readonly inp: (key: BankInputKey) => string;
}

/** The bank as the items read it, on its bus line. */
export function bankLine(place: BankLinePlace): CellContent[] {
  const { inp } = place;
  const r = place.row;
  const here = (col: number) => cell(r, col);
  const out = new Array<CellContent>(WIDTH).fill(null);
  out[QC.bus] = place.busName;
  const [u, total, reactor] = [here(QC.u), here(QC.total), here(QC.reactor)];
  const known = `AND(ISNUMBER(${u}),${u}>0)`;
  out[QC.u] = `=${place.u}`;
  out[QC.fixed] = `=${nonNegative(inp('fixed_kvar'))}`;
  // A step counts with a whole number of steps above zero, as the core reads a bank (bankSpec.ts).
  const [st, n] = [inp('step_kvar'), inp('steps')];
  out[QC.step] = `=IF(AND(ISNUMBER(${st}),ISNUMBER(${n})),IF(AND(${st}>0,INT(${n})>0),${st},0),0)`;
  out[QC.steps] = `=IF(${here(QC.step)}>0,INT(${n}),0)`;
  out[QC.p] = `=${nonNegative(inp('p_pct'))}`;
  const ur = inp('u_rated_kv');
  const hz = settingRef('hzInUse');
  // As typed, else the design's rating by its one rule for the voltage across the capacitors
  // (CAPBANK.URATED, as bankSpec.ts takes it).
  const uCap = here(QC.uCap);
  out[QC.uCap] = `=IF(${known},IFERROR(CAPBANK.UCAP(${u},${here(QC.p)}),""),"")`;
  out[QC.uRated] =
    `=IF(AND(ISNUMBER(${ur}),${ur}>0),${ur},IF(ISNUMBER(${uCap}),IFERROR(CAPBANK.URATED(${uCap},${hz}),""),""))`;
  out[QC.inSeries] = `=IF(${here(QC.uRated)}="","",CAPBANK.USERIES(${here(QC.uRated)},${hz}))`;
  // Nameplate kvar at the rated voltage per kvar of output at the bus: the Compensation sheet's
  // step nameplate rule, 1 / |KVAR.CAPBANK(1, Ur, U, p, f, f)|.
  out[QC.perKvar] =
    `=IF(OR(${here(QC.uRated)}="",NOT(${known})),"",IFERROR(1/ABS(KVAR.CAPBANK(1,${here(QC.uRated)},${u},${here(QC.p)},${hz},${hz})),""))`;
  // Steps are physical stages; capacitors follow the controller step count of their series.
  const ctrl = controllerStepsFormula(inp('series'), here(QC.steps)).slice(1);
  out[QC.total] = `=${here(QC.fixed)}+${here(QC.step)}*${ctrl}`;
  out[QC.reactor] = `=${nonNegative(inp('reactor_kvar'))}`;
  out[QC.what] =
    `=IF(${total}+${reactor}=0,"no bank or reactor chosen",IF(${known},"bank "&ROUND(${total},2)&" kvar"&IF(${reactor}>0,", reactor "&ROUND(${reactor},2)&" kvar","")&" at "&ROUND(${u},3)&" kV","the voltage of the bus is unknown: state u_kv on a row of the bus"))`;
  out[QC.unpriced] = `=IF(AND(NOT(${known}),${total}+${reactor}>0),1,0)`;
  out[QC.subtotal] =
    `=IF(SUM(${rangeOn(undefined, r, QC.unpriced, place.lastRow, QC.unpriced)})>0,"${UNPRICED_TEXT.total}",SUM(${rangeOn(undefined, r + 1, QC.cost, place.lastRow, QC.cost)}))`;
  return out;
}

function busLine(input: QuantitiesInput, i: number): CellContent[] {
  const compRow = i + 1;
  const b = input.s.buses[i];
  return bankLine({
    row: busLineRow(i),
    lastRow: slotRow(i, SLOTS[SLOTS.length - 1] as (typeof SLOTS)[number]),
    busName: b ? textContent(b.name) : null,
    u: cellOn(SHEETS.compensation, compRow, input.comp.u, true),
    inp: (key) => cellOn(SHEETS.compensation, compRow, input.comp.input[key], true),
  });
}

/**
 * The rate of the item in column Item, from the Rates sheet (item, unit, rate, currency): the row
 * is found once, by MATCH in the Rates row column, and Rate reads that row's cells by INDEX. One
 * lookup per line instead of one per field keeps the sheet cheap to build and recalculate.
 */
function rateFormulas(input: Priced, row: number, currency: string): [string | null, string] {
  const item = cell(row, QC.item);
  if (!input.hasRates) return [null, `=IF(${item}="","",${q(UNPRICED_TEXT.noRate)})`];
  const rates = sheetPrefix(RATES_SHEET);
  const at = cell(row, QC.rateRow);
  const field = (col: string) => `INDEX(${rates}$${col}:$${col},${at})`;
  const [unit, rate, cur] = [field('B'), field('C'), field('D')];
  return [
    `=IF(${item}="","",IFERROR(MATCH(${item},${rates}$A:$A,0),""))`,
    `=IF(${item}="","",IF(${at}="",${q(UNPRICED_TEXT.noRate)},IFERROR(IF(${unit}<>${cell(row, QC.unit)},${q(UNPRICED_TEXT.otherUnit)},IF(${cur}<>${currency},${q(UNPRICED_TEXT.otherCurrency)},IF(AND(ISNUMBER(${rate}),${rate}>=0),${rate},${q(UNPRICED_TEXT.noRate)}))),${q(UNPRICED_TEXT.noRate)})))`,
  ];
}

function pricing(out: CellContent[], input: Priced, row: number, currency: string): void {
  const [item, quantity, rate, cost] = [
    cell(row, QC.item),
    cell(row, QC.quantity),
    cell(row, QC.rate),
    cell(row, QC.cost),
  ];
  out[QC.unit] = `=IF(${item}="","",${q(out[QC.unit] as string)})`;
  [out[QC.rateRow], out[QC.rate]] = rateFormulas(input, row, currency);
  out[QC.cost] =
    `=IF(${item}="","",IF(NOT(ISNUMBER(${quantity})),${q(UNPRICED_TEXT.noQuantity)},IF(ISNUMBER(${rate}),${quantity}*${rate},${rate})))`;
  out[QC.unpriced] = `=IF(${item}="",0,IF(ISNUMBER(${cost}),0,1))`;
}

/** A surcharge's percentage from the Rates sheet's "%" row of that name; 0 when there is none. */
function surchargePct(input: Priced, name: string): string {
  if (!input.hasRates) return '=0';
  const table = `${sheetPrefix(RATES_SHEET)}$A:$E`;
  const look = (col: number) => `VLOOKUP("${name}",${table},${col},FALSE)`;
  return `=IFERROR(IF(AND(${look(2)}="%",ISNUMBER(${look(3)})),${look(3)},0),0)`;
}

/** Equipment, surcharges and total below n buses' blocks whose first bus line is at `origin`; then the note. */
export function costSummary(input: Priced, n: number, origin = 1): CellContent[][] {
  const row = (line: (typeof SUMMARY_LABELS)[number]) => summaryRowOf(n, line, origin);
  const amount = (line: (typeof SUMMARY_LABELS)[number]) => cell(row(line), QC.cost);
  const pct = (line: (typeof SUMMARY_LABELS)[number]) => cell(row(line), QC.rate);
  const lastBlockRow = busLineRow(n, origin) - 1;
  const eq = amount('Equipment');
  const unpriced = q(UNPRICED_TEXT.total);
  const lines: CellContent[][] = [new Array<CellContent>(WIDTH).fill(null)];
  for (const label of SUMMARY_LABELS) {
    const out = new Array<CellContent>(WIDTH).fill(null);
    out[QC.bus] = label;
    if (label === 'Currency')
      out[QC.cost] = input.hasRates
        ? `=IF(ISBLANK(${cellOn(RATES_SHEET, 1, 3, true)}),"",${cellOn(RATES_SHEET, 1, 3, true)})`
        : null;
    else if (label === 'Equipment')
      out[QC.cost] =
        `=IF(SUM(${rangeOn(undefined, origin, QC.unpriced, lastBlockRow, QC.unpriced)})>0,${unpriced},SUM(${rangeOn(undefined, origin, QC.cost, lastBlockRow, QC.cost)}))`;
    else if (label === 'Installation' || label === 'Engineering') {
      out[QC.rate] = surchargePct(input, label);
      out[QC.what] = `=ROUND(${pct(label)},2)&" % of the equipment"`;
      out[QC.cost] = `=IF(ISNUMBER(${eq}),${eq}*${pct(label)}/100,${unpriced})`;
    } else if (label === 'Contingency') {
      out[QC.rate] = surchargePct(input, label);
      out[QC.what] = `=ROUND(${pct(label)},2)&" % of equipment, installation and engineering"`;
      out[QC.cost] =
        `=IF(ISNUMBER(${eq}),(${eq}+${amount('Installation')}+${amount('Engineering')})*${pct(label)}/100,${unpriced})`;
    } else
      out[QC.cost] =
        `=IF(ISNUMBER(${eq}),${eq}+${amount('Installation')}+${amount('Engineering')}+${amount('Contingency')},${unpriced})`;
    lines.push(out);
  }
  const note = new Array<CellContent>(WIDTH).fill(null);
  note[QC.bus] = QUANTITIES_NOTE;
  lines.push(new Array<CellContent>(WIDTH).fill(null), note);
  return lines;
}

/** The priced item lines below bus i's bus line, one per slot; `currency` is the quote's currency cell. */
export function itemLines(input: Priced, i: number, currency: string, origin = 1): CellContent[][] {
  return SLOTS.map((slot) => {
    const row = slotRow(i, slot, origin);
    const out = itemRow(itemCells(slot, row, busLineRow(i, origin)), WIDTH);
    pricing(out, input, row, currency);
    return out;
  });
}

/** Every generated cell of the sheet: header, one block per bus, totals and the note. */
export function renderQuantitiesSheet(input: QuantitiesInput): CellContent[][] {
  const n = input.s.buses.length;
  const cells: CellContent[][] = [QUANT_COLUMNS.map((c) => c.header)];
  if (n === 0) return cells;
  const currency = absCell(summaryRowOf(n, 'Currency'), QC.cost);
  for (let i = 0; i < n; i++) {
    cells.push(busLine(input, i));
    cells.push(...itemLines(input, i, currency));
  }
  cells.push(...costSummary(input, n), ...savingRows(n, input.s.cases, input.hasTariff));
  return cells;
}

export const QUANTITIES_NOTE =
  "Estimate only: common practice sizing (README); the maker's offer, local codes, the utility and a licensed engineer decide. INVENTED demo rates are no prices.";

export const QUANTITIES_PURPOSE = `Per bus: the bank as the items read it, its countable items priced at the ${RATES_SHEET} sheet's rates; then equipment, surcharges, total, and what it saves with the Tariff sheet. A line without a usable rate says why; the totals then say "unpriced".`;
