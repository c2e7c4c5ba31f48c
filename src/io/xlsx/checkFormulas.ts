// Formulas an opened workbook cannot compute: calls of functions the engine does not have (from
// another program, or misspelt), unknown names, and references that loop back on themselves.
// Read from the formulas themselves, so even a large workbook is checked in a moment.
import { findFunction } from '../../core/functions/index.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { createEngine, registeredFunctionNames, type OwnPlugin } from '../../engine/index.ts';
import { tokenize } from '../formula/index.ts';
import { findCircularCells, type CellAt } from './cycles.ts';
import type { FileProblem } from './fileProblem.ts';
import { columnLetter } from './sheetNames.ts';

/** At most this many problems are listed; the last line says how many more. */
export const MAX_LISTED_PROBLEMS = 50;

/** Which rows to check: every formula, or only these rows (0-based) of these sheets. */
export type CheckScope = 'all' | ReadonlyMap<string, 'all' | ReadonlySet<number>>;

function knownFunctions(plugins?: readonly OwnPlugin[]): Set<string> {
  createEngine([], plugins ? { plugins } : {}).destroy(); // registers our plugins, once
  return new Set(registeredFunctionNames().map((n) => n.toUpperCase()));
}

function inScope(scope: CheckScope, sheet: string, row: number): boolean {
  if (scope === 'all') return true;
  const s = scope.get(sheet);
  return s === 'all' || (s !== undefined && s.has(row));
}

function unknownName(formula: string, known: ReadonlySet<string>): string | undefined {
  for (const t of tokenize(formula)) {
    if (t.kind === 'func' && !known.has(t.text.toUpperCase()) && !findFunction(t.text))
      return `the function ${t.text.toUpperCase()}`;
    if (t.kind === 'name') return `the name ${t.text}`;
  }
  return undefined;
}

export function checkFormulas(
  doc: WorkbookDoc,
  scope: CheckScope = 'all',
  plugins?: readonly OwnPlugin[],
): FileProblem[] {
  if (scope !== 'all' && scope.size === 0) return [];
  const known = knownFunctions(plugins);
  const problems: FileProblem[] = [];
  const starts: CellAt[] = [];
  doc.sheets.forEach((sheet, s) =>
    sheet.cells.forEach((row, r) => {
      if (!inScope(scope, sheet.name, r)) return;
      row.forEach((content, c) => {
        if (typeof content !== 'string' || !content.startsWith('=')) return;
        starts.push({ sheet: s, row: r, col: c });
        const name = unknownName(content, known);
        if (name)
          problems.push({
            code: 'unknown-function',
            message: `the formula ${content} uses ${name}, which Kvar Ledger does not know`,
            where: `${sheet.name}!${columnLetter(c)}${r + 1}`,
          });
      });
    }),
  );
  for (const at of findCircularCells(doc, starts)) {
    const sheet = doc.sheets[at.sheet] as WorkbookDoc['sheets'][number];
    const content = sheet.cells[at.row]?.[at.col];
    problems.push({
      code: 'circular-reference',
      message: `the formula ${String(content)} refers to itself through a loop of references`,
      where: `${sheet.name}!${columnLetter(at.col)}${at.row + 1}`,
    });
  }
  if (problems.length <= MAX_LISTED_PROBLEMS) return problems;
  const more = problems.length - MAX_LISTED_PROBLEMS;
  return [
    ...problems.slice(0, MAX_LISTED_PROBLEMS),
    {
      code: problems[MAX_LISTED_PROBLEMS]?.code ?? 'unknown-function',
      message: `and ${more} more formula problems`,
    },
  ];
}
