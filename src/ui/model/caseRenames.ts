// A case renamed on the Site sheet: its load column on every equipment sheet is headed by the
// case's name, so the header is renamed before the sheets are written anew and the column keeps
// what was typed in it.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { HEADERS } from '../../core/workbook/layout.ts';

/** The workbook with the load columns of renamed cases (old name → new) headed by their new names. */
export function renameCaseColumns(doc: WorkbookDoc, renames: ReadonlyMap<string, string>): WorkbookDoc {
  if (renames.size === 0) return doc;
  const headers = new Map([...renames].map(([a, b]) => [HEADERS.loadCase(a), HEADERS.loadCase(b)]));
  return {
    ...doc,
    sheets: doc.sheets.map((s) => {
      const first = s.cells[0];
      if (!first || !first.some((h) => typeof h === 'string' && headers.has(h))) return s;
      const row = first.map((h) => (typeof h === 'string' ? (headers.get(h) ?? h) : h));
      return { ...s, cells: [row, ...s.cells.slice(1)] };
    }),
  };
}
