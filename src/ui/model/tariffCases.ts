// The Tariff sheet's hours rows follow the cases of the Site sheet. The Tariff sheet is the
// user's (found by its Setting texts, never rewritten), so without this a renamed case would leave
// its hours under the old name, and a renamed or added case would silently count 0 hours:
// - a case renamed takes its "Hours per year" row with it;
// - a case added gets a row of its own, its Value blank for the user to fill in (Checks and the
//   command line say that it is blank until then).
import { hoursLabel, TARIFF_COL } from '../../core/quote/index.ts';
import { shownText, textContent } from '../../core/text/cellText.ts';
import type { CellContent } from '../../core/workbook/document.ts';
import type { Write } from './siteModel.ts';

const label = (v: CellContent | undefined): string =>
  typeof v === 'string' ? shownText(v).trim().toLowerCase() : '';

const blank = (v: CellContent | undefined) =>
  v === null || v === undefined || (typeof v === 'string' && v.trim() === '');

/** Unit and note of an added case's hours row. */
export const ADDED_CASE_UNIT = 'h';
export const ADDED_CASE_NOTE = 'case added on the Site sheet: enter the hours per year it runs';

/**
 * The Setting cells to rewrite on the Tariff sheet (`rows`, header first) for cases renamed
 * old → new: a row named for the old case gets the new name, unless the new name has a row already.
 */
export function tariffRenameWrites(
  sheet: number,
  rows: readonly (readonly CellContent[])[],
  renames: ReadonlyMap<string, string>,
): Write[] {
  const at = new Map<string, number>();
  rows.forEach((r, i) => {
    const key = label(r[TARIFF_COL.setting]);
    if (i > 0 && key !== '' && !at.has(key)) at.set(key, i);
  });
  const out: Write[] = [];
  for (const [from, to] of renames) {
    const row = at.get(hoursLabel(from).toLowerCase());
    if (row === undefined || at.has(hoursLabel(to).toLowerCase())) continue;
    out.push({ sheet, row, col: TARIFF_COL.setting, content: textContent(hoursLabel(to)) });
  }
  return out;
}

/**
 * The cells to write on the Tariff sheet (`rows`, header first) so that every case has its hours
 * row: a row per case without one, below the last filled row, Value left blank.
 */
export function tariffNewCaseWrites(
  sheet: number,
  rows: readonly (readonly CellContent[])[],
  cases: readonly string[],
): Write[] {
  const have = new Set(rows.slice(1).map((r) => label(r[TARIFF_COL.setting])));
  let next = rows.length;
  while (next > 1 && (rows[next - 1] ?? []).every(blank)) next--;
  const out: Write[] = [];
  for (const c of cases) {
    if (have.has(hoursLabel(c).toLowerCase())) continue;
    out.push(
      { sheet, row: next, col: TARIFF_COL.setting, content: textContent(hoursLabel(c)) },
      { sheet, row: next, col: TARIFF_COL.unit, content: ADDED_CASE_UNIT },
      { sheet, row: next, col: TARIFF_COL.note, content: ADDED_CASE_NOTE },
    );
    next++;
  }
  return out;
}
