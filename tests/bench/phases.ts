// The phases of one size, each meant to run in its own child process with its own time budget
// (so a step that is very slow today cannot hang the bench, and each phase's peak memory is its
// own): core (floor, rollUp, workbook builds), engine (build, xlsx export with cached results
// from that engine as the app does it), edits (a fresh engine, then edits: apart from the export,
// whose garbage would otherwise be collected inside the timed edit), model (the page's own
// model: open, typed edit, inserted row, pasted rows), xlsx (import of that file).
// The core phase leaves its products in the work directory for the others.
// Messages go out one at a time, so a phase stopped by its budget still reports what it did.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeSiteFile } from '../../src/core/site/siteFile.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { generateSite } from './generateSite.ts';
import type { StepId, StepResult } from './record.ts';
import {
  EngineEdits,
  measureBuild,
  measureEngineBuild,
  measureExport,
  measureFloor,
  measureImport,
  measureRollUp,
} from './steps.ts';
import { peakRssMb } from './timing.ts';
import { ModelEdits } from './modelSteps.ts';
import type { RootTotals } from './workbookView.ts';

export const PHASES = ['core', 'engine', 'edits', 'model', 'xlsx'] as const;
export type PhaseName = (typeof PHASES)[number];

/** The steps of each phase, in order (for reporting those a stopped phase never reached). */
export const PHASE_STEPS: Readonly<Record<PhaseName, readonly StepId[]>> = {
  core: ['floor', 'rollup', 'buildLive', 'buildPortable'],
  engine: ['engineBuild', 'xlsxExport'],
  edits: ['editOne', 'editBatch'],
  model: ['modelOpen', 'modelEditOne', 'modelInsertRow', 'modelPaste500'],
  xlsx: ['xlsxImport'],
};

export type PhaseMessage =
  | { readonly type: 'start'; readonly step: StepId }
  | { readonly type: 'result'; readonly result: StepResult }
  | { readonly type: 'memory'; readonly peakRssMb: number };

export type Emit = (m: PhaseMessage) => void;

/** Marks the worker's message lines on its stdout. */
export const MESSAGE_PREFIX = '@@bench ';

/** Files a size's phases share (all under the bench's temporary work directory). */
export function workFiles(workDir: string, rows: number) {
  return {
    site: join(workDir, `site-${rows}.json`),
    roots: join(workDir, `roots-${rows}.json`),
    live: join(workDir, `site-${rows}.kvar.json`),
    portable: join(workDir, `portable-${rows}.json`),
    xlsx: join(workDir, `site-${rows}.xlsx`),
  };
}

const readJson = <T>(file: string): T => JSON.parse(readFileSync(file, 'utf8')) as T;

async function step<T>(emit: Emit, id: StepId, run: () => T | Promise<T>): Promise<T> {
  emit({ type: 'memory', peakRssMb: peakRssMb() });
  emit({ type: 'start', step: id });
  const out = await run();
  emit({ type: 'memory', peakRssMb: peakRssMb() });
  return out;
}

export async function runPhase(
  phase: PhaseName,
  size: { rows: number; buses: number },
  workDir: string,
  emit: Emit,
): Promise<void> {
  const site = generateSite(size);
  const files = workFiles(workDir, size.rows);
  const done = (result: StepResult) => emit({ type: 'result', result });
  if (phase === 'core') {
    writeFileSync(files.site, writeSiteFile(site));
    const floor = await step(emit, 'floor', () => measureFloor(site));
    done(floor.result);
    writeFileSync(files.roots, JSON.stringify({ ...floor.roots, cases: site.settings.cases }));
    done(await step(emit, 'rollup', () => measureRollUp(site, floor.roots)));
    const live = await step(emit, 'buildLive', () => measureBuild(site, 'live'));
    done(live.result);
    writeFileSync(files.live, JSON.stringify(live.doc));
    const portable = await step(emit, 'buildPortable', () => measureBuild(site, 'portable'));
    done(portable.result);
    writeFileSync(files.portable, JSON.stringify(portable.doc));
  } else if (phase === 'engine') {
    const doc = readJson<WorkbookDoc>(files.live);
    const floor = readJson<RootTotals>(files.roots);
    const built = await step(emit, 'engineBuild', () => measureEngineBuild(doc, site, floor));
    done(built.result);
    // Exported before the edits, so the engine's values are those of the portable document.
    const exported = await step(emit, 'xlsxExport', () =>
      measureExport(readJson<WorkbookDoc>(files.portable), built.hf, size.rows),
    );
    done(exported.result);
    writeFileSync(files.xlsx, exported.bytes);
  } else if (phase === 'edits') {
    // The build is timed in the engine phase; here it only prepares the engine.
    const doc = readJson<WorkbookDoc>(files.live);
    const built = measureEngineBuild(doc, site, readJson<RootTotals>(files.roots));
    const edits = new EngineEdits(built.hf, doc, site);
    done(await step(emit, 'editOne', () => edits.one()));
    done(await step(emit, 'editBatch', () => edits.batch()));
  } else if (phase === 'model') {
    const opened = await step(emit, 'modelOpen', () =>
      ModelEdits.open(readJson<WorkbookDoc>(files.live), site),
    );
    done(opened.result);
    const m = opened.edits;
    done(await step(emit, 'modelEditOne', () => m.editOne(size.rows)));
    done(await step(emit, 'modelInsertRow', () => m.insertMotor(size.rows)));
    done(await step(emit, 'modelPaste500', () => m.paste500(size.rows)));
  } else {
    const bytes = existsSync(files.xlsx) ? new Uint8Array(readFileSync(files.xlsx)) : undefined;
    done(await step(emit, 'xlsxImport', () => measureImport(bytes, size.rows)));
  }
}
