// Cross-engine check: LibreOffice Calc, recalculating our exported xlsx on load, must give every
// formula cell the value Kvar Ledger computed, within 1e-9 relative, errors included. The other
// engine is the source of truth here; a planted wrong cached value proves it really recalculated.
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { beforeAll, describe, expect, it } from 'vitest';
import type { SiteSettings } from '../../src/core/site/model.ts';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { createEngine, readCell, type CellResult } from '../../src/engine/index.ts';
import { exportWorkbookXlsx } from '../../src/io/xlsx/export.ts';
import { sampleDoc } from '../io/xlsx/docFixtures.ts';
import { inventedQuarry } from './inventedSite.ts';
import { editedWorkbooks } from './editedWorkbooks.ts';
import { convertToCsv, csvFiles, makeRecalcProfile, sheetCsv } from './libreoffice.ts';

/** Relative tolerance of the check; an absolute floor covers results that cancel to ~0. */
const REL = 1e-9;
const ABS_FLOOR = 1e-9;

interface Book {
  readonly base: string;
  readonly doc: WorkbookDoc;
  readonly settings?: SiteSettings;
}

const books: Book[] = [];
let outDir = '';
let planted: { sheet: string; row: number; col: number; cachedInFile: unknown; app: number } | undefined;

function sameValue(app: CellResult, text: string): { ok: boolean; why: string } {
  if (!app.ok) {
    const isError = /^(#[A-Z/0!?]+|Err:\d+)$/.test(text);
    // Guards and divisions must give the same kind of error; other failures only need to fail.
    const strict = app.error === '#N/A' || app.error === '#DIV/0!';
    return { ok: isError && (!strict || text === app.error), why: `app ${app.error}, LibreOffice "${text}"` };
  }
  const v = app.value;
  if (v === null) return { ok: text === '' || text === '0', why: `app blank, LibreOffice "${text}"` };
  if (typeof v === 'boolean')
    return { ok: text === (v ? 'TRUE' : 'FALSE'), why: `app ${v}, LibreOffice "${text}"` };
  if (typeof v === 'string') return { ok: text === v, why: `app "${v}", LibreOffice "${text}"` };
  const lo = Number(text);
  const ok =
    text.trim() !== '' &&
    Number.isFinite(lo) &&
    Math.abs(lo - v) <= REL * Math.max(Math.abs(v), Math.abs(lo)) + ABS_FLOOR * REL;
  return { ok, why: `app ${v}, LibreOffice "${text}"` };
}

beforeAll(async () => {
  const work = mkdtempSync(join(tmpdir(), 'kvar-crossengine-'));
  for (const f of readdirSync('templates')
    .filter((n) => n.endsWith('.json'))
    .sort()) {
    const { site } = readSiteFile(readFileSync(join('templates', f), 'utf8'));
    books.push({
      base: f.replace(/\.json$/, ''),
      doc: buildWorkbook(site, { flavour: 'portable' }),
      settings: site.settings,
    });
  }
  const quarry = inventedQuarry();
  books.push({
    base: 'invented-quarry',
    doc: buildWorkbook(quarry, { flavour: 'portable' }),
    settings: quarry.settings,
  });
  const faulty = inventedQuarry(true);
  books.push({
    base: 'invented-quarry-fault',
    doc: buildWorkbook(faulty, { flavour: 'portable' }),
    settings: faulty.settings,
  });
  books.push({ base: 'hand-made', doc: sampleDoc() });
  // Workbooks edited through the page's own model (random sites and edits, fixed seeds), exported
  // as the page exports them: what the user built by hand must recompute the same elsewhere.
  for (const [i, edited] of editedWorkbooks(3).entries())
    books.push({ base: `edited-${i + 1}`, doc: edited });
  const files: string[] = [];
  for (const b of books) {
    const file = join(work, `${b.base}.xlsx`);
    writeFileSync(
      file,
      await exportWorkbookXlsx(b.doc, {
        date: new Date('2026-01-01'),
        ...(b.settings ? { settings: b.settings } : {}),
      }),
    );
    files.push(file);
  }

  // Plant a wrong cached value for the point of connection's P in the quarry's export.
  const quarryBook = books.find((b) => b.base === 'invented-quarry') as Book;
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(readFileSync(join(work, 'invented-quarry.xlsx')) as unknown as ArrayBuffer);
  const buses = quarryBook.doc.sheets.find((s) => s.name === 'Buses');
  if (!buses) throw new Error('the quarry workbook has no Buses sheet');
  const pCol = (buses.cells[0] ?? []).findIndex((h) => typeof h === 'string' && h.startsWith('P crushing'));
  const cell = wb.getWorksheet('Buses')!.getCell(2, pCol + 1);
  cell.value = { formula: cell.formula, result: 987654.321 } as ExcelJS.CellFormulaValue;
  const plantedFile = join(work, 'planted.xlsx');
  writeFileSync(plantedFile, new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer));
  const check = new ExcelJS.Workbook();
  await check.xlsx.load(readFileSync(plantedFile) as unknown as ArrayBuffer);
  const app = readCell(createEngine(quarryBook.doc.sheets), 'Buses', 1, pCol);
  planted = {
    sheet: 'Buses',
    row: 1,
    col: pCol,
    cachedInFile: check.getWorksheet('Buses')!.getCell(2, pCol + 1).result,
    app: app.ok ? (app.value as number) : NaN,
  };
  files.push(plantedFile);

  outDir = join(work, 'csv');
  convertToCsv(makeRecalcProfile(join(work, 'profile')), files, outDir);
}, 300_000);

describe('LibreOffice Calc recalculating our exports', () => {
  it('exported every template, the invented site and the hand-made workbook', () => {
    expect(books.map((b) => b.base)).toEqual(
      expect.arrayContaining([
        'cold-store',
        'pumping-station',
        'solar-collector',
        'invented-quarry',
        'invented-quarry-fault',
        'hand-made',
      ]),
    );
    for (const b of books)
      for (const s of b.doc.sheets) expect(csvFiles(outDir)).toContain(`${b.base}-${s.name}.csv`);
  });

  it('really recalculated: a planted wrong cached value comes back right', () => {
    expect(planted?.cachedInFile).toBe(987654.321);
    const lo = sheetCsv(outDir, 'planted', 'Buses')[planted!.row]?.[planted!.col] ?? '';
    expect(Number(lo)).not.toBe(987654.321);
    expect(sameValue({ ok: true, value: planted!.app }, lo)).toEqual({ ok: true, why: expect.any(String) });
  });

  // The fault variant and the hand-made workbook hold error cells on purpose: at least one must be met.
  it.each([
    ['cold-store', 0],
    ['pumping-station', 0],
    ['solar-collector', 0],
    ['invented-quarry', 0],
    ['invented-quarry-fault', 1],
    ['hand-made', 1],
  ] as const)('%s: every formula cell equals the app’s value', (base, leastErrors) => {
    const book = books.find((b) => b.base === base);
    expect(book, `no workbook ${base}`).toBeDefined();
    const hf = createEngine(book!.doc.sheets);
    const mismatches: string[] = [];
    let compared = 0;
    let errors = 0;
    for (const s of book!.doc.sheets) {
      const lo = sheetCsv(outDir, base, s.name);
      s.cells.forEach((row, r) =>
        row.forEach((content, c) => {
          if (typeof content !== 'string' || !content.startsWith('=')) return;
          const app = readCell(hf, s.name, r, c);
          const text = lo[r]?.[c] ?? '';
          compared++;
          if (!app.ok) errors++;
          // A formula the export had to write as a value is compared as a value.
          const r2 = sameValue(
            app.ok || app.error !== '#ERROR!' ? app : { ok: false, error: '#VALUE!', message: '' },
            text,
          );
          if (!r2.ok) mismatches.push(`${s.name}!R${r + 1}C${c + 1} ${content}: ${r2.why}`);
        }),
      );
    }
    hf.destroy();
    expect(mismatches.slice(0, 20)).toEqual([]);
    expect(compared).toBeGreaterThan(base === 'hand-made' ? 15 : 100);
    expect(errors).toBeGreaterThanOrEqual(leastErrors);
  });

  it('shows no unknown-name error anywhere', () => {
    for (const f of csvFiles(outDir)) {
      if (f.includes('_kvar_ledger') || f.includes('Functions used')) continue;
      const text = readFileSync(join(outDir, f), 'utf8');
      expect({ f, name: text.includes('#NAME?') }).toEqual({ f, name: false });
    }
  });
});
