// The command line's one loader: the same site, whichever way it arrives. A template is written
// out as every file the loader reads (the app's .kvar.json workbook, our xlsx export, a CSV list
// with interchange headers, a ';'-separated decimal-comma list with the page's header words and
// units, an xlsx list) and each must give back the same equipment and settings, the same bus
// totals, and the same `balance --json` as a process. The reference values are the template's.
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import ExcelJS from 'exceljs';
import { beforeAll, describe, expect, it } from 'vitest';
import { loadSite, siteNameFromFile, type LoadedSite } from '../../src/cli/loadSite.ts';
import { readSiteOptions, type SiteOptions } from '../../src/cli/siteOptions.ts';
import { parseArgs } from '../../src/cli/args.ts';
import { loadFactor } from '../../src/core/site/cases.ts';
import type { EquipmentRow, Site } from '../../src/core/site/model.ts';
import { rollUpAll } from '../../src/core/site/rollup.ts';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import { writeCsv } from '../../src/io/csv/write.ts';
import { exportWorkbookXlsx } from '../../src/io/xlsx/export.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const TEMPLATE = join(ROOT, 'templates/cold-store.json');
const tmp = mkdtempSync(join(tmpdir(), 'kvar-load-'));
const site = readSiteFile(readFileSync(TEMPLATE, 'utf8')).site;
const [first, second] = site.settings.cases as [string, string];
const s = site.settings;

/** Options that give a bare list the template's settings. */
const SETTINGS_ARGS = [
  '--name',
  s.name,
  '--hz',
  String(s.hz),
  '--cos-phi',
  String((s.requirement as { target: number }).target),
  '--ssc-mva',
  String(s.sscMva),
  '--case',
  first,
];

function options(argv: readonly string[]): SiteOptions {
  const parsed = parseArgs(argv, {
    command: 't',
    values: ['--name', '--hz', '--cos-phi', '--tan-phi', '--ssc-mva', '--case'],
    lists: ['--map', '--unit'],
  });
  if (!parsed.ok) throw new Error(parsed.message);
  const o = readSiteOptions(parsed.args);
  if (!o.ok) throw new Error(o.message);
  return o.options;
}

const NUMERIC = [
  'qty',
  'running',
  'p_kw',
  'eff',
  'cos_phi',
  'i0_pct',
  's_kva',
  'uk_pct',
  'p0_kw',
  'pk_kw',
  'u_kv',
  'c_uf_km',
  'len_km',
  'q_kvar',
  'u_rated_kv',
  'p_pct',
] as const;

/** A row as the site means it: load factors per case (however they were written), no row number. */
function meaning(r: EquipmentRow, cases: readonly string[]) {
  const values: Record<string, number> = {};
  for (const c of NUMERIC) if (r.values[c] !== undefined) values[c] = r.values[c] as number;
  return {
    tag: r.tag,
    bus: r.bus,
    kind: r.kind,
    to_bus: r.to_bus ?? null,
    supply: r.supply ?? null,
    description: r.description ?? null,
    values,
    load: cases.map((c) => loadFactor(r, c).value),
  };
}
/** By tag: a workbook keeps the rows by kind, one sheet each, not in the file's order. */
const meanings = (x: Site) =>
  x.equipment.map((r) => meaning(r, x.settings.cases)).sort((a, b) => a.tag.localeCompare(b.tag));

/** The template's list as a table: plain `load` for the first case, load:<second> for the other. */
function listRows(headers: Record<string, string> = {}): (string | number | null)[][] {
  const cols = [
    'tag',
    'description',
    'bus',
    'kind',
    'to_bus',
    'supply',
    ...NUMERIC,
    'load',
    `load:${second}`,
  ];
  return [
    cols.map((c) => headers[c] ?? c),
    ...site.equipment.map((r) =>
      cols.map((c) => {
        if (c === 'load') return r.loads[first] ?? r.values.load ?? null;
        if (c.startsWith('load:')) return r.loads[second] ?? null;
        if ((NUMERIC as readonly string[]).includes(c))
          return r.values[c as (typeof NUMERIC)[number]] ?? null;
        return (r as unknown as Record<string, string | undefined>)[c] ?? null;
      }),
    ),
  ];
}

const files: Record<string, string> = {};

beforeAll(async () => {
  files.template = TEMPLATE;
  const doc = buildWorkbook(site, { flavour: 'live' });
  files.workbook = join(tmp, 'cold.kvar.json');
  writeFileSync(files.workbook, JSON.stringify(doc));
  files.export = join(tmp, 'cold-export.xlsx');
  writeFileSync(
    files.export,
    await exportWorkbookXlsx(buildWorkbook(site, { flavour: 'portable' }), { settings: site.settings }),
  );
  files.csv = join(tmp, 'cold-list.csv');
  writeFileSync(files.csv, writeCsv(listRows()));
  // The page's header words with units, ';' and decimal commas, the power in MW.
  const words: Record<string, string> = {
    tag: 'Tag no.',
    description: 'Description',
    bus: 'Bus',
    kind: 'Type',
    supply: 'Starter type',
    p_kw: 'Rated power (MW)',
    cos_phi: 'Power factor',
    eff: 'Efficiency',
  };
  const rows = listRows(words).map((r, i) =>
    i === 0
      ? r
      : r.map((v, c) => {
          if (typeof v !== 'number') return v;
          const x = listRows()[0]?.[c] === 'p_kw' ? v / 1000 : v;
          return String(x).replace('.', ',');
        }),
  );
  files.decimalComma = join(tmp, 'cold-list-de.csv');
  writeFileSync(files.decimalComma, writeCsv(rows, { separator: ';' }));
  const wb = new ExcelJS.Workbook();
  wb.addWorksheet('client list').addRows(listRows());
  files.xlsxList = join(tmp, 'cold-list.xlsx');
  writeFileSync(files.xlsxList, new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer));
});

async function load(file: string, argv: readonly string[] = []): Promise<LoadedSite> {
  const r = await loadSite(file, options(argv));
  if (!r.ok) throw new Error(r.message);
  return r.loaded;
}

describe('the same site through every path', () => {
  const lists = ['csv', 'decimalComma', 'xlsxList'] as const;
  it.each(['template', 'workbook', 'export', ...lists])('%s: equipment, settings and totals', async (key) => {
    const listArgs = (lists as readonly string[]).includes(key) ? SETTINGS_ARGS : [];
    const got = await load(files[key] as string, listArgs);
    expect(got.problems.filter((p) => p.severity !== 'info')).toEqual([]);
    expect(got.site.settings.name).toBe(s.name);
    expect(got.site.settings.hz).toBe(s.hz);
    expect(got.site.settings.cases).toEqual(s.cases);
    expect(got.site.settings.requirement).toEqual(s.requirement);
    expect(got.site.settings.sscMva).toBe(s.sscMva);
    const want = meanings(site);
    const have = meanings(got.site);
    // MW → kW and decimal commas may leave binary noise in the last digit, nothing more.
    expect(have.map((r) => ({ ...r, values: {} }))).toEqual(want.map((r) => ({ ...r, values: {} })));
    have.forEach((r, i) => {
      const w = want[i]?.values ?? {};
      expect(Object.keys(r.values).sort()).toEqual(Object.keys(w).sort());
      for (const [k, v] of Object.entries(r.values)) expect(v).toBeCloseTo(w[k] as number, 9);
    });
    const a = rollUpAll(site);
    const b = rollUpAll(got.site);
    b.forEach((bal, i) => {
      expect(bal.root.p_kw).toBeCloseTo(a[i]?.root.p_kw as number, 6);
      expect(bal.root.q_kvar).toBeCloseTo(a[i]?.root.q_kvar as number, 6);
    });
  });
  it('the source is told apart', async () => {
    expect((await load(files.workbook as string)).source).toBe('workbook');
    expect((await load(files.export as string)).source).toBe('own-xlsx');
    expect((await load(files.template as string)).source).toBe('site-file');
    expect((await load(files.xlsxList as string)).source).toBe('list');
  });
});

describe('naming and settings', () => {
  it('a list without --name is named after its file, the same way for every command', async () => {
    expect((await load(files.csv as string)).site.settings.name).toBe('cold-list');
    expect(siteNameFromFile('/x/site.kvar.json')).toBe('site');
    expect(siteNameFromFile('list.CSV')).toBe('list');
  });
  it('options override a file’s own settings', async () => {
    const got = await load(files.template as string, ['--hz', '60', '--tan-phi', '0.4/0.1', '--name', 'X']);
    expect(got.site.settings).toMatchObject({
      name: 'X',
      hz: 60,
      requirement: { kind: 'tanphi', lagMax: 0.4, leadMax: 0.1 },
    });
  });
  it('--map reads a column the header words miss; --unit says its unit', async () => {
    const file = join(tmp, 'odd.csv');
    writeFileSync(file, 'Ident,Where,What,Oomph,pf\nL1,MAIN,load,0.3,0.6\n');
    const got = await load(file, [
      '--map',
      'Ident=tag',
      '--map',
      'B=bus',
      '--map',
      'What=kind',
      '--map',
      'Oomph=p_kw',
      '--unit',
      'Oomph=MW',
      '--map',
      'pf=cos_phi',
    ]);
    expect(got.site.equipment[0]).toMatchObject({
      tag: 'L1',
      bus: 'MAIN',
      kind: 'load',
      values: { p_kw: 300, cos_phi: 0.6 },
    });
  });
  it('options the file does not fit are command-line errors (exit 2), said in words', async () => {
    const bad = async (file: string, argv: string[]) => {
      const r = await loadSite(file, options(argv));
      expect(r.ok).toBe(false);
      return r.ok ? undefined : r;
    };
    expect(await bad(files.csv as string, ['--map', 'Nope=tag'])).toMatchObject({
      usage: true,
      message: expect.stringContaining('has no column "Nope"'),
    });
    expect(await bad(files.csv as string, ['--map', 'tag=tagg'])).toMatchObject({
      usage: true,
      message: expect.stringContaining('"tagg" is not a field'),
    });
    expect(await bad(files.template as string, ['--map', 'A=tag'])).toMatchObject({
      usage: true,
      message: expect.stringContaining('apply to equipment lists'),
    });
  });
});

function cli(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  const bin = (
    JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { bin: Record<string, string> }
  ).bin['kvar-ledger'] as string;
  return new Promise((resolve) => {
    execFile(process.execPath, [bin, ...args], { cwd: ROOT }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : 1) : 0, stdout, stderr });
    });
  });
}

describe('balance as a process gives the same output for the same site in any file', () => {
  it('template, workbook, export and CSV list', async () => {
    const runs = await Promise.all([
      cli('balance', files.template as string, '--case', second, '--json'),
      cli('balance', files.workbook as string, '--case', second, '--json'),
      cli('balance', files.export as string, '--case', second, '--json'),
      cli('balance', files.csv as string, ...SETTINGS_ARGS.slice(0, -2), '--case', first, '--json'),
    ]);
    for (const r of runs) expect(r.code, r.stderr).toBe(0);
    const [t, w, x] = runs.map((r) => JSON.parse(r.stdout) as Record<string, unknown>);
    expect(w).toEqual(t);
    expect(x).toEqual(t);
    const list = JSON.parse(runs[3]?.stdout ?? '') as { site: string; cases: string[] };
    expect(list.site).toBe(s.name);
    expect(list.cases).toEqual(s.cases);
  }, 60_000);
});
