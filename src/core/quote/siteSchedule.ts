// The schedule of a whole site: one BankSpec per bus that has a bank or reactor chosen (the
// Compensation sheet's inputs, or the design's proposal), its items, in the order of the choices.
import type { Site } from '../site/model.ts';
import type { BankChoice } from '../site/bankChoice.ts';
import { busVoltages } from '../site/voltages.ts';
import { bankSpec, type BankSpec } from './bankSpec.ts';
import { busSchedule, type ScheduleItem } from './schedule.ts';

export interface BusScheduleEntry {
  readonly bus: string;
  /** null when the bus voltage is unknown (no row on it states u_kv). */
  readonly spec: BankSpec | null;
  readonly items: readonly ScheduleItem[];
}

const chosen = (c: BankChoice) =>
  (c.fixed_kvar ?? 0) > 0 || ((c.step_kvar ?? 0) > 0 && (c.steps ?? 0) > 0) || (c.reactor_kvar ?? 0) > 0;

/** Items per bus for the choices given; buses without a bank or reactor are left out. */
export function siteSchedule(site: Site, choices: readonly BankChoice[]): BusScheduleEntry[] {
  const voltages = busVoltages(site.equipment).voltages;
  const seen = new Set<string>();
  const out: BusScheduleEntry[] = [];
  for (const c of choices) {
    if (seen.has(c.bus) || !chosen(c)) continue;
    seen.add(c.bus);
    const u = voltages.get(c.bus)?.u_kv;
    if (u === undefined) {
      out.push({
        bus: c.bus,
        spec: null,
        items: [
          {
            bus: c.bus,
            code: '',
            what: 'items of the bank',
            count: null,
            unit: 'pc',
            quantity: null,
            missing: `the voltage of bus ${c.bus} is unknown: state u_kv on a row of the bus`,
          },
        ],
      });
      continue;
    }
    const spec = bankSpec(c, u, site.settings.hz);
    out.push({ bus: c.bus, spec, items: busSchedule(spec) });
  }
  return out;
}
