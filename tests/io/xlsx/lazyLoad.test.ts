// The xlsx library is large: only src/io/xlsx/loadExcelJs.ts may load it, and only by dynamic import.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? sources(p) : p.endsWith('.ts') ? [p] : [];
  });
}

const STATIC =
  /^\s*import\s+(?!type\b)[^;]*from\s+['"]exceljs['"]|^\s*export\s+[^;]*from\s+['"]exceljs['"]|require\(['"]exceljs['"]\)/m;

describe('the xlsx library loads lazily', () => {
  it('no module under src imports exceljs statically; one loads it dynamically', () => {
    const files = sources('src');
    expect(files.filter((f) => STATIC.test(readFileSync(f, 'utf8')))).toEqual([]);
    expect(files.filter((f) => readFileSync(f, 'utf8').includes("import('exceljs')"))).toEqual([
      join('src', 'io', 'xlsx', 'loadExcelJs.ts'),
    ]);
  });

  it('the check itself catches a static import', () => {
    expect(STATIC.test("import ExcelJS from 'exceljs';")).toBe(true);
    expect(STATIC.test("import { Workbook } from 'exceljs';")).toBe(true);
    expect(STATIC.test("import type { Workbook } from 'exceljs';")).toBe(false);
  });
});
