// Limits on what an imported xlsx may ask of us, checked from the zip's own directory and a
// streaming scan BEFORE the xlsx library inflates anything. They are generous for real sites
// (the supported size is 50,000 equipment rows) and stop zip bombs and runaway sheets.

/** Largest file accepted, as stored on disk. */
export const MAX_XLSX_FILE_BYTES = 128 * 1024 * 1024;
/** Largest sum of declared uncompressed sizes of all entries. */
export const MAX_XLSX_UNCOMPRESSED_BYTES = 768 * 1024 * 1024;
/** Largest single entry once inflated. */
export const MAX_XLSX_ENTRY_BYTES = 512 * 1024 * 1024;
/** Largest inflated/stored ratio of one entry (XML compresses ~5-30×; bombs reach 1000×). */
export const MAX_XLSX_COMPRESSION_RATIO = 200;
/** The ratio is only judged on entries bigger than this (tiny entries compress oddly). */
export const RATIO_CHECK_MIN_BYTES = 1024 * 1024;
/** Most zip entries a workbook may have. */
export const MAX_XLSX_ENTRIES = 5_000;
/**
 * Most rows one worksheet may hold (by count of rows and by the highest row number) and most
 * columns it may use: the supported size every door checks (src/core/site/limits.ts).
 */
export { MAX_SHEET_COLUMNS, MAX_SHEET_ROWS } from '../../core/site/limits.ts';

export interface XlsxLimits {
  readonly fileBytes: number;
  readonly uncompressedBytes: number;
  readonly entryBytes: number;
  readonly compressionRatio: number;
  readonly ratioCheckMinBytes: number;
  readonly entries: number;
  readonly sheetRows: number;
  readonly sheetColumns: number;
}

import { MAX_SHEET_COLUMNS, MAX_SHEET_ROWS } from '../../core/site/limits.ts';

export const DEFAULT_XLSX_LIMITS: XlsxLimits = {
  fileBytes: MAX_XLSX_FILE_BYTES,
  uncompressedBytes: MAX_XLSX_UNCOMPRESSED_BYTES,
  entryBytes: MAX_XLSX_ENTRY_BYTES,
  compressionRatio: MAX_XLSX_COMPRESSION_RATIO,
  ratioCheckMinBytes: RATIO_CHECK_MIN_BYTES,
  entries: MAX_XLSX_ENTRIES,
  sheetRows: MAX_SHEET_ROWS,
  sheetColumns: MAX_SHEET_COLUMNS,
};
