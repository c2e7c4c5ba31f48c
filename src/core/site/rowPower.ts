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
// Not through kinds/index.ts: only the roll-up runs compiled physics, and the page loads the
// roll-up on demand, so the compiler stays out of the page's first download.
import { compileExpr, evalCompiled, tryCompiled } from '../kinds/compile.ts';
import { loadFactor, unitsRunning } from './cases.ts';
import type { EquipmentRow } from './model.ts';

export type RowOutcome<T> =
  | ({ readonly ok: true } & T)
  | { readonly ok: false; readonly message: string; readonly column: string | undefined };

/** What a kind's physics reads of one row: one object per evaluation, its methods shared. */
class RowContext implements EvalContext {
  constructor(
    readonly row: EquipmentRow,
    readonly x: number,
    readonly n: number,
    readonly hz: number,
    readonly sUnit: number,
    /** The column the load factor came from, for messages. */
    readonly xColumn: string | undefined,
  ) {}
  col(key: string): number | undefined {
    return this.row.values[key];
  }
  text(key: string): string | undefined {
    return key === 'supply' ? this.row.supply : undefined;
  }
  variable(name: VarName): number {
    return name === 'x' ? this.x : name === 'n' ? this.n : name === 'hz' ? this.hz : this.sUnit;
  }
  variableColumn(name: VarName): string | undefined {
    return name === 'x' ? this.xColumn : undefined;
  }
}

type Run = { ok: true; value: number } | { ok: false; message: string; column: string | undefined };

/** The tree evaluator: gives the message where the compiled closures stop. */
function run(e: Expr | undefined, ctx: EvalContext): Run {
  return e === undefined ? { ok: true, value: 0 } : evalExpr(e, ctx);
}

const ZERO = (): number => 0;
const compiledOr0 = (e: Expr | undefined) => (e === undefined ? ZERO : compileExpr(e));

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
  const ctx = new RowContext(row, lf.value, n, hz, 0, lf.column);
  const { p: pe, q: qe } = kind.shunt;
  const fp = compiledOr0(pe);
  const fq = compileExpr(qe);
  return tryCompiled(
    () => {
      const p = fp(ctx);
      return { ok: true, p: n * p, q: n * fq(ctx), load: lf.value, running: n };
    },
    () => {
      const p = run(pe, ctx);
      if (!p.ok) return p;
      const q = run(qe, ctx);
      if (!q.ok) return q;
      return { ok: true, p: n * p.value, q: n * q.value, load: lf.value, running: n };
    },
  );
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
  const ctx = new RowContext(row, 0, n, hz, sUnit, undefined);
  const [fp, fa, fd] = [compiledOr0(b.pLoss), compileExpr(b.qAbsorbed), compiledOr0(b.qDelivered)];
  const losses = tryCompiled<Run3>(
    () => {
      const p = fp(ctx);
      const abs = fa(ctx);
      return { ok: true, p, abs, del: fd(ctx) };
    },
    () => {
      const p = run(b.pLoss, ctx);
      if (!p.ok) return p;
      const abs = run(b.qAbsorbed, ctx);
      if (!abs.ok) return abs;
      const del = run(b.qDelivered, ctx);
      if (!del.ok) return del;
      return { ok: true, p: p.value, abs: abs.value, del: del.value };
    },
  );
  if (!losses.ok) return losses;
  const rated = unitRatingKva(row, kind, hz);
  return {
    ok: true,
    p: n * losses.p,
    qAbsorbed: n * losses.abs,
    qDelivered: n * losses.del,
    ...(rated ? { loadingPct: (100 * sUnit) / rated } : {}),
    running: n,
  };
}

type Run3 =
  | { ok: true; p: number; abs: number; del: number }
  | { ok: false; message: string; column: string | undefined };

/** Capacitive kvar the supply sees at harmonics from this row with every unit in (0 for most kinds). */
export function resonanceKvar(row: EquipmentRow, hz: number): number {
  const e = findKind(row.kind)?.shunt?.resonanceKvar;
  if (!e) return 0;
  const r = evalCompiled(e, new RowContext(row, 1, unitsRunning(row), hz, 0, undefined));
  return r.ok ? r.value * unitsRunning(row) : 0;
}

/** A branch unit's rated kVA: its column, or its expression (blank, 0 or an error: no rating). */
export function unitRatingKva(row: EquipmentRow, kind: KindSpec, hz: number): number | undefined {
  const rating = kind.branch?.rating;
  if (rating === undefined) return undefined;
  if (typeof rating === 'string') return row.values[rating];
  const r = evalCompiled(rating, new RowContext(row, 0, branchUnits(row), hz, 0, undefined));
  return r.ok && r.value > 0 ? r.value : undefined;
}
