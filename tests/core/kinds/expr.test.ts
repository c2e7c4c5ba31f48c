// The physics is written once as an expression: printed as a formula and evaluated through the
// catalogue, the two must give the same number. Random expression trees of +, −, ×, ÷, negation,
// the blank-safe test and catalogue calls are printed, computed by the engine (an independent
// evaluator of the printed text), and compared with evalExpr.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  add,
  call,
  col,
  div,
  evalExpr,
  ifPositive,
  mul,
  neg,
  num,
  printExpr,
  sub,
  X,
  type Expr,
} from '../../../src/core/kinds/index.ts';
import { createEngine, evaluateFormula } from '../../../src/engine/index.ts';

const cells = { a: 3.5, b: -2, c: 0.75, blank: undefined as number | undefined };
const refs: Record<string, string> = { a: 'A1', b: 'B1', c: 'C1', blank: 'D1' };

const leaf: fc.Arbitrary<Expr> = fc.oneof(
  fc.integer({ min: -9, max: 9 }).map(num),
  fc.constantFrom('a', 'b', 'c', 'blank').map(col),
  fc.constant(X),
);
const tree: fc.Arbitrary<Expr> = fc.letrec<{ e: Expr }>((t) => ({
  e: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    leaf,
    fc.tuple(t('e'), t('e')).map(([a, b]) => add(a, b)),
    fc.tuple(t('e'), t('e')).map(([a, b]) => sub(a, b)),
    fc.tuple(t('e'), t('e')).map(([a, b]) => mul(a, b)),
    fc.tuple(t('e'), leaf).map(([a, b]) => div(a, b)),
    t('e').map(neg),
    fc.tuple(t('e'), t('e')).map(([a, b]) => ifPositive(col('blank'), a, b)),
    t('e').map((a) => call('KVA.TOTAL', a, col('c'))),
  ),
})).e;

describe('an expression printed as a formula computes what evalExpr computes', () => {
  const hf = createEngine([{ name: 'Sheet1', cells: [[cells.a, cells.b, cells.c, null, 0.4]] }]);
  it('for random trees (precedence, negation, blanks, catalogue calls)', () => {
    fc.assert(
      fc.property(tree, (e) => {
        const text = printExpr(e, { col: (k) => refs[k] as string, variable: () => 'E1' });
        const want = evalExpr(e, { col: (k) => cells[k as keyof typeof cells], variable: () => 0.4 });
        const got = evaluateFormula(hf, `=${text}`);
        if (!want.ok) expect(got.ok, text).toBe(false);
        else if (!got.ok) expect.fail(`${text}: ${got.message}`);
        else expect(got.value as number, text).toBeCloseTo(want.value, 9);
      }),
      { numRuns: 300 },
    );
  });
});
