// The command line as a whole process, the way a user runs it: `node src/cli/bin.mjs balance
// <site.json> --json` on the site written by writeSiteFile. Start-up alone (--version) is timed
// too, so the share of the time spent loading is visible. The printed root is checked.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { StepResult } from './record.ts';
import { compareRoots } from './steps.ts';
import { withChildCpu } from './childCpu.ts';
import type { RootTotals } from './workbookView.ts';

const REPO = fileURLToPath(new URL('../../', import.meta.url));
const BIN = 'src/cli/bin.mjs';

interface Run {
  readonly ms: number;
  readonly cpuMs?: number;
  readonly code: number | null;
  readonly stdout: string;
  readonly stderr: string;
  readonly timedOut: boolean;
}

/**
 * Compile the command line as `npm install` does (the `prepare` script), so the bench times the
 * JavaScript a user runs: bin.mjs falls back to compiling TypeScript at each start when any source
 * is newer than the compiled copy, as it is in a working tree between installs.
 */
export function compileCli(): void {
  const r = spawnSync(
    process.execPath,
    [join(REPO, 'node_modules/typescript/bin/tsc'), '-p', '.ci/tsconfig.cli.json'],
    {
      cwd: REPO,
      encoding: 'utf8',
    },
  );
  if (r.status !== 0) throw new Error(`compiling the command line failed: ${r.stdout}${r.stderr}`);
}

function runCli(args: readonly string[], budgetS: number): Run {
  const t0 = performance.now();
  const { value: r, cpuMs } = withChildCpu(() =>
    spawnSync(process.execPath, [BIN, ...args], {
      cwd: REPO,
      encoding: 'utf8',
      timeout: budgetS * 1_000,
      killSignal: 'SIGKILL',
      maxBuffer: 512 * 1024 * 1024,
    }),
  );
  const ms = performance.now() - t0;
  const timedOut = (r.error as NodeJS.ErrnoException | undefined)?.code === 'ETIMEDOUT';
  return {
    ms,
    ...(cpuMs !== undefined ? { cpuMs } : {}),
    code: r.status,
    stdout: r.stdout ?? '',
    stderr: r.stderr ?? '',
    timedOut,
  };
}

/** Up to `runs` runs while the total stays under a third of the budget; the fastest is reported (the machine is shared). */
function repeat(args: readonly string[], budgetS: number, runs: number): { runs: Run[]; failed?: Run } {
  const done: Run[] = [];
  let spent = 0;
  while (done.length < runs && (done.length === 0 || spent < (budgetS * 1_000) / 3)) {
    const r = runCli(args, budgetS);
    if (r.timedOut || r.code !== 0) return { runs: done, failed: r };
    done.push(r);
    spent += r.ms;
  }
  return { runs: done };
}

/** Fastest wall time, its spread, and the least CPU time over the runs. */
function timing(runs: readonly Run[]) {
  const ms = runs.map((x) => x.ms);
  const cpu = runs.map((x) => x.cpuMs).filter((x): x is number => x !== undefined);
  return {
    ms: Math.min(...ms),
    minMs: Math.min(...ms),
    runs: ms.length,
    ...(cpu.length > 0 ? { cpuMs: Math.min(...cpu) } : {}),
  };
}

const failure = (r: Run, budgetS: number) =>
  r.timedOut
    ? { status: 'exceeded' as const, note: `exceeded ${budgetS} s` }
    : { status: 'failed' as const, note: `exit ${r.code}: ${r.stderr.trim().split('\n')[0] ?? ''}` };

export function measureCliStart(rows: number): StepResult {
  const r = repeat(['--version'], 30, 3);
  if (r.failed) return { step: 'cliStart', rows, ...failure(r.failed, 30) };
  return {
    step: 'cliStart',
    rows,
    status: 'ok',
    ...timing(r.runs),
    note: `node + tsx loader + argument parsing; wall of ${r.runs.map((x) => Math.round(x.ms)).join(', ')} ms`,
  };
}

/** The CLI's export as a user runs it: site file in, xlsx out (it builds both flavours and an engine itself). */
export function measureCliExport(
  siteFile: string,
  outFile: string,
  rows: number,
  budgetS: number,
): StepResult {
  const r = repeat(['export', siteFile, outFile], budgetS, 1);
  if (r.failed) return { step: 'cliExport', rows, ...failure(r.failed, budgetS) };
  return {
    step: 'cliExport',
    rows,
    status: 'ok',
    ...timing(r.runs),
    note: 'site file to xlsx: start-up, both workbook flavours, engine over the live one, export, file written; one run',
  };
}

export function measureCliBalance(
  siteFile: string,
  floor: RootTotals,
  rows: number,
  budgetS: number,
): StepResult {
  const r = repeat(['balance', siteFile, '--json'], budgetS, 3);
  if (r.failed) return { step: 'cliBalance', rows, ...failure(r.failed, budgetS) };
  const last = r.runs[r.runs.length - 1] as Run;
  let check;
  try {
    const out = JSON.parse(last.stdout) as { root: { bus: string; p_kw: number; q_kvar: number } };
    check = compareRoots(
      { bus: out.root.bus, p: [out.root.p_kw], q: [out.root.q_kvar] },
      { bus: floor.bus, p: floor.p.slice(0, 1), q: floor.q.slice(0, 1) },
      'floor',
    );
  } catch (e) {
    check = {
      agrees: false,
      detail: `the output is not the expected JSON: ${e instanceof Error ? e.message : String(e)}`,
    };
  }
  return {
    step: 'cliBalance',
    rows,
    status: 'ok',
    ...timing(r.runs),
    note: `first case, compensation designed over all cases; wall of ${r.runs.map((x) => Math.round(x.ms)).join(', ')} ms`,
    check,
  };
}
