// The document the app hands to the xlsx export: a site workbook goes out in its portable
// flavour (no BUS.SUM, which other programs do not know) and as the user sees it: inputs, notes,
// typed-over values and the user's own sheets; a plain workbook goes out as it is.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { handOff, handOffDoc } from '../../src/ui/app/handOff.ts';
import { importKvarXlsx } from '../../src/io/xlsx/importKvar.ts';
import { toResult } from '../../src/engine/index.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { planBusColumns } from '../../src/core/workbook/busColumns.ts';

const formulas = (doc: WorkbookDoc) =>
  doc.sheets
    .flatMap((s) => s.cells.flat())
    .filter((c): c is string => typeof c === 'string' && c.startsWith('='));
const site = readSiteFile(
  readFileSync(new URL('../../templates/pumping-station.json', import.meta.url), 'utf8'),
).site;
const pageResults = (s: WorkbookSession) => (sheet: string, row: number, col: number) => {
  const id = s.engine.getSheetId(sheet);
  return id === undefined ? undefined : toResult(s.engine.getCellValue({ sheet: id, row, col }));
};

describe('hand-off document', () => {
  it('writes the bus sums as classic sums and keeps the sheets the user added', () => {
    const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    s.addSheet('My notes');
    s.setCells(s.engine.getSheetId('My notes') as number, [{ row: 0, col: 0, content: 'check with client' }]);
    expect(formulas(buildWorkbook(site, { flavour: 'live' })).some((f) => f.includes('BUS.SUM'))).toBe(true);
    const out = handOffDoc(s.toDoc());
    expect(formulas(out.doc).some((f) => f.includes('BUS.SUM'))).toBe(false);
    expect(formulas(out.doc).some((f) => /SUMIFS?\(/.test(f))).toBe(true);
    expect(out.doc.sheets.at(-1)?.name).toBe('My notes');
    expect(out.doc.sheets.at(-1)?.cells).toEqual([['check with client']]);
    expect(out.settings?.name).toBe(site.settings.name);
  });

  it('computes the same bus totals in both flavours', () => {
    const live = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const portable = WorkbookSession.fromDoc(handOffDoc(live.toDoc()).doc);
    const busesOf = (s: WorkbookSession) => s.engine.getSheetValues(s.engine.getSheetId('Buses') as number);
    const [a, b] = [busesOf(live), busesOf(portable)];
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

  it('a bus whose rows are scattered sums each run of its rows, in both flavours', () => {
    const live = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const motors = live.engine.getSheetId('Motors') as number;
    const rows = live.sheetContents(motors);
    const head = (rows[0] ?? []).map(String);
    const col = (h: string) => head.indexOf(h);
    const first = rows[1] ?? [];
    const bus = String(first[col('Bus')]);
    const at = rows.length;
    // Below the list: a motor on the first motor's bus (a second run of its rows), and two on a new
    // bus named like a comparison ('<AUX>', which a conditional sum would misread) with a row between.
    const motor = (tag: string, on: string, kw: number) => {
      const line: (string | number | null)[] = head.map(() => null);
      line[col('Tag')] = tag;
      line[col('Bus')] = on;
      line[col('Rated output (kW)')] = kw;
      line[col('Efficiency')] = 0.9;
      line[col('cos φ')] = 0.82;
      return line;
    };
    live.setBlock(motors, at, 0, [motor('X1', '<AUX>', 15), motor('X2', bus, 30), motor('X3', '<AUX>', 7.5)]);
    const buses = live.engine.getSheetId('Buses') as number;
    const busLine = live.engine
      .getSheetFormulas(buses)
      .find((_, r) => live.engine.getCellValue({ sheet: buses, row: r, col: 0 }) === bus);
    const sum = busLine?.find((f) => f?.startsWith('=BUS.SUM(')) ?? '';
    // Two runs of its Motors rows: the first ones, and the one added below the list.
    expect(sum.match(/Motors!\$[A-Z]+\$\d+(:\$[A-Z]+\$\d+)?[,)]/g)?.length).toBe(2);
    const portable = WorkbookSession.fromDoc(handOffDoc(live.toDoc()).doc);
    const busesOf = (s: WorkbookSession) => s.engine.getSheetValues(s.engine.getSheetId('Buses') as number);
    const [a, b] = [busesOf(live), busesOf(portable)];
    expect(a.some((r) => r[0] === '<AUX>')).toBe(true);
    expect(b.length).toBe(a.length);
    a.forEach((row, r) =>
      row.forEach((v, c) => {
        const w = b[r]?.[c];
        if (typeof v === 'number') expect(w).toBeCloseTo(v, 9);
        else expect(w).toEqual(v);
      }),
    );
    // <AUX>'s own P: the two motors' electrical input, Pout / η (IEC 60034-2-1 definition).
    const aux = a.find((r) => r[0] === '<AUX>') ?? [];
    const pOwn = (a[0] ?? []).findIndex((h) => typeof h === 'string' && h.startsWith('P own items'));
    expect(aux[pOwn]).toBeCloseTo((15 + 7.5) / 0.9, 9);
  });

  it('carries typed values, typed-over cells and notes in built-in sheets, as the page shows them', async () => {
    const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const loads = s.engine.getSheetId('Loads') as number;
    const header = s.sheetContents(loads)[0] as string[];
    const q = header.findIndex((h) => String(h).startsWith('Q '));
    const p = header.findIndex((h) => h === 'P (kW)');
    s.setCells(loads, [{ row: 1, col: p, content: 123.4 }]);
    s.setCells(loads, [{ row: 1, col: q, content: 999 }]);
    const buses = s.engine.getSheetId('Buses') as number;
    s.setCells(buses, [{ row: 30, col: 0, content: 'note: check the 33 kV ratio' }]);
    expect(s.isOverride(loads, 1, q)).toBe(true);
    const doc = s.toDoc();
    const out = handOffDoc(doc);
    const outLoads = out.doc.sheets.find((x) => x.name === 'Loads');
    expect(outLoads?.cells[1]?.[p]).toBe(123.4);
    expect(outLoads?.cells[1]?.[q]).toBe(999);
    expect(outLoads?.overrides).toEqual([[1, q]]);
    expect(out.doc.sheets.find((x) => x.name === 'Buses')?.cells[30]?.[0]).toBe(
      'note: check the 33 kV ratio',
    );
    // The file caches what the page shows at the point of connection.
    const file = await handOff(doc, pageResults(s));
    expect(file.overrides).toBe(1);
    const back = await importKvarXlsx(file.bytes);
    expect(back.ok).toBe(true);
    const cols = planBusColumns(site.settings.cases);
    const pageQ = s.engine.getCellValue({ sheet: buses, row: 1, col: cols.q[0] as number });
    const reopened = WorkbookSession.fromDoc(back.ok ? back.doc : doc);
    const busesAgain = reopened.engine.getSheetId('Buses') as number;
    expect(reopened.engine.getCellValue({ sheet: busesAgain, row: 1, col: cols.q[0] as number })).toBeCloseTo(
      pageQ as number,
      9,
    );
  });

  it('sends a workbook that is not a site as it is', () => {
    const doc: WorkbookDoc = {
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 'Scratch',
      sheets: [{ name: 'Sheet 1', cells: [[1, '=A1*2']] }],
    };
    expect(handOffDoc(doc)).toEqual({ doc });
  });

  it('gives the same file whether the cached values come from the page or from an engine of its own', async () => {
    const live = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const doc = live.toDoc();
    let reads = 0;
    const page = pageResults(live);
    const fast = await handOff(doc, (a, b, c) => {
      reads++;
      return page(a, b, c);
    });
    expect(reads).toBeGreaterThan(100);
    const slow = await handOff(doc);
    const [a, b] = [await importKvarXlsx(fast.bytes), await importKvarXlsx(slow.bytes)];
    expect(a.ok && b.ok).toBe(true);
    if (a.ok && b.ok) expect(a.doc.sheets).toEqual(b.doc.sheets);
    expect(fast.issues).toBe(slow.issues);
  });
});
