// Cross-engine check with a second open program: Gnumeric (ssconvert --recalc) recalculates every
// exported workbook, and every formula cell must equal the value Kvar Ledger computed, within
// 1e-9 relative, errors included: the plain formulas must read alike in every engine, not only
// in LibreOffice. A planted wrong cached value proves it really recalculated.
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  BOOK_NAMES,
  compareBook,
  PLANTED_VALUE,
  sameValue,
  writeBooks,
  type Book,
  type Planted,
} from './books.ts';
import { recalcToCsv } from './gnumeric.ts';
import { sheetCsv } from './libreoffice.ts';

/**
 * Every book but two of the three edited ones and the solar template's two variants (referred to
 * rated power; with a night cable and a plain bank):
 * Gnumeric starts once per file (about 20 s each on a two-core machine), and LibreOffice's suite
 * checks those (the rated-power book differs from the solar one in two Site cells only, the other
 * in one cable and one bank).
 */
const GNUMERIC_BOOKS: readonly string[] = BOOK_NAMES.filter(
  (n) =>
    n !== 'edited-2' && n !== 'edited-3' && n !== 'solar-collector-rated' && n !== 'solar-collector-charged',
);

let books: Book[] = [];
let outDir = '';
let planted: Planted | undefined;

beforeAll(async () => {
  const work = mkdtempSync(join(tmpdir(), 'kvar-gnumeric-'));
  const written = await writeBooks(work);
  books = written.books;
  planted = written.planted;
  outDir = join(work, 'csv');
  const wanted = new Set<string>([...GNUMERIC_BOOKS, 'planted']);
  for (const f of written.files) if (wanted.has(basename(f).replace(/\.xlsx$/, ''))) recalcToCsv(f, outDir);
}, 480_000);

const csvFiles = () => readdirSync(outDir).filter((f) => f.endsWith('.csv'));

describe('Gnumeric recalculating our exports', () => {
  it('exported every template, the invented site and the hand-made workbook', () => {
    expect(books.map((b) => b.base)).toEqual(expect.arrayContaining([...BOOK_NAMES]));
    for (const b of books.filter((x) => GNUMERIC_BOOKS.includes(x.base)))
      for (const s of b.doc.sheets) expect(csvFiles()).toContain(`${b.base}-${s.name}.csv`);
  });

  it('really recalculated: a planted wrong cached value comes back right', () => {
    expect(planted?.cachedInFile).toBe(PLANTED_VALUE);
    const text = sheetCsv(outDir, 'planted', 'Buses')[planted!.row]?.[planted!.col] ?? '';
    expect(Number(text)).not.toBe(PLANTED_VALUE);
    expect(sameValue({ ok: true, value: planted!.app }, text, 'Gnumeric')).toEqual({
      ok: true,
      why: expect.any(String),
    });
  });

  it.each([...GNUMERIC_BOOKS])('%s: every formula cell equals the app’s value', (base) => {
    const book = books.find((b) => b.base === base);
    expect(book, `no workbook ${base}`).toBeDefined();
    const { mismatches, compared, errors } = compareBook(
      book!,
      (sheet) => sheetCsv(outDir, base, sheet),
      'Gnumeric',
    );
    expect(mismatches).toEqual([]);
    expect(compared).toBeGreaterThan(base === 'hand-made' ? 15 : 100);
    if (base === 'invented-quarry-fault' || base === 'hand-made') expect(errors).toBeGreaterThan(0);
  });

  it('shows no unknown-name error anywhere', () => {
    for (const f of csvFiles()) {
      if (f.includes('_kvar_ledger') || f.includes('Functions used')) continue;
      const text = readFileSync(join(outDir, f), 'utf8');
      expect({ f, name: text.includes('#NAME?') }).toEqual({ f, name: false });
    }
  });
});
