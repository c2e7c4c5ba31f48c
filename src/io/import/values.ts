// One imported cell to the number the interchange column expects: the column's unit factor,
// a unit written in the cell itself ("400 V", "1.2 MW"), percent signs, decimal commas and
// thousands separators. A cell that is not a number is passed on as text for the parser to report.
import type { RawCell } from './table.ts';
import { dimensionOf, unitFor, type UnitChoice } from './units.ts';

export type CellReading =
  | { readonly kind: 'blank' }
  | { readonly kind: 'number'; readonly value: number; readonly note?: string }
  | { readonly kind: 'text'; readonly text: string };

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const WITH_UNIT = /^([+-]?(?:\d[\d\s'’\u00a0\u202f]*[.,]?\d*|[.,]\d+)(?:[eE][+-]?\d+)?)\s*([^\d\s].*)$/;

/** "1 234,5" / "1'234.5" / "0,95" (decimal comma) / "1,234.5" (thousands comma) → a number text. */
function cleanNumber(text: string, decimalComma: boolean): string | undefined {
  let t = text.replace(/[\s'’\u00a0\u202f]/g, '');
  if (t.includes(',') && t.includes('.'))
    t =
      t.lastIndexOf(',') > t.lastIndexOf('.') ? t.replace(/\./g, '').replace(',', '.') : t.replace(/,/g, '');
  else if (t.includes(','))
    t =
      decimalComma || /^[+-]?\d*,\d{1,2}$|^[+-]?\d*,\d{4,}$|^[+-]?0,\d+$/.test(t)
        ? t.replace(',', '.')
        : t.replace(/,/g, '');
  return NUMBER.test(t) ? t : undefined;
}

/** Read a cell for `target`, whose column is in unit `unit`. */
export function readCell(
  cell: RawCell,
  target: string,
  unit: UnitChoice,
  decimalComma: boolean,
): CellReading {
  if (cell === null || cell === '') return { kind: 'blank' };
  if (typeof cell === 'boolean') return { kind: 'text', text: cell ? 'TRUE' : 'FALSE' };
  const dim = dimensionOf(target);
  if (dim === 'text') return { kind: 'text', text: typeof cell === 'number' ? String(cell) : cell };
  if (typeof cell === 'number') return { kind: 'number', value: scale(cell, unit.factor) };
  const text = cell.trim();
  if (text === '') return { kind: 'blank' };
  const plain = cleanNumber(text, decimalComma);
  if (plain !== undefined) return { kind: 'number', value: scale(Number(plain), unit.factor) };
  const m = WITH_UNIT.exec(text);
  const num = m ? cleanNumber(m[1] as string, decimalComma) : undefined;
  if (m && num !== undefined) {
    const spelled = (m[2] as string).trim();
    const own = unitFor(target, spelled);
    if (own)
      return {
        kind: 'number',
        value: scale(Number(num), own.factor),
        note: `unit ${spelled} written in the cell`,
      };
  }
  return { kind: 'text', text };
}

/** Multiply without leaving binary noise where the unit factor is a power of ten (0.95 % → 0.0095). */
function scale(x: number, factor: number): number {
  if (factor === 1) return x;
  const exp = Math.round(Math.log10(factor));
  if (Math.abs(factor - 10 ** exp) < 1e-15 * Math.abs(factor)) {
    const [mantissa, e = '0'] = String(x).split('e');
    return Number(`${mantissa}e${Number(e) + exp}`);
  }
  return x * factor;
}
