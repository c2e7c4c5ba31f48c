// Running one phase in a child process under a time budget. Whatever the child reported before
// it ended counts; the step it was in when the budget ran out is "exceeded N s" and the steps it
// never reached are "not run". The child is ended by its own handle, nothing broader.
//
// The child runs the sources compiled by tsc, as the command line does (and as the page runs
// what vite built), not through the tsx loader: tsx keeps every function's name by wrapping each
// closure as it is created, which cost about a quarter of the core roll-up's time and timed code
// no user runs.
import { spawn, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { MESSAGE_PREFIX, PHASE_STEPS, type PhaseMessage, type PhaseName } from './phases.ts';
import { STEP_NAMES, type MemoryResult, type StepId, type StepResult } from './record.ts';

const REPO = fileURLToPath(new URL('../../', import.meta.url));
/** Where .ci/tsconfig.bench.json writes the compiled phase worker and the sources it imports. */
const WORKER = join(REPO, 'node_modules/.kvar-ledger-bench/tests/bench/worker.js');

/** Compile the phase worker (and the sources it imports) with tsc; throws with tsc's output when it fails. */
export function compileWorker(): void {
  const r = spawnSync(
    process.execPath,
    [join(REPO, 'node_modules/typescript/bin/tsc'), '-p', '.ci/tsconfig.bench.json'],
    { cwd: REPO, encoding: 'utf8' },
  );
  if (r.status !== 0) throw new Error(`compiling the bench's phase worker failed: ${r.stdout}${r.stderr}`);
}

export interface PhaseOutcome {
  readonly results: StepResult[];
  readonly memory?: MemoryResult;
  readonly wallMs: number;
}

export function notRun(phase: PhaseName, rows: number, why: string): StepResult[] {
  return PHASE_STEPS[phase].map((step) => ({ step, rows, status: 'not run' as const, note: why }));
}

export function runPhaseInChild(
  phase: PhaseName,
  size: { rows: number; buses: number },
  workDir: string,
  budgetS: number,
): Promise<PhaseOutcome> {
  const t0 = performance.now();
  const child = spawn(
    process.execPath,
    ['--max-old-space-size=12288', WORKER, phase, String(size.rows), String(size.buses), workDir],
    {
      cwd: REPO,
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  const results: StepResult[] = [];
  let current: StepId | undefined;
  let peak: number | undefined;
  let stderr = '';
  let pending = '';
  let timedOut = false;
  const onMessage = (m: PhaseMessage) => {
    if (m.type === 'start') current = m.step;
    else if (m.type === 'result') {
      results.push(m.result);
      current = undefined;
    } else peak = Math.max(peak ?? 0, m.peakRssMb);
  };
  child.stdout.setEncoding('utf8').on('data', (chunk: string) => {
    pending += chunk;
    let nl: number;
    while ((nl = pending.indexOf('\n')) >= 0) {
      const line = pending.slice(0, nl);
      pending = pending.slice(nl + 1);
      if (line.startsWith(MESSAGE_PREFIX))
        onMessage(JSON.parse(line.slice(MESSAGE_PREFIX.length)) as PhaseMessage);
    }
  });
  child.stderr.setEncoding('utf8').on('data', (chunk: string) => {
    stderr = (stderr + chunk).slice(-4_000);
  });
  const timer = setTimeout(() => {
    timedOut = true;
    child.kill('SIGKILL');
  }, budgetS * 1_000);

  return new Promise((resolve) => {
    child.on('close', (code) => {
      clearTimeout(timer);
      const wallMs = performance.now() - t0;
      const reached = new Set(results.map((r) => r.step));
      const lastError =
        stderr
          .trim()
          .split('\n')
          .filter((l) => /error/i.test(l))
          .slice(-1)[0] ??
        stderr.trim().split('\n').slice(-1)[0] ??
        '';
      const stopped = timedOut
        ? `exceeded ${budgetS} s`
        : code !== 0
          ? `failed (exit ${code}): ${lastError}`
          : undefined;
      if (current !== undefined && stopped !== undefined) {
        results.push({
          step: current,
          rows: size.rows,
          status: timedOut ? 'exceeded' : 'failed',
          note: timedOut
            ? `stopped: the ${phase} phase's budget of ${budgetS} s ran out in this step`
            : stopped,
        });
        reached.add(current);
      }
      for (const step of PHASE_STEPS[phase]) {
        if (reached.has(step)) continue;
        const why = stopped
          ? `not reached: ${current ? STEP_NAMES[current] : 'the phase'} ${stopped}`
          : 'the phase ended without this step';
        results.push({ step, rows: size.rows, status: 'not run', note: why });
      }
      const memory =
        peak === undefined
          ? undefined
          : { rows: size.rows, phase, peakRssMb: peak, complete: stopped === undefined };
      resolve({ results, ...(memory ? { memory } : {}), wallMs });
    });
  });
}
