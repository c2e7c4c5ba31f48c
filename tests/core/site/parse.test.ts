// Reading the interchange columns (src/core/site/model.ts): header names case-insensitive, load:<case>
// columns become cases, unknown headers warn, numbers are read with row and column in messages.
import { describe, expect, it } from 'vitest';
import { parseEquipmentTable, parseNumberCell } from '../../../src/core/site/parse.ts';

const table = (text: string) =>
  text
    .trim()
    .split('\n')
    .map((l) => l.split(','));

describe('parseEquipmentTable', () => {
  it('reads headers in any letter case and load:<case> columns as cases', () => {
    const r = parseEquipmentTable(
      table(`
TAG,Bus,KIND,P_kW,Eff,cos_phi,Load,load:Night, load : weekend
M1,LV,Motor,75,0.95,0.86,0.8,0.2,0`),
    );
    expect(r.problems).toEqual([]);
    expect(r.cases).toEqual(['normal', 'Night', 'weekend']);
    expect(r.equipment).toEqual([
      {
        row: 2,
        tag: 'M1',
        bus: 'LV',
        kind: 'motor',
        values: { p_kw: 75, eff: 0.95, cos_phi: 0.86, load: 0.8 },
        loads: { Night: 0.2, weekend: 0 },
      },
    ]);
  });
  it('names the first case after the option and skips blank rows without dropping others', () => {
    const r = parseEquipmentTable(
      table('tag,bus,kind,p_kw,cos_phi\nL1,LV,load,10,0.9\n,,,,\nL2,LV,load,5,0.8'),
      { defaultCase: 'day' },
    );
    expect(r.cases).toEqual(['day']);
    expect(r.equipment.map((e) => [e.row, e.tag])).toEqual([
      [2, 'L1'],
      [4, 'L2'],
    ]);
  });
  it('warns about an unknown header, naming the column, and ignores it', () => {
    const r = parseEquipmentTable(table('tag,bus,kind,colour\nL1,LV,load,red'));
    expect(r.problems).toEqual([
      {
        severity: 'warning',
        row: 1,
        column: 'colour',
        message: 'row 1, column colour: unknown column "colour" is ignored',
      },
    ]);
    expect(r.equipment[0]?.values).toEqual({});
  });
  it('reports a text where a number belongs with row and column', () => {
    const r = parseEquipmentTable(table('tag,bus,kind,p_kw,cos_phi\nL1,LV,load,ten,0.9'));
    expect(r.problems).toEqual([
      {
        severity: 'error',
        row: 2,
        column: 'p_kw',
        message: 'row 2, column p_kw: must be a number; got "ten"',
      },
    ]);
  });
  it('reports an unknown kind with row and column and keeps the row out of the equipment', () => {
    const r = parseEquipmentTable(table('tag,bus,kind\nX1,LV,transformr\nL1,LV,load'));
    expect(r.problems).toEqual([
      {
        severity: 'error',
        row: 2,
        column: 'kind',
        tag: 'X1',
        message:
          'row 2, column kind: kind must be one of motor, load, generator, transformer, line, cable, feeder, capacitor, reactor; got "transformr"',
      },
    ]);
    expect(r.equipment.map((e) => e.tag)).toEqual(['L1']);
  });
  it('requires tag, bus and kind headers', () => {
    const r = parseEquipmentTable(table('tag,p_kw\nL1,5'));
    expect(r.problems.map((p) => p.message)).toEqual([
      'row 1, column bus: the header row has no bus column; it is required',
      'row 1, column kind: the header row has no kind column; it is required',
      'row 2, column kind: kind is blank; it must be one of motor, load, generator, transformer, line, cable, feeder, capacitor, reactor',
    ]);
  });
  it('reports an empty table and a duplicated header', () => {
    expect(parseEquipmentTable([]).problems[0]?.message).toBe(
      'row 1: the table is empty; the first row must hold the column headers (tag, bus, kind, ...)',
    );
    const r = parseEquipmentTable(table('tag,bus,kind,p_kw,P_KW\nL1,LV,load,5,6'));
    expect(r.problems[0]?.message).toBe(
      'row 1, column P_KW: column "P_KW" appears twice (also column 4); the second is ignored',
    );
    expect(r.equipment[0]?.values.p_kw).toBe(5);
  });
  it('warns about a value beyond the last header column', () => {
    const r = parseEquipmentTable([
      ['tag', 'bus', 'kind'],
      ['L1', 'LV', 'load', 'stray'],
    ]);
    expect(r.problems[0]?.message).toBe(
      'row 2, column #4: value "stray" is beyond the last header column; ignored',
    );
  });
});

describe('parseNumberCell', () => {
  it('reads plain, signed, exponent and percent numbers; blank is not given', () => {
    expect(parseNumberCell(' 0.95 ', 'eff')).toBe(0.95);
    expect(parseNumberCell('1e3', 'p_kw')).toBe(1000);
    expect(parseNumberCell('95%', 'eff')).toBeCloseTo(0.95, 15);
    expect(parseNumberCell('6%', 'uk_pct')).toBe(6);
    expect(parseNumberCell('', 'p_kw')).toBeUndefined();
  });
  it('reads a decimal comma only when asked, and refuses hex, Infinity and thousands separators', () => {
    expect(parseNumberCell('0,86', 'cos_phi', true)).toBe(0.86);
    expect(parseNumberCell('0,86', 'cos_phi')).toEqual({ bad: 'must be a number; got "0,86"' });
    for (const t of ['0x10', 'Infinity', '1 000', '1,000.5'])
      expect(parseNumberCell(t, 'p_kw')).toHaveProperty('bad');
  });
});
