// results.json and results.md: every step per size with its ratio to the floor and to the peer,
// the targets of the 10,000-row site and whether each is met, memory, the page, the machine.
import type { Machine } from './machine.ts';
import { PHASES } from './phases.ts';
import { STEP_NAMES, type BrowserResult, type MemoryResult, type StepId, type StepResult } from './record.ts';
import { sizeLabel, TARGET_ROWS } from './sizes.ts';

/** The smaller site the issue also sets page and CLI targets for. */
const SMALL_ROWS = 1_000;
/** The child-process phase that builds the engine: its peak memory is the engine process's. */
const ENGINE_PHASE = 'engine';
/** The child that builds an engine and edits it, and does nothing else. */
const EDITS_PHASE = 'edits';

export interface BenchResults {
  readonly machine: Machine;
  readonly sizes: readonly { rows: number; buses: number }[];
  readonly steps: readonly StepResult[];
  readonly memory: readonly MemoryResult[];
  /** The page on the 10,000-row site (the targets' size). */
  readonly browser: BrowserResult;
  /** The page on the 1,000-row site, when that size was run. */
  readonly browserSmall?: BrowserResult;
  readonly wallSeconds: number;
}

export interface TargetOutcome {
  readonly what: string;
  readonly target: string;
  readonly measured: string;
  /** undefined = could not be measured. */
  readonly met?: boolean;
}

const find = (r: BenchResults, step: StepId, rows: number) =>
  r.steps.find((s) => s.step === step && s.rows === rows);
const okMs = (s: StepResult | undefined) => (s?.status === 'ok' && s.ms !== undefined ? s.ms : undefined);

export function formatMs(ms: number): string {
  if (ms < 10) return ms.toFixed(2);
  if (ms < 100) return ms.toFixed(1);
  return Math.round(ms).toLocaleString('en-GB');
}

function ratio(ms: number | undefined, base: number | undefined): string {
  if (ms === undefined || base === undefined || base <= 0) return '–';
  const x = ms / base;
  return x >= 100
    ? `×${Math.round(x).toLocaleString('en-GB')}`
    : x >= 10
      ? `×${x.toFixed(0)}`
      : `×${x.toFixed(2)}`;
}

function stepTarget(
  step: StepId,
): { text: string; test: (ms: number, r: BenchResults) => boolean | undefined } | undefined {
  const within = (limit: number) => ({
    text: `≤ ${limit.toLocaleString('en-GB')} ms`,
    test: (ms: number) => ms <= limit,
  });
  if (step === 'editOne') return within(20);
  if (step === 'modelEditOne') return within(20);
  if (step === 'modelInsertRow') return within(100);
  if (step === 'modelPaste500') return within(1_000);
  if (step === 'xlsxExport' || step === 'cliExport') return within(3_000);
  if (step === 'xlsxImport') return within(2_000);
  if (step === 'cliStart') return within(150);
  if (step === 'cliBalance') return within(800);
  return undefined;
}

/** The targets of the issue, for the 10,000-row / 300-bus site. */
export function targets(r: BenchResults): TargetOutcome[] {
  const out: TargetOutcome[] = [];
  const stepOutcome = (step: StepId, what: string) => {
    const s = find(r, step, step === 'cliStart' ? 0 : TARGET_ROWS);
    const t = stepTarget(step);
    if (!t) return;
    const ms = okMs(s);
    const met = ms === undefined ? undefined : t.test(ms, r);
    const measured =
      ms !== undefined
        ? `${formatMs(ms)} ms`
        : s
          ? `${s.status}${s.note ? `: ${s.note}` : ''}`
          : 'not measured';
    out.push({ what, target: t.text, measured, ...(met !== undefined ? { met } : {}) });
  };
  stepOutcome('editOne', 'One edit to updated bus totals, engine');
  stepOutcome('modelEditOne', "One typed edit to updated bus totals, page's model (engine + living model)");
  stepOutcome('modelInsertRow', "A row inserted with a motor typed in, page's model");
  stepOutcome('modelPaste500', "500 rows pasted at once, page's model");
  const page = (
    b: BrowserResult,
    what: string,
    target: string,
    value: number | undefined,
    unit: string,
    limit: number,
  ) =>
    out.push({
      what,
      target,
      measured:
        value !== undefined
          ? `${formatMs(value)} ${unit}`
          : b.status === 'ok'
            ? 'not measured in this run'
            : `${b.status}${b.note ? `: ${b.note}` : ''}`,
      ...(value !== undefined ? { met: value <= limit } : {}),
    });
  const b = r.browser;
  const small = r.browserSmall;
  // The issue's table: 10,000 rows / 300 buses, and the page at 1,000 rows / 30 buses.
  const limitText = (ms: number) => (ms >= 1_000 ? `≤ ${ms / 1_000} s` : `≤ ${ms} ms`);
  const bothSizes = (
    what: string,
    pick: (x: BrowserResult) => number | undefined,
    ms: number,
    smallMs: number,
  ) => {
    page(b, what, limitText(ms), pick(b), 'ms', ms);
    if (small) page(small, `${what}, 1,000 rows`, limitText(smallMs), pick(small), 'ms', smallMs);
  };
  bothSizes('Value edit to repainted bus total, page', (x) => x.editPaintMs, 50, 25);
  bothSizes(
    'Structural edit (motor row inserted) to repainted total, page',
    (x) => x.structuralPaintMs,
    150,
    50,
  );
  bothSizes('Open: navigation to a grid showing every value', (x) => x.openMs, 1_500, 1_000);
  bothSizes('Open: navigation to the first edit recalculated', (x) => x.firstEditMs, 3_000, 1_500);
  stepOutcome('xlsxExport', 'xlsx export, page (in-process)');
  stepOutcome('cliExport', 'xlsx export, CLI (whole process)');
  stepOutcome('xlsxImport', 'xlsx import');
  stepOutcome('cliStart', 'CLI start-up (whole process)');
  stepOutcome(
    'cliBalance',
    'CLI balance (whole process), beside LibreOffice recalculating the same workbook',
  );
  const cli = find(r, 'cliBalance', TARGET_ROWS);
  const peer = find(r, 'peerRecalc', TARGET_ROWS);
  const last = out[out.length - 1];
  if (last && okMs(cli) !== undefined && okMs(peer) !== undefined) {
    const cpu = (s: StepResult | undefined) => (s?.cpuMs !== undefined ? ` (CPU ${formatMs(s.cpuMs)})` : '');
    out[out.length - 1] = {
      ...last,
      measured: `${formatMs(cli?.ms as number)} ms${cpu(cli)}; peer ${formatMs(peer?.ms as number)} ms${cpu(peer)}`,
    };
  }
  const smallStep = (step: StepId, rows: number, what: string, limit: number) => {
    const ms = okMs(r.steps.find((s) => s.step === step && s.rows === rows));
    out.push({
      what,
      target: `≤ ${limit.toLocaleString('en-GB')} ms`,
      measured: ms !== undefined ? `${formatMs(ms)} ms` : 'not measured',
      ...(ms !== undefined ? { met: ms <= limit } : {}),
    });
  };
  smallStep('cliBalance', SMALL_ROWS, 'CLI balance (whole process), 1,000 rows', 400);
  smallStep('xlsxExport', SMALL_ROWS, 'xlsx export, page (in-process), 1,000 rows', 1_000);
  smallStep('cliExport', SMALL_ROWS, 'xlsx export, CLI (whole process), 1,000 rows', 1_000);
  smallStep('xlsxImport', SMALL_ROWS, 'xlsx import, 1,000 rows', 1_000);
  const floorTimes = (rows: number, label: string) => {
    const roll = okMs(r.steps.find((s) => s.step === 'rollup' && s.rows === rows));
    const floor = okMs(r.steps.find((s) => s.step === 'floor' && s.rows === rows));
    const x = roll !== undefined && floor !== undefined && floor > 0 ? roll / floor : undefined;
    out.push({
      what: `Core roll-up, all cases, against the floor${label}`,
      target: '≤ 20 × floor',
      measured: x !== undefined ? `${ratio(roll, floor)} (${formatMs(roll as number)} ms)` : 'not measured',
      ...(x !== undefined ? { met: x <= 20 } : {}),
    });
  };
  floorTimes(TARGET_ROWS, '');
  floorTimes(SMALL_ROWS, ', 1,000 rows');
  page(b, 'Page memory (JS heap used)', '≤ 150 MB', b.jsHeapUsedMb, 'MB', 150);
  // The engine's own process is the one that builds an engine and edits it; the engine phase's
  // child also writes the xlsx export, whose peak is the export's, given beside it.
  const held = r.memory.find((m) => m.rows === TARGET_ROWS && m.phase === EDITS_PHASE);
  const withExport = r.memory.find((m) => m.rows === TARGET_ROWS && m.phase === ENGINE_PHASE);
  out.push({
    what: 'Engine process memory (peak RSS: an engine built and edited)',
    target: '≤ 400 MB',
    measured: held
      ? `${Math.round(held.peakRssMb)} MB${withExport ? `; ${Math.round(withExport.peakRssMb)} MB with the xlsx export in the same process` : ''}`
      : 'not measured',
    ...(held ? { met: held.peakRssMb <= 400 } : {}),
  });
  bothSizes(
    'Scrolling the grid while an edit recalculates (longest frame)',
    (x) => x.scrollLongestFrameMs,
    50,
    50,
  );
  return out;
}

const ORDER: readonly StepId[] = [
  'floor',
  'rollup',
  'buildLive',
  'buildPortable',
  'engineBuild',
  'editOne',
  'editBatch',
  'modelOpen',
  'modelEditOne',
  'modelInsertRow',
  'modelPaste500',
  'xlsxExport',
  'xlsxImport',
  'cliStart',
  'cliBalance',
  'cliExport',
  'peerStartup',
  'peerGross',
  'peerRecalc',
];

function cellOf(s: StepResult | undefined): string {
  if (!s) return 'not measured';
  if (s.status === 'ok' && s.ms !== undefined) return formatMs(s.ms);
  return s.status;
}

const mark = (met: boolean | undefined) => (met === undefined ? 'not measured' : met ? 'yes' : '**no**');

export function renderMarkdown(r: BenchResults): string {
  const m = r.machine;
  const lines: string[] = [];
  lines.push('# Kvar Ledger benchmark results', '');
  lines.push(
    `Generated by \`npm run bench\` on ${m.date.slice(0, 10)}. Benchmarks, not tests: the figures vary with the machine and its load.`,
    '',
  );
  lines.push(
    `Machine: ${m.cpu}, ${m.cores} cores, ${m.memoryGb} GB; ${m.os}; Node ${m.node}${m.libreoffice ? `; ${m.libreoffice}` : ''}. ` +
      `Load average at the start: ${m.loadAverage.join(', ')} (the machine is shared). Whole bench: ${Math.round(r.wallSeconds)} s.`,
    '',
  );
  lines.push(
    'Sites are invented (tests/bench/generateSite.ts): ' +
      r.sizes.map(sizeLabel).join('; ') +
      '. ' +
      'Floor = a typed-array loop computing the same bus totals (tests/bench/floor.ts). Peer = LibreOffice recalculating the exported workbook headless, net of its start-up. ' +
      'ms = median of several runs for fast steps, one run for slow ones; whole processes (CLI, LibreOffice) give their fastest run and their CPU time (user + system). ' +
      "Steps inside a bench process give the CPU time of that process over the same run(s) (every thread, the garbage collector's included, so it can exceed ms); ms well above CPU ms means the step waited for a busy machine. " +
      "Check = the step's root P and Q agree with the floor (1e-9 relative).",
    '',
  );

  lines.push(
    '## Targets (10,000 rows / 300 buses)',
    '',
    '| What | Target | Measured | Met |',
    '|---|---|---|---|',
  );
  for (const t of targets(r)) lines.push(`| ${t.what} | ${t.target} | ${t.measured} | ${mark(t.met)} |`);
  lines.push('');

  lines.push(
    '## Steps',
    '',
    '| Step | Size | ms | CPU ms | × floor | × peer | Target | Met | Check |',
    '|---|---|--:|--:|--:|--:|---|---|---|',
  );
  for (const step of ORDER) {
    // Start-ups do not depend on the site: one row, measured once.
    const once = step === 'peerStartup' || step === 'cliStart';
    for (const size of once ? r.sizes.slice(0, 1) : r.sizes) {
      const s = find(r, step, once ? 0 : size.rows);
      const ms = okMs(s);
      const floor = once ? undefined : okMs(find(r, 'floor', size.rows));
      const peer = once ? undefined : okMs(find(r, 'peerRecalc', size.rows));
      const t = size.rows === TARGET_ROWS ? stepTarget(step) : undefined;
      const met = t && ms !== undefined ? t.test(ms, r) : undefined;
      const check = s?.check ? (s.check.agrees ? 'agrees' : '**differs**') : '';
      const sizeText = once
        ? 'any'
        : `${size.rows.toLocaleString('en-GB')} / ${size.buses.toLocaleString('en-GB')}`;
      const cpu = s?.cpuMs !== undefined ? formatMs(s.cpuMs) : '';
      lines.push(
        `| ${STEP_NAMES[step]} | ${sizeText} | ${cellOf(s)} | ${cpu} | ${ratio(ms, floor)} | ${ratio(ms, peer)} | ${t?.text ?? ''} | ${t ? mark(met) : ''} | ${check} |`,
      );
    }
  }
  lines.push('');

  lines.push(
    '## Peak memory (resident set, MB, per child process)',
    '',
    "The engine process also runs the xlsx export (from its engine); the edits process builds an engine of its own and edits it; the model process is the page's model; the xlsx process runs the import.",
    '',
    '| Size | ' + PHASES.join(' | ') + ' |',
    '|---|' + PHASES.map(() => '--:|').join(''),
  );
  for (const size of r.sizes) {
    const cells = PHASES.map((phase) => {
      const mem = r.memory.find((x) => x.rows === size.rows && x.phase === phase);
      return mem
        ? `${Math.round(mem.peakRssMb).toLocaleString('en-GB')}${mem.complete ? '' : ' (stopped; at least)'}`
        : '–';
    });
    lines.push(`| ${sizeLabel(size)} | ${cells.join(' | ')} |`);
  }
  lines.push('');

  lines.push('## Page (headless Chromium)', '');
  const pages = [r.browserSmall, r.browser].filter((x): x is BrowserResult => x !== undefined);
  for (const b of pages)
    if (b.status !== 'ok')
      lines.push(
        `Not measured${b.rows ? ` at ${b.rows.toLocaleString('en-GB')} rows` : ''}: ${b.status}${b.note ? ` — ${b.note}` : ''}.`,
        '',
      );
  const kb = (n: number | undefined) => (n === undefined ? '–' : `${(n / 1024).toFixed(0)} KB`);
  const ms = (n: number | undefined) => (n !== undefined ? formatMs(n) : '–');
  const row = (what: string, cell: (b: BrowserResult) => string) =>
    lines.push(`| ${what} | ${pages.map(cell).join(' | ')} |`);
  lines.push(
    `| What | ${pages.map((b) => (b.rows ? `${b.rows.toLocaleString('en-GB')} rows` : '–')).join(' | ')} |`,
    `|---|${pages.map(() => '--:').join('|')}|`,
  );
  row('Navigation to interactive grid (ms)', (b) => ms(b.openMs));
  row(
    'Edit to repainted bus total (ms, median)',
    (b) => `${ms(b.editPaintMs)} (${b.editPaintRuns ?? 0} edits)`,
  );
  row('Structural edit: insert a row + fill a motor into it, to repainted total (ms)', (b) =>
    ms(b.structuralPaintMs),
  );
  row('Navigation to the first edit recalculated (ms)', (b) => ms(b.firstEditMs));
  row('Longest frame while scrolling during an edit (ms)', (b) => ms(b.scrollLongestFrameMs));
  row('JS heap used (MB)', (b) => (b.jsHeapUsedMb !== undefined ? b.jsHeapUsedMb.toFixed(0) : '–'));
  row('Initial JavaScript (raw / gzip)', (b) => `${kb(b.initialJsBytes)} / ${kb(b.initialJsGzipBytes)}`);
  row('Check', (b) => (b.check ? `${b.check.agrees ? 'agrees' : '**differs**'}: ${b.check.detail}` : '–'));
  row('Notes', (b) => (b.status === 'ok' && b.note ? b.note : '–'));
  lines.push('');

  const notes = r.steps.filter((s) => s.note && (s.status !== 'ok' || s.check?.agrees === false));
  if (notes.length > 0) {
    lines.push('## Steps without a figure, and checks that failed', '');
    for (const s of notes)
      lines.push(
        `- ${STEP_NAMES[s.step]}, ${s.rows ? `${s.rows.toLocaleString('en-GB')} rows` : 'any size'}: ${s.status}${s.note ? ` — ${s.note}` : ''}${s.check && !s.check.agrees ? ` — ${s.check.detail}` : ''}`,
      );
    lines.push('');
  }
  return lines.join('\n');
}
