// Design options side by side. Each option's figures are checked against the workbook with that
// option's banks typed on its Compensation sheet: the engine's Quantities and cost sheet (live
// formulas, the same rates and tariff) must show the same total, annual saving and payback, so
// the comparison is what the estimator would see by trying each option in the page. The shape of
// each option (no detuning, all 7 %, one bank at the point of connection) is checked from its
// banks, and the payback against cost ÷ saving worked out here. Sites: the invented templates.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compareOptions, DETUNED_OPTION_P, standardOptions } from '../../../src/core/options/index.ts';
import { demoRateTable, readTariff, tariffSheetDoc } from '../../../src/core/quote/index.ts';
import { bankTotal } from '../../../src/core/site/bankChoice.ts';
import { buildBusGraph } from '../../../src/core/site/graph.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import {
  QC,
  QUANTITIES_SHEET,
  summaryRowOf,
  savingRowOf,
} from '../../../src/core/workbook/quantitiesLayout.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { siteFromCsv } from '../site/fixtures.ts';

const template = (name: string) =>
  readSiteFile(readFileSync(new URL(`../../../templates/${name}.json`, import.meta.url), 'utf8'));

function figuresOf(name: string) {
  const { site, banks } = template(name);
  const cases = site.settings.cases;
  const { tariff } = readTariff(tariffSheetDoc(cases).cells, cases);
  const specs = standardOptions(site, banks);
  return { site, specs, figures: compareOptions(site, specs, demoRateTable(), tariff) };
}

/** Total, annual saving and payback as the workbook with these banks shows them. */
function workbookFigures(
  site: ReturnType<typeof template>['site'],
  banks: Parameters<typeof buildWorkbook>[1]['banks'],
) {
  const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live', banks }));
  const q = s.engine.getSheetId(QUANTITIES_SHEET) as number;
  const comp = s.engine.getSheetId('Compensation') as number;
  // Buses on the Compensation sheet: the rows above its first blank bus cell.
  let n = 0;
  while (s.engine.getCellValue({ sheet: comp, row: n + 1, col: 0 }) !== null) n++;
  const v = (row: number) => s.engine.getCellValue({ sheet: q, row, col: QC.cost });
  const out = {
    total: v(summaryRowOf(n, 'Total')),
    saving: v(savingRowOf(n, site.settings.cases.length, 'Annual saving')),
    payback: v(savingRowOf(n, site.settings.cases.length, 'Simple payback (years)')),
  };
  s.destroy();
  return out;
}

const close = (a: unknown, b: number | null) => {
  if (b === null) return expect(typeof a).not.toBe('number');
  expect(typeof a).toBe('number');
  expect(Math.abs((a as number) - b)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b)));
};

describe.each(['cold-store', 'pumping-station'])('options for the %s template', (name) => {
  const { site, specs, figures } = figuresOf(name);
  const root = buildBusGraph(site.equipment).root;

  it('lists the banks as held, the proposal, plain, all detuned and one central bank', () => {
    expect(figures.map((f) => f.id)).toEqual(['current', 'proposal', 'plain', 'detuned', 'central']);
    const by = (id: string) => figures.find((f) => f.id === id)!;
    const caps = (id: string) => by(id).banks.filter((b) => bankTotal(b) > 0);
    expect(caps('plain').every((b) => (b.p_pct ?? 0) === 0)).toBe(true);
    expect(caps('detuned').every((b) => b.p_pct === DETUNED_OPTION_P)).toBe(true);
    expect(caps('central').map((b) => b.bus)).toEqual([root]);
    // The template's banks are the design's proposal, so the proposal says it is the same.
    expect(by('proposal').sameAs).toBe('Banks as given');
    for (const f of figures)
      expect(f.capacitor_kvar).toBeCloseTo(
        f.banks.reduce((s, b) => s + bankTotal(b), 0),
        9,
      );
  });

  it('each option shows the figures the workbook shows with its banks typed in', () => {
    for (const f of figures) {
      const w = workbookFigures(site, f.banks);
      close(w.total, f.total);
      close(w.saving, f.annual_saving);
      close(w.payback, f.payback_years);
    }
  });

  it('payback is the total over the annual saving, worked out here', () => {
    for (const f of figures)
      if (f.total !== null && f.annual_saving > 0)
        expect(f.payback_years).toBeCloseTo(f.total / f.annual_saving, 9);
    expect(specs).toHaveLength(figures.length);
  });
});

describe('options for a site that holds no banks', () => {
  it('start with the proposal', () => {
    const { site } = template('cold-store');
    expect(standardOptions(site, undefined).map((o) => o.id)).toEqual([
      'proposal',
      'plain',
      'detuned',
      'central',
    ]);
  });
});

describe('one bank at the connection, when the point of connection has no stated voltage', () => {
  it('says in its line why it has no bank, rather than only missing the requirement', () => {
    // The transformer leaves u_kv blank, so only the LV bus has a voltage (from its load's row).
    const { site, problems } = siteFromCsv(
      [
        'tag,bus,kind,p_kw,cos_phi,s_kva,uk_pct,p0_kw,pk_kw,i0_pct,to_bus,u_kv',
        'T1,MV,transformer,,,1000,6,1.1,10,1,LV,',
        'L1,LV,load,600,0.75,,,,,,,0.4',
      ].join('\n'),
    );
    expect(problems.filter((p) => p.severity === 'error')).toEqual([]);
    const central = standardOptions(site, undefined).find((o) => o.id === 'central');
    expect(central?.banks.filter((b) => bankTotal(b) > 0)).toEqual([]);
    expect(central?.summary).toBe(
      'no bank: no row on MV, the point of connection, states its voltage (u_kv), so no bank there can be sized',
    );
  });
  it('keeps its usual line when the voltage is stated', () => {
    const { site } = template('cold-store');
    const root = buildBusGraph(site.equipment).root;
    expect(standardOptions(site, undefined).find((o) => o.id === 'central')?.summary).toMatch(
      new RegExp(`^a single bank on ${root}, the point of connection`),
    );
  });
});
