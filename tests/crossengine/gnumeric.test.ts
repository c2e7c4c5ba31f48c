// Cross-engine check with a second open program: Gnumeric (ssconvert --recalc) recalculates every
// exported workbook, and every formula cell must equal the value Kvar Ledger computed, within
// 1e-9 relative, errors included: the plain formulas must read alike in every engine, not only
// in LibreOffice. A planted wrong cached value proves it really recalculated.
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
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

let books: Book[] = [];
let outDir = '';
let planted: Planted | undefined;

beforeAll(async () => {
  const work = mkdtempSync(join(tmpdir(), 'kvar-gnumeric-'));
  const written = await writeBooks(work);
  books = written.books;
  planted = written.planted;
  outDir = join(work, 'csv');
  for (const f of written.files) recalcToCsv(f, outDir);
  // Gnumeric starts once per file (about 20 s each on a busy two-core machine, 11 files).
}, 480_000);

const csvFiles = () => readdirSync(outDir).filter((f) => f.endsWith('.csv'));

describe('Gnumeric recalculating our exports', () => {
  it('exported every template, the invented site and the hand-made workbook', () => {
    expect(books.map((b) => b.base)).toEqual(expect.arrayContaining([...BOOK_NAMES]));
    for (const b of books)
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

  it.each([...BOOK_NAMES])('%s: every formula cell equals the app’s value', (base) => {
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
