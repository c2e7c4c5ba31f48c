// Each cell of the workbook as it goes into the xlsx: a plain formula (catalogue calls expanded,
// later functions prefixed) with the app's own result cached beside it, or the value the engine
// reads from what was typed. Problems are collected with the cell they concern.
import { CATALOGUE } from '../../core/functions/index.ts';
import type { CellContent, SheetDoc } from '../../core/workbook/document.ts';
import type { CellResult } from '../../engine/index.ts';
import { expandFormula, MAX_FORMULA_LENGTH, parseFormula, type ExpandResult } from '../formula/index.ts';
import { toFileFormula, withoutText } from './functionNames.ts';
import { compileShape, renderShape, toShape, type ShapeTemplate } from './formulaShape.ts';
import { normaliseFormula } from './metadata.ts';
import { columnLetter } from './sheetNames.ts';

/** Longest formula other programs accept (characters; defined with the expansion) and deepest nesting of calls. */
export { MAX_FORMULA_LENGTH };
export const MAX_NESTING = 64;

/** Error values the 2007 file format knows; the engine's own ones map to the nearest. */
const FILE_ERRORS = new Set(['#NULL!', '#DIV/0!', '#VALUE!', '#REF!', '#NAME?', '#NUM!', '#N/A']);
export function fileError(code: string): string {
  if (FILE_ERRORS.has(code)) return code;
  return code === '#CYCLE!' ? '#REF!' : '#VALUE!';
}

export type ExportCell =
  | { readonly kind: 'empty' }
  | { readonly kind: 'value'; readonly value: number | string | boolean }
  | { readonly kind: 'error'; readonly error: string }
  /** `normalised`: normaliseFormula(formula), for the row fingerprints. */
  | {
      readonly kind: 'formula';
      readonly formula: string;
      readonly normalised: string;
      readonly result: CellResult;
    };

export interface CellIssue {
  /** "Sheet!B7" */
  readonly where: string;
  readonly message: string;
}

export interface SheetCells {
  readonly rows: ExportCell[][];
  /** Catalogue functions used on the sheet, canonical names. */
  readonly catalogue: Set<string>;
  /** Later functions stored with a prefix. */
  readonly newer: Set<string>;
  /** Cells that cannot be written as a formula for other programs. */
  readonly issues: CellIssue[];
}

/** Characters XML 1.0 cannot hold; they would make the file unreadable. */
const XML_INVALID =
  // eslint-disable-next-line no-control-regex -- characters XML cannot hold are what this finds
  /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;
export function xmlSafe(text: string): string {
  return text.replace(XML_INVALID, '\uFFFD');
}

/** Could the formula call a catalogue function? (A cheap test; the tokenizer decides.) */
const CATALOGUE_NAMES = CATALOGUE.map((f) => f.name.replace(/\./g, '\\.')).join('|');
const CATALOGUE_CALL = new RegExp(`(?<![A-Za-z0-9_.])(?:${CATALOGUE_NAMES})\\(`, 'i');
/** The same, capturing each name (the tokenizer takes a name directly followed by '(' as a call). */
const CATALOGUE_CALLS = new RegExp(`(?<![A-Za-z0-9_.])(${CATALOGUE_NAMES})\\(`, 'gi');

/** A formula without catalogue calls goes out as written, once we know it can be read at all. */
function readable(formula: string): ExpandResult {
  const parsed = parseFormula(formula);
  return parsed.ok ? { ok: true, formula } : { ok: false, message: parsed.message };
}

function nesting(formula: string): number {
  let depth = 0;
  let max = 0;
  let inString = false;
  for (const ch of formula) {
    if (ch === '"') inString = !inString;
    else if (!inString && ch === '(') max = Math.max(max, ++depth);
    else if (!inString && ch === ')') depth--;
  }
  return max;
}

function valueCell(r: CellResult): ExportCell {
  if (!r.ok) return { kind: 'error', error: fileError(r.error) };
  const v = r.value;
  if (v === null) return { kind: 'empty' };
  if (typeof v === 'string') return { kind: 'value', value: xmlSafe(v) };
  return { kind: 'value', value: v };
}

function isFormula(c: CellContent): boolean {
  return typeof c === 'string' && c.startsWith('=');
}

/** The app's result in a cell of the sheet being converted (0-based row and column). */
export type ValueOf = (row: number, col: number) => CellResult;

const BLANK: CellResult = { ok: true, value: null };

/** What a formula becomes in the file, worked out once per shape (see formulaShape.ts). */
type Conversion =
  | {
      readonly ok: true;
      readonly file: ShapeTemplate;
      readonly normalised: ShapeTemplate;
      readonly tooDeep: boolean;
      readonly catalogue: readonly string[];
      readonly newer: readonly string[];
    }
  | { readonly ok: false; readonly message: string };

function convert(formula: string, row1: number): Conversion {
  const calls = CATALOGUE_CALL.test(formula);
  const catalogue = calls
    ? [...withoutText(formula).matchAll(CATALOGUE_CALLS)].map((m) => (m[1] as string).toUpperCase())
    : [];
  const expanded = calls ? expandFormula(formula) : readable(formula);
  if (!expanded.ok)
    return {
      ok: false,
      message: `the formula cannot be written for other programs (${expanded.message}); its value is written instead`,
    };
  const file = toFileFormula(expanded.formula);
  if (file.unknown.length > 0)
    return {
      ok: false,
      message: `the formula uses ${file.unknown.join(', ')}, which other spreadsheet programs do not have; its value is written instead`,
    };
  const text = xmlSafe(file.text);
  // Nesting does not change with the row numbers: checked once per shape.
  const shape = toShape(text, row1);
  // Normalising leaves row numbers and the offset marks as they are, so it too is done once per shape.
  return {
    ok: true,
    file: compileShape(shape),
    normalised: compileShape(normaliseFormula(shape)),
    tooDeep: nesting(text) > MAX_NESTING,
    catalogue,
    newer: file.newer,
  };
}

/** Checks of the written text (its length grows with row numbers; its nesting is the shape's). */
function sizeProblem(text: string, tooDeep: boolean): string | undefined {
  if (text.length > MAX_FORMULA_LENGTH) {
    return `the formula is ${text.length} characters long once written out; other programs accept at most ${MAX_FORMULA_LENGTH} (move nested calls into cells of their own); its value is written instead`;
  }
  if (tooDeep)
    return `the formula nests calls deeper than the ${MAX_NESTING} levels other programs accept; its value is written instead`;
  return undefined;
}

/** The last shape met in a column: the next row's formula is most often the same shape again. */
interface ColumnShape {
  readonly source: ShapeTemplate;
  readonly conv: Conversion;
}

/** Convert one sheet, with each cell's result from `valueOf`. */
export function exportSheetCells(valueOf: ValueOf, sheet: SheetDoc): SheetCells {
  const out: SheetCells = { rows: [], catalogue: new Set(), newer: new Set(), issues: [] };
  const shapes = new Map<string, Conversion>();
  const lastInColumn: (ColumnShape | undefined)[] = [];
  /** The conversion of a formula: the column's last shape when it writes out to this very text, else by shape. */
  const conversionOf = (formula: string, r: number, c: number): Conversion => {
    const last = lastInColumn[c];
    if (last && renderShape(last.source, r + 1) === formula) return last.conv;
    const shape = toShape(formula, r + 1);
    const key = `${c}|${shape}`;
    let conv = shapes.get(key);
    if (!conv) {
      conv = convert(formula, r + 1);
      shapes.set(key, conv);
      if (conv.ok) {
        conv.catalogue.forEach((f) => out.catalogue.add(f));
        conv.newer.forEach((n) => out.newer.add(n));
      }
    }
    lastInColumn[c] = { source: compileShape(shape), conv };
    return conv;
  };
  sheet.cells.forEach((row, r) => {
    const cells: ExportCell[] = [];
    row.forEach((content, c) => {
      const result = valueOf(r, c) ?? BLANK;
      if (!isFormula(content)) {
        cells.push(content === null || content === '' ? { kind: 'empty' } : valueCell(result));
        return;
      }
      const conv = conversionOf(content as string, r, c);
      const text = conv.ok ? renderShape(conv.file, r + 1) : undefined;
      const problem = conv.ok ? sizeProblem(text as string, conv.tooDeep) : conv.message;
      if (problem !== undefined) {
        out.issues.push({ where: `${sheet.name}!${columnLetter(c)}${r + 1}`, message: problem });
        cells.push(valueCell(result));
        return;
      }
      cells.push({
        kind: 'formula',
        formula: text as string,
        normalised: renderShape((conv as { normalised: ShapeTemplate }).normalised, r + 1),
        result,
      });
    });
    out.rows.push(cells);
  });
  return out;
}
