// The banks the workbook starts with: the compensation design's choice per bus (fixed part,
// step, steps, detuning, capacitor rating, shunt reactor), written as inputs on the
// Compensation sheet so the user can change them and see the consequences.
import type { Site } from '../site/model.ts';
import { designCompensation, type CompensationDesign } from '../site/compensation.ts';
import type { BankChoice } from './buildCompensation.ts';

export function choicesFromDesign(design: CompensationDesign): BankChoice[] {
  const byBus = new Map<string, { -readonly [K in keyof BankChoice]: BankChoice[K] }>();
  const get = (bus: string) => {
    let c = byBus.get(bus);
    if (!c) byBus.set(bus, (c = { bus }));
    return c;
  };
  for (const b of design.banks) {
    const c = get(b.bus);
    if (b.fixed_kvar > 0) c.fixed_kvar = b.fixed_kvar;
    if (b.steps > 0) {
      c.step_kvar = b.step_kvar;
      c.steps = b.steps;
    }
    if (b.p_pct > 0) c.p_pct = b.p_pct;
    c.u_rated_kv = b.u_rated_kv;
    c.note = b.why;
  }
  for (const r of design.reactors) {
    const c = get(r.bus);
    c.reactor_kvar = r.q_kvar;
    c.note = c.note ? `${c.note}; reactor: ${r.why}` : `reactor: ${r.why}`;
  }
  return [...byBus.values()];
}

/** The design's choices, or none when the site cannot be designed yet (e.g. it is not a tree). */
export function proposeChoices(site: Site): BankChoice[] {
  try {
    return choicesFromDesign(designCompensation(site));
  } catch {
    return [];
  }
}
