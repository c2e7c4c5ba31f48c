// One equipment row's power in one case, from its kind's physics (src/core/kinds): the value
// the roll-up adds up and the workbook's formulas compute. Rules per case are in cases.ts.
import {
  evalExpr,
  findKind,
  type EvalContext,
  type Expr,
  type KindSpec,
  type VarName,
} from '../kinds/index.ts';
import { loadFactor, unitsRunning } from './cases.ts';
import type { EquipmentRow } from './model.ts';

export type RowOutcome<T> =
  | ({ readonly ok: true } & T)
  | { readonly ok: false; readonly message: string; readonly column: string | undefined };

function context(
  row: EquipmentRow,
  vars: Partial<Record<VarName, number>>,
  columns: Partial<Record<VarName, string>>,
): EvalContext {
  return {
    col: (key) => row.values[key],
    text: (key) => (key === 'supply' ? row.supply : undefined),
    variable: (name) => vars[name] ?? 0,
    variableColumn: (name) => columns[name],
  };
}

function run(
  e: Expr | undefined,
  ctx: EvalContext,
): { ok: true; value: number } | { ok: false; message: string; column: string | undefined } {
  return e === undefined ? { ok: true, value: 0 } : evalExpr(e, ctx);
}

/**
 * A shunt row in a case: P and Q of all units running at the case's load factor. Off (load
 * factor 0 or no unit running) is 0 without evaluating anything, as the workbook's IF guard.
 */
export function shuntPower(
  row: EquipmentRow,
  kind: KindSpec,
  caseName: string,
  hz: number,
): RowOutcome<{ p: number; q: number; load: number; running: number }> {
  const n = unitsRunning(row);
  const lf = loadFactor(row, caseName);
  if (!kind.shunt) return { ok: false, message: `a ${kind.name} is not a shunt item`, column: 'kind' };
  if (n === 0 || lf.value === 0) return { ok: true, p: 0, q: 0, load: lf.value, running: n };
  const ctx = context(row, { x: lf.value, hz, n }, { x: lf.column });
  const p = run(kind.shunt.p, ctx);
  if (!p.ok) return p;
  const q = run(kind.shunt.q, ctx);
  if (!q.ok) return q;
  return { ok: true, p: n * p.value, q: n * q.value, load: lf.value, running: n };
}

/** Units of a branch sharing the bus they feed: at least one carries it, whatever `running` says. */
export function branchUnits(row: EquipmentRow): number {
  return Math.max(1, unitsRunning(row));
}

/** A branch row carrying sKva (all units together): losses, in the load convention's parts. */
export function branchPower(
  row: EquipmentRow,
  kind: KindSpec,
  sKva: number,
  hz: number,
): RowOutcome<{ p: number; qAbsorbed: number; qDelivered: number; loadingPct?: number; running: number }> {
  const b = kind.branch;
  if (!b) return { ok: false, message: `a ${kind.name} is not a branch`, column: 'kind' };
  const n = branchUnits(row);
  const sUnit = sKva / n;
  const ctx = context(row, { hz, n, sUnit }, {});
  const p = run(b.pLoss, ctx);
  if (!p.ok) return p;
  const abs = run(b.qAbsorbed, ctx);
  if (!abs.ok) return abs;
  const del = run(b.qDelivered, ctx);
  if (!del.ok) return del;
  const rated = unitRatingKva(row, kind, hz);
  return {
    ok: true,
    p: n * p.value,
    qAbsorbed: n * abs.value,
    qDelivered: n * del.value,
    ...(rated ? { loadingPct: (100 * sUnit) / rated } : {}),
    running: n,
  };
}

/** Capacitive kvar the supply sees at harmonics from this row with every unit in (0 for most kinds). */
export function resonanceKvar(row: EquipmentRow, hz: number): number {
  const e = findKind(row.kind)?.shunt?.resonanceKvar;
  if (!e) return 0;
  const r = evalExpr(e, context(row, { hz, x: 1, n: unitsRunning(row) }, {}));
  return r.ok ? r.value * unitsRunning(row) : 0;
}

/** A branch unit's rated kVA: its column, or its expression (blank, 0 or an error: no rating). */
export function unitRatingKva(row: EquipmentRow, kind: KindSpec, hz: number): number | undefined {
  const rating = kind.branch?.rating;
  if (rating === undefined) return undefined;
  if (typeof rating === 'string') return row.values[rating];
  const r = evalExpr(rating, context(row, { hz, n: branchUnits(row) }, {}));
  return r.ok && r.value > 0 ? r.value : undefined;
}
