// Individual motor compensation: a bus that holds exactly one motor row, one or more capacitor
// rows (or a bank on the Compensation sheet) and nothing else (no loads, generators, cables,
// reactors, and no transformer or line leaving it) is the motor's own capacitor, connected on
// the motor side of its starter and switched with it (common practice: the capacitor is
// connected to the motor terminals so that one contactor switches both).
//
// So a bank on such a bus is out in every case where the motor is stopped, which the roll-up
// shows as the bus drawing no active power (load factor 0 or no unit running): compensate.ts
// and the Compensation sheet's formulas both read it that way.
import type { EquipmentRow } from './model.ts';
import type { BusGraph } from './graph.ts';
import { isCapacitorKind } from '../kinds/index.ts';

/** The motor whose bus holds only it and capacitors (individual compensation), if any. */
export function soleMotorOf(
  bus: string,
  graph: Pick<BusGraph, 'branches' | 'items'>,
): EquipmentRow | undefined {
  if ((graph.branches.get(bus) ?? []).length > 0) return undefined;
  const items = graph.items.get(bus) ?? [];
  const motors = items.filter((r) => r.kind === 'motor');
  const others = items.filter((r) => r.kind !== 'motor' && !isCapacitorKind(r.kind));
  return motors.length === 1 && others.length === 0 ? motors[0] : undefined;
}

/** A bank switched with its motor is out when the motor's bus draws no active power in the case. */
export function switchedOutWithMotor(soleMotor: boolean, busPKw: number): boolean {
  return soleMotor && busPKw === 0;
}
