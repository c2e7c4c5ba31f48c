// Bad files through the command line as a process: every one is refused with exit status 1, in
// lines that name the file (and the row and column where there is one), and never with a stack
// trace. The corpus holds the kinds tests/io/xlsx/badFiles.test.ts refuses at the xlsx gate, plus
// JSON, CSV and site files gone wrong, files that are no list at all, and absurd values.
import { execFile } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import ExcelJS from 'exceljs';
import { beforeAll, describe, expect, it } from 'vitest';
import { MAX_EQUIPMENT_ROWS } from '../../src/core/site/limits.ts';
import { exportWorkbookXlsx } from '../../src/io/xlsx/export.ts';
import { sampleDoc } from '../io/xlsx/docFixtures.ts';
import { encryptedContainer, makeZip, millionRowXlsx, xlsxShell } from '../io/xlsx/zipFixtures.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const BIN = (JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { bin: Record<string, string> })
  .bin['kvar-ledger'] as string;
const dir = mkdtempSync(join(tmpdir(), 'kvar-badfiles-'));

interface Run {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

function cli(args: readonly string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(process.execPath, [BIN, ...args], { cwd: ROOT, maxBuffer: 1 << 24 }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : -1) : 0, stdout, stderr });
    });
  });
}

/** Run at most two processes at a time: the machine is shared. */
async function runAll(jobs: ReadonlyArray<readonly string[]>): Promise<Run[]> {
  const out: Run[] = new Array<Run>(jobs.length);
  let next = 0;
  const worker = async () => {
    while (next < jobs.length) {
      const i = next++;
      out[i] = await cli(jobs[i] as readonly string[]);
    }
  };
  await Promise.all([worker(), worker()]);
  return out;
}

const site = (
  equipment: string,
  settings = '"name":"x","hz":50,"cases":["normal"],"requirement":{"kind":"cosphi","target":0.95}',
) => `{"format":"kvar-ledger-site","version":1,"settings":{${settings}},"equipment":[${equipment}]}`;
const XFMR =
  '{"tag":"T1","bus":"MV","kind":"transformer","to_bus":"LV","s_kva":1000,"uk_pct":6,"i0_pct":1,"p0_kw":0.7,"pk_kw":7.6,"u_kv":0.4}';

async function xlsxOf(build: (wb: ExcelJS.Workbook) => void): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  build(wb);
  return new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer);
}

/** name → [content, what the message must say]. */
const corpus = new Map<string, [Uint8Array | string, RegExp]>();

beforeAll(async () => {
  const add = (name: string, content: Uint8Array | string, says: RegExp) => corpus.set(name, [content, says]);
  add('empty.csv', '', /empty \(0 bytes\)/);
  add('empty.json', '', /empty \(0 bytes\)/);
  add('blank.csv', '\n \n\n', /the file is empty/);
  add('text-named.xlsx', 'tag,bus\nM1,LV\n', /not an xlsx workbook/);
  add('encrypted.xlsx', encryptedContainer(), /password-protected/);
  add('million-rows.xlsx', millionRowXlsx(), /more than 51,000 rows/);
  add('bomb.xlsx', xlsxShell('<worksheet>' + ' '.repeat(40 * 1024 * 1024) + '</worksheet>'), /inflates \d+×/);
  add('no-workbook-inside.xlsx', makeZip([{ name: 'mimetype', data: 'x' }]), /not an xlsx workbook/);
  const whole = await exportWorkbookXlsx(sampleDoc());
  add('truncated.xlsx', whole.subarray(0, Math.floor(whole.length / 2)), /truncated|cut off|incomplete/i);
  add(
    'empty-workbook.xlsx',
    await xlsxOf((wb) => void wb.addWorksheet('Empty')),
    /not an equipment list|holds no data|the file is empty/,
  );
  add(
    'circular.xlsx',
    await xlsxOf((wb) => {
      const ws = wb.addWorksheet('Buses');
      ws.getCell('A1').value = { formula: 'B1+1', result: 0 } as ExcelJS.CellFormulaValue;
      ws.getCell('B1').value = { formula: 'A1*2', result: 0 } as ExcelJS.CellFormulaValue;
    }),
    /not an equipment list/,
  );
  add('broken.json', '{"format": kvar}', /not valid JSON at line 1/);
  add(
    'deep.json',
    '{"a":'.repeat(200_000) + '1' + '}'.repeat(200_000),
    /not a Kvar Ledger file|not valid JSON/,
  );
  add('array.json', '[1,2,3]', /not a site file/);
  add(
    'other.json',
    '{"name":"kvar-ledger","version":"0.1.0"}',
    /not a Kvar Ledger file: its "format" is missing/,
  );
  add(
    'bad-workbook.kvar.json',
    '{"format":"kvar-ledger-workbook","version":1,"title":"t","sheets":[{"name":"A","cells":"no"}]}',
    /cells must be a list of rows/,
  );
  add(
    'huge-power.json',
    site(`${XFMR},{"tag":"M1","bus":"LV","kind":"motor","p_kw":1e308,"eff":0.95,"cos_phi":0.86,"u_kv":0.4}`),
    /row 2, column p_kw: p_kw must be at most 1,000,000 kW .*got 1e\+308/,
  );
  add(
    'huge-qty.json',
    site(
      `${XFMR},{"tag":"M1","bus":"LV","kind":"motor","qty":10000000,"p_kw":75,"eff":0.95,"cos_phi":0.86,"u_kv":0.4}`,
    ),
    /row 2, column qty: qty must be at most 10,000 units/,
  );
  add(
    'unknown-kind.json',
    site(`${XFMR},{"tag":"W1","bus":"LV","kind":"widget","p_kw":5}`),
    /row 2, column kind: kind must be one of/,
  );
  add(
    'loop.json',
    site(
      `${XFMR},{"tag":"T2","bus":"LV","kind":"transformer","to_bus":"MV","s_kva":1000,"uk_pct":6,"i0_pct":1,"p0_kw":0.7,"pk_kw":7.6,"u_kv":11}`,
    ),
    /loop|cycle|feeds itself|fed by/i,
  );
  add(
    'bad-settings.json',
    site(XFMR, '"name":"x","hz":55,"cases":[],"requirement":{"kind":"cos"}'),
    /settings\./,
  );
  add('README.md', readFileSync(join(ROOT, 'README.md')), /README\.md is not an equipment list/);
  add(
    'ls.bin',
    readFileSync(process.execPath).subarray(0, 65_536),
    /the file is binary \(it holds NUL bytes\)/,
  );
  add('nul.csv', 'tag,bus,kind\n\u0000\u0000,\u0000,motor\n', /the file is binary/);
  add(
    'unclosed-quote.csv',
    'tag,bus,kind\n"M1,LV,motor\n',
    /line 2, character 1: a quoted field is never closed/,
  );
  add(
    'header-only.csv',
    'tag,bus,kind,p_kw\n',
    /row 1: the list has a header row but no equipment rows below it/,
  );
  add(
    'bad-rows.csv',
    'tag,bus,kind,p_kw,eff,cos_phi\nM1,LV,motor,75,0.95,1.3\nM2,LV,heater,1,1,1\n,LV,load,5,,0.9\nM3,LV,motor,abc,0.9,0.8\n',
    /row 2, column F \(cos_phi\).*\n.*row 3, column C \(kind\).*\n.*row 4, column A \(tag\).*\n.*row 5, column D \(p_kw\)/,
  );
  add(
    'huge-value.csv',
    'tag,bus,kind,p_kw,cos_phi\nL1,LV,load,1e308,0.9\nL2,LV,load,1e999,0.9\n',
    /row 2, column D \(p_kw\)/,
  );
  add(
    'too-many-rows.csv',
    [
      'tag,bus,kind,p_kw,cos_phi',
      ...Array.from({ length: MAX_EQUIPMENT_ROWS + 1 }, (_, i) => `L${i},LV,load,1,0.9`),
    ].join('\n'),
    /50,001 rows of data; Kvar Ledger supports at most 50,000/,
  );
  add(
    'legacy.xls',
    new Uint8Array([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, ...new Uint8Array(2048)]),
    /xls|password|older|cannot be read/i,
  );
  for (const [name, [content]] of corpus) writeFileSync(join(dir, name), content);
  mkdirSync(join(dir, 'a-folder'));
}, 120_000);

function expectOneVoice(r: Run, command: string, file: string): void {
  expect(r.stdout).toBe('');
  // No stack frame, no exception class name, no "internal error".
  expect(r.stderr).not.toMatch(/^\s+at\s|\n\s+at\s/);
  expect(r.stderr).not.toMatch(/\b(?:Type|Range|Syntax|Reference)?Error:|internal error/);
  const lines = r.stderr.trimEnd().split('\n');
  expect(lines[0]).toMatch(new RegExp(`^kvar-ledger ${command}: `));
  expect(lines[0]).toContain(file);
  for (const l of lines.slice(1)) expect(l.startsWith(file) || l.startsWith('kvar-ledger ')).toBe(true);
}

describe('bad files through the command line, as a process', () => {
  it('balance refuses every file of the corpus with exit 1, saying what and where', async () => {
    const names = [...corpus.keys()];
    const runs = await runAll(names.map((n) => ['balance', join(dir, n)]));
    runs.forEach((r, i) => {
      const name = names[i] as string;
      const [, says] = corpus.get(name) as [unknown, RegExp];
      expect({ name, code: r.code }).toEqual({ name, code: 1 });
      expectOneVoice(r, 'balance', join(dir, name));
      expect(r.stderr, name).toMatch(says);
    });
  }, 600_000);

  it('export refuses them too and writes nothing (one file per way in: the loader is shared)', async () => {
    const names = [
      'empty.json',
      'encrypted.xlsx',
      'truncated.xlsx',
      'broken.json',
      'bad-workbook.kvar.json',
      'huge-power.json',
      'README.md',
      'bad-rows.csv',
      'too-many-rows.csv',
    ];
    const runs = await runAll(names.map((n) => ['export', join(dir, n), join(dir, `${n}.out.xlsx`)]));
    runs.forEach((r, i) => {
      const name = names[i] as string;
      const [, says] = corpus.get(name) as [unknown, RegExp];
      expect({ name, code: r.code }).toEqual({ name, code: 1 });
      expectOneVoice(r, 'export', join(dir, name));
      expect(r.stderr, name).toMatch(says);
      expect(existsSync(join(dir, `${name}.out.xlsx`)), name).toBe(false);
    });
  }, 600_000);

  it('a missing file and a folder', async () => {
    const [missing, folder] = await runAll([
      ['balance', join(dir, 'nope.csv')],
      ['balance', join(dir, 'a-folder')],
    ]);
    expect(missing).toMatchObject({ code: 1, stdout: '' });
    expect(missing?.stderr).toBe(`kvar-ledger balance: cannot read ${join(dir, 'nope.csv')}: no such file\n`);
    expect(folder?.stderr).toBe(
      `kvar-ledger balance: cannot read ${join(dir, 'a-folder')}: it is a directory, not a file\n`,
    );
  });

  it('a wrong command line exits 2 in one line that points to --help', async () => {
    const runs = await runAll([
      ['balance'],
      ['balance', 'a.csv', 'b.csv'],
      ['balance', 'templates/cold-store.json', '--cos-phi', '0,95'],
      ['balance', 'templates/cold-store.json', '--cos-phi', '0.9', '--tan-phi', '0.4'],
      ['export', 'templates/cold-store.json', 'out.txt'],
      ['export', 'templates/cold-store.json', 'o.xlsx', '--map', 'A'],
      ['frobnicate'],
      [],
    ]);
    for (const r of runs) {
      expect(r.code, r.stderr).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trimEnd().split('\n'), r.stderr).toHaveLength(1);
      expect(r.stderr).toMatch(/see kvar-ledger (\w+ )?--help\)$/m);
    }
  });

  it('every command documents its exit statuses in --help', async () => {
    const runs = await runAll([
      ['eval', '--help'],
      ['functions', '--help'],
      ['balance', '--help'],
      ['export', '--help'],
      ['--help'],
    ]);
    for (const r of runs) {
      expect(r.code).toBe(0);
      expect(r.stdout).toContain('Exit status: 0 done; 1 the input cannot be used');
      expect(r.stdout).toContain('2 the command line is wrong');
    }
  });
});
