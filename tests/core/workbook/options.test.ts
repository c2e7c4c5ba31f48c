// The Design options sheet: each option's figures as live formulas must be what the core works out
// for the same banks (compare.ts: the one rule for after compensation, the schedule, the cost and
// the saving of src/core/quote), for the invented templates and for random sites. The core is the
// reference here because its every step is checked against outside sources in its own tests
// (tests/core/site/compensate*, tests/core/quote/*); the cross-engine suite recalculates the same
// sheet in LibreOffice. A hand check pins the roll-up of one option on a one-transformer site.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { draftOptions } from '../../../src/core/options/index.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import {
  OPTIONS_SHEET,
  TABLE,
  blockOrigin,
  blockTitleRow,
  MET_LABEL,
  metRow,
  optionsExtent,
  planOptionColumns,
  optionLabel,
  tableRow,
} from '../../../src/core/workbook/optionsLayout.ts';
import { optionDrafts } from '../../../src/core/workbook/optionDrafts.ts';
import { busLineRow } from '../../../src/core/workbook/quantitiesLayout.ts';
import { siteArb } from '../../ui/living/siteArb.ts';
import { liveEngine, portableEngine, sheet, templateSites } from './engineDoc.ts';
import { coreOptions, engineValue, expectSameOptions, sheetOptions } from './optionFaces.ts';
import { siteFromCsv } from '../site/fixtures.ts';

describe.each(templateSites())('Design options of the $name template', ({ site }) => {
  const live = buildWorkbook(site, { flavour: 'live' });
  const drafts = draftOptions(site);

  it('holds the standard options less the banks as given, their banks as inputs', () => {
    expect(drafts.map((d) => d.id)).toEqual(['proposal', 'plain', 'detuned', 'central']);
    const back = optionDrafts(sheet(live, OPTIONS_SHEET), site.settings.cases);
    expect(back.map((d) => d.name)).toEqual(drafts.map((d) => d.name));
    back.forEach((b, j) => {
      const want = (drafts[j]?.banks ?? []).map(({ note: _note, ...rest }) => rest);
      expect(b.banks, b.name).toEqual(want);
    });
  });

  it('shows in the live engine what the core works out for each option', () => {
    const hf = liveEngine(live);
    expectSameOptions(sheetOptions(engineValue(hf), [0, 1, 2, 3]), coreOptions(live), 'live');
    hf.destroy();
  });

  it('shows the same in the portable flavour, expanded to classic functions', () => {
    const portable = buildWorkbook(site, { flavour: 'portable' });
    const hf = portableEngine(portable);
    expectSameOptions(sheetOptions(engineValue(hf), [0, 1, 2, 3]), coreOptions(portable), 'portable');
    hf.destroy();
  });
});

describe('Design options of random sites', () => {
  it('every option on the sheet equals the core, with banks as given typed too', () => {
    fc.assert(
      fc.property(siteArb, ({ site, banks }) => {
        const doc = buildWorkbook(site, { flavour: 'live', banks });
        const hf = liveEngine(doc);
        try {
          const core = coreOptions(doc);
          expect(core.length).toBeGreaterThan(0);
          expectSameOptions(
            sheetOptions(
              engineValue(hf),
              core.map((o) => o.block),
            ),
            core,
          );
        } finally {
          hf.destroy();
        }
      }),
      { numRuns: Number(process.env.KVAR_PROPERTY_RUNS ?? 12) },
    );
    // Each run builds a workbook and its engine and prices five designs: 20-24 s for the twelve
    // runs beside the other property tests, near the default 30 s.
  }, 120_000);
});

describe('one option worked by hand', () => {
  // 400 kW at cos φ 0.8 lagging on an LV bus fed by one 1000 kVA transformer; the option puts
  // 6 × 50 kvar plain on the LV bus. Circuit theory only: Q = P·tan φ, Q after = Q − bank output.
  const { site } = siteFromCsv(
    [
      'tag,bus,kind,qty,p_kw,cos_phi,u_kv,to_bus,s_kva,uk_pct,p0_kw,pk_kw,i0_pct,load',
      'T1,MV,transformer,1,,,11,LV,1000,6,1.1,10,0.8,',
      'L1,LV,load,1,400,0.8,0.4,,,,,,,1',
    ].join('\n'),
  );
  const option = { name: 'Hand', summary: 'by hand', banks: [{ bus: 'LV', step_kvar: 50, steps: 6 }] };
  const doc = buildWorkbook(site, { flavour: 'live', banks: [], options: [option] });
  const hf = liveEngine(doc);
  const v = engineValue(hf);

  it('names the option from its title line and counts its kvar', () => {
    expect(v(OPTIONS_SHEET, tableRow(0), TABLE.option.col)).toBe('Hand');
    expect(v(OPTIONS_SHEET, tableRow(0), TABLE.capacitor.col)).toBe(300);
    // Blank blocks show their label.
    expect(v(OPTIONS_SHEET, tableRow(1), TABLE.option.col)).toBe(optionLabel(1));
    expect(v(OPTIONS_SHEET, tableRow(1), TABLE.capacitor.col)).toBe(0);
  });

  it("takes the transformer's losses at the option's own loading (P0 + Pk·(S/Sr)², IEC 60076 losses)", () => {
    const cols = planOptionColumns(site.settings.cases);
    const origin = blockOrigin(0, 2, site.settings.cases.length);
    const [mv, lv] = [busLineRow(0, origin), busLineRow(1, origin)];
    const at = (row: number, col: number) => v(OPTIONS_SHEET, row, col) as number;
    const steps = at(lv, cols.perCase.stepsIn[0] as number);
    expect(steps).toBeGreaterThan(0);
    // Q own = 400 · tan(acos 0.8) = 300 kvar; the steps switched in deliver 50 kvar each.
    const qLv = at(lv, cols.perCase.qAbsAfter[0] as number) - at(lv, cols.perCase.qDelAfter[0] as number);
    expect(qLv).toBeCloseTo(300 - 50 * steps, 9);
    expect(at(lv, cols.perCase.pAfter[0] as number)).toBeCloseTo(400, 9);
    const s = Math.hypot(400, 300 - 50 * steps);
    expect(at(mv, cols.perCase.pAfter[0] as number)).toBeCloseTo(400 + 1.1 + 10 * (s / 1000) ** 2, 9);
  });

  it('puts every line where the layout says, under headers that name one column each', () => {
    const s = sheet(doc, OPTIONS_SHEET);
    const n = 2;
    const C = site.settings.cases.length;
    const headers = s.cells[0] ?? [];
    expect(new Set(headers).size).toBe(headers.length);
    expect(headers).toEqual(planOptionColumns(site.settings.cases).columns.map((c) => c.header));
    for (let j = 0; j < 4; j++) {
      expect(s.cells[blockTitleRow(j, n, C)]?.[1]).toBe(optionLabel(j));
      expect(s.cells[busLineRow(0, blockOrigin(j, n, C))]?.[0]).toBe('MV');
      expect(s.cells[busLineRow(1, blockOrigin(j, n, C))]?.[0]).toBe('LV');
      expect(s.cells[metRow(j, n, C)]?.[0]).toBe(MET_LABEL);
    }
    expect(s.cells.length).toBe(optionsExtent(n, C));
  });
});
