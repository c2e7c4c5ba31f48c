// Plausibility ranges: values the catalogue accepts but no real item has. Ranges are common
// practice (from memory): power cables 0.1–1.5 µF/km, overhead lines 8–14 nF/km, line and cable
// inductance 0.25–1.4 mH/km. Transformer losses against Commission Regulation (EU) No 548/2014,
// Annex I, Tier 2: 1 000 kVA liquid-immersed Pk ≤ 7.6 kW, P0 ≤ 0.693 kW (Table I.1); dry-type
// Pk ≤ 9 kW, P0 ≤ 1.395 kW (Table I.2) (values from memory).
import { describe, expect, it } from 'vitest';
import { validateSite } from '../../../src/core/site/validate.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { siteFromCsv } from './fixtures.ts';

function warningsOf(csv: string) {
  const { site, problems } = siteFromCsv(csv);
  expect(problems).toEqual([]);
  return { site, found: validateSite(site).filter((p) => p.severity === 'warning') };
}

describe('capacitance per km', () => {
  it('a cable typed in nF/km in the µF/km column is flagged, with the other reading', () => {
    // (Above 100 µF/km the value is refused outright as a typing error: limits.ts.)
    const { site, found } = warningsOf('tag,bus,kind,u_kv,c_uf_km,len_km\nK1,MV,cable,11,80,2');
    expect(found.map((p) => [p.row, p.column])).toEqual([[2, 'c_uf_km']]);
    expect(found[0]?.message).toMatch(/80 µF\/km is outside the usual 0\.05–2 µF\/km/);
    expect(found[0]?.message).toMatch(/typed in nF\/km\? 80 nF\/km is 0\.08 µF\/km/);
    // What it would cost if nobody noticed: ω·C·len·U² = 2π·50·80e-6·2·11 000² ≈ 6.1 Mvar.
    const q = -rollUp(site, 'normal').root.q_kvar;
    expect(q).toBeCloseTo((2 * Math.PI * 50 * 80e-6 * 2 * 11000 ** 2) / 1000, 6);
  });

  it('a plausible cable (0.25 µF/km) raises nothing', () => {
    expect(warningsOf('tag,bus,kind,u_kv,c_uf_km,len_km\nK1,MV,cable,11,0.25,2').found).toEqual([]);
  });

  it('a line typed in µF/km in the nF/km column is flagged, with the other reading', () => {
    const { found } = warningsOf(
      'tag,bus,kind,to_bus,u_kv,r_ohm_km,l_mh_km,c_nf_km,len_km\nL1,A,line,B,20,0.12,1.2,0.011,5\nX,B,load,,20',
    );
    expect(found.map((p) => p.column)).toEqual(['c_nf_km']);
    expect(found[0]?.message).toMatch(/typed in µF\/km\? 0\.011 µF\/km is 11 nF\/km/);
  });

  it('an overhead line of 1.2 mH/km and 10 nF/km raises nothing', () => {
    // 0.12 Ω/km: a typical 240 mm² aluminium overhead conductor (from memory).
    const { found } = warningsOf(
      'tag,bus,kind,to_bus,u_kv,r_ohm_km,l_mh_km,c_nf_km,len_km\nL1,A,line,B,20,0.12,1.2,10,5',
    );
    expect(found).toEqual([]);
  });
});

describe('transformer losses against EU 548/2014 Tier 2', () => {
  const head = 'tag,bus,kind,to_bus,u_kv,s_kva,uk_pct,i0_pct,p0_kw,pk_kw';
  it('within the liquid-immersed maxima: nothing', () => {
    expect(warningsOf(`${head}\nT1,MV,transformer,LV,0.4,1000,6,1,0.69,7.6`).found).toEqual([]);
  });

  it('load losses typed in W are flagged, with the reading in kW', () => {
    const { found } = warningsOf(`${head}\nT1,MV,transformer,LV,0.4,1000,6,1,0.69,7600`);
    expect(found.map((p) => p.column)).toEqual(['pk_kw']);
    expect(found[0]?.message).toMatch(/Regulation \(EU\) No 548\/2014/);
    expect(found[0]?.message).toMatch(/7\.6 kW liquid-immersed, Table I\.1; 9 kW dry-type, Table I\.2/);
    expect(found[0]?.message).toMatch(/typed in W\? 7600 W is 7\.6 kW/);
  });

  it('an old unit with 1.8 kW no-load losses (above even the dry-type 1.395 kW + 15 %) is flagged', () => {
    const { found } = warningsOf(`${head}\nT1,MV,transformer,LV,0.4,1000,6,1,1.8,9`);
    expect(found.map((p) => p.column)).toEqual(['p0_kw']);
    expect(found[0]?.message).toMatch(/0\.693 kW liquid-immersed/);
    expect(found[0]?.message).not.toMatch(/typed in W/);
  });

  it('above 3 150 kVA the Regulation uses another measure: nothing checked', () => {
    expect(warningsOf(`${head}\nT1,HV,transformer,MV,33,60000,12,0.25,28,400`).found).toEqual([]);
  });
});
