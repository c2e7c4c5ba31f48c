// Bus totals of an invented site, recomputed independently in handCalc.ts from the published
// formulas (no code under test involved), for two operating cases, with a transformer, a
// cable, a line, a detuned capacitor, a generator and a reactor.
import { describe, expect, it } from 'vitest';
import { rollUp, SiteStructureError } from '../../../src/core/site/rollup.ts';
import { handTotals, type HandRow } from './handCalc.ts';
import { siteFromCsv } from './fixtures.ts';

// The transformer: 1000 kVA, uk 6 %, i0 1 %, with the EU Regulation 548/2014 Tier 2 loss limits
// Pk 7.6 kW and P0 0.693 kW (from memory): leakage 59.52 kvar at full load, magnetising
// 9.976 kvar (recomputed in handCalc.ts and tests/core/functions/recomputed.ts).
const ROWS: HandRow[] = [
  {
    tag: 'T1',
    bus: 'MV',
    kind: 'transformer',
    to_bus: 'LV',
    s_kva: 1000,
    uk_pct: 6,
    i0_pct: 1,
    p0_kw: 0.693,
    pk_kw: 7.6,
    u_kv: 0.4,
  },
  { tag: 'K1', bus: 'MV', kind: 'cable', u_kv: 11, c_uf_km: 0.31, len_km: 2.5 },
  // 0.32 Ω/km: 95 mm² aluminium (IEC 60228 class 2 at 20 °C, from memory).
  {
    tag: 'W1',
    bus: 'MV',
    kind: 'line',
    to_bus: 'FAR',
    u_kv: 11,
    r_ohm_km: 0.32,
    l_mh_km: 1.1,
    c_nf_km: 9.5,
    len_km: 12,
  },
  {
    tag: 'G1',
    bus: 'FAR',
    kind: 'generator',
    p_kw: 400,
    cos_phi: 0.9,
    u_kv: 11,
    'load:day': 1,
    'load:night': 0.25,
  },
  {
    tag: 'M1',
    bus: 'LV',
    kind: 'motor',
    qty: 3,
    running: 2,
    p_kw: 75,
    eff: 0.95,
    cos_phi: 0.86,
    u_kv: 0.4,
    'load:day': 0.8,
    'load:night': 0,
  },
  {
    tag: 'M2',
    bus: 'LV',
    kind: 'motor',
    p_kw: 110,
    eff: 0.954,
    cos_phi: 0.87,
    i0_pct: 30,
    u_kv: 0.4,
    'load:day': 1.1,
    'load:night': 0.4,
  },
  { tag: 'L1', bus: 'LV', kind: 'load', p_kw: 180, cos_phi: 0.9, 'load:day': 1, 'load:night': 0.5 },
  {
    tag: 'Q1',
    bus: 'LV',
    kind: 'capacitor',
    qty: 4,
    q_kvar: 80,
    u_rated_kv: 0.525,
    u_kv: 0.4,
    p_pct: 7,
    'load:day': 1,
    'load:night': 0.25,
  },
  {
    tag: 'R1',
    bus: 'MV',
    kind: 'reactor',
    q_kvar: 100,
    u_rated_kv: 11.5,
    u_kv: 11,
    'load:day': 0,
    'load:night': 1,
  },
];

function csvOf(rows: HandRow[]): string {
  const keys = [...new Set(rows.flatMap((r) => Object.keys(r)))];
  return [keys.join(','), ...rows.map((r) => keys.map((k) => String(r[k] ?? '')).join(','))].join('\n');
}

const { site, problems } = siteFromCsv(csvOf(ROWS), { cases: ['day', 'night'] });

describe('rollUp against an independent recomputation', () => {
  it('the invented site reads without problems', () => {
    expect(problems).toEqual([]);
  });
  for (const caseName of ['day', 'night']) {
    it(`bus totals in case ${caseName}`, () => {
      const hand = handTotals(ROWS, caseName, 50);
      const bal = rollUp(site, caseName);
      expect(bal.buses.map((b) => b.bus)).toEqual(['MV', 'LV', 'FAR']);
      for (const b of bal.buses) {
        const h = hand.get(b.bus);
        expect(b.p_kw).toBeCloseTo(h?.p as number, 9);
        expect(b.q_kvar).toBeCloseTo(h?.q as number, 9);
        expect(b.s_kva).toBeCloseTo(h?.s as number, 9);
        expect(b.cos_phi).toBeCloseTo(Math.abs(h?.p as number) / (h?.s as number), 12);
        expect(b.q_absorbed_kvar - b.q_delivered_kvar).toBeCloseTo(b.q_kvar, 9);
      }
      expect(bal.root.bus).toBe('MV');
      expect(bal.problems).toEqual([]);
    });
  }
  it('shows absorbed and delivered kvar apart (day: capacitor, cable and line charging, generator deliver)', () => {
    const bal = rollUp(site, 'day');
    const lv = bal.buses.find((b) => b.bus === 'LV');
    // Q1: 4 × 80 kvar at 525 V run at 400 V behind 7 %: 4 × 80·(0.4/0.525)²/0.93 (a worked example recalled from memory gives 49.9 kvar each).
    const q1 = (4 * 80 * (0.4 / 0.525) ** 2) / 0.93;
    expect(q1 / 4).toBeCloseTo(49.9, 1);
    expect(lv?.q_delivered_kvar).toBeCloseTo(q1, 9);
    const mv = bal.root;
    const cable = (2 * Math.PI * 50 * 0.31e-6 * 2.5 * 11000 ** 2) / 1000;
    const lineCharging = (2 * Math.PI * 50 * 9.5e-9 * 12 * 11000 ** 2) / 1000;
    const gen = 400 * (Math.sqrt(1 - 0.81) / 0.9);
    expect(mv.q_delivered_kvar).toBeCloseTo(q1 + cable + lineCharging + gen, 9);
    expect(mv.sense).toBe(mv.q_kvar > 0 ? 'lagging' : 'leading');
  });
  it('a transformer element carries the apparent power of its bus and its loading', () => {
    const bal = rollUp(site, 'day');
    const t1 = bal.elements.find((e) => e.tag === 'T1');
    const lv = bal.buses.find((b) => b.bus === 'LV');
    expect(t1?.s_load_kva).toBeCloseTo(lv?.s_kva as number, 12);
    expect(t1?.loading_pct).toBeCloseTo((lv?.s_kva as number) / 10, 12);
    expect(t1?.bus).toBe('MV');
  });
  it('load factor 0 switches a motor off; a running motor at a small load draws its magnetising kvar', () => {
    const night = rollUp(site, 'night');
    expect(night.elements.find((e) => e.tag === 'M1')).toMatchObject({ p_kw: 0, q_kvar: 0, load: 0 });
    const m2 = night.elements.find((e) => e.tag === 'M2');
    const q0 = 0.3 * (110 / (0.954 * 0.87));
    expect(m2?.q_kvar).toBeGreaterThan(q0);
  });
  it('refuses an unknown case and a site that is not a tree', () => {
    expect(() => rollUp(site, 'weekend')).toThrowError(
      /unknown case "weekend"; the site's cases are day, night/,
    );
    expect(rollUp(site, 'NIGHT').case).toBe('night');
    const twice = {
      ...site,
      equipment: [
        ...site.equipment,
        { ...(site.equipment[0] as (typeof site.equipment)[number]), row: 99, tag: 'T9' },
      ],
    };
    expect(() => rollUp(twice, 'day')).toThrowError(SiteStructureError);
  });
});
