// What each bus's own items add up to: the only formulas that look items up by bus name. The
// live workbook (the page) uses the engine's BUS.SUM functions over the runs of consecutive rows
// that hold the bus's items on each sheet, so an edit reaches its own bus and the buses above it
// only, and the engine tracks each item row once (not every row of a span that other buses' rows
// stretch: 500 rows pasted over 300 buses made every bus depend on almost the whole sheet). The
// runs are found here by bus name and written again whenever they change, so the sums take the
// value columns alone (half the references to read when a paste rewrites every bus's sums). The
// exported workbook uses classic conditional sums over whole columns, which every program reads
// and which count a row a colleague adds at the bottom.
import type { EquipmentColumns } from './equipmentColumns.ts';
import { absCell, cellOn, columnOn, rangeOn, textLiteral } from './refs.ts';
import type { WorkbookStructure } from './structure.ts';
import { busKey } from '../site/busNames.ts';

/** Names of the engine's bus-sum functions (src/engine registers them under these names). */
export const BUS_SUM = { all: 'BUS.SUM', absorbed: 'BUS.SUM.ABS', delivered: 'BUS.SUM.DEL' } as const;

export type Flavour = 'live' | 'portable';

/** First and last cell row of consecutive rows that hold one bus's items on one sheet. */
export interface Run {
  readonly first: number;
  readonly last: number;
}

/** Per bus key, per equipment sheet index, the runs of rows that name the bus, top to bottom. */
export type BusRowIndex = ReadonlyMap<string, ReadonlyMap<number, readonly Run[]>>;

export function busRowIndex(s: WorkbookStructure): BusRowIndex {
  const out = new Map<string, Map<number, Run[]>>();
  for (const sheet of s.sheets) {
    if (sheet.cols.role !== 'shunt') continue;
    sheet.rows.forEach((r, i) => {
      if (!r.present || r.bus === '') return;
      const key = busKey(r.bus);
      let bySheet = out.get(key);
      if (!bySheet) out.set(key, (bySheet = new Map<number, Run[]>()));
      let runs = bySheet.get(sheet.index);
      if (!runs) bySheet.set(sheet.index, (runs = []));
      const row = i + 1;
      const lastRun = runs[runs.length - 1];
      if (lastRun && lastRun.last === row - 1) runs[runs.length - 1] = { first: lastRun.first, last: row };
      else runs.push({ first: row, last: row });
    });
  }
  return out;
}

/**
 * SUMIF criterion for a bus: the name cell, or an exact-match text when the name holds pattern
 * characters (* ? ~). Undefined for a name starting with < > or =, which conditional sums read
 * as a comparison: such a bus sums its own span of rows instead.
 */
export function criterion(name: string, nameCell: string): string | undefined {
  if (/^[<>=]/.test(name)) return undefined;
  if (/^[A-Za-z0-9 _.\-/]+$/.test(name)) return nameCell;
  return textLiteral('=' + name.replace(/[~*?]/g, (c) => '~' + c));
}

interface SumTerm {
  readonly cols: EquipmentColumns;
  readonly runs: readonly Run[];
  readonly valueCol: number;
}

/** One column's rows of a run: a cell for a run of one row (the engine tracks a cell most cheaply). */
function runRef(sheet: string, run: Run, col: number): string {
  return run.first === run.last
    ? cellOn(sheet, run.first, col, true)
    : rangeOn(sheet, run.first, col, run.last, col);
}

function terms(
  s: WorkbookStructure,
  busRows: BusRowIndex,
  key: string,
  pick: (c: EquipmentColumns) => number | undefined,
): SumTerm[] {
  const bySheet = busRows.get(key);
  const out: SumTerm[] = [];
  for (const sheet of s.sheets) {
    const valueCol = sheet.cols.role === 'shunt' ? pick(sheet.cols) : undefined;
    if (valueCol !== undefined)
      out.push({ cols: sheet.cols, runs: bySheet?.get(sheet.index) ?? [], valueCol });
  }
  return out;
}

/**
 * One bus's own items: the sum of one computed column over its rows on every sheet that has it.
 * `part`: all values, the positive ones (absorbed kvar), or the size of the negative ones (delivered).
 */
export function ownSum(
  s: WorkbookStructure,
  busRows: BusRowIndex,
  flavour: Flavour,
  bus: { name: string; nameCell: string },
  pick: (c: EquipmentColumns) => number | undefined,
  part: 'all' | 'absorbed' | 'delivered',
  /** Portable 'delivered': the cell holding this bus's absorbed sum. */
  absorbedCell?: string,
): string {
  const list = terms(s, busRows, busKey(bus.name), pick);
  if (flavour === 'live') {
    // Built in one pass: a paste over every bus writes some 2,000 of these at once.
    let args = '';
    for (const t of list) {
      const sheet = t.cols.sheet.name;
      for (const run of t.runs) args += `,${runRef(sheet, run, t.valueCol)}`;
    }
    return args === '' ? '=0' : `=${BUS_SUM[part]}(${args.slice(1)})`;
  }
  const portable = (positive: boolean) => portableSum(list, bus, positive);
  if (part === 'all') return `=${portable(false)}`;
  if (part === 'absorbed') return `=${portable(true)}`;
  // Delivered = absorbed − net: the net SUMIF passes on an error value where SUMIFS may skip it.
  return `=${absorbedCell ?? portable(true)}-(${portable(false)})`;
}

function portableSum(
  list: readonly SumTerm[],
  bus: { name: string; nameCell: string },
  positive: boolean,
): string {
  const crit = criterion(bus.name, bus.nameCell);
  const parts = list.flatMap((t) => {
    const sheet = t.cols.sheet.name;
    if (crit === undefined) {
      return t.runs.map((run) => {
        const vals = runRef(sheet, run, t.valueCol);
        return positive ? `SUMIF(${vals},">0")` : `SUM(${vals})`;
      });
    }
    const keys = columnOn(sheet, t.cols.input.get('bus') as number);
    const vals = columnOn(sheet, t.valueCol);
    return [positive ? `SUMIFS(${vals},${keys},${crit},${vals},">0")` : `SUMIF(${keys},${crit},${vals})`];
  });
  return parts.length === 0 ? '0' : parts.join('+');
}

/** The bus-name cell a sum refers to, fixed in place: $A$5. */
export function nameCellOf(row: number): string {
  return absCell(row, 0);
}
