// The measured steps, each a function of its inputs that returns a StepResult (and what the
// next step needs). Every step that yields bus totals checks them against the floor, so a fast
// but wrong path cannot look good. Site generation and file writing are never timed.
import type { HyperFormula } from 'hyperformula';
import type { Site } from '../../src/core/site/model.ts';
import { rollUp } from '../../src/core/site/rollup.ts';
import { buildWorkbook, type Flavour } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { createEngine, readCell, type CellResult } from '../../src/engine/index.ts';
import { BUS_ROLLUP_PLUGIN } from '../../src/engine/rollupPlugin.ts';
import { floorRootIndex, floorRoots, floorTotals, prepareFloor } from './floor.ts';
import { agreeRel, type Check, type StepResult } from './record.ts';
import { timeOnce, timeOnceAsync, timeRepeated, warmUp } from './timing.ts';
import { busesView, MotorEdits, readRoot, readRootP, type RootTotals } from './workbookView.ts';
import { exportWorkbookXlsxWithReport, importKvarXlsx } from '../../src/io/xlsx/index.ts';

const fmt = (x: number) => x.toFixed(6);

/** Compare root totals of every case with a reference. */
export function compareRoots(got: RootTotals, ref: RootTotals, refName: string): Check {
  const bad: string[] = [];
  if (got.bus !== ref.bus) bad.push(`root bus ${got.bus} ≠ ${ref.bus}`);
  ref.p.forEach((p, k) => {
    const gp = got.p[k] ?? Number.NaN,
      gq = got.q[k] ?? Number.NaN,
      rq = ref.q[k] as number;
    if (!agreeRel(gp, p) || !agreeRel(gq, rq))
      bad.push(`case ${k + 1}: P ${fmt(gp)} vs ${fmt(p)}, Q ${fmt(gq)} vs ${fmt(rq)}`);
  });
  return bad.length === 0
    ? {
        agrees: true,
        detail: `root ${ref.bus} P and Q of ${ref.p.length} case(s) equal the ${refName} to 1e-9 relative`,
      }
    : { agrees: false, detail: `differs from the ${refName}: ${bad.join('; ')}` };
}

export function measureFloor(site: Site): { result: StepResult; roots: RootTotals } {
  const x = prepareFloor(site);
  const root = floorRootIndex(x);
  // The floor is the yardstick: warm it up first, so it is timed as optimised code.
  for (let w = performance.now(); performance.now() - w < 200;)
    site.settings.cases.forEach((_, k) => floorTotals(x, k));
  const t = timeRepeated(() => site.settings.cases.map((_, k) => floorTotals(x, k)), 21, 1_000);
  const roots = {
    bus: x.busNames[root] as string,
    p: t.value.map((v) => v.p[root] as number),
    q: t.value.map((v) => v.q[root] as number),
  };
  return {
    result: {
      step: 'floor',
      rows: site.equipment.length,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      minMs: t.minMs,
      runs: t.runs,
      note: 'warmed up for 200 ms; unpacking into typed arrays not timed',
    },
    roots,
  };
}

export function measureRollUp(site: Site, floor: RootTotals): StepResult {
  // A new equipment list each run (a copy of the array, microseconds): the roll-up keeps a site's
  // bus graph and voltages per list, and a repeated roll-up of one list would not pay for them.
  // This times what a first roll-up of a site costs, for all its cases.
  const t = timeRepeated(
    () => {
      const fresh = { ...site, equipment: site.equipment.slice() };
      return site.settings.cases.map((c) => rollUp(fresh, c));
    },
    5,
    3_000,
  );
  const got = {
    bus: t.value[0]?.root.bus ?? '',
    p: t.value.map((b) => b.root.p_kw),
    q: t.value.map((b) => b.root.q_kvar),
  };
  return {
    step: 'rollup',
    rows: site.equipment.length,
    status: 'ok',
    ms: t.ms,
    cpuMs: t.cpuMs,
    minMs: t.minMs,
    runs: t.runs,
    check: compareRoots(got, floor, 'floor'),
  };
}

export function measureBuild(site: Site, flavour: Flavour): { result: StepResult; doc: WorkbookDoc } {
  const t = timeOnce(() => buildWorkbook(site, { flavour }));
  let cells = 0;
  let formulas = 0;
  for (const s of t.value.sheets) {
    for (const r of s.cells) {
      cells += r.length;
      for (const c of r) if (typeof c === 'string' && c.startsWith('=')) formulas++;
    }
  }
  const step = flavour === 'live' ? 'buildLive' : 'buildPortable';
  return {
    result: {
      step,
      rows: site.equipment.length,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      runs: 1,
      note: `${t.value.sheets.length} sheets, ${cells.toLocaleString('en-GB')} cells, ${formulas.toLocaleString('en-GB')} formulas`,
    },
    doc: t.value,
  };
}

export function measureEngineBuild(
  doc: WorkbookDoc,
  site: Site,
  floor: RootTotals,
): { result: StepResult; hf: HyperFormula } {
  const t = timeOnce(() => createEngine(doc.sheets, { plugins: [BUS_ROLLUP_PLUGIN] }));
  const got = readRoot(t.value, busesView(t.value, site.settings.cases));
  return {
    result: {
      step: 'engineBuild',
      rows: site.equipment.length,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      runs: 1,
      check: compareRoots(got, floor, 'floor'),
    },
    hf: t.value,
  };
}

/** Edits the engine and checks its root against the floor of the site with the same edits. */
export class EngineEdits {
  readonly edits: MotorEdits;
  private readonly sheet: number;
  private k = 0;

  constructor(
    private readonly hf: HyperFormula,
    doc: WorkbookDoc,
    private readonly site: Site,
  ) {
    this.edits = new MotorEdits(doc, site);
    const id = hf.getSheetId(this.edits.sheetName);
    if (id === undefined) throw new Error(`the engine has no sheet "${this.edits.sheetName}"`);
    this.sheet = id;
  }

  private check(): Check {
    const got = readRoot(this.hf, busesView(this.hf, this.site.settings.cases));
    return compareRoots(got, floorRoots(this.edits.editedSite()), 'floor of the edited site');
  }

  /** One cell edit, then the root P read back; several edits on different motors, median reported. */
  one(): StepResult {
    const view = busesView(this.hf, this.site.settings.cases);
    const edit = () => {
      this.edits.write(this.hf, this.sheet, this.k++);
      return readRootP(this.hf, view);
    };
    warmUp(edit);
    const t = timeRepeated(edit, 9, 5_000);
    return {
      step: 'editOne',
      rows: this.site.equipment.length,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      minMs: t.minMs,
      runs: t.runs,
      note: `${t.runs} edits on different motors (after 3 untimed), setCellContents then getCellValue of the root P`,
      check: this.check(),
    };
  }

  /** 1,000 edits in one engine batch, then the root P read back. */
  batch(count = 1_000): StepResult {
    const view = busesView(this.hf, this.site.settings.cases);
    const t = timeRepeated(
      () => {
        this.hf.batch(() => {
          for (let i = 0; i < count; i++) this.edits.write(this.hf, this.sheet, this.k++);
        });
        return readRootP(this.hf, view);
      },
      3,
      4_000,
    );
    return {
      step: 'editBatch',
      rows: this.site.equipment.length,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      minMs: t.minMs,
      runs: t.runs,
      note: `${count} motor load cells in one hf.batch`,
      check: this.check(),
    };
  }
}

/** Cached results read from an engine that already holds the same layout (the live flavour). */
export function engineValues(hf: HyperFormula): (sheet: string, row: number, col: number) => CellResult {
  return (sheet, row, col) => readCell(hf, sheet, row, col);
}

/**
 * The export as the app does it: the portable document goes out, its cached results are read
 * from the live engine that already exists (built and checked by the engine step, not timed here).
 */
export async function measureExport(
  portable: WorkbookDoc,
  hf: HyperFormula,
  rows: number,
): Promise<{ result: StepResult; bytes: Uint8Array }> {
  const t = await timeOnceAsync(() => exportWorkbookXlsxWithReport(portable, { valueAt: engineValues(hf) }));
  const mb = (t.value.bytes.byteLength / 1048576).toFixed(1);
  const asValues =
    t.value.issues.length === 0
      ? ''
      : `; ${t.value.issues.length} cell(s) written as values (${t.value.issues
          .slice(0, 3)
          .map((i) => i.where)
          .join(', ')})`;
  const note = `exportWorkbookXlsxWithReport(portable doc, valueAt: the live engine already built); conversion, styles, metadata, zip; ${mb} MB${asValues}`;
  return {
    result: { step: 'xlsxExport', rows, status: 'ok', ms: t.ms, cpuMs: t.cpuMs, runs: 1, note },
    bytes: t.value.bytes,
  };
}

export async function measureImport(bytes: Uint8Array | undefined, rows: number): Promise<StepResult> {
  if (!bytes)
    return {
      step: 'xlsxImport',
      rows,
      status: 'not available',
      note: 'no exported file to read (the export did not run)',
    };
  const t = await timeOnceAsync(() => importKvarXlsx(bytes));
  if (!t.value.ok)
    return {
      step: 'xlsxImport',
      rows,
      status: 'failed',
      ms: t.ms,
      cpuMs: t.cpuMs,
      note: `importKvarXlsx refused the file: ${t.value.problem.message}`,
    };
  return {
    step: 'xlsxImport',
    rows,
    status: 'ok',
    ms: t.ms,
    cpuMs: t.cpuMs,
    runs: 1,
    note: `importKvarXlsx of the exported file (rows ${t.value.restored === 'plain' ? 'read as plain formulas' : `restored from its metadata: ${t.value.restored}`})`,
  };
}
