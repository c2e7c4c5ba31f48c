// The one fill rule over a site's rows (the CLI and the list import) and over a sheet's cells
// (the page) gives the same values; the workbook built from a filled site marks each value as
// assumed in the cell that holds it. Motor efficiencies: IEC 60034-30-1 IE3 4-pole minimum
// (UK SI 2021/745 Sch. 16 Table 28, published): 11 kW 91.4 %, 37 kW 93.9 %.
import { describe, expect, it } from 'vitest';
import { defaultSettings } from '../../../../src/core/site/defaults.ts';
import type { EquipmentRow, Site } from '../../../../src/core/site/model.ts';
import { fillSiteTypical } from '../../../../src/core/site/typical/fillSite.ts';
import { typicalFillRow } from '../../../../src/core/site/typical/fillRow.ts';
import { buildWorkbook } from '../../../../src/core/workbook/build.ts';
import { heldAssumptions } from '../../../../src/core/workbook/cellMarks.ts';
import { planTypicalFill } from '../../../../src/core/workbook/typicalFill.ts';
import { equipmentPlans } from '../../../../src/core/workbook/structure.ts';

const row = (
  r: number,
  tag: string,
  kind: string,
  values: EquipmentRow['values'],
  bus = 'LV',
): EquipmentRow => ({
  row: r,
  tag,
  bus,
  kind,
  values,
  loads: {},
});

const site: Site = {
  settings: defaultSettings('fill'),
  equipment: [
    row(2, 'T1', 'transformer', { s_kva: 1000, u_kv: 0.4 }, 'MV'),
    row(3, 'M-37', 'motor', { p_kw: 37, u_kv: 0.4, cos_phi: 0.85 }),
    row(4, 'M-11', 'motor', { p_kw: 11, u_kv: 0.4 }),
    row(5, 'M-X', 'motor', { u_kv: 0.4 }),
    row(6, 'L1', 'load', { p_kw: 50, cos_phi: 0.9 }),
  ].map((r) => (r.kind === 'transformer' ? { ...r, to_bus: 'LV' } : r)),
};

describe('typical values for a site read from a file', () => {
  it('fills blanks of motors and transformers with a rating, keeps typed values, says why not', () => {
    const f = fillSiteTypical(site);
    const at = (tag: string, column: string) => f.assumed.find((a) => a.tag === tag && a.column === column);
    expect(at('M-11', 'eff')?.value).toBe(0.914);
    expect(at('M-37', 'eff')?.value).toBe(0.939);
    // Typed cos φ stays; a load has no tables.
    expect(at('M-37', 'cos_phi')).toBeUndefined();
    expect(f.site.equipment[1]?.values.cos_phi).toBe(0.85);
    expect(f.assumed.some((a) => a.tag === 'L1')).toBe(false);
    expect(f.site.equipment[4]).toBe(site.equipment[4]);
    // The transformer gets uk, both losses and no-load current; the motor without rating nothing.
    expect(
      f.assumed
        .filter((a) => a.tag === 'T1')
        .map((a) => a.column)
        .sort(),
    ).toEqual(['i0_pct', 'p0_kw', 'pk_kw', 'uk_pct']);
    expect(f.notAssumed.filter((w) => w.startsWith('row 5 (M-X): '))).toHaveLength(3);
    expect(f.site.equipment[2]?.values.eff).toBe(0.914);
    expect(site.equipment[2]?.values.eff).toBeUndefined();
  });

  it('never fills over text or a formula the user put in the cell', () => {
    const fill = typicalFillRow('motor', (k) => ({ p_kw: 11, eff: '=0.9', cos_phi: 'n/a' })[k]);
    expect(fill.writes.map((w) => w.column)).toEqual(['i0_pct']);
    expect(fill.notAssumed).toEqual([]);
  });

  it('the built workbook marks each filled cell as assumed, and the page rule finds the same values', () => {
    const f = fillSiteTypical(site);
    const doc = buildWorkbook(f.site, { flavour: 'portable', assumed: f.assumed });
    const held = doc.sheets.flatMap((s) =>
      heldAssumptions(s).map((m) => ({ sheet: s.name, value: m.value, col: s.cells[0]?.[m.col] })),
    );
    expect(held).toHaveLength(f.assumed.length);
    expect(held).toContainEqual({ sheet: 'Motors', value: 0.914, col: 'Efficiency' });
    // The page's plan over the unfilled site's cells proposes the same values at the same cells.
    const plans = equipmentPlans(site.settings.cases);
    const blank = buildWorkbook(site, { flavour: 'live', banks: [] });
    const plan = planTypicalFill(
      plans.map((p) => ({
        key: p.sheet.name,
        rows: blank.sheets.find((s) => s.name === p.sheet.name)?.cells ?? [],
      })),
      plans,
    );
    const pageMarks = [...plan.sheets].flatMap(([sheet, v]) => v.marks.map((m) => ({ sheet, ...m })));
    // The assumed values' marks (the design options' proposed values are marked too, apart).
    const cliMarks = doc.sheets.flatMap((s) =>
      (s.marks ?? []).filter((m) => m.kind === 'assumed').map((m) => ({ sheet: s.name, ...m })),
    );
    const key = (m: { sheet: string; row: number; col: number }) => `${m.sheet}!${m.row},${m.col}`;
    expect([...pageMarks].sort((a, b) => key(a).localeCompare(key(b)))).toEqual(
      [...cliMarks].sort((a, b) => key(a).localeCompare(key(b))),
    );
  });
});
