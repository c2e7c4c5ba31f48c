// Where the time goes in one step: `npx tsx tests/bench/profile.ts <step> [rows]` runs the step
// on the bench site under the V8 sampling profiler and prints the functions with the most self
// time and the project files most often on the stack. Steps: rollup, build, engine, edit,
// modelEdit, modelInsert, modelPaste (the page's model), export, import.
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
import { exportWorkbookXlsx, importKvarXlsx } from '../../src/io/xlsx/index.ts';
import { engineValues } from './steps.ts';
import { summarise, type Profile } from './profileSummary.ts';
import { ModelEdits } from './modelSteps.ts';

type Prepared = () => unknown;

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
  if (step === 'modelEdit' || step === 'modelInsert' || step === 'modelPaste') {
    // The page's model: opened outside the profile, then one kind of edit.
    const { edits } = ModelEdits.open(live(), site);
    const rows = site.equipment.length;
    if (step === 'modelEdit') return () => edits.editOne(rows);
    if (step === 'modelInsert') return () => edits.insertMotor(rows);
    return () => edits.paste500(rows);
  }
  if (step === 'export' || step === 'import') {
    // As the app exports: the portable document, cached results read from the live engine.
    const doc = buildWorkbook(site, { flavour: 'portable' });
    const hf = engineOf();
    const exported = () => exportWorkbookXlsx(doc, { valueAt: engineValues(hf) });
    if (step === 'export') return exported;
    const bytes = await exported();
    hf.destroy();
    return () => importKvarXlsx(bytes);
  }
  throw new Error(
    `unknown step "${step}"; steps: rollup, build, engine, edit, modelEdit, modelInsert, modelPaste, export, import`,
  );
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
