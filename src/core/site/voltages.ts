// Bus voltages. The interchange has no bus table, so a bus's voltage is read from the rows that
// touch it: first the items connected to it (motor, load, generator, cable, capacitor, reactor)
// that state u_kv, then lines (same voltage at both ends), then a transformer feeding it — for a
// transformer u_kv is the voltage of the bus it feeds (its secondary). Rows that disagree by
// more than VOLTAGE_MISMATCH are reported: a capacitor at 0.4 kV on an 11 kV bus is a typo or
// a wrong bus.
import { findKind } from '../kinds/index.ts';
import type { EquipmentRow } from './model.ts';
import { warning, type Problem } from './problems.ts';

/** Relative spread of stated voltages on one bus tolerated before a warning (common practice: ±10 % service band). */
export const VOLTAGE_MISMATCH = 0.1;

export interface BusVoltage {
  readonly u_kv: number;
  /** Row that gave the voltage. */
  readonly row: number;
}

function candidates(
  equipment: readonly EquipmentRow[],
): Map<string, Array<{ u: number; row: number; rank: number }>> {
  const byBus = new Map<string, Array<{ u: number; row: number; rank: number }>>();
  const add = (bus: string | undefined, u: number | undefined, row: number, rank: number) => {
    if (!bus || u === undefined || !(u > 0)) return;
    const list = byBus.get(bus) ?? [];
    list.push({ u, row, rank });
    byBus.set(bus, list);
  };
  for (const r of equipment) {
    const u = r.values.u_kv;
    const at = findKind(r.kind)?.voltageAt ?? 'bus';
    if (at === 'to_bus') add(r.to_bus, u, r.row, 2);
    else if (at === 'both') {
      add(r.bus, u, r.row, 1);
      add(r.to_bus, u, r.row, 1);
    } else add(r.bus, u, r.row, 0);
  }
  return byBus;
}

export function busVoltages(equipment: readonly EquipmentRow[]): {
  voltages: Map<string, BusVoltage>;
  problems: Problem[];
} {
  const voltages = new Map<string, BusVoltage>();
  const problems: Problem[] = [];
  for (const [bus, list] of candidates(equipment)) {
    const best = [...list].sort((a, b) => a.rank - b.rank || a.row - b.row)[0];
    if (!best) continue;
    voltages.set(bus, { u_kv: best.u, row: best.row });
    for (const c of list) {
      if (Math.abs(c.u - best.u) > VOLTAGE_MISMATCH * best.u) {
        problems.push(
          warning(
            { row: c.row, column: 'u_kv', bus },
            `u_kv ${c.u} kV differs from ${best.u} kV stated for bus ${bus} in row ${best.row} by more than ${VOLTAGE_MISMATCH * 100} %; check the voltage or the bus`,
          ),
        );
      }
    }
  }
  return { voltages, problems };
}
