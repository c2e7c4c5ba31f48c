// The export's "Options compared" sheet: the design options of the site as values, with the
// banks of each option; the cover names the sheet; our own import leaves the sheet out (it is
// generated, not part of the workbook), and a large site's export says why it has none.
import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { OPTIONS_UNASKED_MAX_ROWS, optionsForExport, optionsOfDoc } from '../../../src/core/options/index.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { exportWorkbookXlsxWithReport, importKvarXlsx } from '../../../src/io/xlsx/index.ts';
import { BANKS_HEADER, OPTIONS_HEADER, OPTIONS_SHEET_NAME } from '../../../src/io/xlsx/exportOptions.ts';
import { generateSite } from '../../bench/generateSite.ts';

const { site, banks } = readSiteFile(
  readFileSync(new URL('../../../templates/cold-store.json', import.meta.url), 'utf8'),
);

async function sheetRows(bytes: Uint8Array, name: string): Promise<unknown[][] | undefined> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  const ws = wb.getWorksheet(name);
  if (!ws) return undefined;
  // Rows without a cell are holes in the library's array: read as empty rows.
  return Array.from((ws.getSheetValues() as unknown[][]).slice(1), (r) => (r ?? []).slice(1));
}

describe('the exported options sheet', () => {
  it('holds each option as the core works it out, then the banks of each, and comes back out on import', async () => {
    const live = buildWorkbook(site, { flavour: 'live', ...(banks ? { banks } : {}) });
    const wanted = optionsOfDoc(live);
    if (!wanted.ok) throw new Error(wanted.message);
    const portable = buildWorkbook(site, { flavour: 'portable', ...(banks ? { banks } : {}) });
    const r = await exportWorkbookXlsxWithReport(portable, { valuesFrom: live, ...optionsForExport(live) });
    const rows = (await sheetRows(r.bytes, OPTIONS_SHEET_NAME)) as unknown[][];
    const head = rows.findIndex((x) => x[0] === OPTIONS_HEADER[0] && x[1] === OPTIONS_HEADER[1]);
    expect(rows[head]).toEqual([...OPTIONS_HEADER]);
    const body = rows.slice(head + 1, head + 1 + wanted.options.length);
    expect(body.map((x) => x[0])).toEqual(wanted.options.map((o) => o.name));
    for (const [i, o] of wanted.options.entries()) {
      const x = body[i] as unknown[];
      expect(x[2]).toBeCloseTo(o.capacitor_kvar, 9);
      expect(x[4]).toBeCloseTo(o.total as number, 9);
      expect(x[6]).toBeCloseTo(o.annual_saving, 9);
      expect(x[8]).toBe(o.meets_every_case ? 'met' : 'missed');
      expect([x[9], x[10]]).toEqual([o.errors, o.warnings]);
    }
    // The banks: one row per bank of every option that has banks of its own.
    const banksAt = rows.findIndex((x) => x[0] === BANKS_HEADER[0] && x[1] === BANKS_HEADER[1]);
    const bankRows = rows.slice(banksAt + 1);
    const own = wanted.options.filter((o) => !o.sameAs);
    expect(bankRows).toHaveLength(own.reduce((n, o) => n + o.banks.length, 0));
    const central = own.find((o) => o.id === 'central')!;
    expect(bankRows.filter((x) => x[0] === central.name).map((x) => x[1])).toEqual(
      central.banks.map((b) => b.bus),
    );
    const cover = JSON.stringify(await sheetRows(r.bytes, 'Cover'));
    expect(cover).toContain(`sheet ${OPTIONS_SHEET_NAME}`);
    const back = await importKvarXlsx(r.bytes);
    if (!back.ok) throw new Error('import failed');
    expect(back.doc.sheets.map((s) => s.name)).not.toContain(OPTIONS_SHEET_NAME);
    expect(back.doc.sheets.map((s) => s.name)).toEqual(portable.sheets.map((s) => s.name));
  });

  it('is left out of a large site, and the cover says why', async () => {
    const big = generateSite({ rows: OPTIONS_UNASKED_MAX_ROWS + 1, buses: 20 });
    const live = buildWorkbook(big, { flavour: 'live' });
    const out = optionsForExport(live);
    expect(out.options).toBeUndefined();
    expect(out.optionsLeftOut).toMatch(/^Design options are not in this file: with 2,001 equipment rows/);
  });
});
