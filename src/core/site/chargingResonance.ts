// Resonance of all the capacitance on a voltage level, cable and line charging included. Cables
// and lines are short against a harmonic's wavelength, so their charging is lumped: every bus
// joined by lines (no transformer between) forms one zone, whose capacitance sits at the zone's
// top bus (the one fed by a transformer, or the point of connection) against the short-circuit
// power there. A shunt reactor in service in the zone is in parallel with the supply: at order h
// the admittances balance when h²·Qc = Ssc + Qr, so RESONANCE.ORDER takes Ssc + Qr as the supply
// (lumped-element derivation, the same as IEEE Std 1036's h = √(Ssc/Qc) with Qr = 0).
import type { EquipmentRow, Site } from './model.ts';
import type { BusGraph } from './graph.ts';
import type { CaseBalance } from './rollup.ts';
import type { BusShortCircuit } from './shortCircuit.ts';
import { nearHarmonic, resonanceOrderOf, voltageRise, RESONANCE_MARGIN } from './bankRules.ts';
import { infiniteSupplyNote } from './supplyStrength.ts';
import { designWarning, type DesignWarning } from './warnings.ts';
import { findKind } from '../kinds/index.ts';

/** The top bus of each bus's zone: walk up through lines until a transformer or the root. */
export function zoneTops(graph: BusGraph): Map<string, string> {
  const top = new Map<string, string>();
  for (const bus of graph.order) {
    const feeder = graph.feeder.get(bus);
    const viaLine =
      feeder !== undefined && feeder.kind !== 'transformer' && findKind(feeder.kind)?.traits?.charging;
    top.set(bus, viaLine ? (top.get(feeder.bus) ?? feeder.bus) : bus);
  }
  return top;
}

export interface ZoneCapacitance {
  /** Cable and line charging delivered in the zone, kvar. */
  readonly charging_kvar: number;
  /** Plain (not detuned) capacitors delivering in the zone, kvar. */
  readonly plain_kvar: number;
}

const isPlainCapacitor = (row: EquipmentRow | undefined) =>
  row !== undefined && findKind(row.kind)?.traits?.capacitor === true && !((row.values.p_pct ?? 0) > 0);

/** Charging and plain capacitor kvar per zone top in one case (from the case's balance). */
export function zoneCapacitance(
  site: Site,
  graph: BusGraph,
  balance: CaseBalance,
): Map<string, ZoneCapacitance> {
  const tops = zoneTops(graph);
  const byRow = new Map(site.equipment.map((r) => [r.row, r]));
  const out = new Map<string, { charging_kvar: number; plain_kvar: number }>();
  for (const e of balance.elements) {
    const top = tops.get(e.bus);
    if (top === undefined || !(e.q_delivered_kvar > 0)) continue;
    const z = out.get(top) ?? { charging_kvar: 0, plain_kvar: 0 };
    if (findKind(e.kind)?.traits?.charging) z.charging_kvar += e.q_delivered_kvar;
    else if (isPlainCapacitor(byRow.get(e.row))) z.plain_kvar += e.q_delivered_kvar;
    else continue;
    out.set(top, z);
  }
  return out;
}

/**
 * Per bus, the most cable and line charging its zone holds in any of these cases, kvar: what the
 * design's resonance sweep and the Compensation sheet's resonance and voltage-rise columns count
 * (the case with the most charging gives the lowest resonance order and the highest voltage).
 */
export function zoneChargingMost(
  site: Site,
  graph: BusGraph,
  balances: readonly CaseBalance[],
): Map<string, number> {
  const most = new Map<string, number>();
  for (const bal of balances)
    for (const [top, z] of zoneCapacitance(site, graph, bal))
      most.set(top, Math.max(most.get(top) ?? 0, z.charging_kvar));
  return new Map([...zoneTops(graph)].map(([bus, top]) => [bus, most.get(top) ?? 0]));
}

const f = (x: number, d = 1) => x.toFixed(d);

/**
 * A finding per case and zone whose charging (with the plain capacitors there) resonates near a
 * characteristic harmonic. `reactorKvar(case, top)` gives a shunt reactor in service.
 */
export function chargingResonanceWarnings(
  site: Site,
  graph: BusGraph,
  ssc: ReadonlyMap<string, BusShortCircuit>,
  balances: readonly CaseBalance[],
  reactorKvar: (caseName: string, top: string) => number = () => 0,
): DesignWarning[] {
  const out: DesignWarning[] = [];
  for (const bal of balances) {
    for (const [top, q] of zoneCapacitance(site, graph, bal)) {
      const sc = ssc.get(top);
      if (sc === undefined || !(q.charging_kvar > 0)) continue;
      const supply = sc.ssc_mva + reactorKvar(bal.case, top) / 1000;
      const order = resonanceOrderOf(supply, q.charging_kvar + q.plain_kvar, 0);
      const near = order === undefined ? undefined : nearHarmonic(order);
      if (order === undefined || near === undefined) continue;
      const plain = q.plain_kvar > 0 ? ` with ${f(q.plain_kvar)} kvar of plain capacitors` : '';
      const rise = voltageRise(q.charging_kvar + q.plain_kvar, sc.ssc_mva);
      out.push(
        designWarning(
          'warning',
          'resonance',
          { bus: top, case: bal.case },
          `${f(q.charging_kvar)} kvar of cable and line charging${plain} on the buses fed from ${top} (short-circuit power ${f(sc.ssc_mva, 2)} MVA${infiniteSupplyNote(sc)}) resonate at order ${order.toFixed(2)} (RESONANCE.ORDER), within ${RESONANCE_MARGIN * 100} % of the ${near}th harmonic; they hold the voltage ${rise.toFixed(2)} % up (VRISE.PCT): have a harmonic study confirm it, or change the reactive plant`,
        ),
      );
    }
  }
  return out;
}
