// The xlsx library is large: it is only ever loaded here, by dynamic import, so the page's
// initial bundle stays small. Type imports are erased at build time and cost nothing.
import type * as ExcelJSNamespace from 'exceljs';

export type ExcelJS = typeof ExcelJSNamespace;

let loading: Promise<ExcelJS> | undefined;

export function loadExcelJs(): Promise<ExcelJS> {
  loading ??= import('exceljs').then(
    (m) => (m as { default?: ExcelJS }).default ?? (m as unknown as ExcelJS),
  );
  return loading;
}
