// Layering is checked by a test, not by memory: src/core stays free of the engine, io, ui and
// cli layers and of the engine, grid and xlsx libraries, so it runs anywhere and tests alone.
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const FORBIDDEN_LAYERS = ['engine', 'io', 'ui', 'cli'];
const FORBIDDEN_PACKAGES = ['hyperformula', 'handsontable', 'exceljs'];

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

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(p);
    return /\.(ts|tsx|mts|js|mjs)$/.test(e.name) ? [p] : [];
  });
}

/** Violations as "file: specifier" for every core module that reaches outside core's layer. */
export function coreViolations(srcDir: string): string[] {
  const coreDir = join(srcDir, 'core');
  const found: string[] = [];
  for (const file of sourceFiles(coreDir)) {
    for (const spec of specifiers(readFileSync(file, 'utf8'))) {
      const where = `${relative(srcDir, file)}: ${spec}`;
      if (spec.startsWith('.')) {
        const target = relative(srcDir, resolve(dirname(file), spec));
        const top = target.split(sep)[0] ?? '';
        if (FORBIDDEN_LAYERS.includes(top)) found.push(where);
      } else {
        const pkg = spec.startsWith('@') ? spec.split('/').slice(0, 2).join('/') : (spec.split('/')[0] ?? '');
        if (FORBIDDEN_PACKAGES.includes(pkg)) found.push(where);
      }
    }
  }
  return found;
}

describe('architecture', () => {
  it('src/core imports nothing from engine, io, ui, cli or the engine/grid/xlsx libraries', () => {
    const src = fileURLToPath(new URL('../src/', import.meta.url));
    expect(sourceFiles(join(src, 'core')).length).toBeGreaterThan(10);
    expect(coreViolations(src)).toEqual([]);
  });

  it('the scanner finds planted violations and passes clean imports (self-check)', () => {
    const root = mkdtempSync(join(tmpdir(), 'kvar-arch-'));
    try {
      mkdirSync(join(root, 'core', 'deep'), { recursive: true });
      const plant = (path: string, text: string) => writeFileSync(join(root, path), text);
      plant('core/a.ts', "import { createEngine } from '../engine/index.ts';\n");
      plant(
        'core/deep/b.ts',
        "import type { Token } from '../../io/formula/tokenize.ts';\nimport HF from 'hyperformula';\n",
      );
      plant(
        'core/c.ts',
        'export async function f() { return import(\'exceljs\'); }\nexport { x } from "../ui/x.ts";\n',
      );
      plant(
        'core/d.ts',
        "import 'handsontable/dist/handsontable.css';\nimport {\n  run,\n} from '../cli/main.ts';\n",
      );
      plant(
        'core/ok.ts',
        "import { a } from './a.ts';\nimport { b } from './deep/b.ts';\nimport { x } from '../core/c.ts';\nimport fc from 'fast-check';\n// import from '../engine/index.ts' in a comment is not an import statement\n",
      );
      const found = coreViolations(root);
      expect(found.sort()).toEqual(
        [
          `core${sep}a.ts: ../engine/index.ts`,
          `core${sep}deep${sep}b.ts: ../../io/formula/tokenize.ts`,
          `core${sep}deep${sep}b.ts: hyperformula`,
          `core${sep}c.ts: exceljs`,
          `core${sep}c.ts: ../ui/x.ts`,
          `core${sep}d.ts: handsontable/dist/handsontable.css`,
          `core${sep}d.ts: ../cli/main.ts`,
        ].sort(),
      );
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
