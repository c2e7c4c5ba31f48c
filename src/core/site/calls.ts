// One catalogue call from core code (the design's sizing rules, requirement checks), with the
// column behind each argument so a failure can name the cell at fault. Equipment rows do not come
// through here: their physics is the kind registry's (src/core/kinds), evaluated in rowPower.ts.
import { findFunction } from '../functions/index.ts';
import { evaluate, type RawArg } from '../registry/evaluate.ts';

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
