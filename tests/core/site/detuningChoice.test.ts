// Detuning chosen from the harmonic sources on a bus, not from resonance distance alone.
// Hand-worked: the sources' kVA from the power triangle (S = P/cos φ; a 6-pulse drive draws
// displacement factor 0.96, common practice, from memory), the bus short-circuit power from the
// supply and the transformer in series (IEC 60909-0 simplified: U²/Ssc + uk·U²/Sr), and the
// resonance order of each switching state recomputed from the reactances (independent.ts).
// Thresholds (common practice, stated in src/core/site/detuningChoice.ts): detune above 15 % of
// harmonic-source kVA against the transformer rating; 14 % when single-phase electronic load is at
// least half the sources; otherwise plain unless a state resonates within 10 % of the 5th or 7th
// (or of the 11th and 13th when 6-pulse sources are present).
import { describe, expect, it } from 'vitest';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import type { BankDesign } from '../../../src/core/site/bankSizing.ts';
import { parallelResonanceOrder } from '../functions/independent.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,to_bus,qty,p_kw,eff,cos_phi,load,u_kv,supply,s_kva,uk_pct,i0_pct,p0_kw,pk_kw';
const SSC_MVA = 250;
const xfmr = (kva: number) =>
  `T1,MV,transformer,LV,,,,,,0.4,,${kva},6,1,${kva / 1000},${(kva / 100).toFixed(1)}`;

function design(rows: string[]) {
  const { site, problems } = siteFromCsv([HEAD, ...rows].join('\n'), { sscMva: SSC_MVA });
  expect([...problems, ...validateSite(site)].filter((p) => p.severity === 'error')).toEqual([]);
  const d = designCompensation(site);
  const bank = d.banks.find((b) => b.bus === 'LV') as BankDesign;
  expect(bank).toBeDefined();
  const finding = d.warnings.find((w) => w.code === 'detuning-choice' && w.bus === 'LV');
  const resonance = d.warnings.filter((w) => w.code === 'resonance' && w.bus === 'LV');
  return { bank, finding, resonance };
}

/** Bus short-circuit MVA below a transformer of sr kVA, uk %, on a supply of SSC_MVA (reactances in series). */
const busSsc = (srKva: number, ukPct: number) => 1 / (1 / SSC_MVA + ukPct / 100 / (srKva / 1000));
/** Switching states of a plain bank: fixed, then each step added. */
const states = (b: BankDesign) =>
  [b.fixed_kvar, ...Array.from({ length: b.steps }, (_, k) => b.fixed_kvar + (k + 1) * b.step_kvar)].filter(
    (q) => q > 0,
  );
const near = (h: number, n: number) => Math.abs(h - n) <= 0.1 * n;

describe('detuning from harmonic sources', () => {
  it('a bus of direct-on-line motors only: plain, although a plain state resonates near the 11th/13th', () => {
    const { bank, finding, resonance } = design([
      xfmr(630),
      'M1,LV,motor,,3,55,0.93,0.84,1,0.4,DOL,,,,,',
      'M2,LV,motor,,2,30,0.92,0.83,1,0.4,,,,,,',
    ]);
    const ssc = busSsc(630, 6);
    expect(bank.ssc_mva).toBeCloseTo(ssc, 6);
    const orders = states(bank).map((q) => parallelResonanceOrder(ssc, q));
    // The merged ±10 % bands of the 11th and 13th (9.9–14.3) catch a state: the old rule detuned here.
    expect(orders.some((h) => near(h, 11) || near(h, 13))).toBe(true);
    expect(orders.some((h) => near(h, 5) || near(h, 7))).toBe(false);
    expect(bank.p_pct).toBe(0);
    expect(bank.why).toMatch(
      /plain capacitors: no harmonic sources on the bus or below and no switching state/,
    );
    expect(finding?.severity).toBe('info');
    // Near the 11th or 13th with nothing on the bus producing them: said, as information.
    expect(resonance.length).toBeGreaterThan(0);
    expect(
      resonance.every(
        (w) => w.severity === 'info' && /which no item on bus LV or below produces/.test(w.message),
      ),
    ).toBe(true);
    expect(finding?.message).toMatch(
      /no switching state of a plain bank resonates within 10 % of the 5th or 7th/,
    );
  });

  it('6-pulse drive pumps at about 40 % of the transformer: 7 %', () => {
    const { bank, finding } = design([
      xfmr(630),
      'P1,LV,motor,,5,55,0.94,0.85,0.8,0.4,VSD 6-pulse,,,,,',
      'M1,LV,motor,,3,75,0.95,0.82,1,0.4,,,,,,',
    ]);
    // By hand: each pump draws 55·0.8/0.94 = 46.81 kW at 0.96: 48.76 kVA; five: 243.8 kVA = 38.7 % of 630 kVA.
    const sources = (5 * ((55 * 0.8) / 0.94)) / 0.96;
    expect(sources).toBeCloseTo(243.8, 1);
    expect(sources / 630).toBeGreaterThan(0.15);
    expect(bank.p_pct).toBe(7);
    expect(bank.why).toContain(
      `detuned at 7 %: harmonic sources (6-pulse drives and rectifiers 244 kVA) are ${((100 * sources) / 630).toFixed(0)} % of transformer T1 (630 kVA) in case normal, above 15 %`,
    );
    expect(finding?.message).toContain('39 % of transformer T1 (630 kVA)');
  });

  it('an office-like bus of electronic lighting: 14 %', () => {
    const { bank } = design([
      xfmr(400),
      'LT,LV,load,,1,150,,0.92,1,0.4,electronic lighting,,,,,',
      'AHU,LV,motor,,4,30,0.92,0.8,1,0.4,,,,,,',
    ]);
    // By hand: 150/0.92 = 163.0 kVA of single-phase electronic load = 40.8 % of 400 kVA, all of the sources.
    expect(150 / 0.92 / 400).toBeCloseTo(0.408, 3);
    expect(bank.p_pct).toBe(14);
    expect(bank.why).toMatch(
      /detuned at 14 % \(single-phase electronic load is at least 50 % of the sources: the 3rd dominates\)/,
    );
    expect(bank.why).toContain('single-phase electronic load 163 kVA) are 41 % of transformer T1 (400 kVA)');
  });

  it('a per-bus detuning still wins', () => {
    const { site } = siteFromCsv(
      [
        HEAD,
        xfmr(630),
        'P1,LV,motor,,5,55,0.94,0.85,0.8,0.4,VSD 6-pulse,,,,,',
        'M1,LV,motor,,3,75,0.95,0.82,1,0.4,,,,,,',
      ].join('\n'),
      { sscMva: SSC_MVA },
    );
    const bank = designCompensation(site, undefined, { detuning: { LV: 0 } }).banks.find(
      (b) => b.bus === 'LV',
    );
    expect(bank?.p_pct).toBe(0);
    expect(bank?.why).toContain('detuning 0 % as chosen for this bus');
  });
});

describe("Checks on a bank typed on the Compensation sheet, by the design's rule", () => {
  const PUMPS = [
    xfmr(630),
    'P1,LV,motor,,5,55,0.94,0.85,0.8,0.4,VSD 6-pulse,,,,,',
    'M1,LV,motor,,3,75,0.95,0.82,1,0.4,,,,,,',
  ];
  const OFFICE = [xfmr(400), 'LT,LV,load,,1,150,,0.92,1,0.4,electronic lighting,,,,,'];
  const findings = (rows: string[], p?: number) => {
    const { site } = siteFromCsv([HEAD, ...rows].join('\n'), { sscMva: SSC_MVA });
    const bank = { bus: 'LV', step_kvar: 25, steps: 4, ...(p !== undefined ? { p_pct: p } : {}) };
    return assessBanks(site, [bank]).warnings.filter((w) => w.code === 'detuning-choice');
  };

  it('a plain bank among 39 % of 6-pulse sources: a warning to detune at 7 %', () => {
    const [w, ...more] = findings(PUMPS);
    expect(more).toEqual([]);
    expect(w?.severity).toBe('warning');
    expect(w?.message).toContain('the plain bank on bus LV shares it with harmonic sources');
    expect(w?.message).toContain('39 % of transformer T1 (630 kVA)');
    expect(w?.message).toContain('detune it (7 % here)');
  });
  it('the same bank at 7 %: nothing to say', () => {
    expect(findings(PUMPS, 7)).toEqual([]);
  });
  it('a 7 % bank among electronic lighting: information that 14 % keeps the tuning below the 3rd', () => {
    const [w] = findings(OFFICE, 7);
    expect(w?.severity).toBe('info');
    expect(w?.message).toContain('14 % keeps the tuning below it');
    expect(findings(OFFICE, 14)).toEqual([]);
  });
});
