// The export's Design options sheet: the options' inputs and live formulas travel like any other
// sheet; Checks' counts of errors and warnings per design sit beside the table as values, as the
// core counts them (compare.ts); our own import brings every option input back, and a large
// site's export says why the sheet has no figures.
import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import {
  draftOptions,
  draftOptionsOfDoc,
  OPTIONS_UNASKED_MAX_ROWS,
  optionsForExport,
  optionsOfDoc,
} from '../../../src/core/options/index.ts';
import { heldProposals } from '../../../src/core/workbook/cellMarks.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { optionDrafts } from '../../../src/core/workbook/optionDrafts.ts';
import { GIVEN_ROW, OPTIONS_SHEET, TABLE, tableRow } from '../../../src/core/workbook/optionsLayout.ts';
import { renderWorkbook } from '../../../src/core/workbook/render.ts';
import { exportWorkbookXlsxWithReport, importKvarXlsx } from '../../../src/io/xlsx/index.ts';
import { generateSite } from '../../bench/generateSite.ts';
import { figuresOf } from '../../core/workbook/optionFaces.ts';

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

describe('the exported Design options sheet', () => {
  const live = buildWorkbook(site, { flavour: 'live', ...(banks ? { banks } : {}) });
  const portable = buildWorkbook(site, { flavour: 'portable', ...(banks ? { banks } : {}) });

  it("writes Checks' counts per design beside the table, as the core counts them", async () => {
    const wanted = optionsOfDoc(live);
    if (!wanted.ok) throw new Error(wanted.message);
    const r = await exportWorkbookXlsxWithReport(portable, { valuesFrom: live, ...optionsForExport(live) });
    const rows = (await sheetRows(r.bytes, OPTIONS_SHEET)) as unknown[][];
    expect(wanted.options.map((o) => o.id)).toEqual(['current', 'proposal', 'plain', 'detuned', 'central']);
    wanted.options.forEach((o, j) => {
      const row = rows[j === 0 ? GIVEN_ROW : tableRow(j - 1)] as unknown[];
      const f = figuresOf(o);
      expect([row[TABLE.errors.col], row[TABLE.warnings.col]], o.name).toEqual([f.errors, f.warnings]);
    });
    const cover = JSON.stringify(await sheetRows(r.bytes, 'Cover'));
    expect(cover).toContain(`Design options side by side as live formulas: sheet ${OPTIONS_SHEET}`);
    expect(await sheetRows(r.bytes, 'Options compared')).toBeUndefined();
  });

  it('comes back on import with every option input, an edited one included', async () => {
    const sheet = portable.sheets.find((s) => s.name === OPTIONS_SHEET)!;
    const cases = site.settings.cases;
    const before = optionDrafts(sheet, cases);
    // An estimator's own variant: option 2 renamed, its first bank given a reactor.
    const edited = structuredClone(portable);
    const opt = edited.sheets.find((s) => s.name === OPTIONS_SHEET)!;
    const titleRow = opt.cells.findIndex((line) => line[1] === 'Option 2');
    (opt.cells[titleRow] as unknown[])[0] = 'Plain, with a reactor';
    const bankRow = opt.cells.findIndex((line, r) => r > titleRow && line[0] === before[1]?.banks[0]?.bus);
    const reactorCol = opt.cells[0]?.indexOf('Reactor (kvar)') as number;
    (opt.cells[bankRow] as unknown[])[reactorCol] = 75;
    const doc = renderWorkbook(edited, { flavour: 'portable' }).doc;
    const r = await exportWorkbookXlsxWithReport(doc);
    const back = await importKvarXlsx(r.bytes);
    if (!back.ok) throw new Error('import failed');
    const again = renderWorkbook(back.doc, { flavour: 'live' }).doc;
    const after = optionDrafts(
      again.sheets.find((s) => s.name === OPTIONS_SHEET),
      cases,
    );
    expect(after[1]?.name).toBe('Plain, with a reactor');
    expect(after[1]?.banks[0]?.reactor_kvar).toBe(75);
    expect(
      after.map((d) => ({ ...d, name: '', banks: d.banks.map((b) => ({ ...b, reactor_kvar: 0 })) })),
    ).toEqual(
      before.map((d) => ({ ...d, name: '', banks: d.banks.map((b) => ({ ...b, reactor_kvar: 0 })) })),
    );
    expect(back.doc.sheets.map((s) => s.name)).toEqual(doc.sheets.map((s) => s.name));
  });

  it('a workbook saved before the sheet gets the standard options, marked proposed, when rendered with the drafter', () => {
    const old = { ...live, sheets: live.sheets.filter((s) => s.name !== OPTIONS_SHEET) };
    const report = optionsOfDoc(old);
    if (!report.ok) throw new Error(report.message);
    expect(report.options.map((o) => o.id)).toEqual(['current', 'proposal', 'plain', 'detuned', 'central']);
    const opened = renderWorkbook(old, { flavour: 'live', draftOptions: draftOptionsOfDoc }).doc.sheets.find(
      (s) => s.name === OPTIONS_SHEET,
    );
    const drafts = draftOptions(site);
    expect(optionDrafts(opened, site.settings.cases).map((d) => d.name)).toEqual(drafts.map((d) => d.name));
    const values = drafts.reduce(
      (n, d) =>
        n +
        d.banks.reduce(
          (m, b) =>
            m + Object.entries(b).filter(([k, v]) => k !== 'bus' && k !== 'note' && v !== undefined).length,
          0,
        ),
      0,
    );
    expect(heldProposals(opened!)).toHaveLength(values);
  });
});

describe('a large site', () => {
  it("keeps the options' inputs without figures, and the cover says why", () => {
    const big = generateSite({ rows: OPTIONS_UNASKED_MAX_ROWS + 1, buses: 20 });
    const live = buildWorkbook(big, { flavour: 'live' });
    const out = optionsForExport(live);
    expect(out.optionFindings).toBeUndefined();
    expect(out.optionsLeftOut).toMatch(
      /holds the options' inputs only, no figures: with 2,001 equipment rows/,
    );
    const sheet = live.sheets.find((s) => s.name === OPTIONS_SHEET)!;
    expect(sheet.cells.flat().some((c) => typeof c === 'string' && c.startsWith('='))).toBe(true);
    expect(String(sheet.cells[tableRow(3) + 1]?.[0])).toMatch(/not formulas here: with 2,001 equipment rows/);
  });
});
