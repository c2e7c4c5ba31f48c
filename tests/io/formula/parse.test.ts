import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseFormula } from '../../../src/io/formula/parse.ts';
import { printFormula, printNode } from '../../../src/io/formula/print.ts';
import type { Node } from '../../../src/io/formula/ast.ts';

function ast(text: string): Node {
  const r = parseFormula(text);
  if (!r.ok) throw new Error(r.message);
  return r.ast;
}

describe('parse and print', () => {
  it.each([
    '=1+2*3',
    '=KVA.TOTAL(3,4)',
    "=COSPHI(KVA.TOTAL(A1,$B$2),TANPHI(Sheet1!C3,'My sheet'!D4))",
    '=SUM(A1:B10)/COUNT(Data!A:A)',
    '=-2^2',
    '=2^-1',
    '=50%*A1',
    '="a, (b)"&"c""d"',
    '=IF(A1<>0,1,)',
    '=KVAR.LOAD(50,0.9,)',
    '=F(,,)',
    '=NOW()',
    '={1,2;3,-4}',
    '=A1>=B1',
    '=TRUE',
    '=#N/A',
    "='Bob''s list'!A1",
  ])('%s round-trips', (text) => {
    expect(printFormula(ast(text))).toBe(text);
  });

  it('ignores whitespace outside strings and sheet names', () => {
    expect(printFormula(ast('= KVA.TOTAL( \'A b\'!A1 , " x " )'))).toBe('=KVA.TOTAL(\'A b\'!A1," x ")');
  });

  it('follows spreadsheet precedence: unary minus above ^, ^ above * above + above & above comparison', () => {
    expect(ast('=-2^2')).toEqual({
      type: 'binary',
      op: '^',
      left: { type: 'unary', op: '-', arg: { type: 'number', text: '2' } },
      right: { type: 'number', text: '2' },
    });
    const n = ast('=1+2*3^2&"x"=A1');
    expect(n).toMatchObject({
      type: 'binary',
      op: '=',
      left: {
        type: 'binary',
        op: '&',
        left: { type: 'binary', op: '+', right: { op: '*', right: { op: '^' } } },
      },
    });
    expect(ast('=8/4/2')).toMatchObject({ op: '/', left: { op: '/' } });
    expect(ast('=5%^2')).toMatchObject({ op: '^', left: { type: 'percent' } });
  });

  it('records omitted arguments as null and the call position', () => {
    expect(ast('=X+F(1,,3)')).toMatchObject({
      right: { type: 'call', name: 'F', args: [{ type: 'number' }, null, { type: 'number' }], at: 4 },
    });
  });

  it.each([
    [
      '=KVA.TOTAL(3,',
      'the formula ends too early (after character 13); expected an argument or ")" to close "KVA.TOTAL(" opened at character 11',
    ],
    ['=1+', 'the formula ends too early (after character 3); expected a value'],
    ['=(1+2', 'the formula ends too early (after character 5); expected ")" to close the "(" at character 2'],
    ['=F(1 2)', 'unexpected "2" at character 6; expected "," or ")" in the arguments of F'],
    ['=1)', 'unexpected ")" at character 3; expected an operator or the end of the formula'],
    ['=F("abc', 'the text starting at character 4 has no closing quote (")'],
    ['=1€', '"€" at character 3 is not part of any formula syntax'],
    ['=', 'the formula ends too early (after character 1); expected an expression'],
  ])('%s is an error that says what and where', (text, message) => {
    expect(parseFormula(text)).toMatchObject({ ok: false, message });
  });

  it('printing then parsing then printing is stable for generated formulas', () => {
    const leaf = fc.oneof(
      fc.integer({ min: 0, max: 999 }).map((n): Node => ({ type: 'number', text: String(n) })),
      fc.constantFrom<Node>(
        { type: 'ref', text: 'A1', range: false },
        { type: 'ref', text: "'S x'!$B$2:C3", range: true },
        { type: 'string', value: 'a,"(b)' },
        { type: 'bool', value: false },
      ),
    );
    const tree = fc.letrec<{ node: Node }>((tie) => ({
      node: fc.oneof(
        { depthSize: 'small', withCrossShrink: true },
        leaf,
        fc.record({
          type: fc.constant('binary' as const),
          op: fc.constantFrom('+', '-', '*', '/', '^', '&', '=', '<>', '<=') as fc.Arbitrary<'+'>,
          left: tie('node'),
          right: tie('node'),
        }),
        fc.record({ type: fc.constant('unary' as const), op: fc.constant('-' as const), arg: tie('node') }),
        fc.record({ type: fc.constant('paren' as const), inner: tie('node') }),
        fc.record({
          type: fc.constant('call' as const),
          name: fc.constantFrom('KVA.TOTAL', 'IF', 'F'),
          args: fc.array(fc.option(tie('node'), { nil: null }), { maxLength: 3 }),
        }),
      ),
    })).node;
    fc.assert(
      fc.property(tree, (n) => {
        const text = '=' + printNode(n);
        const again = parseFormula(text);
        expect(again.ok && printFormula(again.ast), text).toBe(text);
      }),
      { numRuns: 300 },
    );
  });
});
