// Which columns stay frozen and how wide each column is drawn. On equipment sheets the columns
// up to Bus (Tag, Description, Bus) stay in view while scrolling right; on the Buses and
// Compensation sheets the bus name does. Header texts wrap onto two lines in the header row, so
// a long header no longer widens its column; a long description is cut (its full text shows on
// hover and in the formula bar) so that at 1024 px with a panel open six columns stay in sight.
import type { ColumnInfo } from '../../core/workbook/document.ts';

/** Columns frozen at the left: through the 'Bus' column when it is among the first three. */
export function frozenColumns(cols: readonly ColumnInfo[] | undefined): number {
  const i = (cols ?? []).slice(0, 3).findIndex((c) => c.header.trim().toLowerCase() === 'bus');
  return i < 0 ? 0 : i + 1;
}

const CHAR_PX = 6.4;
/** Header text is bold and a little smaller: a character is wider on average. */
const HEAD_CHAR_PX = 7.8;

/** Characters of the longer line when a header is broken at its best space into two lines. */
export function twoLineChars(header: string): number {
  const words = header.trim().split(/\s+/);
  let best = header.trim().length;
  for (let i = 1; i < words.length; i++) {
    best = Math.min(best, Math.max(words.slice(0, i).join(' ').length, words.slice(i).join(' ').length));
  }
  return best;
}
const PAD_PX = 12;
/** A frozen column that is not the tag or the bus (the description) is kept this narrow. */
export const FROZEN_TEXT_MAX_PX = 112;

/** Width in pixels of column `i`, given the sheet's column descriptions and the frozen count. */
export function columnWidth(cols: readonly ColumnInfo[] | undefined, i: number, frozen: number): number {
  const info = cols?.[i];
  if (!info) return cols ? 64 : 90;
  const chars = info.width ?? 9;
  let px = Math.max(
    chars * CHAR_PX + PAD_PX,
    Math.min(180, twoLineChars(info.header) * HEAD_CHAR_PX + PAD_PX),
  );
  const isKey = /^(tag|bus)$/i.test(info.header.trim());
  if (i < frozen && !isKey) px = Math.min(px, FROZEN_TEXT_MAX_PX);
  return Math.round(Math.max(44, Math.min(400, px)));
}
