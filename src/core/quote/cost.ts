// Cost of a schedule at the user's rates: quantity × rate per item, a subtotal per bus, the
// surcharges and the total. An item without a usable rate (none, another unit, another currency)
// or without a quantity is unpriced and said so; the totals are then null, never a smaller sum.
import { itemKey, type Rate, type RateTable, type SurchargeName, SURCHARGES } from './rates.ts';
import type { ScheduleItem } from './schedule.ts';
import type { BusScheduleEntry } from './siteSchedule.ts';

export interface CostLine {
  readonly item: ScheduleItem;
  readonly rate: Rate | null;
  /** quantity × rate, or null with `unpriced` saying why. */
  readonly cost: number | null;
  readonly unpriced?: string;
}

export interface BusCost {
  readonly bus: string;
  readonly lines: readonly CostLine[];
  /** Sum of the bus's lines; null when any is unpriced. */
  readonly subtotal: number | null;
}

export interface Quote {
  readonly currency: string;
  readonly buses: readonly BusCost[];
  /** Equipment: sum of the bus subtotals; null when any line is unpriced. */
  readonly equipment: number | null;
  readonly surcharges: Readonly<
    Record<SurchargeName, { readonly pct: number; readonly amount: number | null }>
  >;
  readonly total: number | null;
  /** Every reason a line is unpriced, naming bus and item. */
  readonly unpriced: readonly string[];
}

const sumOrNull = (xs: readonly (number | null)[]) =>
  xs.some((x) => x === null) ? null : xs.reduce<number>((s, x) => s + (x as number), 0);

function priceLine(item: ScheduleItem, byItem: ReadonlyMap<string, Rate>, currency: string): CostLine {
  if (item.quantity === null)
    return { item, rate: null, cost: null, unpriced: item.missing ?? 'quantity unknown' };
  const rate = byItem.get(itemKey(item.code)) ?? null;
  if (rate === null)
    return { item, rate, cost: null, unpriced: `no rate for "${item.code}" in the rate table` };
  if (rate.unit !== item.unit)
    return {
      item,
      rate,
      cost: null,
      unpriced: `the rate for "${item.code}" is per ${rate.unit}; the item is counted per ${item.unit}`,
    };
  // Compared as the sheet's <> compares text: without regard to case.
  if (rate.currency.toLowerCase() !== currency.toLowerCase())
    return {
      item,
      rate,
      cost: null,
      unpriced: `the rate for "${item.code}" is in ${rate.currency || 'no currency'}; the quote is in ${currency || 'no currency'}`,
    };
  return { item, rate, cost: item.quantity * rate.rate };
}

/**
 * The quote: installation and engineering as percentages of the equipment, contingency of
 * equipment plus both (common estimating practice). The currency is the table's own (its first
 * row's, as the sheet reads it), else the first rate's.
 */
export function priceSchedule(schedule: readonly BusScheduleEntry[], table: RateTable): Quote {
  const currency = table.currency ?? table.rates[0]?.currency ?? '';
  const byItem = new Map(table.rates.map((r) => [itemKey(r.item), r]));
  const buses: BusCost[] = schedule.map((e) => {
    const lines = e.items.map((i) => priceLine(i, byItem, currency));
    return { bus: e.bus, lines, subtotal: sumOrNull(lines.map((l) => l.cost)) };
  });
  const equipment = sumOrNull(buses.map((b) => b.subtotal));
  const pct = (s: SurchargeName) => table.surcharges[s];
  const of = (base: number | null, p: number) => (base === null ? null : (base * p) / 100);
  const installation = of(equipment, pct('Installation'));
  const engineering = of(equipment, pct('Engineering'));
  const beforeContingency = sumOrNull([equipment, installation, engineering]);
  const contingency = of(beforeContingency, pct('Contingency'));
  const amounts: Record<SurchargeName, number | null> = {
    Installation: installation,
    Engineering: engineering,
    Contingency: contingency,
  };
  const surcharges = Object.fromEntries(
    SURCHARGES.map((s) => [s, { pct: pct(s), amount: amounts[s] }]),
  ) as Quote['surcharges'];
  return {
    currency,
    buses,
    equipment,
    surcharges,
    total: sumOrNull([beforeContingency, contingency]),
    unpriced: buses.flatMap((b) =>
      b.lines
        .filter((l) => l.unpriced !== undefined)
        .map((l) => `bus ${b.bus}: ${l.item.what}: ${l.unpriced}`),
    ),
  };
}
