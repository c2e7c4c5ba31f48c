// Header mapping and preview of a foreign-headed equipment list (an invented pump station).
import { describe, expect, it } from 'vitest';
import {
  proposeMapping,
  rememberMapping,
  withColumnTarget,
  withColumnUnit,
} from '../../../src/io/import/mapping.ts';
import { emptyMappingMemory } from '../../../src/io/import/memory.ts';
import { previewImport } from '../../../src/io/import/preview.ts';
import { tableFromCsvText, type RawTable } from '../../../src/io/import/table.ts';

const LIST = [
  'Pump station equipment (invented for the tests)',
  ',,,',
  'Tag No.,Description,Fed from,Type,Qty,Motor kW,Eff %,PF,LF,Load factor (night),Voltage (V),Remarks,Weight kg',
  'P-101,Raw water pump,MCC-1,motor,2,75,95,0.86,0.8,0.5,400,dry well,1200',
  'P-102,Wash pump,MCC-1,motor,1,abc,94,0.85,0.9,0,400,,300',
  'H-1,Heater,MCC-1,load,1,40,,1.3,1,1,400,,',
  '',
  'X-1,Spare,MCC-1,widget,1,5,,0.9,1,1,400,,',
].join('\n');

function table(text = LIST): RawTable {
  const t = tableFromCsvText('pumps.csv', text);
  if (!t.ok) throw new Error(t.problem.message);
  return t.value;
}

const byHeader = (p: ReturnType<typeof proposeMapping>, h: string) => p.columns.find((c) => c.header === h)!;

describe('proposeMapping', () => {
  it('finds the header below title rows and suggests targets and units', () => {
    const p = proposeMapping(table());
    expect(p.headerRow).toBe(3);
    expect(p.missing).toEqual([]);
    expect(p.columns.map((c) => c.target)).toEqual([
      'tag',
      'description',
      'bus',
      'kind',
      'qty',
      'p_kw',
      'eff',
      'cos_phi',
      'load',
      'load:night',
      'u_kv',
      null,
      null,
    ]);
    expect(byHeader(p, 'Voltage (V)').unit).toEqual({ label: 'V', factor: 1e-3 });
    expect(byHeader(p, 'Eff %').unit).toEqual({ label: '%', factor: 0.01 });
    expect(byHeader(p, 'Remarks').note).toMatch(/also looks like Description, which column B/);
  });

  it('spots percent from the values, but not from one bad value', () => {
    const p = proposeMapping(table('tag,bus,kind,eff,cos phi\nM1,B,motor,95,0.86\nM2,B,motor,93.5,1.3\n'));
    expect(byHeader(p, 'eff').unit.label).toBe('%');
    expect(byHeader(p, 'cos phi').unit.label).toBe('');
  });

  it('reports required columns that are not mapped', () => {
    const p = proposeMapping(table('Item,Motor kW\nM1,5\n'));
    expect(p.missing).toEqual(['bus', 'kind']);
    const fixed = withColumnTarget(p, 1, 'bus');
    expect(fixed.missing).toEqual(['kind']);
  });

  it('lets the user re-point a column and frees the previous one', () => {
    const p = withColumnTarget(proposeMapping(table()), 11, 'description');
    expect(p.columns[11]).toMatchObject({ target: 'description', why: 'user' });
    expect(p.columns[1]).toMatchObject({ target: null, note: 'now fed by column L' });
    const q = withColumnUnit(p, 5, 'MW');
    expect(q.columns[5]?.unit).toEqual({ label: 'MW', factor: 1000 });
    expect(withColumnUnit(p, 5, 'kV').columns[5]?.unit.label).toBe('kW');
  });

  it('remembers accepted choices for the next list with the same headers', () => {
    const p = withColumnUnit(withColumnTarget(proposeMapping(table()), 12, 'p_kw'), 12, 'W');
    const memory = rememberMapping(emptyMappingMemory(), p);
    const again = proposeMapping(table(), memory);
    expect(again.columns[12]).toMatchObject({
      target: 'p_kw',
      unit: { label: 'W', factor: 1e-3 },
      why: 'remembered',
    });
    expect(again.columns[5]).toMatchObject({ target: null, why: 'remembered' });
  });
});

describe('previewImport', () => {
  it('converts units and reports bad rows with the file row and column', () => {
    const pv = previewImport(proposeMapping(table()));
    const first = pv.rows[0]!;
    expect(first).toMatchObject({ row: 4, status: 'ok' });
    expect(first.cells).toMatchObject({
      tag: 'P-101',
      p_kw: 75,
      eff: 0.95,
      cos_phi: 0.86,
      load: 0.8,
      'load:night': 0.5,
      u_kv: 0.4,
    });
    expect(pv.cases).toEqual(['normal', 'night']);
    const messages = pv.problems.map((x) => x.message);
    expect(messages).toContain('row 5, column F (Motor kW): must be a number; got "abc"');
    expect(messages.some((m) => m.startsWith('row 6, column H (PF): ') && m.includes('1.3'))).toBe(true);
    expect(messages.some((m) => m.startsWith('row 8, column D (Type): ') && m.includes('widget'))).toBe(true);
    expect(pv.rows.map((r) => [r.row, r.status])).toEqual([
      [4, 'ok'],
      [5, 'error'],
      [6, 'error'],
      [8, 'error'],
    ]);
    expect(pv.counts).toEqual({ rows: 4, ok: 1, withErrors: 3, withWarnings: 0 });
    expect(pv.canApply).toBe(false);
  });

  it('can apply a clean list', () => {
    const pv = previewImport(
      proposeMapping(
        table(
          'Item,Board,Type,Rated power (MW),PF,Eff\nM1,LV,motor,0.075,0.86,0.95\nM2,LV,motor,0.11,0.87,0.955\n',
        ),
      ),
    );
    expect(pv.problems.filter((x) => x.severity === 'error')).toEqual([]);
    expect(pv.canApply).toBe(true);
    expect(pv.equipment.map((e) => e.values.p_kw)).toEqual([75, 110]);
  });

  it('flags text that looks like a formula, and imports it as text', () => {
    const pv = previewImport(
      proposeMapping(
        table(
          'Item,Description,Board,Type,Motor kW,PF,Eff\n' +
            '=1+1,@SUM(A1),LV,motor,75,0.86,0.95\n' +
            'M2,-5 kW spare,LV,motor,11,0.85,0.93\n' +
            'M3,plain,LV,motor,15,0.85,0.93\n',
        ),
      ),
    );
    expect(pv.problems.filter((x) => x.severity === 'warning').map((x) => x.message)).toEqual([
      'row 2, column A (Item): "=1+1" looks like a formula; it is imported as text and never run',
      'row 2, column B (Description): "@SUM(A1)" looks like a formula; it is imported as text and never run',
      'row 3, column B (Description): "-5 kW spare" looks like a formula; it is imported as text and never run',
    ]);
    expect(pv.rows.map((r) => r.status)).toEqual(['warning', 'warning', 'ok']);
    expect(pv.canApply).toBe(true);
    expect(pv.equipment.map((e) => [e.tag, e.description])).toEqual([
      ['=1+1', '@SUM(A1)'],
      ['M2', '-5 kW spare'],
      ['M3', 'plain'],
    ]);
  });
});
