// The cells and ranges a formula refers to, read from its reference tokens: enough to follow
// dependencies between formula cells (for the circular-reference check) without building an engine.
import { tokenize } from '../formula/index.ts';

export interface Area {
  /** Sheet name as written, or the formula's own sheet. */
  readonly sheet: string;
  /** 0-based, inclusive; whole columns or rows run to Infinity. */
  readonly r0: number;
  readonly c0: number;
  readonly r1: number;
  readonly c1: number;
}

const SHEET = /^(?:'((?:[^']|'')+)'|([A-Za-z_][A-Za-z0-9_.]*))!/;
const CELL = /^\$?([A-Za-z]{1,3})\$?(\d+)$/;
const COL = /^\$?([A-Za-z]{1,3})$/;
const ROW = /^\$?(\d+)$/;

function columnIndex(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

function splitSheet(text: string, own: string): { sheet: string; rest: string } {
  const m = SHEET.exec(text);
  if (!m) return { sheet: own, rest: text };
  return {
    sheet: m[1] !== undefined ? m[1].replace(/''/g, "'") : (m[2] as string),
    rest: text.slice(m[0].length),
  };
}

/** One reference token ('Sheet'!A1:B4, A:C, 3:5, $B$2) as an area; undefined if unreadable. */
export function areaOf(ref: string, ownSheet: string): Area | undefined {
  const { sheet, rest } = splitSheet(ref, ownSheet);
  const [a, b] = rest.split(':');
  if (a === undefined) return undefined;
  const second = b === undefined ? a : splitSheet(b, sheet).rest;
  const ca = CELL.exec(a);
  const cb = CELL.exec(second);
  if (ca && cb) {
    const rows = [Number(ca[2]) - 1, Number(cb[2]) - 1];
    const cols = [columnIndex(ca[1] as string), columnIndex(cb[1] as string)];
    return {
      sheet,
      r0: Math.min(...rows),
      r1: Math.max(...rows),
      c0: Math.min(...cols),
      c1: Math.max(...cols),
    };
  }
  const ka = COL.exec(a);
  const kb = COL.exec(second);
  if (ka && kb) {
    const cols = [columnIndex(ka[1] as string), columnIndex(kb[1] as string)];
    return { sheet, r0: 0, r1: Infinity, c0: Math.min(...cols), c1: Math.max(...cols) };
  }
  const ra = ROW.exec(a);
  const rb = ROW.exec(second);
  if (ra && rb) {
    const rows = [Number(ra[1]) - 1, Number(rb[1]) - 1];
    return { sheet, r0: Math.min(...rows), r1: Math.max(...rows), c0: 0, c1: Infinity };
  }
  return undefined;
}

/** Every area a formula refers to. */
export function areasOf(formula: string, ownSheet: string): Area[] {
  const out: Area[] = [];
  for (const t of tokenize(formula)) {
    if (t.kind !== 'ref') continue;
    const a = areaOf(t.text, ownSheet);
    if (a) out.push(a);
  }
  return out;
}
