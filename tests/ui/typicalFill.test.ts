// Typical values for a tender-stage list, through the page's model: blanks of motors and
// transformers with a rating take a typical value marked as assumed (one undo step); the marks
// travel with their rows, lapse when the cell is typed over, are saved with the workbook, are
// listed by Checks and noted on the export's cover.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { heldAssumptions } from '../../src/core/workbook/cellMarks.ts';
import { collectChecks } from '../../src/ui/panels/checksModel.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { handOffDoc } from '../../src/ui/app/handOff.ts';
import { exportWorkbookXlsxWithReport } from '../../src/io/xlsx/index.ts';
import { workbookOf } from '../../src/ui/templates/templateBuild.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));

async function demo(): Promise<WorkbookSession> {
  const id = 'cold-store';
  return WorkbookSession.fromDoc(await workbookOf(id, readFileSync(`${ROOT}templates/${id}.json`, 'utf8')));
}

function columns(s: WorkbookSession, sheet: number) {
  const header = (s.sheetContents(sheet)[0] ?? []).map(String);
  return (h: string) => {
    const c = header.indexOf(h);
    if (c < 0) throw new Error(`no column ${h}`);
    return c;
  };
}

describe('filling blanks with typical values', () => {
  it('a motor given only its rated output gets efficiency, cos φ and no-load current, marked assumed', async () => {
    const s = await demo();
    const motors = s.engine.getSheetId('Motors') as number;
    const col = columns(s, motors);
    const row = s.sheetContents(motors).length;
    s.setCells(motors, [
      { row, col: col('Tag'), content: 'M-TYP' },
      { row, col: col('Bus'), content: 'LV-REF' },
      { row, col: col('Rated output (kW)'), content: 11 },
    ]);
    const before = s.toDoc();
    const report = await s.fillTypicalValues();
    expect(report.filled).toBeGreaterThanOrEqual(3);
    const value = (c: string) => s.engine.getCellValue({ sheet: motors, row, col: col(c) });
    // IE3 4-pole 11 kW: 91.4 % (IEC 60034-30-1 Table 2, the published minimum).
    expect(value('Efficiency')).toBe(0.914);
    expect(typeof value('cos φ')).toBe('number');
    expect(value('cos φ') as number).toBeGreaterThan(0.75);
    expect(value('cos φ') as number).toBeLessThan(0.9);
    expect(typeof value('No-load current (%)')).toBe('number');
    const marks = s.meta(motors).marks ?? [];
    const eff = marks.find((m) => m.row === row && m.col === col('Efficiency'));
    expect(eff).toMatchObject({ kind: 'assumed', value: 0.914 });
    expect(eff?.note).toMatch(/11 kW, 4-pole, class IE3/);
    // Demo motors with a blank no-load current got one too; nothing typed was touched.
    expect(s.sheetContents(motors)[1]?.[col('No-load current (%)')]).toBe(28);

    // Saved and opened again: the values and marks are there; Checks lists them.
    const saved = s.toDoc();
    const reopened = WorkbookSession.fromDoc(saved);
    expect(reopened.meta(motors).marks).toEqual(marks);
    const sheet = saved.sheets.find((x) => x.name === 'Motors');
    expect(heldAssumptions(sheet!)).toHaveLength(marks.length);
    const listed = collectChecks(saved).items.find((i) => i.code === 'assumed');
    expect(listed?.text).toMatch(new RegExp(`^assumed: ${marks.length} typical values`));
    expect(listed?.severity).toBe('info');

    // The export marks each assumed cell with a note of its source and lists them on the cover.
    const handOff = handOffDoc(saved);
    const bytes = (
      await exportWorkbookXlsxWithReport(handOff.doc, handOff.settings ? { settings: handOff.settings } : {})
    ).bytes;
    const { default: ExcelJS } = await import('exceljs');
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
    const cover = wb.worksheets[0]!.getSheetValues().flat().join('\n');
    expect(cover).toMatch(new RegExp(`${marks.length} value\\(s\\) are typical values assumed for blanks`));
    const note = wb.getWorksheet('Motors')!.getCell(row + 1, col('Efficiency') + 1).note;
    expect(JSON.stringify(note)).toMatch(
      /Assumed \(typical value at tender stage\): 11 kW, 4-pole, class IE3/,
    );

    // One undo takes every value and mark out.
    expect(s.undo()).toBe(true);
    expect(s.toDoc()).toEqual(before);
  });

  it('marks move with their rows, and lapse when the cell is typed over', async () => {
    const s = await demo();
    const transformers = s.engine.getSheetId('Transformers') as number;
    const col = columns(s, transformers);
    const row = s.sheetContents(transformers).length;
    s.setCells(transformers, [
      { row, col: col('Tag'), content: 'TX-TYP' },
      { row, col: col('Bus'), content: 'MV-11' },
      { row, col: col('Feeds bus'), content: 'LV-NEW' },
      { row, col: col('Rating (kVA)'), content: 1000 },
    ]);
    await s.fillTypicalValues();
    const pk = col('Load loss (kW)');
    const mark = () => (s.meta(transformers).marks ?? []).find((m) => m.col === pk);
    expect(mark()?.row).toBe(row);
    // Maximum load losses for 1000 kVA liquid-immersed, EU 548/2014 Annex I Table I.1 Tier 2:
    // Ck = 7 600 W (the regulation's figure, from memory).
    expect(s.engine.getCellValue({ sheet: transformers, row, col: pk })).toBe(7.6);
    s.insertRows(transformers, 1, 2);
    expect(mark()?.row).toBe(row + 2);
    s.sortRows(transformers, col('Tag'), true);
    const at = s.sheetContents(transformers).findIndex((r) => r[col('Tag')] === 'TX-TYP');
    expect(mark()?.row).toBe(at);
    const sheetOf = () => s.toDoc().sheets.find((x) => x.name === 'Transformers')!;
    expect(heldAssumptions(sheetOf()).some((m) => m.col === pk)).toBe(true);
    s.setCells(transformers, [{ row: at, col: pk, content: 8.2 }]);
    expect(heldAssumptions(sheetOf()).some((m) => m.col === pk)).toBe(false);
  });

  it('says why a blank stays blank (no rating, size outside the tables)', async () => {
    const s = await demo();
    const motors = s.engine.getSheetId('Motors') as number;
    const col = columns(s, motors);
    const row = s.sheetContents(motors).length;
    s.setCells(motors, [
      { row, col: col('Tag'), content: 'M-HUGE' },
      { row, col: col('Bus'), content: 'LV-REF' },
      { row, col: col('Rated output (kW)'), content: 5000 },
    ]);
    const r = await s.fillTypicalValues();
    expect(r.notAssumed.join('\n')).toMatch(
      new RegExp(`Motors row ${row + 1} \\(M-HUGE\\): eff: 5000 kW is outside the typical-value tables`),
    );
  });
});

describe('filling a line with blank inductance and capacitance', () => {
  it('takes 1.1 mH/km and 10.5 nF/km at 11 kV, marked assumed, and the sheet counts their I²X', async () => {
    const s = await demo();
    const lines = s.engine.getSheetId('Lines') as number;
    const loads = s.engine.getSheetId('Loads') as number;
    const lc = columns(s, lines);
    const dc = columns(s, loads);
    const row = s.sheetContents(lines).length;
    s.setCells(lines, [
      { row, col: lc('Tag'), content: 'L-TYP' },
      { row, col: lc('Bus'), content: 'MV-11' },
      { row, col: lc('Feeds bus'), content: 'FAR' },
      { row, col: lc('U (kV)'), content: 11 },
      { row, col: lc('Length (km)'), content: 3 },
    ]);
    const drow = s.sheetContents(loads).length;
    s.setCells(loads, [
      { row: drow, col: dc('Tag'), content: 'FAR-LOAD' },
      { row: drow, col: dc('Bus'), content: 'FAR' },
      { row: drow, col: dc('P (kW)'), content: 1600 },
      { row: drow, col: dc('cos φ'), content: 0.8 },
      { row: drow, col: dc('Load (default)'), content: 1 },
    ]);
    await s.fillTypicalValues();
    const value = (c: string) => s.engine.getCellValue({ sheet: lines, row, col: lc(c) });
    // Typical single-circuit MV line (common practice, from memory; see lineTypical.test.ts).
    expect(value('L (mH/km)')).toBe(1.1);
    expect(value('C (nF/km)')).toBe(10.5);
    const marks = (s.meta(lines).marks ?? []).filter((m) => m.row === row);
    expect(marks.map((m) => [m.col, m.kind])).toEqual([
      [lc('L (mH/km)'), 'assumed'],
      [lc('C (nF/km)'), 'assumed'],
    ]);
    // By hand: 2000 kVA at 11 kV is 105.0 A; X = 2π·50 Hz·1.1 mH/km = 0.3456 Ω/km;
    // 3·I²·X·3 km = 34.3 kvar. Charging ω·C·U²·len = 314.16 · 10.5e-9 · 11 000² · 3 = 1.2 kvar.
    const amps = 2000 / (Math.sqrt(3) * 11);
    const i2x = (3 * amps ** 2 * (2 * Math.PI * 50 * 1.1e-3) * 3) / 1000;
    expect(i2x).toBeCloseTo(34.3, 1);
    expect(value('Q absorbed summer-day (kvar)') as number).toBeCloseTo(i2x, 6);
    const charging = (2 * Math.PI * 50 * 10.5e-9 * 11_000 ** 2 * 3) / 1000;
    expect(Math.abs(value('Q delivered (kvar)') as number)).toBeCloseTo(charging, 6);
  });
});
