// The engine's recalculation order, computed over reusable typed arrays.
//
// After every edit the formula engine walks everything downstream of the changed cells with
// Tarjan's algorithm (to find the order and any cycles), then recomputes only the cells whose
// inputs changed. In a workbook with compensation, every bank's dispatch depends on the root's
// need, so one typed load reaches about 4,300 cells at 10,000 rows / 300 buses, and the walk,
// not the arithmetic, took most of an edit: the library keeps its bookkeeping in sparse arrays
// indexed by node id (up to 250,000 here), which the JavaScript engine stores as hash tables,
// and builds a filtered copy of a cell's dependents three times per cell.
//
// This module replaces that one method of the library's dependency graph with the same
// algorithm, step for step (same visiting order, same result order, same cycle handling, same
// "recompute only what changed" rule), on typed arrays kept per graph and cleared after each
// walk. tests/engine/topSort.test.ts runs both on random graphs, cycles included, and requires
// identical results; it also fails if a new version of the library moves what we replace, and
// the engine then keeps the library's own method (nothing here is required for correctness).
import { HyperFormula } from 'hyperformula';

/** A vertex of the engine's dependency graph, as far as the walk needs it. */
interface GraphNode {
  readonly idInGraph?: number;
}

/** The part of the library's graph (DependencyGraph/Graph in 3.x) that the walk reads. */
interface GraphInternals {
  readonly nodesSparseArray: readonly (GraphNode | undefined)[];
  readonly edgesSparseArray: readonly (readonly (number | undefined)[] | undefined)[];
}

type Recompute = (node: GraphNode) => boolean;
type OnCycle = (node: GraphNode) => void;
interface SortResult {
  readonly sorted: GraphNode[];
  readonly cycled: GraphNode[];
}
type SortMethod = (
  this: GraphInternals,
  modified: GraphNode[],
  recompute: Recompute,
  onCycle: OnCycle,
) => SortResult;

const METHOD = 'getTopSortedWithSccSubgraphFrom';
const ON_STACK = 1;
const PROCESSED = 2;
const POPPED = 3;

/** Per-node scratch state of one walk; every entry a walk touches is reset when it ends. */
class WalkState {
  size = 0;
  status = new Uint8Array(0);
  entered = new Uint8Array(0);
  inScc = new Uint8Array(0);
  onCycle = new Uint8Array(0);
  update = new Uint8Array(0);
  entrance = new Int32Array(0);
  low = new Int32Array(0);
  parent = new Int32Array(0);

  reserve(n: number): void {
    if (n <= this.size) return;
    const size = Math.max(n, Math.ceil(this.size * 1.5), 1024);
    this.size = size;
    this.status = new Uint8Array(size);
    this.entered = new Uint8Array(size);
    this.inScc = new Uint8Array(size);
    this.onCycle = new Uint8Array(size);
    this.update = new Uint8Array(size);
    this.entrance = new Int32Array(size);
    this.low = new Int32Array(size);
    this.parent = new Int32Array(size).fill(-1);
  }

  clear(touched: readonly number[]): void {
    for (const t of touched) {
      this.status[t] = 0;
      this.entered[t] = 0;
      this.inScc[t] = 0;
      this.onCycle[t] = 0;
      this.update[t] = 0;
      this.parent[t] = -1;
    }
  }
}

const states = new WeakMap<object, WalkState>();

/** Tarjan's algorithm from the modified nodes, then the recomputation pass, as the library does it. */
function walk(
  graph: GraphInternals,
  modified: GraphNode[],
  recompute: Recompute,
  onCycle: OnCycle,
): SortResult {
  const nodes = graph.nodesSparseArray;
  const edges = graph.edgesSparseArray;
  let st = states.get(graph);
  if (!st) states.set(graph, (st = new WalkState()));
  st.reserve(nodes.length);
  const { status, entered, inScc, entrance, low, parent, update } = st;
  const cyc = st.onCycle;
  const live = (t: number | undefined): t is number => t !== undefined && nodes[t] !== undefined;
  const roots: number[] = [];
  for (const n of modified) if (n.idInGraph !== undefined) roots.push(n.idInGraph);
  roots.reverse();
  const touched: number[] = [];
  const order: number[] = [];
  try {
    let time = 0;
    const dfs: number[] = [];
    const sccStack: number[] = [];
    for (const v of roots) {
      if (status[v] !== 0) continue;
      status[v] = ON_STACK;
      touched.push(v);
      dfs.push(v);
      while (dfs.length > 0) {
        const u = dfs[dfs.length - 1] as number;
        const out = edges[u] ?? [];
        if (status[u] === ON_STACK) {
          entrance[u] = low[u] = time++;
          entered[u] = 1;
          sccStack.push(u);
          for (const t of out) {
            if (!live(t) || entered[t]) continue;
            dfs.push(t);
            parent[t] = u;
            if (status[t] === 0) touched.push(t);
            status[t] = ON_STACK;
          }
          status[u] = PROCESSED;
        } else if (status[u] === PROCESSED) {
          let uLow = entrance[u] as number;
          for (const t of out) {
            if (!live(t) || inScc[t]) continue;
            uLow = Math.min(uLow, parent[t] === u ? (low[t] as number) : (entrance[t] as number));
          }
          low[u] = uLow;
          if (uLow === entrance[u]) {
            const start = order.length;
            let w: number;
            do {
              w = sccStack.pop() as number;
              order.push(w);
            } while (w !== u);
            for (let k = start; k < order.length; k++) inScc[order[k] as number] = 1;
            if (order.length - start > 1)
              for (let k = start; k < order.length; k++) cyc[order[k] as number] = 1;
          }
          dfs.pop();
          status[u] = POPPED;
        } else dfs.pop();
      }
    }
    for (const t of roots) update[t] = 1;
    const sorted: GraphNode[] = [];
    const cycled: GraphNode[] = [];
    const markDependents = (out: readonly (number | undefined)[]) => {
      for (const s of out) if (live(s)) update[s] = 1;
    };
    for (let k = order.length - 1; k >= 0; k--) {
      const t = order[k] as number;
      const out = edges[t] ?? [];
      const node = nodes[t] as GraphNode;
      if (cyc[t] || out.includes(t)) {
        cycled.push(node);
        onCycle(node);
        markDependents(out);
      } else {
        sorted.push(node);
        if (update[t] && recompute(node)) markDependents(out);
      }
    }
    return { sorted, cycled };
  } finally {
    st.clear(touched);
  }
}

let original: SortMethod | undefined;
let enabled = true;

/** The graph object inside an engine, or undefined when the library no longer has it there. */
function graphOf(hf: HyperFormula): (GraphInternals & Record<string, unknown>) | undefined {
  const g = (hf as unknown as { dependencyGraph?: { graph?: unknown } }).dependencyGraph?.graph;
  if (typeof g !== 'object' || g === null) return undefined;
  const c = g as Partial<GraphInternals> & Record<string, unknown>;
  if (!Array.isArray(c.nodesSparseArray) || !Array.isArray(c.edgesSparseArray)) return undefined;
  if (typeof c[METHOD] !== 'function') return undefined;
  return c as GraphInternals & Record<string, unknown>;
}

/**
 * Install the walk into the library's graph class, once per process. Returns whether it is in
 * place: false when the library's graph no longer looks as described above (it then keeps its own).
 */
export function installFastTopSort(): boolean {
  if (original) return true;
  const probe = HyperFormula.buildEmpty({ licenseKey: 'gpl-v3' });
  try {
    const graph = graphOf(probe);
    if (!graph) return false;
    const proto = Object.getPrototypeOf(graph) as Record<string, unknown>;
    const own = proto[METHOD];
    if (typeof own !== 'function' || own.length !== 3) return false;
    original = own as SortMethod;
    const theirs = original;
    proto[METHOD] = function (
      this: GraphInternals,
      modified: GraphNode[],
      recompute: Recompute,
      cycle: OnCycle,
    ) {
      return enabled ? walk(this, modified, recompute, cycle) : theirs.call(this, modified, recompute, cycle);
    };
    return true;
  } finally {
    probe.destroy();
  }
}

/** For the equivalence tests: switch between this walk and the library's own. */
export function useFastTopSort(on: boolean): void {
  enabled = on;
}
