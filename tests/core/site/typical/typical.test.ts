// Typical values for tender-stage lists, checked against the sources they name. Each check says
// whether its outside value is published or from memory; consistency checks (a table against
// a published formula, physics every row must obey) are marked as such.
import { describe, expect, it } from 'vitest';
import {
  COS_PHI_TYPICAL,
  EFFICIENCY_TABLES,
  IE3_4POLE_COEFFICIENTS,
  NO_LOAD_CURRENT_TYPICAL,
  POLES,
  efficiencyPolynomial,
  motorCosPhi,
  motorEfficiency,
  motorNoLoadCurrent,
} from '../../../../src/core/site/typical/motors.ts';
import {
  ECODESIGN_LIQUID_TIER2,
  ecodesignLosses,
  transformerNoLoadCurrent,
  ukMinimum,
} from '../../../../src/core/site/typical/transformers.ts';
import { band, lookup } from '../../../../src/core/site/typical/interpolate.ts';
import { assumeTypical } from '../../../../src/core/site/typical/assume.ts';
import { SOURCES } from '../../../../src/core/site/typical/sources.ts';
import { typicalFillRow } from '../../../../src/core/site/typical/fillRow.ts';
import { motorNoLoadTooHigh } from '../../../../src/core/elements/motor.ts';

describe('motor efficiency, IEC 60034-30-1', () => {
  it.each([
    [11, 91.4],
    [37, 93.9],
    [110, 95.4],
  ])('IE3 4-pole 50 Hz %s kW = %s %% (UK SI 2021/745 Sch. 16 Table 28, published)', (kw, pct) => {
    expect(motorEfficiency(kw, 'IE3', 4)?.value).toBeCloseTo(pct, 1);
    expect(motorEfficiency(kw)?.source.kind).toBe('published');
  });

  it('uses the published coefficients A 0.0773, B −1.8951, C 9.2984, D 83.7025', () => {
    expect(IE3_4POLE_COEFFICIENTS).toEqual({ A: 0.0773, B: -1.8951, C: 9.2984, D: 83.7025 });
    // x = 1 (10 kW): η = A + B + C + D.
    expect(efficiencyPolynomial(10)).toBeCloseTo(0.0773 - 1.8951 + 9.2984 + 83.7025, 10);
  });

  it('the IE3 4-pole table (from memory) agrees with the published polynomial at every size to its 0.1 % rounding', () => {
    const t = EFFICIENCY_TABLES['IE3-4'] ?? [];
    expect(t.length).toBeGreaterThan(20);
    for (const [kw, pct] of t)
      expect(Math.abs(efficiencyPolynomial(Math.min(kw, 200)) - pct)).toBeLessThan(0.051);
  });

  it('classes rank IE1 < IE2 < IE3 < IE4 at every size and efficiency rises with size (from memory tables)', () => {
    for (const kw of [0.75, 2.2, 7.5, 30, 90, 200, 500]) {
      const e = (['IE1', 'IE2', 'IE3', 'IE4'] as const).map((c) => motorEfficiency(kw, c, 4)?.value ?? NaN);
      for (let i = 1; i < e.length; i++) expect(e[i]).toBeGreaterThan(e[i - 1] as number);
    }
    for (const key of Object.keys(EFFICIENCY_TABLES) as Array<keyof typeof EFFICIENCY_TABLES>) {
      const t = EFFICIENCY_TABLES[key] ?? [];
      for (let i = 1; i < t.length; i++)
        expect(t[i]?.[1] as number).toBeGreaterThanOrEqual(t[i - 1]?.[1] as number);
    }
  });

  it('is constant from 200 kW to 1 000 kW and not assumed outside 0.75 kW to 1 000 kW', () => {
    expect(motorEfficiency(500)?.value).toBeCloseTo(motorEfficiency(200)?.value as number, 10);
    expect(motorEfficiency(0.5)).toBeUndefined();
    expect(motorEfficiency(1500)).toBeUndefined();
    expect(motorEfficiency(11, 'IE2', 2)).toBeUndefined();
  });
});

describe('motor cos φ and no-load current (common practice, from memory)', () => {
  it('cos φ rises with size and falls with more poles', () => {
    for (const kw of [1, 10, 100]) {
      const c = POLES.map((p) => motorCosPhi(kw, p)?.value ?? NaN);
      for (let i = 1; i < c.length; i++) expect(c[i]).toBeLessThan(c[i - 1] as number);
    }
    for (const p of POLES) {
      const t = COS_PHI_TYPICAL[p];
      for (let i = 1; i < t.length; i++)
        expect(t[i]?.[1] as number).toBeGreaterThanOrEqual(t[i - 1]?.[1] as number);
    }
  });

  it('no-load current stays below the full-load reactive current (i0 < sin φ, physics) at every size and pole count', () => {
    for (const p of POLES) {
      expect(NO_LOAD_CURRENT_TYPICAL[p].length).toBe(COS_PHI_TYPICAL[p].length);
      for (let x = Math.log10(0.75); x <= 3; x += 0.01) {
        const kw = 10 ** x;
        const cos = motorCosPhi(kw, p)?.value as number;
        const i0 = motorNoLoadCurrent(kw, p)?.value as number;
        expect(motorNoLoadTooHigh(cos, i0), `${p}-pole ${kw.toFixed(2)} kW`).toBe(false);
      }
    }
  });
});

describe('transformer losses, EU 548/2014 Annex I (values from memory)', () => {
  it('Table I.1 Tier 2 at 1 000 kVA: Pk 7 600 W, P0 693 W; at 400 kVA: 3 250 W, 387 W', () => {
    expect(ecodesignLosses(1000)).toMatchObject({ pk: { value: 7.6 }, p0: { value: 0.693 } });
    expect(ecodesignLosses(400)).toMatchObject({ pk: { value: 3.25 }, p0: { value: 0.387 } });
    expect(ecodesignLosses(1000)?.pk.source.ref).toMatch(/548\/2014.*Table I\.1.*Tier 2/);
  });

  it('Tier 2 no-load losses are Tier 1 (Ao of EN 50464-1) less 10 %, to the watt', () => {
    // Tier 1 P0 (class Ao), from memory.
    const tier1: Record<number, number> = {
      25: 70,
      50: 90,
      100: 145,
      160: 210,
      250: 300,
      315: 360,
      400: 430,
      500: 510,
      630: 600,
      800: 650,
      1000: 770,
      1250: 950,
      1600: 1200,
      2000: 1450,
      2500: 1750,
      3150: 2200,
    };
    for (const [kva, , p0] of ECODESIGN_LIQUID_TIER2)
      expect(Math.abs(0.9 * (tier1[kva] as number) - p0)).toBeLessThanOrEqual(1);
  });

  it('reads intermediate ratings linearly, covers ratings under 25 kVA by the first row, stops above 3 150 kVA', () => {
    // 1 100 kVA: 7 600 + (9 500 − 7 600)·100/250 = 8 360 W.
    expect(ecodesignLosses(1100)?.pk.value).toBeCloseTo(8.36, 10);
    expect(ecodesignLosses(10)?.p0.value).toBeCloseTo(0.063, 10);
    expect(ecodesignLosses(4000)).toBeUndefined();
  });

  it('dry-type (Table I.2 Tier 2) losses exceed liquid-immersed ones at the same rating', () => {
    for (const kva of [100, 400, 630, 1000, 2500]) {
      const dry = ecodesignLosses(kva, 'dry'),
        liquid = ecodesignLosses(kva, 'liquid');
      expect(dry?.p0.value).toBeGreaterThan(liquid?.p0.value as number);
      expect(dry?.pk.source.ref).toMatch(/Table I\.2/);
    }
  });
});

describe('transformer uk (IEC 60076-5 Table 1, from memory) and no-load current (common practice)', () => {
  it.each([
    [100, 4],
    [630, 4],
    [631, 5],
    [1250, 5],
    [1600, 6],
    [2500, 6],
    [5000, 7],
    [20000, 8],
    [31500, 10],
    [50000, 11],
    [80000, 12.5],
  ])('%s kVA: %s %%', (kva, uk) => expect(ukMinimum(kva)?.value).toBe(uk));

  it('gives no minimum above 100 MVA (the standard says only "above 12.5 %")', () => {
    expect(ukMinimum(120000)).toBeUndefined();
  });

  it('no-load losses fit inside the no-load apparent power (P0 ≤ i0·S, physics) at every rating', () => {
    for (let x = Math.log10(25); x <= Math.log10(3150); x += 0.01) {
      const kva = 10 ** x;
      const s0 = ((transformerNoLoadCurrent(kva)?.value as number) / 100) * kva;
      expect(ecodesignLosses(kva, 'dry')?.p0.value as number).toBeLessThan(s0);
    }
  });
});

describe('interpolation', () => {
  it('reads on a log scale by default and refuses to extrapolate', () => {
    expect(
      lookup(
        [
          [1, 0],
          [100, 2],
        ],
        10,
      ),
    ).toBeCloseTo(1, 12);
    expect(
      lookup(
        [
          [1, 0],
          [100, 2],
        ],
        10,
        'linear',
      ),
    ).toBeCloseTo((2 * 9) / 99, 12);
    expect(
      lookup(
        [
          [1, 0],
          [100, 2],
        ],
        101,
      ),
    ).toBeUndefined();
    expect(
      band(
        [
          [10, 1],
          [20, 2],
        ],
        15,
      ),
    ).toBe(2);
  });
});

describe('assumeTypical', () => {
  it('fills a motor row that gives only the rated output, naming each source', () => {
    const r = assumeTypical({ kind: 'motor', values: { p_kw: 37 } });
    expect(r.assumed.map((a) => [a.column, a.value])).toEqual([
      ['eff', 0.939],
      ['cos_phi', motorCosPhi(37)?.value],
      ['i0_pct', motorNoLoadCurrent(37)?.value],
    ]);
    expect(r.assumed[0]?.source.label).toMatch(/IEC 60034-30-1 IE3/);
    expect(r.assumed[0]?.note).toMatch(/^assumed 0\.939 \(37 kW, 4-pole, class IE3; /);
    expect(r.assumed[1]?.source.kind).toBe('common practice');
  });

  it('keeps what the list gives and assumes only the blanks', () => {
    const r = assumeTypical({ kind: 'motor', values: { p_kw: 11, eff: 0.9, cos_phi: 0.8 } });
    expect(r.assumed.map((a) => a.column)).toEqual(['i0_pct']);
  });

  it('uses the class and poles asked for', () => {
    const r = assumeTypical({ kind: 'motor', values: { p_kw: 11 } }, { motorClass: 'IE3', poles: 6 });
    expect(r.assumed[0]?.value).toBe(0.903);
    expect(r.assumed[1]?.value).toBe(0.8);
  });

  it('fills a transformer row from its rating', () => {
    const r = assumeTypical({ kind: 'transformer', values: { s_kva: 1000, uk_pct: 6 } });
    expect(r.assumed.map((a) => [a.column, a.value])).toEqual([
      ['p0_kw', 0.693],
      ['pk_kw', 7.6],
      ['i0_pct', 1],
    ]);
    expect(r.assumed[0]?.note).toMatch(/liquid-immersed, maximum allowed; EU 548\/2014 Tier 2/);
  });

  it('says why nothing is assumed without a rating or outside the tables', () => {
    expect(assumeTypical({ kind: 'transformer', values: {} }).notAssumed).toHaveLength(4);
    expect(assumeTypical({ kind: 'motor', values: { eff: 0.95 } }).notAssumed).toEqual([
      'cos_phi: no typical value without the rated output (p_kw)',
      'i0_pct: no typical value without the rated output (p_kw)',
    ]);
    const big = assumeTypical({ kind: 'transformer', values: { s_kva: 10000 } });
    expect(big.assumed.map((a) => a.column)).toEqual(['uk_pct', 'i0_pct']);
    expect(big.notAssumed[0]).toMatch(/^p0_kw: 10000 kVA is outside/);
    expect(assumeTypical({ kind: 'capacitor', values: {} })).toEqual({ assumed: [], notAssumed: [] });
  });
});

describe('feeder cable reactance by voltage (common practice, from memory)', () => {
  it('a blank X takes 0.08 Ω/km at low voltage and 0.11 Ω/km up to 36 kV, naming the source', () => {
    const lv = assumeTypical({ kind: 'feeder', values: { u_kv: 0.4, len_km: 0.2 } });
    expect(lv.assumed).toEqual([
      expect.objectContaining({ column: 'x_ohm_km', value: 0.08, source: SOURCES.cableReactance }),
    ]);
    expect(lv.assumed[0]?.note).toBe(
      'assumed 0.08 (0.4 kV cable; typical cable reactance by voltage (common practice))',
    );
    const mv = assumeTypical({ kind: 'feeder', values: { u_kv: 20, len_km: 5 } });
    expect(mv.assumed.map((a) => [a.column, a.value])).toEqual([['x_ohm_km', 0.11]]);
    // The bands meet at 1 kV: a 1 kV cable is low voltage, 1.1 kV medium.
    expect(assumeTypical({ kind: 'feeder', values: { u_kv: 1 } }).assumed[0]?.value).toBe(0.08);
    expect(assumeTypical({ kind: 'feeder', values: { u_kv: 1.1 } }).assumed[0]?.value).toBe(0.11);
  });

  it('keeps a typed X, and says why none is assumed above 36 kV or without a voltage', () => {
    expect(assumeTypical({ kind: 'feeder', values: { u_kv: 0.4, x_ohm_km: 0.07 } })).toEqual({
      assumed: [],
      notAssumed: [],
    });
    expect(assumeTypical({ kind: 'feeder', values: { u_kv: 66 } }).notAssumed).toEqual([
      "x_ohm_km: no typical reactance above 36 kV: take the maker's data",
    ]);
    expect(assumeTypical({ kind: 'feeder', values: {} }).notAssumed).toEqual([
      'x_ohm_km: no typical value without the voltage (u_kv)',
    ]);
  });

  it('fills a feeder row through the one rule, never over text typed in the cell', () => {
    const row: Record<string, number | string | null> = { u_kv: 11, x_ohm_km: null };
    expect(typicalFillRow('feeder', (k) => row[k]).writes).toEqual([
      {
        column: 'x_ohm_km',
        value: 0.11,
        note: '11 kV cable; typical cable reactance by voltage (common practice)',
      },
    ]);
    row.x_ohm_km = 'ask the maker';
    expect(typicalFillRow('feeder', (k) => row[k]).writes).toEqual([]);
  });
});
