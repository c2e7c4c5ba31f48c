// Rewriting catalogue calls into plain formulas of classic spreadsheet functions, so that an
// exported workbook stays live in any spreadsheet program. Calls are rewritten inner first;
// other functions pass through unchanged.
import { findFunction } from '../../core/functions/index.ts';
import { expandCall } from '../../core/registry/expand.ts';
import { msg, withFunction } from '../../core/registry/messages.ts';
import { isOptional, minArgs, type FunctionSpec } from '../../core/registry/spec.ts';
import { isAtomic, type CallNode, type Node } from './ast.ts';
import { parseFormula } from './parse.ts';
import { printNode } from './print.ts';
import { significantTokens } from './tokenize.ts';

export type ExpandResult =
  { readonly ok: true; readonly formula: string } | { readonly ok: false; readonly message: string };

class ExpandError extends Error {}

function where(call: CallNode): string {
  return call.at === undefined ? '' : ` (the call at character ${call.at})`;
}

/** An argument as text for a spec's template: parenthesised unless it is atomic. */
function argumentText(n: Node): string {
  const text = printNode(n);
  return isAtomic(n) ? text : `(${text})`;
}

/** Argument count problems, worded as the engine words them (an expansion cannot show them). */
function arityProblem(spec: FunctionSpec, args: readonly (Node | null)[]): string | undefined {
  if (args.length > spec.params.length) return msg.tooMany(spec.params.length, args.length);
  const required = minArgs(spec);
  const firstMissing = spec.params.findIndex((p, i) => !isOptional(p) && !args[i]);
  if (firstMissing < 0) return undefined;
  const missing = msg.missing(firstMissing + 1, spec.params[firstMissing] as FunctionSpec['params'][number]);
  return args.length < required ? `${msg.tooFew(required, args.length)}; ${missing}` : missing;
}

/** A range or array given where one value belongs (the engine reports it; a plain formula would not). */
function rangeProblem(spec: FunctionSpec, args: readonly (Node | null)[]): string | undefined {
  const i = args.findIndex((a) => (a?.type === 'ref' && a.range) || a?.type === 'array');
  const a = args[i];
  const p = spec.params[i];
  if (!a || !p) return undefined;
  return msg.notOneValue(
    i + 1,
    p,
    a.type === 'array' ? `the array ${printNode(a)}` : `the range ${printNode(a)}`,
  );
}

function expandCatalogueCall(spec: FunctionSpec, call: CallNode, args: readonly (Node | null)[]): Node {
  const problem = arityProblem(spec, args) ?? rangeProblem(spec, args);
  if (problem) throw new ExpandError(withFunction(spec.name, problem) + where(call));
  const texts = spec.params.map((_, i) => {
    const a = args[i];
    return a ? argumentText(a) : undefined;
  });
  const plain = expandCall(spec, texts);
  const reparsed = parseFormula(plain);
  if (!reparsed.ok) {
    throw new ExpandError(
      withFunction(
        spec.name,
        `its plain-formula expansion could not be read back (${reparsed.message}): ${plain}`,
      ) + where(call),
    );
  }
  return isAtomic(reparsed.ast) ? reparsed.ast : { type: 'paren', inner: reparsed.ast };
}

function rewrite(n: Node): Node {
  switch (n.type) {
    case 'call': {
      const args = n.args.map((a) => (a ? rewrite(a) : null));
      const spec = findFunction(n.name);
      return spec ? expandCatalogueCall(spec, n, args) : { ...n, args };
    }
    case 'unary':
    case 'percent':
      return { ...n, arg: rewrite(n.arg) };
    case 'binary':
      return { ...n, left: rewrite(n.left), right: rewrite(n.right) };
    case 'paren':
      return { ...n, inner: rewrite(n.inner) };
    case 'array':
      return { ...n, rows: n.rows.map((r) => r.map(rewrite)) };
    default:
      return n;
  }
}

/** Catalogue function names used in a formula (canonical, each once, in order of appearance). */
export function referencedFunctions(formula: string): string[] {
  const names = new Set<string>();
  for (const t of significantTokens(formula)) {
    if (t.kind === 'func') {
      const spec = findFunction(t.text);
      if (spec) names.add(spec.name);
    }
  }
  return [...names];
}

/**
 * Rewrite every catalogue call of a formula (with or without its leading '=') into a plain
 * formula. A formula without catalogue calls comes back exactly as given. Never throws.
 */
export function expandFormula(formula: string): ExpandResult {
  const parsed = parseFormula(formula);
  if (!parsed.ok) return { ok: false, message: parsed.message };
  if (referencedFunctions(formula).length === 0) return { ok: true, formula };
  try {
    const prefix = formula.trimStart().startsWith('=') ? '=' : '';
    return { ok: true, formula: prefix + printNode(rewrite(parsed.ast)) };
  } catch (e) {
    if (e instanceof ExpandError) return { ok: false, message: e.message };
    return {
      ok: false,
      message: `the formula could not be expanded: ${e instanceof Error ? e.message : String(e)}`,
    };
  }
}
