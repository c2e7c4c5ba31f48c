// Runaway inputs: absurd magnitudes are refused with row, column and the allowed range; a site
// beyond the supported size is refused as a whole; the bank design stays bounded however large
// the need (before, a motor quantity of 500 threw RangeError and 200 proposed 55,564 steps).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { maxStepsAt } from '../../../src/core/site/bankRules.ts';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { MAX_BUSES, MAX_CASES, MAX_EQUIPMENT_ROWS, siteSizeProblems } from '../../../src/core/site/limits.ts';
import type { EquipmentRow, Site } from '../../../src/core/site/model.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,qty,p_kw,eff,cos_phi,s_kva,uk_pct,i0_pct,p0_kw,pk_kw,to_bus,u_kv';
const XFMR = 'T1,MV,transformer,,,,,1000,6,1,0.693,7.6,LV,0.4';

const errors = (site: Site) => validateSite(site).filter((p) => p.severity === 'error');

describe('absurd magnitudes', () => {
  it('1e308 kW is refused with its row, column and the allowed range, once', () => {
    const { site } = siteFromCsv([HEAD, XFMR, 'M1,LV,motor,,1e308,0.95,0.86,,,,,,,0.4'].join('\n'));
    expect(errors(site)).toEqual([
      {
        severity: 'error',
        row: 3,
        column: 'p_kw',
        tag: 'M1',
        message:
          'row 3, column p_kw: p_kw must be at most 1,000,000 kW (a larger value is taken as a typing error); got 1e+308',
      },
    ]);
  });
  it('a quantity of 1e7 and a negative -1e7 kW are refused the same way', () => {
    const { site } = siteFromCsv(
      [HEAD, XFMR, 'M1,LV,motor,10000000,75,0.95,0.86,,,,,,,0.4', 'G1,LV,load,,-1e7,,0.9,,,,,,,'].join('\n'),
    );
    const msgs = errors(site).map((p) => p.message);
    expect(msgs).toContain(
      'row 3, column qty: qty must be at most 10,000 units (a larger value is taken as a typing error); got 10000000',
    );
    expect(msgs).toContain(
      'row 4, column p_kw: p_kw must be at least -1,000,000 kW (a larger value is taken as a typing error); got -10000000',
    );
  });
  it('values at the bound are accepted', () => {
    const { site } = siteFromCsv([HEAD, XFMR, 'M1,LV,motor,10000,75,0.95,0.86,,,,,,,0.4'].join('\n'));
    expect(errors(site)).toEqual([]);
  });
});

function row(i: number, bus: string): EquipmentRow {
  return { row: i + 2, tag: `L${i}`, bus, kind: 'load', values: { p_kw: 1, cos_phi: 0.9 }, loads: {} };
}
const settings = {
  name: 's',
  hz: 50,
  cases: ['normal'],
  requirement: { kind: 'cosphi', target: 0.95 },
} as const;

describe('supported size', () => {
  it('one row more than supported is one error for the whole site, said with the limit', () => {
    const equipment = Array.from({ length: MAX_EQUIPMENT_ROWS + 1 }, (_, i) => row(i, 'LV'));
    const problems = validateSite({ settings, equipment });
    expect(problems).toEqual([
      {
        severity: 'error',
        message:
          'the site has 50,001 equipment rows; Kvar Ledger supports at most 50,000 (see README, Limits)',
      },
    ]);
  });
  it('at the limit of rows nothing is said about size', () => {
    const equipment = Array.from({ length: MAX_EQUIPMENT_ROWS }, (_, i) => row(i, 'LV'));
    expect(siteSizeProblems({ settings, equipment })).toEqual([]);
  });
  it('too many buses and too many cases are said too', () => {
    const buses = Array.from({ length: MAX_BUSES + 1 }, (_, i) => row(i, `B${i}`));
    expect(siteSizeProblems({ settings, equipment: buses }).map((p) => p.message)).toEqual([
      'the site has 1,001 buses; Kvar Ledger supports at most 1,000 (see README, Limits)',
    ]);
    const cases = Array.from({ length: MAX_CASES + 1 }, (_, i) => `c${i}`);
    expect(
      siteSizeProblems({ settings: { ...settings, cases }, equipment: [row(0, 'LV')] }).map((p) => p.message),
    ).toEqual(['the site has 21 operating cases; Kvar Ledger supports at most 20 (see README, Limits)']);
  });
  it('the whole validation of a full-size site runs without a stack overflow from spreads', () => {
    // Every row gives a problem (duplicate tag): 50,000 problems must pass through the lists.
    const equipment = Array.from({ length: MAX_EQUIPMENT_ROWS }, (_, i) => ({ ...row(i, 'LV'), tag: 'X' }));
    expect(validateSite({ settings, equipment }).length).toBeGreaterThanOrEqual(MAX_EQUIPMENT_ROWS - 1);
  });
});

describe('the bank design stays bounded', () => {
  const coldStore = readSiteFile(readFileSync('templates/cold-store.json', 'utf8')).site;
  const withQty = (qty: number): Site => ({
    ...coldStore,
    equipment: coldStore.equipment.map((r) =>
      r.tag === 'CMP-A' ? { ...r, values: { ...r.values, qty } } : r,
    ),
  });
  it.each([200, 500, 10_000])(
    'compressors × %i: at most maxStepsAt steps per bank, and the cap is said',
    (qty) => {
      const site = withQty(qty);
      expect(errors(site)).toEqual([]);
      const design = designCompensation(site);
      for (const b of design.banks) expect(b.steps).toBeLessThanOrEqual(maxStepsAt(b.u_kv));
      const capped = design.warnings.filter((w) => w.code === 'bank-capped');
      expect(capped.map((w) => w.bus)).toContain('LV-REF');
      expect(capped[0]?.message).toMatch(
        /more than the largest bank proposed \(48 × 50 kvar = 2,400 kvar in 4 sections\)/,
      );
    },
  );
  it('the template as shipped needs no cap', () => {
    const design = designCompensation(coldStore);
    expect(design.warnings.filter((w) => w.code === 'bank-capped')).toEqual([]);
  });
});
