// The workbooks every other spreadsheet program recalculates in the cross-engine suite: each
// template's export, an invented site with a motor's own capacitor (and a faulty copy), a hand-made workbook with every kind
// of content, the solar template with charging beside a plain bank, and a copy of the invented site's export with a wrong cached value planted in it
// (a program that really recalculates gives the right value back). Shared by the LibreOffice
// and the Gnumeric checks, with the comparison they both use.
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import type { Site, SiteSettings } from '../../src/core/site/model.ts';
import { proposeChoices } from '../../src/core/site/compensation.ts';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { createEngine, readCell, type CellResult } from '../../src/engine/index.ts';
import { exportWorkbookXlsx } from '../../src/io/xlsx/export.ts';
import { sampleDoc } from '../io/xlsx/docFixtures.ts';
import { inventedQuarry } from './inventedSite.ts';
import { editedWorkbooks } from './editedWorkbooks.ts';
import * as chargedSolar from '../core/workbook/chargedSolar.ts';

/** Relative tolerance of the check; an absolute floor covers results that cancel to ~0. */
export const REL = 1e-9;
export const ABS_FLOOR = 1e-9;

export interface Book {
  readonly base: string;
  readonly doc: WorkbookDoc;
  readonly settings?: SiteSettings;
}

export interface Planted {
  readonly file: string;
  readonly sheet: string;
  readonly row: number;
  readonly col: number;
  readonly cachedInFile: unknown;
  readonly app: number;
}

export const BOOK_NAMES = [
  'cold-store',
  'pumping-station',
  'solar-collector',
  'solar-collector-rated',
  'solar-collector-charged',
  'invented-quarry',
  'invented-quarry-fault',
  'invented-quarry-lagging',
  'hand-made',
  'edited-1',
  'edited-2',
  'edited-3',
] as const;

export const PLANTED_VALUE = 987654.321;

/** Export every book into `work` (base.xlsx) and the planted copy (planted.xlsx). */
export async function writeBooks(
  work: string,
): Promise<{ books: Book[]; files: string[]; planted: Planted }> {
  const books: Book[] = [];
  for (const f of readdirSync('templates')
    .filter((n) => n.endsWith('.json'))
    .sort()) {
    const { site, banks } = readSiteFile(readFileSync(join('templates', f), 'utf8'));
    books.push({
      base: f.replace(/\.json$/, ''),
      doc: buildWorkbook(site, { flavour: 'portable', ...(banks ? { banks } : {}) }),
      settings: site.settings,
    });
  }
  // The solar template with its tan φ limits referred to 42,000 kW rated power (a generating
  // site's requirement): the Compensation sheet's point-of-connection formulas take the Site
  // sheet's rated power instead of P.
  const solar = readSiteFile(readFileSync(join('templates', 'solar-collector.json'), 'utf8'));
  const rated: Site = {
    ...solar.site,
    settings: {
      ...solar.site.settings,
      requirement: { ...solar.site.settings.requirement, refKw: 42_000 },
    },
  };
  books.push({
    base: 'solar-collector-rated',
    doc: buildWorkbook(rated, { flavour: 'portable', ...(solar.banks ? { banks: solar.banks } : {}) }),
    settings: rated.settings,
  });
  // The solar template with a night-only cable and a plain bank on a collector bus: the
  // Compensation sheet's charging column, resonance orders and voltage rise.
  books.push({
    base: 'solar-collector-charged',
    doc: buildWorkbook(chargedSolar.site, { flavour: 'portable', banks: [chargedSolar.bank] }),
    settings: chargedSolar.site.settings,
  });
  const quarry = inventedQuarry();
  // The design's banks, and the crusher motor's own capacitor (switched out with it in maintenance).
  const quarryBanks = [...proposeChoices(quarry), { bus: 'LV-CR2', fixed_kvar: 40 }];
  books.push({
    base: 'invented-quarry',
    doc: buildWorkbook(quarry, { flavour: 'portable', banks: quarryBanks }),
    settings: quarry.settings,
  });
  const faulty = inventedQuarry(true);
  books.push({
    base: 'invented-quarry-fault',
    doc: buildWorkbook(faulty, { flavour: 'portable' }),
    settings: faulty.settings,
  });
  // A tariff that bills drawn kvar alone: cos φ ≥ 0.95 lagging, leading not limited (the Site
  // sheet's lagging-only branch and the Compensation sheet's checks under it).
  const lagging: Site = {
    ...quarry,
    settings: { ...quarry.settings, requirement: { kind: 'cosphi', target: 0.95, lagOnly: true } },
  };
  books.push({
    base: 'invented-quarry-lagging',
    doc: buildWorkbook(lagging, { flavour: 'portable', banks: proposeChoices(lagging) }),
    settings: lagging.settings,
  });
  books.push({ base: 'hand-made', doc: sampleDoc() });
  // Workbooks edited through the page's own model (random sites and edits, fixed seeds), as the
  // page exports them: what a user built by hand must recompute the same elsewhere.
  editedWorkbooks(3).forEach((doc, i) => books.push({ base: `edited-${i + 1}`, doc }));
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
  cell.value = { formula: cell.formula, result: PLANTED_VALUE } as ExcelJS.CellFormulaValue;
  const plantedFile = join(work, 'planted.xlsx');
  writeFileSync(plantedFile, new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer));
  const check = new ExcelJS.Workbook();
  await check.xlsx.load(readFileSync(plantedFile) as unknown as ArrayBuffer);
  const app = readCell(createEngine(quarryBook.doc.sheets), 'Buses', 1, pCol);
  files.push(plantedFile);
  return {
    books,
    files,
    planted: {
      file: plantedFile,
      sheet: 'Buses',
      row: 1,
      col: pCol,
      cachedInFile: check.getWorksheet('Buses')!.getCell(2, pCol + 1).result,
      app: app.ok ? (app.value as number) : NaN,
    },
  };
}

/** Does the other program's text for a cell say what the app computed? `who` names it in `why`. */
export function sameValue(app: CellResult, text: string, who: string): { ok: boolean; why: string } {
  if (!app.ok) {
    const isError = /^(#[A-Z/0!?]+|Err:\d+)$/.test(text);
    // Guards and divisions must give the same kind of error; other failures only need to fail.
    const strict = app.error === '#N/A' || app.error === '#DIV/0!';
    return { ok: isError && (!strict || text === app.error), why: `app ${app.error}, ${who} "${text}"` };
  }
  const v = app.value;
  if (v === null) return { ok: text === '' || text === '0', why: `app blank, ${who} "${text}"` };
  if (typeof v === 'boolean')
    return { ok: text === (v ? 'TRUE' : 'FALSE'), why: `app ${v}, ${who} "${text}"` };
  if (typeof v === 'string') return { ok: text === v, why: `app "${v}", ${who} "${text}"` };
  const other = Number(text);
  const ok =
    text.trim() !== '' &&
    Number.isFinite(other) &&
    Math.abs(other - v) <= REL * Math.max(Math.abs(v), Math.abs(other)) + ABS_FLOOR * REL;
  return { ok, why: `app ${v}, ${who} "${text}"` };
}

/**
 * Every formula cell of a book against the other program's sheets: the mismatches (sheet, cell,
 * formula, why), how many cells were compared and how many of them the app shows as errors.
 */
export function compareBook(
  book: Book,
  sheetText: (sheet: string) => string[][],
  who: string,
): { mismatches: string[]; compared: number; errors: number } {
  const hf = createEngine(book.doc.sheets);
  const mismatches: string[] = [];
  let compared = 0;
  let errors = 0;
  for (const s of book.doc.sheets) {
    const other = sheetText(s.name);
    s.cells.forEach((row, r) =>
      row.forEach((content, c) => {
        if (typeof content !== 'string' || !content.startsWith('=')) return;
        const app = readCell(hf, s.name, r, c);
        const text = other[r]?.[c] ?? '';
        compared++;
        if (!app.ok) errors++;
        // A formula the export had to write as a value is compared as a value.
        const r2 = sameValue(
          app.ok || app.error !== '#ERROR!' ? app : { ok: false, error: '#VALUE!', message: '' },
          text,
          who,
        );
        if (!r2.ok) mismatches.push(`${s.name}!R${r + 1}C${c + 1} ${content}: ${r2.why}`);
      }),
    );
  }
  hf.destroy();
  return { mismatches, compared, errors };
}
