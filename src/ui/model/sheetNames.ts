// Sheet names must survive the xlsx hand-off, so they follow the rules other spreadsheet
// programs enforce: 1–31 characters, none of : \ / ? * [ ], no leading or trailing apostrophe,
// not "History" (reserved in xlsx), unique ignoring case; and no character an xlsx file cannot
// hold at all (control characters, a half of a surrogate pair, U+FFFE, U+FFFF). A leading digit
// is refused too: the formula engine cannot read back its own references to such a sheet.

import { unstorableCharacter } from '../../core/text/storable.ts';

export const MAX_SHEET_NAME = 31;

/** Returns a message saying what is wrong, or undefined when the name is fine. */
export function sheetNameProblem(
  name: string,
  existing: readonly string[],
  current?: string,
): string | undefined {
  const trimmed = name.trim();
  if (trimmed === '') return 'A sheet name cannot be empty.';
  if (trimmed !== name) return 'A sheet name cannot start or end with spaces.';
  if (name.length > MAX_SHEET_NAME)
    return `A sheet name can have at most ${MAX_SHEET_NAME} characters; this one has ${name.length}.`;
  const bad = /[:\\/?*[\]]/.exec(name);
  if (bad) return `A sheet name cannot contain the character ${bad[0]}`;
  const unstorable = unstorableCharacter(name);
  if (unstorable)
    return `A sheet name cannot contain the character ${unstorable} (a control or unpaired character that files cannot hold).`;
  // The engine writes a reference to such a sheet without quotes ('2nd floor'!A1 becomes
  // 2nd floor!A1) and cannot read it back, so formulas reaching it would break on reopening.
  if (/^\d/.test(name))
    return `A sheet name cannot start with a digit (formulas that refer to it would not survive saving); try "Floor ${name}" or "Sheet ${name}".`;
  if (name.toLowerCase() === 'history')
    return 'A sheet cannot be called "History": spreadsheet files reserve that name.';
  if (name.startsWith("'") || name.endsWith("'"))
    return 'A sheet name cannot start or end with an apostrophe.';
  const clash = existing.find((e) => e.toLowerCase() === name.toLowerCase() && e !== current);
  if (clash !== undefined) return `There is already a sheet called "${clash}".`;
  return undefined;
}

/** 'Sheet 4' style default that does not clash. */
export function freshSheetName(existing: readonly string[], stem = 'Sheet'): string {
  const taken = new Set(existing.map((e) => e.toLowerCase()));
  for (let i = existing.length + 1; ; i++) {
    const candidate = `${stem} ${i}`;
    if (!taken.has(candidate.toLowerCase())) return candidate;
  }
}
