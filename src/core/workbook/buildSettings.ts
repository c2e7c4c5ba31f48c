// The Site sheet: name, frequency, requirement at the connection point, short-circuit power,
// operating cases, assumptions and the cautions. Settings sit in fixed rows of column B so
// every other sheet refers to them by cell (Site!$B$3), never by a copied value.
import type { SiteSettings } from '../site/model.ts';
import type { CellContent, ColumnInfo, SheetDoc } from './document.ts';
import { SHEETS } from './buildLayout.ts';
import { cellOn } from './buildRefs.ts';

export const SETTING_LABELS = {
  name: 'Site name',
  hz: 'Frequency',
  requirement: 'Requirement at the connection point',
  cosTarget: 'Target cos φ',
  tanLag: 'tan φ limit, lagging',
  tanLead: 'tan φ limit, leading',
  ssc: 'Short-circuit power at the connection point',
  lagInUse: 'tan φ limit in use, lagging',
  leadInUse: 'tan φ limit in use, leading',
  case: 'Case',
  assumption: 'Assumption',
  caution: 'Caution',
} as const;

/** Texts of the requirement cell. */
export const REQUIREMENT_TEXT = { cosphi: 'cos φ', tanphi: 'tan φ' } as const;

/** Fixed rows (0-based) of the single settings; cases, assumptions and cautions follow. */
export const SETTING_ROWS = {
  name: 1,
  hz: 2,
  requirement: 3,
  cosTarget: 4,
  tanLag: 5,
  tanLead: 6,
  ssc: 7,
  lagInUse: 8,
  leadInUse: 9,
  firstCase: 10,
} as const;
const VALUE_COL = 1;

/** Absolute reference to a setting's value from another sheet, e.g. Site!$B$3. */
export function settingRef(which: keyof typeof SETTING_ROWS): string {
  return cellOn(SHEETS.settings, SETTING_ROWS[which], VALUE_COL, true);
}

export const CAUTIONS: readonly string[] = [
  'This workbook estimates. It is not a design.',
  'Capacitor banks, resonance and overvoltage can hurt people and damage plant: switching transients, harmonic amplification and self-excitation of motors are real risks.',
  "The final design must follow local codes and the utility's rules, and be checked by a licensed engineer.",
];

const COLUMNS: readonly ColumnInfo[] = [
  { header: 'Setting', width: 40 },
  { header: 'Value', width: 18 },
  { header: 'Unit', width: 8 },
  { header: 'Note', width: 70 },
];

/** The tan φ limit the compensation works to, from whichever requirement the Site sheet states. */
function inUse(limit: 'tanLag' | 'tanLead'): string {
  const here = (row: number) => cellOn(undefined, row, VALUE_COL);
  return `=IF(${here(SETTING_ROWS.requirement)}="${REQUIREMENT_TEXT.tanphi}",${here(SETTING_ROWS[limit])},TAN(ACOS(${here(SETTING_ROWS.cosTarget)})))`;
}

export function buildSettingsSheet(s: SiteSettings): SheetDoc {
  const req = s.requirement;
  const rows: CellContent[][] = [
    COLUMNS.map((c) => c.header),
    [SETTING_LABELS.name, s.name, null, 'Free text: shown on the export cover.'],
    [SETTING_LABELS.hz, s.hz, 'Hz', '50 or 60. Cables, lines and capacitor steps use it.'],
    [
      SETTING_LABELS.requirement,
      REQUIREMENT_TEXT[req.kind],
      null,
      `"${REQUIREMENT_TEXT.cosphi}": a lagging target below; "${REQUIREMENT_TEXT.tanphi}": a band of tan φ limits.`,
    ],
    [
      SETTING_LABELS.cosTarget,
      req.kind === 'cosphi' ? req.target : null,
      null,
      'Used when the requirement is cos φ: the compensation aims at this lagging power factor.',
    ],
    [
      SETTING_LABELS.tanLag,
      req.kind === 'tanphi' ? req.lagMax : null,
      null,
      'Used when the requirement is tan φ: the largest tan φ allowed while drawing kvar.',
    ],
    [
      SETTING_LABELS.tanLead,
      req.kind === 'tanphi' ? req.leadMax : null,
      null,
      'Used when the requirement is tan φ: the largest |tan φ| allowed while delivering kvar.',
    ],
    [
      SETTING_LABELS.ssc,
      s.sscMva ?? null,
      'MVA',
      'Of the supply at the point of connection; resonance and voltage rise need it. Blank = unknown.',
    ],
    [
      SETTING_LABELS.lagInUse,
      inUse('tanLag'),
      null,
      'What the Compensation sheet aims at: from the tan φ limit, or tan(acos target) for a cos φ target.',
    ],
    [
      SETTING_LABELS.leadInUse,
      inUse('tanLead'),
      null,
      'A cos φ target is read as the same limit leading and lagging.',
    ],
  ];
  s.cases.forEach((c, i) => {
    rows.push([
      SETTING_LABELS.case,
      c,
      null,
      i === 0
        ? 'The first case: items without a load factor of their own use the Load (default) column.'
        : null,
    ]);
  });
  for (const note of s.notes ?? []) rows.push([SETTING_LABELS.assumption, note, null, null]);
  for (const line of CAUTIONS) rows.push([SETTING_LABELS.caution, line, null, null]);
  return {
    name: SHEETS.settings,
    cells: rows,
    columns: COLUMNS,
    purpose:
      'Site settings that every formula refers to: frequency, requirement at the point of connection, short-circuit power, operating cases; assumptions and cautions.',
  };
}
