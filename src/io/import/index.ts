// Importing a client's equipment list, step by step, for the app's import dialog:
//   1. readEquipmentFile(name, bytes)       → the raw table (CSV, or the first sheet of an xlsx)
//   2. proposeMapping(table, memory)        → suggested column → interchange column and unit
//      withColumnTarget / withColumnUnit    ← the user's changes; unitChoicesFor / mappingTargets for the menus
//      withDefaultKind                      ← one kind for every row of a list without a kind column
//   3. previewImport(proposal, {settings})  → converted rows, problems with row and column, canApply
//   4. applyImport(currentDoc, preview, {mode}) → a NEW workbook document (the open one is untouched)
//      rememberMapping(memory, proposal)    → memory to keep in localStorage (MAPPING_MEMORY_STORAGE_KEY)
export { readEquipmentFile, tableFromCsvText, type RawTable, type RawCell } from './table.ts';
export {
  proposeMapping,
  withColumnTarget,
  withColumnUnit,
  withDefaultKind,
  kindColumnMapped,
  rememberMapping,
  mappingTargets,
  REQUIRED_TARGETS,
  type ColumnMapping,
  type MappingProposal,
  type MappingReason,
} from './mapping.ts';
export {
  previewImport,
  DEFAULT_IMPORT_SETTINGS,
  type ImportPreview,
  type PreviewRow,
  type PreviewOptions,
} from './preview.ts';
export { applyImport, type ApplyOptions, type ApplyResult } from './apply.ts';
export {
  emptyMappingMemory,
  parseMappingMemory,
  MAPPING_MEMORY_STORAGE_KEY,
  type MappingMemory,
  type RememberedChoice,
} from './memory.ts';
export { unitChoicesFor, type UnitChoice } from './units.ts';
export { describeProblem, type FileProblem } from '../xlsx/index.ts';
