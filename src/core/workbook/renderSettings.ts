// The Site sheet: the settings every formula refers to by cell, the operating cases, the
// assumptions and the cautions. Values in column B are the user's; labels, units, notes, the
// limits in use and the cautions are written by Kvar Ledger.
import { CAUTION_LINES } from '../cautions.ts';
import type { CellContent, ColumnInfo, SheetDoc } from './document.ts';
import {
  FIRST_CASE_ROW,
  REQUIREMENT_TEXT,
  SETTING_LABELS,
  SETTING_ROWS,
  VALUE_COL,
  settingsRows,
} from './settingsLayout.ts';
import { cellOn } from './refs.ts';

/** The values typed on the Site sheet, as typed. */
export interface SettingsInputs {
  readonly name: CellContent;
  readonly hz: CellContent;
  readonly requirement: CellContent;
  readonly cosTarget: CellContent;
  readonly tanLag: CellContent;
  readonly tanLead: CellContent;
  /** Blank: the limits apply to the case's own P. */
  readonly refKw: CellContent;
  readonly ssc: CellContent;
  /** Case names in order (non-blank). */
  readonly cases: readonly CellContent[];
  readonly notes: readonly CellContent[];
}

export const SETTINGS_COLUMNS: readonly ColumnInfo[] = [
  { header: 'Setting', width: 40 },
  { header: 'Value', width: 18 },
  { header: 'Unit', width: 8 },
  { header: 'Note', width: 70 },
];

const NOTES: Partial<Record<keyof typeof SETTING_ROWS, readonly [string | null, string]>> = {
  name: [null, 'Free text: the workbook title, shown on the export cover.'],
  hz: ['Hz', '50 or 60. Cables, lines and capacitor steps use it.'],
  requirement: [
    null,
    `"${REQUIREMENT_TEXT.cosphi}": the target below, lagging or leading; "${REQUIREMENT_TEXT.cosphiLag}": the target while drawing kvar, no leading limit (a tariff billing drawn kvar alone); "${REQUIREMENT_TEXT.tanphi}": a band of tan φ limits.`,
  ],
  cosTarget: [
    null,
    'Used when the requirement is cos φ: the compensation aims at this lagging power factor.',
  ],
  tanLag: [null, 'Used when the requirement is tan φ: the largest tan φ allowed while drawing kvar.'],
  tanLead: [null, 'Used when the requirement is tan φ: the largest |tan φ| allowed while delivering kvar.'],
  refKw: [
    'kW',
    "Blank: the limits apply to the site's active power in each case. For a site that generates, the rated (registered) active power the utility refers its kvar limits to, so the kvar allowed is the same at night as at full output.",
  ],
  ssc: [
    'MVA',
    'Of the supply at the point of connection, from the utility; resonance and voltage rise need it. Blank = unknown: Checks warns and offers a typical value for the voltage.',
  ],
  lagInUse: [
    null,
    'What the Compensation sheet aims at: from the tan φ limit, or tan(acos target) for a cos φ target.',
  ],
  leadInUse: [
    null,
    'A cos φ target is read as the same limit leading and lagging; blank when it is lagging only (no leading limit).',
  ],
  hzInUse: ['Hz', 'The frequency every formula uses; #N/A when the frequency above is not 50 or 60.'],
};

const here = (row: number) => cellOn(undefined, row, VALUE_COL);

/** Generated cells of the Site sheet for its inputs: [row, col, content]. */
export function settingsGenerated(inputs: SettingsInputs): Array<readonly [number, number, CellContent]> {
  const out: Array<readonly [number, number, CellContent]> = [];
  out.push([0, 0, 'Setting'], [0, 1, 'Value'], [0, 2, 'Unit'], [0, 3, 'Note']);
  for (const [key, row] of Object.entries(SETTING_ROWS) as Array<[keyof typeof SETTING_ROWS, number]>) {
    out.push([row, 0, SETTING_LABELS[key]]);
    const n = NOTES[key];
    out.push([row, 2, n?.[0] ?? null], [row, 3, n?.[1] ?? null]);
  }
  const inUse = (limit: number) =>
    `=IF(${here(SETTING_ROWS.requirement)}="${REQUIREMENT_TEXT.tanphi}",${here(limit)},TAN(ACOS(${here(SETTING_ROWS.cosTarget)})))`;
  out.push([SETTING_ROWS.lagInUse, 1, inUse(SETTING_ROWS.tanLag)]);
  out.push([
    SETTING_ROWS.leadInUse,
    1,
    `=IF(${here(SETTING_ROWS.requirement)}="${REQUIREMENT_TEXT.cosphiLag}","",${inUse(SETTING_ROWS.tanLead).slice(1)})`,
  ]);
  const hz = here(SETTING_ROWS.hz);
  out.push([SETTING_ROWS.hzInUse, 1, `=IF(OR(${hz}=50,${hz}=60),${hz},NA())`]);
  const rows = settingsRows(inputs.cases.length, inputs.notes.length);
  for (let i = 0; i <= rows.cases.count; i++) {
    const row = rows.cases.first + i;
    out.push([row, 0, SETTING_LABELS.case]);
    out.push([
      row,
      3,
      i === 0
        ? 'The first case: items without a load factor of their own use the Load (default) column.'
        : i === rows.cases.count
          ? 'Type a name here to add an operating case; clear a case name to remove the case.'
          : null,
    ]);
  }
  for (let i = 0; i <= rows.notes.count; i++) {
    out.push([rows.notes.first + i, 0, SETTING_LABELS.assumption]);
    if (i === rows.notes.count) out.push([rows.notes.first + i, 3, 'Type here to add an assumption.']);
  }
  CAUTION_LINES.forEach((line, i) => {
    out.push([rows.firstCaution + i, 0, SETTING_LABELS.caution], [rows.firstCaution + i, 1, line]);
  });
  return out;
}

/** Input cells of the Site sheet: [row, col, content]. */
export function settingsInputCells(inputs: SettingsInputs): Array<readonly [number, number, CellContent]> {
  const rows = settingsRows(inputs.cases.length, inputs.notes.length);
  const out: Array<readonly [number, number, CellContent]> = [
    [SETTING_ROWS.name, 1, inputs.name],
    [SETTING_ROWS.hz, 1, inputs.hz],
    [SETTING_ROWS.requirement, 1, inputs.requirement],
    [SETTING_ROWS.cosTarget, 1, inputs.cosTarget],
    [SETTING_ROWS.tanLag, 1, inputs.tanLag],
    [SETTING_ROWS.tanLead, 1, inputs.tanLead],
    [SETTING_ROWS.refKw, 1, inputs.refKw],
    [SETTING_ROWS.ssc, 1, inputs.ssc],
  ];
  inputs.cases.forEach((c, i) => out.push([rows.cases.first + i, 1, c]));
  inputs.notes.forEach((c, i) => out.push([rows.notes.first + i, 1, c]));
  return out;
}

/** The rows of the Site sheet (inputs and generated cells). */
export function settingsCells(inputs: SettingsInputs): CellContent[][] {
  const cells: CellContent[][] = [];
  for (const [r, c, v] of [...settingsGenerated(inputs), ...settingsInputCells(inputs)]) {
    while (cells.length <= r) cells.push([]);
    const line = cells[r] as CellContent[];
    while (line.length <= c) line.push(null);
    line[c] = v;
  }
  return cells.map((line) => {
    while (line.length < 4) line.push(null);
    return line;
  });
}

const label = (sheet: SheetDoc, row: number): string => {
  const v = sheet.cells[row]?.[0];
  return typeof v === 'string' ? v.trim().toLowerCase() : '';
};

const isBlank = (v: CellContent | undefined) =>
  v === null || v === undefined || (typeof v === 'string' && v.trim() === '');

/** The inputs of a Site sheet, found by the labels in column A (any layout). */
export function readSettingsInputs(sheet: SheetDoc | undefined): SettingsInputs {
  const valueOf = (key: keyof typeof SETTING_LABELS): CellContent => {
    if (!sheet) return null;
    const r = sheet.cells.findIndex((_, i) => i > 0 && label(sheet, i) === SETTING_LABELS[key].toLowerCase());
    return r < 0 ? null : (sheet.cells[r]?.[VALUE_COL] ?? null);
  };
  const list = (key: 'case' | 'assumption') =>
    (sheet?.cells ?? [])
      .filter((_, i) => i > 0 && sheet !== undefined && label(sheet, i) === SETTING_LABELS[key].toLowerCase())
      .map((line) => line[VALUE_COL] ?? null)
      .filter((v) => !isBlank(v));
  return {
    name: valueOf('name'),
    hz: valueOf('hz'),
    requirement: valueOf('requirement'),
    cosTarget: valueOf('cosTarget'),
    tanLag: valueOf('tanLag'),
    tanLead: valueOf('tanLead'),
    refKw: valueOf('refKw'),
    ssc: valueOf('ssc'),
    cases: list('case'),
    notes: list('assumption'),
  };
}

/** Is the sheet laid out as settingsCells would write it (so cells can be addressed by position)? */
export function isCanonicalSettings(sheet: SheetDoc, inputs: SettingsInputs): boolean {
  return settingsGenerated(inputs)
    .filter(([, c]) => c === 0)
    .every(([r, , v]) => (sheet.cells[r]?.[0] ?? null) === v);
}

export const SETTINGS_PURPOSE =
  'Site settings that every formula refers to: frequency, requirement at the point of connection, short-circuit power, operating cases (type a name in the empty Case row to add one); assumptions and cautions.';

export { FIRST_CASE_ROW };
