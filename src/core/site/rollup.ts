// The bus balance of one operating case, in the load convention (Q > 0 absorbed, Q < 0
// delivered; delivered P counts negative). Every element's P and Q is per unit × running from
// the catalogue (see cases.ts for load factors and what 0 means). Buses are summed from the
// bottom up: a transformer or line adds the total of the bus it feeds plus its own losses at
// that loading into its upstream bus, level by level to the root, the point of connection.
import type { EquipmentKind, EquipmentRow, Site } from './model.ts';
import { findKind, type KindSpec } from '../kinds/index.ts';
import { branchPower, shuntPower } from './rowPower.ts';
import { loadFactor, resolveCase, unitsRunning } from './cases.ts';
import type { BusGraph } from './graph.ts';
import { error, type Problem } from './problems.ts';
import { siteTopology, type BranchPlace, type ShuntPlace, type SiteTopology } from './topology.ts';
import { apparentPower, powerFactor, tanPhi } from '../elements/powerTriangle.ts';

export type Sense = 'lagging' | 'leading' | 'unity';

export interface ElementBalance {
  readonly row: number;
  readonly tag: string;
  readonly kind: EquipmentKind;
  /** The bus whose total includes this element (for a transformer or line: its upstream bus). */
  readonly bus: string;
  readonly running: number;
  /** Load factor in the case (undefined for transformers and lines). */
  readonly load?: number;
  readonly p_kw: number;
  readonly q_kvar: number;
  readonly q_absorbed_kvar: number;
  readonly q_delivered_kvar: number;
  /** Transformers and lines: apparent power carried (all units together) and loading of one unit. */
  readonly s_load_kva?: number;
  readonly loading_pct?: number;
  /** Present when the catalogue refused the values; the element then counts as 0. */
  readonly error?: string;
}

export interface BusBalance {
  readonly bus: string;
  readonly level: number;
  /** Tag of the transformer or line feeding the bus; undefined at the root. */
  readonly fed_by?: string;
  readonly u_kv?: number;
  /** Everything the bus draws from upstream: own items plus fed buses plus their feeders' losses. */
  readonly p_kw: number;
  readonly q_kvar: number;
  readonly q_absorbed_kvar: number;
  readonly q_delivered_kvar: number;
  readonly s_kva: number;
  /** null when S = 0. */
  readonly cos_phi: number | null;
  /** null when P = 0. */
  readonly tan_phi: number | null;
  /** By the sign of Q: lagging = draws kvar, leading = delivers kvar. */
  readonly sense: Sense;
  /** Items connected directly to this bus (no fed buses, no feeder losses). */
  readonly own_p_kw: number;
  readonly own_q_kvar: number;
}

export interface CaseBalance {
  readonly case: string;
  readonly hz: number;
  /** Root first, then level by level. */
  readonly buses: readonly BusBalance[];
  readonly root: BusBalance;
  readonly elements: readonly ElementBalance[];
  readonly problems: readonly Problem[];
}

/** kvar added to a bus's own items that is not an equipment row: a bank's output switched in, a reactor. */
export interface BusExtra {
  readonly q_absorbed_kvar: number;
  readonly q_delivered_kvar: number;
}

/** Thrown when the site cannot be balanced at all (no single root, a loop, an unknown case). */
export class SiteStructureError extends Error {
  constructor(readonly problems: readonly Problem[]) {
    super(problems.map((p) => p.message).join('\n'));
    this.name = 'SiteStructureError';
  }
}

interface Sum {
  p: number;
  abs: number;
  del: number;
}
const add = (s: Sum, p: number, q: number) => {
  s.p += p;
  if (q > 0) s.abs += q;
  else s.del -= q;
};

/** One element's balance; fields in the order the JSON output shows them. */
function shuntResult(
  row: EquipmentRow,
  n: number,
  load: number,
  p: number,
  q: number,
  error?: string,
): ElementBalance {
  const e: ElementBalance = {
    row: row.row,
    tag: row.tag,
    kind: row.kind,
    bus: row.bus,
    running: n,
    load,
    p_kw: p,
    q_kvar: q,
    q_absorbed_kvar: Math.max(q, 0),
    q_delivered_kvar: Math.max(-q, 0),
  };
  return error === undefined ? e : { ...e, error };
}

function shuntElement(
  row: EquipmentRow,
  kind: KindSpec | undefined,
  caseName: string,
  hz: number,
): ElementBalance {
  const off = (message: string) =>
    shuntResult(row, unitsRunning(row), loadFactor(row, caseName).value, 0, 0, message);
  if (!kind) return off(`unknown kind "${row.kind}"`);
  const r = shuntPower(row, kind, caseName, hz);
  if (!r.ok) return off(r.message);
  return shuntResult(row, r.running, r.load, r.p, r.q);
}

/** Losses of a transformer or line carrying the apparent power sKva of the bus it feeds. */
function branchElement(row: EquipmentRow, sKva: number, hz: number): ElementBalance {
  const kind = findKind(row.kind);
  const base = { row: row.row, tag: row.tag, kind: row.kind, bus: row.bus, s_load_kva: sKva };
  const zero = { p_kw: 0, q_kvar: 0, q_absorbed_kvar: 0, q_delivered_kvar: 0 };
  if (!kind) return { ...base, running: unitsRunning(row), ...zero, error: `unknown kind "${row.kind}"` };
  const r = branchPower(row, kind, sKva, hz);
  if (!r.ok) return { ...base, running: Math.max(unitsRunning(row), 1), ...zero, error: r.message };
  return {
    ...base,
    running: r.running,
    ...(r.loadingPct !== undefined ? { loading_pct: r.loadingPct } : {}),
    p_kw: r.p,
    q_kvar: r.qAbsorbed - r.qDelivered,
    q_absorbed_kvar: r.qAbsorbed,
    q_delivered_kvar: r.qDelivered,
  };
}

function busResult(bus: string, graph: BusGraph, u: number | undefined, total: Sum, own: Sum): BusBalance {
  const q = total.abs - total.del;
  const s = apparentPower(total.p, q);
  const fed = graph.feeder.get(bus)?.tag;
  return {
    bus,
    level: graph.level.get(bus) ?? 0,
    ...(fed !== undefined ? { fed_by: fed } : {}),
    ...(u !== undefined ? { u_kv: u } : {}),
    p_kw: total.p,
    q_kvar: q,
    q_absorbed_kvar: total.abs,
    q_delivered_kvar: total.del,
    s_kva: s,
    cos_phi: powerFactor(total.p, q) ?? null,
    tan_phi: tanPhi(total.p, q) ?? null,
    sense: q > 0 ? 'lagging' : q < 0 ? 'leading' : 'unity',
    own_p_kw: own.p,
    own_q_kvar: own.abs - own.del,
  };
}

/** The shunt items of one case: what a roll-up with banks added (compensate.ts) shares with the one without. */
interface ShuntPass {
  readonly top: SiteTopology;
  readonly hz: number;
  readonly elements: readonly ElementBalance[];
  readonly problems: readonly Problem[];
}

/** The shunt pass each balance was summed from. */
const SHUNT_PASS = new WeakMap<CaseBalance, ShuntPass>();

function shuntPass(top: SiteTopology, caseName: string, hz: number, reuse?: CaseBalance): ShuntPass {
  const known = reuse === undefined ? undefined : SHUNT_PASS.get(reuse);
  if (known !== undefined && known.top === top && known.hz === hz && reuse?.case === caseName) return known;
  const elements: ElementBalance[] = [];
  const problems: Problem[] = [];
  for (const { row, kind } of top.shunts) {
    const e = shuntElement(row, kind, caseName, hz);
    elements.push(e);
    if (e.error) problems.push(error({ row: row.row, tag: row.tag }, e.error));
  }
  return { top, hz, elements, problems };
}

/**
 * The balance of every bus in one case. Throws SiteStructureError when the site is not a tree or
 * the case is unknown. `extra`: kvar added on buses (banks switched in). `same`: a balance of
 * this site in this case (with or without extra) whose items are taken as they are instead of
 * being computed again; a balance of another site or case is ignored.
 */
export function rollUp(
  site: Site,
  caseName: string,
  extra?: ReadonlyMap<string, BusExtra>,
  same?: CaseBalance,
): CaseBalance {
  const found = resolveCase(site.settings.cases, caseName);
  if (found === undefined) {
    throw new SiteStructureError([
      error({}, `unknown case "${caseName}"; the site's cases are ${site.settings.cases.join(', ')}`),
    ]);
  }
  const top = siteTopology(site);
  if (top.structural.length > 0) throw new SiteStructureError(top.structural);
  const { graph, voltages } = top;
  const hz = site.settings.hz;
  const own: Sum[] = graph.order.map(() => ({ p: 0, abs: 0, del: 0 }));
  const total: Sum[] = graph.order.map(() => ({ p: 0, abs: 0, del: 0 }));
  const pass = shuntPass(top, found, hz, same);
  const elements: ElementBalance[] = pass.elements.slice();
  const problems: Problem[] = pass.problems.slice();
  pass.elements.forEach((e, i) => {
    const sum = own[(top.shunts[i] as ShuntPlace).bus] as Sum;
    add(sum, e.p_kw, e.q_absorbed_kvar);
    add(sum, 0, -e.q_delivered_kvar);
  });
  for (const [bus, x] of extra ?? []) {
    const at = top.place.get(bus);
    if (at === undefined) continue;
    const sum = own[at] as Sum;
    add(sum, 0, x.q_absorbed_kvar);
    add(sum, 0, -x.q_delivered_kvar);
  }
  // Bottom-up: children come after parents in graph.order, so walk it backwards.
  let runaway = false;
  const buses: BusBalance[] = new Array<BusBalance>(graph.order.length);
  for (let i = graph.order.length - 1; i >= 0; i--) {
    const bus = graph.order[i] as string;
    const t = total[i] as Sum;
    const o = own[i] as Sum;
    t.p += o.p;
    t.abs += o.abs;
    t.del += o.del;
    for (const { row: br, to } of top.branches[i] as readonly BranchPlace[]) {
      const child = total[to] as Sum;
      const e = branchElement(br, apparentPower(child.p, child.abs - child.del), hz);
      elements.push(e);
      if (e.error) problems.push(error({ row: br.row, tag: br.tag }, e.error));
      else if (
        !runaway &&
        !(Math.max(Math.abs(e.p_kw), e.q_absorbed_kvar, e.q_delivered_kvar) <= RUNAWAY_KVA)
      ) {
        runaway = true;
        const p = error(
          { row: br.row, tag: br.tag },
          runawayText(br.kind, hz, found, e.q_absorbed_kvar, e.p_kw),
        );
        RUNAWAY.add(p);
        problems.push(p);
      }
      t.p += child.p + e.p_kw;
      t.abs += child.abs + e.q_absorbed_kvar;
      t.del += child.del + e.q_delivered_kvar;
    }
    buses[i] = busResult(bus, graph, voltages.get(bus), t, o);
  }
  elements.sort((a, b) => a.row - b.row);
  const balance: CaseBalance = { case: found, hz, buses, root: buses[0] as BusBalance, elements, problems };
  SHUNT_PASS.set(balance, pass);
  return balance;
}

/** Every case of the site, in the order of the settings. */
/**
 * Beyond this a figure is not a site's (1 TW): losses of branches that feed one another run away
 * when a line or transformer carries far more than its voltage allows, each one's I²X adding to
 * the load of the one above it.
 */
export const RUNAWAY_KVA = 1e9;

const runawayText = (kind: string, hz: number, caseName: string, q: number, p: number) =>
  `the ${kind}'s own losses come to ${q.toExponential(2)} kvar and ${p.toExponential(2)} kW in case ${caseName} (${hz} Hz): ` +
  `more than any site draws (${RUNAWAY_KVA.toExponential(0)} kVA), so the figures above it cannot be trusted; ` +
  'check U (kV), length and mH/km of this branch and those below it (megawatts carried at low voltage?)';

/** The problems rollUp raised for runaway losses (told apart from the same text elsewhere). */
const RUNAWAY = new WeakSet<Problem>();

/** The first branch (from the bottom of the network) whose losses run away, as an error; else undefined. */
export function runawayProblem(bal: CaseBalance): Problem | undefined {
  return bal.problems.find((p) => RUNAWAY.has(p));
}

export function rollUpAll(site: Site): CaseBalance[] {
  return site.settings.cases.map((c) => rollUp(site, c));
}
