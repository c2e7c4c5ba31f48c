// A case renamed on the Site sheet takes its hours per year on the Tariff sheet with it. The
// Tariff sheet is the user's (found by its Setting texts, never rewritten), so without this the
// hours typed for "night" would sit under "Hours per year: night" while the workbook asks for the
// renamed case's row, and that case's saving would silently count 0 hours.
import { hoursLabel } from '../../core/quote/index.ts';
import { shownText, textContent } from '../../core/text/cellText.ts';
import type { CellContent } from '../../core/workbook/document.ts';
import type { Write } from './siteModel.ts';

const label = (v: CellContent | undefined): string =>
  typeof v === 'string' ? shownText(v).trim().toLowerCase() : '';

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
    const key = label(r[0]);
    if (i > 0 && key !== '' && !at.has(key)) at.set(key, i);
  });
  const out: Write[] = [];
  for (const [from, to] of renames) {
    const row = at.get(hoursLabel(from).toLowerCase());
    if (row === undefined || at.has(hoursLabel(to).toLowerCase())) continue;
    out.push({ sheet, row, col: 0, content: textContent(hoursLabel(to)) });
  }
  return out;
}
