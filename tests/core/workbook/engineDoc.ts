// Test helpers: evaluate a built workbook in the engine (live) or, after the plain-formula
// expansion, in an engine without our plugins (portable), and read the Buses sheet by header.
import { shownText } from '../../../src/core/text/cellText.ts';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { HyperFormula } from 'hyperformula';
import type { Site } from '../../../src/core/site/model.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import type { SheetDoc, WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { createEngine, createPlainEngine, readCell, type CellResult } from '../../../src/engine/index.ts';
import { expandFormula } from '../../../src/io/formula/expand.ts';

const TEMPLATES = fileURLToPath(new URL('../../../templates/', import.meta.url));

export function templateSites(): Array<{ name: string; site: Site }> {
  return readdirSync(TEMPLATES)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => {
      const { site, problems } = readSiteFile(readFileSync(join(TEMPLATES, f), 'utf8'));
      const errors = problems.filter((p) => p.severity === 'error');
      if (errors.length > 0) throw new Error(`template ${f}: ${errors.map((p) => p.message).join('; ')}`);
      return { name: f, site };
    });
}

export function sheet(doc: WorkbookDoc, name: string): SheetDoc {
  const s = doc.sheets.find((x) => x.name === name);
  if (!s) throw new Error(`no sheet ${name}`);
  return s;
}

export function liveEngine(doc: WorkbookDoc): HyperFormula {
  return createEngine(doc.sheets);
}

/** Every formula expanded to classic functions; throws when one cannot be. Returns the longest formula too. */
export function expandDoc(doc: WorkbookDoc): { sheets: SheetDoc[]; longest: number } {
  let longest = 0;
  const sheets = doc.sheets.map((s) => ({
    ...s,
    cells: s.cells.map((row) =>
      row.map((c) => {
        if (typeof c !== 'string' || !c.startsWith('=')) return c;
        const e = expandFormula(c);
        if (!e.ok) throw new Error(`${s.name}: ${c}: ${e.message}`);
        longest = Math.max(longest, e.formula.length);
        return e.formula;
      }),
    ),
  }));
  return { sheets, longest };
}

export function portableEngine(doc: WorkbookDoc): HyperFormula {
  return createPlainEngine(expandDoc(doc).sheets);
}

/** A cell by sheet, 0-based row and header text. */
export function valueAt(
  hf: HyperFormula,
  doc: WorkbookDoc,
  sheetName: string,
  row: number,
  header: string,
): CellResult {
  const col = sheet(doc, sheetName).cells[0]?.indexOf(header) ?? -1;
  if (col < 0) throw new Error(`sheet ${sheetName} has no column "${header}"`);
  return readCell(hf, sheetName, row, col);
}

export function num(r: CellResult): number {
  if (!r.ok || typeof r.value !== 'number') throw new Error(`expected a number, got ${JSON.stringify(r)}`);
  return r.value;
}

export function busRow(doc: WorkbookDoc, bus: string, sheetName = 'Buses'): number {
  // A bus name that reads as a number is stored as text with its mark ('12).
  const r = sheet(doc, sheetName).cells.findIndex(
    (row, i) => i > 0 && typeof row[0] === 'string' && shownText(row[0]) === bus,
  );
  if (r < 0) throw new Error(`no bus ${bus} on ${sheetName}`);
  return r;
}

/** Relative closeness with a floor for values that should be zero (kW/kvar: 1e-9 of the scale). */
export function close(a: number, b: number, rel = 1e-9, scale = 1): boolean {
  return Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b), scale);
}
