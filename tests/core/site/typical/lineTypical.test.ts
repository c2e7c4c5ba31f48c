// Typical inductance and capacitance of an overhead line by voltage level (common practice,
// values from memory), checked against the geometry they stand for: per phase
// L = 2·10⁻⁷·ln(D/r′) H/m with r′ = e^(−1/4)·r for a solid round conductor, and
// C = 2π·ε₀/ln(D/r) F/m (Grainger and Stevenson, Power System Analysis, chapters 4 and 5; the
// textbook formulas). Then a 20 kV line whose L and C were left blank, filled and balanced,
// against its I²X and charging worked by hand.
import { describe, expect, it } from 'vitest';
import { assumeTypical } from '../../../../src/core/site/typical/assume.ts';
import { typicalFillRow } from '../../../../src/core/site/typical/fillRow.ts';
import { fillSiteTypical } from '../../../../src/core/site/typical/fillSite.ts';
import { LINE_BANDS } from '../../../../src/core/site/typical/lines.ts';
import { SOURCES } from '../../../../src/core/site/typical/sources.ts';
import { rollUp } from '../../../../src/core/site/rollup.ts';
import { validateSite } from '../../../../src/core/site/validate.ts';
import { siteFromCsv } from '../fixtures.ts';

const EPS0 = 8.8541878128e-12; // F/m, CODATA 2018
const C0 = 299_792_458; // m/s, speed of light (SI definition)
const inductanceMhKm = (dM: number, rM: number) => 2e-7 * Math.log(dM / (Math.exp(-0.25) * rM)) * 1e6;
const capacitanceNfKm = (dM: number, rM: number) => ((2 * Math.PI * EPS0) / Math.log(dM / rM)) * 1e12;

describe('typical overhead line L and C by voltage', () => {
  // Representative single-circuit geometry per band (common practice, from memory): MV pole
  // tops space the phases about 1.2 m apart with 50–150 mm² conductors (radius about 6 mm);
  // 66–132 kV towers about 4.5 m with 240 mm² class conductors (radius about 10.5 mm).
  const geometry = [
    { upToKv: 36, d: 1.2, r: 0.006 },
    { upToKv: 145, d: 4.5, r: 0.0105 },
  ];
  for (const g of geometry)
    it(`up to ${g.upToKv} kV: within 3 % of the geometry's L and C`, () => {
      const b = LINE_BANDS.find((x) => x.upToKv === g.upToKv)!;
      expect(Math.abs(b.lMhKm / inductanceMhKm(g.d, g.r) - 1)).toBeLessThan(0.03);
      expect(Math.abs(b.cNfKm / capacitanceNfKm(g.d, g.r) - 1)).toBeLessThan(0.03);
    });

  it('each pair travels just below the speed of light, as a line in air must: 1 ≤ L·C·c² < 1.1', () => {
    // L·C = μ₀ε₀·ln(D/r′)/ln(D/r) ≥ 1/c², the excess being the conductor's inner flux.
    for (const b of LINE_BANDS) {
      const lc = b.lMhKm * 1e-6 * (b.cNfKm * 1e-12) * C0 ** 2;
      expect(lc).toBeGreaterThanOrEqual(1);
      expect(lc).toBeLessThan(1.1);
    }
  });

  it('a blank L and C take the band values, naming the source; typed ones stay', () => {
    const mv = assumeTypical({ kind: 'line', values: { u_kv: 20, len_km: 5 } });
    expect(mv.assumed).toEqual([
      expect.objectContaining({ column: 'l_mh_km', value: 1.1, source: SOURCES.lineGeometry }),
      expect.objectContaining({ column: 'c_nf_km', value: 10.5, source: SOURCES.lineGeometry }),
    ]);
    expect(mv.assumed[0]?.note).toBe(
      'assumed 1.1 (20 kV single-circuit overhead line; typical overhead line L and C by voltage (common practice))',
    );
    const hv = assumeTypical({ kind: 'line', values: { u_kv: 110, c_nf_km: 8.7 } });
    expect(hv.assumed.map((a) => [a.column, a.value])).toEqual([['l_mh_km', 1.25]]);
    // The bands meet at 36 kV.
    expect(assumeTypical({ kind: 'line', values: { u_kv: 36 } }).assumed[0]?.value).toBe(1.1);
    expect(assumeTypical({ kind: 'line', values: { u_kv: 66 } }).assumed[0]?.value).toBe(1.25);
  });

  it('says why none is assumed at low voltage, above 145 kV or without a voltage', () => {
    expect(assumeTypical({ kind: 'line', values: { u_kv: 0.4, c_nf_km: 9 } }).notAssumed).toEqual([
      "l_mh_km: no typical value at or below 1 kV, where open-wire lines and aerial bundled cables differ threefold: take the maker's data",
    ]);
    expect(assumeTypical({ kind: 'line', values: { u_kv: 220 } }).notAssumed[0]).toMatch(
      /^l_mh_km: no typical value above 145 kV, where bundled conductors/,
    );
    expect(assumeTypical({ kind: 'line', values: {} }).notAssumed).toEqual([
      'l_mh_km: no typical value without the voltage (u_kv)',
      'c_nf_km: no typical value without the voltage (u_kv)',
    ]);
  });

  it('the one fill rule never writes over text in the cell', () => {
    const row: Record<string, number | string | null> = { u_kv: 20, l_mh_km: 'ask the utility' };
    expect(typicalFillRow('line', (k) => row[k]).writes.map((w) => w.column)).toEqual(['c_nf_km']);
  });
});

describe('a 20 kV line of 240 mm² aluminium, L and C blank, carrying 8 MVA over 5 km', () => {
  const csv = [
    'tag,bus,kind,to_bus,u_kv,al_mm2,l_mh_km,c_nf_km,len_km,p_kw,cos_phi',
    'L1,MV,line,B2,20,240,,,5,,',
    'X1,B2,load,,20,,,,,6400,0.8',
  ].join('\n');

  it('is refused as it stands, and balances once filled: I²X and charging by hand', () => {
    const { site } = siteFromCsv(csv, { cases: ['day'] });
    expect(
      validateSite(site)
        .filter((p) => p.severity === 'error')
        .map((p) => p.column),
    ).toEqual(['l_mh_km', 'c_nf_km']);
    const filled = fillSiteTypical(site);
    expect(filled.assumed.map((a) => [a.column, a.value])).toEqual([
      ['l_mh_km', 1.1],
      ['c_nf_km', 10.5],
    ]);
    expect(validateSite(filled.site)).toEqual([]);
    // By hand: I = 8000 kVA / (√3 · 20 kV) = 230.9 A; X = 2π·50·1.1 mH/km = 0.3456 Ω/km;
    // 3·I²·X·5 km = 276.5 kvar absorbed; charging ω·C·U²·len = 314.16 · 10.5e-9 · 20 000² · 5
    // = 6.6 kvar delivered; R from 240 mm² aluminium 0.125 Ω/km (IEC 60228, from memory): 100 kW.
    const amps = 8000 / (Math.sqrt(3) * 20);
    const i2x = (3 * amps ** 2 * (2 * Math.PI * 50 * 1.1e-3) * 5) / 1000;
    const charging = (2 * Math.PI * 50 * 10.5e-9 * 20_000 ** 2 * 5) / 1000;
    expect(i2x).toBeCloseTo(276.5, 1);
    expect(charging).toBeCloseTo(6.6, 1);
    const root = rollUp(filled.site, 'day').root;
    expect(root.q_kvar).toBeCloseTo(4800 + i2x - charging, 6);
    expect(root.p_kw).toBeCloseTo(6400 + 100, 6);
  });
});
