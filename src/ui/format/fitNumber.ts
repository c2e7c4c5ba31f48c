// A number shown in a column too narrow for it is rounded to fit, never cut with "…": fewer
// decimals first, then no thousands separators, then scientific notation, and only when not
// even that fits, "###" (as spreadsheet users know it). The engine keeps the full value; the
// formula bar and the cell's hover text show it.
import { formatNumber } from './numberFormat.ts';

/** Width of a text in digit widths: digits, signs and letters count 1, '.' and ',' half. */
export function textUnits(text: string): number {
  let u = 0;
  for (const ch of text) u += ch === '.' || ch === ',' ? 0.5 : 1;
  return u;
}

function decimalsOf(text: string): number {
  const m = /\.(\d+)/.exec(text);
  return m ? (m[1] as string).length : 0;
}

/**
 * The text for `x` in its column format that fits `room` digit widths. `room` is the column's
 * inner width divided by the width of one digit.
 */
export function fitNumber(x: number, format: string | undefined, room: number): string {
  const text = formatNumber(x, format);
  if (textUnits(text) <= room) return text;
  if (format === undefined || format === '' || format.toLowerCase() === 'general') return fitGeneral(x, room);
  const grouping = text.includes(',');
  const percent = text.endsWith('%');
  for (let d = decimalsOf(text) - 1; d >= 0; d--) {
    const code = `${grouping ? '#,##' : ''}0${d > 0 ? `.${'0'.repeat(d)}` : ''}${percent ? '%' : ''}`;
    const t = formatNumber(x, code);
    if (textUnits(t) <= room) return t;
  }
  const plain = formatNumber(x, percent ? '0%' : '0');
  if (textUnits(plain) <= room) return plain;
  for (let d = 2; d >= 0; d--) {
    const t = formatNumber(x, `0${d > 0 ? `.${'0'.repeat(d)}` : ''}E+00`);
    if (textUnits(t) <= room) return t;
  }
  return '###';
}

/** General format: fewer significant digits (no trailing zeros), then scientific, then ###. */
function fitGeneral(x: number, room: number): string {
  const whole = Math.abs(x) >= 1 ? Math.floor(Math.log10(Math.abs(x))) + 1 : 1;
  for (let p = 9; p >= whole; p--) {
    const t = String(Number.parseFloat(x.toPrecision(p)));
    if (!/e/i.test(t) && textUnits(t) <= room) return t;
  }
  for (let d = 2; d >= 0; d--) {
    const t = formatNumber(x, `0${d > 0 ? `.${'0'.repeat(d)}` : ''}E+00`);
    if (textUnits(t) <= room) return t;
  }
  return '###';
}
