// The bus sums of the live workbook: BUS.SUM, BUS.SUM.ABS and BUS.SUM.DEL add up the runs of
// rows that hold one bus's items on each sheet.
//
//   BUS.SUM(values_1, [values_2, ...])        Σ values
//   BUS.SUM.ABS(values_1, [values_2, ...])    Σ of the positive values
//   BUS.SUM.DEL(values_1, [values_2, ...])    size of Σ of the negative ones
//
// The living model (src/ui/model/siteModel.ts) passes each bus exactly the rows that name it (a
// lone row as a cell, a run of rows as a range) and writes the sums again whenever those rows
// change, so an edit reaches its own bus and the buses above it only. Blanks and text count as
// nothing; an error value is the result (the total cannot be known). The export writes the same
// sums as SUMIF/SUMIFS over whole columns, which every program reads.
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
    signature: `${BUS_SUM.all}(values_1, [values_2, ...])`,
    summary: "The sum of a bus's own rows: one argument per run of rows that name the bus, on each sheet.",
  },
  {
    name: BUS_SUM.absorbed,
    signature: `${BUS_SUM.absorbed}(values_1, [values_2, ...])`,
    summary: 'As BUS.SUM, the positive values only (kvar absorbed).',
  },
  {
    name: BUS_SUM.delivered,
    signature: `${BUS_SUM.delivered}(values_1, [values_2, ...])`,
    summary: 'As BUS.SUM, the size of the negative values only (kvar delivered).',
  },
];

/** A cell value as the kernel sees it: numbers, text, booleans, blanks (null) and errors. */
export type Cell = number | string | boolean | null | CellError;

export type Part = 'all' | 'absorbed' | 'delivered';

/** One argument: a column of values. */
export interface ValueColumn {
  readonly height: number;
  value(row: number): Cell;
}

/** The kernel: the sum over every column. Pure, tested directly. */
export function sumOfRuns(columns: readonly ValueColumn[], part: Part): number | CellError {
  let total = 0;
  for (const column of columns) {
    for (let r = 0; r < column.height; r++) {
      const v = column.value(r);
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
      const columns: ValueColumn[] = [];
      for (let k = 0; k < node.args.length; k++) {
        const values = this.column(fn, node.args[k] as ArgNode, state, k + 1, 'values');
        if (values instanceof CellError) return values;
        columns.push({ height: values.height, value: values.read });
      }
      return sumOfRuns(columns, part);
    } catch (e) {
      return fail(fn, `internal error: ${e instanceof Error ? e.message : String(e)}`);
    }
  }

  /** A one-column argument, read straight from the engine's store when it is a plain range. */
  private column(fn: string, node: ArgNode, state: State, position: number, what: string): Column {
    const b = blockOf(node, state);
    const store = cellStoreOf(this);
    if (b && store) {
      if (b.width !== 1) {
        const sheet = sheetNameOf(this, b.sheet) ?? `sheet ${b.sheet + 1}`;
        return fail(
          fn,
          `argument ${position} (${what} on ${sheet}) must be one column; got ${b.width} columns`,
        );
      }
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
    parameters: [{ argumentType: FunctionArgumentType.RANGE }],
    repeatLastArgs: 1,
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
