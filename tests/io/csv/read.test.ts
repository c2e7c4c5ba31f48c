// CSV reading after RFC 4180 (IETF, "Common Format and MIME Type for CSV Files"): the examples
// of its section 2 plus what spreadsheet programs write (BOM, ';' in decimal-comma locales).
// One deliberate difference: every line end is read as LF, inside quotes too (in-cell line
// breaks are LF in spreadsheet programs, and a file may mix line ends).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CsvSyntaxError, detectDelimiter, readCsv } from '../../../src/io/csv/read.ts';

describe('readCsv (RFC 4180 section 2)', () => {
  it('splits records on CRLF and fields on commas; a final line break adds no record', () => {
    expect(readCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n')).toEqual([
      ['aaa', 'bbb', 'ccc'],
      ['zzz', 'yyy', 'xxx'],
    ]);
    expect(readCsv('aaa,bbb,ccc\nzzz,yyy,xxx')).toEqual([
      ['aaa', 'bbb', 'ccc'],
      ['zzz', 'yyy', 'xxx'],
    ]);
  });
  it('reads quoted fields with commas, line breaks (as LF) and doubled quotes', () => {
    expect(readCsv('"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx')).toEqual([
      ['aaa', 'b\nbb', 'ccc'],
      ['zzz', 'yyy', 'xxx'],
    ]);
    expect(readCsv('"aaa","b""bb","ccc"')).toEqual([['aaa', 'b"bb', 'ccc']]);
    expect(readCsv('tag,description\nM1,"pump, 75 kW"\n')).toEqual([
      ['tag', 'description'],
      ['M1', 'pump, 75 kW'],
    ]);
  });
  it('reads CR, LF and CRLF line ends mixed in one file', () => {
    expect(readCsv('a,b\r\nc,d\ne,f\rg,h\r\n')).toEqual([
      ['a', 'b'],
      ['c', 'd'],
      ['e', 'f'],
      ['g', 'h'],
    ]);
  });
  it('keeps empty fields, including a quoted empty last field', () => {
    expect(readCsv('a,,c\n,,\n')).toEqual([
      ['a', '', 'c'],
      ['', '', ''],
    ]);
    expect(readCsv('a,""')).toEqual([['a', '']]);
  });
  it('drops a UTF-8 byte-order mark', () => {
    expect(readCsv('\uFEFFtag,bus\nM1,LV')).toEqual([
      ['tag', 'bus'],
      ['M1', 'LV'],
    ]);
  });
  it('detects ; and tab delimiters from the first line, outside quotes', () => {
    expect(detectDelimiter('tag;bus;p_kw\nM1;LV;0,95')).toBe(';');
    expect(detectDelimiter('tag\tbus\n')).toBe('\t');
    expect(detectDelimiter('"a;b;c",d\n')).toBe(',');
    expect(readCsv('tag;cos_phi\nM1;0,86\n')).toEqual([
      ['tag', 'cos_phi'],
      ['M1', '0,86'],
    ]);
  });
  it('an empty text has no rows; a blank line in the middle is one empty field', () => {
    expect(readCsv('')).toEqual([]);
    expect(readCsv('a\n\nb\n')).toEqual([['a'], [''], ['b']]);
  });
  it('reports an unterminated quote with the line and character where it opened', () => {
    expect(() => readCsv('tag,desc\nM1,"never closed\nmore')).toThrowError(CsvSyntaxError);
    try {
      readCsv('tag,desc\nM1,"never closed\nmore');
    } catch (e) {
      expect(e).toMatchObject({ line: 2, column: 4 });
      expect((e as Error).message).toBe(
        'CSV line 2, character 4: a quoted field is never closed (missing ")',
      );
    }
  });
  it('reports text glued to a closing quote, on whichever line', () => {
    expect(() => readCsv('"abc"x,d')).toThrowError(
      /line 1, character 6: unexpected "x" after a closing quote/,
    );
    expect(() => readCsv('tag;desc\r\nM1;"pump ""A"""x;LV\r\n')).toThrowError(
      'CSV line 2, character 16: unexpected "x" after a closing quote; expected the delimiter ";" or a line end',
    );
  });
  it('reads spaces between a closing quote and the delimiter as nothing (papaparse leniency)', () => {
    expect(readCsv('"pump, 75 kW"  ,LV\n')).toEqual([['pump, 75 kW', 'LV']]);
  });
  it('round-trips any table written with RFC 4180 quoting (property)', () => {
    const cell = fc.string({ unit: fc.constantFrom('a', 'b', ',', '"', '\n', '\r\n', ' ', ';', 'é') });
    fc.assert(
      fc.property(
        fc.array(fc.array(cell, { minLength: 2, maxLength: 4 }), { minLength: 1, maxLength: 5 }),
        (rows) => {
          const width = (rows[0] as string[]).length;
          const table = rows.map((r) => Array.from({ length: width }, (_, i) => r[i] ?? ''));
          const text = table.map((r) => r.map((c) => `"${c.replace(/"/g, '""')}"`).join(',')).join('\r\n');
          const asLf = table.map((r) => r.map((c) => c.replace(/\r\n?/g, '\n')));
          expect(readCsv(text, { delimiter: ',' })).toEqual(asLf);
        },
      ),
    );
  });
});
