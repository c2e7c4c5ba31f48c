// The tokenizer and the catalogue-call expansion do work linear in the formula's length, shown by
// counting, not by a clock: every character the scanners read is counted, and every tree node
// the expansion builds or prints. Before, a quoted sheet name was rescanned from every position
// (90 kB of '' took 7–10 s) and every level of nested calls printed and re-read all the levels
// inside it.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { expandFormula, MAX_FORMULA_LENGTH, type ExpandCounter } from '../../../src/io/formula/expand.ts';
import { MAX_PARSE_DEPTH, parseFormula } from '../../../src/io/formula/parse.ts';
import { tokenize } from '../../../src/io/formula/tokenize.ts';

/** Characters read per character of text, at most (the costliest is an error literal's window). */
const READS_PER_CHAR = 32;

function reads(text: string): number {
  const counter = { reads: 0 };
  tokenize(text, counter);
  return counter.reads;
}

/** Texts that made a scanner go back over what it had read, each of about 2·n characters. */
const HOSTILE: Record<string, (n: number) => string> = {
  'doubled apostrophes': (n) => '=' + "''".repeat(n),
  'an unclosed sheet name': (n) => "='" + "''".repeat(n),
  'doubled quotes': (n) => '="' + '""'.repeat(n),
  'an unclosed string': (n) => '=' + '"'.repeat(2 * n),
  'one long name': (n) => '=' + 'a'.repeat(2 * n),
  'one long number before a letter': (n) => '=' + '1'.repeat(2 * n) + 'x',
  'cells run together': (n) => '=' + 'A1'.repeat(n),
  'half ranges': (n) => '=' + 'A1:'.repeat(Math.ceil((2 * n) / 3)),
  'dollar signs': (n) => '=' + '$A'.repeat(n),
  'sheet names without cells': (n) => '=' + "'a'!".repeat(Math.ceil(n / 2)),
  'error literal starts': (n) => '=' + '#N'.repeat(n),
  'unicode spaces': (n) => '=' + ' \u00a0'.repeat(n),
};

describe('the tokenizer reads each character a bounded number of times', () => {
  it.each(Object.keys(HOSTILE))(
    '%s: at most 32 reads per character, and 16 times the text is 16 times the work',
    (k) => {
      const make = HOSTILE[k] as (n: number) => string;
      const small = make(2_000);
      const large = make(32_000);
      expect(reads(small)).toBeLessThanOrEqual(READS_PER_CHAR * small.length);
      expect(reads(large)).toBeLessThanOrEqual(READS_PER_CHAR * large.length);
      // Linear: the ratio of the work follows the ratio of the lengths (a quadratic scan gives ×256).
      expect(reads(large) / reads(small)).toBeLessThanOrEqual(1.05 * (large.length / small.length));
    },
  );

  it('any text: at most 32 reads per character (property)', () => {
    const piece = fc.constantFrom(
      ...'AZaz09$:!\'" .,;()#/N?E-+e_\\{}%<>=&€'.split(''),
      "''",
      '""',
      'A1',
      "'x'!",
    );
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 400 }), (parts) => {
        const text = parts.join('');
        return reads(text) <= READS_PER_CHAR * text.length + READS_PER_CHAR;
      }),
      { numRuns: 500 },
    );
  });

  it('keeps a quoted text whole, doubled quotes and all, whether or not it is closed', () => {
    expect(tokenize("='a''b'&1").map((t) => [t.kind, t.text])).toEqual([
      ['op', '='],
      ['unknown', "'a''b'"],
      ['op', '&'],
      ['number', '1'],
    ]);
    expect(tokenize("='a''b").map((t) => t.text)).toEqual(['=', "'a''b"]);
  });
});

function expansionWork(formula: string): { counter: ExpandCounter; ok: boolean } {
  const counter: ExpandCounter = { reads: 0, nodes: 0 };
  const r = expandFormula(formula, counter);
  return { counter, ok: r.ok };
}

/** n catalogue calls nested through the TRUE/FALSE argument `leading`. */
const throughFlag = (n: number) => {
  let f = 'A1';
  for (let i = 0; i < n; i++) f = `KVAR.LOAD(1,0.9,${f}>0)`;
  return `=${f}`;
};
/** n calls nested through a number argument, which the guards and the formula repeat. */
const repeated = (n: number) => {
  let f = 'A1';
  for (let i = 0; i < n; i++) f = `KVAR.LOAD(${f},0.9)`;
  return `=${f}`;
};
/** n calls side by side. */
const wide = (n: number) => '=' + Array.from({ length: n }, (_, i) => `KVA.TOTAL(A${i + 1},1)`).join('+');

describe('the expansion of catalogue calls is linear in the formula', () => {
  it.each([
    ['nested through a TRUE/FALSE argument', throughFlag, 40, 160],
    ['nested through a number argument', repeated, 40, 160],
    ['side by side', wide, 20, 80],
  ] as const)('%s: four times the calls, at most four times the work', (_, make, small, large) => {
    const a = expansionWork(make(small));
    const b = expansionWork(make(large));
    const ratio = make(large).length / make(small).length;
    expect(b.counter.reads / a.counter.reads).toBeLessThanOrEqual(1.1 * ratio);
    // Nodes are bounded by the text and by the printed limit (a repeated argument stops there).
    expect(b.counter.nodes).toBeLessThanOrEqual(20 * make(large).length + MAX_FORMULA_LENGTH);
  });

  it('two nested calls expand within the limit', () => {
    const r = expandFormula(repeated(2));
    expect(r.ok).toBe(true);
    expect(r.ok && r.formula.length).toBeLessThanOrEqual(MAX_FORMULA_LENGTH);
  });

  it('an expansion that would pass the xlsx formula limit is refused in words', () => {
    expect(expandFormula(repeated(40))).toEqual({
      ok: false,
      message:
        'its plain-formula expansion would be longer than 8,192 characters, the most a formula in an xlsx file holds (write inner calls into cells of their own)',
    });
    expect(expandFormula(`=KVA.TOTAL(1,2)+${'1+'.repeat(5000)}1`)).toEqual({
      ok: false,
      message:
        'the formula is 10,017 characters long; a formula in an xlsx file holds at most 8,192 (write inner calls into cells of their own)',
    });
  });
});

describe('nesting deeper than the parser reads is refused, not a stack overflow', () => {
  it.each([
    ['brackets', (n: number) => '=' + '('.repeat(n) + '1' + ')'.repeat(n)],
    ['calls', (n: number) => '=' + 'ABS('.repeat(n) + '1' + ')'.repeat(n)],
    ['signs', (n: number) => '=' + '-'.repeat(n) + '1'],
    ['percent signs', (n: number) => '=1' + '%'.repeat(n)],
    ['arrays', (n: number) => '=' + '{'.repeat(n) + '1' + '}'.repeat(n)],
  ])('%s', (_, make) => {
    expect(parseFormula(make(MAX_PARSE_DEPTH - 5)).ok).toBe(true);
    const r = parseFormula(make(100_000));
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(
      /nests brackets, calls or signs more than 200 levels deep \(at character \d+\)/,
    );
  });
});
