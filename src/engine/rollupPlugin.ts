// The bus sums of the live workbook: BUS.SUM, BUS.SUM.ABS and BUS.SUM.DEL add up value columns
// over the rows whose bus column names a given bus (ignoring case, like SUMIF).
//
//   BUS.SUM(bus, bus_column_1, values_1, [bus_column_2, values_2, ...])   Σ values
//   BUS.SUM.ABS(...same...)                                              Σ of the positive values
//   BUS.SUM.DEL(...same...)                                              size of Σ of the negative ones
//
// Rows naming another bus, blanks and text count as nothing (as in SUMIF); an error value on a
// matching row is the result (the total cannot be known). The workbook passes each bus only the
// runs of rows that hold its items on each sheet (a lone row as a cell, a pair of cells), so an
// edit reaches its own bus and the buses above it; the export writes the same sums as
// SUMIF/SUMIFS over whole columns.
import { CellError, ErrorType, FunctionArgumentType, FunctionPlugin, SimpleRangeValue } from 'hyperformula';
import type { ImplementedFunctions } from 'hyperformula';
import { BUS_SUM } from '../core/workbook/busSums.ts';
import { ENGINE_LANGUAGE } from './config.ts';
import { cellStoreOf, sheetNameOf } from './internals.ts';
import type { OwnPlugin } from './plugins.ts';

/** For the app's formula help: not catalogue functions (no physics, not exported as such). */
export const ROLLUP_FUNCTION_DOCS: ReadonlyArray<{
  readonly name: string;
  readonly signature: string;
  readonly summary: string;
}> = [
  {
    name: BUS_SUM.all,
    signature: `${BUS_SUM.all}(bus, bus_column_1, values_1, [bus_column_2, values_2, ...])`,
    summary: 'The sum of the values on the rows whose bus column names the bus (ignoring case), like SUMIF.',
  },
  {
    name: BUS_SUM.absorbed,
    signature: `${BUS_SUM.absorbed}(bus, bus_column_1, values_1, ...)`,
    summary: 'As BUS.SUM, the positive values only (kvar absorbed).',
  },
  {
    name: BUS_SUM.delivered,
    signature: `${BUS_SUM.delivered}(bus, bus_column_1, values_1, ...)`,
    summary: 'As BUS.SUM, the size of the negative values only (kvar delivered).',
  },
];

/** A cell value as the kernel sees it: numbers, text, booleans, blanks (null) and errors. */
export type Cell = number | string | boolean | null | CellError;

export type Part = 'all' | 'absorbed' | 'delivered';

/** One pair of arguments: the bus name of each row and that row's value. */
export interface KeyedColumn {
  readonly height: number;
  key(row: number): Cell;
  value(row: number): Cell;
}

/** The comparison key of a bus name, ignoring case; a number names the bus of its text. */
export function busCellKey(v: Cell): string | undefined {
  if (typeof v === 'string') return v === '' ? undefined : v.toUpperCase();
  if (typeof v === 'number') return String(v);
  return undefined;
}

/** The kernel: the sum for one bus over every pair. Pure, tested directly. */
export function sumForBus(bus: Cell, pairs: readonly KeyedColumn[], part: Part): number | CellError {
  const want = busCellKey(bus);
  if (want === undefined) return 0;
  let total = 0;
  for (const pair of pairs) {
    for (let r = 0; r < pair.height; r++) {
      if (busCellKey(pair.key(r)) !== want) continue;
      const v = pair.value(r);
      if (v instanceof CellError) return v;
      if (typeof v !== 'number') continue;
      if (part === 'all') total += v;
      else if (part === 'absorbed' && v > 0) total += v;
      else if (part === 'delivered' && v < 0) total -= v;
    }
  }
  return total;
}

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

const fail = (fn: string, tail: string) => new CellError(ErrorType.VALUE, `${fn}: ${tail}`);

type Column = { readonly height: number; readonly read: (row: number) => Cell } | CellError;

export class BusRollupPlugin extends FunctionPlugin {
  static override implementedFunctions: ImplementedFunctions = {
    [BUS_SUM.all]: metadata('busSum'),
    [BUS_SUM.absorbed]: metadata('busSumAbsorbed'),
    [BUS_SUM.delivered]: metadata('busSumDelivered'),
  };

  busSum(node: CallNode, state: State): number | CellError {
    return this.sum(BUS_SUM.all, node, state, 'all');
  }
  busSumAbsorbed(node: CallNode, state: State): number | CellError {
    return this.sum(BUS_SUM.absorbed, node, state, 'absorbed');
  }
  busSumDelivered(node: CallNode, state: State): number | CellError {
    return this.sum(BUS_SUM.delivered, node, state, 'delivered');
  }

  private sum(fn: string, node: CallNode, state: State, part: Part): number | CellError {
    try {
      const args = node.args;
      if (args.length < 3 || args.length % 2 === 0) {
        return fail(fn, `takes a bus and then pairs of (bus column, values); got ${args.length} arguments`);
      }
      const bus: unknown = this.evaluateAst(args[0] as never, state as never);
      if (bus instanceof CellError) return bus;
      const pairs: KeyedColumn[] = [];
      for (let k = 1; k < args.length; k += 2) {
        const keys = this.column(fn, args[k] as ArgNode, state, k + 1, 'bus column');
        if (keys instanceof CellError) return keys;
        const values = this.column(fn, args[k + 1] as ArgNode, state, k + 2, 'values');
        if (values instanceof CellError) return values;
        if (values.height !== keys.height) {
          const where = this.where(args[k] as ArgNode, state);
          return fail(
            fn,
            `argument ${k + 2} (values) has ${values.height} rows but argument ${k + 1} (bus column${where}) has ${keys.height}; they must cover the same rows`,
          );
        }
        pairs.push({ height: keys.height, key: keys.read, value: values.read });
      }
      return sumForBus(asCell(bus), pairs, part);
    } catch (e) {
      return fail(fn, `internal error: ${e instanceof Error ? e.message : String(e)}`);
    }
  }

  private where(node: ArgNode, state: State): string {
    const b = blockOf(node, state);
    if (!b) return '';
    return ` on ${sheetNameOf(this, b.sheet) ?? `sheet ${b.sheet + 1}`}`;
  }

  /** A one-column argument, read straight from the engine's store when it is a plain range. */
  private column(fn: string, node: ArgNode, state: State, position: number, what: string): Column {
    const b = blockOf(node, state);
    const store = cellStoreOf(this);
    if (b && store) {
      if (b.width !== 1)
        return fail(fn, `argument ${position} (${what}) must be one column; got ${b.width} columns`);
      const address = { sheet: b.sheet, col: b.col, row: 0 };
      return {
        height: b.height,
        read: (row) => {
          address.row = b.row + row;
          return asCell(store(address));
        },
      };
    }
    // Anything but a plain range (a named range, a function's result): the engine's own copy.
    const v: unknown = this.evaluateAst(node as never, state as never);
    if (v instanceof CellError) return v;
    if (v instanceof SimpleRangeValue) {
      if (v.width() !== 1)
        return fail(fn, `argument ${position} (${what}) must be one column; got ${v.width()} columns`);
      const data = v.data;
      return { height: v.height(), read: (row) => asCell(data[row]?.[0]) };
    }
    const one = asCell(v);
    return { height: 1, read: () => one };
  }
}

function metadata(method: string) {
  return {
    method,
    // Ranges are read by the method itself; never spread a range into one call per cell.
    vectorizationForbidden: true,
    parameters: [
      { argumentType: FunctionArgumentType.ANY },
      { argumentType: FunctionArgumentType.RANGE },
      { argumentType: FunctionArgumentType.RANGE },
    ],
    repeatLastArgs: 2,
  };
}

export const BUS_ROLLUP_PLUGIN: OwnPlugin = {
  plugin: BusRollupPlugin,
  translations: {
    [ENGINE_LANGUAGE]: {
      [BUS_SUM.all]: BUS_SUM.all,
      [BUS_SUM.absorbed]: BUS_SUM.absorbed,
      [BUS_SUM.delivered]: BUS_SUM.delivered,
    },
  },
};
