// Opening bad files: each gets a clear message, nothing throws, and the open workbook (a frozen
// document here) is never touched. Hostile files are made in the test itself.
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { readEquipmentFile } from '../../../src/io/import/table.ts';
import { describeProblem, exportWorkbookXlsx, importKvarXlsx } from '../../../src/io/xlsx/index.ts';
import { sampleDoc } from './docFixtures.ts';
import { encryptedContainer, makeZip, millionRowXlsx, xlsxShell } from './zipFixtures.ts';

function deepFreeze<T>(x: T): T {
  if (x && typeof x === 'object') {
    Object.values(x).forEach(deepFreeze);
    Object.freeze(x);
  }
  return x;
}

async function xlsxOf(build: (wb: ExcelJS.Workbook) => void): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  build(wb);
  return new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer);
}

async function refusal(bytes: Uint8Array) {
  const r = await importKvarXlsx(bytes);
  if (r.ok) throw new Error('expected a refusal');
  return r;
}

describe('importKvarXlsx refuses bad files with a clear message', () => {
  const open: WorkbookDoc = deepFreeze(sampleDoc());
  const before = JSON.stringify(open);

  it.each([
    ['empty', () => new Uint8Array(), 'empty', /empty \(0 bytes\)/],
    ['not a zip', () => new TextEncoder().encode('Tag,Bus\nM1,LV\n'), 'not-zip', /not an xlsx workbook/],
    ['password-protected', () => encryptedContainer(), 'encrypted', /password-protected/],
    ['a million rows', () => millionRowXlsx(), 'too-many-rows', /more than 51,000 rows/],
    [
      'a zip bomb',
      () => xlsxShell('<worksheet>' + ' '.repeat(40 * 1024 * 1024) + '</worksheet>'),
      'zip-bomb',
      /inflates \d+×/,
    ],
    [
      'not a workbook inside',
      () => makeZip([{ name: 'mimetype', data: 'x' }]),
      'wrong-layout',
      /not an xlsx workbook/,
    ],
  ] as const)('%s', async (_, make, code, message) => {
    const r = await refusal(make());
    expect(r.problem.code).toBe(code);
    expect(describeProblem(r.problem)).toMatch(message);
    expect(JSON.stringify(open)).toBe(before);
  });

  it('a truncated export', async () => {
    const whole = await exportWorkbookXlsx(open);
    for (const cut of [whole.length - 10, Math.floor(whole.length / 2), 100]) {
      const r = await refusal(whole.subarray(0, cut));
      expect(r.problem.code).toBe('truncated');
    }
  });

  it('unknown functions, naming the cell and the function', async () => {
    const bytes = await xlsxOf((wb) => {
      const ws = wb.addWorksheet('Loads');
      ws.getCell('A1').value = 5;
      ws.getCell('B2').value = { formula: 'A1*FROBNICATE(2)', result: 10 } as ExcelJS.CellFormulaValue;
      ws.getCell('B3').value = { formula: '_xlfn.IFNA(A1,0)', result: 5 } as ExcelJS.CellFormulaValue;
    });
    const r = await refusal(bytes);
    expect(r.problem).toEqual({
      code: 'unknown-function',
      message: 'the formula =A1*FROBNICATE(2) uses the function FROBNICATE, which Kvar Ledger does not know',
      where: 'Loads!B2',
    });
    expect(r.problems).toHaveLength(1);
    const accepted = await importKvarXlsx(bytes, { acceptFormulaProblems: true });
    expect(accepted.ok && accepted.doc.sheets[0]?.cells).toEqual([
      [5],
      [null, '=A1*FROBNICATE(2)'],
      [null, '=IFNA(A1,0)'],
    ]);
    expect(accepted.ok && accepted.problems).toHaveLength(1);
  });

  it('circular references, naming every cell in the loop', async () => {
    const bytes = await xlsxOf((wb) => {
      const ws = wb.addWorksheet('Buses');
      ws.getCell('A1').value = { formula: 'B1+1', result: 0 } as ExcelJS.CellFormulaValue;
      ws.getCell('B1').value = { formula: 'A1*2', result: 0 } as ExcelJS.CellFormulaValue;
      ws.getCell('C1').value = { formula: 'SUM(1,2)', result: 3 } as ExcelJS.CellFormulaValue;
    });
    const r = await refusal(bytes);
    expect(r.problems.map((p) => [p.code, p.where])).toEqual([
      ['circular-reference', 'Buses!A1'],
      ['circular-reference', 'Buses!B1'],
    ]);
    expect(r.problem.message).toBe('the formula =B1+1 refers to itself through a loop of references');
  });

  it('a workbook with nothing in it', async () => {
    const r = await refusal(await xlsxOf((wb) => void wb.addWorksheet('Empty')));
    expect(r.problem).toMatchObject({
      code: 'wrong-layout',
      message: 'the workbook holds no data (every sheet is empty)',
    });
  });

  it('reads another program’s plain workbook (values, text, dates, shared formulas)', async () => {
    const bytes = await xlsxOf((wb) => {
      const ws = wb.addWorksheet('Data');
      ws.addRow(['tag', 'p', 'when', 'note']);
      ws.addRow([
        'M1',
        10,
        new Date(Date.UTC(2024, 0, 2)),
        { richText: [{ text: 'rich ' }, { text: 'text' }] },
      ]);
      ws.addRow(['M2', 20, null, '=not a formula']);
      ws.getCell('E2').value = { formula: 'B2*2', result: 20 } as ExcelJS.CellFormulaValue;
      ws.getCell('E3').value = { sharedFormula: 'E2', result: 40 } as ExcelJS.CellSharedFormulaValue;
      ws.getCell('E2').value = {
        formula: 'B2*2',
        result: 20,
        shareType: 'shared',
        ref: 'E2:E3',
      } as ExcelJS.CellFormulaValue;
    });
    const r = await importKvarXlsx(bytes);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.restored).toBe('plain');
    expect(r.doc.sheets[0]?.cells).toEqual([
      ['tag', 'p', 'when', 'note'],
      ['M1', 10, 45293, 'rich text', '=B2*2'],
      ['M2', 20, null, "'=not a formula", '=B3*2'],
    ]);
  });
});

describe('readEquipmentFile refuses bad lists with a clear message', () => {
  it.each([
    ['list.xlsx', 'not-zip', () => new TextEncoder().encode('tag,bus\n')],
    ['list.xlsx', 'encrypted', () => encryptedContainer()],
    ['list.xlsx', 'too-many-rows', () => millionRowXlsx()],
    ['list.csv', 'empty', () => new Uint8Array()],
    [
      'list.csv',
      'too-many-rows',
      () => new TextEncoder().encode('tag,bus,kind\n' + 'M,B,motor\n'.repeat(1_000_000)),
    ],
    ['list.csv', 'corrupt', () => new TextEncoder().encode('tag,bus\n"M1,LV\n')],
  ] as const)('%s: %s', async (name, code, make) => {
    const r = await readEquipmentFile(name, make());
    if (r.ok) return expect.fail(`${name} was read; expected the refusal ${code}`);
    expect(r.problem.code).toBe(code);
    expect(describeProblem(r.problem)).toContain(name);
  });

  it('reads the first visible sheet of an xlsx with percent cells as percent', async () => {
    const bytes = await xlsxOf((wb) => {
      wb.addWorksheet('Hidden notes', { state: 'hidden' }).addRow(['not this one']);
      const ws = wb.addWorksheet('Equipment');
      ws.addRow(['Tag', 'Board', 'Type', 'Eff']);
      ws.addRow(['M1', 'LV', 'motor', 0.95]);
      ws.getCell('D2').numFmt = '0%';
      ws.addRow(['M2', 'LV', 'motor', { formula: '0.9+0.01', result: 0.91 }]);
    });
    const r = await readEquipmentFile('list.xlsx', bytes);
    expect(r.ok && r.value).toMatchObject({
      kind: 'xlsx',
      sheet: 'Equipment',
      rows: [
        ['Tag', 'Board', 'Type', 'Eff'],
        ['M1', 'LV', 'motor', '95%'],
        ['M2', 'LV', 'motor', 0.91],
      ],
    });
  });

  it('decodes a Windows code page CSV and detects the semicolon and decimal comma', async () => {
    const bytes = new Uint8Array([
      ...new TextEncoder().encode('tag;bus;kind;cos phi\nM1;LV;motor;0,86\nK'),
      0xfc,
      ...new TextEncoder().encode('hl;LV;load;0,9\n'),
    ]);
    const r = await readEquipmentFile('liste.csv', bytes);
    expect(r.ok && r.value).toMatchObject({
      decimalComma: true,
      rows: [
        ['tag', 'bus', 'kind', 'cos phi'],
        ['M1', 'LV', 'motor', '0,86'],
        ['Kühl', 'LV', 'load', '0,9'],
      ],
    });
  });
});
