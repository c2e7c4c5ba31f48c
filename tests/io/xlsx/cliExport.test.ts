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
