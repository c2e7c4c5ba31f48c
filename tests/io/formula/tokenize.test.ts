import { describe, expect, it } from 'vitest';
import { significantTokens, tokenize } from '../../../src/io/formula/tokenize.ts';

const kinds = (text: string) => significantTokens(text).map((t) => [t.kind, t.text]);

describe('tokenize', () => {
  it('covers the whole text, whitespace included, with positions', () => {
    const text = '= KVA.TOTAL( A1 , 2 )';
    const tokens = tokenize(text);
    expect(tokens.map((t) => t.text).join('')).toBe(text);
    for (const t of tokens) expect(text.slice(t.start, t.end)).toBe(t.text);
  });
  it('tells function names (followed by "(") from references and names', () => {
    expect(kinds('=LOG10(A1)+A1B+rate')).toEqual([
      ['op', '='],
      ['func', 'LOG10'],
      ['lparen', '('],
      ['ref', 'A1'],
      ['rparen', ')'],
      ['op', '+'],
      ['name', 'A1B'],
      ['op', '+'],
      ['name', 'rate'],
    ]);
  });
  it('reads dotted names, absolute and sheet references, ranges', () => {
    expect(
      kinds("KVAR.MOTOR($A$1,Sheet1!B2,'My sheet'!C3:D4,A:C,1:3)").filter(([k]) => k !== 'comma'),
    ).toEqual([
      ['func', 'KVAR.MOTOR'],
      ['lparen', '('],
      ['ref', '$A$1'],
      ['ref', 'Sheet1!B2'],
      ['ref', "'My sheet'!C3:D4"],
      ['ref', 'A:C'],
      ['ref', '1:3'],
      ['rparen', ')'],
    ]);
  });
  it('keeps a quote inside a sheet name and a string', () => {
    expect(kinds(`='Bob''s list'!A1&"say ""hi"", (ok)"`)).toEqual([
      ['op', '='],
      ['ref', "'Bob''s list'!A1"],
      ['op', '&'],
      ['string', '"say ""hi"", (ok)"'],
    ]);
  });
  it('numbers, booleans, errors and two-character operators', () => {
    expect(kinds('1.5e-3<=.5<>TRUE>=#N/A')).toEqual([
      ['number', '1.5e-3'],
      ['op', '<='],
      ['number', '.5'],
      ['op', '<>'],
      ['bool', 'TRUE'],
      ['op', '>='],
      ['error', '#N/A'],
    ]);
  });
  it('marks an unterminated string and unknown characters instead of throwing', () => {
    const t = tokenize('=F("abc');
    expect(t[t.length - 1]).toMatchObject({ kind: 'string', unterminated: true, text: '"abc' });
    expect(kinds('=1€')).toEqual([
      ['op', '='],
      ['number', '1'],
      ['unknown', '€'],
    ]);
  });
});
