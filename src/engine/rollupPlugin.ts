// The bus roll-up in one pass: BUS.SUMS and BUS.SUMS.SPLIT add up value columns per bus name
// for a list of buses and return the totals as an array that spills over the buses sheet.
//
//   BUS.SUMS(buses, bus_column_1, values_1, [bus_column_2, values_2, ...])
//     → one row per bus of `buses`, one column per column of the values: the sum of the
//       values on the rows whose bus column names that bus (names compared ignoring case,
//       like SUMIF; text and blank values count as nothing, like SUMIF).
//   BUS.SUMS.SPLIT(...same arguments...)
//     → two columns per value column: the sum of the positive values, then the size of the
//       sum of the negative ones (absorbed and delivered kvar in the load convention, both
//       shown as positive amounts, so value = first − second).
// Unlike SUMIF, a row that names a bus outside the list is an error, not silently left out: in
// the live workbook each bus sums the block of rows kept together for it, so a row whose bus
// was changed shows up at once. An error value on a row shows in its bus's cell of that column.
//
// Why per bus and not one call for all buses: the engine re-walks everything downstream of a
// changed cell. One array for all buses puts every bus formula downstream of every item (an
// edit of one motor then revisits the whole Buses sheet); one call per bus over that bus's rows
// keeps an edit to the item's own bus and the buses above it.
import {
  ArraySize,
  CellError,
  ErrorType,
  FunctionArgumentType,
  FunctionPlugin,
  SimpleRangeValue,
} from 'hyperformula';
import type { ImplementedFunctions } from 'hyperformula';
import { ENGINE_LANGUAGE } from './config.ts';
import type { OwnPlugin } from './plugins.ts';

export const BUS_SUMS = 'BUS.SUMS';
export const BUS_SUMS_SPLIT = 'BUS.SUMS.SPLIT';

/** For the app's formula help: these two are not catalogue functions (no physics, no export). */
export const ROLLUP_FUNCTION_DOCS: ReadonlyArray<{
  readonly name: string;
  readonly signature: string;
  readonly summary: string;
}> = [
  {
    name: BUS_SUMS,
    signature: 'BUS.SUMS(buses, bus_column_1, values_1, [bus_column_2, values_2, ...])',
    summary:
      'Per bus of the list, the sum of each value column over the rows naming that bus (ignoring case); a row naming another bus is an error. Spills one row per bus.',
  },
  {
    name: BUS_SUMS_SPLIT,
    signature: 'BUS.SUMS.SPLIT(buses, bus_column_1, values_1, [bus_column_2, values_2, ...])',
    summary:
      'As BUS.SUMS, with two columns per value column: the positive values summed (absorbed kvar) and the size of the negative ones (delivered kvar).',
  },
];

/** A cell value as the kernel sees it: numbers, text, booleans, blanks (null) and errors. */
export type Cell = number | string | boolean | null | CellError;

/** One pair of arguments: the bus name of each row and that row's value columns. */
export interface KeyedColumns {
  readonly height: number;
  readonly width: number;
  key(row: number): Cell;
  value(row: number, col: number): Cell;
  /** Where row r is, for messages, e.g. 'Motors row 153'. */
  where?(row: number): string;
}

/**
 * The comparison key of a bus name, ignoring case. A name like "1" that the engine read as a
 * number still matches (both sides are read the same way); blanks, booleans and errors name no bus.
 */
function busKey(v: Cell): string | undefined {
  if (typeof v === 'string') return v === '' ? undefined : v.toUpperCase();
  if (typeof v === 'number') return String(v);
  return undefined;
}

export type SumResult =
  { readonly ok: true; readonly rows: Cell[][] } | { readonly ok: false; readonly message: string };

function listText(buses: readonly Cell[]): string {
  const names = buses.filter((b) => busKey(b) !== undefined).map(String);
  return names.length <= 3 ? names.join(', ') : `${names.length} buses`;
}

/**
 * The kernel: totals per bus (rows of `buses`) for every value column, or per column the
 * positive part and the size of the negative part when `split`. Pure: no engine involved, so
 * it is tested directly. A row naming a bus outside the list makes the whole result an error.
 */
export function sumByBus(buses: readonly Cell[], pairs: readonly KeyedColumns[], split: boolean): SumResult {
  const width = pairs[0]?.width ?? 0;
  const index = new Map<string, number[]>();
  buses.forEach((b, i) => {
    const key = busKey(b);
    if (key === undefined) return;
    const list = index.get(key) ?? [];
    list.push(i);
    index.set(key, list);
  });
  const outWidth = split ? 2 * width : width;
  const out: Cell[][] = buses.map(() => new Array<Cell>(outWidth).fill(0));
  for (let k = 0; k < pairs.length; k++) {
    const pair = pairs[k] as KeyedColumns;
    for (let r = 0; r < pair.height; r++) {
      const name = pair.key(r);
      const key = busKey(name);
      if (key === undefined) continue;
      const targets = index.get(key);
      if (targets === undefined) {
        const where = pair.where?.(r) ?? `argument ${2 * k + 2}, row ${r + 1}`;
        return {
          ok: false,
          message:
            `${where} names bus "${String(name)}", which is not among the buses summed here (${listText(buses)}); ` +
            'correct the bus name, or rebuild the workbook if the item moved to another bus',
        };
      }
      for (let c = 0; c < width; c++) {
        const v = pair.value(r, c);
        if (v instanceof CellError) {
          for (const t of targets) {
            const row = out[t] as Cell[];
            if (split) row[2 * c] = row[2 * c + 1] = v;
            else row[c] = v;
          }
          continue;
        }
        if (typeof v !== 'number' || v === 0) continue;
        const col = split ? 2 * c + (v > 0 ? 0 : 1) : c;
        const amount = split && v < 0 ? -v : v;
        for (const t of targets) {
          const row = out[t] as Cell[];
          const prev = row[col];
          if (typeof prev === 'number') row[col] = prev + amount;
        }
      }
    }
  }
  return { ok: true, rows: out };
}

/** What we read of the engine's argument nodes. */
interface ArgNode {
  readonly type: string;
  readonly start?: { toSimpleCellAddress(base: unknown): { sheet: number; col: number; row: number } };
  readonly end?: { toSimpleCellAddress(base: unknown): { sheet: number; col: number; row: number } };
}
interface CallNode {
  readonly args: readonly ArgNode[];
}
interface State {
  readonly formulaAddress: unknown;
}
interface Block {
  readonly sheet: number;
  readonly col: number;
  readonly row: number;
  readonly width: number;
  readonly height: number;
}
/** The engine's cell store, as far as we use it (a stable method of its dependency graph). */
interface CellStore {
  getCellValue(address: { sheet: number; col: number; row: number }): unknown;
}

function blockOf(node: ArgNode, state: State): Block | undefined {
  if (node.type !== 'CELL_RANGE' || !node.start || !node.end) return undefined;
  const s = node.start.toSimpleCellAddress(state.formulaAddress);
  const e = node.end.toSimpleCellAddress(state.formulaAddress);
  if (s.sheet !== e.sheet) return undefined;
  return {
    sheet: s.sheet,
    col: Math.min(s.col, e.col),
    row: Math.min(s.row, e.row),
    width: Math.abs(e.col - s.col) + 1,
    height: Math.abs(e.row - s.row) + 1,
  };
}

function asCell(v: unknown): Cell {
  if (v instanceof CellError) return v;
  if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean') return v;
  if (typeof v === 'object' && v !== null && typeof (v as { val?: unknown }).val === 'number')
    return (v as { val: number }).val;
  return null;
}

/** Reads a block straight from the engine's cell store: no copy of the range is made. */
function storeReader(store: CellStore, b: Block): (row: number, col: number) => Cell {
  const address = { sheet: b.sheet, col: 0, row: 0 };
  return (row, col) => {
    address.col = b.col + col;
    address.row = b.row + row;
    return asCell(store.getCellValue(address));
  };
}

function valueReader(v: SimpleRangeValue): (row: number, col: number) => Cell {
  const data = v.data;
  return (row, col) => asCell(data[row]?.[col]);
}

const fail = (fn: string, tail: string) => new CellError(ErrorType.VALUE, `${fn}: ${tail}`);

export class BusRollupPlugin extends FunctionPlugin {
  static override implementedFunctions: ImplementedFunctions = {
    [BUS_SUMS]: metadata('busSums', 'busSumsSize'),
    [BUS_SUMS_SPLIT]: metadata('busSumsSplit', 'busSumsSplitSize'),
  };

  busSums(node: CallNode, state: State): SimpleRangeValue | CellError {
    return this.rollUp(BUS_SUMS, node, state, false);
  }
  busSumsSplit(node: CallNode, state: State): SimpleRangeValue | CellError {
    return this.rollUp(BUS_SUMS_SPLIT, node, state, true);
  }
  busSumsSize(node: CallNode, state: State): ArraySize {
    return this.resultSize(node, state, 1);
  }
  busSumsSplitSize(node: CallNode, state: State): ArraySize {
    return this.resultSize(node, state, 2);
  }

  /** The spill size must be known before evaluation: rows of the bus list × value columns. */
  private resultSize(node: CallNode, state: State, perColumn: number): ArraySize {
    const [buses, , values] = node.args;
    if (!buses || !values) return ArraySize.error();
    const b = this.arraySizeForAst(buses as never, state as never);
    const v = this.arraySizeForAst(values as never, state as never);
    return new ArraySize(v.width * perColumn, b.height);
  }

  private rollUp(fn: string, node: CallNode, state: State, split: boolean): SimpleRangeValue | CellError {
    try {
      const args = node.args;
      if (args.length < 3 || args.length % 2 === 0) {
        return fail(
          fn,
          `takes a bus list and then pairs of (bus column, values); got ${args.length} arguments`,
        );
      }
      const buses = this.column(fn, args[0] as ArgNode, state, 1, 'bus list');
      if (buses instanceof CellError) return buses;
      const pairs: KeyedColumns[] = [];
      for (let k = 1; k < args.length; k += 2) {
        const keys = this.column(fn, args[k] as ArgNode, state, k + 1, 'bus column');
        if (keys instanceof CellError) return keys;
        const values = this.block(args[k + 1] as ArgNode, state);
        if (values instanceof CellError) return values;
        const first = pairs[0];
        if (values.height !== keys.length) {
          return fail(
            fn,
            `argument ${k + 2} (values) has ${values.height} rows but argument ${k + 1} (bus column) has ${keys.length}; they must cover the same rows`,
          );
        }
        if (first && values.width !== first.width) {
          return fail(
            fn,
            `argument ${k + 2} (values) has ${values.width} columns but argument 3 has ${first.width}; every values range must have as many columns`,
          );
        }
        const where = this.rowLabel(args[k] as ArgNode, state);
        pairs.push({
          height: values.height,
          width: values.width,
          key: (r) => keys[r] ?? null,
          value: values.read,
          ...(where ? { where } : {}),
        });
      }
      const result = sumByBus(buses, pairs, split);
      if (!result.ok) return new CellError(ErrorType.NA, `${fn}: ${result.message}`);
      return SimpleRangeValue.onlyValues(result.rows as never);
    } catch (e) {
      return fail(fn, `internal error: ${e instanceof Error ? e.message : String(e)}`);
    }
  }

  /** 'Motors row 153' for row r of a plain range argument (the sheet's name when the engine tells it). */
  private rowLabel(node: ArgNode, state: State): ((row: number) => string) | undefined {
    const b = blockOf(node, state);
    if (!b) return undefined;
    let sheet = `sheet ${b.sheet + 1}`;
    try {
      const name = (
        this as unknown as {
          dependencyGraph?: { sheetMapping?: { getSheetName?(id: number): string | undefined } };
        }
      ).dependencyGraph?.sheetMapping?.getSheetName?.(b.sheet);
      if (typeof name === 'string') sheet = name;
    } catch {
      // keep the number
    }
    return (row) => `${sheet} row ${b.row + row + 1}`;
  }

  /** A one-column argument as a list of cells. */
  private column(
    fn: string,
    node: ArgNode,
    state: State,
    position: number,
    what: string,
  ): Cell[] | CellError {
    const b = this.block(node, state);
    if (b instanceof CellError) return b;
    if (b.width !== 1)
      return fail(fn, `argument ${position} (${what}) must be one column; got ${b.width} columns`);
    const out: Cell[] = new Array<Cell>(b.height);
    for (let r = 0; r < b.height; r++) out[r] = b.read(r, 0);
    return out;
  }

  private block(
    node: ArgNode,
    state: State,
  ): { width: number; height: number; read: (row: number, col: number) => Cell } | CellError {
    const store = (this as unknown as { dependencyGraph?: Partial<CellStore> }).dependencyGraph;
    const b = blockOf(node, state);
    if (b && store && typeof store.getCellValue === 'function') {
      return { width: b.width, height: b.height, read: storeReader(store as CellStore, b) };
    }
    // Anything but a plain range (a named range, a function's result): the engine's own copy.
    const v: unknown = this.evaluateAst(node as never, state as never);
    if (v instanceof CellError) return v;
    if (v instanceof SimpleRangeValue) return { width: v.width(), height: v.height(), read: valueReader(v) };
    const one = asCell(v);
    return { width: 1, height: 1, read: () => one };
  }
}

function metadata(method: string, sizeMethod: string) {
  return {
    method,
    sizeOfResultArrayMethod: sizeMethod,
    // Ranges are read by the method itself; never spread a range into one call per cell.
    vectorizationForbidden: true,
    parameters: [
      { argumentType: FunctionArgumentType.RANGE },
      { argumentType: FunctionArgumentType.RANGE },
      { argumentType: FunctionArgumentType.RANGE },
    ],
    repeatLastArgs: 2,
  };
}

export const BUS_ROLLUP_PLUGIN: OwnPlugin = {
  plugin: BusRollupPlugin,
  translations: { [ENGINE_LANGUAGE]: { [BUS_SUMS]: BUS_SUMS, [BUS_SUMS_SPLIT]: BUS_SUMS_SPLIT } },
};
