// Checks judges a typed plain bank's resonance by the design's harmonic-source rule
// (detuningChoice.ts): near the 11th or 13th with no 6-pulse source on the bus or below it is
// information, with one it is a warning; the background 5th and 7th always warn. Hand-worked:
// - short-circuit power below the transformer, reactances in series (IEC 60909-0):
//   1/Ssc = 1/250 MVA + 0.06/1 MVA → 15.625 MVA;
// - parallel resonance h = √(Ssc/Qc) (IEEE Std 1036): 90 kvar in → √(15 625/90) = 13.18, within
//   10 % of the 13th; 30 and 60 kvar give 22.8 and 16.1, near nothing.
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';

function siteWith(supply: string | undefined) {
  const file = JSON.stringify({
    format: 'kvar-ledger-site',
    version: 1,
    settings: {
      name: 'resonance and sources',
      hz: 50,
      cases: ['day'],
      requirement: { kind: 'cosphi', target: 0.95 },
      sscMva: 250,
    },
    equipment: [
      {
        tag: 'T1',
        bus: 'MV',
        kind: 'transformer',
        to_bus: 'LV',
        s_kva: 1000,
        uk_pct: 6,
        i0_pct: 1,
        p0_kw: 1.5,
        pk_kw: 10,
        u_kv: 0.4,
      },
      { tag: 'MV-L', bus: 'MV', kind: 'load', p_kw: 10, cos_phi: 0.9, u_kv: 11 },
      { tag: 'L1', bus: 'LV', kind: 'load', p_kw: 300, cos_phi: 0.8, u_kv: 0.4 },
      {
        tag: 'L2',
        bus: 'LV',
        kind: 'load',
        p_kw: 200,
        cos_phi: 0.95,
        u_kv: 0.4,
        ...(supply ? { supply } : {}),
      },
    ],
  });
  const r = readSiteFile(file);
  expect(r.problems.filter((p) => p.severity === 'error')).toEqual([]);
  return r.site;
}

const ssc = 1 / (1 / 250 + 0.06 / 1);
const h90 = Math.sqrt((ssc * 1000) / 90);
const bank = { bus: 'LV', step_kvar: 30, steps: 4 };

describe('resonance of a typed plain bank follows the harmonic sources', () => {
  it('the hand figure: 90 kvar resonate at 13.18, within 10 % of the 13th', () => {
    expect(ssc).toBeCloseTo(15.625, 9);
    expect(Math.abs(h90 / 13 - 1)).toBeLessThan(0.1);
  });

  it('no 6-pulse source on the bus: information, and it says why', () => {
    const w = assessBanks(siteWith(undefined), [bank]).warnings.filter((x) => x.code === 'resonance');
    expect(w).toHaveLength(1);
    expect(w[0]?.severity).toBe('info');
    expect(w[0]?.message).toContain(`order ${h90.toFixed(2)}`);
    expect(w[0]?.message).toContain('near the 13th harmonic, which no item on bus LV or below produces');
  });

  it('a 6-pulse drive on the bus: a warning', () => {
    const w = assessBanks(siteWith('VSD 6-pulse'), [bank]).warnings.filter((x) => x.code === 'resonance');
    expect(w).toHaveLength(1);
    expect(w[0]?.severity).toBe('warning');
    expect(w[0]?.message).toContain(`order ${h90.toFixed(2)}, near the 13th harmonic; choose`);
  });

  it('near the background 5th it warns whatever the sources: 600 kvar resonate at √(15 625/600) = 5.10', () => {
    const w = assessBanks(siteWith(undefined), [{ bus: 'LV', fixed_kvar: 600 }]).warnings.filter(
      (x) => x.code === 'resonance',
    );
    expect(Math.sqrt((ssc * 1000) / 600)).toBeCloseTo(5.1, 2);
    expect(w.map((x) => x.severity)).toEqual(['warning']);
  });
});
