// What the generated parts of a workbook depend on, read from the cells users type: for every
// equipment row whether it is an item, its kind, bus, fed bus and voltage; the cases; and from
// those the buses in order with what feeds them. Two workbooks with the same structure have the
// same generated formulas, so the page compares structures to know what to rewrite after an edit.
import { equipmentSheets, findKind, type KindSpec } from '../kinds/index.ts';
import { buildBusGraph } from '../site/graph.ts';
import { busKey, unifyBusNames } from '../site/busNames.ts';
import type { EquipmentRow } from '../site/model.ts';
import { busVoltages } from '../site/voltages.ts';
import { soleMotorOf } from '../site/individualCompensation.ts';
import type { CellContent } from './document.ts';
import { shownText } from '../text/cellText.ts';
import { planEquipmentColumns, type EquipmentColumns } from './equipmentColumns.ts';

/** A cell's value: typed content, or what a formula evaluates to when the caller can tell. */
export type ValueOf = (row: number, col: number, content: CellContent) => CellContent;

export interface RowInfo {
  /** Any input cell filled in: the row is an item and gets its computed columns. */
  readonly present: boolean;
  /** The kind (single-kind sheets: the sheet's; others: the Kind cell), undefined when not one of the sheet's. */
  readonly kind: KindSpec | undefined;
  readonly tag: string;
  readonly bus: string;
  readonly toBus: string;
  readonly u: number | undefined;
}

export const BLANK_ROW: RowInfo = Object.freeze({
  present: false,
  kind: undefined,
  tag: '',
  bus: '',
  toBus: '',
  u: undefined,
});

export interface SheetStructure {
  /** Position among the equipment sheets. */
  readonly index: number;
  readonly cols: EquipmentColumns;
  /** rows[i] is cell row i + 1 (row 0 is the header). */
  readonly rows: readonly RowInfo[];
}

export interface RowRef {
  readonly sheet: number;
  /** Cell row (0-based, header = 0). */
  readonly row: number;
}

export interface BusInfo {
  readonly name: string;
  readonly key: string;
  /** 0 at the point of connection; undefined for a bus the tree does not reach. */
  readonly level: number | undefined;
  readonly feeder?: RowRef;
  readonly upstream?: string;
  /** The row whose u_kv gives the bus voltage. */
  readonly voltage?: RowRef;
  /** One motor and capacitors only: a bank here is the motor's own and switches with it. */
  readonly soleMotor?: true;
}

export interface WorkbookStructure {
  readonly cases: readonly string[];
  readonly sheets: readonly SheetStructure[];
  /** Point of connection first, then level by level, then buses the tree misses. */
  readonly buses: readonly BusInfo[];
  /** Bus key → index in `buses`. */
  readonly busIndex: ReadonlyMap<string, number>;
}

function text(v: CellContent): string {
  if (v === null) return '';
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  return (typeof v === 'string' ? shownText(v) : String(v)).trim();
}

function blank(v: CellContent): boolean {
  return v === null || (typeof v === 'string' && v.trim() === '');
}

/** The equipment sheets for a list of cases, with their column plans. */
export function equipmentPlans(cases: readonly string[]): EquipmentColumns[] {
  return equipmentSheets().map((s) => planEquipmentColumns(s.sheet, s.kinds, cases));
}

/** One row's structure from its cells (formula cells through `value`). */
export function readRowInfo(
  cells: readonly CellContent[],
  cols: EquipmentColumns,
  value: (col: number) => CellContent,
): RowInfo {
  if (cols.inputCols.every((c) => blank(cells[c] ?? null))) return BLANK_ROW;
  const at = (key: string): CellContent => {
    const c = cols.input.get(key);
    return c === undefined ? null : value(c);
  };
  let kind: KindSpec | undefined;
  if (cols.kinds.length === 1) kind = cols.kinds[0];
  else {
    const k = findKind(text(at('kind')));
    kind = k && cols.kinds.includes(k) ? k : undefined;
  }
  const u = at('u_kv');
  return {
    present: true,
    kind,
    tag: text(at('tag')),
    bus: text(at('bus')),
    toBus: kind?.role === 'branch' ? text(at('to_bus')) : '',
    u: typeof u === 'number' && u > 0 ? u : undefined,
  };
}

/** Rows of an equipment sheet's cells (header skipped). */
export function readSheetRows(
  cells: readonly (readonly CellContent[])[],
  cols: EquipmentColumns,
  value?: ValueOf,
): RowInfo[] {
  const out: RowInfo[] = [];
  for (let r = 1; r < cells.length; r++) {
    const line = cells[r] ?? [];
    out.push(readRowInfo(line, cols, (c) => (value ? value(r, c, line[c] ?? null) : (line[c] ?? null))));
  }
  while (out.length > 0 && !(out[out.length - 1] as RowInfo).present) out.pop();
  return out;
}

/**
 * The row number a site row gets here: sheet position × ROW_SPAN + cell row + 1. Only its order
 * matters to the graph and voltage rules (first row wins), and it stays the same for an unchanged
 * row from one edit to the next, so the row objects below can be kept between passes.
 */
const ROW_SPAN = 2 ** 21; // above the 1,048,576 rows a sheet can have
const siteRows = new WeakMap<RowInfo, EquipmentRow>();

function siteRow(r: RowInfo, code: number): EquipmentRow {
  const known = siteRows.get(r);
  if (known && known.row === code) return known;
  const row: EquipmentRow = {
    row: code,
    tag: r.tag,
    bus: r.bus,
    kind: r.kind?.name ?? '',
    ...(r.toBus !== '' ? { to_bus: r.toBus } : {}),
    values: r.u !== undefined ? { u_kv: r.u } : {},
    loads: {},
  };
  siteRows.set(r, row);
  return row;
}

const refOf = (code: number): RowRef => ({ sheet: Math.floor(code / ROW_SPAN), row: (code % ROW_SPAN) - 1 });

/** The buses and what feeds them, computed by the site's own graph and voltage rules. */
export function busesOf(sheets: readonly SheetStructure[]): {
  buses: BusInfo[];
  busIndex: Map<string, number>;
} {
  const rows: EquipmentRow[] = [];
  for (const s of sheets) {
    s.rows.forEach((r, i) => {
      // A row of no known kind still names its bus: it is summed there (as an error), not lost.
      if (r.present && r.bus !== '') rows.push(siteRow(r, s.index * ROW_SPAN + i + 2));
    });
  }
  const unified = unifyBusNames(rows).rows;
  const graph = buildBusGraph(unified);
  const voltages = busVoltages(unified).voltages;
  const names = [...graph.order, ...[...graph.firstRow.keys()].filter((b) => !graph.level.has(b))];
  const buses: BusInfo[] = names.map((name) => {
    const feeder = graph.feeder.get(name);
    const v = voltages.get(name);
    return {
      name,
      key: busKey(name),
      level: graph.level.get(name),
      ...(feeder ? { feeder: refOf(feeder.row), upstream: feeder.bus } : {}),
      ...(v ? { voltage: refOf(v.row) } : {}),
      ...(soleMotorOf(name, graph) ? { soleMotor: true as const } : {}),
    };
  });
  return { buses, busIndex: new Map(buses.map((b, i) => [b.key, i])) };
}

export function structureOf(
  cases: readonly string[],
  sheetRows: readonly (readonly RowInfo[])[],
): WorkbookStructure {
  const plans = equipmentPlans(cases);
  const sheets = plans.map((cols, index) => ({ index, cols, rows: sheetRows[index] ?? [] }));
  return { cases, sheets, ...busesOf(sheets) };
}

/** What the Buses and Compensation sheets and the branch rows' references depend on, as one text. */
export function busSignature(s: WorkbookStructure): string {
  return JSON.stringify([
    s.cases,
    s.buses.map((b) => [
      b.name,
      b.level ?? -1,
      b.feeder?.sheet ?? -1,
      b.feeder?.row ?? -1,
      b.upstream ?? '',
      b.voltage?.sheet ?? -1,
      b.voltage?.row ?? -1,
      b.soleMotor === true,
    ]),
  ]);
}
