// Smoke test of the bench on the 1,000-row site: the core steps run in this process and give
// results, and the floor, the core roll-up and the engine agree on the point of connection's
// P and Q, before and after edits. A correctness check only: no timing is asserted.
import { describe, expect, it } from 'vitest';
import { generateSite } from './generateSite.ts';
import { floorRoots } from './floor.ts';
import {
  compareRoots,
  EngineEdits,
  measureBuild,
  measureEngineBuild,
  measureFloor,
  measureRollUp,
} from './steps.ts';
import { busesView, readRoot } from './workbookView.ts';
import { ModelEdits } from './modelSteps.ts';
import { formatMs, renderMarkdown, type BenchResults } from './report.ts';
import { describeMachine } from './machine.ts';
import { parseOptions, SIZES } from './sizes.ts';
import { STEP_NAMES, type StepResult } from './record.ts';

describe('bench smoke (1,000 rows / 30 buses)', () => {
  it('runs floor, rollUp, buildWorkbook, engine build and edits; all agree on the root totals', () => {
    const size = SIZES[0] as (typeof SIZES)[number];
    const site = generateSite(size);
    expect(site.equipment).toHaveLength(1_000);

    const floor = measureFloor(site);
    // The floor's own root equals the independent unpack-and-sum helper (same arrays, same loop).
    expect(compareRoots(floor.roots, floorRoots(site), 'floor helper').agrees).toBe(true);
    expect(floor.roots.p.every((p) => p > 0)).toBe(true);

    const roll = measureRollUp(site, floor.roots);
    expect(roll.check?.agrees, roll.check?.detail).toBe(true);

    const live = measureBuild(site, 'live');
    const engine = measureEngineBuild(live.doc, site, floor.roots);
    expect(engine.result.check?.agrees, engine.result.check?.detail).toBe(true);

    const edits = new EngineEdits(engine.hf, live.doc, site);
    const one = edits.one();
    expect(one.check?.agrees, one.check?.detail).toBe(true);
    const batch = edits.batch(200);
    expect(batch.check?.agrees, batch.check?.detail).toBe(true);
    // The edits moved the root: the engine did not just keep its first answer.
    const after = readRoot(engine.hf, busesView(engine.hf, site.settings.cases));
    expect(compareRoots(after, floor.roots, 'unedited floor').agrees).toBe(false);
    engine.hf.destroy();

    const steps: StepResult[] = [floor.result, roll, live.result, engine.result, one, batch];
    const results: BenchResults = {
      machine: describeMachine(),
      sizes: [size],
      steps,
      memory: [],
      browser: { status: 'not run', note: 'smoke test' },
      wallSeconds: 0,
    };
    const md = renderMarkdown(results);
    // Every step ran and recorded a time, and the report shows that time in the step's row.
    for (const s of steps) {
      expect(s.status).toBe('ok');
      expect(s.ms).toBeTypeOf('number');
      expect(md).toContain(`| ${STEP_NAMES[s.step]} | 1,000 / 30 | ${formatMs(s.ms as number)} |`);
    }
    expect(md).toContain('| One edit (motor load) to updated root P | 1,000 / 30 |');
    expect(md).toContain('agrees');
    expect(md).not.toContain('**differs**');

    // The page at two sizes: one column each, and the small size's own targets.
    const page = (rows: number, editPaintMs: number) => ({
      status: 'ok' as const,
      rows,
      openMs: 900,
      editPaintMs,
      editPaintRuns: 7,
    });
    const both = renderMarkdown({ ...results, browser: page(10_000, 60), browserSmall: page(1_000, 20) });
    expect(both).toContain('| What | 1,000 rows | 10,000 rows |');
    expect(both).toContain('| Edit to repainted bus total (ms, median) | 20.0 (7 edits) | 60.0 (7 edits) |');
    expect(both).toMatch(/Value edit to repainted bus total, page, 1,000 rows \| ≤ 25 ms \| 20\.0 ms \| yes/);
  });

  it("the page's model: open, a typed edit, an inserted motor row and 500 pasted rows agree with the core", () => {
    const size = SIZES[0] as (typeof SIZES)[number];
    const site = generateSite(size);
    const live = measureBuild(site, 'live');
    const opened = ModelEdits.open(live.doc, site);
    const steps = [
      opened.result,
      opened.edits.editOne(size.rows),
      opened.edits.insertMotor(size.rows),
      opened.edits.paste500(size.rows),
    ];
    for (const s of steps) {
      expect(s.status).toBe('ok');
      expect(s.check?.agrees, `${s.step}: ${s.check?.detail}`).toBe(true);
    }
    // The pasted rows are there and count: 500 per run, each a motor on a bus.
    const motors = opened.edits.session.engine.getSheetId('Motors') as number;
    const runs = steps[3]?.runs ?? 0;
    const inserted = (steps[2]?.runs ?? 0) + 3; // three untimed inserts come before the timed ones
    const before = site.equipment.filter((e) => e.kind === 'motor').length;
    expect(opened.edits.session.sheetContents(motors).length - 1).toBe(before + inserted + 500 * runs);
    opened.edits.session.destroy();
  });

  it('reads its options and refuses a size it does not know', () => {
    const o = parseOptions(['--sizes', '1000', '--no-browser', '--no-peer'], '/tmp');
    expect(o.sizes.map((s) => s.rows)).toEqual([1_000]);
    expect([o.browser, o.peer, o.cli]).toEqual([false, false, true]);
    expect(() => parseOptions(['--sizes', '2000'], '/tmp')).toThrow(
      /2000 is not a bench size; allowed: 1000, 10000, 50000/,
    );
  });
});
