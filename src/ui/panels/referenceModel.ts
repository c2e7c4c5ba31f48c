// The function reference without the DOM: search over the catalogue and the worked examples as
// formulas a user can type.
import { CATALOGUE } from '../../core/functions/index.ts';
import type { Example, FunctionSpec } from '../../core/registry/spec.ts';

/** Functions whose name, summary, family or parameter names contain every word of the query. */
export function searchCatalogue(query: string, specs: readonly FunctionSpec[] = CATALOGUE): FunctionSpec[] {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0) return [...specs];
  return specs.filter((f) => {
    const hay = [f.name, f.summary, f.family, f.description, ...f.params.map((p) => `${p.name} ${p.unit}`)]
      .join(' ')
      .toLowerCase();
    return words.every((w) => hay.includes(w));
  });
}

/** Families in catalogue order, each with its functions. */
export function byFamily(specs: readonly FunctionSpec[]): Array<{ family: string; specs: FunctionSpec[] }> {
  const out: Array<{ family: string; specs: FunctionSpec[] }> = [];
  for (const f of specs) {
    const group = out.find((g) => g.family === f.family);
    if (group) group.specs.push(f);
    else out.push({ family: f.family, specs: [f] });
  }
  return out;
}

/** '=KVAR.MOTOR(90,0.95,0.85,,30)': omitted optional arguments are left empty, trailing ones dropped. */
export function exampleFormula(spec: FunctionSpec, ex: Example): string {
  const args = ex.args.map((a) =>
    a === undefined ? '' : typeof a === 'boolean' ? (a ? 'TRUE' : 'FALSE') : String(a),
  );
  while (args.length > 0 && args[args.length - 1] === '') args.pop();
  return `=${spec.name}(${args.join(',')})`;
}

export type ExampleCheck =
  | { readonly kind: 'value'; readonly ok: boolean; readonly got: number | string }
  | { readonly kind: 'error'; readonly ok: boolean; readonly got: string };

/** Does what the engine computed agree with the example's stated result (within its tolerance)? */
export function checkExample(
  ex: Example,
  got: { ok: true; value: unknown } | { ok: false; message: string },
): ExampleCheck {
  if (typeof ex.expect === 'number') {
    if (!got.ok) return { kind: 'error', ok: false, got: got.message };
    const v = got.value;
    if (typeof v !== 'number') return { kind: 'value', ok: false, got: String(v) };
    const tol = ex.tol ?? 1e-9;
    const ok = Math.abs(v - ex.expect) <= tol * Math.max(1, Math.abs(ex.expect));
    return { kind: 'value', ok, got: v };
  }
  if (got.ok) return { kind: 'value', ok: false, got: String(got.value) };
  return { kind: 'error', ok: got.message.includes(ex.expect.error), got: got.message };
}
