// Header reading: our synonym table and unit spellings. Unit factors are SI prefixes
// (BIPM, The International System of Units, 9th edition 2019, Table 7: k = 1e3, M = 1e6,
// m = 1e-3, µ = 1e-6, n = 1e-9, p = 1e-12).
import { describe, expect, it } from 'vitest';
import { columnLetter, readHeader } from '../../../src/io/import/headers.ts';
import { unitChoicesFor, unitFor } from '../../../src/io/import/units.ts';

describe('readHeader', () => {
  it.each([
    ['Tag No.', 'tag', undefined],
    ['Item', 'tag', undefined],
    ['Rated power kW', 'p_kw', 'kW'],
    ['Motor kW', 'p_kw', 'kW'],
    ['Motor rated power [MW]', 'p_kw', 'MW'],
    ['PF', 'cos_phi', undefined],
    ['cos φ', 'cos_phi', undefined],
    ['Motor power factor', 'cos_phi', undefined],
    ['Voltage (V)', 'u_kv', 'V'],
    ['Eff %', 'eff', '%'],
    ['%Z', 'uk_pct', '%'],
    ['Fed from', 'bus', undefined],
    ['To bus', 'to_bus', undefined],
    ['Rating (kVA)', 's_kva', 'kVA'],
    ['Capacity kvar', 'q_kvar', 'kvar'],
    ['Length (m)', 'len_km', 'm'],
    ['C (nF/km)', 'c_uf_km', 'nF/km'],
    ['Line capacitance nF/km', 'c_nf_km', 'nF/km'],
    ['Cable C µF/km', 'c_uf_km', 'µF/km'],
    ['R (Ω/km)', 'r_ohm_km', 'Ω/km'],
    ['Resistance ohm/km', 'r_ohm_km', 'ohm/km'],
    ['Conductor resistance (mΩ/m)', 'r_ohm_km', 'mΩ/m'],
    ['Detuning %', 'p_pct', '%'],
    ['Load factor (night)', 'load:night', undefined],
    ['load:standby', 'load:standby', undefined],
    ['cos_phi', 'cos_phi', undefined],
    ['Weight kg', null, undefined],
  ])('%s → %s', (header, target, unit) => {
    const r = readHeader(header);
    expect(r.target).toBe(target);
    expect(r.unitSpelling).toBe(unit);
  });

  it('lets the unit outrank the words when they disagree', () => {
    expect(readHeader('Rating (kW)').target).toBe('p_kw');
    expect(readHeader('Rating (kVA)').target).toBe('s_kva');
    expect(readHeader('Rating (kvar)').target).toBe('q_kvar');
    expect(readHeader('Input (kV)').target).toBe('u_kv');
  });
});

describe('units', () => {
  it('converts to each target unit (SI prefixes)', () => {
    expect(unitFor('p_kw', 'MW')?.factor).toBe(1e3);
    expect(unitFor('p_kw', 'w')?.factor).toBe(1e-3);
    expect(unitFor('u_kv', 'V')?.factor).toBe(1e-3);
    expect(unitFor('c_uf_km', 'nF/km')?.factor).toBe(1e-3);
    expect(unitFor('c_nf_km', 'µF/km')?.factor).toBe(1e3);
    expect(unitFor('c_uf_km', 'uF')?.factor).toBe(1);
    expect(unitFor('eff', '%')?.factor).toBe(0.01);
    expect(unitFor('uk_pct', 'pu')?.factor).toBe(100);
    expect(unitFor('p_kw', 'kV')).toBeUndefined();
    // resistance per length: mΩ/m = 1e-3 Ω / 1e-3 km = Ω/km; Ω/m = 1 000 Ω/km
    expect(unitFor('r_ohm_km', 'mΩ/m')?.factor).toBe(1);
    expect(unitFor('r_ohm_km', 'ohm/m')?.factor).toBe(1e3);
    expect(unitFor('r_ohm_km', '\u2126/km')?.factor).toBe(1);
  });

  it('offers the target unit first', () => {
    expect(unitChoicesFor('q_kvar').map((u) => u.label)).toEqual(['kvar', 'var', 'Mvar']);
    expect(unitChoicesFor('tag')).toEqual([{ label: '', factor: 1 }]);
  });

  it('names columns as spreadsheet programs do', () => {
    expect([0, 25, 26, 701, 702].map(columnLetter)).toEqual(['A', 'Z', 'AA', 'ZZ', 'AAA']);
  });
});
