// What compensation saves a year, against a worked example written out by hand. The tariff is a
// common form (a price per kvarh drawn above tan φ × kWh, and a monthly penalty per kvar of demand
// above tan φ × kW; the thresholds and prices are invented for the example, as utilities set
// their own), and the losses saved are the drop of P at the point of connection times the hours.
import { describe, expect, it } from 'vitest';
import { annualSaving, readTariff, type CaseFlow, type Tariff } from '../../../src/core/quote/index.ts';

const TARIFF: Tariff = {
  kvarh_price: 0.02,
  kvarh_free_tan: 0.4,
  demand_price: 3,
  demand_free_tan: 0.5,
  periods_per_year: 12,
  energy_price: 0.15,
  hours: new Map([
    ['day', 4000],
    ['night', 2000],
  ]),
};

// Before: day 800 kW, 600 kvar (cos φ 0.8); night 300 kW, 250 kvar.
// After: day 796 kW, 200 kvar; night 299 kW, 150 kvar (the transformer losses fell 4 and 1 kW).
const FLOWS: CaseFlow[] = [
  { case: 'day', p_kw: 800, q_kvar: 600, p_after_kw: 796, q_after_kvar: 200 },
  { case: 'night', p_kw: 300, q_kvar: 250, p_after_kw: 299, q_after_kvar: 150 },
];

describe('the worked example', () => {
  const s = annualSaving(FLOWS, TARIFF, 60000);
  it('kvarh charged: only what is drawn above 0.4 × kWh', () => {
    // day before: 600 − 0.4 × 800 = 280 kvar over the free share, × 4000 h = 1 120 000 kvarh
    // night before: 250 − 0.4 × 300 = 130 kvar, × 2000 h = 260 000 kvarh
    // day after: 200 < 0.4 × 796 = 318.4: nothing; night after: 150 − 119.6 = 30.4 kvar × 2000 h = 60 800 kvarh
    expect(s.cases.map((c) => c.kvarh_before)).toEqual([1_120_000, 260_000]);
    expect(s.cases[0]?.kvarh_after).toBe(0);
    expect(s.cases[1]?.kvarh_after).toBeCloseTo(60_800, 6);
  });
  it('charge before: 1 380 000 kvarh × 0.02 + 200 kvar × 3 × 12 = 27 600 + 7 200 = 34 800', () => {
    // demand over 0.5 × kW: day 600 − 400 = 200, night 250 − 150 = 100; the larger, 200 kvar, is charged
    expect(s.charge_before).toBeCloseTo(34_800, 9);
  });
  it('charge after: 60 800 × 0.02 + 0.5 kvar × 36 = 1 216 + 18 = 1 234', () => {
    // demand after: day 200 − 398 < 0; night 150 − 149.5 = 0.5 kvar
    expect(s.charge_after).toBeCloseTo(1234, 9);
  });
  it('losses: (4 kW × 4000 h + 1 kW × 2000 h) × 0.15 = 18 000 kWh × 0.15 = 2 700', () => {
    expect(s.losses_saved).toBeCloseTo(2700, 9);
  });
  it('annual saving 34 800 − 1 234 + 2 700 = 36 266; payback 60 000 / 36 266 = 1.654 years', () => {
    expect(s.annual_saving).toBeCloseTo(36_266, 9);
    expect(s.payback_years as number).toBeCloseTo(1.6544, 4);
    // Independently: the month in which the cumulative saving first covers the cost is the 20th
    // (19 months save 57 421, 20 months 60 443), i.e. the payback lies in (19/12, 20/12] years.
    let month = 0;
    while ((++month * 36_266) / 12 < 60_000);
    expect(month).toBe(20);
    expect(s.payback_years as number).toBeGreaterThan(19 / 12);
    expect(s.payback_years as number).toBeLessThanOrEqual(20 / 12);
  });
  it('no payback without a cost, or without a saving', () => {
    expect(annualSaving(FLOWS, TARIFF, null).payback_years).toBeNull();
    const none = FLOWS.map((f) => ({ ...f, p_after_kw: f.p_kw, q_after_kvar: f.q_kvar }));
    expect(annualSaving(none, TARIFF, 60000).payback_years).toBeNull();
  });
  it('no payback when the saving is so small that the cost over it overflows (a price of 5e-324)', () => {
    const tiny: Tariff = { ...TARIFF, kvarh_price: 5e-324, demand_price: 0, energy_price: 0 };
    const s = annualSaving(FLOWS, tiny, 60000);
    expect(s.annual_saving).toBeGreaterThan(0);
    expect(60000 / s.annual_saving).toBe(Infinity);
    expect(s.payback_years).toBeNull();
  });
  it('a case the tariff gives no hours counts nothing, demand included', () => {
    const dayOnly = { ...TARIFF, hours: new Map([['day', 4000]]) };
    const s1 = annualSaving(FLOWS, dayOnly, null);
    expect(s1.cases[1]).toMatchObject({
      hours: 0,
      kvarh_before: 0,
      excess_before_kvar: 0,
      loss_kwh_saved: 0,
    });
  });
});

describe('the Tariff sheet', () => {
  it('reads settings by their text, hours per case, and reports a bad value and a missing hours row', () => {
    const { tariff, problems } = readTariff(
      [
        ['Setting', 'Value', 'Unit', 'Note'],
        ['Hours per year: day', 4000, 'h', ''],
        ['reactive energy price', '0,02', 'per kvarh', 'typed with a decimal comma'],
        ['Energy price for losses', 'ask', 'per kWh', ''],
      ],
      ['day', 'night'],
    );
    expect(tariff.kvarh_price).toBe(0.02);
    expect(tariff.energy_price).toBe(0);
    expect([...tariff.hours]).toEqual([
      ['day', 4000],
      ['night', 0],
    ]);
    expect(problems).toEqual([
      {
        row: 4,
        message: 'tariff row 4, column Value: "Energy price for losses" must be a number ≥ 0; got "ask"',
      },
      {
        message:
          'tariff: no row "Hours per year: night", so case night counts 0 hours per year; add the row with the hours it runs',
      },
    ]);
  });
});

describe('hours of the cases against the hours of a year', () => {
  const sheet = (day: number, night: number) => [
    ['Setting', 'Value', 'Unit', 'Note'],
    ['Energy price for losses', 0.1, 'per kWh', ''],
    ['Hours per year: day', day, 'h', ''],
    ['Hours per year: night', night, 'h', ''],
  ];

  it('says when the cases share more hours than a year has, at the first hours row', () => {
    // A year has 365 × 24 = 8,760 h, a leap year 366 × 24 = 8,784 h (calendar arithmetic).
    // A case typed as running all year beside another counts those hours twice.
    const { problems } = readTariff(sheet(8760, 4380), ['day', 'night']);
    expect(problems).toEqual([
      {
        row: 3,
        message:
          "tariff row 3, column Value: the cases' hours add up to 13,140 h per year (day 8,760 h, night 4,380 h), more than a year has (8,784 h in a leap year), so the saving counts some hours twice; share the year between the cases",
      },
    ]);
  });

  it('accepts a year shared exactly, and a leap year typed as such', () => {
    expect(readTariff(sheet(4380, 4380), ['day', 'night']).problems).toEqual([]);
    expect(readTariff(sheet(4392, 4392), ['day', 'night']).problems).toEqual([]);
    expect(readTariff(sheet(4392, 4393), ['day', 'night']).problems).toHaveLength(1);
  });
});
