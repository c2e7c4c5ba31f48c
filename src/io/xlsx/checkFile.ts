// The gate every xlsx passes before the xlsx library sees it: zip directory, layout, sizes and
// rows. Cheap, streaming, and it never inflates more than the limits allow.
import { fail, type FileResult } from './fileProblem.ts';
import { DEFAULT_XLSX_LIMITS, type XlsxLimits } from './limits.ts';
import { scanWorksheets, type SheetExtent } from './sheetScan.ts';
import { readZipDirectory } from './zipDirectory.ts';

export interface CheckedXlsx {
  readonly entries: readonly string[];
  readonly sheets: readonly SheetExtent[];
}

export async function checkXlsxBytes(
  bytes: Uint8Array,
  limits: XlsxLimits = DEFAULT_XLSX_LIMITS,
): Promise<FileResult<CheckedXlsx>> {
  const dir = readZipDirectory(bytes, limits);
  if (!dir.ok) return dir;
  const names = dir.value.map((e) => e.name);
  const has = (n: string) => names.some((x) => x.toLowerCase() === n.toLowerCase());
  if (!has('[Content_Types].xml') || !has('xl/workbook.xml')) {
    const what = has('word/document.xml')
      ? 'a word-processor document'
      : has('ppt/presentation.xml')
        ? 'a presentation'
        : 'a zip archive';
    return fail('wrong-layout', `the file is ${what}, not an xlsx workbook (no xl/workbook.xml inside)`);
  }
  const sheets = await scanWorksheets(bytes, dir.value, limits);
  if (!sheets.ok) return sheets;
  if (sheets.value.length === 0) return fail('wrong-layout', 'the workbook has no worksheets');
  return { ok: true, value: { entries: names, sheets: sheets.value } };
}
