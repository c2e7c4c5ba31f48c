// The physics of an equipment kind, written once as a small expression tree. The same tree is
// evaluated through the function catalogue for the roll-up and the CLI, and printed as the
// formula text of the live and exported workbook, so the two cannot say different things.
//
// Blank cells follow spreadsheet rules in both: a blank input is 0 in arithmetic and "not given"
// as a catalogue argument (the default for an optional argument, an error for a required one).
import { findFunction } from '../functions/index.ts';
import { evaluate, type RawArg } from '../registry/evaluate.ts';

/** Names the framework fills in: load factor used, units in service, site frequency, kVA per unit carried. */
export type VarName = 'x' | 'n' | 'hz' | 'sUnit';

export type Expr =
  | { readonly k: 'num'; readonly v: number }
  | { readonly k: 'col'; readonly key: string }
  | { readonly k: 'var'; readonly name: VarName }
  | { readonly k: 'call'; readonly fn: string; readonly args: readonly Expr[] }
  | { readonly k: 'op'; readonly op: '+' | '-' | '*' | '/'; readonly a: Expr; readonly b: Expr }
  | { readonly k: 'neg'; readonly a: Expr }
  /** then when `test` (blank read as 0) is > 0, else `otherwise`. */
  | { readonly k: 'ifPositive'; readonly test: Expr; readonly then: Expr; readonly otherwise: Expr }
  /**
   * then when the text column `key`, case folded with hyphens read as spaces and spaces trimmed
   * (normaliseText), equals `equals` (already normalised), else `otherwise`.
   */
  | {
      readonly k: 'ifText';
      readonly key: string;
      readonly equals: string;
      readonly then: Expr;
      readonly otherwise: Expr;
    };

export const num = (v: number): Expr => ({ k: 'num', v });
export const col = (key: string): Expr => ({ k: 'col', key });
export const X: Expr = { k: 'var', name: 'x' };
export const N: Expr = { k: 'var', name: 'n' };
export const HZ: Expr = { k: 'var', name: 'hz' };
export const S_UNIT: Expr = { k: 'var', name: 'sUnit' };
export const call = (fn: string, ...args: Expr[]): Expr => ({ k: 'call', fn, args });
export const add = (a: Expr, b: Expr): Expr => ({ k: 'op', op: '+', a, b });
export const sub = (a: Expr, b: Expr): Expr => ({ k: 'op', op: '-', a, b });
export const mul = (a: Expr, b: Expr): Expr => ({ k: 'op', op: '*', a, b });
export const div = (a: Expr, b: Expr): Expr => ({ k: 'op', op: '/', a, b });
export const neg = (a: Expr): Expr => ({ k: 'neg', a });
export const ifPositive = (test: Expr, then: Expr, otherwise: Expr): Expr => ({
  k: 'ifPositive',
  test,
  then,
  otherwise,
});

export const ifText = (key: string, equals: string, then: Expr, otherwise: Expr): Expr => {
  if (normaliseText(equals) !== equals) throw new Error(`ifText: "${equals}" is not normalised`);
  return { k: 'ifText', key, equals, then, otherwise };
};

/**
 * Text as ifText compares it, the way the printed LOWER(TRIM(SUBSTITUTE(cell,"-"," "))) does in
 * every spreadsheet program: hyphens read as spaces, spaces trimmed and runs of them made one
 * (TRIM), case folded (LOWER).
 */
export function normaliseText(text: string): string {
  return text.replace(/-/g, ' ').replace(/ +/g, ' ').trim().toLowerCase();
}

// ---------------------------------------------------------------- printing as formula text

export interface PrintContext {
  /** Reference to the row's cell for an input column, e.g. F5. */
  col(key: string): string;
  /** Text for a framework variable, e.g. the load-used cell or Site!$B$3. */
  variable(name: VarName): string;
}

/** Binding strength: sums 1, products 2, negation 3, everything else 4. */
function strength(e: Expr): number {
  if (e.k === 'op') return e.op === '+' || e.op === '-' ? 1 : 2;
  if (e.k === 'neg' || (e.k === 'num' && e.v < 0)) return 3;
  return 4;
}

function printAtLeast(e: Expr, ctx: PrintContext, min: number): string {
  const text = printExpr(e, ctx);
  return strength(e) < min ? `(${text})` : text;
}

/** Formula text (without the leading '='); parentheses only where precedence needs them. */
export function printExpr(e: Expr, ctx: PrintContext): string {
  switch (e.k) {
    case 'num':
      return String(e.v);
    case 'col':
      return ctx.col(e.key);
    case 'var':
      return ctx.variable(e.name);
    case 'call':
      return `${e.fn}(${e.args.map((a) => printExpr(a, ctx)).join(',')})`;
    case 'neg':
      return `-${printAtLeast(e.a, ctx, 3)}`;
    case 'op': {
      const left = printAtLeast(e.a, ctx, e.op === '+' || e.op === '-' ? 1 : 2);
      const right = printAtLeast(e.b, ctx, e.op === '+' ? 1 : e.op === '-' || e.op === '*' ? 2 : 3);
      return `${left}${e.op}${right}`;
    }
    case 'ifPositive': {
      // A blank test cell reads 0 in every program (not N(), which one program refuses on a blank).
      const t =
        e.test.k === 'col'
          ? `IF(ISBLANK(${ctx.col(e.test.key)}),0,${ctx.col(e.test.key)})`
          : printExpr(e.test, ctx);
      return `IF(${t}>0,${printExpr(e.then, ctx)},${printExpr(e.otherwise, ctx)})`;
    }
    case 'ifText':
      return `IF(LOWER(TRIM(SUBSTITUTE(${ctx.col(e.key)},"-"," ")))="${e.equals}",${printExpr(e.then, ctx)},${printExpr(e.otherwise, ctx)})`;
  }
}

// ---------------------------------------------------------------- evaluation

export interface EvalContext {
  /** The row's value for an input column; undefined = blank. */
  col(key: string): number | undefined;
  variable(name: VarName): number;
  /** The row's text for a text column (ifText); undefined = blank. */
  text?(key: string): string | undefined;
  /** The interchange column a variable stands for, for messages (e.g. 'load:night'). */
  variableColumn?(name: VarName): string | undefined;
}

export type EvalResult =
  | { readonly ok: true; readonly value: number }
  | { readonly ok: false; readonly message: string; readonly column: string | undefined };

const ok = (value: number): EvalResult => ({ ok: true, value });

/** The column an argument came from, for a message that names it. */
function columnOf(e: Expr, ctx: EvalContext): string | undefined {
  if (e.k === 'col') return e.key;
  if (e.k === 'var') return ctx.variableColumn?.(e.name);
  if (e.k === 'op') return columnOf(e.a, ctx) ?? columnOf(e.b, ctx);
  return undefined;
}

/** Evaluate through the catalogue; never throws. */
export function evalExpr(e: Expr, ctx: EvalContext): EvalResult {
  switch (e.k) {
    case 'num':
      return ok(e.v);
    case 'col':
      return ok(ctx.col(e.key) ?? 0);
    case 'var':
      return ok(ctx.variable(e.name));
    case 'neg': {
      const a = evalExpr(e.a, ctx);
      return a.ok ? ok(-a.value) : a;
    }
    case 'op': {
      const a = evalExpr(e.a, ctx);
      if (!a.ok) return a;
      const b = evalExpr(e.b, ctx);
      if (!b.ok) return b;
      if (e.op === '/' && b.value === 0) {
        return { ok: false, message: 'division by zero', column: columnOf(e.b, ctx) };
      }
      const v =
        e.op === '+'
          ? a.value + b.value
          : e.op === '-'
            ? a.value - b.value
            : e.op === '*'
              ? a.value * b.value
              : a.value / b.value;
      return ok(v);
    }
    case 'ifPositive': {
      const t = evalExpr(e.test, ctx);
      if (!t.ok) return t;
      return evalExpr(t.value > 0 ? e.then : e.otherwise, ctx);
    }
    case 'ifText':
      return evalExpr(textMatches(e, ctx) ? e.then : e.otherwise, ctx);
    case 'call':
      return evalCall(e.fn, e.args, ctx);
  }
}

function textMatches(e: Extract<Expr, { k: 'ifText' }>, ctx: EvalContext): boolean {
  return normaliseText(ctx.text?.(e.key) ?? '') === e.equals;
}

/**
 * An argument as the engine hands it to a function: a cell, or a choice that lands on a cell,
 * passes a blank as "not given" (null); anything computed passes its number.
 */
function argument(
  a: Expr,
  ctx: EvalContext,
): { ok: true; value: number | null } | { ok: false; message: string; column: string | undefined } {
  if (a.k === 'col') return { ok: true, value: ctx.col(a.key) ?? null };
  if (a.k === 'ifPositive') {
    const t = evalExpr(a.test, ctx);
    if (!t.ok) return t;
    return argument(t.value > 0 ? a.then : a.otherwise, ctx);
  }
  if (a.k === 'ifText') return argument(textMatches(a, ctx) ? a.then : a.otherwise, ctx);
  return evalExpr(a, ctx);
}

function evalCall(fn: string, args: readonly Expr[], ctx: EvalContext): EvalResult {
  const spec = findFunction(fn);
  if (!spec) return { ok: false, message: `catalogue function ${fn} is not available`, column: undefined };
  const raw: RawArg[] = [];
  for (const a of args) {
    const r = argument(a, ctx);
    if (!r.ok) return r;
    raw.push(r.value);
  }
  const r = evaluate(spec, raw);
  if (r.ok) return r;
  const m = /argument (\d+) \(/.exec(r.message);
  const at = m ? args[Number(m[1]) - 1] : undefined;
  const column =
    (at ? columnOf(at, ctx) : undefined) ?? args.map((a) => columnOf(a, ctx)).find((c) => c !== undefined);
  return { ok: false, message: r.message, column };
}

/** Every input column an expression reads. */
export function columnsOf(e: Expr, out = new Set<string>()): Set<string> {
  if (e.k === 'col') out.add(e.key);
  else if (e.k === 'call') for (const a of e.args) columnsOf(a, out);
  else if (e.k === 'op') {
    columnsOf(e.a, out);
    columnsOf(e.b, out);
  } else if (e.k === 'neg') columnsOf(e.a, out);
  else if (e.k === 'ifPositive') {
    columnsOf(e.test, out);
    columnsOf(e.then, out);
    columnsOf(e.otherwise, out);
  } else if (e.k === 'ifText') {
    out.add(e.key);
    columnsOf(e.then, out);
    columnsOf(e.otherwise, out);
  }
  return out;
}
