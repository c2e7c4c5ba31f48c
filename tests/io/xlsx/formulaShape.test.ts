// The per-shape conversion cache gives exactly the text the direct conversion gives, cell by cell.
import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { expandFormula } from '../../../src/io/formula/expand.ts';
import { exportWorkbookXlsx } from '../../../src/io/xlsx/export.ts';
import { compileShape, fromShape, renderShape, toShape } from '../../../src/io/xlsx/formulaShape.ts';
import { toFileFormula } from '../../../src/io/xlsx/functionNames.ts';
import { exportSheetCells } from '../../../src/io/xlsx/exportCells.ts';
import { normaliseFormula } from '../../../src/io/xlsx/metadata.ts';
import { generateSite } from '../../bench/generateSite.ts';

describe('formula shapes', () => {
  it('turn relative rows into offsets and back', () => {
    const f = '=KVAR.MOTOR(F12,$G$3,H12*2)+\'Sheet 1\'!A11+Loads!B$9+SUM(C:C)+LOG10(A13)+"A12"';
    const shape = toShape(f, 12);
    expect(shape).not.toContain('F12');
    expect(shape).toContain('$G$3');
    expect(shape).toContain('"A12"');
    expect(fromShape(shape, 12)).toBe(f);
    expect(fromShape(shape, 40)).toBe(
      '=KVAR.MOTOR(F40,$G$3,H40*2)+\'Sheet 1\'!A39+Loads!B$9+SUM(C:C)+LOG10(A41)+"A12"',
    );
    expect(toShape('=F40*2', 40)).toBe(toShape('=F7*2', 7));
  });

  it('write out from a compiled shape exactly as from the shape text', () => {
    for (const f of [
      '=KVAR.MOTOR(F12,$G$3,H12*2)+\'Sheet 1\'!A11+Loads!B$9+SUM(C:C)+LOG10(A13)+"A12"',
      '=1+2',
      '=A12',
      '="B3"&C12&"D4"',
    ]) {
      const shape = toShape(f, 12);
      for (const row of [1, 12, 13, 999])
        expect(renderShape(compileShape(shape), row)).toBe(fromShape(shape, row));
      expect(renderShape(compileShape(shape), 12)).toBe(f);
    }
    // A different formula in the same column is not taken for the same shape.
    expect(renderShape(compileShape(toShape('=F12*2', 12)), 13)).not.toBe('=F12*2');
  });

  it('give the same file formulas as converting every cell on its own (a template, portable)', async () => {
    const { site } = readSiteFile(readFileSync('templates/pumping-station.json', 'utf8'));
    const doc = buildWorkbook(site, { flavour: 'portable' });
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await exportWorkbookXlsx(doc)) as unknown as ArrayBuffer);
    let compared = 0;
    for (const s of doc.sheets) {
      const ws = wb.getWorksheet(s.name)!;
      s.cells.forEach((row, r) =>
        row.forEach((c, col) => {
          if (typeof c !== 'string' || !c.startsWith('=')) return;
          const e = expandFormula(c);
          if (!e.ok) throw new Error(e.message);
          expect([s.name, r, col, ws.getCell(r + 1, col + 1).formula]).toEqual([
            s.name,
            r,
            col,
            toFileFormula(e.formula).text,
          ]);
          compared++;
        }),
      );
    }
    expect(compared).toBeGreaterThan(200);
  });

  it('give per shape the same normalised text (for row fingerprints) as normalising each written formula', () => {
    const { site } = readSiteFile(readFileSync('templates/pumping-station.json', 'utf8'));
    const docs = [
      buildWorkbook(site, { flavour: 'portable' }),
      buildWorkbook(generateSite({ rows: 1_000, buses: 30 }), { flavour: 'portable' }),
    ];
    let compared = 0;
    for (const doc of docs) {
      for (const s of doc.sheets) {
        for (const row of exportSheetCells(() => ({ ok: true, value: null }), s).rows) {
          for (const c of row) {
            if (c.kind !== 'formula') continue;
            if (c.normalised !== normaliseFormula(c.formula))
              expect([s.name, c.formula, c.normalised]).toEqual([
                s.name,
                c.formula,
                normaliseFormula(c.formula),
              ]);
            compared++;
          }
        }
      }
    }
    expect(compared).toBeGreaterThan(5_000);
  });
});
