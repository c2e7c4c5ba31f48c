// The two things we read from inside the formula engine, behind one typed adapter: its cell
// store (to read a range without the engine copying it) and its sheet names (for messages).
// Both are stable parts of the engine's dependency graph in 3.x; tests/engine/internals.test.ts
// fails if an upgrade moves them, and every caller falls back to the public way when absent.

interface Address {
  readonly sheet: number;
  readonly col: number;
  readonly row: number;
}

/** What we use of the engine's dependency graph. */
interface DependencyGraphView {
  getCellValue(address: Address): unknown;
  readonly sheetMapping?: { getSheetName?(id: number): string | undefined };
}

function graphOf(plugin: object): Partial<DependencyGraphView> | undefined {
  const g = (plugin as { dependencyGraph?: unknown }).dependencyGraph;
  return typeof g === 'object' && g !== null ? (g as Partial<DependencyGraphView>) : undefined;
}

/** A reader of computed cell values straight from the engine's store, or undefined when not reachable. */
export function cellStoreOf(plugin: object): ((address: Address) => unknown) | undefined {
  const g = graphOf(plugin);
  if (!g || typeof g.getCellValue !== 'function') return undefined;
  const get = g.getCellValue.bind(g);
  return (address) => get(address);
}

/** The name of sheet `id`, or undefined when the engine does not tell. */
export function sheetNameOf(plugin: object, id: number): string | undefined {
  const name = graphOf(plugin)?.sheetMapping?.getSheetName?.(id);
  return typeof name === 'string' ? name : undefined;
}
