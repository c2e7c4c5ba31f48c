// Reading typed values back out of a workbook's cells, with messages that say which sheet, row
// and column hold a value that cannot be read. Shared by the settings, equipment and bank readers.
import { error, warning, type Problem, type Severity } from '../site/problems.ts';
import type { CellContent, SheetDoc } from './document.ts';
import { shownText } from '../text/cellText.ts';

/** What a cell holds once evaluated; the app can pass the engine's values for formula cells. */
export type CellValueReader = (sheet: string, row: number, col: number) => CellContent | undefined;

export interface ReadContext {
  readonly problems: Problem[];
  readonly valueAt?: CellValueReader;
}

/** Where a value sits, for messages: the sheet, the 1-based row, and the column's header. */
export interface Spot {
  readonly sheet: string;
  /** 0-based row in cells. */
  readonly row: number;
  readonly col: number;
  readonly header: string;
  /** Interchange name of the column, when it has one. */
  readonly column?: string;
  readonly tag?: string;
}

export function report(ctx: ReadContext, severity: Severity, at: Spot, text: string): void {
  const where = { row: at.row + 1, column: at.column ?? at.header, ...(at.tag ? { tag: at.tag } : {}) };
  const p = severity === 'error' ? error(where, text) : warning(where, text);
  ctx.problems.push({
    ...p,
    message: `sheet ${at.sheet}, row ${at.row + 1}, column "${at.header}": ${text}`,
  });
}

/** The cell's value: typed content, or for a formula the evaluated value when a reader is given. */
function valueOf(doc: SheetDoc, at: Spot, ctx: ReadContext): { value: CellContent } | { formula: string } {
  const raw = doc.cells[at.row]?.[at.col] ?? null;
  if (typeof raw === 'string' && raw.startsWith('=')) {
    const v = ctx.valueAt?.(doc.name, at.row, at.col);
    return v === undefined ? { formula: raw } : { value: v };
  }
  return { value: raw };
}

export function readText(doc: SheetDoc, at: Spot, ctx: ReadContext): string | undefined {
  const v = valueOf(doc, at, ctx);
  if ('formula' in v) {
    report(ctx, 'error', at, `holds the formula ${v.formula}; type the text itself`);
    return undefined;
  }
  const x = v.value;
  if (x === null) return undefined;
  const t = (typeof x === 'string' ? shownText(x) : String(x)).trim();
  return t === '' ? undefined : t;
}

const NUMBER_TEXT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

export function readNumber(doc: SheetDoc, at: Spot, ctx: ReadContext): number | undefined {
  const v = valueOf(doc, at, ctx);
  if ('formula' in v) {
    report(ctx, 'error', at, `holds the formula ${v.formula}; inputs are read as typed numbers`);
    return undefined;
  }
  const x = v.value;
  if (x === null) return undefined;
  if (typeof x === 'number') {
    if (Number.isFinite(x)) return x;
    report(ctx, 'error', at, `must be a finite number; got ${x}`);
    return undefined;
  }
  if (typeof x === 'boolean') {
    report(ctx, 'error', at, `must be a number; got ${x ? 'TRUE' : 'FALSE'}`);
    return undefined;
  }
  const t = x.trim();
  if (t === '') return undefined;
  if (NUMBER_TEXT.test(t)) return Number(t);
  report(ctx, 'error', at, `must be a number; got "${t.length > 40 ? t.slice(0, 40) + '…' : t}"`);
  return undefined;
}

/** Header text → column index (first occurrence), compared ignoring case and surrounding spaces. */
export function headerIndex(doc: SheetDoc): Map<string, number> {
  const out = new Map<string, number>();
  (doc.cells[0] ?? []).forEach((h, i) => {
    if (typeof h !== 'string') return;
    const key = h.trim().toLowerCase();
    if (key !== '' && !out.has(key)) out.set(key, i);
  });
  return out;
}

export function findSheet(sheets: readonly SheetDoc[], name: string): SheetDoc | undefined {
  return (
    sheets.find((s) => s.name === name) ?? sheets.find((s) => s.name.toLowerCase() === name.toLowerCase())
  );
}
