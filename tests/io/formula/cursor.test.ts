import { describe, expect, it } from 'vitest';
import { callAtCursor } from '../../../src/io/formula/cursor.ts';

/** The cursor sits where the "|" is. */
function at(textWithBar: string) {
  const cursor = textWithBar.indexOf('|');
  return callAtCursor(textWithBar.replace('|', ''), cursor);
}

describe('callAtCursor', () => {
  it('finds the function and argument while typing', () => {
    expect(at('=KVAR.MOTOR(|')).toEqual({ name: 'KVAR.MOTOR', argIndex: 0 });
    expect(at('=kvar.motor(75,0.95,|')).toEqual({ name: 'KVAR.MOTOR', argIndex: 2 });
    expect(at('=KVAR.MOTOR(75,|0.95)')).toEqual({ name: 'KVAR.MOTOR', argIndex: 1 });
  });
  it('takes the innermost call, and the outer one after the inner closes', () => {
    expect(at('=COSPHI(KVA.TOTAL(1,|')).toEqual({ name: 'KVA.TOTAL', argIndex: 1 });
    expect(at('=COSPHI(KVA.TOTAL(1,2),|')).toEqual({ name: 'COSPHI', argIndex: 1 });
  });
  it('ignores commas in strings, arrays and grouping parentheses', () => {
    expect(at('=F("a,b",|')).toEqual({ name: 'F', argIndex: 1 });
    expect(at('=F({1,2;3,4},|')).toEqual({ name: 'F', argIndex: 1 });
    expect(at('=F((1+2),(3|')).toEqual({ name: 'F', argIndex: 1 });
    expect(at('=F("a,(b|')).toEqual({ name: 'F', argIndex: 0 });
  });
  it('is undefined outside any call', () => {
    expect(at('=1+|2')).toBeUndefined();
    expect(at('=KVA.TOTAL|(')).toBeUndefined();
    expect(at('=F(1)|')).toBeUndefined();
    expect(at('|')).toBeUndefined();
  });
});
