// The design as the Compensation sheet's inputs: one choice per bus with a bank or a reactor,
// what compensate.ts applies and what the sheet holds when the design proposes.
import type { BankChoice } from './bankChoice.ts';
import type { BankDesign } from './bankSizing.ts';
import type { ReactorDesign } from './designBasics.ts';
import { DEFAULT_STEP_SERIES } from './stepSeries.ts';

/** The design as the Compensation sheet's inputs: one choice per bus with a bank or reactor. */
export function choicesFromDesign(
  banks: readonly BankDesign[],
  reactors: readonly Pick<ReactorDesign, 'bus' | 'q_kvar' | 'why'>[],
): BankChoice[] {
  const byBus = new Map<string, { -readonly [K in keyof BankChoice]: BankChoice[K] }>();
  const get = (bus: string) => {
    let c = byBus.get(bus);
    if (!c) byBus.set(bus, (c = { bus }));
    return c;
  };
  for (const b of banks) {
    const c = get(b.bus);
    if (b.fixed_kvar > 0) c.fixed_kvar = b.fixed_kvar;
    if (b.steps > 0) {
      c.step_kvar = b.step_kvar;
      c.steps = b.steps;
      if (b.series !== DEFAULT_STEP_SERIES) c.series = b.series;
    }
    if (b.p_pct > 0) c.p_pct = b.p_pct;
    c.u_rated_kv = b.u_rated_kv;
    c.note = b.why;
  }
  for (const r of reactors) {
    const c = get(r.bus);
    c.reactor_kvar = r.q_kvar;
    if (r.why) c.note = c.note ? `${c.note}; reactor: ${r.why}` : `reactor: ${r.why}`;
  }
  return [...byBus.values()];
}
