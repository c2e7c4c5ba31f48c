// Fingerprints tell an untouched row from an edited one, however another program re-spells formulas.
import { describe, expect, it } from 'vitest';
import { normaliseFormula, parseMeta, rowFingerprint } from '../../../src/io/xlsx/metadata.ts';
import { fromFileFormula, toFileFormula } from '../../../src/io/xlsx/functionNames.ts';

describe('normaliseFormula', () => {
  it('ignores spacing, case, storage prefixes, needless quotes and number spelling', () => {
    const n = normaliseFormula('SUM(Motors!A1,1.5)+_xlfn.IFNA(B2,0)');
    for (const v of ["=sum( 'Motors'!a1 , 1.50 )+IFNA(b2,0)", 'SUM(MOTORS!A1,15E-1)+_XLFN.IFNA(B2,0.0)'])
      expect(normaliseFormula(v)).toBe(n);
  });

  it('keeps what matters: text literals, needed quotes, references', () => {
    expect(normaliseFormula('IF(A1="Yes",1,0)')).not.toBe(normaliseFormula('IF(A1="YES",1,0)'));
    expect(normaliseFormula("'Capacitors and reactors'!Q4")).toBe("'CAPACITORS AND REACTORS'!Q4");
    expect(normaliseFormula('A1+B2')).not.toBe(normaliseFormula('A1+B3'));
    expect(normaliseFormula('$A$1')).not.toBe(normaliseFormula('A1'));
    expect(normaliseFormula('SUMIFS(C:C,D:D,">0")')).toBe('SUMIFS(C:C,D:D,">0")');
  });

  it('fingerprints rows by position and kind of each cell', () => {
    const row = [
      { col: 0, value: 'M1' },
      { col: 1, value: 75 },
      { col: 2, formula: 'B2*2' },
    ];
    expect(rowFingerprint(row)).toBe(
      rowFingerprint([
        { col: 0, value: 'M1' },
        { col: 1, value: 75 },
        { col: 2, formula: 'b2 * 2' },
      ]),
    );
    expect(rowFingerprint(row)).not.toBe(
      rowFingerprint([
        { col: 0, value: 'M1' },
        { col: 1, value: '75' },
        { col: 2, formula: 'B2*2' },
      ]),
    );
    expect(rowFingerprint(row)).not.toBe(
      rowFingerprint([
        { col: 1, value: 'M1' },
        { col: 2, value: 75 },
        { col: 3, formula: 'B2*2' },
      ]),
    );
    expect(rowFingerprint([])).toMatch(/^[0-9a-f]{8}$/);
  });

  it('refuses damaged or foreign metadata', () => {
    expect(parseMeta('{')).toBeUndefined();
    expect(parseMeta('{"format":"kvar-ledger-xlsx-meta","version":2}')).toBeUndefined();
    const doc = {
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 't',
      sheets: [{ name: 'S', cells: [[{ evil: 1 }]] }],
    };
    expect(
      parseMeta(
        JSON.stringify({ format: 'kvar-ledger-xlsx-meta', version: 1, doc, sheets: [], generated: [] }),
      ),
    ).toBeUndefined();
  });
});

describe('function names in the file', () => {
  it('prefixes newer functions, leaves classic ones and text alone, and reads prefixes back', () => {
    expect(toFileFormula('=IFNA(A1,"IFS(")+SUM(1)')).toEqual({
      text: 'IFNA(A1,"IFS(")+SUM(1)'.replace('IFNA', '_xlfn.IFNA'),
      newer: ['IFNA'],
      unknown: [],
    });
    expect(toFileFormula('=FILTER(A1:A3,B1:B3)').text).toBe('_xlfn._xlws.FILTER(A1:A3,B1:B3)');
    expect(toFileFormula('=SUMIFS(C:C,D:D,">0")')).toEqual({
      text: 'SUMIFS(C:C,D:D,">0")',
      newer: [],
      unknown: [],
    });
    expect(toFileFormula('=BUS.SUMS(A1)').unknown).toEqual(['BUS.SUMS']);
    expect(fromFileFormula('_xlfn._xlws.SORT(A1:A3)+_xlfn.IFNA(1,2)')).toBe('=SORT(A1:A3)+IFNA(1,2)');
    expect(fromFileFormula('A1*2')).toBe('=A1*2');
  });
});
