// What the roll-up needs of a site that does not depend on the operating case: the bus graph,
// the bus voltages, and which rows are shunt items on which bus. Worked out once per site and
// shared by the roll-up of every case (and by compensate.ts's before and after): a site is
// immutable data (readonly throughout), so the list of equipment rows identifies it.
import { findKind, type KindSpec } from '../kinds/index.ts';
import { buildBusGraph, type BusGraph } from './graph.ts';
import type { EquipmentRow, Site } from './model.ts';
import { error, type Problem } from './problems.ts';
import { busVoltages } from './voltages.ts';

/** A row the roll-up adds to a bus's own items: its kind (undefined: unknown) and its bus's place in graph.order. */
export interface ShuntPlace {
  readonly row: EquipmentRow;
  readonly kind: KindSpec | undefined;
  readonly bus: number;
}

/** A transformer or line leaving a bus, with the place of the bus it feeds in graph.order. */
export interface BranchPlace {
  readonly row: EquipmentRow;
  readonly to: number;
}

export interface SiteTopology {
  readonly graph: BusGraph;
  /** Why the site cannot be balanced (not a tree with one point of connection); empty when it can. */
  readonly structural: readonly Problem[];
  /** kV of each bus that has one stated. */
  readonly voltages: ReadonlyMap<string, number>;
  /** Each bus's place in graph.order. */
  readonly place: ReadonlyMap<string, number>;
  /** Shunt rows on a bus of the tree (unknown kinds included), in row order. */
  readonly shunts: readonly ShuntPlace[];
  /** Branches leaving each bus, by the bus's place in graph.order. */
  readonly branches: readonly (readonly BranchPlace[])[];
}

const known = new WeakMap<readonly EquipmentRow[], SiteTopology>();

/** The site's topology, worked out on the first call for its equipment list. */
export function siteTopology(site: Site): SiteTopology {
  let t = known.get(site.equipment);
  if (t === undefined) {
    t = topologyOf(site.equipment);
    known.set(site.equipment, t);
  }
  return t;
}

function topologyOf(equipment: readonly EquipmentRow[]): SiteTopology {
  const graph = buildBusGraph(equipment.filter((r) => r.bus !== ''));
  const errors = graph.problems.filter((p) => p.severity === 'error');
  const structural =
    errors.length > 0 || graph.root !== undefined
      ? errors
      : [error({}, 'the site has no bus fed by nothing (no point of connection)')];
  const voltages = new Map<string, number>();
  for (const [bus, v] of busVoltages(equipment).voltages) voltages.set(bus, v.u_kv);
  const place = new Map<string, number>();
  graph.order.forEach((b, i) => place.set(b, i));
  const shunts: ShuntPlace[] = [];
  for (const row of equipment) {
    const kind = findKind(row.kind);
    if (kind?.role === 'branch') continue;
    const bus = place.get(row.bus);
    if (bus !== undefined) shunts.push({ row, kind, bus });
  }
  const branches = graph.order.map((b) =>
    (graph.branches.get(b) ?? []).map((row) => ({ row, to: place.get(row.to_bus as string) as number })),
  );
  return { graph, structural, voltages, place, shunts, branches };
}
