// No silent infinite supply: a site with and without the supply's short-circuit power.
// Hand-worked: the short-circuit power below a transformer is that of the supply and the
// transformer's own (S/uk) in series (IEC 60909-0, reactances only), and a plain bank resonates
// at h = √(Ssc/Qc) (IEEE Std 1036). The typical value offered is common practice, from memory.
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { typicalSupplyShortCircuit } from '../../../src/core/site/typical/supply.ts';
import { siteFromCsv } from './fixtures.ts';

const CSV = [
  'tag,bus,kind,to_bus,qty,running,u_kv,s_kva,uk_pct,i0_pct,p0_kw,pk_kw,p_kw,cos_phi,q_kvar,u_rated_kv',
  'AUX,MV,load,,1,1,20,,,,,,50,0.9,,',
  'T1,MV,transformer,LV,1,1,0.4,1000,6,1,1.1,9,,,,',
  'L1,LV,load,,1,1,0.4,,,,,,600,0.8,,',
  'C1,LV,capacitor,,1,1,0.4,,,,,,,,140,0.4',
].join('\n');

function site(sscMva?: number) {
  const { site, problems } = siteFromCsv(CSV, sscMva === undefined ? {} : { sscMva });
  expect(problems).toEqual([]);
  return site;
}

const transformerMva = 1000 / 1000 / 0.06; // S/uk: 16.667 MVA

describe('the supply short-circuit power at the point of connection', () => {
  it('blank: a warning at the connection bus offers the typical value for 20 kV, marked typical', () => {
    const { warnings } = assessBanks(site(), []);
    const w = warnings.filter((x) => x.code === 'supply-unknown');
    expect(w).toHaveLength(1);
    expect(w[0]?.severity).toBe('warning');
    expect(w[0]?.bus).toBe('MV');
    // 20 kV lies in the ≤ 24 kV level of the table (common practice, from memory): 350 MVA.
    expect(w[0]?.message).toMatch(
      /typical value at 20 kV is 350 MVA \(typical: .*common practice.*from memory\)/,
    );
    expect(w[0]?.message).toMatch(/as if the supply were infinite/);
  });

  it('blank: the resonance below the transformer is worked out on S/uk alone and says so', () => {
    const order = Math.sqrt((transformerMva * 1000) / 140); // √(16 667/140) = 10.91, near the 11th
    const r = assessBanks(site(), []).warnings.find((x) => x.code === 'resonance');
    expect(r?.message).toContain(
      `short-circuit power ${transformerMva.toFixed(2)} MVA (with an infinite supply assumed`,
    );
    expect(r?.message).toContain(`order ${order.toFixed(2)}`);
  });

  it('given 250 MVA: no supply warning; the supply is in series with the transformer', () => {
    const ssc = 1 / (1 / 250 + 1 / transformerMva); // 15.625 MVA
    const order = Math.sqrt((ssc * 1000) / 140); // 10.56, still near the 11th
    const { warnings } = assessBanks(site(250), []);
    expect(warnings.filter((x) => x.code === 'supply-unknown')).toEqual([]);
    const r = warnings.find((x) => x.code === 'resonance');
    expect(r?.message).toContain(`short-circuit power ${ssc.toFixed(2)} MVA)`);
    expect(r?.message).toContain(`order ${order.toFixed(2)}`);
    expect(r?.message).not.toMatch(/infinite/);
  });

  it('the design carries the same warning, once', () => {
    const design = designCompensation(site());
    expect(design.warnings.filter((x) => x.code === 'supply-unknown')).toHaveLength(1);
    expect(designCompensation(site(250)).warnings.filter((x) => x.code === 'supply-unknown')).toEqual([]);
  });

  it('typical values by voltage level: steps at the level limits, none above 245 kV', () => {
    expect(typicalSupplyShortCircuit(0.4)?.value).toBe(15);
    expect(typicalSupplyShortCircuit(11)?.value).toBe(250);
    expect(typicalSupplyShortCircuit(24)?.value).toBe(350);
    expect(typicalSupplyShortCircuit(33)?.value).toBe(750);
    expect(typicalSupplyShortCircuit(132)?.value).toBe(5000);
    expect(typicalSupplyShortCircuit(400)).toBeUndefined();
    expect(typicalSupplyShortCircuit(132)?.source.kind).toBe('common practice');
  });
});
