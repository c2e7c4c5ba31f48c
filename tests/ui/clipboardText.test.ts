// What Ctrl+C hands to other programs: values at full precision, and text that another program
// would run as a formula marked as text, by the CSV writer's rule (OWASP, CSV injection).
import { describe, expect, it } from 'vitest';
import { clipboardText } from '../../src/ui/grid/cellView.ts';
import { neutraliseText } from '../../src/io/csv/write.ts';

describe('clipboard text', () => {
  it('marks formula-like text as text', () => {
    expect(clipboardText('=1+1')).toBe("'=1+1");
    expect(clipboardText('+A1')).toBe("'+A1");
    expect(clipboardText('-A1')).toBe("'-A1");
    expect(clipboardText('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(clipboardText('=HYPERLINK("http://x","y")')).toBe('\'=HYPERLINK("http://x","y")');
  });

  it('follows the CSV writer exactly for text', () => {
    for (const t of ['=1', '-5', '+1.5e3', '-x', '\tx', 'Pump', '007', '\uFF1D1']) {
      expect(clipboardText(t)).toBe(neutraliseText(t));
    }
  });

  it('leaves numbers, truth values, errors and plain text as they are', () => {
    expect(clipboardText(-5)).toBe('-5');
    expect(clipboardText(1000.0499987500625)).toBe('1000.0499987500625');
    expect(clipboardText(true)).toBe('TRUE');
    expect(clipboardText({ value: '#N/A', message: 'x' })).toBe('#N/A');
    expect(clipboardText('Pump 1')).toBe('Pump 1');
    expect(clipboardText(null)).toBe('');
  });
});
