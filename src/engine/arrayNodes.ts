// The engine's list of array formulas, kept as they come and go instead of searched for.
//
// Every row or column inserted or removed makes the formula engine adjust its array formulas
// (formulas that spill over several cells), and it finds them by filtering a copy of every node
// of its dependency graph: about 250,000 at 10,000 equipment rows, some 25 ms per inserted row,
// while a site workbook holds none or a few. This module keeps, per graph, the array formula
// nodes in the order the graph numbered them (the order the library's search yields them) by
// watching the graph's two methods that add and remove nodes, and answers the search from that.
// A graph that held nodes before this was installed is not watched and keeps the library's
// search. tests/engine/arrayNodes.test.ts compares both on random edits, array formulas included.
import { HyperFormula } from 'hyperformula';

interface GraphNode {
  idInGraph?: number;
}

/** The parts of the library's graph classes (DependencyGraph and its Graph, 3.x) used here. */
interface GraphInternals {
  nextId: number;
  addNodeIfNotExists: (this: GraphInternals, node: GraphNode) => number;
  removeNode: (this: GraphInternals, node: GraphNode) => unknown;
}
interface DependencyGraphInternals {
  graph: GraphInternals;
  arrayFormulaNodes: (this: DependencyGraphInternals) => Generator<GraphNode>;
}

/** Array formula nodes per graph, in numbering order; null for a graph seen only after it had nodes. */
const tracked = new WeakMap<GraphInternals, Set<GraphNode> | null>();
let installed = false;
let enabled = true;

function internalsOf(hf: HyperFormula): DependencyGraphInternals | undefined {
  const dg = (hf as unknown as { dependencyGraph?: Partial<DependencyGraphInternals> }).dependencyGraph;
  const g = dg?.graph as Partial<GraphInternals> | undefined;
  if (!dg || !g || typeof g.nextId !== 'number') return undefined;
  if (typeof g.addNodeIfNotExists !== 'function' || g.addNodeIfNotExists.length !== 1) return undefined;
  if (typeof g.removeNode !== 'function' || g.removeNode.length !== 1) return undefined;
  if (typeof dg.arrayFormulaNodes !== 'function') return undefined;
  return dg as DependencyGraphInternals;
}

/**
 * Install the watch into the library's graph classes, once per process. Returns whether it is in
 * place: false when the classes no longer look as described above (the engine keeps its search).
 */
export function installArrayNodeIndex(): boolean {
  if (installed) return true;
  // A probe with one array formula gives the classes, and the array formula node's class.
  const probe = HyperFormula.buildFromArray([['=TRANSPOSE(B2:C2)'], [null, 1, 2]], {
    licenseKey: 'gpl-v3',
  });
  try {
    const dg = internalsOf(probe);
    if (!dg) return false;
    const arrays = [...dg.arrayFormulaNodes()];
    const ArrayNode = arrays[0]?.constructor;
    if (arrays.length !== 1 || typeof ArrayNode !== 'function') return false;
    const graphProto = Object.getPrototypeOf(dg.graph) as GraphInternals;
    const dgProto = Object.getPrototypeOf(dg) as DependencyGraphInternals;
    const add = graphProto.addNodeIfNotExists;
    const remove = graphProto.removeNode;
    const search = dgProto.arrayFormulaNodes;
    graphProto.addNodeIfNotExists = function (this: GraphInternals, node: GraphNode): number {
      let set = tracked.get(this);
      if (set === undefined) {
        set = this.nextId === 0 ? new Set() : null;
        tracked.set(this, set);
      }
      const known = node.idInGraph !== undefined;
      const id = add.call(this, node);
      // A node numbered now comes after every node in the set, so the set stays in number order.
      if (set && !known && node instanceof ArrayNode) set.add(node);
      return id;
    };
    graphProto.removeNode = function (this: GraphInternals, node: GraphNode): unknown {
      tracked.get(this)?.delete(node);
      return remove.call(this, node);
    };
    dgProto.arrayFormulaNodes = function* (this: DependencyGraphInternals): Generator<GraphNode> {
      const set = tracked.get(this.graph);
      if (!enabled || set === null || (set === undefined && this.graph.nextId > 0)) {
        yield* search.call(this);
        return;
      }
      // A copy: the caller may replace nodes while it goes through them.
      if (set) yield* [...set];
    };
    installed = true;
    return true;
  } finally {
    probe.destroy();
  }
}

/** For the equivalence tests: answer from the kept list (true) or by the library's search. */
export function useArrayNodeIndex(on: boolean): void {
  enabled = on;
}
