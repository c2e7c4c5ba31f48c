// The catalogue as a reader sees it: signatures, argument units, allowed values, defaults,
// sources. One description, used by `kvar-ledger functions` (text, JSON, Markdown) and
// available to the help panel.
import { describeInterval, formatNumber } from '../../core/registry/messages.ts';
import { isOptional, type FunctionSpec, type ParamSpec } from '../../core/registry/spec.ts';

export interface ParamReference {
  readonly name: string;
  readonly unit: string;
  readonly doc: string;
  readonly type: 'number' | 'boolean';
  /** Allowed values in words: "(0, 1]", "≥ 0", "any number", "TRUE or FALSE". */
  readonly allowed: string;
  readonly optional: boolean;
  /** The default of an optional argument in words ("1", "FALSE", "= u_rated_kv", "omitted: why"). */
  readonly default?: string;
}

export interface ExampleReference {
  readonly formula: string;
  /** The stated value, or the error message the call gives. */
  readonly expect: number | { readonly error: string };
  readonly note: string;
}

export interface FunctionReference {
  readonly name: string;
  readonly family: string;
  readonly signature: string;
  readonly summary: string;
  readonly description: string;
  readonly params: readonly ParamReference[];
  readonly result: { readonly unit: string; readonly doc: string };
  readonly source: { readonly kind: string; readonly ref: string };
  readonly examples: readonly ExampleReference[];
}

export function defaultText(p: ParamSpec): string | undefined {
  const d = p.default;
  if (d === undefined) return undefined;
  if (typeof d === 'number') return formatNumber(d);
  if (typeof d === 'boolean') return d ? 'TRUE' : 'FALSE';
  if ('sameAs' in d) return `= ${d.sameAs}`;
  return `omitted: ${d.omitted}`;
}

/** "KVAR.MOTOR(p_out_kw, eff, cos_phi, [load=1], [i0_pct])" */
export function signature(spec: FunctionSpec): string {
  const parts = spec.params.map((p) => {
    if (!isOptional(p)) return p.name;
    const d = p.default;
    if (typeof d === 'number' || typeof d === 'boolean') return `[${p.name}=${defaultText(p)}]`;
    if (d && typeof d === 'object' && 'sameAs' in d) return `[${p.name}=${d.sameAs}]`;
    return `[${p.name}]`;
  });
  return `${spec.name}(${parts.join(', ')})`;
}

function literal(a: number | boolean | undefined): string {
  if (a === undefined) return '';
  if (typeof a === 'boolean') return a ? 'TRUE' : 'FALSE';
  return String(a);
}

/** An example's call as a formula: omitted trailing arguments dropped, inner ones left empty. */
export function exampleFormula(
  spec: FunctionSpec,
  args: ReadonlyArray<number | boolean | undefined>,
): string {
  let n = args.length;
  while (n > 0 && args[n - 1] === undefined) n--;
  return `=${spec.name}(${args.slice(0, n).map(literal).join(',')})`;
}

export function paramReference(p: ParamSpec): ParamReference {
  const isBool = p.type === 'boolean';
  const def = defaultText(p);
  return {
    name: p.name,
    unit: p.unit,
    doc: p.doc,
    type: isBool ? 'boolean' : 'number',
    allowed: isBool ? 'TRUE or FALSE' : describeInterval(p.domain),
    optional: isOptional(p),
    ...(def !== undefined ? { default: def } : {}),
  };
}

export function functionReference(spec: FunctionSpec): FunctionReference {
  return {
    name: spec.name,
    family: spec.family,
    signature: signature(spec),
    summary: spec.summary,
    description: spec.description,
    params: spec.params.map(paramReference),
    result: { unit: spec.result.unit, doc: spec.result.doc },
    source: { kind: spec.source.kind, ref: spec.source.ref },
    examples: spec.examples.map((e) => ({
      formula: exampleFormula(spec, e.args),
      expect: e.expect,
      note: e.note,
    })),
  };
}
