// A kind's physics compiled once into JavaScript closures, for the roll-up's per-row work: the
// tree evaluator (evalExpr) walks the tree, looks each function up by name and builds its
// result objects at every row of every case. The closures do the same arithmetic in the same
// order and call the same catalogue functions through the same validation (evaluate), so their
// values equal the tree's; when anything fails (a division by zero, an argument the catalogue
// refuses) they stop, and the tree evaluator runs instead to give the message and its column.
// tests/core/kinds/compile.property.test.ts pins the two together on every kind.
import { findFunction } from '../functions/index.ts';
import { evaluateValue, type RawArg } from '../registry/evaluate.ts';
import { evalExpr, normaliseText, type EvalContext, type EvalResult, type Expr } from './expr.ts';

/** The physics as a closure: the value, or a throw of FAILED where evalExpr gives an error. */
export type Compiled = (ctx: EvalContext) => number;

/**
 * Thrown by a compiled closure where the tree evaluator gives an error, and caught by the
 * callers here (made once: no stack is captured per row).
 */
const FAILED = new Error('compiled evaluation failed; the tree evaluator gives the message');

const compiled = new WeakMap<Expr, Compiled>();

/** The closure for a tree, compiled on first use (a tree is never changed once built). */
export function compileExpr(e: Expr): Compiled {
  let f = compiled.get(e);
  if (f === undefined) {
    f = compile(e);
    compiled.set(e, f);
  }
  return f;
}

/**
 * Evaluate through the compiled closure; where it fails, through the tree, which gives the
 * message. Same result as evalExpr(e, ctx); never throws.
 */
export function evalCompiled(e: Expr, ctx: EvalContext): EvalResult {
  const f = compileExpr(e);
  try {
    return { ok: true, value: f(ctx) };
  } catch (x) {
    if (x !== FAILED) throw x;
    return evalExpr(e, ctx);
  }
}

/** Run closures that may fail; the fallback (the tree evaluator) runs when one of them does. */
export function tryCompiled<T>(run: () => T, fallback: () => T): T {
  try {
    return run();
  } catch (x) {
    if (x !== FAILED) throw x;
    return fallback();
  }
}

const fail = (): never => {
  throw FAILED;
};

// Text as ifText compares it; sites repeat a handful of supply texts over thousands of rows.
const normalised = new Map<string, string>();
function normalisedText(text: string): string {
  let t = normalised.get(text);
  if (t === undefined) {
    t = normaliseText(text);
    if (normalised.size > 1_000) normalised.clear(); // texts typed by hand: keep the cache small
    normalised.set(text, t);
  }
  return t;
}

type IfText = Extract<Expr, { k: 'ifText' }>;

/**
 * A run of text tests on one column (ifText whose `otherwise` is again ifText on the same
 * column, as bySupply writes a kind's supply arrangements) as one look-up of the row's text:
 * the first test in the run that matches wins, as when the tree is walked.
 */
function textChoice<T>(e: IfText, part: (e: Expr) => T): (ctx: EvalContext) => T {
  const key = e.key;
  const branches = new Map<string, T>();
  let at: Expr = e;
  while (at.k === 'ifText' && at.key === key) {
    if (!branches.has(at.equals)) branches.set(at.equals, part(at.then));
    at = at.otherwise;
  }
  const otherwise = part(at);
  return (ctx) => {
    const text = ctx.text?.(key);
    return branches.get(text === undefined ? '' : normalisedText(text)) ?? otherwise;
  };
}

function compile(e: Expr): Compiled {
  switch (e.k) {
    case 'num': {
      const v = e.v;
      return () => v;
    }
    case 'col': {
      const key = e.key;
      return (ctx) => ctx.col(key) ?? 0;
    }
    case 'var': {
      const name = e.name;
      return (ctx) => ctx.variable(name);
    }
    case 'neg': {
      const a = compileExpr(e.a);
      return (ctx) => -a(ctx);
    }
    case 'op':
      return compileOp(e.op, compileExpr(e.a), compileExpr(e.b));
    case 'ifPositive': {
      const test = compileExpr(e.test);
      const then = compileExpr(e.then);
      const otherwise = compileExpr(e.otherwise);
      return (ctx) => (test(ctx) > 0 ? then(ctx) : otherwise(ctx));
    }
    case 'ifText': {
      const choose = textChoice(e, compileExpr);
      return (ctx) => choose(ctx)(ctx);
    }
    case 'call':
      return compileCall(e.fn, e.args);
  }
}

function compileOp(op: '+' | '-' | '*' | '/', a: Compiled, b: Compiled): Compiled {
  switch (op) {
    case '+':
      return (ctx) => {
        const x = a(ctx);
        return x + b(ctx);
      };
    case '-':
      return (ctx) => {
        const x = a(ctx);
        return x - b(ctx);
      };
    case '*':
      return (ctx) => {
        const x = a(ctx);
        return x * b(ctx);
      };
    case '/':
      return (ctx) => {
        const x = a(ctx);
        const y = b(ctx);
        return y === 0 ? fail() : x / y;
      };
  }
}

type CompiledArgument = (ctx: EvalContext) => number | null;

/** An argument as the engine hands it over: a cell (or a choice landing on one) passes a blank as null. */
function compileArgument(a: Expr): CompiledArgument {
  if (a.k === 'col') {
    const key = a.key;
    return (ctx) => ctx.col(key) ?? null;
  }
  if (a.k === 'ifPositive') {
    const test = compileExpr(a.test);
    const then = compileArgument(a.then);
    const otherwise = compileArgument(a.otherwise);
    return (ctx) => (test(ctx) > 0 ? then(ctx) : otherwise(ctx));
  }
  if (a.k === 'ifText') {
    const choose = textChoice(a, compileArgument);
    return (ctx) => choose(ctx)(ctx);
  }
  return compileExpr(a);
}

function compileCall(fn: string, args: readonly Expr[]): Compiled {
  const spec = findFunction(fn);
  if (!spec) return fail;
  const value = (raw: RawArg[]): number => {
    const v = evaluateValue(spec, raw);
    return v === v ? v : fail(); // NaN: evaluate gives an error
  };
  const parts = args.map(compileArgument);
  // The catalogue's functions take two to five arguments: an array literal per call, no loop.
  const [a, b, c, d, e] = parts;
  if (parts.length === 2 && a && b) return (ctx) => value([a(ctx), b(ctx)]);
  if (parts.length === 3 && a && b && c) return (ctx) => value([a(ctx), b(ctx), c(ctx)]);
  if (parts.length === 4 && a && b && c && d) return (ctx) => value([a(ctx), b(ctx), c(ctx), d(ctx)]);
  if (parts.length === 5 && a && b && c && d && e)
    return (ctx) => value([a(ctx), b(ctx), c(ctx), d(ctx), e(ctx)]);
  return (ctx) => value(parts.map((p) => p(ctx)));
}
