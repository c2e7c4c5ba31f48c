// Text stored in a cell reads back as the same text in the formula engine (HyperFormula, an engine
// outside this project), whatever it holds: a leading '=' or apostrophe, digits, a date, TRUE.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { needsTextMark, shownText, textContent } from '../../../src/core/text/cellText.ts';
import { createEngine } from '../../../src/engine/index.ts';

const TRICKY = [
  '=1+1',
  "'007",
  '007',
  ' 5',
  '1e3',
  '$5',
  '50%',
  '1/2/2020',
  '1.5.2020',
  '12:30',
  'TRUE',
  'false',
  '#N/A',
  '#REF!',
  '.5',
  '-',
  '+a',
  '@SUM(1)',
  ' ',
  'Pump 1',
  '__proto__',
];

/** What the engine shows for each content, one cell each. */
function shown(contents: readonly string[]): unknown[] {
  const hf = createEngine([{ name: 'S', cells: [contents.map((c) => c)] }]);
  const out = contents.map((_, col) => hf.getCellValue({ sheet: 0, row: 0, col }));
  hf.destroy();
  return out;
}

describe('text in a cell', () => {
  it('shows exactly the text for values the engine would otherwise read as numbers, dates or formulas', () => {
    expect(shown(TRICKY.map(textContent))).toEqual(TRICKY);
  });

  it('reads back as the same text for any string (property, checked against the engine)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.oneof(
            fc.string({ unit: 'grapheme', minLength: 1 }),
            fc.string({ unit: 'binary-ascii', minLength: 1 }),
            // Near-numbers, dates and times: digits among separators, signs, units and words.
            fc.string({ unit: fc.constantFrom(...'0123456789 .,:/-+$%eEaApPmM#€TRUEfalse'), minLength: 1 }),
          ),
          { minLength: 1, maxLength: 20 },
        ),
        (texts) => {
          expect(shown(texts.map(textContent))).toEqual(texts);
          expect(texts.map((t) => shownText(textContent(t)))).toEqual(texts);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('marks only what needs it, so plain text is stored as typed', () => {
    expect(textContent('Pump 1')).toBe('Pump 1');
    expect(textContent('=1+1')).toBe("'=1+1");
    expect(textContent('007')).toBe("'007");
    expect(needsTextMark('MV-11')).toBe(false);
    expect(needsTextMark('10-P-101')).toBe(false);
    expect(needsTextMark('2A')).toBe(false);
    expect(needsTextMark('')).toBe(false);
  });
});
