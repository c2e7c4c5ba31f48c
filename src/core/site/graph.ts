// The bus graph: buses are named by the `bus` and `to_bus` columns; transformers and lines are
// the branches from their `bus` (upstream) to their `to_bus` (downstream). A valid site is a
// tree: every bus is fed by at most one branch, there are no loops, and exactly one bus is fed
// by nothing: the root, which is the point of connection to the utility.
import { isBranchKind } from '../kinds/index.ts';
import type { EquipmentRow } from './model.ts';
import { error, type Problem } from './problems.ts';

export interface BusGraph {
  /** Every bus reachable from the root, root first, then level by level (parents before children). */
  readonly order: readonly string[];
  readonly root: string | undefined;
  /** The transformer or line feeding each bus (absent for the root). */
  readonly feeder: ReadonlyMap<string, EquipmentRow>;
  /** The branches leaving each bus. */
  readonly branches: ReadonlyMap<string, readonly EquipmentRow[]>;
  /** 0 for the root, +1 per branch. */
  readonly level: ReadonlyMap<string, number>;
  /** Items connected to each bus (everything but transformers and lines), in row order. */
  readonly items: ReadonlyMap<string, readonly EquipmentRow[]>;
  /** The first row that names each bus, for messages. */
  readonly firstRow: ReadonlyMap<string, number>;
  readonly problems: readonly Problem[];
}

export function isBranch(row: EquipmentRow): boolean {
  return isBranchKind(row.kind) && row.to_bus !== undefined && row.to_bus !== '';
}

export function buildBusGraph(equipment: readonly EquipmentRow[]): BusGraph {
  const problems: Problem[] = [];
  const firstRow = new Map<string, number>();
  const note = (bus: string | undefined, row: number) => {
    if (bus && !firstRow.has(bus)) firstRow.set(bus, row);
  };
  for (const r of equipment) {
    note(r.bus, r.row);
    if (isBranch(r)) note(r.to_bus, r.row);
  }

  const feeder = new Map<string, EquipmentRow>();
  const branches = new Map<string, EquipmentRow[]>();
  const items = new Map<string, EquipmentRow[]>();
  for (const r of equipment) {
    if (isBranchKind(r.kind) || r.bus === '') continue;
    const list = items.get(r.bus) ?? [];
    list.push(r);
    items.set(r.bus, list);
  }
  for (const r of equipment) {
    if (!isBranch(r) || r.bus === '') continue;
    const to = r.to_bus as string;
    const where = { row: r.row, column: 'to_bus', tag: r.tag, bus: to };
    if (to === r.bus) {
      problems.push(
        error(where, `${r.kind} ${r.tag} feeds its own bus ${to}; to_bus must name a different bus`),
      );
      continue;
    }
    const other = feeder.get(to);
    if (other) {
      problems.push(
        error(
          where,
          `bus ${to} is fed twice: by ${other.kind} ${other.tag} (row ${other.row}) and by ${r.kind} ${r.tag} (row ${r.row}); ` +
            'a bus has one feeder (for units in parallel give one row with qty)',
        ),
      );
      continue;
    }
    feeder.set(to, r);
    const list = branches.get(r.bus) ?? [];
    list.push(r);
    branches.set(r.bus, list);
  }

  reportLoops(firstRow, feeder, problems);

  const roots = [...firstRow.keys()].filter((b) => !feeder.has(b));
  if (roots.length > 1) {
    const listed = roots.map((b) => `${b} (row ${firstRow.get(b)})`).join(', ');
    // Report it where the stray bus is named (a typo, usually): not at the point of connection,
    // taken to be the root with the most buses below it.
    const below = (root: string) => {
      const seen = new Set([root]);
      for (const b of seen) for (const r of branches.get(b) ?? []) seen.add(r.to_bus as string);
      return seen.size;
    };
    const main = roots.reduce((a, b) => (below(b) > below(a) ? b : a));
    const second = roots.find((r) => r !== main) as string;
    problems.push(
      error(
        { row: firstRow.get(second) as number, column: 'bus', bus: second },
        `buses ${listed} are each fed by nothing; a site has one point of connection, so every other bus needs a transformer or line (to_bus) feeding it`,
      ),
    );
  }
  const root = roots.length === 1 ? roots[0] : undefined;

  const order: string[] = [];
  const level = new Map<string, number>();
  if (root !== undefined) {
    order.push(root);
    level.set(root, 0);
    for (let i = 0; i < order.length; i++) {
      const bus = order[i] as string;
      for (const b of branches.get(bus) ?? []) {
        const to = b.to_bus as string;
        if (level.has(to)) continue;
        level.set(to, (level.get(bus) as number) + 1);
        order.push(to);
      }
    }
  }
  return { order, root, feeder, branches, items, level, firstRow, problems };
}

/** Follow feeders upward from every bus; a walk that returns to a bus it passed is a loop. */
function reportLoops(
  firstRow: ReadonlyMap<string, number>,
  feeder: ReadonlyMap<string, EquipmentRow>,
  problems: Problem[],
): void {
  const done = new Set<string>();
  for (const start of firstRow.keys()) {
    const path: string[] = [];
    const onPath = new Set<string>();
    let bus: string | undefined = start;
    while (bus !== undefined && !done.has(bus) && !onPath.has(bus)) {
      path.push(bus);
      onPath.add(bus);
      bus = feeder.get(bus)?.bus;
    }
    if (bus !== undefined && onPath.has(bus)) {
      const loop = path.slice(path.indexOf(bus));
      // Show the loop in the direction power would flow: feeder bus → fed bus.
      const downstream = [...loop].reverse();
      const rows = downstream.map((b) => feeder.get(b) as EquipmentRow);
      const first = rows.reduce((a, r) => (r.row < a.row ? r : a));
      // Start the description at the upstream bus of the first row in the loop.
      const k = downstream.indexOf(first.bus);
      for (const b of downstream.splice(0, k)) downstream.push(b); // no spread: a loop may be long
      problems.push(
        error(
          { row: first.row, column: 'to_bus', tag: first.tag, bus },
          `buses ${[...downstream, downstream[0]].join(' → ')} form a loop (rows ${rows
            .map((r) => r.row)
            .sort((a, b) => a - b)
            .join(', ')}); ` + 'power must flow from the point of connection down a tree',
        ),
      );
    }
    for (const b of path) done.add(b);
  }
}

/** The buses above `bus` up to the root, nearest first. */
export function ancestors(graph: BusGraph, bus: string): string[] {
  const out: string[] = [];
  let b = graph.feeder.get(bus)?.bus;
  while (b !== undefined && !out.includes(b)) {
    out.push(b);
    b = graph.feeder.get(b)?.bus;
  }
  return out;
}
