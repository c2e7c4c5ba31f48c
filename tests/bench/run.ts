// `npm run bench`: every size through its phases (each a child process under a time budget),
// the command line as a process, the peer, the page; then results.json and results.md.
// Site generation, file writing and set-up are never timed. Progress goes to stderr.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { SHEETS } from '../../src/core/workbook/layout.ts';
import { measureBrowser } from './browser.ts';
import { compileWorker, notRun, runPhaseInChild } from './child.ts';
import { compileCli, measureCliBalance, measureCliExport, measureCliStart } from './cliProcess.ts';
import { describeMachine } from './machine.ts';
import { makePeer, measurePeer, measureStartup, soffice, type Peer } from './peer.ts';
import { workFiles, type PhaseName } from './phases.ts';
import { STEP_NAMES, type BrowserResult, type MemoryResult, type StepResult } from './record.ts';
import { renderMarkdown, formatMs, type BenchResults } from './report.ts';
import { parseOptions, sizeLabel, TARGET_ROWS, type BenchSize } from './sizes.ts';
import type { RootTotals } from './workbookView.ts';

const HERE = fileURLToPath(new URL('.', import.meta.url));
const say = (s: string) => process.stderr.write(s + '\n');

function show(r: StepResult): void {
  const how =
    r.cpuMs !== undefined ? `fastest of ${r.runs}, CPU ${formatMs(r.cpuMs)} ms` : `median of ${r.runs}`;
  const what =
    r.status === 'ok' && r.ms !== undefined
      ? `${formatMs(r.ms)} ms${r.runs && r.runs > 1 ? ` (${how})` : ''}`
      : `${r.status}${r.note ? `: ${r.note}` : ''}`;
  const check = r.check ? (r.check.agrees ? ' — agrees' : ` — DIFFERS: ${r.check.detail}`) : '';
  say(`  ${STEP_NAMES[r.step]}: ${what}${check}`);
}

/** 1-based position of the Buses sheet in the exported file: the cover comes first, then the workbook's sheets. */
function busesSheetInFile(portableFile: string): number {
  const doc = JSON.parse(readFileSync(portableFile, 'utf8')) as WorkbookDoc;
  return 2 + doc.sheets.findIndex((s) => s.name === SHEETS.buses);
}

async function runSize(
  size: BenchSize,
  workDir: string,
  peer: { peer: Peer; startup: StepResult } | undefined,
  cli: boolean,
  steps: StepResult[],
  memory: MemoryResult[],
) {
  say(`${sizeLabel(size)}`);
  const files = workFiles(workDir, size.rows);
  const phase = async (name: PhaseName, needs: string | undefined, why: string) => {
    const out =
      needs !== undefined && !existsSync(needs)
        ? { results: notRun(name, size.rows, why) }
        : await runPhaseInChild(name, size, workDir, size.budget[name]);
    out.results.forEach(show);
    steps.push(...out.results);
    if ('memory' in out && out.memory) memory.push(out.memory);
  };
  await phase('core', undefined, '');
  await phase('engine', files.live, 'not run: buildWorkbook (live) did not finish');
  await phase('edits', files.live, 'not run: buildWorkbook (live) did not finish');
  await phase('model', files.live, 'not run: buildWorkbook (live) did not finish');
  await phase('xlsx', files.xlsx, 'not run: the xlsx export (engine phase) did not finish');
  const roots = existsSync(files.roots)
    ? (JSON.parse(readFileSync(files.roots, 'utf8')) as RootTotals & { cases: string[] })
    : undefined;
  const add = (r: StepResult) => (show(r), steps.push(r));
  if (!cli) add({ step: 'cliBalance', rows: size.rows, status: 'not run', note: '--no-cli' });
  else if (!roots)
    add({ step: 'cliBalance', rows: size.rows, status: 'not run', note: 'the core phase did not finish' });
  else add(measureCliBalance(files.site, roots, size.rows, size.budget.cli));
  if (!cli) add({ step: 'cliExport', rows: size.rows, status: 'not run', note: '--no-cli' });
  else if (!existsSync(files.site))
    add({ step: 'cliExport', rows: size.rows, status: 'not run', note: 'the core phase did not finish' });
  else
    add(
      measureCliExport(files.site, join(workDir, `cli-${size.rows}.xlsx`), size.rows, size.budget.cliExport),
    );
  if (!peer) {
    for (const step of ['peerGross', 'peerRecalc'] as const)
      add({ step, rows: size.rows, status: 'not run', note: 'LibreOffice not measured in this run' });
  } else if (!roots || !existsSync(files.xlsx)) {
    for (const step of ['peerGross', 'peerRecalc'] as const)
      add({
        step,
        rows: size.rows,
        status: 'not available',
        note: 'no exported workbook of this size (see xlsx export)',
      });
  } else {
    measurePeer(
      peer.peer,
      files.xlsx,
      busesSheetInFile(files.portable),
      roots,
      roots.cases[0] as string,
      peer.startup,
      size.rows,
      size.budget.peer,
    ).forEach(add);
  }
}

const BROWSER_BUDGET_S = 300;
const SMALL_PAGE_ROWS = 1_000;

/** The page part under a budget: a wait that never ends is reported, not waited for (main exits the process). */
function withBudget(p: Promise<BrowserResult>, seconds: number): Promise<BrowserResult> {
  return new Promise((resolve) => {
    const timer = setTimeout(
      () => resolve({ status: 'exceeded', note: `the page part exceeded ${seconds} s` }),
      seconds * 1_000,
    );
    void p.then((r) => {
      clearTimeout(timer);
      resolve(r);
    });
  });
}

async function main(): Promise<void> {
  const opts = parseOptions(process.argv.slice(2), HERE);
  const t0 = performance.now();
  const workDir = mkdtempSync(join(tmpdir(), 'kvar-bench-'));
  const lo = opts.peer ? soffice() : undefined;
  const machine = describeMachine(lo);
  say(
    `bench: ${machine.cpu}, ${machine.cores} cores, Node ${machine.node}, load ${machine.loadAverage.join(' ')}; work files in ${workDir}`,
  );
  const steps: StepResult[] = [];
  const memory: MemoryResult[] = [];
  let peer: { peer: Peer; startup: StepResult } | undefined;
  try {
    compileWorker();
    if (opts.cli) {
      compileCli();
      const r = measureCliStart(0);
      show(r);
      steps.push(r);
    }
    if (opts.peer && !lo)
      steps.push({
        step: 'peerStartup',
        rows: 0,
        status: 'not available',
        note: 'soffice (LibreOffice) is not installed',
      });
    else if (opts.peer) {
      const p = makePeer(workDir);
      const s = await measureStartup(p);
      show(s.result);
      steps.push(s.result);
      if (s.result.status === 'ok' && s.result.ms !== undefined) peer = { peer: p, startup: s.result };
    }
    for (const size of opts.sizes) await runSize(size, workDir, peer, opts.cli, steps, memory);
    const pageAt = async (rows: number): Promise<BrowserResult> => {
      const live = workFiles(workDir, rows).live;
      const result: BrowserResult = !opts.browser
        ? { status: 'not run', note: '--no-browser' }
        : existsSync(live)
          ? await withBudget(measureBrowser(workDir, live, rows), BROWSER_BUDGET_S)
          : {
              status: 'not run',
              note: `the ${rows.toLocaleString('en-GB')}-row workbook was not built in this run`,
            };
      say(
        `page, ${rows.toLocaleString('en-GB')} rows: ${result.status}${result.note ? ` — ${result.note}` : ''}`,
      );
      return result;
    };
    // The page at the small size too: what an edit costs on a site most estimators open.
    const browserSmall = opts.sizes.some((s) => s.rows === SMALL_PAGE_ROWS)
      ? await pageAt(SMALL_PAGE_ROWS)
      : undefined;
    const browser = await pageAt(TARGET_ROWS);
    const results: BenchResults = {
      machine,
      sizes: opts.sizes.map(({ rows, buses }) => ({ rows, buses })),
      steps,
      memory,
      browser,
      ...(browserSmall ? { browserSmall } : {}),
      wallSeconds: (performance.now() - t0) / 1_000,
    };
    mkdirSync(opts.outDir, { recursive: true });
    writeFileSync(join(opts.outDir, 'results.json'), JSON.stringify(results, null, 1) + '\n');
    const md = renderMarkdown(results);
    writeFileSync(join(opts.outDir, 'results.md'), md + '\n');
    process.stdout.write(md + '\n');
  } finally {
    rmSync(workDir, { recursive: true, force: true });
  }
}

await main();
// A page part stopped by its budget may still hold the browser open; nothing else is pending.
process.exit(0);
