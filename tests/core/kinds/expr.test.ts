// The physics is written once as an expression: printed as a formula and evaluated through the
// catalogue, the two must give the same number. Random expression trees of +, −, ×, ÷, negation,
// the blank-safe test, the text test (case and hyphens folded) and catalogue calls are printed, computed by the engine (an independent
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
  ifText,
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
// Text cells as typed: case, hyphens and spaces vary; ifText compares them normalised.
const texts: Record<string, string | undefined> = { s: ' VSD  6-Pulse', t: 'soft-starter', u: undefined };
const S = texts.s as string;
const T = texts.t as string;
const refs: Record<string, string> = { a: 'A1', b: 'B1', c: 'C1', blank: 'D1', s: 'F1', t: 'G1', u: 'H1' };

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
    fc
      .tuple(
        fc.constantFrom('s', 't', 'u'),
        fc.constantFrom('vsd 6 pulse', 'soft starter', ''),
        t('e'),
        t('e'),
      )
      .map(([key, equals, a, b]) => ifText(key, equals, a, b)),
    t('e').map((a) => call('KVA.TOTAL', a, col('c'))),
  ),
})).e;

describe('an expression printed as a formula computes what evalExpr computes', () => {
  const hf = createEngine([{ name: 'Sheet1', cells: [[cells.a, cells.b, cells.c, null, 0.4, S, T, null]] }]);
  it('for random trees (precedence, negation, blanks, catalogue calls)', () => {
    fc.assert(
      fc.property(tree, (e) => {
        const text = printExpr(e, { col: (k) => refs[k] as string, variable: () => 'E1' });
        const want = evalExpr(e, {
          col: (k) => cells[k as keyof typeof cells],
          variable: () => 0.4,
          text: (k) => texts[k],
        });
        const got = evaluateFormula(hf, `=${text}`);
        if (!want.ok) expect(got.ok, text).toBe(false);
        else if (!got.ok) expect.fail(`${text}: ${got.message}`);
        else expect(got.value as number, text).toBeCloseTo(want.value, 9);
      }),
      { numRuns: 300 },
    );
  });
});
