// What lets our own export come back exactly: the original workbook (catalogue formulas and
// everything typed) as JSON in a very hidden sheet, plus one fingerprint per exported row. On
// import a row whose fingerprint still matches is restored from the JSON; a row someone changed
// in another program is read as that program left it. Other programs only see plain formulas.
import type { WorkbookDoc } from '../../core/workbook/document.ts';

export const META_SHEET_NAME = '_kvar_ledger';
export const META_MARKER = 'kvar-ledger-xlsx-meta';
export const META_VERSION = 1;
/** Characters per cell (the format allows 32,767). */
export const META_CHUNK = 30_000;

export interface SheetMeta {
  /** Sheet name in the workbook document. */
  readonly doc: string;
  /** Sheet name in the xlsx (the same unless it had to change). */
  readonly file: string;
  /** Fingerprint of each exported row, row 1 first. */
  readonly rows: readonly string[];
}

export interface ExportMeta {
  readonly format: typeof META_MARKER;
  readonly version: typeof META_VERSION;
  readonly doc: WorkbookDoc;
  readonly sheets: readonly SheetMeta[];
  /** Sheets the export added (cover, functions list): not part of the document. */
  readonly generated: readonly string[];
}

/** A cell as written or read back, reduced to what a fingerprint compares. */
export type FingerprintCell =
  | { readonly col: number; readonly formula: string }
  /** A formula already normalised (normaliseFormula of its text), e.g. worked out once per shape. */
  | { readonly col: number; readonly normalised: string }
  | { readonly col: number; readonly value: number | string | boolean }
  | { readonly col: number; readonly error: string };

/**
 * A formula in a form that survives another program's re-saving: no spaces, upper-case names,
 * no storage prefixes, no quotes around simple sheet names, numbers in one spelling.
 */
export function normaliseFormula(text: string): string {
  const body = text.startsWith('=') ? text.slice(1) : text;
  // Most formulas have no text literal and no quoted sheet name: one pass, no splitting.
  if (!body.includes('"') && !body.includes("'")) return normaliseOutsideText(body);
  // Text literals stay exactly as written, quoted sheet names lose only needless quotes;
  // every other rule is a plain substitution.
  return body
    .split(/("(?:[^"]|"")*"?|'(?:[^']|'')*'?)/)
    .map((part, i) =>
      i % 2 === 0 ? normaliseOutsideText(part) : part.startsWith('"') ? part : sheetName(part),
    )
    .join('');
}

function sheetName(quoted: string): string {
  const inner = quoted.slice(1, -1);
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(inner) ? inner.toUpperCase() : quoted.toUpperCase();
}

function normaliseOutsideText(part: string): string {
  return part
    .replace(/\s+/g, '')
    .toUpperCase()
    .replace(/_XLFN\.|_XLWS\./g, '')
    .replace(NUMBER_LITERAL, (n) => String(Number(n)));
}

/** A number literal: not part of a name, a cell address or a sheet name. */
const NUMBER_LITERAL = /(?<![A-Z0-9_.$])(?:\d+\.?\d*|\.\d+)(?:E[+-]?\d+)?(?![A-Z0-9_.(!])/g;

/** FNV-1a, 32 bits: enough to tell an edited row from an untouched one. */
function fnv1a(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return (h >>> 0).toString(16).padStart(8, '0');
}

export function rowFingerprint(cells: readonly FingerprintCell[]): string {
  const parts = cells.map((c) => {
    if ('normalised' in c) return `${c.col}f${c.normalised}`;
    if ('formula' in c) return `${c.col}f${normaliseFormula(c.formula)}`;
    if ('error' in c) return `${c.col}e${c.error}`;
    return `${c.col}${typeof c.value === 'number' ? 'n' : typeof c.value === 'boolean' ? 'b' : 's'}${String(c.value)}`;
  });
  return fnv1a(parts.join('\u0001'));
}

/** The JSON split into cell-sized chunks. */
export function metaChunks(meta: ExportMeta): string[] {
  // JSON escapes control characters and lone surrogates, but not these two, which XML forbids.
  const json = JSON.stringify(meta).replace(/[\uFFFE\uFFFF]/g, (c) => `\\u${c.charCodeAt(0).toString(16)}`);
  const chunks: string[] = [];
  for (let i = 0; i < json.length; i += META_CHUNK) chunks.push(json.slice(i, i + META_CHUNK));
  return chunks;
}

function isSheetDocLike(x: unknown): boolean {
  if (typeof x !== 'object' || x === null) return false;
  const s = x as { name?: unknown; cells?: unknown };
  return (
    typeof s.name === 'string' &&
    Array.isArray(s.cells) &&
    s.cells.every(
      (r) =>
        Array.isArray(r) && r.every((c) => c === null || ['number', 'string', 'boolean'].includes(typeof c)),
    )
  );
}

/** Parse and check the stored JSON; undefined when it is absent, damaged or of another version. */
export function parseMeta(json: string): ExportMeta | undefined {
  try {
    const m = JSON.parse(json) as Partial<ExportMeta>;
    if (m.format !== META_MARKER || m.version !== META_VERSION) return undefined;
    const doc = m.doc as Partial<WorkbookDoc> | undefined;
    if (
      !doc ||
      doc.format !== 'kvar-ledger-workbook' ||
      !Array.isArray(doc.sheets) ||
      !doc.sheets.every(isSheetDocLike)
    )
      return undefined;
    if (!Array.isArray(m.sheets) || !Array.isArray(m.generated)) return undefined;
    const sheetsOk = (m.sheets as unknown[]).every((x) => {
      const s = x as { doc?: unknown; file?: unknown; rows?: unknown } | null;
      return typeof s?.doc === 'string' && typeof s.file === 'string' && Array.isArray(s.rows);
    });
    return sheetsOk ? (m as ExportMeta) : undefined;
  } catch {
    return undefined;
  }
}
