// The cover's figures at a glance: per case cos φ and tan φ before and after at the point
// of connection, the cost total, the annual saving and the payback, each a formula referring to
// the exported sheet's cell, cached with that cell's value. (LibreOffice recalculating them, and
// following an edit, is in tests/crossengine/recalc.test.ts.)
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { planBusColumns } from '../../../src/core/workbook/busColumns.ts';
import { QC, savingRowOf, summaryRowOf } from '../../../src/core/workbook/quantitiesLayout.ts';
import { columnLetters } from '../../../src/core/workbook/refs.ts';
import { createEngine, readCell } from '../../../src/engine/index.ts';
import { exportWorkbookXlsx } from '../../../src/io/xlsx/export.ts';
import { FIGURES_HEADING } from '../../../src/io/xlsx/exportCover.ts';
import { sampleDoc } from './docFixtures.ts';

async function coverOf(bytes: Uint8Array): Promise<ExcelJS.Worksheet> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  return wb.getWorksheet('Cover') as ExcelJS.Worksheet;
}

/** Label in column A → the formula cell in column B. */
function figures(ws: ExcelJS.Worksheet): Map<string, ExcelJS.Cell> {
  const out = new Map<string, ExcelJS.Cell>();
  ws.eachRow((row) => {
    const b = row.getCell(2);
    if (b.formula) out.set(String(row.getCell(1).value), b);
  });
  return out;
}

describe('the cover of an exported site', () => {
  it('carries the figures as formulas on the Buses and Quantities sheets, with their values', async () => {
    const { site, banks } = readSiteFile(readFileSync('templates/cold-store.json', 'utf8'));
    const doc = buildWorkbook(site, { flavour: 'portable', ...(banks ? { banks } : {}) });
    const ws = await coverOf(await exportWorkbookXlsx(doc, { settings: site.settings }));
    const text = ws.getSheetValues().flat().join('\n');
    expect(text).toContain(FIGURES_HEADING);
    const f = figures(ws);
    const cases = site.settings.cases;
    const bus = planBusColumns(cases);
    const hf = createEngine(doc.sheets);
    const value = (sheet: string, row: number, col: number) => {
      const r = readCell(hf, sheet, row, col);
      if (!r.ok) throw new Error(`${sheet} R${row + 1}C${col + 1}: ${r.error}`);
      return r.value;
    };
    cases.forEach((c, k) => {
      for (const [label, col] of [
        [`cos φ before at MV-11, ${c}`, bus.cos[k]],
        [`tan φ before at MV-11, ${c}`, bus.tan[k]],
        [`cos φ after at MV-11, ${c}`, bus.cosAfter[k]],
        [`tan φ after at MV-11, ${c}`, bus.tanAfter[k]],
      ] as const) {
        const cell = f.get(label);
        expect(cell?.formula, label).toBe(`Buses!$${columnLetters(col as number)}$2`);
        expect(cell?.result, label).toBe(value('Buses', 1, col as number));
        expect(cell?.numFmt).toBe('0.000');
      }
    });
    const n = 3; // buses MV-11, LV-REF, LV-SVC: the Quantities sheet's blocks
    const q = (row: number) => `'Quantities and cost'!$${columnLetters(QC.cost)}$${row + 1}`;
    const total = f.get('Equipment cost total with surcharges');
    const saving = f.get('Annual saving');
    const payback = f.get('Simple payback (years)');
    expect(total?.formula).toBe(q(summaryRowOf(n, 'Total')));
    expect(saving?.formula).toBe(q(savingRowOf(n, cases.length, 'Annual saving')));
    expect(payback?.formula).toBe(q(savingRowOf(n, cases.length, 'Simple payback (years)')));
    expect(f.get('Currency of the cost and saving')?.result).toBe('EUR');
    // payback = total / saving (the Quantities sheet's rule, recomputed here from the cached values)
    expect(Number(payback?.result)).toBeCloseTo(Number(total?.result) / Number(saving?.result), 9);
    expect(Number(total?.result)).toBeGreaterThan(0);
    hf.destroy();
  });

  it('has no figures for a workbook without the site sheets', async () => {
    const ws = await coverOf(await exportWorkbookXlsx(sampleDoc()));
    expect(figures(ws).size).toBe(0);
    expect(ws.getSheetValues().flat().join('\n')).not.toContain(FIGURES_HEADING);
  });
});
