// The computed cells of one equipment row: units in service, per case the load factor used and
// P and Q (shunt items), or the power carried and the losses before and after compensation
// (transformers and lines). Every formula is the kind's physics printed (src/core/kinds), so
// the workbook computes exactly what the roll-up evaluates. Rules per case: src/core/site/cases.ts.
import { printExpr, type Expr, type KindSpec, type VarName } from '../kinds/index.ts';
import type { CellContent } from './document.ts';
import type { EquipmentColumns } from './equipmentColumns.ts';
import { SHEETS } from './layout.ts';
import { cell, cellOn } from './refs.ts';
import { settingRef } from './settingsLayout.ts';
import type { RowInfo } from './structure.ts';

/** Where a bus's totals sit, for a branch row's power carried. */
export interface BusLookup {
  /** Buses-sheet column of S per case, before and after compensation. */
  readonly sCol: readonly number[];
  readonly sAfterCol: readonly number[];
  /** Cell row of the bus named (ignoring case), or undefined. */
  rowOf(bus: string): number | undefined;
}

export type ComputedCells = Array<readonly [number, CellContent]>;

const UNITS = (running: string, qty: string) =>
  `IF(ISBLANK(${running}),IF(ISBLANK(${qty}),1,${qty}),${running})`;

function printer(
  cols: EquipmentColumns,
  r: number,
  vars: Partial<Record<VarName, string>>,
  /** How a cell of the row is referred to: relative on its own sheet unless said otherwise. */
  ref: (row: number, col: number) => string = cell,
) {
  return (e: Expr) =>
    printExpr(e, {
      col: (key) => {
        const c = cols.input.get(key);
        if (c === undefined) throw new Error(`sheet ${cols.sheet.name} has no ${key} column`);
        return ref(r, c);
      },
      variable: (name) => {
        const v = vars[name];
        if (v === undefined) throw new Error(`${name} is not available on sheet ${cols.sheet.name}`);
        return v;
      },
    });
}

/** Computed cells of cell row r (1-based past the header), for a row that is an item. */
export function computedCells(
  cols: EquipmentColumns,
  r: number,
  info: RowInfo,
  cases: readonly string[],
  buses: BusLookup,
): ComputedCells {
  const out: Array<[number, CellContent]> = [];
  const at = (key: string) => cell(r, cols.input.get(key) as number);
  const units = UNITS(at('running'), at('qty'));
  const n = cell(r, cols.inService);
  const hz = settingRef('hzInUse');
  const kind: KindSpec | undefined = info.kind;
  if (cols.role === 'shunt') {
    out.push([cols.inService, `=${units}`]);
    cases.forEach((_, k) => {
      const own = cell(r, cols.loadCase?.[k] as number);
      const dflt = cell(r, cols.loadDefault as number);
      const xCol = cols.loadUsed?.[k] as number;
      const x = cell(r, xCol);
      out.push([xCol, `=IF(ISBLANK(${own}),IF(ISBLANK(${dflt}),1,${dflt}),${own})`]);
      const print = printer(cols, r, { x, n, hz });
      const guard = (e: Expr | undefined) =>
        e === undefined ? '=0' : `=IF(OR(${n}=0,${x}=0),0,${n}*${wrapProduct(print(e), e)})`;
      const p = cols.p?.[k];
      if (p !== undefined) out.push([p, kind ? guard(kind.shunt?.p) : '=NA()']);
      out.push([cols.q?.[k] as number, kind ? guard(kind.shunt?.q) : '=NA()']);
    });
    if (cols.resonance !== undefined) {
      const e = kind?.shunt?.resonanceKvar;
      out.push([cols.resonance, e ? `=${n}*${wrapProduct(printer(cols, r, { n, hz })(e), e)}` : '=0']);
    }
    return out;
  }
  // A branch: at least one unit carries the bus it feeds, whatever `running` says.
  out.push([cols.inService, `=MAX(1,${units})`]);
  const to = buses.rowOf(info.toBus);
  if (!kind?.branch || to === undefined) return out;
  const b = kind.branch;
  if (cols.qCharging !== undefined) {
    const e = b.qDelivered;
    out.push([cols.qCharging, e ? `=${n}*${wrapProduct(printer(cols, r, { n, hz })(e), e)}` : '=0']);
  }
  const phase = (
    sCol: readonly number[],
    carried?: readonly number[],
    loading?: readonly number[],
    pLoss?: readonly number[],
    qLoss?: readonly number[],
  ) =>
    cases.forEach((_, k) => {
      const sc = carried?.[k] as number;
      out.push([sc, `=${cellOn(SHEETS.buses, to, sCol[k] as number, true)}`]);
      const sUnit = `${cell(r, sc)}/${n}`;
      const print = printer(cols, r, { n, hz, sUnit });
      const lc = loading?.[k];
      if (lc !== undefined) out.push([lc, loadingFormula(b.rating, sUnit, at, print)]);
      const pc = pLoss?.[k];
      if (pc !== undefined) out.push([pc, b.pLoss ? `=${n}*${wrapProduct(print(b.pLoss), b.pLoss)}` : '=0']);
      out.push([qLoss?.[k] as number, `=${n}*${wrapProduct(print(b.qAbsorbed), b.qAbsorbed)}`]);
    });
  phase(buses.sCol, cols.sCarried, cols.loading, cols.pLoss, cols.qLoss);
  phase(buses.sAfterCol, cols.sCarriedAfter, cols.loadingAfter, cols.pLossAfter, cols.qLossAfter);
  return out;
}

/**
 * A branch row's losses when it carries the apparent power in `carried` (all units together), as
 * formulas read from another sheet: [P loss, Q absorbed]. The Design options sheet takes each
 * option's losses at its own loading with these, the same physics as the row's own columns.
 */
export function branchLossesFrom(
  cols: EquipmentColumns,
  r: number,
  kind: KindSpec | undefined,
  carried: string,
): readonly [string, string] {
  const b = kind?.branch;
  if (!b) return ['0', '0'];
  const ref = (row: number, col: number) => cellOn(cols.sheet.name, row, col, true);
  const n = ref(r, cols.inService);
  const print = printer(cols, r, { n, hz: settingRef('hzInUse'), sUnit: `${carried}/${n}` }, ref);
  return [
    b.pLoss ? `${n}*${wrapProduct(print(b.pLoss), b.pLoss)}` : '0',
    `${n}*${wrapProduct(print(b.qAbsorbed), b.qAbsorbed)}`,
  ];
}

/** Loading in % of one unit's rating: by its column, or blank where an optional rating is not given. */
function loadingFormula(
  rating: string | Expr | undefined,
  sUnit: string,
  at: (key: string) => string,
  print: (e: Expr) => string,
): string {
  if (rating === undefined) return '=0';
  if (typeof rating === 'string') return `=100*${sUnit}/${at(rating)}`;
  const kva = print(rating);
  return `=IF(${kva}>0,100*${sUnit}/(${kva}),"")`;
}

/** A printed expression as the right operand of a product: sums and negations in brackets. */
function wrapProduct(text: string, e: Expr): string {
  return (e.k === 'op' && (e.op === '+' || e.op === '-' || e.op === '/')) ||
    e.k === 'neg' ||
    (e.k === 'num' && e.v < 0)
    ? `(${text})`
    : text;
}

/** The header row of an equipment sheet. */
export function headerRow(cols: EquipmentColumns): CellContent[] {
  return cols.columns.map((c) => c.header);
}

/** The Buses sheet columns a branch row refers to. */
export function busLookup(
  sCol: readonly number[],
  sAfterCol: readonly number[],
  rowOf: (bus: string) => number | undefined,
): BusLookup {
  return { sCol, sAfterCol, rowOf };
}
