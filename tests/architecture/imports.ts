// The import graph of a source tree, read from the text of each module (no compiler needed):
// every module specifier, the graph of relative imports, its loops, the imports that bypass a
// folder's index, and the modules that import a given package.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';

/** Every module specifier in a source text: static imports and re-exports, type imports, dynamic import(). */
export function specifiers(source: string): string[] {
  const out: string[] = [];
  // Comments are not dependencies: drop block comments and line comments (not "://" in URLs).
  source = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:])\/\/.*$/gm, '$1');
  const patterns = [
    /\b(?:import|export)\b[^'"`;]*?\bfrom\s*['"]([^'"]+)['"]/g,
    /\bimport\s*['"]([^'"]+)['"]/g,
    /\bimport\s*\(\s*['"]([^'"]+)['"]\s*\)/g,
    /\brequire\s*\(\s*['"]([^'"]+)['"]\s*\)/g,
  ];
  for (const re of patterns) for (const m of source.matchAll(re)) out.push(m[1] as string);
  return out;
}

export function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(p);
    return /\.(ts|tsx|mts|js|mjs)$/.test(e.name) ? [p] : [];
  });
}

/** Paths relative to the source root, with '/' on every platform. */
const rel = (root: string, path: string) => relative(root, path).split(sep).join('/');

/** The package a bare specifier names: 'handsontable/base' → 'handsontable', '@a/b/c' → '@a/b'. */
export function packageOf(spec: string): string {
  const parts = spec.split('/');
  return (spec.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0]) ?? spec;
}

export interface ModuleImports {
  /** Relative imports, resolved to paths under the root ('ui/app/app.ts'). */
  readonly modules: string[];
  /** Bare specifiers (packages). */
  readonly packages: string[];
}

/** Each module under `root` (by its root-relative path) with what it imports, type imports included. */
export function importGraph(root: string): Map<string, ModuleImports> {
  const graph = new Map<string, ModuleImports>();
  for (const file of sourceFiles(root)) {
    const modules: string[] = [];
    const packages: string[] = [];
    for (const spec of specifiers(readFileSync(file, 'utf8'))) {
      if (spec.startsWith('.')) modules.push(rel(root, resolve(dirname(file), spec)));
      else packages.push(spec);
    }
    graph.set(rel(root, file), { modules, packages });
  }
  return graph;
}

/**
 * Import loops: each strongly connected group of modules (Tarjan's algorithm), as its sorted
 * member list; a module importing itself is a loop of one.
 */
export function findCycles(graph: ReadonlyMap<string, ModuleImports>): string[][] {
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const cycles: string[][] = [];
  let next = 0;
  const visit = (v: string): void => {
    index.set(v, next);
    low.set(v, next);
    next++;
    stack.push(v);
    onStack.add(v);
    const targets = graph.get(v)?.modules ?? [];
    for (const w of targets) {
      if (!graph.has(w)) continue;
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v) as number, low.get(w) as number));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v) as number, index.get(w) as number));
    }
    if (low.get(v) !== index.get(v)) return;
    const group: string[] = [];
    let w: string;
    do {
      w = stack.pop() as string;
      onStack.delete(w);
      group.push(w);
    } while (w !== v);
    if (group.length > 1 || targets.includes(v)) cycles.push(group.sort());
  };
  for (const v of graph.keys()) if (!index.has(v)) visit(v);
  return cycles;
}

/**
 * Imports from outside a folder that has an index.ts into one of its other modules, as
 * "importer → target". Modules inside the folder (or below it) may import each other directly.
 */
export function indexBypasses(root: string, graph: ReadonlyMap<string, ModuleImports>): string[] {
  const out: string[] = [];
  for (const [file, { modules }] of graph) {
    for (const target of modules) {
      const folder = target.slice(0, Math.max(target.lastIndexOf('/'), 0));
      if (folder === '' || target.endsWith('/index.ts') || file.startsWith(`${folder}/`)) continue;
      if (existsSync(join(root, folder, 'index.ts'))) out.push(`${file} → ${target}`);
    }
  }
  return out.sort();
}

/** Modules that import `pkg` (or any path inside it). */
export function importersOf(graph: ReadonlyMap<string, ModuleImports>, pkg: string): string[] {
  return [...graph]
    .filter(([, { packages }]) => packages.some((s) => packageOf(s) === pkg))
    .map(([file]) => file)
    .sort();
}
