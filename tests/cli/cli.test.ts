// The CLI as a user runs it: a separate process through the package bin (no build step).
import { execFile } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { CATALOGUE } from '../../src/core/functions/index.ts';
import type { FunctionReference } from '../../src/io/formula/reference.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as {
  bin: Record<string, string>;
};
const BIN = pkg.bin['kvar-ledger'] as string;

interface Run {
  code: number;
  stdout: string;
  stderr: string;
}

function cli(...args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(process.execPath, [BIN, ...args], { cwd: ROOT }, (error, stdout, stderr) => {
      const code = error ? (typeof error.code === 'number' ? error.code : 1) : 0;
      resolve({ code, stdout, stderr });
    });
  });
}

describe('kvar-ledger eval', () => {
  it('--json gives a value and an error with our message; an error value exits 1', async () => {
    const r = await cli('eval', '=KVAR.MOTOR(75,0.95,0.86)', '=KVAR.LOAD(50,1.2)', '--json');
    expect(r.stderr).toBe('kvar-ledger eval: 1 of 2 formulas gives an error value (shown above)\n');
    expect(r.code).toBe(1);
    const out = JSON.parse(r.stdout) as Array<Record<string, unknown>>;
    // At full load Q = Qr = P_out/η · tan(acos cos φ) (KVAR.MOTOR in FUNCTIONS.md).
    const qr = (75 / 0.95) * (Math.sqrt(1 - 0.86 ** 2) / 0.86);
    expect(out).toEqual([
      { formula: '=KVAR.MOTOR(75,0.95,0.86)', value: expect.closeTo(qr, 10) },
      {
        formula: '=KVAR.LOAD(50,1.2)',
        error: '#N/A',
        message: 'KVAR.LOAD: argument 2 (cos_phi) must be in (0, 1]; got 1.2',
      },
    ]);
  });

  it('prints one line per formula without --json; "=" may be left out', async () => {
    const r = await cli('eval', 'KVA.TOTAL(300,400)', '=TANPHI(0,1)', '=KVAR.LOAD(400,0.8,TRUE)');
    expect(r.code).toBe(1);
    const ok = await cli('eval', 'KVA.TOTAL(300,400)');
    expect(ok).toEqual({ code: 0, stdout: 'KVA.TOTAL(300,400) → 500\n', stderr: '' });
    const lines = r.stdout.trimEnd().split('\n');
    expect(lines[0]).toBe('KVA.TOTAL(300,400) → 500');
    expect(lines[1]).toBe('=TANPHI(0,1) → #N/A TANPHI: argument 1 (p_kw) must not be 0; got 0');
    expect(lines[2]).toMatch(
      /^=KVAR\.LOAD\(400,0\.8,TRUE\) → -300(\.0+\d*|)$|^=KVAR\.LOAD\(400,0\.8,TRUE\) → -299\.99999/,
    );
  });

  it('exits 2 on a wrong command line and 1 on an unreadable formula, saying what and where', async () => {
    const [badOption, none, parse, both, unknown] = await Promise.all([
      cli('eval', '--jsn', '=1'),
      cli('eval', '--json'),
      cli('eval', '=1', '=KVA.TOTAL(3,'),
      cli('functions', '--json', '--md'),
      cli('tally'),
    ]);
    expect(badOption).toMatchObject({ code: 2, stdout: '' });
    expect(badOption.stderr).toContain('eval: unknown option --jsn (argument 1); allowed: --json, --help');
    expect(none).toMatchObject({ code: 2, stdout: '' });
    expect(none.stderr).toContain('eval: no formula given');
    expect(parse).toMatchObject({ code: 1, stdout: '' });
    expect(parse.stderr).toContain(
      'eval: formula 2 (=KVA.TOTAL(3,): the formula ends too early (after character 13)',
    );
    expect(both).toMatchObject({ code: 2, stdout: '' });
    expect(both.stderr).toContain('give either --json or --md, not both');
    expect(unknown).toMatchObject({ code: 2, stdout: '' });
    expect(unknown.stderr).toContain('unknown command "tally"; commands: eval, functions');
  });
});

describe('kvar-ledger eval and ";"', () => {
  it('reads ";" between arguments as "," when no "," is anywhere, and explains it otherwise', async () => {
    const ok = await cli('eval', '=KVA.TOTAL(300;400)');
    expect(ok).toEqual({ code: 0, stdout: '=KVA.TOTAL(300;400) → 500\n', stderr: '' });
    const mixed = await cli('eval', '=KVAR.LOAD(50;0,9)');
    expect(mixed.code).toBe(1);
    expect(mixed.stderr).toBe(
      'kvar-ledger eval: formula 1 (=KVAR.LOAD(50;0,9)): ";" at character 14 is not read here: arguments are separated by "," and decimals written with "." (as in spreadsheet programs set to English: SUM(1,2.5), not SUM(1;2,5))\n',
    );
  });
});

describe('the package bin', () => {
  it("npx runs the project's own bin from the repository root (offline: never fetched)", async () => {
    const r = await new Promise<Run>((done) => {
      execFile(
        'npx',
        ['--offline', 'kvar-ledger', 'eval', '=KVA.TOTAL(300,400)', '--json'],
        { cwd: ROOT },
        (error, stdout, stderr) => {
          done({ code: error ? 1 : 0, stdout, stderr });
        },
      );
    });
    expect(r.code, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout)).toEqual([{ formula: '=KVA.TOTAL(300,400)', value: 500 }]);
  });
});

describe('kvar-ledger functions', () => {
  it('--json lists every catalogue function with units, domains, defaults and sources', async () => {
    const r = await cli('functions', '--json');
    expect(r.code).toBe(0);
    const refs = JSON.parse(r.stdout) as FunctionReference[];
    expect(refs.map((f) => f.name)).toEqual(CATALOGUE.map((f) => f.name));
    for (const [i, ref] of refs.entries()) {
      const spec = CATALOGUE[i];
      if (!spec) throw new Error('catalogue shorter than the listing');
      expect(ref.signature.startsWith(`${spec.name}(`)).toBe(true);
      expect(ref.result.unit).toBe(spec.result.unit);
      expect(ref.source).toEqual({ kind: spec.source.kind, ref: spec.source.ref });
      expect(ref.source.ref.length).toBeGreaterThan(5);
      expect(ref.params.map((p) => [p.name, p.unit])).toEqual(spec.params.map((p) => [p.name, p.unit]));
      for (const p of ref.params) expect(p.allowed.length).toBeGreaterThan(0);
    }
    const motor = refs.find((f) => f.name === 'KVAR.MOTOR');
    expect(motor).toBeDefined();
    if (motor) {
      expect(motor.signature).toBe('KVAR.MOTOR(p_out_kw, eff, cos_phi, [load=1], [i0_pct])');
      expect(motor.params[1]).toMatchObject({ name: 'eff', allowed: '(0, 1]', optional: false });
      expect(motor.params[3]).toMatchObject({
        name: 'load',
        allowed: '[0, 1.5]',
        optional: true,
        default: '1',
      });
    }
  });

  it('--md is the committed FUNCTIONS.md, whose first line says how it is generated', async () => {
    const r = await cli('functions', '--md');
    expect(r.code).toBe(0);
    const first = r.stdout.split('\n')[0];
    expect(first).toContain('Generated by `npm run functions:md`');
    for (const f of CATALOGUE) expect(r.stdout).toContain(`### ${f.name}\n`);
    const committed = readFileSync(new URL('../../FUNCTIONS.md', import.meta.url), 'utf8');
    expect(committed, 'FUNCTIONS.md is out of date: run `npm run functions:md`').toBe(r.stdout);
  });
});
