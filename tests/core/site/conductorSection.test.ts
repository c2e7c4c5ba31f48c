// R from the cross-section when R is blank: IEC 60228 Table 2 class 2 at 20 °C (from memory:
// 240 mm² aluminium 0.125 Ω/km, 185 mm² copper 0.0991 Ω/km), at the conductor temperature by
// R20·(1 + α20·(θ − 20)), α20 = 4.03e-3 /K aluminium, 3.93e-3 /K copper (IEC 60287-1-1, from
// memory). Worked by hand here (I = S/(√3·U), P = 3·I²·R·len), then through the roll-up and the
// live and exported workbook.
import { describe, expect, it } from 'vitest';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { close, liveEngine, num, portableEngine, sheet, valueAt } from '../workbook/engineDoc.ts';
import { siteFromCsv } from './fixtures.ts';

const settings = { cases: ['day'], requirement: { kind: 'cosphi' as const, target: 0.95 } };
const amps = (sKva: number, uKv: number) => sKva / (Math.sqrt(3) * uKv);
const lossKw = (sKva: number, uKv: number, rOhmKm: number, lenKm: number) =>
  (3 * amps(sKva, uKv) ** 2 * rOhmKm * lenKm) / 1000;

const LINE_HEAD =
  'tag,bus,kind,to_bus,u_kv,r_ohm_km,cu_mm2,al_mm2,theta_c,l_mh_km,c_nf_km,len_km,p_kw,cos_phi';
const lineSite = (cu: string, al: string, theta: string) =>
  siteFromCsv(
    [LINE_HEAD, `L1,MV,line,B2,20,,${cu},${al},${theta},1.2,10,5,,`, 'X1,B2,load,,20,,,,,,,,6400,0.8'].join(
      '\n',
    ),
    settings,
  );

describe('a 20 kV line of 240 mm² aluminium, R blank, carrying 8 MVA over 5 km', () => {
  it('at 20 °C (θ blank): R = 0.125 Ω/km, 231 A, 100 kW', () => {
    const { site, problems } = lineSite('', '240', '');
    expect(problems).toEqual([]);
    expect(validateSite(site)).toEqual([]);
    expect(lossKw(8000, 20, 0.125, 5)).toBeCloseTo(100, 9);
    expect(rollUp(site, 'day').root.p_kw).toBeCloseTo(6400 + 100, 9);
  });

  it('at 70 °C: R = 0.125 × (1 + 4.03e-3 × 50) = 0.1502 Ω/km, 120.2 kW', () => {
    const { site } = lineSite('', '240', '70');
    const r70 = 0.125 * (1 + 4.03e-3 * 50);
    expect(r70).toBeCloseTo(0.15019, 5);
    expect(rollUp(site, 'day').root.p_kw).toBeCloseTo(6400 + lossKw(8000, 20, r70, 5), 9);
  });

  for (const flavour of ['live', 'portable'] as const)
    it(`the ${flavour} workbook computes the same loss from the section`, () => {
      const { site } = lineSite('', '240', '70');
      const doc = buildWorkbook(site, { flavour, banks: [] });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      const at = sheet(doc, 'Lines').cells.findIndex((row) => row[0] === 'L1');
      const want = rollUp(site, 'day').elements.find((e) => e.tag === 'L1')?.p_kw as number;
      expect(want).toBeGreaterThan(100);
      expect(close(num(valueAt(hf, doc, 'Lines', at, 'P loss day (kW)')), want)).toBe(true);
    });
});

describe('a 400 V feeder cable of 185 mm² copper at 90 °C (XLPE), R blank', () => {
  const HEAD = 'tag,bus,kind,to_bus,u_kv,cu_mm2,theta_c,x_ohm_km,len_km,p_kw,cos_phi';
  const csv = [HEAD, 'F1,LV,feeder,DB1,0.4,185,90,0.08,0.2,,', 'P1,DB1,load,,0.4,,,,,250,0.85'];
  it('R = 0.0991 × 1.2751 = 0.1264 Ω/km: 13.7 kW at 294 kVA', () => {
    const { site } = siteFromCsv(csv.join('\n'), settings);
    expect(validateSite(site)).toEqual([]);
    const r90 = 0.0991 * (1 + 3.93e-3 * 70);
    const want = lossKw(250 / 0.85, 0.4, r90, 0.2);
    expect(want).toBeCloseTo(13.66, 2);
    expect(rollUp(site, 'day').elements.find((e) => e.tag === 'F1')?.p_kw).toBeCloseTo(want, 9);
  });
});

describe('cross-sections in the checks', () => {
  it('both metals given: a warning on al_mm2, and R comes from the copper section', () => {
    const { site } = lineSite('240', '240', '');
    const found = validateSite(site);
    expect(found.map((p) => [p.severity, p.column])).toEqual([['warning', 'al_mm2']]);
    expect(found[0]?.message).toContain(
      'both cu_mm2 and al_mm2 are given for line L1; R comes from the copper section',
    );
    expect(rollUp(site, 'day').root.p_kw).toBeCloseTo(6400 + lossKw(8000, 20, 0.0754, 5), 9);
  });

  it('a size the table does not hold: an error naming the column and the standard sizes', () => {
    const { site } = lineSite('', '230', '');
    const r = rollUp(site, 'day');
    const text = JSON.stringify(r);
    expect(text).toContain(
      'argument 1 (area_mm2) must be a standard aluminium cross-section of IEC 60228 class 2',
    );
  });
});
