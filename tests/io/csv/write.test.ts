// CSV export safety. Source for the rule: OWASP "CSV Injection" (common practice): cells starting
// with = + - @, tab or carriage return are prefixed with an apostrophe; RFC 4180 for quoting.
import { describe, expect, it } from 'vitest';
import { csvField, neutraliseText, writeCsv } from '../../../src/io/csv/write.ts';

describe('CSV injection', () => {
  it.each([
    ['=HYPERLINK("http://x","y")', `"'=HYPERLINK(""http://x"",""y"")"`],
    ['+cmd|calc', "'+cmd|calc"],
    ['-2+3+cmd|calc', "'-2+3+cmd|calc"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\t=1+1', "'\t=1+1"],
    ['\r=1+1', `"'\r=1+1"`],
    ['＝1+1', "'＝1+1"],
  ])('neutralises %j', (text, field) => {
    expect(csvField(text)).toBe(field);
  });

  it('leaves ordinary text, numbers and numeric text alone', () => {
    expect(neutraliseText('M-101')).toBe('M-101');
    expect(neutraliseText('-5')).toBe('-5');
    expect(neutraliseText('+1.5e3')).toBe('+1.5e3');
    expect(neutraliseText('-')).toBe("'-");
    expect(csvField(-12.5)).toBe('-12.5');
    expect(csvField(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(csvField(true)).toBe('TRUE');
    expect(csvField(null)).toBe('');
    expect(csvField(Number.POSITIVE_INFINITY)).toBe('#NUM!');
    expect(csvField({ value: '#N/A' })).toBe('#N/A');
  });

  it('quotes separators, quotes and line breaks (RFC 4180)', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('a;b', ';')).toBe('"a;b"');
    expect(csvField('a;b', ',')).toBe('a;b');
  });

  it('writes a table with CRLF and an optional BOM', () => {
    const rows = [
      ['tag', 'p_kw', 'note'],
      ['M-1', 75, '=1+1'],
      ['M-2', -3, null],
    ];
    expect(writeCsv(rows)).toBe("tag,p_kw,note\r\nM-1,75,'=1+1\r\nM-2,-3,\r\n");
    expect(writeCsv(rows, { separator: ';', eol: '\n', bom: true })).toBe(
      "\uFEFFtag;p_kw;note\nM-1;75;'=1+1\nM-2;-3;\n",
    );
    expect(writeCsv([])).toBe('');
  });
});
