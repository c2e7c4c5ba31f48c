// No silent infinite supply. Resonance orders and voltage rise depend on the short-circuit power
// at the bank's bus; without the supply's value at the point of connection, buses below a
// transformer are worked out as if the supply were infinite (orders too high, rise too low) and
// the connection bus itself is not checked. Say so once, at the point of connection, and offer
// a typical value for its voltage, marked as typical.
import type { Site } from './model.ts';
import type { BusGraph } from './graph.ts';
import { typicalSupplyShortCircuit } from './typical/supply.ts';
import { designWarning, type DesignWarning } from './warnings.ts';
import { formatNumber } from '../registry/messages.ts';

export function supplyWarnings(
  site: Site,
  graph: BusGraph,
  voltages: ReadonlyMap<string, { u_kv: number }>,
): DesignWarning[] {
  if (site.settings.sscMva !== undefined || graph.root === undefined) return [];
  const root = graph.root;
  const u = voltages.get(root)?.u_kv;
  const typical = u === undefined ? undefined : typicalSupplyShortCircuit(u);
  const offer =
    u === undefined
      ? `the voltage of bus ${root} is unknown, so no typical value can be offered`
      : typical === undefined
        ? `no typical value is offered above 245 kV`
        : `a typical value at ${formatNumber(u)} kV is ${formatNumber(typical.value)} MVA (typical: ${typical.source.label}, from memory)`;
  return [
    designWarning(
      'warning',
      'supply-unknown',
      { bus: root },
      `the short-circuit power at the point of connection (bus ${root}) is not given: resonance and voltage rise below transformers are worked out as if the supply were infinite (resonance orders too high, voltage rise too low), and on bus ${root} they are not checked; ${offer}. Ask the utility for its minimum and maximum and type it on the Site sheet (or --ssc-mva)`,
    ),
  ];
}

/** Words to add to a finding computed with an infinite supply assumed upstream ('' otherwise). */
export function infiniteSupplyNote(sc: { readonly infiniteSupplyAssumed: boolean }): string {
  return sc.infiniteSupplyAssumed
    ? ' (with an infinite supply assumed: the short-circuit power at the point of connection is not given)'
    : '';
}
