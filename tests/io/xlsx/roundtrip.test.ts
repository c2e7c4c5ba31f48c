// Export → import of our own file gives back the document exactly; other programs see only plain
// formulas with our cached results. "Other program" here is the xlsx library read directly plus
// the formula engine WITHOUT our catalogue (any leaked catalogue name would be #NAME?).
import { inflateRawSync } from 'node:zlib';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { CATALOGUE } from '../../../src/core/functions/index.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { createEngine, createPlainEngine, readCell } from '../../../src/engine/index.ts';
import {
  exportWorkbookXlsx,
  describeProblem,
  exportWorkbookXlsxWithReport,
  importKvarXlsx,
  XlsxExportError,
} from '../../../src/io/xlsx/index.ts';
import { fileError } from '../../../src/io/xlsx/exportCells.ts';
import { DEFAULT_XLSX_LIMITS } from '../../../src/io/xlsx/limits.ts';
import { META_SHEET_NAME } from '../../../src/io/xlsx/metadata.ts';
import { entryDataOffset, readZipDirectory } from '../../../src/io/xlsx/zipDirectory.ts';
import { sampleDoc } from './docFixtures.ts';

const DATE = new Date('2026-03-04T10:00:00Z');

async function load(bytes: Uint8Array): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  return wb;
}

async function save(wb: ExcelJS.Workbook): Promise<Uint8Array> {
  return new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer);
}

function entryText(bytes: Uint8Array, name: string): string {
  const dir = readZipDirectory(bytes, DEFAULT_XLSX_LIMITS);
  if (!dir.ok) throw new Error(dir.problem.message);
  const e = dir.value.find((x) => x.name === name)!;
  const start = entryDataOffset(bytes, e)!;
  const data = bytes.subarray(start, start + e.compressedSize);
  return (e.method === 0 ? Buffer.from(data) : inflateRawSync(data)).toString('utf8');
}

async function restored(bytes: Uint8Array): Promise<WorkbookDoc> {
  const r = await importKvarXlsx(bytes);
  if (!r.ok) throw new Error(r.problem.message);
  return r.doc;
}

describe('round trip of our own export', () => {
  it('gives back the original document exactly', async () => {
    const doc = sampleDoc();
    const r = await importKvarXlsx(await exportWorkbookXlsx(doc, { date: DATE }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.restored).toBe('restored');
    expect(r.notes).toEqual([]);
    expect(r.doc).toEqual(doc);
  });

  it('restores untouched rows and reads rows changed in another program as plain formulas', async () => {
    const wb = await load(await exportWorkbookXlsx(sampleDoc(), { date: DATE }));
    wb.getWorksheet('Motors')!.getCell('B3').value = 160;
    const r = await importKvarXlsx(await save(wb));
    expect(r.ok && r.restored).toBe('partly');
    if (!r.ok) return;
    const motors = r.doc.sheets[0]!;
    expect(motors.cells[1]).toEqual(sampleDoc().sheets[0]!.cells[1]);
    expect(motors.cells[2]?.[1]).toBe(160);
    expect(String(motors.cells[2]?.[5])).toMatch(
      /^=IF\(OR\(B3<>B3,.*OR\(ISLOGICAL\(B3\),ISTEXT\(B3\),ISBLANK\(B3\)\)/,
    );
    expect(r.notes.join(' ')).toContain('sheet "Motors": row(s) 3 were changed in another program');
    // The plain formula computes what the catalogue formula computes.
    const hf = createEngine(r.doc.sheets);
    const expected = createEngine([{ name: 'x', cells: [['=KVAR.MOTOR(160,0.962,0.88)']] }]);
    expect(readCell(hf, 'Motors', 2, 6)).toEqual(readCell(expected, 'x', 0, 0));
  });

  it('survives another program quoting sheet names, changing case and spacing of formulas', async () => {
    const wb = await load(await exportWorkbookXlsx(sampleDoc(), { date: DATE }));
    const cell = wb.getWorksheet('Point of connection')!.getCell('B3');
    const f = (cell.value as { formula: string; result: number }).formula;
    cell.value = {
      formula: f.toLowerCase().replace(/,/g, ', '),
      result: (cell.value as { result: number }).result,
    } as ExcelJS.CellFormulaValue;
    expect(await restored(await save(wb))).toEqual(sampleDoc());
  });

  it('falls back to plain formulas when the metadata is gone or damaged', async () => {
    const bytes = await exportWorkbookXlsx(sampleDoc(), { date: DATE });
    const gone = await load(bytes);
    gone.removeWorksheet(gone.getWorksheet(META_SHEET_NAME)!.id);
    const damaged = await load(bytes);
    damaged.getWorksheet(META_SHEET_NAME)!.getCell('A2').value = '{"format":"kvar-ledger-xlsx-meta",';
    // Without the metadata sheet the file reads as another program's, with nothing to note.
    for (const [wb, notes] of [
      [gone, /^$/],
      [damaged, /damaged/],
    ] as const) {
      const r = await importKvarXlsx(await save(wb));
      if (!r.ok) return expect.fail(`the workbook was refused: ${describeProblem(r.problem)}`);
      expect(r.restored).toBe('plain');
      expect(r.notes.join(' ')).toMatch(notes);
      expect(r.doc.sheets.map((s) => s.name)).toEqual(['Motors', 'Point of connection', 'Functions used']);
      // Same values as the original, computed from the plain formulas.
      const a = createEngine(sampleDoc().sheets);
      const b = createEngine(r.doc.sheets.slice(0, 2));
      for (const [sheet, row, col] of [
        ['Motors', 1, 6],
        ['Motors', 6, 5],
        ['Point of connection', 2, 1],
        ['Point of connection', 5, 1],
      ] as const) {
        const x = readCell(a, sheet, row, col);
        const y = readCell(b, sheet, row, col);
        if (!x.ok || !y.ok) return expect.fail(`${sheet} ${row},${col}: ${JSON.stringify([x, y])}`);
        expect([typeof x.value, typeof y.value]).toEqual(['number', 'number']);
        expect(y.value as number).toBeCloseTo(x.value as number, 9);
      }
    }
  });
});

describe('what other programs see', () => {
  it('plain classic formulas with the app’s results cached, evaluating alike without our catalogue', async () => {
    const doc = sampleDoc();
    const wb = await load(await exportWorkbookXlsx(doc, { date: DATE }));
    const app = createEngine(doc.sheets);
    const names = CATALOGUE.map((s) => s.name);
    const plainSheets: Array<{ name: string; cells: (string | number | boolean | null)[][] }> = [];
    let formulas = 0;
    for (const s of doc.sheets) {
      const ws = wb.getWorksheet(s.name)!;
      const cells: (string | number | boolean | null)[][] = [];
      s.cells.forEach((row, r) => {
        cells.push(
          row.map((_, c) => {
            const cell = ws.getCell(r + 1, c + 1);
            if (cell.formula) {
              formulas++;
              for (const n of names)
                expect(cell.formula.toUpperCase()).not.toMatch(
                  new RegExp(`(^|[^A-Z.])${n.replace(/\./g, '\\.')}\\(`),
                );
              const cached = readCell(app, s.name, r, c);
              const result = cell.result as unknown;
              if (cached.ok) expect(result).toBe(cached.value);
              else expect(result).toEqual({ error: cached.error });
              return '=' + cell.formula.replace(/_xlfn\./g, '');
            }
            const v = cell.value as string | number | boolean | null | { error: string };
            return v !== null && typeof v === 'object' ? v.error : v;
          }),
        );
      });
      plainSheets.push({ name: s.name, cells });
    }
    expect(formulas).toBe(17);
    const plain = createPlainEngine(plainSheets);
    let [numbers, errors] = [0, 0];
    doc.sheets.forEach((s) =>
      s.cells.forEach((row, r) =>
        row.forEach((content, c) => {
          if (typeof content !== 'string' || !content.startsWith('=')) return;
          const x = readCell(app, s.name, r, c);
          const y = readCell(plain, s.name, r, c);
          expect({ at: `${s.name}!${r},${c}`, ok: y.ok }).toEqual({ at: `${s.name}!${r},${c}`, ok: x.ok });
          if (!x.ok || !y.ok) {
            errors++;
            return expect(y.ok ? y.value : y.error).toBe(x.ok ? x.value : fileError(x.error));
          }
          if (typeof x.value !== 'number') return expect(y.value).toBe(x.value);
          numbers++;
          expect(Math.abs((y.value as number) - x.value)).toBeLessThanOrEqual(
            1e-12 * Math.max(1, Math.abs(x.value)),
          );
        }),
      ),
    );
    // Both kinds of cell are met: numbers, and the sample's deliberate error cells.
    expect(numbers).toBeGreaterThan(5);
    expect(errors).toBeGreaterThan(0);
  });

  it('writes the value of a formula it cannot read, and says where', async () => {
    const r = await exportWorkbookXlsxWithReport(sampleDoc(), { date: DATE });
    expect(r.issues).toHaveLength(1);
    expect(r.issues[0]?.where).toBe('Motors!H3');
    expect(r.issues[0]?.message).toMatch(
      /cannot be written for other programs .*its value is written instead/,
    );
    expect((await load(r.bytes)).getWorksheet('Motors')!.getCell('H3').value).toEqual({ error: '#VALUE!' });
  });

  it('asks for recalculation on load and prefixes functions newer than 2007', async () => {
    const bytes = await exportWorkbookXlsx(sampleDoc(), { date: DATE });
    expect(entryText(bytes, 'xl/workbook.xml')).toContain('fullCalcOnLoad="1"');
    expect(entryText(bytes, 'xl/workbook.xml')).toMatch(/name="_kvar_ledger" state="veryHidden"/);
    const sheetXml = entryText(bytes, 'xl/worksheets/sheet2.xml');
    expect(sheetXml).toContain('<f>_xlfn.IFNA(G4,0)</f>');
    expect(sheetXml).not.toMatch(/KVAR\.|KW\.MOTOR/);
  });

  it('styles header rows, number formats, widths and frozen panes', async () => {
    const wb = await load(await exportWorkbookXlsx(sampleDoc(), { date: DATE }));
    const ws = wb.getWorksheet('Motors')!;
    expect(ws.getCell('A1').font?.bold).toBe(true);
    expect(ws.getCell('G1').fill).toMatchObject({ type: 'pattern', pattern: 'solid' });
    expect(ws.getCell('G1').fill).not.toEqual(ws.getCell('B1').fill);
    expect(ws.getCell('B2').numFmt).toBe('0.0');
    expect(ws.getCell('G3').numFmt).toBe('0.00');
    expect(ws.getColumn(1).width).toBe(10);
    expect(ws.getColumn(2).width).toBe(12);
    expect(ws.views[0]).toMatchObject({ state: 'frozen', ySplit: 1 });
  });

  it('has a cover with site, date, cautions, licence and notes, and a functions sheet with sources', async () => {
    const wb = await load(
      await exportWorkbookXlsx(sampleDoc(), {
        date: DATE,
        settings: {
          name: 'Invented test works',
          hz: 60,
          cases: ['day', 'night'],
          requirement: { kind: 'cosphi', target: 0.95 },
        },
      }),
    );
    expect(wb.worksheets[0]!.name).toBe('Cover');
    const cover = wb.worksheets[0]!.getSheetValues()
      .flat()
      .filter((v) => typeof v === 'string')
      .join('\n');
    for (const s of [
      'Invented test works',
      '2026-03-04',
      '60 Hz',
      'day, night',
      'cos φ at least 0.95',
      'hurt people',
      'licensed engineer',
      'local codes',
      'utility',
      'GPL-3.0',
      'IFNA',
    ])
      expect(cover).toContain(s);
    const fn = wb.getWorksheet('Functions used')!;
    const rows = fn
      .getSheetValues()
      .slice(2)
      .map((r) => (r as unknown[]).slice(1) as string[]);
    expect(rows.map((r) => r[0]!.split('(')[0])).toEqual([
      'COSPHI',
      'TANPHI',
      'KVAR.LOAD',
      'KW.MOTOR',
      'KVAR.MOTOR',
      'KVAR.TOPF',
      'BANK.ROUNDUP',
    ]);
    for (const r of rows) {
      expect(r[4]).toMatch(/^=/);
      expect(r[5]!.length).toBeGreaterThan(5);
      expect(['published', 'common practice', 'from memory']).toContain(r[6]);
    }
  });
});

describe('text cells written by another program', () => {
  it('come in as text, even when they look like a formula, a number, a date or TRUE', async () => {
    const texts = ['=1+1', '007', 'TRUE', '1/2/2020', '12:30', '#N/A', '+A1', 'Pump 1'];
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet('Typed').addRow(texts);
    const r = await importKvarXlsx(await save(wb));
    if (!r.ok) throw new Error(r.problem.message);
    const hf = createEngine(r.doc.sheets);
    expect(texts.map((_, col) => readCell(hf, 'Typed', 0, col))).toEqual(
      texts.map((value) => ({ ok: true, value })),
    );
    expect(r.doc.sheets[0]?.cells[0]?.slice(-1)).toEqual(['Pump 1']);
  });
});

describe('export refusals', () => {
  it('refuses sheet names xlsx cannot hold, saying which and why', async () => {
    const doc = sampleDoc();
    const bad: WorkbookDoc = { ...doc, sheets: [{ ...doc.sheets[0]!, name: 'Motors/Pumps' }] };
    await expect(exportWorkbookXlsx(bad)).rejects.toThrow(/sheet name "Motors\/Pumps" contains "\/"/);
    const long: WorkbookDoc = { ...doc, sheets: [{ ...doc.sheets[0]!, name: 'x'.repeat(32) }] };
    await expect(exportWorkbookXlsx(long)).rejects.toBeInstanceOf(XlsxExportError);
  });

  it('writes a value (and says so) instead of a function other programs lack; strict mode refuses', async () => {
    const doc: WorkbookDoc = {
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 't',
      sheets: [
        {
          name: 'S',
          cells: [
            ['a', 'b'],
            ['=COUNTUNIQUE(A1:B1)', '=KVA.TOTAL(3,4)'],
          ],
        },
      ],
    };
    const r = await exportWorkbookXlsxWithReport(doc);
    expect(r.issues).toEqual([
      {
        where: 'S!A2',
        message:
          'the formula uses COUNTUNIQUE, which other spreadsheet programs do not have; its value is written instead',
      },
    ]);
    const ws = (await load(r.bytes)).getWorksheet('S')!;
    expect(ws.getCell('A2').value).toBe(2);
    expect(ws.getCell('B2').formula).toMatch(/^SQRT\(POWER\(3,2\)\+POWER\(4,2\)\)$/);
    await expect(exportWorkbookXlsx(doc, { strict: true })).rejects.toThrow(
      /S!A2: the formula uses COUNTUNIQUE/,
    );
  });
});

describe('cover of a builder workbook without settings given', () => {
  it('reads the settings from the workbook itself', async () => {
    const { readSiteFile } = await import('../../../src/core/site/siteFile.ts');
    const { buildWorkbook } = await import('../../../src/core/workbook/build.ts');
    const { readFileSync } = await import('node:fs');
    const { site } = readSiteFile(readFileSync('templates/solar-collector.json', 'utf8'));
    const wb = await load(await exportWorkbookXlsx(buildWorkbook(site, { flavour: 'live' }), { date: DATE }));
    const cover = wb.worksheets[0]!.getSheetValues().flat().join('\n');
    expect(cover).toContain(site.settings.name);
    expect(cover).toContain(`Operating cases`);
    expect(cover).toContain(site.settings.cases.join(', '));
  });
});

describe('sheet names the export also uses', () => {
  it('keep their own sheets; the added ones step aside and are dropped again on import', async () => {
    const doc: WorkbookDoc = {
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 't',
      sheets: [
        { name: 'Cover', cells: [['mine', 1]] },
        { name: 'functions USED', cells: [['=KVA.TOTAL(3,4)']] },
      ],
    };
    const bytes = await exportWorkbookXlsx(doc, { date: DATE });
    expect((await load(bytes)).worksheets.map((w) => w.name)).toEqual([
      'Cover (2)',
      'Cover',
      'functions USED',
      'Functions used (2)',
      META_SHEET_NAME,
    ]);
    expect(await restored(bytes)).toEqual(doc);
  });
});

describe('where cached results come from', () => {
  const doc: WorkbookDoc = {
    format: 'kvar-ledger-workbook',
    version: 1,
    title: 't',
    sheets: [{ name: 'S', cells: [[3, 4, '=KVA.TOTAL(A1,B1)']] }],
  };
  const cached = async (bytes: Uint8Array) => (await load(bytes)).getWorksheet('S')!.getCell('C1').result;

  it('by default from an engine over the document', async () => {
    expect(await cached(await exportWorkbookXlsx(doc))).toBe(5);
  });

  it('from the caller’s engine when given (no engine is built)', async () => {
    const r = await exportWorkbookXlsx(doc, {
      valueAt: (s, row, col) => (s === 'S' && row === 0 && col === 2 ? { ok: true, value: 5.5 } : undefined),
    });
    expect(await cached(r)).toBe(5.5);
  });

  it('from an aligned faster document, but never from one whose typed values differ', async () => {
    const twin: WorkbookDoc = { ...doc, sheets: [{ name: 'S', cells: [[3, 4, '=SQRT(A1^2+B1^2)+0.25']] }] };
    expect(await cached(await exportWorkbookXlsx(doc, { valuesFrom: twin }))).toBe(5.25);
    const other: WorkbookDoc = { ...doc, sheets: [{ name: 'S', cells: [[6, 8, '=SQRT(A1^2+B1^2)']] }] };
    expect(await cached(await exportWorkbookXlsx(doc, { valuesFrom: other }))).toBe(5);
  });
});
