// `kvar-ledger balance`: templates, CSV and xlsx lists, --case, --hz, --json, and bad input.
// The bus totals are checked against handCalc.ts, an independent recomputation from the
// published formulas that reads the template JSON itself.
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { run } from '../../src/cli/balance.ts';
import { handTotals, type HandRow } from '../core/site/handCalc.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const COLD = join(ROOT, 'templates/cold-store.json');
const tmp = mkdtempSync(join(tmpdir(), 'kvar-balance-'));

async function balance(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await run(argv, { out: (t) => void (out += t), err: (t) => void (err += t) });
  return { code, out, err };
}

function cliProcess(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  const bin = (
    JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { bin: Record<string, string> }
  ).bin['kvar-ledger'] as string;
  return new Promise((resolve) => {
    execFile(process.execPath, [bin, ...args], { cwd: ROOT }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : 1) : 0, stdout, stderr });
    });
  });
}

interface BusJson {
  bus: string;
  p_kw: number;
  q_kvar: number;
  s_kva: number;
  cos_phi: number | null;
  tan_phi: number | null;
  sense: string;
  q_absorbed_kvar: number;
  q_delivered_kvar: number;
}

function expectHandTotals(buses: BusJson[], caseName: string) {
  const raw = JSON.parse(readFileSync(COLD, 'utf8')) as { equipment: HandRow[] };
  const hand = handTotals(raw.equipment, caseName, 50);
  expect(buses.map((b) => b.bus).sort()).toEqual([...hand.keys()].sort());
  for (const b of buses) {
    const h = hand.get(b.bus) as { p: number; q: number; s: number };
    expect(b.p_kw).toBeCloseTo(h.p, 9);
    expect(b.q_kvar).toBeCloseTo(h.q, 9);
    expect(b.s_kva).toBeCloseTo(h.s, 9);
    expect(b.cos_phi).toBeCloseTo(h.p / h.s, 12);
    expect(b.tan_phi).toBeCloseTo(h.q / h.p, 12);
  }
}

describe('kvar-ledger balance', () => {
  it('reproduces hand-computed bus totals of the cold store in its second case (as a separate process)', async () => {
    const r = await cliProcess('balance', 'templates/cold-store.json', '--case', 'winter-night', '--json');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout) as { case: string; buses: BusJson[]; root: BusJson };
    expect(j.case).toBe('winter-night');
    expectHandTotals(j.buses, 'winter-night');
    expect(j.root.bus).toBe('MV-11');
  });
  it('and in its first case, the default', async () => {
    const r = await balance(COLD, '--json');
    const j = JSON.parse(r.out) as { case: string; buses: BusJson[] };
    expect(j.case).toBe('summer-day');
    expectHandTotals(j.buses, 'summer-day');
  });
  it('--json shape: case, buses, root, compensation, warnings', async () => {
    const j = JSON.parse((await balance(COLD, '--case', 'winter-night', '--json')).out) as Record<
      string,
      unknown
    >;
    expect(Object.keys(j)).toEqual(
      expect.arrayContaining(['case', 'buses', 'root', 'compensation', 'warnings', 'cases', 'hz']),
    );
    const bus = (j.buses as Record<string, unknown>[])[0] as Record<string, unknown>;
    expect(Object.keys(bus)).toEqual(
      expect.arrayContaining([
        'bus',
        'p_kw',
        'q_kvar',
        's_kva',
        'cos_phi',
        'tan_phi',
        'q_absorbed_kvar',
        'q_delivered_kvar',
        'sense',
        'u_kv',
        'fed_by',
      ]),
    );
    const comp = j.compensation as {
      banks: Array<{ bus: string; steps_in_case: number }>;
      met_after: boolean;
      root_after: BusJson;
    };
    expect(comp.banks.map((b) => b.bus)).toEqual(['LV-REF', 'LV-SVC']);
    expect(comp.met_after).toBe(true);
    expect(comp.root_after.cos_phi).toBeGreaterThanOrEqual(0.95);
    expect(Array.isArray(j.warnings)).toBe(true);
  });
  it('prints a readable aligned table by default', async () => {
    const r = await balance(join(ROOT, 'templates/solar-collector.json'), '--case', 'night');
    expect(r.code).toBe(0);
    const lines = r.out.split('\n');
    const header = lines.find((l) => l.startsWith('bus')) as string;
    expect(header).toMatch(
      /bus\s+fed by\s+U kV\s+P kW\s+Q kvar\s+Q abs\s+Q del\s+S kVA\s+cos φ\s+tan φ\s+sense/,
    );
    const start = lines.indexOf(header) + 2;
    const rows = lines.slice(start, lines.indexOf('', start));
    expect(rows).toHaveLength(11);
    // Right-aligned numbers end in the same column as their header.
    const pEnd = header.indexOf('P kW') + 'P kW'.length;
    for (const row of rows) expect(row.slice(0, pEnd)).toMatch(/\d$/);
    expect(r.out).toContain('shunt reactor');
    expect(r.out).toContain('licensed engineer');
  });
  it('warns when the supply short-circuit power is missing and offers a typical one; --ssc-mva clears it', async () => {
    const csv = join(tmp, 'supply.csv');
    writeFileSync(csv, 'tag,bus,kind,p_kw,cos_phi,u_kv\nL1,MAIN,load,100,0.8,11\n');
    const codes = async (...extra: string[]) =>
      (
        JSON.parse((await balance(csv, '--json', ...extra)).out) as {
          warnings: { code: string; message: string }[];
        }
      ).warnings;
    const blank = (await codes()).filter((w) => w.code === 'supply-unknown');
    expect(blank).toHaveLength(1);
    // 11 kV lies in the ≤ 12 kV level: 250 MVA (common practice, from memory).
    expect(blank[0]?.message).toMatch(/typical value at 11 kV is 250 MVA/);
    expect((await codes('--ssc-mva', '250')).filter((w) => w.code === 'supply-unknown')).toEqual([]);
  });
  it('--cos-phi-lagging sets no leading limit: cable charging asks for no reactor', async () => {
    const csv = join(tmp, 'lagging.csv');
    // 100 kW beside 10 km of 11 kV cable at 0.3 µF/km: ω·C·len·U² ≈ 1 140 kvar delivered.
    writeFileSync(
      csv,
      'tag,bus,kind,p_kw,cos_phi,u_kv,c_uf_km,len_km\nL1,MAIN,load,100,1,11,,\nK1,MAIN,cable,,,11,0.3,10\n',
    );
    const codes = async (...extra: string[]) =>
      (
        JSON.parse((await balance(csv, '--json', '--ssc-mva', '250', ...extra)).out) as {
          warnings: { code: string }[];
        }
      ).warnings.map((w) => w.code);
    expect(await codes('--cos-phi', '0.95')).toContain('charging-dominates');
    expect(await codes('--cos-phi-lagging', '0.95')).not.toContain('charging-dominates');
    expect(await codes('--cos-phi-lagging', '0.95')).not.toContain('requirement-not-met');
    const both = await balance(csv, '--cos-phi', '0.95', '--cos-phi-lagging', '0.9');
    expect(both.code).toBe(2);
    expect(both.err).toMatch(/give one of --cos-phi, --cos-phi-lagging or --tan-phi/);
  });
  it('--rated-kw refers the limits to a rated power: the same charging is within them', async () => {
    const csv = join(tmp, 'rated.csv');
    // As above: about 1 140 kvar delivered beside 100 kW. Referred to P, tan φ 0.33 allows 33 kvar
    // leading; referred to 5,000 kW rated, 0.33 × 5,000 = 1,650 kvar (hand figures).
    writeFileSync(
      csv,
      'tag,bus,kind,p_kw,cos_phi,u_kv,c_uf_km,len_km\nL1,MAIN,load,100,1,11,,\nK1,MAIN,cable,,,11,0.3,10\n',
    );
    const json = async (...extra: string[]) =>
      JSON.parse((await balance(csv, '--json', '--ssc-mva', '250', '--tan-phi', '0.33', ...extra)).out) as {
        warnings: { code: string }[];
        compensation: { requirement: string; rated_kw: number | null; met_before: boolean };
      };
    const own = await json();
    expect(own.warnings.map((w) => w.code)).toContain('charging-dominates');
    expect([own.compensation.met_before, own.compensation.rated_kw]).toEqual([false, null]);
    const rated = await json('--rated-kw', '5000');
    expect(rated.warnings.map((w) => w.code)).not.toContain('charging-dominates');
    expect(rated.compensation.requirement).toMatch(/referred to 5000 kW rated power/);
    expect([rated.compensation.met_before, rated.compensation.rated_kw]).toEqual([true, 5000]);
    const bad = await balance(csv, '--rated-kw', '0');
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--rated-kw must be a number > 0 \(kW\); got "0"/);
  });
  it('reads a CSV list with a load:<case> column; --hz changes the cable charging', async () => {
    const csv = join(tmp, 'list.csv');
    writeFileSync(
      csv,
      'tag,bus,kind,p_kw,cos_phi,u_kv,c_uf_km,len_km,load:night\nL1,MAIN,load,100,0.8,,,,0.5\nK1,MAIN,cable,,,11,0.3,2,\n',
    );
    const at = async (hz: string) =>
      JSON.parse((await balance(csv, '--case', 'night', '--hz', hz, '--json')).out) as {
        root: BusJson;
        cases: string[];
      };
    const j50 = await at('50');
    const j60 = await at('60');
    expect(j50.cases).toEqual(['normal', 'night']);
    expect(j50.root.p_kw).toBeCloseTo(50, 12);
    // 100 kW at 0.8: Q = 75 kvar at full load, 37.5 at half; cable −ω·C·len·U².
    expect(j50.root.q_kvar).toBeCloseTo(37.5 - (2 * Math.PI * 50 * 0.3e-6 * 2 * 11000 ** 2) / 1000, 9);
    expect(j60.root.q_kvar).toBeCloseTo(37.5 - (2 * Math.PI * 60 * 0.3e-6 * 2 * 11000 ** 2) / 1000, 9);
  });
  it('reads the first sheet of an xlsx list', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('list');
    ws.addRows([
      ['tag', 'bus', 'kind', 'p_kw', 'cos_phi'],
      ['L1', 'MAIN', 'load', 300, 0.6],
    ]);
    const xlsx = join(tmp, 'book.xlsx');
    await wb.xlsx.writeFile(xlsx);
    const j = JSON.parse((await balance(xlsx, '--json')).out) as { root: BusJson };
    expect(j.root.q_kvar).toBeCloseTo(400, 9);
  });

  it('reads the site back from its own xlsx export (whose first sheet is the cover) and matches the hand totals', async () => {
    const xlsx = join(tmp, 'cold-store-export.xlsx');
    const exported = await cliProcess('export', COLD, xlsx);
    expect(exported.code, exported.stderr).toBe(0);
    const r = await balance(xlsx, '--case', 'winter-night', '--json');
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out) as { case: string; buses: BusJson[] };
    expect(j.case).toBe('winter-night');
    expectHandTotals(j.buses, 'winter-night');
  });
  it("counts a line's I²R loss when R is given and says so on the row when it is blank", async () => {
    // 5 km of 20 kV line with 0.12 Ω/km (a typical 240 mm² aluminium overhead conductor, from
    // memory) feeding 6 400 kW at cos φ 0.8 (8 MVA): I = S/(√3·U) = 230.9 A, 3·I²·R·len = 96 kW.
    const head = 'tag,bus,kind,to_bus,u_kv,r_ohm_km,l_mh_km,c_nf_km,len_km,p_kw,cos_phi';
    const write = (name: string, r: string) => {
      const csv = join(tmp, name);
      writeFileSync(csv, `${head}\nL1,MV,line,B2,20,${r},1.2,10,5,,\nX1,B2,load,,20,,,,,6400,0.8\n`);
      return csv;
    };
    const amps = 8000 / (Math.sqrt(3) * 20);
    const given = JSON.parse(
      (await balance(write('line-r.csv', '0.12'), '--json', '--ssc-mva', '250')).out,
    ) as {
      root: { p_kw: number };
      warnings: { column: string | null }[];
    };
    expect(given.root.p_kw).toBeCloseTo(6400 + (3 * amps ** 2 * 0.12 * 5) / 1000, 9);
    expect(given.warnings.filter((w) => w.column === 'r_ohm_km')).toEqual([]);
    const blank = await balance(write('line-blank.csv', ''), '--ssc-mva', '250');
    expect(blank.code).toBe(0);
    // A list names the column by its letter too: F is r_ohm_km in this header.
    expect(blank.out).toContain(
      'warning row 2, column F (r_ohm_km): r_ohm_km is blank, so the kW losses of line L1 (3·I²·R) are not counted before or after compensation',
    );
  });
});

describe('kvar-ledger balance: bad input exits 1 saying what and where', () => {
  it('a list with bad rows: every problem with row and column, nothing balanced', async () => {
    const csv = join(tmp, 'bad.csv');
    writeFileSync(
      csv,
      'tag,bus,kind,p_kw,eff,cos_phi\nM1,LV,motor,75,0.95,1.3\nM1,LV,heater,1,1,1\n,LV,load,5,,0.9\n',
    );
    const r = await balance(csv);
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    // The unknown kind keeps row 3 out, so its duplicate tag is not reported as well.
    const lines = r.err.trimEnd().split('\n');
    expect(lines[0]).toBe(`kvar-ledger balance: ${csv} has 3 errors; nothing was balanced`);
    // One line per error, in the file's order, naming the file, the row and the column as the
    // page's import names them (letter and header).
    expect(lines.slice(1)).toEqual([
      `${csv}: row 2, column F (cos_phi): KVAR.MOTOR: argument 3 (cos_phi) must be in (0, 1]; got 1.3`,
      `${csv}: row 3, column C (kind): kind must be one of motor, load, generator, transformer, line, cable, feeder, capacitor, reactor; got "heater"`,
      `${csv}: row 4, column A (tag): tag is blank; every item needs a unique tag`,
    ]);
  });
  it('a missing file, an unreadable site file (exit 1); an unknown case, a bad --hz, an unknown option, no file (exit 2)', async () => {
    const cases: Array<[string[], number, RegExp]> = [
      [[join(tmp, 'nope.csv')], 1, /cannot read .*nope\.csv: no such file/],
      [[join(tmp, 'broken.json')], 1, /the site file is not valid JSON at line 1/],
      [
        [COLD, '--case', 'spring'],
        2,
        /--case "spring" is not a case of .*; its cases are summer-day, winter-night/,
      ],
      [[COLD, '--hz', '55'], 2, /--hz must be 50 or 60; got "55"/],
      [[COLD, '--colour'], 2, /unknown option --colour/],
      [[], 2, /give exactly one file/],
    ];
    writeFileSync(join(tmp, 'broken.json'), '{"format": kvar}');
    for (const [argv, code, message] of cases) {
      const r = await balance(...argv);
      expect(r.code, argv.join(' ')).toBe(code);
      expect(r.err).toMatch(message);
      expect(r.err.trimEnd().split('\n'), r.err).toHaveLength(1);
    }
  });
  it('an empty or corrupt list file', async () => {
    writeFileSync(join(tmp, 'empty.csv'), '');
    expect((await balance(join(tmp, 'empty.csv'))).err).toMatch(/the file is empty/);
    writeFileSync(join(tmp, 'q.csv'), 'tag,bus\n"open,LV\n');
    const r = await balance(join(tmp, 'q.csv'));
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/line 2, character 1: a quoted field is never closed/);
  });
});
