// Boundaries are checked by a test, not by memory:
// - src/core stays free of the engine, io, ui and cli layers and of the engine, grid and xlsx
//   libraries, so it runs anywhere and tests alone;
// - only src/engine imports the formula engine library, so an upgrade is met in one folder;
// - a folder with an index.ts is entered through it from outside;
// - no module imports itself through a loop (type imports count: they tie modules together too);
// - src/core has no bare `catch {}`: a caught error is named and handled, so a bug cannot hide.
// The allowlists name files other people are rewriting now; an entry that no longer applies fails
// the test, so the lists only shrink.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  findCycles,
  importersOf,
  importGraph,
  indexBypasses,
  packageOf,
  type ModuleImports,
} from './architecture/imports.ts';

const FORBIDDEN_LAYERS = ['engine', 'io', 'ui', 'cli'];
const FORBIDDEN_PACKAGES = ['hyperformula', 'handsontable', 'exceljs'];
const ENGINE_LIBRARY = 'hyperformula';

/** Modules outside src/engine that still import the engine library (the workbook session, lead's). */
const ENGINE_LIBRARY_ALLOWED: string[] = [];

/** Index bypasses left in files owned by the lead (cli/balance, cli/export, ui/app/handOff) or the CLI's owner. */
const INDEX_BYPASS_ALLOWED = [
  // By design: the typing help is in the first download and needs only the tokenizer; the formula
  // index would bring the parser and the expansion into it.
  'ui/autocomplete/suggest.ts → io/formula/cursor.ts',
  'ui/autocomplete/suggest.ts → io/formula/tokenize.ts',
  'ui/formulaBar.ts → io/formula/entry.ts',
  'ui/formulaBar.ts → io/formula/parse.ts',
  'ui/grid/gridEdits.ts → io/formula/entry.ts',
  'cli/export.ts → io/xlsx/export.ts',
  // By design: the options load on demand; through the quote index the bundler made the whole
  // quote (cost, saving, schedule) a chunk of the first download, 5 kB gzip.
  'core/options/compare.ts → core/quote/cost.ts',
  'core/options/compare.ts → core/quote/rates.ts',
  'core/options/compare.ts → core/quote/saving.ts',
  'core/options/compare.ts → core/quote/siteSchedule.ts',
  'core/options/fromWorkbook.ts → core/quote/rates.ts',
  'core/options/fromWorkbook.ts → core/quote/ratesSheet.ts',
  'core/options/fromWorkbook.ts → core/quote/tariffSheet.ts',
  'cli/functions.ts → io/formula/reference.ts',
  // By design: only the roll-up runs compiled physics, and the page loads it on demand; through
  // the kinds index the compiler was part of the first download (0.6 kB gzip).
  'core/site/rowPower.ts → core/kinds/compile.ts',
];

/** Core modules with a bare catch left in a file the lead is rewriting (the workbook builder). */
const BARE_CATCH_ALLOWED: string[] = [];

/** Violations as "file → target" for every core module that reaches outside core's layer. */
export function coreViolations(graph: ReadonlyMap<string, ModuleImports>): string[] {
  const found: string[] = [];
  for (const [file, { modules, packages }] of graph) {
    if (!file.startsWith('core/')) continue;
    for (const m of modules)
      if (FORBIDDEN_LAYERS.includes(m.split('/')[0] ?? '')) found.push(`${file} → ${m}`);
    for (const p of packages) if (FORBIDDEN_PACKAGES.includes(packageOf(p))) found.push(`${file} → ${p}`);
  }
  return found.sort();
}

/** What the rule finds beyond its allowlist, and allowlist entries that no longer apply. */
function beyond(found: readonly string[], allowed: readonly string[]) {
  return {
    unexpected: found.filter((f) => !allowed.includes(f)),
    stale: allowed.filter((a) => !found.includes(a)),
  };
}

const src = fileURLToPath(new URL('../src/', import.meta.url));
const graph = importGraph(src);

describe('architecture', () => {
  it('reads the whole source tree', () => {
    expect([...graph.keys()].filter((f) => f.startsWith('core/')).length).toBeGreaterThan(10);
    expect(graph.get('ui/app/app.ts')?.modules).toContain('ui/app/topBar.ts');
  });

  it('src/core imports nothing from engine, io, ui, cli or the engine/grid/xlsx libraries', () => {
    expect(coreViolations(graph)).toEqual([]);
  });

  it(`only src/engine imports ${ENGINE_LIBRARY}`, () => {
    const outside = importersOf(graph, ENGINE_LIBRARY).filter((f) => !f.startsWith('engine/'));
    expect(beyond(outside, ENGINE_LIBRARY_ALLOWED)).toEqual({ unexpected: [], stale: [] });
  });

  it('imports into a folder with an index.ts go through the index from outside the folder', () => {
    expect(beyond(indexBypasses(src, graph), INDEX_BYPASS_ALLOWED)).toEqual({ unexpected: [], stale: [] });
  });

  it('has no import loops', () => {
    expect(findCycles(graph)).toEqual([]);
  });

  it('src/core catches no error without naming it', () => {
    const bare = [...graph.keys()]
      .filter((f) => f.startsWith('core/'))
      .filter((f) => /\bcatch\s*\{/.test(readFileSync(join(src, f), 'utf8')));
    expect(beyond(bare, BARE_CATCH_ALLOWED)).toEqual({ unexpected: [], stale: [] });
  });
});

describe('the scanners find planted problems and pass clean imports (self-check)', () => {
  function plantedTree(files: Record<string, string>): { root: string; done: () => void } {
    const root = mkdtempSync(join(tmpdir(), 'kvar-arch-'));
    for (const [path, text] of Object.entries(files)) {
      mkdirSync(join(root, dirname(path)), { recursive: true });
      writeFileSync(join(root, path), text);
    }
    return { root, done: () => rmSync(root, { recursive: true, force: true }) };
  }

  it('core layer violations, in every import form', () => {
    const t = plantedTree({
      'core/a.ts': "import { createEngine } from '../engine/index.ts';\n",
      'core/deep/b.ts':
        "import type { Token } from '../../io/formula/tokenize.ts';\nimport HF from 'hyperformula';\n",
      'core/c.ts':
        'export async function f() { return import(\'exceljs\'); }\nexport { x } from "../ui/x.ts";\n',
      'core/d.ts':
        "import 'handsontable/dist/handsontable.css';\nimport {\n  run,\n} from '../cli/main.ts';\n",
      'core/ok.ts':
        "import { a } from './a.ts';\nimport { b } from './deep/b.ts';\nimport { x } from '../core/c.ts';\nimport fc from 'fast-check';\n// import from '../engine/index.ts' in a comment is not an import statement\n",
    });
    try {
      expect(coreViolations(importGraph(t.root))).toEqual(
        [
          'core/a.ts → engine/index.ts',
          'core/deep/b.ts → io/formula/tokenize.ts',
          'core/deep/b.ts → hyperformula',
          'core/c.ts → exceljs',
          'core/c.ts → ui/x.ts',
          'core/d.ts → handsontable/dist/handsontable.css',
          'core/d.ts → cli/main.ts',
        ].sort(),
      );
    } finally {
      t.done();
    }
  });

  it('loops (type imports and dynamic imports included), index bypasses and library importers', () => {
    const t = plantedTree({
      'app/app.ts': "import { bar } from './bar.ts';\n",
      'app/bar.ts': "import type { App } from './app.ts';\n",
      'app/self.ts': "export const f = () => import('./self.ts');\n",
      'lib/index.ts': "export { one } from './one.ts';\n",
      'lib/one.ts': "import { two } from './two.ts';\n",
      'lib/two.ts': "import type { HyperFormula } from 'hyperformula/typings';\n",
      'ui/x.ts': "import { one } from '../lib/index.ts';\nimport { two } from '../lib/two.ts';\n",
      'ui/y.ts': "import { x } from './x.ts';\n",
    });
    try {
      const g = importGraph(t.root);
      expect(findCycles(g).sort()).toEqual([['app/app.ts', 'app/bar.ts'], ['app/self.ts']]);
      expect(indexBypasses(t.root, g)).toEqual(['ui/x.ts → lib/two.ts']);
      expect(importersOf(g, 'hyperformula')).toEqual(['lib/two.ts']);
      expect(beyond(['a', 'b'], ['b', 'c'])).toEqual({ unexpected: ['a'], stale: ['c'] });
    } finally {
      t.done();
    }
  });
});
