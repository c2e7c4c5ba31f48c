// Limits that agree: the size every door accepts (src/core/site/limits.ts) is a size every path
// can carry. Before, the engine refused sheets above 40,000 rows ("Sheet size limit exceeded"),
// so the export crashed on a list the import had accepted (it took 200,000 rows).
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { MAX_EQUIPMENT_ROWS, MAX_SHEET_COLUMNS, MAX_SHEET_ROWS } from '../../../src/core/site/limits.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { createEngine, readCell } from '../../../src/engine/index.ts';
import { readEquipmentFile } from '../../../src/io/import/table.ts';
import { exportWorkbookXlsx } from '../../../src/io/xlsx/export.ts';
import { importKvarXlsx } from '../../../src/io/xlsx/importKvar.ts';
import { workbookProblems } from '../../../src/ui/model/docValidate.ts';

const longSheet = (rows: number) => [
  ['tag', 'p_kw'],
  ...Array.from({ length: rows - 2 }, (_, i) => [`M${i}`, i]),
  ['total', `=SUM(B2:B${rows - 1})`],
];
const sum = (n: number) => (n * (n - 1)) / 2;

describe('the engine takes every sheet the doors let in', () => {
  it(`a sheet of ${MAX_SHEET_ROWS.toLocaleString('en')} rows builds and computes`, () => {
    const hf = createEngine([{ name: 'Motors', cells: longSheet(MAX_SHEET_ROWS) }]);
    expect(readCell(hf, 'Motors', MAX_SHEET_ROWS - 1, 1)).toEqual({
      ok: true,
      value: sum(MAX_SHEET_ROWS - 2),
    });
    hf.destroy();
  });
  it('the engine and the workbook check agree on the largest sheet', () => {
    const doc = (rows: number): WorkbookDoc => ({
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 't',
      sheets: [{ name: 'Notes', cells: longSheet(rows) }],
    });
    expect(workbookProblems(doc(MAX_SHEET_ROWS))).toEqual([]);
    expect(workbookProblems(doc(MAX_SHEET_ROWS + 1))).toEqual([
      `Sheet "Notes": ${MAX_SHEET_ROWS + 1} rows; at most ${MAX_SHEET_ROWS} are allowed.`,
    ]);
    expect(() =>
      createEngine([{ name: 'Wide', cells: [Array.from({ length: MAX_SHEET_COLUMNS }, () => 1)] }]),
    ).not.toThrow();
  });
});

describe('45,000 rows of one kind: the export carries them, and opening counts every kind', () => {
  it('writes the sheet; a workbook of 50,001 equipment rows in all is refused where it is opened', async () => {
    const motors = 45_000;
    const loads = 5_003; // with the header: 45,000 − 1 + 5,003 − 1 = 50,001 equipment rows
    const doc: WorkbookDoc = {
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 'long list',
      sheets: [
        { name: 'Motors', cells: longSheet(motors) },
        { name: 'Loads', cells: longSheet(loads) },
      ],
    };
    const bytes = await exportWorkbookXlsx(doc, { date: new Date('2026-01-01') });
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
    const ws = wb.getWorksheet('Motors');
    expect(ws?.rowCount).toBe(motors);
    expect(ws?.getCell(motors, 2).formula).toBe(`SUM(B2:B${motors - 1})`);
    // The doors: the native file's check and the xlsx import say the same.
    const text =
      'the workbook has 50,001 equipment rows; Kvar Ledger supports at most 50,000 (see README, Limits)';
    expect(workbookProblems(doc)).toEqual([`T${text.slice(1)}.`]);
    const back = await importKvarXlsx(bytes);
    expect(back).toMatchObject({ ok: false, problem: { code: 'too-many-rows', message: text } });
  }, 180_000);
});

describe('the list import refuses more rows than a site may have, at the door', () => {
  const csv = (dataRows: number) =>
    new TextEncoder().encode(
      [
        'tag,bus,kind,p_kw,cos_phi',
        ...Array.from({ length: dataRows }, (_, i) => `L${i},LV,load,1,0.9`),
      ].join('\n'),
    );
  it('one row too many: refused, with the limit', async () => {
    const r = await readEquipmentFile('big.csv', csv(MAX_EQUIPMENT_ROWS + 1));
    expect(r).toEqual({
      ok: false,
      problem: {
        code: 'too-many-rows',
        message: 'the list has 50,001 rows of data; Kvar Ledger supports at most 50,000 (see README, Limits)',
        where: 'big.csv',
      },
    });
  });
  it('exactly the limit, with blank rows around: read', async () => {
    const bytes = csv(MAX_EQUIPMENT_ROWS);
    const withBlanks = new Uint8Array([...bytes, ...new TextEncoder().encode('\n,,,,\n\n')]);
    const r = await readEquipmentFile('full.csv', withBlanks);
    expect(r.ok).toBe(true);
  });
});
