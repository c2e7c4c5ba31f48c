// Overloaded branches. A transformer's rated power is its continuous loading (IEC 60076-1); the
// loading is the apparent power it carries over its rating. By hand: 1 000 kW at cos φ 0.8 draw
// S = 1 000/0.8 = 1 250 kVA, so one 1 000 kVA unit carries 125 %, two in parallel 62.5 % each.
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { siteFromCsv } from './fixtures.ts';

const site = (qty: number) =>
  siteFromCsv(
    [
      'tag,bus,kind,to_bus,qty,u_kv,s_kva,uk_pct,i0_pct,p0_kw,pk_kw,p_kw,cos_phi,load:night',
      `T1,MV,transformer,LV,${qty},0.4,1000,6,1,0.69,7.6,,,`,
      'L1,LV,load,,1,0.4,,,,,,1000,0.8,0.5',
    ].join('\n'),
    { sscMva: 250 },
  ).site;

describe('overloaded transformers', () => {
  it('one 1 000 kVA unit under 1 250 kVA: 125 % in the full-load case only', () => {
    const w = assessBanks(site(1), []).warnings.filter((x) => x.code === 'overload');
    expect(w.map((x) => [x.case, x.row, x.tag])).toEqual([['normal', 2, 'T1']]);
    expect(w[0]?.message).toContain(`carries ${((100 * 1000) / 0.8 / 1000).toFixed(1)} % of its rating`);
    // At half load 625 kVA: 62.5 %, no warning.
  });

  it('two units in parallel carry 62.5 % each: nothing', () => {
    expect(assessBanks(site(2), []).warnings.filter((x) => x.code === 'overload')).toEqual([]);
  });
});
