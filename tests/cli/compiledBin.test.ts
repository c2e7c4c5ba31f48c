// The package bin runs the CLI compiled at install (node_modules/.kvar-ledger-cli, `npm run build:cli`, the `prepare`
// script) and falls back to the TypeScript sources when they are newer: both must print the same
// figures. The compiled copy is brought up to date first if a source changed since it was made.
import { execFile, execFileSync } from 'node:child_process';
import { existsSync, readdirSync, renameSync, rmSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const BIN = `${ROOT}src/cli/bin.mjs`;
const COMPILED = `${ROOT}node_modules/.kvar-ledger-cli/cli/main.js`;

function newest(dir: string): number {
  return Math.max(
    0,
    ...readdirSync(dir, { withFileTypes: true }).map((e) =>
      e.isDirectory()
        ? newest(`${dir}/${e.name}`)
        : e.name.endsWith('.ts')
          ? statSync(`${dir}/${e.name}`).mtimeMs
          : 0,
    ),
  );
}

function run(args: string[], fromSource: boolean): Promise<{ code: number; stdout: string; stderr: string }> {
  const env = { ...process.env, KVAR_LEDGER_FROM_SOURCE: fromSource ? '1' : '0' };
  return new Promise((resolve) => {
    execFile(process.execPath, [BIN, ...args], { cwd: ROOT, env }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : 1) : 0, stdout, stderr });
    });
  });
}

describe('the compiled command line', () => {
  beforeAll(() => {
    if (existsSync(COMPILED) && statSync(COMPILED).mtimeMs >= newest(`${ROOT}src`)) return;
    // Built aside and moved in at once: other test files run the bin meanwhile.
    const aside = `${ROOT}node_modules/.kvar-ledger-cli-${process.pid}`;
    execFileSync(
      process.execPath,
      [`${ROOT}node_modules/typescript/bin/tsc`, '-p', '.ci/tsconfig.cli.json', '--outDir', aside],
      { cwd: ROOT },
    );
    rmSync(`${ROOT}node_modules/.kvar-ledger-cli`, { recursive: true, force: true });
    renameSync(aside, `${ROOT}node_modules/.kvar-ledger-cli`);
  }, 120_000);

  it('exists after install and is not older than the sources', () => {
    expect(existsSync(COMPILED)).toBe(true);
    expect(statSync(COMPILED).mtimeMs).toBeGreaterThanOrEqual(newest(`${ROOT}src`));
  });

  for (const args of [
    ['--version'],
    ['balance', 'templates/pumping-station.json', '--json'],
    ['quote', 'templates/pumping-station.json'],
    ['balance', 'README.md'],
  ]) {
    it(`prints what the sources print: ${args.join(' ')}`, async () => {
      const [compiled, source] = await Promise.all([run(args, false), run(args, true)]);
      expect(compiled).toEqual(source);
      expect(compiled.stdout.length + compiled.stderr.length).toBeGreaterThan(10);
    });
  }
});
