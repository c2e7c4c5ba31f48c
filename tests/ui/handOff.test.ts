// The document the app hands to the xlsx export: a builder workbook goes out in its portable
// flavour (no BUS.SUMS, which other programs do not know), with the user's own sheets kept.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { handOffDoc } from '../../src/ui/app/handOff.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';

const formulas = (doc: WorkbookDoc) => doc.sheets.flatMap((s) => s.cells.flat()).filter((c): c is string => typeof c === 'string' && c.startsWith('='));
const site = readSiteFile(readFileSync(new URL('../../templates/pumping-station.json', import.meta.url), 'utf8')).site;

describe('hand-off document', () => {
  it('rebuilds a live workbook with classic sums and keeps added sheets', () => {
    const live = buildWorkbook(site, { flavour: 'live' });
    expect(formulas(live).some((f) => f.includes('BUS.SUMS'))).toBe(true);
    const withNotes: WorkbookDoc = { ...live, title: 'My tender', sheets: [...live.sheets, { name: 'My notes', cells: [['check with client']] }] };
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
    const a = busesOf(live), b = busesOf(portable);
    expect(b.length).toBe(a.length);
    a.forEach((row, r) => row.forEach((v, c) => {
      if (typeof v === 'number') expect(b[r]?.[c]).toBeCloseTo(v, 9);
    }));
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
    const doc: WorkbookDoc = { format: 'kvar-ledger-workbook', version: 1, title: 'Scratch', sheets: [{ name: 'Sheet 1', cells: [[1, '=A1*2']] }] };
    expect(handOffDoc(doc)).toEqual({ doc });
  });
});
