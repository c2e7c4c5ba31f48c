// What the site diagram shows, without the DOM: every bus named by the equipment list with what
// feeds it (the bus graph), its voltage, what hangs on it (compensation apart, the rest counted),
// its P, Q and cos φ in the chosen case as the engine computed them on the Buses sheet (found by
// header text), and the problems that concern it.
import { buildBusGraph, type BusGraph } from '../../core/site/graph.ts';
import type { EquipmentRow, Site } from '../../core/site/model.ts';
import type { Problem } from '../../core/site/problems.ts';
import { busVoltages } from '../../core/site/voltages.ts';
import { cellError, type Grid } from '../charts/chartData.ts';

export interface Feeder {
  readonly kind: 'transformer' | 'line' | 'feeder';
  readonly tag: string;
  /** Rating of a transformer, kVA (times units in parallel). */
  readonly sKva?: number;
  readonly units: number;
}

export interface BankSummary {
  readonly rows: number;
  /** Total rated kvar (magnitudes) of the rows on the bus, times their quantity. */
  readonly kvar: number;
  /** Capacitors only: some rows have a detuning reactor (p_pct). */
  readonly detuned: boolean;
}

export interface BusFigures {
  readonly p?: number;
  readonly q?: number;
  readonly cos?: number;
  /** Figures the engine gave an error for, with the error code (e.g. q: '#N/A'). */
  readonly failed?: Readonly<Partial<Record<'p' | 'q' | 'cos', string>>>;
}

export interface DiagramBus {
  readonly name: string;
  readonly kv?: number;
  readonly parent?: string;
  readonly feeder?: Feeder;
  readonly children: readonly string[];
  /** 0 for a point of connection, +1 per branch. */
  readonly depth: number;
  /** e.g. "6 motors · 2 loads" (capacitors and reactors drawn apart). */
  readonly itemsText: string;
  readonly capacitors?: BankSummary;
  readonly reactors?: BankSummary;
  readonly figures: BusFigures;
  /** 0-based row of this bus on the Buses sheet; absent when the sheet has no row for it yet. */
  readonly sheetRow?: number;
  readonly errors: readonly string[];
}

export interface DiagramModel {
  /** Buses in drawing order: each tree depth first from its root. */
  readonly buses: ReadonlyMap<string, DiagramBus>;
  readonly roots: readonly string[];
}

const PLURAL: Record<string, [string, string]> = {
  motor: ['motor', 'motors'],
  load: ['load', 'loads'],
  generator: ['generator', 'generators'],
  cable: ['cable', 'cables'],
};

function units(r: EquipmentRow): number {
  const q = r.values.qty;
  return q !== undefined && q > 0 ? q : 1;
}

function itemsText(items: readonly EquipmentRow[]): string {
  const counts = new Map<string, number>();
  for (const r of items) if (PLURAL[r.kind]) counts.set(r.kind, (counts.get(r.kind) ?? 0) + units(r));
  return [...counts].map(([k, n]) => `${n} ${(PLURAL[k] as [string, string])[n === 1 ? 0 : 1]}`).join(' · ');
}

function bank(items: readonly EquipmentRow[], kind: 'capacitor' | 'reactor'): BankSummary | undefined {
  const rows = items.filter((r) => r.kind === kind);
  if (rows.length === 0) return undefined;
  return {
    rows: rows.length,
    kvar: rows.reduce((s, r) => s + Math.abs(r.values.q_kvar ?? 0) * units(r), 0),
    detuned: rows.some((r) => (r.values.p_pct ?? 0) > 0),
  };
}

/** Per-bus figures of one case from the Buses sheet, with any error values in them. */
export function busFigures(
  sheet: Grid | undefined,
  caseName: string,
): Map<string, { row: number; figures: BusFigures; errors: string[] }> {
  const out = new Map<string, { row: number; figures: BusFigures; errors: string[] }>();
  const header = new Map<string, number>();
  (sheet?.[0] ?? []).forEach((h, i) => {
    if (typeof h === 'string') header.set(h.trim().toLowerCase(), i);
  });
  const cols = {
    p: header.get(`p ${caseName} (kw)`.toLowerCase()),
    q: header.get(`q ${caseName} (kvar)`.toLowerCase()),
    cos: header.get(`cos φ ${caseName}`.toLowerCase()),
  };
  const headers = { p: `P ${caseName} (kW)`, q: `Q ${caseName} (kvar)`, cos: `cos φ ${caseName}` };
  // The bus list runs from row 2 to the first row without a bus name (notes may follow).
  for (let r = 1; r < (sheet?.length ?? 0); r++) {
    const row = sheet?.[r] ?? [];
    const name = row[0];
    if (typeof name !== 'string' || name.trim() === '') break;
    const figures: { -readonly [K in keyof BusFigures]: BusFigures[K] } = {};
    const failed: Partial<Record<'p' | 'q' | 'cos', string>> = {};
    const errors: string[] = [];
    for (const k of ['p', 'q', 'cos'] as const) {
      const c = cols[k];
      if (c === undefined) continue;
      const v = row[c];
      const err = cellError(v);
      if (err) {
        errors.push(`${headers[k]} on the Buses sheet is ${err.code}: ${err.message}`);
        failed[k] = err.code;
      } else if (typeof v === 'number' && Number.isFinite(v)) figures[k] = v;
    }
    if (Object.keys(failed).length > 0) figures.failed = failed;
    if (!out.has(name)) out.set(name, { row: r, figures, errors });
  }
  return out;
}

/** Which bus a problem concerns: its own bus, else the bus of the equipment row it names. */
function problemBus(p: Problem, equipment: readonly EquipmentRow[]): string | undefined {
  if (p.bus) return p.bus;
  // Rows of a site read from a workbook are numbered as one list from 2.
  return p.row !== undefined ? equipment[p.row - 2]?.bus || undefined : undefined;
}

export function buildDiagramModel(input: {
  readonly site: Site;
  /** Problems of the inputs, rows numbered as in `site` (validateSite's numbering). */
  readonly problems: readonly Problem[];
  readonly busesSheet: Grid | undefined;
  readonly caseName: string;
  readonly graph?: BusGraph;
}): DiagramModel {
  const equipment = input.site.equipment.filter((r) => r.bus !== '');
  const graph = input.graph ?? buildBusGraph(equipment);
  const { voltages } = busVoltages(equipment);
  const figures = busFigures(input.busesSheet, input.caseName);
  const errorsOf = new Map<string, string[]>();
  for (const p of input.problems) {
    if (p.severity !== 'error') continue;
    const bus = problemBus(p, input.site.equipment);
    if (bus === undefined || !graph.firstRow.has(bus)) continue;
    const list = errorsOf.get(bus) ?? [];
    if (!list.includes(p.message)) list.push(p.message);
    errorsOf.set(bus, list);
  }

  const childrenOf = (bus: string) => (graph.branches.get(bus) ?? []).map((b) => b.to_bus as string);
  // Roots: the point of connection, or with a broken graph every bus fed by nothing; a bus left
  // over after walking them sits in a loop and starts a tree of its own so it is still drawn.
  const roots: string[] = [];
  const depth = new Map<string, number>();
  const walk = (root: string) => {
    roots.push(root);
    depth.set(root, 0);
    const queue = [root];
    for (let i = 0; i < queue.length; i++) {
      const bus = queue[i] as string;
      for (const c of childrenOf(bus)) {
        if (depth.has(c)) continue;
        depth.set(c, (depth.get(bus) as number) + 1);
        queue.push(c);
      }
    }
  };
  for (const bus of graph.firstRow.keys()) if (!graph.feeder.has(bus)) walk(bus);
  for (const bus of graph.firstRow.keys()) if (!depth.has(bus)) walk(bus);

  const buses = new Map<string, DiagramBus>();
  for (const name of graph.firstRow.keys()) {
    const feederRow = graph.feeder.get(name);
    const items = graph.items.get(name) ?? [];
    const fig = figures.get(name);
    const kv = voltages.get(name)?.u_kv;
    const cap = bank(items, 'capacitor');
    const rea = bank(items, 'reactor');
    const parent = feederRow && depth.get(name) !== 0 ? feederRow.bus : undefined;
    buses.set(name, {
      name,
      ...(kv !== undefined ? { kv } : {}),
      ...(parent !== undefined ? { parent } : {}),
      ...(feederRow && parent !== undefined
        ? {
            feeder: {
              kind: feederRow.kind as 'transformer' | 'line' | 'feeder',
              tag: feederRow.tag,
              units: units(feederRow),
              ...(feederRow.values.s_kva !== undefined ? { sKva: feederRow.values.s_kva } : {}),
            },
          }
        : {}),
      children: childrenOf(name).filter((c) => depth.get(c) !== 0),
      depth: depth.get(name) ?? 0,
      itemsText: itemsText(items),
      ...(cap ? { capacitors: cap } : {}),
      ...(rea ? { reactors: rea } : {}),
      figures: fig?.figures ?? {},
      ...(fig ? { sheetRow: fig.row } : {}),
      errors: [...(fig?.errors ?? []), ...(errorsOf.get(name) ?? [])],
    });
  }
  return { buses, roots };
}
