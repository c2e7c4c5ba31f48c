// What a typed or pasted text means as cell content, decided once here so the native file holds
// numbers as numbers: '' → blank, '12.5' → 12.5, 'TRUE' → true, '=…' → formula. A leading
// apostrophe enters the rest as text, as in other spreadsheet programs: "'=1+1" shows =1+1 and
// "'007" shows 007 (the content keeps the apostrophe where the engine would otherwise read the
// text as a formula, number, date or truth value; see core/text/cellText.ts).
import type { CellContent } from '../../core/workbook/document.ts';
import { textContent } from '../../core/text/cellText.ts';

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

export function typedContent(text: string): CellContent {
  if (text.startsWith("'")) return textContent(text.slice(1));
  const t = text.trim();
  if (t === '') return null;
  if (t.startsWith('=') && t.length > 1) return t;
  if (NUMBER.test(t)) {
    const n = Number(t);
    if (Number.isFinite(n)) return n === 0 ? 0 : n;
  }
  const upper = t.toUpperCase();
  if (upper === 'TRUE') return true;
  if (upper === 'FALSE') return false;
  return text;
}

/** Any value a grid or clipboard hands over, as cell content. */
export function contentOf(v: unknown): CellContent {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number') return Number.isFinite(v) ? v : null;
  if (typeof v === 'boolean') return v;
  return typedContent(String(v));
}

/** The text the editor starts from for a cell's content. */
export function editText(c: CellContent | undefined): string {
  if (c === null || c === undefined) return '';
  if (typeof c === 'boolean') return c ? 'TRUE' : 'FALSE';
  if (typeof c === 'number') return String(c);
  // Marked text shows its mark; other text that would be read back as something else gets one.
  if (c.startsWith("'") || c.startsWith('=')) return c;
  return typedContent(c) === c ? c : `'${c}`;
}
