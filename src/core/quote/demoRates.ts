// INVENTED demo rates, so a new workbook shows a priced schedule at once. They are no prices of
// any maker or market: every row says so in its source, and the estimator replaces them.
import { CURRENT_CLASSES_A, MV_CONTACTOR_CLASSES_A } from './itemRules.ts';
import type { Rate, RateTable } from './rates.ts';

export const DEMO_SOURCE = 'INVENTED demo rate: replace with your own';
export const DEMO_CURRENCY = 'EUR';

const r = (item: string, unit: Rate['unit'], rate: number): Rate => ({
  item,
  unit,
  rate,
  currency: DEMO_CURRENCY,
  source: DEMO_SOURCE,
});

/** An invented, round price that grows with the current class (no market behind it). */
const byAmps = (base: number, perAmp: number) => (a: number) => Math.round(base + perAmp * a);

export function demoRateTable(): RateTable {
  const lvContactor = byAmps(60, 1.5);
  const lvFuseSwitch = byAmps(150, 1.2);
  const lvBreaker = byAmps(900, 2);
  const mvBreaker = byAmps(14000, 4);
  const rates: Rate[] = [
    r('LV capacitor', 'kvar', 9),
    r('MV capacitor', 'kvar', 14),
    ...[5.67, 7, 14].flatMap((p) => [
      r(`LV detuning reactor ${p} %`, 'kvar', 11),
      r(`MV detuning reactor ${p} %`, 'kvar', 16),
    ]),
    ...CURRENT_CLASSES_A.filter((a) => a <= 630).map((a) => r(`LV contactor ${a} A`, 'pc', lvContactor(a))),
    ...CURRENT_CLASSES_A.filter((a) => a >= 63 && a <= 630).map((a) =>
      r(`LV fuse-switch ${a} A`, 'pc', lvFuseSwitch(a)),
    ),
    ...CURRENT_CLASSES_A.filter((a) => a >= 800).map((a) => r(`LV breaker ${a} A`, 'pc', lvBreaker(a))),
    ...MV_CONTACTOR_CLASSES_A.map((a) => r(`MV contactor ${a} A`, 'pc', 6000 + 10 * a)),
    ...[630, 1250, 2500].map((a) => r(`MV breaker ${a} A`, 'pc', mvBreaker(a))),
    r('Step controller 6 outputs', 'pc', 700),
    r('Step controller 12 outputs', 'pc', 1100),
    r('LV section', 'pc', 2500),
    r('MV frame', 'pc', 6000),
    r('MV discharge VT', 'pc', 2200),
    r('LV shunt reactor', 'kvar', 20),
    r('MV shunt reactor', 'kvar', 30),
  ];
  return {
    rates,
    surcharges: { Installation: 15, Engineering: 8, Contingency: 10 },
    currency: DEMO_CURRENCY,
  };
}
