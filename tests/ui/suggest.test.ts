import { describe, expect, it } from 'vitest';
import {
  accept,
  nameAtCursor,
  signatureAtCursor,
  signatureText,
  suggestions,
} from '../../src/ui/autocomplete/suggest.ts';
import { findFunction } from '../../src/core/functions/index.ts';

describe('name at cursor', () => {
  it('finds the word being typed in a formula', () => {
    expect(nameAtCursor('=kvar.mo', 8)).toEqual({ start: 1, end: 8, prefix: 'KVAR.MO' });
    expect(nameAtCursor('=1+KVA', 6)).toEqual({ start: 3, end: 6, prefix: 'KVA' });
    expect(nameAtCursor('=SUM(A1,kv', 10)?.prefix).toBe('KV');
  });
  it('stays quiet outside formulas, in strings and on references', () => {
    expect(nameAtCursor('KVAR', 4)).toBeUndefined();
    expect(nameAtCursor('="KVA', 5)).toBeUndefined();
    expect(nameAtCursor('=B12', 4)).toBeUndefined();
    expect(nameAtCursor('=Sheet1!KV', 10)).toBeUndefined();
  });
});

describe('suggestions', () => {
  it('lists catalogue functions first, prefix matches before part matches', () => {
    const names = suggestions('KVAR.M').map((s) => s.name);
    expect(names).toEqual(['KVAR.MOTOR', 'KVAR.MOTORCAP.MAX']);
    const motor = suggestions('MOTOR', ['MOD']).map((s) => s.name);
    expect(motor).toEqual(['KVAR.MOTOR', 'KVAR.MOTORCAP.MAX', 'KW.MOTOR']);
  });
  it('adds standard functions after ours', () => {
    const s = suggestions('CO', ['COS', 'COUNT', 'COSPHI']);
    expect(s[0]).toMatchObject({ name: 'COSPHI', catalogue: true });
    expect(s.slice(1).map((x) => x.name)).toEqual(['COS', 'COUNT']);
  });
});

describe('accepting a suggestion', () => {
  it('completes the name and opens the call', () => {
    const at = nameAtCursor('=1+kvar.mo', 10)!;
    expect(accept('=1+kvar.mo', at, 'KVAR.MOTOR')).toEqual({ text: '=1+KVAR.MOTOR(', cursor: 14 });
  });
  it('does not double an existing parenthesis', () => {
    const at = nameAtCursor('=KV(1,2)', 3)!;
    expect(accept('=KV(1,2)', at, 'KVA.TOTAL')).toEqual({ text: '=KVA.TOTAL(1,2)', cursor: 11 });
  });
});

describe('signature', () => {
  it('marks the argument in progress with its unit and range', () => {
    const sig = signatureAtCursor('=KVAR.MOTOR(90, 0.95, ', 22)!;
    expect(sig.spec.name).toBe('KVAR.MOTOR');
    expect(sig.argIndex).toBe(2);
    expect(sig.parts[2]).toMatchObject({ active: true });
    expect(sig.current?.param.name).toBe('cos_phi');
    expect(sig.current?.range).toBe('(0, 1]');
  });
  it('follows nesting', () => {
    const text = '=KVA.TOTAL(KW.MOTOR(90,0.95), 3';
    expect(signatureAtCursor(text, 26)?.spec.name).toBe('KW.MOTOR');
    expect(signatureAtCursor(text, text.length)?.argIndex).toBe(1);
  });
  it('writes optional arguments in brackets', () => {
    expect(signatureText(findFunction('KVA.TOTAL')!)).toBe('KVA.TOTAL(p_kw kW, q_kvar kvar) → kVA');
    expect(signatureText(findFunction('KVAR.MOTOR')!)).toMatch(/\[.*\]\) → kvar$/);
  });
});
