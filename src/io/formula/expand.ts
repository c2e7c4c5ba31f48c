// Rewriting catalogue calls into plain formulas of classic spreadsheet functions, so that an
// exported workbook stays live in any spreadsheet program. Calls are rewritten inner first;
// other functions pass through unchanged.
//
// Linear work: a spec's expansion is written with a placeholder name for every argument that is
// not a plain value, parsed (a text of the spec's own size), and the argument's tree is put in
// place of the placeholder: shared, never printed and re-read at every level of nesting. The
// text is printed once at the end, within the xlsx formula limit: an argument the expansion
// repeats makes the text double per level of nesting, so a long one stops at the limit.
import { findFunction } from '../../core/functions/index.ts';
import { expandCall } from '../../core/registry/expand.ts';
import { msg, withFunction } from '../../core/registry/messages.ts';
import { isOptional, minArgs, type FunctionSpec } from '../../core/registry/spec.ts';
import { isAtomic, type CallNode, type Node } from './ast.ts';
import { parseFormula } from './parse.ts';
import { printNodeWithin } from './print.ts';
import { significantTokens, type ScanCounter } from './tokenize.ts';

/**
 * Longest formula an xlsx cell may hold (Excel specifications and limits: 8,192 characters of
 * formula contents); an expansion beyond it cannot be written as a formula anyway.
 */
export const MAX_FORMULA_LENGTH = 8192;

/** Counts the work of an expansion, for tests: characters read and tree nodes built or printed. */
export interface ExpandCounter extends ScanCounter {
  nodes: number;
}

/** Stands for an argument in a spec's template; no formula of a user may contain it. */
const PLACEHOLDER = '_kvar_arg_';

export type ExpandResult =
  { readonly ok: true; readonly formula: string } | { readonly ok: false; readonly message: string };

class ExpandError extends Error {}

function where(call: CallNode): string {
  return call.at === undefined ? '' : ` (the call at character ${call.at})`;
}

/** A plain value is handed to the template as its text (the guards look at it: TRUE, "text", 2). */
function isPlainValue(n: Node): boolean {
  return (
    n.type === 'number' ||
    n.type === 'bool' ||
    n.type === 'string' ||
    n.type === 'ref' ||
    n.type === 'name' ||
    n.type === 'error'
  );
}

/** An argument in the template: parenthesised unless it is atomic, as a text would be. */
function argumentNode(n: Node): Node {
  return isAtomic(n) ? n : { type: 'paren', inner: n };
}

/** The template's tree with each placeholder replaced by its argument's tree (shared, not copied). */
function substitute(n: Node, args: readonly (Node | undefined)[], counter: ExpandCounter | undefined): Node {
  if (counter) counter.nodes++;
  const sub = (x: Node) => substitute(x, args, counter);
  switch (n.type) {
    case 'name': {
      if (!n.text.startsWith(PLACEHOLDER)) return n;
      const a = args[Number(n.text.slice(PLACEHOLDER.length))];
      return a ? argumentNode(a) : n;
    }
    case 'unary':
    case 'percent':
      return { ...n, arg: sub(n.arg) };
    case 'binary':
      return { ...n, left: sub(n.left), right: sub(n.right) };
    case 'paren':
      return { ...n, inner: sub(n.inner) };
    case 'call':
      return { ...n, args: n.args.map((a) => (a ? sub(a) : null)) };
    case 'array':
      return { ...n, rows: n.rows.map((r) => r.map(sub)) };
    default:
      return n;
  }
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

/** A node's text for a message: at most 60 characters (an argument may hold a whole expansion). */
function shortText(n: Node): string {
  return printNodeWithin(n, 60) ?? (n.type === 'array' ? '{…}' : '…');
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
    a.type === 'array' ? `the array ${shortText(a)}` : `the range ${shortText(a)}`,
  );
}

function expandCatalogueCall(
  spec: FunctionSpec,
  call: CallNode,
  args: readonly (Node | null)[],
  counter: ExpandCounter | undefined,
): Node {
  const problem = arityProblem(spec, args) ?? rangeProblem(spec, args);
  if (problem) throw new ExpandError(withFunction(spec.name, problem) + where(call));
  const texts = spec.params.map((_, i) => {
    const a = args[i];
    if (!a) return undefined;
    return isPlainValue(a) ? printNodeWithin(a, MAX_FORMULA_LENGTH, counter) : `${PLACEHOLDER}${i}`;
  });
  const plain = expandCall(spec, texts);
  const reparsed = parseFormula(plain, counter);
  if (!reparsed.ok) {
    throw new ExpandError(
      withFunction(
        spec.name,
        `its plain-formula expansion could not be read back (${reparsed.message}): ${plain}`,
      ) + where(call),
    );
  }
  const tree = substitute(
    reparsed.ast,
    args.map((a) => a ?? undefined),
    counter,
  );
  return isAtomic(tree) ? tree : { type: 'paren', inner: tree };
}

function rewrite(n: Node, counter: ExpandCounter | undefined): Node {
  if (counter) counter.nodes++;
  const sub = (x: Node) => rewrite(x, counter);
  switch (n.type) {
    case 'call': {
      const args = n.args.map((a) => (a ? sub(a) : null));
      const spec = findFunction(n.name);
      return spec ? expandCatalogueCall(spec, n, args, counter) : { ...n, args };
    }
    case 'unary':
    case 'percent':
      return { ...n, arg: sub(n.arg) };
    case 'binary':
      return { ...n, left: sub(n.left), right: sub(n.right) };
    case 'paren':
      return { ...n, inner: sub(n.inner) };
    case 'array':
      return { ...n, rows: n.rows.map((r) => r.map(sub)) };
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

const LIMIT = MAX_FORMULA_LENGTH.toLocaleString('en');
const ADVICE = 'write inner calls into cells of their own';

/**
 * Rewrite every catalogue call of a formula (with or without its leading '=') into a plain
 * formula. A formula without catalogue calls comes back exactly as given. Never throws. The work
 * is linear in the formula's length; `counter` counts it (for tests).
 */
export function expandFormula(formula: string, counter?: ExpandCounter): ExpandResult {
  // Longer input cannot become a formula of an xlsx file; refusing it also bounds the depth of
  // the trees walked below.
  if (formula.length > MAX_FORMULA_LENGTH)
    return {
      ok: false,
      message: `the formula is ${formula.length.toLocaleString('en')} characters long; a formula in an xlsx file holds at most ${LIMIT} (${ADVICE})`,
    };
  if (formula.toLowerCase().includes(PLACEHOLDER))
    return { ok: false, message: `the name ${PLACEHOLDER}… is reserved for the expansion; rename it` };
  const parsed = parseFormula(formula, counter);
  if (!parsed.ok) return { ok: false, message: parsed.message };
  if (referencedFunctions(formula).length === 0) return { ok: true, formula };
  try {
    const prefix = formula.trimStart().startsWith('=') ? '=' : '';
    const text = printNodeWithin(rewrite(parsed.ast, counter), MAX_FORMULA_LENGTH - prefix.length, counter);
    if (text === undefined)
      return {
        ok: false,
        message: `its plain-formula expansion would be longer than ${LIMIT} characters, the most a formula in an xlsx file holds (${ADVICE})`,
      };
    return { ok: true, formula: prefix + text };
  } catch (e) {
    if (e instanceof ExpandError) return { ok: false, message: e.message };
    return {
      ok: false,
      message: `the formula could not be expanded: ${e instanceof Error ? e.message : String(e)}`,
    };
  }
}
