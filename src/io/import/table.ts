// An equipment list as it arrives: the rows of a CSV or of an xlsx's first sheet, cells as the
// file holds them. Reading never touches the open workbook; problems come back as values.
import { CsvSyntaxError, detectDelimiter, readCsv } from '../csv/read.ts';
import {
  checkXlsxBytes,
  fail,
  formatBytes,
  loadExcelJs,
  MAX_SHEET_COLUMNS,
  type FileResult,
} from '../xlsx/index.ts';
import { MAX_EQUIPMENT_ROWS, tooManyText } from '../../core/site/limits.ts';

export type RawCell = string | number | boolean | null;

export interface RawTable {
  /** File name, for messages. */
  readonly name: string;
  readonly kind: 'csv' | 'xlsx';
  /** The sheet read, for an xlsx. */
  readonly sheet?: string;
  /** Row-major, as in the file (row 0 = file row 1). */
  readonly rows: RawCell[][];
  /** Numbers in text use a decimal comma (a ';'-separated CSV). */
  readonly decimalComma: boolean;
}

/** Largest CSV accepted. */
export const MAX_CSV_BYTES = 64 * 1024 * 1024;

const ZIP_MAGIC = [0x50, 0x4b, 0x03, 0x04];

function decodeText(bytes: Uint8Array): string {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder('utf-16le').decode(bytes.subarray(2));
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder('utf-16be').decode(bytes.subarray(2));
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    // Lists saved by older spreadsheet programs on Windows are often in this code page.
    return new TextDecoder('windows-1252').decode(bytes);
  }
}

/** Rows of a CSV text, refusing what cannot be read with line and character. */
export function tableFromCsvText(name: string, text: string): FileResult<RawTable> {
  if (text.trim() === '')
    return fail(
      'empty',
      'the file is empty; an equipment list needs a header row (tag, bus, kind, ...) and one row per item',
      name,
    );
  try {
    const delimiter = detectDelimiter(text);
    const rows = readCsv(text, { delimiter });
    const tooMany = sizeProblem(rows, name);
    if (tooMany) return tooMany;
    const wide = rows.findIndex((r) => r.length > MAX_SHEET_COLUMNS);
    if (wide >= 0)
      return fail(
        'too-many-columns',
        `row ${wide + 1} has more than ${MAX_SHEET_COLUMNS} columns, the most accepted`,
        name,
      );
    return { ok: true, value: { name, kind: 'csv', rows, decimalComma: delimiter === ';' } };
  } catch (e) {
    if (e instanceof CsvSyntaxError) return fail('corrupt', `the CSV cannot be read: ${e.message}`, name);
    throw e;
  }
}

const isBlankRow = (r: readonly RawCell[] | undefined): boolean =>
  !r || r.every((c) => c === null || (typeof c === 'string' && c.trim() === ''));

/**
 * The door for the list's size: more data rows (non-blank rows after the first) than a site may
 * have is refused here, before anything is converted or checked row by row.
 */
function sizeProblem(
  rows: readonly (readonly RawCell[] | undefined)[],
  name: string,
): FileResult<never> | undefined {
  if (rows.length <= MAX_EQUIPMENT_ROWS + 1) return undefined;
  let filled = 0;
  for (const r of rows) if (!isBlankRow(r)) filled++;
  const data = filled - 1;
  if (data <= MAX_EQUIPMENT_ROWS) return undefined;
  return fail('too-many-rows', `the list has ${tooManyText('rows of data', data, MAX_EQUIPMENT_ROWS)}`, name);
}

type ExcelCellValue = unknown;

/** What an xlsx cell holds, as a plain value: cached results of formulas, text of rich text. */
function plainCell(v: ExcelCellValue, numFmt: string | undefined): RawCell {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number') return numFmt?.includes('%') ? `${Number((v * 100).toPrecision(15))}%` : v;
  if (typeof v === 'string' || typeof v === 'boolean') return v;
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  if (typeof v === 'object') {
    const o = v as Record<string, unknown>;
    if ('result' in o) return plainCell(o.result, numFmt);
    if ('formula' in o || 'sharedFormula' in o) return null;
    if (Array.isArray(o.richText))
      return (o.richText as Array<{ text?: string }>).map((r) => r.text ?? '').join('');
    if (typeof o.text === 'string') return o.text;
    if (typeof o.error === 'string') return o.error;
  }
  return String(v);
}

/** Rows of the first visible worksheet of an xlsx, after the gate has judged the file. */
export async function tableFromXlsx(name: string, bytes: Uint8Array): Promise<FileResult<RawTable>> {
  const gate = await checkXlsxBytes(bytes);
  if (!gate.ok)
    return {
      ok: false,
      problem: { ...gate.problem, where: gate.problem.where ? `${name}: ${gate.problem.where}` : name },
    };
  const ExcelJS = await loadExcelJs();
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch (e) {
    return fail('corrupt', `the xlsx cannot be read (${e instanceof Error ? e.message : String(e)})`, name);
  }
  const ws = wb.worksheets.find((w) => w.state === 'visible') ?? wb.worksheets[0];
  if (!ws) return fail('wrong-layout', 'the workbook has no worksheets', name);
  const rows: RawCell[][] = [];
  ws.eachRow({ includeEmpty: true }, (row, rowNumber) => {
    const cells: RawCell[] = [];
    row.eachCell({ includeEmpty: true }, (cell, col) => {
      cells[col - 1] = plainCell(cell.value, cell.numFmt);
    });
    rows[rowNumber - 1] = Array.from(cells, (c) => c ?? null);
  });
  const tooMany = sizeProblem(rows, name);
  if (tooMany) return tooMany;
  return {
    ok: true,
    value: {
      name,
      kind: 'xlsx',
      sheet: ws.name,
      rows: Array.from(rows, (r) => r ?? []),
      decimalComma: false,
    },
  };
}

/** A NUL byte near the start, without a UTF-16 byte-order mark: a program or an image, not text. */
function looksBinary(bytes: Uint8Array): boolean {
  const utf16 = (bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff);
  return !utf16 && bytes.subarray(0, 8192).includes(0);
}

/** Read an equipment list: an xlsx (by its zip signature) or a CSV (anything that is text). */
export async function readEquipmentFile(name: string, bytes: Uint8Array): Promise<FileResult<RawTable>> {
  if (bytes.length === 0) return fail('empty', 'the file is empty (0 bytes)', name);
  const isZip = ZIP_MAGIC.every((b, i) => bytes[i] === b);
  const looksXlsx = isZip || /\.xls[xm]?$/i.test(name);
  if (looksXlsx) return tableFromXlsx(name, bytes);
  if (looksBinary(bytes))
    return fail(
      'wrong-layout',
      'the file is binary (it holds NUL bytes), not a CSV text or an xlsx workbook; save the list as CSV or xlsx',
      name,
    );
  if (bytes.length > MAX_CSV_BYTES)
    return fail(
      'too-large',
      `the file is ${formatBytes(bytes.length)}; the largest list accepted is ${formatBytes(MAX_CSV_BYTES)}`,
      name,
    );
  return tableFromCsvText(name, decodeText(bytes));
}
