// The xlsx hand-off, as the app and the command line use it. Load this module lazily from the
// page (`await import('../io/xlsx/index.ts')`): it pulls in the xlsx library on first use.
//
//   exportWorkbookXlsx(doc, opts?) → Promise<Uint8Array>
//   exportWorkbookXlsxWithReport(doc, opts?) → { bytes, issues, newerFunctions, catalogueFunctions }
//     opts.settings  site settings for the cover (read from a builder workbook when omitted)
//     opts.valueAt   (sheet, row, col) → CellResult: cached results from an engine the caller already
//                    has (the app's), so no second engine is built; by far the fastest way
//     opts.strict    throw XlsxExportError instead of writing a value where a formula cannot go
//   importKvarXlsx(bytes, opts?) → { ok: true, doc, restored, notes, problems } | { ok: false, problem, problems }
//     Our own export comes back exactly; rows changed elsewhere come back as plain formulas.
//     opts.acceptFormulaProblems opens a workbook with unknown functions or loops anyway.
//   describeProblem(problem) → one line for the status bar.
//   alignedWith(doc, source) → may the cached results of `source` stand in for `doc`'s?
//   checkXlsxBytes, loadExcelJs, fail, formatBytes: the gate, the library and the problem values
//   that the equipment-list reader (src/io/import) shares.
export {
  alignedWith,
  exportWorkbookXlsx,
  exportWorkbookXlsxWithReport,
  XlsxExportError,
  type XlsxExportOptions,
  type XlsxExportReport,
} from './export.ts';
export {
  importKvarXlsx,
  importKvarXlsx as importXlsx,
  type KvarImportOptions,
  type KvarImportResult,
} from './importKvar.ts';
export { checkXlsxBytes } from './checkFile.ts';
export {
  describeProblem,
  fail,
  formatBytes,
  type FileProblem,
  type FileProblemCode,
  type FileResult,
} from './fileProblem.ts';
export { loadExcelJs, type ExcelJS } from './loadExcelJs.ts';
export * from './limits.ts';
