// Test helpers: finding a sheet and a column of an open page session by name, as a user reads them.
import type { WorkbookSession } from '../../../src/ui/model/session.ts';

/** The engine's id of the sheet named `name`. */
export const sheetIdOf = (s: WorkbookSession, name: string) => s.engine.getSheetId(name) as number;

/** The 0-based column of `sheet` whose header (row 1) reads `header`; throws when there is none. */
export function columnOf(s: WorkbookSession, sheet: string, header: string): number {
  const c = (s.sheetContents(sheetIdOf(s, sheet))[0] ?? []).indexOf(header);
  if (c < 0) throw new Error(`${sheet} has no column ${header}`);
  return c;
}
