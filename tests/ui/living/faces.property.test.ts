// One model, four faces: after every edit made through the page's own model, each bus's P, Q and
// cos φ before compensation and P and Q after it, as the page's engine computes them, equal the
// core roll-up and compensation rule (what the command line prints) for the same workbook, to
// 1e-9 relative. Random valid sites (siteArb.ts) and random sequences of 1–30 edits (edits.ts).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { siteArb } from './siteArb.ts';
import { applyEdit, editArb } from './edits.ts';
import { coreFaces, pageFaces, relDiff } from './faces.ts';

const TOL = 1e-9;

function compare(s: WorkbookSession, log: readonly string[]): number {
  const core = coreFaces(s);
  if (!core) return 0; // inputs with errors: the page shows them; nothing to compare
  const page = pageFaces(s, core.cases, core.faces.buses.length);
  const where = () => log.join(' → ');
  expect(
    page.buses.map((b) => b.bus),
    where(),
  ).toEqual(core.faces.buses.map((b) => b.bus));
  core.faces.buses.forEach((b, i) => {
    b.cases.forEach((c, k) => {
      const p = page.buses[i]?.cases[k];
      if (!p) throw new Error(`no page figures for ${b.bus} case ${k}: ${where()}`);
      for (const j of [0, 1, 3, 4] as const) {
        expect(
          relDiff(p[j], c[j]),
          `${b.bus} case ${k} figure ${j}: page ${p[j]} core ${c[j]}; ${where()}`,
        ).toBeLessThan(TOL);
      }
      if (c[2] === null) expect(p[2], where()).toBeNull();
      else expect(relDiff(p[2] as number, c[2]), where()).toBeLessThan(TOL);
    });
  });
  expect(page.within, where()).toEqual(core.faces.within);
  return 1;
}

describe('the page and the core agree after every edit', () => {
  it('on random sites and random edit sequences', { timeout: 600_000 }, () => {
    let compared = 0;
    fc.assert(
      fc.property(siteArb, fc.array(editArb, { minLength: 1, maxLength: 30 }), ({ site, banks }, edits) => {
        const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live', banks }));
        const log: string[] = ['open'];
        compared += compare(s, log);
        for (const e of edits) {
          log.push(applyEdit(s, e));
          compared += compare(s, log);
        }
        s.destroy();
      }),
      { numRuns: Number(process.env.KVAR_PROPERTY_RUNS ?? 20) },
    );
    // The comparison must have run on most steps (valid inputs), not been skipped.
    expect(compared).toBeGreaterThan(100);
  });
});
