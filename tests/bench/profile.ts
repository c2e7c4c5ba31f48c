// Where the time goes in one step: `npx tsx tests/bench/profile.ts <step> [rows]` runs the step
// on the bench site under the V8 sampling profiler and prints the functions with the most self
// time and the project files most often on the stack. Steps: rollup, build, engine, edit, export.
// A tool for reading the figures, not part of `npm run bench`.
import { Session } from 'node:inspector/promises';
import type { Site } from '../../src/core/site/model.ts';
import { rollUp } from '../../src/core/site/rollup.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import { createEngine } from '../../src/engine/index.ts';
import { BUS_ROLLUP_PLUGIN } from '../../src/engine/rollupPlugin.ts';
import { generateSite } from './generateSite.ts';
import { SIZES } from './sizes.ts';
import { MotorEdits } from './workbookView.ts';
import { findExporter } from './xlsxModules.ts';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}
interface Profile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

type Prepared = () => Promise<unknown> | unknown;

async function prepare(step: string, site: Site): Promise<Prepared> {
  const live = () => buildWorkbook(site, { flavour: 'live' });
  const engineOf = () => createEngine(live().sheets, { plugins: [BUS_ROLLUP_PLUGIN] });
  if (step === 'rollup') return () => site.settings.cases.map((c) => rollUp(site, c));
  if (step === 'build') return live;
  if (step === 'engine') {
    const doc = live();
    return () => createEngine(doc.sheets, { plugins: [BUS_ROLLUP_PLUGIN] });
  }
  if (step === 'edit') {
    const doc = live();
    const hf = engineOf();
    const edits = new MotorEdits(doc, site);
    const sheet = hf.getSheetId(edits.sheetName) as number;
    return () => {
      for (let k = 0; k < 5; k++) edits.write(hf, sheet, k);
    };
  }
  if (step === 'export') {
    const doc = buildWorkbook(site, { flavour: 'portable' });
    const exporter = await findExporter();
    if (!exporter.ok) throw new Error(exporter.why);
    return () => exporter.fn(doc);
  }
  throw new Error(`unknown step "${step}"; steps: rollup, build, engine, edit, export`);
}

const short = (url: string) => url.replace(/^file:\/\//, '').replace(/^.*\/work\/main\//, '').replace(/^.*node_modules\//, 'nm:');

function summarise(p: Profile, top = 25): string {
  const byId = new Map(p.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of p.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const self = new Map<string, number>();
  const onStack = new Map<string, number>();
  let total = 0;
  p.samples.forEach((id, i) => {
    const dt = (p.timeDeltas[i] ?? 0) / 1_000;
    total += dt;
    const n = byId.get(id);
    if (!n) return;
    const key = `${n.callFrame.functionName || '(anonymous)'}  ${short(n.callFrame.url)}`;
    self.set(key, (self.get(key) ?? 0) + dt);
    const files = new Set<string>();
    for (let cur: number | undefined = id; cur !== undefined; cur = parent.get(cur)) {
      const u = byId.get(cur)?.callFrame.url ?? '';
      if (u.includes('/src/') && !u.includes('node_modules')) files.add(short(u));
    }
    for (const f of files) onStack.set(f, (onStack.get(f) ?? 0) + dt);
  });
  const table = (m: Map<string, number>) =>
    [...m.entries()].sort((a, b) => b[1] - a[1]).slice(0, top).map(([k, ms]) => `${ms.toFixed(0).padStart(8)} ms ${((100 * ms) / total).toFixed(1).padStart(5)} %  ${k}`).join('\n');
  return `sampled ${total.toFixed(0)} ms\n\nself time by function:\n${table(self)}\n\nproject files on the stack (inclusive):\n${table(onStack)}\n`;
}

async function main(): Promise<void> {
  const [step = 'engine', rowsText = '1000'] = process.argv.slice(2);
  const size = SIZES.find((s) => s.rows === Number(rowsText));
  if (!size) throw new Error(`rows must be one of ${SIZES.map((s) => s.rows).join(', ')}`);
  const run = await prepare(step, generateSite(size));
  const session = new Session();
  session.connect();
  await session.post('Profiler.enable');
  await session.post('Profiler.setSamplingInterval', { interval: 500 });
  await session.post('Profiler.start');
  const t0 = performance.now();
  await run();
  const wall = performance.now() - t0;
  const { profile } = (await session.post('Profiler.stop')) as unknown as { profile: Profile };
  session.disconnect();
  process.stdout.write(`${step} on ${size.rows} rows: ${wall.toFixed(0)} ms wall\n${summarise(profile)}`);
}

await main();
