// Cost of a schedule, computed again here by hand: quantity × rate per line, installation and
// engineering as percentages of the equipment, contingency on equipment plus both (common
// estimating practice). The rates below are invented for the test.
import { describe, expect, it } from 'vitest';
import {
  bankSpec,
  busSchedule,
  demoRateTable,
  DEMO_SOURCE,
  priceSchedule,
  readRateTable,
  rateTableRows,
} from '../../../src/core/quote/index.ts';

const bank = () => [
  {
    bus: 'LV1',
    spec: null,
    items: busSchedule(
      bankSpec({ bus: 'LV1', step_kvar: 50, steps: 6, p_pct: 7, u_rated_kv: 0.48 }, 0.4, 50),
    ),
  },
];
const TABLE = [
  ['Item', 'Unit', 'Rate', 'Currency', 'Source and date'],
  ['LV capacitor', 'kvar', 10, 'EUR', 'test'],
  ['LV detuning reactor 7 %', 'kvar', 12, 'EUR', 'test'],
  ['LV contactor 125 A', 'pc', 200, 'EUR', 'test'],
  ['Step controller 6 outputs', 'pc', 800, 'EUR', 'test'],
  ['LV section', 'pc', 3000, 'EUR', 'test'],
  ['LV fuse-switch 630 A', 'pc', 900, 'EUR', 'test'],
  ['Installation', '%', 20, '', ''],
  ['Engineering', '%', 10, '', ''],
  ['Contingency', '%', 5, '', ''],
];

describe('a priced 6 × 50 kvar 7 % bank', () => {
  it('line by line, per bus, surcharges and total as worked out by hand', () => {
    const { table, problems } = readRateTable(TABLE);
    expect(problems).toEqual([]);
    const q = priceSchedule(bank(), table);
    // 401.76 kvar nameplate × 10 + 300 kvar × 12 + 6 × 200 + 800 + 2 × 3000 + 900
    const equipment = 6 * 50 * 0.93 * 1.44 * 10 + 300 * 12 + 6 * 200 + 800 + 2 * 3000 + 900;
    expect(equipment).toBeCloseTo(16517.6, 6);
    expect(q.buses[0]?.subtotal).toBeCloseTo(equipment, 6);
    expect(q.equipment).toBeCloseTo(equipment, 6);
    expect(q.surcharges.Installation.amount).toBeCloseTo(0.2 * equipment, 6);
    expect(q.surcharges.Engineering.amount).toBeCloseTo(0.1 * equipment, 6);
    expect(q.surcharges.Contingency.amount).toBeCloseTo(0.05 * 1.3 * equipment, 6);
    expect(q.total).toBeCloseTo(1.3 * 1.05 * equipment, 6);
    expect(q.currency).toBe('EUR');
    expect(q.unpriced).toEqual([]);
  });
  it('a missing rate leaves its line, the bus and the total unpriced, and says which item', () => {
    const { table } = readRateTable(TABLE.filter((r) => r[0] !== 'LV section'));
    const q = priceSchedule(bank(), table);
    const line = q.buses[0]?.lines.find((l) => l.item.code === 'LV section');
    expect(line?.cost).toBeNull();
    expect(q.buses[0]?.subtotal).toBeNull();
    expect(q.total).toBeNull();
    expect(q.unpriced).toEqual([expect.stringMatching(/bus LV1: .*no rate for "LV section"/)]);
  });
  it('a rate per another unit or in another currency is not used', () => {
    const rows = TABLE.map((r) =>
      r[0] === 'LV capacitor'
        ? ['LV capacitor', 'pc', 10, 'EUR', '']
        : r[0] === 'LV section'
          ? ['LV section', 'pc', 1, 'USD', '']
          : r,
    );
    const q = priceSchedule(bank(), readRateTable(rows).table);
    expect(q.unpriced).toEqual([
      expect.stringMatching(/"LV capacitor" is per pc; the item is counted per kvar/),
      expect.stringMatching(/"LV section" is in USD; the quote is in EUR/),
    ]);
  });
  it("a rate in another currency than the first row's is reported at its row, or at row 2 when that is blank", () => {
    const withCurrency = (item: string, currency: string) =>
      TABLE.map((r) => (r[0] === item ? [...r.slice(0, 3), currency, ...r.slice(4)] : r));
    const one = readRateTable(withCurrency('LV section', 'USD'));
    expect(one.table.currency).toBe('EUR');
    expect(one.problems).toEqual([
      {
        row: 6,
        column: 'Currency',
        message:
          'rates row 6, column Currency: "LV section" is in "USD", not in "EUR", the currency of the quote (the first row\'s), so it is unpriced; give every rate the same currency, or put the currency of the quote on the first row',
      },
    ]);
    // Spreadsheets compare text without regard to case: "eur" is the quote's currency.
    const lower = withCurrency('LV section', 'eur');
    expect(readRateTable(lower).problems).toEqual([]);
    expect(priceSchedule(bank(), readRateTable(lower).table).total).not.toBeNull();
    const blankFirst = withCurrency('LV capacitor', '');
    expect(readRateTable(blankFirst).problems).toEqual([
      {
        row: 2,
        column: 'Currency',
        message:
          'rates row 2, column Currency: the quote is in the currency of the first row, which is blank, so "LV detuning reactor 7 %" (in "EUR") is unpriced, as are 4 other rate(s) in another currency; give every rate the same currency, or put the currency of the quote on the first row',
      },
    ]);
  });
  it('items match rates without regard to case', () => {
    const rows = TABLE.map((r) => (r[0] === 'LV section' ? ['lv SECTION', 'pc', 3000, 'EUR', ''] : r));
    expect(priceSchedule(bank(), readRateTable(rows).table).total).not.toBeNull();
  });
  it('a name with extra spaces matches nothing, as in the sheet, and says how to write it', () => {
    // The Quantities sheet finds a rate with MATCH(item, Rates!A:A, 0): any case, exact spacing.
    const rows = TABLE.map((r) => (r[0] === 'LV section' ? ['  lv   SECTION ', 'pc', 3000, 'EUR', ''] : r));
    const { table, problems } = readRateTable(rows);
    expect(problems).toEqual([
      {
        row: 6,
        column: 'Item',
        message:
          'rates row 6, column Item: "  lv   SECTION " has spaces at its ends or doubled inside, so no item matches it; write it as "lv SECTION"',
      },
    ]);
    expect(priceSchedule(bank(), table).total).toBeNull();
  });
});

describe('reading a rate table', () => {
  it('bad rows are reported with row, column and the value given, and left out', () => {
    const { table, problems } = readRateTable([
      ['Item', 'Unit', 'Rate'],
      ['LV section', 'each', 10],
      ['MV frame', 'pc', 'cheap'],
      ['LV capacitor', 'kvar', -1],
      ['Overheads', '%', 5],
      ['', '', ''],
      ['LV capacitor', 'kvar', 9],
      ['lv capacitor', 'kvar', 8],
    ]);
    expect(problems.map((p) => [p.row, p.column])).toEqual([
      [2, 'Unit'],
      [3, 'Rate'],
      [4, 'Rate'],
      [5, 'Item'],
      [8, 'Item'],
    ]);
    expect(problems[0]?.message).toBe('rates row 2, column Unit: must be one of pc, kvar, %; got "each"');
    expect(problems[1]?.message).toBe('rates row 3, column Rate: must be a number ≥ 0; got "cheap"');
    expect(table.rates.map((r) => [r.item, r.rate])).toEqual([['LV capacitor', 9]]);
  });
  it('columns are found by their header in any order; the table writes back to the same rows', () => {
    const { table } = readRateTable([
      ['Rate', 'Item', 'Unit', 'Currency'],
      [7, 'MV frame', 'pc', 'CHF'],
    ]);
    expect(table.rates).toEqual([{ item: 'MV frame', unit: 'pc', rate: 7, currency: 'CHF', source: '' }]);
    expect(readRateTable(rateTableRows(table)).table).toEqual(table);
  });
  it('the demo rates are marked invented on every row', () => {
    const demo = demoRateTable();
    expect(demo.rates.length).toBeGreaterThan(10);
    for (const r of demo.rates) expect(r.source).toBe(DEMO_SOURCE);
    expect(DEMO_SOURCE).toMatch(/INVENTED/);
  });
});
