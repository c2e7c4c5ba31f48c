// Properties of the quote (fast-check):
// - the total never falls when a rate, a quantity or a surcharge grows;
// - a site that already meets its requirement gets no bank, so an empty schedule and a zero cost.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  busSchedule,
  bankSpec,
  priceSchedule,
  siteSchedule,
  demoRateTable,
  type RateTable,
  type ScheduleItem,
} from '../../../src/core/quote/index.ts';
import { proposeChoices } from '../../../src/core/site/compensation.ts';
import { siteFromCsv } from '../site/fixtures.ts';

const CODES = ['A', 'B', 'C', 'D'];
const amount = fc.double({ min: 0, max: 1e6, noNaN: true });
const pct = fc.double({ min: 0, max: 100, noNaN: true });
const item = fc.record({ code: fc.constantFrom(...CODES), quantity: amount });
const world = fc.record({
  items: fc.array(item, { minLength: 1, maxLength: 8 }),
  rates: fc.tuple(amount, amount, amount, amount),
  surcharges: fc.tuple(pct, pct, pct),
});
type World = typeof world extends fc.Arbitrary<infer T> ? T : never;

function totalOf(w: World): number {
  const items: ScheduleItem[] = w.items.map((i) => ({ bus: 'X', what: i.code, count: 1, unit: 'pc', ...i }));
  const table: RateTable = {
    rates: CODES.map((c, k) => ({
      item: c,
      unit: 'pc',
      rate: w.rates[k] as number,
      currency: 'EUR',
      source: '',
    })),
    surcharges: { Installation: w.surcharges[0], Engineering: w.surcharges[1], Contingency: w.surcharges[2] },
  };
  const q = priceSchedule([{ bus: 'X', spec: null, items }], table);
  expect(q.total).not.toBeNull();
  return q.total as number;
}

const bump = fc.double({ min: 0, max: 1e5, noNaN: true });
const noLess = (after: number, before: number) => expect(after).toBeGreaterThanOrEqual(before * (1 - 1e-12));

describe('the total is monotone', () => {
  it('in every rate', () => {
    fc.assert(
      fc.property(world, fc.nat(3), bump, (w, k, d) => {
        const rates = [...w.rates] as World['rates'];
        rates[k] = (rates[k] as number) + d;
        noLess(totalOf({ ...w, rates }), totalOf(w));
      }),
    );
  });
  it('in every quantity', () => {
    fc.assert(
      fc.property(world, fc.nat(7), bump, (w, k, d) => {
        const i = k % w.items.length;
        const items = w.items.map((x, j) => (j === i ? { ...x, quantity: x.quantity + d } : x));
        noLess(totalOf({ ...w, items }), totalOf(w));
      }),
    );
  });
  it('in every surcharge', () => {
    fc.assert(
      fc.property(world, fc.nat(2), fc.double({ min: 0, max: 50, noNaN: true }), (w, k, d) => {
        const surcharges = [...w.surcharges] as World['surcharges'];
        surcharges[k] = (surcharges[k] as number) + d;
        noLess(totalOf({ ...w, surcharges }), totalOf(w));
      }),
    );
  });
  it('and a real bank costs more with one more step', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 11 }), fc.constantFrom(0, 7, 14), (n, p) => {
        const cost = (steps: number) =>
          priceSchedule(
            [
              {
                bus: 'B',
                spec: null,
                items: busSchedule(
                  bankSpec({ bus: 'B', step_kvar: 25, steps, p_pct: p, u_rated_kv: 0.48 }, 0.4, 50),
                ),
              },
            ],
            demoRateTable(),
          ).total as number;
        expect(cost(n + 1)).toBeGreaterThan(cost(n));
      }),
    );
  });
});

describe('zero need gives an empty schedule', () => {
  it('loads already at or above the target cos φ get no bank, no items and no cost', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            p: fc.integer({ min: 1, max: 2000 }),
            cos: fc.double({ min: 0.96, max: 1, noNaN: true }),
          }),
          {
            minLength: 1,
            maxLength: 4,
          },
        ),
        (loads) => {
          const rows = loads.map((l, i) => `L${i},LV,load,1,${l.p},${l.cos},0.4,1`);
          const { site, problems } = siteFromCsv(
            ['tag,bus,kind,qty,p_kw,cos_phi,u_kv,load', ...rows].join('\n'),
          );
          expect(problems).toEqual([]);
          const schedule = siteSchedule(site, proposeChoices(site));
          expect(schedule).toEqual([]);
          const q = priceSchedule(schedule, demoRateTable());
          expect([q.equipment, q.total, q.unpriced]).toEqual([0, 0, []]);
        },
      ),
      { numRuns: 30 },
    );
  });
  it('while the same site at cos φ 0.7 gets a bank and a priced schedule (the property is not vacuous)', () => {
    const { site } = siteFromCsv(
      ['tag,bus,kind,qty,p_kw,cos_phi,u_kv,load', 'L0,LV,load,1,500,0.7,0.4,1'].join('\n'),
    );
    const schedule = siteSchedule(site, proposeChoices(site));
    expect(schedule.map((e) => e.bus)).toEqual(['LV']);
    expect(priceSchedule(schedule, demoRateTable()).total).toBeGreaterThan(0);
  });
});
