// Design options side by side: the same site compensated in a few ways, each priced, saved and
// judged by the same rules (compare.ts), and read from a workbook (fromWorkbook.ts).
export {
  BLOCK_IDS,
  compareOptions,
  isUnread,
  weighOptions,
  DETUNED_OPTION_P,
  draftOptions,
  givenOption,
  sheetOptions,
  standardOptions,
  type OptionFigures,
  type OptionId,
  type OptionOutcome,
  type UnreadOption,
  type OptionSpec,
} from './compare.ts';
export {
  OPTIONS_UNASKED_MAX_ROWS,
  draftOptionsOfDoc,
  findingsCells,
  optionsForExport,
  workbookOptions,
  optionsOfDoc,
  type OptionsReport,
} from './fromWorkbook.ts';
