// A typed formula on Enter, as spreadsheet users expect: open brackets closed, ';' between
// arguments read as ',' where nothing else can be meant, and otherwise a message in words.
import { describe, expect, it } from 'vitest';
import { commaSeparated, completeTypedFormula } from '../../../src/io/formula/entry.ts';
import { parseFormula } from '../../../src/io/formula/parse.ts';

describe('completeTypedFormula', () => {
  it.each([
    ['=SUM(1,2', '=SUM(1,2)', ['the open bracket closed']],
    ['=SUM(A1,KVAR.LOAD(50,0.9', '=SUM(A1,KVAR.LOAD(50,0.9))', ['2 open brackets closed']],
    ['=(1+2 ', '=(1+2)', ['the open bracket closed']],
    ['=A1&"abc', '=A1&"abc"', ['the open quote closed']],
    ['=IF(A1>0,"yes', '=IF(A1>0,"yes")', ['the open quote and the open bracket closed']],
    ['=KVAR.LOAD(50;0.9)', '=KVAR.LOAD(50,0.9)', ['";" between arguments read as ","']],
    [
      '=IF(A1>0;"a;b";KVA.TOTAL(3;4',
      '=IF(A1>0,"a;b",KVA.TOTAL(3,4))',
      ['";" between arguments read as ","', '2 open brackets closed'],
    ],
    ['=SUM(1;{1;2})', '=SUM(1,{1;2})', ['";" between arguments read as ","']],
  ])('%s → %s', (typed, stored, changes) => {
    expect(completeTypedFormula(typed)).toEqual({ text: stored, changes });
    expect(parseFormula(stored).ok).toBe(true);
  });

  it.each([
    ['a formula that reads already', '=SUM(1,2)'],
    ['an array with rows', '={1;2}'],
    ['text, not a formula', 'SUM(1,2'],
    ['a closing bracket too many', '=SUM(1,2))'],
    ['a mismatched bracket', '=SUM(1,2}'],
    ['";" with a "," elsewhere: 0,9 may be a decimal comma', '=KVAR.LOAD(50;0,9)'],
    ['an operator left at the end', '=SUM(1,2+'],
  ])('leaves %s as typed', (_, typed) => {
    expect(completeTypedFormula(typed)).toEqual({ text: typed, changes: [] });
  });
});

describe('";" that cannot be read as "," is explained in words, not as a parser dump', () => {
  it('in the arguments of a call and anywhere else', () => {
    for (const f of ['=KVAR.LOAD(50;0,9)', '=1;2']) {
      const r = parseFormula(f);
      expect(r.ok).toBe(false);
      expect(!r.ok && r.message).toMatch(
        /^";" at character \d+ is not read here: arguments are separated by "," and decimals written with "\." \(as in spreadsheet programs set to English: SUM\(1,2\.5\), not SUM\(1;2,5\)\)$/,
      );
    }
  });
  it('commaSeparated alone (the command line) does not close brackets', () => {
    expect(commaSeparated('=KVA.TOTAL(3;4)').text).toBe('=KVA.TOTAL(3,4)');
    expect(commaSeparated('=KVA.TOTAL(3;4').text).toBe('=KVA.TOTAL(3;4');
  });
});
