// Cell conversion. Unit factors: SI prefixes (BIPM SI Brochure, 9th ed., Table 7); percent = 1/100.
import { describe, expect, it } from 'vitest';
import { readCell } from '../../../src/io/import/values.ts';
import { ownUnit, unitFor } from '../../../src/io/import/units.ts';

const kw = ownUnit('p_kw');
const mw = unitFor('p_kw', 'MW')!;
const v = unitFor('u_kv', 'V')!;
const pct = unitFor('eff', '%')!;

describe('readCell', () => {
  it('scales numbers by the column unit without binary noise', () => {
    expect(readCell(1.2, 'p_kw', mw, false)).toEqual({ kind: 'number', value: 1200 });
    expect(readCell(400, 'u_kv', v, false)).toEqual({ kind: 'number', value: 0.4 });
    expect(readCell('95', 'eff', pct, false)).toEqual({ kind: 'number', value: 0.95 });
    expect(readCell(0.7, 'u_kv', v, false)).toEqual({ kind: 'number', value: 0.0007 });
    expect(readCell(1.5e-7, 'p_kw', mw, false)).toEqual({ kind: 'number', value: 1.5e-4 });
  });

  it('reads a unit written in the cell, overriding the column unit', () => {
    expect(readCell('11 kV', 'u_kv', v, false)).toMatchObject({ kind: 'number', value: 11 });
    expect(readCell('400V', 'u_kv', ownUnit('u_kv'), false)).toMatchObject({ kind: 'number', value: 0.4 });
    expect(readCell('95%', 'eff', ownUnit('eff'), false)).toMatchObject({ kind: 'number', value: 0.95 });
    expect(readCell('6 %', 'uk_pct', ownUnit('uk_pct'), false)).toMatchObject({ kind: 'number', value: 6 });
    expect(readCell('250 kW', 'p_kw', mw, false)).toMatchObject({ kind: 'number', value: 250 });
  });

  it('handles decimal commas and thousands separators', () => {
    expect(readCell('0,86', 'cos_phi', ownUnit('cos_phi'), true)).toEqual({ kind: 'number', value: 0.86 });
    expect(readCell('1.250,5', 'p_kw', kw, true)).toEqual({ kind: 'number', value: 1250.5 });
    expect(readCell('1,250.5', 'p_kw', kw, false)).toEqual({ kind: 'number', value: 1250.5 });
    expect(readCell('1 250', 'p_kw', kw, false)).toEqual({ kind: 'number', value: 1250 });
    expect(readCell('1,250', 'p_kw', kw, false)).toEqual({ kind: 'number', value: 1250 });
    expect(readCell('1,250', 'p_kw', kw, true)).toEqual({ kind: 'number', value: 1.25 });
  });

  it('passes text through for the parser to report, and keeps blanks blank', () => {
    expect(readCell('abc', 'p_kw', kw, false)).toEqual({ kind: 'text', text: 'abc' });
    expect(readCell('12 kvar', 'p_kw', kw, false)).toEqual({ kind: 'text', text: '12 kvar' });
    expect(readCell('  ', 'p_kw', kw, false)).toEqual({ kind: 'blank' });
    expect(readCell(null, 'tag', ownUnit('tag'), false)).toEqual({ kind: 'blank' });
    expect(readCell(101, 'tag', ownUnit('tag'), false)).toEqual({ kind: 'text', text: '101' });
  });
});
