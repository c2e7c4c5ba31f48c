// `kvar-ledger export`: the full workbook from a template or a list, and clear refusals.
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../../src/cli/main.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { importKvarXlsx } from '../../../src/io/xlsx/importKvar.ts';

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'kvar-export-'));
});

async function cli(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await main(['export', ...argv], { out: (s) => (out += s), err: (s) => (err += s) });
  return { code, out, err };
}

describe('kvar-ledger export', () => {
  it('writes the portable workbook of a template, which imports back exactly', async () => {
    const out = join(dir, 'cold.xlsx');
    const r = await cli('templates/cold-store.json', out);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(
      /^wrote .*cold\.xlsx: 15 sheets, \d+ live formulas, \d+ catalogue functions written out\n$/,
    );
    const back = await importKvarXlsx(new Uint8Array(readFileSync(out)));
    const { site } = readSiteFile(readFileSync('templates/cold-store.json', 'utf8'));
    expect(back.ok && back.doc).toEqual(buildWorkbook(site, { flavour: 'portable' }));
    // The cover names the site, its cases and the requirement.
    const { default: ExcelJS } = await import('exceljs');
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(readFileSync(out) as unknown as ArrayBuffer);
    const cover = wb.getWorksheet('Cover')!.getSheetValues().flat().join('\n');
    for (const s of [site.settings.name, site.settings.cases.join(', '), 'cos φ at least 0.95', '50 Hz'])
      expect(cover).toContain(s);
  });

  it("writes a saved workbook whole: the user's rates, tariff and own sheets", async () => {
    // A workbook as the page saves it, with a rate and a tariff price typed over the demo values
    // and a sheet of the user's own. Rebuilt from its site, the export would carry the demo ones.
    const { site } = readSiteFile(readFileSync('templates/cold-store.json', 'utf8'));
    const doc = buildWorkbook(site, { flavour: 'live' });
    const sheet = (name: string) => {
      const s = doc.sheets.find((x) => x.name === name);
      if (!s) throw new Error(`no ${name} sheet`);
      return s;
    };
    const rates = sheet('Rates').cells as (string | number | null)[][];
    const rateCol = (rates[0] ?? []).indexOf('Rate');
    const priced = rates.findIndex((r, i) => i > 0 && typeof r[rateCol] === 'number');
    expect(rateCol).toBeGreaterThan(0);
    expect(priced).toBeGreaterThan(0);
    (rates[priced] as (string | number | null)[])[rateCol] = 777;
    const tariff = sheet('Tariff').cells as (string | number | null)[][];
    const valueCol = (tariff[0] ?? []).indexOf('Value');
    const price = tariff.findIndex((r, i) => i > 0 && typeof r[valueCol] === 'number');
    (tariff[price] as (string | number | null)[])[valueCol] = 0.123;
    const own = { name: 'Site visit', cells: [['Visit on 3 March'], ['Cable trays full on level 2']] };
    const saved = { ...doc, sheets: [...doc.sheets, own] };
    const file = join(dir, 'saved.kvar.json');
    writeFileSync(file, JSON.stringify(saved));
    const out = join(dir, 'saved.xlsx');
    const r = await cli(file, out);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const back = await importKvarXlsx(new Uint8Array(readFileSync(out)));
    if (!back.ok) throw new Error('the export did not import back');
    const cellOf = (name: string, row: number, col: number) =>
      back.doc.sheets.find((x) => x.name === name)?.cells[row]?.[col];
    expect(cellOf('Rates', priced, rateCol)).toBe(777);
    expect(cellOf('Tariff', price, valueCol)).toBe(0.123);
    expect(back.doc.sheets.find((x) => x.name === 'Site visit')?.cells).toEqual(own.cells);
  });

  it('writes the workbook of a CSV list', async () => {
    const list = join(dir, 'list.csv');
    writeFileSync(
      list,
      'tag,bus,kind,p_kw,eff,cos_phi,u_kv\nM1,LV,motor,75,0.95,0.86,0.4\nL1,LV,load,40,,0.9,0.4\n',
    );
    const r = await cli(list, join(dir, 'list.xlsx'));
    expect(r.code).toBe(0);
    expect(existsSync(join(dir, 'list.xlsx'))).toBe(true);
  });

  it('refuses a list with bad rows, naming row and column, and writes nothing', async () => {
    const list = join(dir, 'bad.csv');
    writeFileSync(list, 'tag,bus,kind,p_kw,cos_phi\nL1,LV,load,75,1.3\nX1,LV,widget,5,0.9\n');
    const target = join(dir, 'bad.xlsx');
    const r = await cli(list, target);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/nothing was written/);
    expect(r.err).toMatch(/bad\.csv: row 2, column E \(cos_phi\)/);
    expect(r.err).toMatch(/bad\.csv: row 3, column C \(kind\): .*widget/);
    expect(existsSync(target)).toBe(false);
  });

  it('says what and where for unreadable input and wrong arguments', async () => {
    const fake = join(dir, 'fake.xlsx');
    writeFileSync(fake, 'not a workbook at all');
    expect((await cli(fake, join(dir, 'o.xlsx'))).err).toMatch(
      /fake\.xlsx.*text, not an xlsx workbook|text, not an xlsx workbook.*fake\.xlsx/,
    );
    expect((await cli(join(dir, 'missing.csv'), join(dir, 'o.xlsx'))).err).toMatch(
      /cannot read .*missing\.csv: no such file/,
    );
    expect((await cli('templates/cold-store.json', join(dir, 'o.csv'))).err).toMatch(
      /must end in \.xlsx; got ".*o\.csv" \(argument 2\)/,
    );
    const one = await cli('templates/cold-store.json');
    expect(one.code).toBe(2);
    expect(one.err).toMatch(/give an input file and an output \.xlsx; got 1 argument/);
    expect((await cli('--bogus')).err).toMatch(/unknown option --bogus/);
  });

  it('is listed by the command line and has help', async () => {
    const r = await cli('--help');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^usage: kvar-ledger export/);
  });
});
