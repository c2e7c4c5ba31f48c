import { describe, expect, it } from 'vitest';
import { evaluate, inInterval } from '../../../src/core/registry/evaluate.ts';
import { expandCall, isCellReference } from '../../../src/core/registry/expand.ts';
import { COSPHI, KVA_TOTAL } from '../../../src/core/functions/powerTriangle.ts';
import { CATALOGUE, findFunction } from '../../../src/core/functions/index.ts';
import type { RawArg } from '../../../src/core/registry/evaluate.ts';
import type { FunctionSpec } from '../../../src/core/registry/spec.ts';

describe('argument validation', () => {
  it('names function, position, argument and value for text', () => {
    const r = evaluate(COSPHI, ['abc', 1]);
    expect(r).toEqual({
      ok: false,
      message: 'COSPHI: argument 1 (p_kw) must be a number in kW; got text "abc"',
    });
  });
  it('a plain ratio (unit 1) is said with its allowed range, never "a number in 1"', () => {
    const motor = findFunction('KW.MOTOR') as FunctionSpec;
    expect(evaluate(motor, [75, 'abc'])).toEqual({
      ok: false,
      message: 'KW.MOTOR: argument 2 (eff) must be a number in (0, 1]; got text "abc"',
    });
    expect(evaluate(motor, [75, null])).toEqual({
      ok: false,
      message: 'KW.MOTOR: argument 2 (eff) is a blank cell; a number in (0, 1] is required',
    });
    // No message of any catalogue function says "in 1".
    for (const spec of CATALOGUE)
      spec.params.forEach((p, i) => {
        if (p.type === 'boolean') return;
        const args = spec.params.map(() => 1 as RawArg);
        args[i] = 'x';
        const r = evaluate(spec, args);
        expect(!r.ok && r.message, spec.name).not.toMatch(/ in 1;| in 1 is/);
      });
  });
  it('reports a blank required argument', () => {
    const r = evaluate(KVA_TOTAL, [3, null]);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toContain('argument 2 (q_kvar) is a blank cell');
  });
  it('reports too many arguments', () => {
    const r = evaluate(KVA_TOTAL, [3, 4, 5]);
    expect(!r.ok && r.message).toBe('KVA.TOTAL: takes at most 2 arguments; got 3');
  });
  it('interval bounds honour open and closed ends', () => {
    expect(inInterval(0, { lo: 0, loOpen: true })).toBe(false);
    expect(inInterval(0, { lo: 0 })).toBe(true);
    expect(inInterval(1, { lo: 0, hi: 1, loOpen: true })).toBe(true);
    expect(inInterval(Number.NaN, { lo: 0 })).toBe(false);
  });
});

describe('plain-formula expansion', () => {
  it('guards required cell references: errors and type first, then size, then the cross-argument rule', () => {
    expect(expandCall(COSPHI, ['A1', 'B1'])).toBe(
      'IF(OR(A1<>A1,B1<>B1,OR(ISLOGICAL(A1),ISTEXT(A1),ISBLANK(A1)),OR(ISLOGICAL(B1),ISTEXT(B1),ISBLANK(B1))),NA(),' +
        'IF(OR(ABS(A1)>1e+30,AND(A1<>0,ABS(A1)<1e-30),ABS(B1)>1e+30,AND(B1<>0,ABS(B1)<1e-30)),NA(),' +
        'IF(OR(AND(A1=0,B1=0)),NA(),ABS(A1)/SQRT(POWER(A1,2)+POWER(B1,2)))))',
    );
  });
  it('a number typed in the formula needs no type guard, and no size guard when in range', () => {
    expect(expandCall(COSPHI, ['3', '4'])).toBe(
      'IF(OR(AND(3=0,4=0)),NA(),ABS(3)/SQRT(POWER(3,2)+POWER(4,2)))',
    );
    expect(expandCall(COSPHI, ['1e40', '4'])).toContain('ABS(1e40)>1e+30');
  });
  it('recognises cell references but not ranges', () => {
    expect(isCellReference('$B$2')).toBe(true);
    expect(isCellReference("'Motors list'!C3")).toBe(true);
    expect(isCellReference('A1:B2')).toBe(false);
  });
});
