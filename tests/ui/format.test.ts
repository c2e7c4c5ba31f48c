import { describe, expect, it } from 'vitest';
import { formatGeneral, formatNumber } from '../../src/ui/format/numberFormat.ts';
import { fitNumber, textUnits } from '../../src/ui/format/fitNumber.ts';
import { headerLabel, unitOf } from '../../src/ui/format/columnHeader.ts';
import { a1, columnLetters, rangeLabel, sheetRef } from '../../src/ui/model/address.ts';

describe('number formats', () => {
  it('rounds to the decimals of the code', () => {
    expect(formatNumber(41.3379, '0.0')).toBe('41.3');
    expect(formatNumber(0.86, '0.000')).toBe('0.860');
    expect(formatNumber(-12.25, '0')).toBe('-12');
    expect(formatNumber(1234567.891, '#,##0.0')).toBe('1,234,567.9');
    expect(formatNumber(999.95, '#,##0.0')).toBe('1,000.0');
  });
  it('shows percent and scientific codes', () => {
    expect(formatNumber(0.0567, '0.00%')).toBe('5.67%');
    expect(formatNumber(0.000123, '0.00E+00')).toBe('1.23E-04');
  });
  it('never shows minus zero', () => {
    expect(formatNumber(-0.00004, '0.0')).toBe('0.0');
  });
  it('falls back to General for codes it does not know', () => {
    expect(formatNumber(1 / 3, 'mm/dd/yy')).toBe('0.3333333333');
    expect(formatGeneral(1e12)).toBe('1e+12');
    expect(formatGeneral(2.5e-7)).toBe('2.5e-7');
    expect(formatGeneral(-0.1 - 0.2)).toBe('-0.3');
  });
});

describe('column headers', () => {
  it('takes the unit from the last parenthesis', () => {
    expect(unitOf('P (kW)')).toBe('kW');
    expect(unitOf('C (µF/km)')).toBe('µF/km');
    expect(unitOf('cos φ')).toBeUndefined();
  });
  it('joins unit and format', () => {
    expect(headerLabel('C', { header: 'Q (kvar)', format: '0.0', computed: true })).toEqual({
      letter: 'C',
      detail: 'kvar · 1 dp',
      computed: true,
    });
    expect(headerLabel('E', { header: 'U (kV)', format: '0.0##' }).detail).toBe('kV · 1–3 dp');
    expect(headerLabel('D', { header: 'Qty', format: '0' }).detail).toBe('0 dp');
    expect(headerLabel('F', { header: 'Share', format: '0.0%' }).detail).toBe('1 dp %');
    expect(headerLabel('A', undefined)).toEqual({ letter: 'A', detail: '', computed: false });
  });
});

describe('addresses', () => {
  it('names columns like other spreadsheet programs', () => {
    expect([0, 25, 26, 51, 52, 701, 702].map(columnLetters)).toEqual([
      'A',
      'Z',
      'AA',
      'AZ',
      'BA',
      'ZZ',
      'AAA',
    ]);
    expect(a1(4, 2)).toBe('C5');
    expect(rangeLabel(8, 3, 1, 1)).toBe('B2:D9');
    expect(rangeLabel(0, 0, 0, 0)).toBe('A1');
  });
  it('quotes sheet names that need it', () => {
    expect(sheetRef('Buses')).toBe('Buses');
    expect(sheetRef("Bob's loads")).toBe("'Bob''s loads'");
  });
});

import { contentOf, editText, typedContent } from '../../src/ui/model/typedInput.ts';
import { createWorkbookEngine } from '../../src/ui/model/engineBridge.ts';

describe('typed input', () => {
  it('reads numbers, booleans, formulas and text', () => {
    expect(typedContent('12.5')).toBe(12.5);
    expect(typedContent(' -3e2 ')).toBe(-300);
    expect(typedContent('.5')).toBe(0.5);
    expect(typedContent('')).toBeNull();
    expect(typedContent('true')).toBe(true);
    expect(typedContent('=KVA.TOTAL(3,4)')).toBe('=KVA.TOTAL(3,4)');
    expect(typedContent('M-101')).toBe('M-101');
    expect(typedContent('1,5')).toBe('1,5');
    expect(typedContent('=')).toBe('=');
  });
  it('enters text after a leading apostrophe, keeping the mark only where the engine needs it', () => {
    expect(typedContent("'=1+1")).toBe("'=1+1");
    expect(typedContent("'007")).toBe("'007");
    expect(typedContent("'TRUE")).toBe("'TRUE");
    expect(typedContent("''x")).toBe("''x");
    expect(typedContent("'Pump 1")).toBe('Pump 1');
    // Pasted text goes the same way.
    expect(contentOf("'=1+1")).toBe("'=1+1");
  });
  it('shows text entered with an apostrophe as that text (the engine reads the content)', () => {
    const typed = ["'=1+1", "'007", "'TRUE", "'1/2/2020", "'#N/A", "''x", "'Pump 1"];
    const hf = createWorkbookEngine([{ name: 'S', cells: [typed.map((t) => typedContent(t))] }]);
    expect(typed.map((_, col) => hf.getCellValue({ sheet: 0, row: 0, col }))).toEqual([
      '=1+1',
      '007',
      'TRUE',
      '1/2/2020',
      '#N/A',
      "'x",
      'Pump 1',
    ]);
    hf.destroy();
  });
  it('keeps what other values are', () => {
    expect(contentOf(undefined)).toBeNull();
    expect(contentOf(Number.NaN)).toBeNull();
    expect(contentOf(false)).toBe(false);
  });
  it('gives editor text that reads back to the same content', () => {
    for (const c of ["'007", "'TRUE", "'=1+1", 'M-101', '=SUM(A1:A3)', 42, true, null, ' padded'] as const) {
      expect(typedContent(editText(c))).toBe(c);
    }
  });
  it('gives unmarked text that would read as something else its apostrophe in the editor', () => {
    expect(editText('007')).toBe("'007");
    expect(editText('TRUE')).toBe("'TRUE");
    expect(editText("'007")).toBe("'007");
  });
});

describe('optional decimals', () => {
  it('drops trailing zeros after the required decimals', () => {
    expect(formatNumber(11, '0.0##')).toBe('11.0');
    expect(formatNumber(0.4, '0.0##')).toBe('0.4');
    expect(formatNumber(6.6, '0.0##')).toBe('6.6');
    expect(formatNumber(0.415, '0.0##')).toBe('0.415');
    expect(formatNumber(0.41567, '0.0##')).toBe('0.416');
    expect(formatNumber(3, '0.##')).toBe('3');
  });
});

describe('numbers rounded to fit their column', () => {
  it('keeps a number that fits as its format shows it', () => {
    expect(fitNumber(1234.5678, '#,##0.0', 10)).toBe('1,234.6');
  });
  it('drops decimals first, rounding (not cutting) the last digit kept', () => {
    // 1,234.6 is 6 digit widths: with 5.5 it shows 1,235.
    expect(fitNumber(1234.5678, '#,##0.0', 5.5)).toBe('1,235');
    expect(fitNumber(0.98765, '0.000', 4)).toBe('0.99');
    expect(fitNumber(-0.98765, '0.000', 2)).toBe('-1');
  });
  it('then the separators, then scientific notation, and ### only when nothing fits', () => {
    expect(fitNumber(1234567, '#,##0', 7)).toBe('1234567');
    expect(fitNumber(123456789, '#,##0', 7)).toBe('1.2E+08');
    expect(fitNumber(123456789, '#,##0', 5)).toBe('1E+08');
    expect(fitNumber(123456789, '#,##0', 3)).toBe('###');
  });
  it('in General format, keeps fewer significant digits without trailing zeros', () => {
    // 1000.0499987500625 (√(1000² + 10²) at full precision) in a column of 9 digit widths.
    expect(fitNumber(1000.0499987500625, undefined, 9)).toBe('1000.05');
    expect(fitNumber(1000.0499987500625, undefined, 12)).toBe('1000.049999');
    expect(fitNumber(123456789012, 'General', 8)).toBe('1.23E+11');
  });
  it('counts points and commas as half a digit', () => {
    expect(textUnits('1,234.5')).toBe(6);
  });
});
