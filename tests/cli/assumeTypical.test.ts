// --assume-typical on the site commands: blank motor and transformer inputs take the typical
// values the page's fill gives, listed on stderr or in --json, marked in an export; without the
// option nothing changes. Outside values: IEC 60034-30-1 IE3 4-pole 50 Hz minimum efficiency
// 90 kW 95.2 % (the published table, value quoted from memory of it); a motor's electrical input P = P_out / η (definition of
// efficiency), worked by hand below.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { run as balanceRun } from '../../src/cli/balance.ts';
import { run as exportRun } from '../../src/cli/export.ts';
import { run as quoteRun } from '../../src/cli/quote.ts';

const tmp = mkdtempSync(join(tmpdir(), 'kvar-typical-'));

type Run = (argv: string[], io: { out(t: string): void; err(t: string): void }) => Promise<number>;
async function cli(run: Run, ...argv: string[]) {
  let out = '';
  let err = '';
  const code = await run(argv, { out: (t) => void (out += t), err: (t) => void (err += t) });
  return { code, out, err };
}

// An invented tender-stage list: one motor without efficiency and cos φ, one complete, a
// transformer with only its rating.
const LIST =
  'Tag,Bus,Kind,Rated output (kW),Efficiency,cos phi,u_kv,sn_kva,to_bus\n' +
  'T1,MV,transformer,,,,0.4,1000,LV\n' +
  'M1,LV,motor,90,,,0.4,,\n' +
  'M2,LV,motor,45,0.93,0.83,0.4,,\n';
const file = join(tmp, 'tender.csv');
writeFileSync(file, LIST);

interface AssumedJson {
  sheet: string;
  row: number;
  tag: string;
  field: string;
  value: number;
  source: string;
}

describe('kvar-ledger --assume-typical', () => {
  it('without the option the blanks are refused as before', async () => {
    const r = await cli(balanceRun, file);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/row 3, column E \(Efficiency\): eff is required for a motor and is blank/);
    expect(r.err).not.toMatch(/assumed/);
  });

  it('balance fills the blanks, lists each with sheet, row, tag, field, value and source', async () => {
    const text = await cli(balanceRun, file, '--assume-typical');
    expect(text.code, text.err).toBe(0);
    expect(text.err).toMatch(
      /tender\.csv: assumed: Motors row 2 \(M1\): eff = 0\.952 \(90 kW, 4-pole, class IE3; IEC 60034-30-1/,
    );
    expect(text.err).toMatch(/Transformers row 2 \(T1\): p0_kw = .*EU 548\/2014/);
    expect(text.err).toMatch(/8 typical value\(s\) assumed for blanks/);

    const json = await cli(balanceRun, file, '--assume-typical', '--json');
    expect(json.code, json.err).toBe(0);
    // With --json the list is in the JSON, not on stderr.
    expect(json.err).toBe('');
    const out = JSON.parse(json.out) as {
      assumed: AssumedJson[];
      not_assumed: string[];
      buses: Array<{ bus: string; own_p_kw: number }>;
    };
    expect(out.assumed).toContainEqual(
      expect.objectContaining({ sheet: 'Motors', row: 2, tag: 'M1', field: 'eff', value: 0.952 }),
    );
    // Typed values are kept: M2's efficiency and cos φ are not among the assumed.
    expect(out.assumed.filter((a) => a.tag === 'M2').map((a) => a.field)).toEqual(['i0_pct']);
    expect(
      out.assumed
        .filter((a) => a.tag === 'T1')
        .map((a) => a.field)
        .sort(),
    ).toEqual(['i0_pct', 'p0_kw', 'pk_kw', 'uk_pct']);
    expect(out.not_assumed).toEqual([]);
    // By hand: P = 90 / 0.952 + 45 / 0.93 on bus LV (load factor 1).
    const lv = out.buses.find((b) => b.bus === 'LV');
    expect(lv?.own_p_kw).toBeCloseTo(90 / 0.952 + 45 / 0.93, 9);
  });

  it('without the option a complete file gives an empty list and the same figures', async () => {
    const full = join(tmp, 'full.csv');
    writeFileSync(
      full,
      'Tag,Bus,Kind,Rated output (kW),Efficiency,cos phi,i0_pct,u_kv\nM2,LV,motor,45,0.93,0.83,30,0.4\n',
    );
    const plain = await cli(balanceRun, full, '--json');
    const filled = await cli(balanceRun, full, '--json', '--assume-typical');
    expect(JSON.parse(plain.out)).toEqual(JSON.parse(filled.out));
    expect((JSON.parse(plain.out) as { assumed: unknown[] }).assumed).toEqual([]);
  });

  it('says which blanks stay blank and why', async () => {
    const odd = join(tmp, 'odd.csv');
    writeFileSync(odd, 'Tag,Bus,Kind,Rated output (kW),Efficiency,cos phi,u_kv\nM9,LV,motor,5000,,,6\n');
    const r = await cli(balanceRun, odd, '--assume-typical');
    expect(r.code).toBe(1);
    expect(r.err).toMatch(
      /odd\.csv: not assumed: row 2 \(M9\): eff: 5000 kW is outside the typical-value tables/,
    );
  });

  it('export marks the assumed cells with their source and counts them on the cover', async () => {
    const xlsx = join(tmp, 'tender.xlsx');
    const r = await cli(exportRun, file, xlsx, '--assume-typical');
    expect(r.code, r.err).toBe(0);
    expect(r.err).toMatch(/assumed: Motors row 2 \(M1\): eff = 0\.952/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(readFileSync(xlsx) as unknown as ArrayBuffer);
    const cover = wb.worksheets[0]!.getSheetValues().flat().join('\n');
    expect(cover).toMatch(/8 value\(s\) are typical values assumed for blanks/);
    const motors = wb.getWorksheet('Motors')!;
    const header = (motors.getRow(1).values as unknown[]).map(String);
    const eff = motors.getCell(2, header.indexOf('Efficiency'));
    expect(eff.value).toBe(0.952);
    expect(JSON.stringify(eff.note)).toMatch(/90 kW, 4-pole, class IE3/);
    // A typed value carries no note.
    expect(motors.getCell(3, header.indexOf('Efficiency')).note).toBeUndefined();

    const plain = join(tmp, 'plain.xlsx');
    const refused = await cli(exportRun, file, plain);
    expect(refused.code).toBe(1);
  });

  it('quote prices the filled site and lists what it assumed', async () => {
    const r = await cli(quoteRun, file, '--assume-typical');
    expect(r.code, r.err).toBe(0);
    expect(r.err).toMatch(/8 typical value\(s\) assumed for blanks/);
  });

  it('export of a saved workbook keeps the assumed marks the page put there', async () => {
    const { WorkbookSession } = await import('../../src/ui/model/session.ts');
    const { workbookOf } = await import('../../src/ui/templates/templateBuild.ts');
    const text = readFileSync(new URL('../../templates/cold-store.json', import.meta.url), 'utf8');
    const s = WorkbookSession.fromDoc(await workbookOf('cold-store', text));
    const filled = (await s.fillTypicalValues()).filled;
    expect(filled).toBeGreaterThan(0);
    const saved = join(tmp, 'filled.kvar.json');
    writeFileSync(saved, JSON.stringify(s.toDoc()));
    const xlsx = join(tmp, 'filled.xlsx');
    const r = await cli(exportRun, saved, xlsx);
    expect(r.code, r.err).toBe(0);
    // Nothing new was assumed, so nothing is listed; the page's marks travel to the xlsx.
    expect(r.err).not.toMatch(/assumed/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(readFileSync(xlsx) as unknown as ArrayBuffer);
    const cover = wb.worksheets[0]!.getSheetValues().flat().join('\n');
    expect(cover).toMatch(new RegExp(`${filled} value\\(s\\) are typical values assumed for blanks`));
  });
});

describe('kvar-ledger --assume-typical on a feeder cable', () => {
  // An invented list: a 400 V feeder with R but no X. Typical X at 0.4 kV: 0.08 Ω/km (common
  // practice, from memory). Through 0.2 km at 294.1 kVA (I = 424.5 A): 3·I²·X·len = 8.65 kvar.
  const feederList =
    'Tag,Bus,Kind,to_bus,u_kv,r_ohm_km,len_km,p_kw,cos_phi\n' +
    'F1,LV,feeder,DB1,0.4,0.0991,0.2,,\n' +
    'P1,DB1,load,,0.4,,,250,0.85\n';
  const feederFile = join(tmp, 'feeder.csv');
  writeFileSync(feederFile, feederList);

  it('assumes the cable reactance by voltage, says so, and counts its I²X', async () => {
    const text = await cli(balanceRun, feederFile, '--assume-typical');
    expect(text.code, text.err).toBe(0);
    expect(text.err).toMatch(
      /Feeders row 2 \(F1\): x_ohm_km = 0\.08 \(0\.4 kV cable; typical cable reactance by voltage/,
    );
    const r = await cli(balanceRun, feederFile, '--assume-typical', '--json');
    const j = JSON.parse(r.out) as { root: { q_kvar: number }; assumed: AssumedJson[] };
    expect(j.assumed).toEqual([
      expect.objectContaining({ sheet: 'Feeders', field: 'x_ohm_km', value: 0.08 }),
    ]);
    const s = 250 / 0.85;
    const amps = (s * 1000) / (Math.sqrt(3) * 400);
    const i2x = (3 * amps ** 2 * 0.08 * 0.2) / 1000;
    const qLoad = 250 * Math.tan(Math.acos(0.85));
    // No capacitance is given, so the feeder delivers no charging.
    expect(j.root.q_kvar).toBeCloseTo(qLoad + i2x, 6);
  });
});

describe('kvar-ledger --assume-typical on an overhead line', () => {
  // An invented list: a 20 kV line of 240 mm² aluminium with L and C blank, feeding 8 MVA over
  // 5 km. Typical 20 kV line: 1.1 mH/km and 10.5 nF/km (common practice, from memory). By hand:
  // I = 230.9 A; 3·I²·(2π·50·1.1e-3)·5 = 276.5 kvar absorbed, ω·C·U²·len = 6.6 kvar delivered.
  const lineList =
    'Tag,Bus,Kind,to_bus,u_kv,al_mm2,l_mh_km,c_nf_km,len_km,p_kw,cos_phi\n' +
    'L1,MV,line,FAR,20,240,,,5,,\n' +
    'X1,FAR,load,,20,,,,,6400,0.8\n';
  const lineFile = join(tmp, 'line.csv');
  writeFileSync(lineFile, lineList);

  it('assumes L and C by voltage, says so, and counts the line I²X and charging', async () => {
    const text = await cli(balanceRun, lineFile, '--assume-typical');
    expect(text.code, text.err).toBe(0);
    expect(text.err).toMatch(
      /Lines row 2 \(L1\): l_mh_km = 1\.1 \(20 kV single-circuit overhead line; typical overhead line L and C/,
    );
    const r = await cli(balanceRun, lineFile, '--assume-typical', '--json');
    const j = JSON.parse(r.out) as { root: { q_kvar: number }; assumed: AssumedJson[] };
    expect(j.assumed.map((a) => [a.sheet, a.field, a.value])).toEqual([
      ['Lines', 'l_mh_km', 1.1],
      ['Lines', 'c_nf_km', 10.5],
    ]);
    const amps = 8000 / (Math.sqrt(3) * 20);
    const i2x = (3 * amps ** 2 * (2 * Math.PI * 50 * 1.1e-3) * 5) / 1000;
    const charging = (2 * Math.PI * 50 * 10.5e-9 * 20_000 ** 2 * 5) / 1000;
    expect(j.root.q_kvar).toBeCloseTo(4800 + i2x - charging, 6);
  });
});
