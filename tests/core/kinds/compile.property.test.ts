// The compiled closures (compile.ts) against the tree evaluator (evalExpr), the reference: on
// every registered kind's physics, and on random trees, with random rows (blanks, zeros, values
// inside and outside the catalogue's domains, supply texts as typed), the two give the same
// result: the same number (Object.is, so -0 and 0 are told apart) or the same message and column.
// The closures must also succeed exactly where the tree does (the tree runs only for messages).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  add,
  allKinds,
  call,
  col,
  columnsOf,
  div,
  evalExpr,
  HZ,
  ifPositive,
  ifText,
  mul,
  N,
  neg,
  num,
  sub,
  X,
  type EvalContext,
  type Expr,
  type KindSpec,
} from '../../../src/core/kinds/index.ts';
import { compileExpr, evalCompiled, tryCompiled } from '../../../src/core/kinds/compile.ts';

/** Every physics tree of a kind, named for messages. */
function trees(k: KindSpec): Array<[string, Expr]> {
  const out: Array<[string, Expr | string | undefined]> = [
    ['p', k.shunt?.p],
    ['q', k.shunt?.q],
    ['resonanceKvar', k.shunt?.resonanceKvar],
    ['pLoss', k.branch?.pLoss],
    ['qAbsorbed', k.branch?.qAbsorbed],
    ['qDelivered', k.branch?.qDelivered],
    ['rating', k.branch?.rating],
  ];
  return out.filter((t): t is [string, Expr] => typeof t[1] === 'object');
}

// Values a row may hold: blank, zero, typical magnitudes, negatives, and the extremes the
// catalogue refuses (so both the closures' success and their fallback are exercised).
const value: fc.Arbitrary<number | undefined> = fc.oneof(
  fc.constant(undefined),
  fc.constant(0),
  fc.double({ min: 0.01, max: 2, noNaN: true }),
  fc.double({ min: 0.1, max: 5_000, noNaN: true }),
  fc.integer({ min: -3, max: 120 }),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

interface Row {
  readonly values: Record<string, number | undefined>;
  readonly supply: string | undefined;
  readonly vars: { x: number; n: number; hz: number; sUnit: number };
}

function rowOf(columns: readonly string[], supplies: readonly string[]): fc.Arbitrary<Row> {
  return fc.record({
    values: fc.tuple(...columns.map(() => value)).map((vs) => {
      const out: Record<string, number | undefined> = {};
      columns.forEach((c, i) => (out[c] = vs[i]));
      return out;
    }),
    supply: fc.option(fc.oneof(fc.constantFrom(...supplies, ' VSD 6-Pulse ', 'Soft-Starter'), fc.string()), {
      nil: undefined,
    }),
    vars: fc.record({
      x: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1.5, noNaN: true })),
      n: fc.integer({ min: 0, max: 4 }),
      hz: fc.constantFrom(50, 60, 0),
      sUnit: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 50_000, noNaN: true })),
    }),
  });
}

function context(r: Row): EvalContext {
  return {
    col: (k) => r.values[k],
    text: (k) => (k === 'supply' ? r.supply : undefined),
    variable: (name) => r.vars[name],
    variableColumn: (name) => (name === 'x' ? 'load:night' : undefined),
  };
}

const seen = { ok: 0, failed: 0 };

function sameResult(e: Expr, r: Row, where: string): void {
  const ctx = context(r);
  const want = evalExpr(e, ctx);
  const got = evalCompiled(e, ctx);
  expect(got, where).toEqual(want);
  if (want.ok && got.ok)
    expect(Object.is(got.value, want.value), `${where}: ${got.value} vs ${want.value}`).toBe(true);
  // The closure alone: succeeds exactly where the tree does.
  const f = compileExpr(e);
  const alone = tryCompiled(
    () => ({ ok: true, value: f(ctx) }),
    () => ({ ok: false }),
  );
  expect(alone.ok, where).toBe(want.ok);
  seen[want.ok ? 'ok' : 'failed']++;
}

describe('compiled physics equals the tree evaluator', () => {
  for (const kind of allKinds()) {
    for (const [name, e] of trees(kind)) {
      it(`${kind.name}: ${name}`, () => {
        const supplies = (kind.supplies ?? []).flatMap((s) => [s.name, ...s.aliases]);
        fc.assert(
          fc.property(rowOf([...columnsOf(e)], supplies), (r) => sameResult(e, r, `${kind.name}.${name}`)),
          { numRuns: 300 },
        );
      });
    }
  }

  it('on random trees: arithmetic, blanks, division by zero, choices, catalogue calls', () => {
    const leaf: fc.Arbitrary<Expr> = fc.oneof(
      fc.integer({ min: -3, max: 9 }).map(num),
      fc.constantFrom('a', 'b', 'c').map(col),
      fc.constantFrom(X, N, HZ),
    );
    const tree: fc.Arbitrary<Expr> = fc.letrec<{ e: Expr }>((t) => ({
      e: fc.oneof(
        { depthSize: 'small', withCrossShrink: true },
        leaf,
        fc.tuple(t('e'), t('e')).map(([a, b]) => add(a, b)),
        fc.tuple(t('e'), t('e')).map(([a, b]) => sub(a, b)),
        fc.tuple(t('e'), t('e')).map(([a, b]) => mul(a, b)),
        fc.tuple(t('e'), t('e')).map(([a, b]) => div(a, b)),
        t('e').map(neg),
        fc.tuple(t('e'), t('e'), t('e')).map(([a, b, c]) => ifPositive(a, b, c)),
        fc
          .tuple(fc.constantFrom('vsd 6 pulse', 'soft starter', ''), t('e'), t('e'))
          .map(([equals, a, b]) => ifText('supply', equals, a, b)),
        // Arguments that are cells or choices landing on cells pass a blank as "not given".
        fc.tuple(t('e'), t('e')).map(([a, b]) => call('KVAR.LOAD', ifPositive(a, col('a'), b), col('c'))),
        t('e').map((a) => call('KVA.TOTAL', a, col('b'))),
        fc.tuple(t('e'), t('e')).map(([a, b]) => call('NO.SUCH.FUNCTION', a, b)),
      ),
    })).e;
    fc.assert(
      fc.property(tree, rowOf(['a', 'b', 'c'], ['dol', 'vsd 6 pulse']), (e, r) =>
        sameResult(e, r, 'random tree'),
      ),
      { numRuns: 500 },
    );
  });

  it('exercised both the closures and the fallback', () => {
    expect(seen.ok).toBeGreaterThan(100);
    expect(seen.failed).toBeGreaterThan(100);
  });
});
