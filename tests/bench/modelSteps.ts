// The page's own model (WorkbookSession: the path every grid edit takes, with the living model
// keeping generated cells in step) on a built site: open it, one value edit, one row inserted
// with a motor typed into it, and 500 motor rows pasted at once, each timed to the updated root
// P and checked against the core roll-up of the workbook the session would save.
import type { Site } from '../../src/core/site/model.ts';
import { rollUp } from '../../src/core/site/rollup.ts';
import type { CellContent, WorkbookDoc } from '../../src/core/workbook/document.ts';
import { HEADERS, SHEETS } from '../../src/core/workbook/layout.ts';
import { siteFromWorkbook } from '../../src/core/workbook/readSite.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { agreeRel, type Check, type StepResult } from './record.ts';
import { timeOnce, timeRepeated, warmUp } from './timing.ts';
import { busesView, readRoot, readRootP, type RootTotals } from './workbookView.ts';

/** Root P and Q of the workbook the session would save, by the core roll-up (not timed). */
function coreRoot(s: WorkbookSession): RootTotals {
  const { site } = siteFromWorkbook(s.toDoc());
  const totals = site.settings.cases.map((c) => rollUp(site, c).root);
  return { bus: totals[0]?.bus ?? '', p: totals.map((t) => t.p_kw), q: totals.map((t) => t.q_kvar) };
}

function check(s: WorkbookSession, cases: readonly string[]): Check {
  const page = readRoot(s.engine, busesView(s.engine, cases));
  const core = coreRoot(s);
  const bad = core.p.flatMap((p, k) =>
    agreeRel(page.p[k] ?? NaN, p) && agreeRel(page.q[k] ?? NaN, core.q[k] ?? NaN)
      ? []
      : [`case ${k + 1}: P ${page.p[k]} vs ${p}, Q ${page.q[k]} vs ${core.q[k]}`],
  );
  return bad.length === 0
    ? {
        agrees: true,
        detail: `root P and Q of ${core.p.length} case(s) equal the core roll-up of the saved workbook to 1e-9`,
      }
    : { agrees: false, detail: `differs from the core roll-up of the saved workbook: ${bad.join('; ')}` };
}

export class ModelEdits {
  private constructor(
    readonly session: WorkbookSession,
    private readonly cases: readonly string[],
    private readonly motors: number,
    private readonly cols: { tag: number; bus: number; kw: number; eff: number; cos: number; load: number },
    private readonly buses: readonly string[],
  ) {}

  /** Open the live workbook in the page's model (timed: what opening a file costs the page). */
  static open(doc: WorkbookDoc, site: Site): { result: StepResult; edits: ModelEdits } {
    const t = timeOnce(() => WorkbookSession.fromDoc(doc));
    const s = t.value;
    const motors = s.engine.getSheetId(SHEETS.motors) as number;
    const header = (s.sheetContents(motors)[0] ?? []).map(String);
    const col = (h: string) => {
      const c = header.indexOf(h);
      if (c < 0) throw new Error(`the Motors sheet has no column "${h}"`);
      return c;
    };
    const cases = site.settings.cases;
    const edits = new ModelEdits(
      s,
      cases,
      motors,
      {
        tag: col('Tag'),
        bus: col('Bus'),
        kw: col('Rated output (kW)'),
        eff: col('Efficiency'),
        cos: col('cos φ'),
        load: col(HEADERS.loadCase(cases[0] as string)),
      },
      [...new Set(site.equipment.filter((e) => e.kind === 'motor').map((e) => e.bus))],
    );
    return {
      result: {
        step: 'modelOpen',
        rows: site.equipment.length,
        status: 'ok',
        ms: t.ms,
        cpuMs: t.cpuMs,
        runs: 1,
        note: 'WorkbookSession.fromDoc of the live workbook: engine, contents, living model',
        check: check(s, cases),
      },
      edits,
    };
  }

  private rootP(): number {
    return readRootP(this.session.engine, busesView(this.session.engine, this.cases));
  }

  private motorRow(k: number): CellContent[] {
    const line = new Array<CellContent>(this.cols.load + 1).fill(null);
    line[this.cols.tag] = `BENCH-${k}`;
    line[this.cols.bus] = this.buses[k % this.buses.length] as string;
    line[this.cols.kw] = 15 + (k % 40);
    line[this.cols.eff] = 0.92;
    line[this.cols.cos] = 0.85;
    line[this.cols.load] = 0.8;
    return line;
  }

  /** One load factor typed through the session, then the root P read back. */
  editOne(rows: number): StepResult {
    let k = 0;
    const edit = () => {
      const row = 1 + ((k * 7919) % 500);
      this.session.setCells(this.motors, [{ row, col: this.cols.load, content: 0.3 + (k++ % 60) / 100 }]);
      return this.rootP();
    };
    warmUp(edit);
    const t = timeRepeated(edit, 9, 5_000);
    return {
      step: 'modelEditOne',
      rows,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      minMs: t.minMs,
      runs: t.runs,
      note: `${t.runs} load factors typed (session.setCells, after 3 untimed), then the root P`,
      check: check(this.session, this.cases),
    };
  }

  /** A row inserted in the middle of Motors and a motor typed into it (one step each), then the root P. */
  insertMotor(rows: number): StepResult {
    let k = 0;
    const insert = () => {
      const at = 1 + Math.floor((this.session.sheetContents(this.motors).length - 1) / 2);
      this.session.insertRows(this.motors, at, 1);
      this.session.setBlock(this.motors, at, 0, [this.motorRow(k++)]);
      return this.rootP();
    };
    // The first insert after opening pays once for compiling the insert path: reported apart.
    const first = timeOnce(insert).ms;
    warmUp(insert, 2);
    const t = timeRepeated(insert, 7, 5_000);
    return {
      step: 'modelInsertRow',
      rows,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      minMs: t.minMs,
      runs: t.runs,
      note: `session.insertRows + the motor row typed in (setBlock), then the root P; ${t.runs} timed after 3 untimed, the first of which took ${first.toFixed(0)} ms`,
      check: check(this.session, this.cases),
    };
  }

  /** 500 motor rows pasted below the list in one paste, then the root P. */
  paste500(rows: number): StepResult {
    let k = 100_000;
    const t = timeRepeated(
      () => {
        const at = this.session.sheetContents(this.motors).length;
        this.session.setBlock(
          this.motors,
          at,
          0,
          Array.from({ length: 500 }, () => this.motorRow(k++)),
        );
        return this.rootP();
      },
      3,
      10_000,
    );
    return {
      step: 'modelPaste500',
      rows,
      status: 'ok',
      ms: t.ms,
      cpuMs: t.cpuMs,
      minMs: t.minMs,
      runs: t.runs,
      note: '500 motor rows pasted at once below the list (session.setBlock), then the root P',
      check: check(this.session, this.cases),
    };
  }
}
