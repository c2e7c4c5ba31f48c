// The Site sheet's layout: settings in fixed rows of column B (so every formula refers to them by
// cell, e.g. Site!$B$3), then the operating cases, the assumptions and the cautions. A blank
// "Case" row and a blank "Assumption" row wait at the end of their lists: typing there adds one.
import { SHEETS } from './layout.ts';
import { cellOn } from './refs.ts';

export const SETTING_LABELS = {
  name: 'Site name',
  hz: 'Frequency',
  requirement: 'Requirement at the connection point',
  cosTarget: 'Target cos φ',
  tanLag: 'tan φ limit, lagging',
  tanLead: 'tan φ limit, leading',
  refKw: 'Rated power the limits refer to',
  ssc: 'Short-circuit power at the connection point',
  lagInUse: 'tan φ limit in use, lagging',
  leadInUse: 'tan φ limit in use, leading',
  hzInUse: 'Frequency in use',
  case: 'Case',
  assumption: 'Assumption',
  caution: 'Caution',
} as const;

/** Texts of the requirement cell. */
export const REQUIREMENT_TEXT = {
  cosphi: 'cos φ',
  cosphiLag: 'cos φ lagging only',
  tanphi: 'tan φ',
} as const;

/** Fixed rows (0-based) of the single settings; cases follow from FIRST_CASE_ROW. */
export const SETTING_ROWS = {
  name: 1,
  hz: 2,
  requirement: 3,
  cosTarget: 4,
  tanLag: 5,
  tanLead: 6,
  refKw: 7,
  ssc: 8,
  lagInUse: 9,
  leadInUse: 10,
  hzInUse: 11,
} as const;
export const FIRST_CASE_ROW = 12;
export const VALUE_COL = 1;

/** Absolute reference to a setting's value from another sheet, e.g. Site!$B$3. */
export function settingRef(which: keyof typeof SETTING_ROWS): string {
  return cellOn(SHEETS.settings, SETTING_ROWS[which], VALUE_COL, true);
}

/** Rows of the variable part for k cases and m assumptions (one spare row after each list). */
export function settingsRows(cases: number, notes: number) {
  const firstNote = FIRST_CASE_ROW + cases + 1;
  const firstCaution = firstNote + notes + 1;
  return {
    cases: { first: FIRST_CASE_ROW, count: cases, spare: FIRST_CASE_ROW + cases },
    notes: { first: firstNote, count: notes, spare: firstNote + notes },
    firstCaution,
  };
}
