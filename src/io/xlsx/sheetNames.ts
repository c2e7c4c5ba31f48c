// Sheet names and cell addresses as the xlsx format wants them.
import { columnLetters } from '../../core/workbook/refs.ts';

/** 0 → 'A', 25 → 'Z', 26 → 'AA' (the one implementation lives with the workbook builder). */
export const columnLetter = columnLetters;

export const MAX_SHEET_NAME_LENGTH = 31;
const FORBIDDEN = /[\\/?*[\]:]/;

/** Why a sheet name cannot be stored in an xlsx, or undefined when it can. */
export function sheetNameProblem(name: string): string | undefined {
  if (name.trim() === '') return 'a sheet name must not be blank';
  if (name.length > MAX_SHEET_NAME_LENGTH)
    return `sheet name "${name}" is ${name.length} characters long; at most ${MAX_SHEET_NAME_LENGTH} are allowed in xlsx`;
  const bad = FORBIDDEN.exec(name);
  if (bad)
    return `sheet name "${name}" contains "${bad[0]}", which xlsx does not allow in sheet names (\\ / ? * [ ] :)`;
  if (name.startsWith("'") || name.endsWith("'"))
    return `sheet name "${name}" starts or ends with an apostrophe, which xlsx does not allow`;
  if (name.toLowerCase() === 'history')
    return 'a sheet may not be named "History" in xlsx (the name is reserved)';
  return undefined;
}

/** `wanted`, or `wanted (2)`, ... whichever is not taken (case-insensitively). */
export function uniqueSheetName(wanted: string, taken: Iterable<string>): string {
  const used = new Set([...taken].map((t) => t.toLowerCase()));
  if (!used.has(wanted.toLowerCase())) return wanted;
  for (let i = 2; ; i++) {
    const suffix = ` (${i})`;
    const name = wanted.slice(0, MAX_SHEET_NAME_LENGTH - suffix.length) + suffix;
    if (!used.has(name.toLowerCase())) return name;
  }
}
