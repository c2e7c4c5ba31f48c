// The document the app hands to the xlsx export: a builder workbook goes out in its portable
// flavour (no BUS.SUMS, which other programs do not know), with the user's own sheets kept.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { handOff, handOffDoc } from '../../src/ui/app/handOff.ts';
import { alignedWith } from '../../src/io/xlsx/export.ts';
import { importKvarXlsx } from '../../src/io/xlsx/importKvar.ts';
import { toResult } from '../../src/engine/index.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';

const formulas = (doc: WorkbookDoc) =>
  doc.sheets
    .flatMap((s) => s.cells.flat())
    .filter((c): c is string => typeof c === 'string' && c.startsWith('='));
const site = readSiteFile(
  readFileSync(new URL('../../templates/pumping-station.json', import.meta.url), 'utf8'),
).site;

describe('hand-off document', () => {
  it('rebuilds a live workbook with classic sums and keeps added sheets', () => {
    const live = buildWorkbook(site, { flavour: 'live' });
    expect(formulas(live).some((f) => f.includes('BUS.SUMS'))).toBe(true);
    const withNotes: WorkbookDoc = {
      ...live,
      title: 'My tender',
      sheets: [...live.sheets, { name: 'My notes', cells: [['check with client']] }],
    };
    const out = handOffDoc(withNotes);
    expect(out.note).toBeUndefined();
    expect(out.doc.title).toBe('My tender');
    expect(formulas(out.doc).some((f) => f.includes('BUS.SUMS'))).toBe(false);
    expect(formulas(out.doc).some((f) => /SUMIFS?\(/.test(f))).toBe(true);
    expect(out.doc.sheets.at(-1)).toEqual({ name: 'My notes', cells: [['check with client']] });
    expect(out.settings?.name).toBe(site.settings.name);
  });

  it('computes the same bus totals in both flavours (engine with the catalogue)', () => {
    const live = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const portable = WorkbookSession.fromDoc(handOffDoc(live.toDoc()).doc);
    const busesOf = (s: WorkbookSession) => s.engine.getSheetValues(s.engine.getSheetId('Buses') as number);
    const a = busesOf(live),
      b = busesOf(portable);
    expect(b.length).toBe(a.length);
    let numbers = 0;
    a.forEach((row, r) =>
      row.forEach((v, c) => {
        const w = b[r]?.[c];
        if (typeof v !== 'number') return expect(w).toEqual(v);
        numbers++;
        expect(w).toBeCloseTo(v, 9);
      }),
    );
    expect(numbers).toBeGreaterThan(20);
  });

  it('carries an edited input into the rebuilt workbook', () => {
    const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const motors = s.engine.getSheetId('Motors') as number;
    const header = s.sheetContents(motors)[0] as string[];
    const col = header.findIndex((h) => /^Rated output/.test(String(h)));
    expect(col).toBeGreaterThan(0);
    s.setCells(motors, [{ row: 1, col, content: 123.4 }]);
    const out = handOffDoc(s.toDoc());
    expect(out.doc.sheets.find((x) => x.name === 'Motors')?.cells[1]?.[col]).toBe(123.4);
  });

  it('sends a workbook without a Buses sheet as it is', () => {
    const doc: WorkbookDoc = {
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 'Scratch',
      sheets: [{ name: 'Sheet 1', cells: [[1, '=A1*2']] }],
    };
    expect(handOffDoc(doc)).toEqual({ doc });
  });

  it('takes the cached results from the open engine when the rebuilt document has its layout, and gives the same file values', async () => {
    const live = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const doc = live.toDoc();
    expect(alignedWith(handOffDoc(doc).doc, doc)).toBe(true);
    let reads = 0;
    const resultAt = (sheet: string, row: number, col: number) => {
      reads++;
      const id = live.engine.getSheetId(sheet);
      return id === undefined ? undefined : toResult(live.engine.getCellValue({ sheet: id, row, col }));
    };
    const fast = await handOff(doc, undefined, resultAt);
    expect(reads).toBeGreaterThan(100);
    const slow = await handOff(doc);
    const [a, b] = [await importKvarXlsx(fast.bytes), await importKvarXlsx(slow.bytes)];
    if (!a.ok || !b.ok) return expect.fail('both hand-off files must open again');
    expect(a.doc.sheets).toEqual(b.doc.sheets);
    expect(fast.issues).toBe(slow.issues);
  });

  it('does not read the open engine when a row was added by copying another (its formulas differ from a rebuild)', async () => {
    const doc = buildWorkbook(site, { flavour: 'live' });
    const motors = doc.sheets.find((s) => s.name === 'Motors');
    const grown: WorkbookDoc = {
      ...doc,
      sheets: doc.sheets.map((s) =>
        s === motors
          ? {
              ...s,
              cells: [
                ...s.cells.slice(0, 2),
                [...(s.cells[1] ?? [])].map((c, i) => (i === 0 ? 'P-EXTRA' : c)),
                ...s.cells.slice(2),
              ],
            }
          : s,
      ),
    };
    let reads = 0;
    await handOff(grown, undefined, () => {
      reads++;
      return undefined;
    });
    expect(reads).toBe(0);
  });
});
