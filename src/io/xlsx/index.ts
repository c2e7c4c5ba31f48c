// The xlsx hand-off, as the app and the command line use it. Load this module lazily from the
// page (`await import('../io/xlsx/index.ts')`): it pulls in the xlsx library on first use.
export { exportWorkbookXlsx, exportWorkbookXlsxWithReport, XlsxExportError, type XlsxExportOptions, type XlsxExportReport } from './export.ts';
export { importKvarXlsx, importKvarXlsx as importXlsx, type KvarImportOptions, type KvarImportResult } from './importKvar.ts';
export { checkXlsxBytes } from './checkFile.ts';
export { describeProblem, type FileProblem, type FileProblemCode } from './fileProblem.ts';
export * from './limits.ts';
