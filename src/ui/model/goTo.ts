// The go-to box: an address ("Motors!F12", "'Capacitors and reactors'!B3", "F12" on the sheet
// on screen) or an equipment tag / bus name ("CMP-A"), turned into a cell to select. A bare
// text that reads both ways ("LV1") is taken as the tag or bus when one has that name. Pure.
import type { CellContent } from '../../core/workbook/document.ts';

export interface GoToSheet {
  readonly id: number;
  readonly name: string;
  /** Header texts of the sheet's columns, when it has a header row. */
  readonly headers?: readonly string[];
  readonly cells: () => readonly (readonly CellContent[])[];
}

export type GoToResult =
  | { readonly ok: true; readonly sheet: number; readonly row: number; readonly col: number }
  | { readonly ok: false; readonly message: string };

const CELL = /^(?:(?:'((?:[^']|'')+)'|([^!'\s][^!]*))!)?\$?([A-Za-z]{1,3})\$?(\d{1,7})$/;

function columnIndex(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

/** Where an address or a tag points; `current` is the sheet on screen. */
export function goTo(text: string, sheets: readonly GoToSheet[], current: number): GoToResult {
  const t = text.trim();
  if (t === '') return { ok: false, message: 'Type an address such as Motors!F12 or F12, or a tag.' };
  const m = CELL.exec(t);
  // "LV1" could be a cell of column LV or a bus: without a sheet name, a tag or bus wins.
  if (m && m[1] === undefined && m[2] === undefined) {
    const tag = findTag(t, sheets);
    if (tag.ok) return tag;
  }
  if (m) {
    const name = m[1] !== undefined ? m[1].replace(/''/g, "'") : m[2];
    const sheet =
      name === undefined
        ? sheets.find((s) => s.id === current)
        : (sheets.find((s) => s.name === name) ??
          sheets.find((s) => s.name.toLowerCase() === name.toLowerCase()));
    if (!sheet) return { ok: false, message: `There is no sheet named "${name ?? ''}".` };
    const row = Number(m[4]) - 1,
      col = columnIndex(m[3] as string);
    if (row < 0) return { ok: false, message: `Row numbers start at 1; got ${m[4]}.` };
    return { ok: true, sheet: sheet.id, row, col };
  }
  return findTag(t, sheets);
}

/** The first row whose Tag (or, on a bus list, Bus) cell reads `text`, ignoring case. */
function findTag(text: string, sheets: readonly GoToSheet[]): GoToResult {
  const want = text.toLowerCase();
  for (const keyHeader of ['tag', 'bus']) {
    for (const s of sheets) {
      const col = (s.headers ?? []).findIndex((h) => h.trim().toLowerCase() === keyHeader);
      // Bus names are looked up on sheets that list buses (Bus first), not on every item row.
      if (col < 0 || (keyHeader === 'bus' && col !== 0)) continue;
      const cells = s.cells();
      for (let r = 1; r < cells.length; r++) {
        const v = cells[r]?.[col];
        if (v !== null && v !== undefined && String(v).trim().toLowerCase() === want)
          return { ok: true, sheet: s.id, row: r, col };
      }
    }
  }
  const shown = text.length > 40 ? `${text.slice(0, 40)}…` : text;
  return {
    ok: false,
    message: `"${shown}" is neither an address (such as Motors!F12) nor a tag or bus name in this workbook.`,
  };
}
