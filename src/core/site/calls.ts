// Which catalogue function computes what for each kind of equipment, and which interchange
// column feeds each argument. Validation and the roll-up both go through these plans, so a
// domain error in the roll-up and in validation carry the same message (the catalogue's own)
// and point at the same column.
import { findFunction } from '../functions/index.ts';
import { evaluate, type RawArg } from '../registry/evaluate.ts';
import type { EquipmentKind, EquipmentRow, NumericColumn } from './model.ts';

/** One catalogue call: function name, raw arguments, and the column behind each argument. */
export interface CallPlan {
  readonly fn: string;
  readonly args: readonly RawArg[];
  /** Column each argument came from; undefined for site settings (frequency) or computed values. */
  readonly columns: ReadonlyArray<string | undefined>;
}

export type CallResult =
  | { readonly ok: true; readonly value: number }
  | { readonly ok: false; readonly message: string; readonly column: string | undefined };

/** Evaluate a plan through the catalogue; never throws. A failure names the column at fault. */
export function runCall(plan: CallPlan): CallResult {
  const spec = findFunction(plan.fn);
  if (!spec)
    return { ok: false, message: `catalogue function ${plan.fn} is not available`, column: undefined };
  const r = evaluate(spec, plan.args);
  if (r.ok) return r;
  return { ok: false, message: r.message, column: columnOfMessage(r.message, plan) };
}

/** The catalogue's messages name "argument N (name)": map N back to the column. */
export function columnOfMessage(message: string, plan: CallPlan): string | undefined {
  const m = /argument (\d+) \(/.exec(message);
  if (!m) return plan.columns.find((c) => c !== undefined);
  return plan.columns[Number(m[1]) - 1] ?? plan.columns.find((c) => c !== undefined);
}

/** Values each kind cannot do without (beyond tag, bus, kind); blank ones are reported. */
export const REQUIRED_VALUES: Readonly<Record<EquipmentKind, readonly NumericColumn[]>> = {
  motor: ['p_kw', 'eff', 'cos_phi'],
  load: ['p_kw', 'cos_phi'],
  generator: ['p_kw', 'cos_phi'],
  transformer: ['s_kva', 'uk_pct', 'i0_pct', 'p0_kw', 'pk_kw'],
  cable: ['u_kv', 'c_uf_km', 'len_km'],
  line: ['u_kv', 'l_mh_km', 'c_nf_km', 'len_km'],
  capacitor: ['q_kvar', 'u_rated_kv'],
  reactor: ['q_kvar', 'u_rated_kv'],
};

/** Kinds that carry the power of the bus they feed (to_bus) instead of drawing their own. */
export const BRANCH_KINDS: readonly EquipmentKind[] = ['transformer', 'line'];

const v = (row: EquipmentRow, c: NumericColumn): RawArg => row.values[c];

/**
 * Per-unit active and reactive power of a shunt element (everything but transformers and
 * lines) at load factor x. P is a plain product where the design says so (load, generator).
 */
export function shuntPlans(
  row: EquipmentRow,
  x: number,
  loadColumn: string,
  hz: number,
): { p?: CallPlan; q?: CallPlan; pProduct?: { column: string; value: number } } {
  switch (row.kind) {
    case 'motor':
      return {
        p: { fn: 'KW.MOTOR', args: [v(row, 'p_kw'), v(row, 'eff'), x], columns: ['p_kw', 'eff', loadColumn] },
        q: {
          fn: 'KVAR.MOTOR',
          args: [v(row, 'p_kw'), v(row, 'eff'), v(row, 'cos_phi'), x, v(row, 'i0_pct')],
          columns: ['p_kw', 'eff', 'cos_phi', loadColumn, 'i0_pct'],
        },
      };
    case 'load':
    case 'generator': {
      const p = (row.values.p_kw ?? Number.NaN) * x;
      const fn = row.kind === 'load' ? 'KVAR.LOAD' : 'KVAR.GEN';
      return {
        pProduct: { column: 'p_kw', value: p },
        q: {
          fn,
          args: [row.values.p_kw === undefined ? undefined : p, v(row, 'cos_phi')],
          columns: ['p_kw', 'cos_phi'],
        },
      };
    }
    case 'cable':
      return {
        q: {
          fn: 'KVAR.CABLE',
          args: [v(row, 'u_kv'), v(row, 'c_uf_km'), v(row, 'len_km'), hz],
          columns: ['u_kv', 'c_uf_km', 'len_km', undefined],
        },
      };
    case 'capacitor':
      // Nameplate taken at the site frequency (no rated-frequency column in the interchange).
      return {
        q: {
          fn: 'KVAR.CAPBANK',
          args: [v(row, 'q_kvar'), v(row, 'u_rated_kv'), v(row, 'u_kv'), v(row, 'p_pct'), hz, hz],
          columns: ['q_kvar', 'u_rated_kv', 'u_kv', 'p_pct', undefined, undefined],
        },
      };
    case 'reactor':
      return {
        q: {
          fn: 'KVAR.REACTOR',
          args: [v(row, 'q_kvar'), v(row, 'u_rated_kv'), v(row, 'u_kv')],
          columns: ['q_kvar', 'u_rated_kv', 'u_kv'],
        },
      };
    default:
      return {};
  }
}

/** Losses of one transformer unit carrying sUnit kVA: active, magnetising and leakage kvar. */
export function transformerPlans(
  row: EquipmentRow,
  sUnit: number,
): { p: CallPlan; mag: CallPlan; leak: CallPlan } {
  return {
    p: {
      fn: 'KW.XFMR.LOSS',
      args: [v(row, 's_kva'), v(row, 'p0_kw'), v(row, 'pk_kw'), sUnit],
      columns: ['s_kva', 'p0_kw', 'pk_kw', undefined],
    },
    mag: {
      fn: 'KVAR.XFMR.MAG',
      args: [v(row, 's_kva'), v(row, 'i0_pct'), v(row, 'p0_kw')],
      columns: ['s_kva', 'i0_pct', 'p0_kw'],
    },
    leak: {
      fn: 'KVAR.XFMR.LEAK',
      args: [v(row, 's_kva'), v(row, 'uk_pct'), sUnit, v(row, 'pk_kw')],
      columns: ['s_kva', 'uk_pct', undefined, 'pk_kw'],
    },
  };
}

/** Net reactive power of one line circuit carrying sUnit kVA, and its charging alone (at no load). */
export function linePlans(
  row: EquipmentRow,
  sUnit: number,
  hz: number,
): { net: CallPlan; charging: CallPlan } {
  const plan = (s: number): CallPlan => ({
    fn: 'KVAR.LINE',
    args: [v(row, 'u_kv'), s, v(row, 'l_mh_km'), v(row, 'c_nf_km'), v(row, 'len_km'), hz],
    columns: ['u_kv', undefined, 'l_mh_km', 'c_nf_km', 'len_km', undefined],
  });
  return { net: plan(sUnit), charging: plan(0) };
}
