// Where a Checks entry points: the sheet, the 1-based grid row and the column of the cell at
// fault. Problems come in two numberings: the workbook reader names the sheet and grid row in
// its message ("sheet Site, row 3, column "Frequency": ..."), while the site rules number the
// equipment as one list from 2 (mapped back through the reader's origins). Row numbers inside
// a message are rewritten the same way, so "(row 9)" reads "Motors row 4". Pure: no DOM.
import { describeWhere, type Problem, type Severity } from '../../core/site/problems.ts';
import { equipmentSheets } from '../../core/kinds/index.ts';
import { HEADERS, SHEETS } from '../../core/workbook/layout.ts';
import { SETTING_LABELS } from '../../core/workbook/settingsLayout.ts';
import type { SheetDoc, WorkbookDoc } from '../../core/workbook/document.ts';
import { findSheet, headerIndex } from '../../core/workbook/readCells.ts';
import type { SiteFromWorkbook } from '../../core/workbook/readSite.ts';

export interface CheckTarget {
  readonly sheet: string;
  /** 1-based grid row. */
  readonly row: number;
  /** 0-based column; absent when the problem concerns the whole row. */
  readonly col?: number;
}

export interface CheckItem {
  readonly severity: Severity;
  /** 'input' for a problem with what was typed, else the design finding's code. */
  readonly code: string;
  /** "Motors row 5, column cos_phi", "bus LV-REF, item M1", or "" for the whole site. */
  readonly where: string;
  readonly text: string;
  /** The cell to show: sheet, 1-based grid row, 0-based column when known. */
  readonly target?: CheckTarget;
}

export interface Located {
  readonly where: string;
  readonly text: string;
  readonly target?: CheckTarget;
  /** Sheet, row and interchange column, to drop a rule's repeat of a problem the reader gave. */
  readonly key?: string;
}

const READER = /^sheet (.+?), row (\d+), column "(.*?)": ([\s\S]*)$/;
const READER_SHEET = /^sheet (.+?): ([\s\S]*)$/;

function settingsRow(doc: SheetDoc | undefined, label: string): number | undefined {
  const r = doc?.cells.findIndex(
    (row, i) =>
      i > 0 &&
      String(row[0] ?? '')
        .trim()
        .toLowerCase() === label.toLowerCase(),
  );
  return r === undefined || r < 0 ? undefined : r;
}

/** The grid column of an interchange column ('cos_phi', 'load:night') on an equipment sheet. */
/** The grid column and header of an input named by its key (the site file's name for it). */
function columnOf(
  doc: WorkbookDoc,
  sheet: string,
  column: string | undefined,
): { index: number | undefined; header: string } | undefined {
  if (!column) return undefined;
  const s = findSheet(doc.sheets, sheet);
  const layout = equipmentSheets().find((l) => l.sheet.name === s?.name)?.sheet;
  if (!s || !layout) return undefined;
  const header = column.startsWith('load:')
    ? HEADERS.loadCase(column.slice(5))
    : column === 'load'
      ? HEADERS.loadDefault
      : layout.inputs.find((c) => c.key === column)?.header;
  return header === undefined ? undefined : { index: headerIndex(s).get(header.toLowerCase()), header };
}

/**
 * The message with the input's key (l_mh_km, cos_phi, load:night) replaced by the header the user
 * sees in the grid. Keys that are plain words (bus, tag, qty) stay: they also occur as words.
 */
function withHeader(text: string, key: string | undefined, header: string | undefined): string {
  if (!key || !header || key === header || !/[_:]/.test(key)) return text;
  const escaped = key.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  return text.replace(new RegExp(`(^|[^A-Za-z0-9_:])${escaped}(?![A-Za-z0-9_])`, 'g'), `$1${header}`);
}

export function locateReaderProblem(p: Problem, doc: WorkbookDoc): Located {
  const m = READER.exec(p.message);
  if (m) {
    const [, sheet = '', row = '1', header = '', text = ''] = m;
    const s = findSheet(doc.sheets, sheet);
    const col = sheet === SHEETS.settings ? 1 : s ? headerIndex(s).get(header.toLowerCase()) : undefined;
    const name = p.column ?? header;
    return {
      where: `${sheet} row ${row}, column ${name}`,
      text,
      target: { sheet, row: Number(row), ...(col !== undefined ? { col } : {}) },
      key: `${sheet}|${row}|${name}`,
    };
  }
  const ms = READER_SHEET.exec(p.message);
  if (ms) return { where: ms[1] ?? '', text: ms[2] ?? '', target: { sheet: ms[1] ?? '', row: 1 } };
  return { where: '', text: p.message };
}

/** "row 7" and "rows 3, 5" in a rule's message, in the grid's own sheet-and-row terms. */
export function sheetRows(text: string, origins: SiteFromWorkbook['origins']): string {
  return text.replace(/\brows? (\d+(?:(?:, | and )\d+)*)/g, (whole, list: string) => {
    const named = list.split(/, | and /).map((n) => {
      const o = origins[Number(n) - 2];
      return o ? `${o.sheet} row ${o.row + 1}` : undefined;
    });
    return named.every((x) => x !== undefined) ? named.join(', ') : whole;
  });
}

/** The message without the "row 7, column x: " prefix that problems.ts puts in front. */
function bare(p: Problem): string {
  const prefix = describeWhere(p);
  return prefix && p.message.startsWith(`${prefix}: `) ? p.message.slice(prefix.length + 2) : p.message;
}

/** A problem of the site rules (validateSite) or a design finding: rows numbered as one list. */
export function locateRuleProblem(
  p: Problem,
  doc: WorkbookDoc,
  origins: SiteFromWorkbook['origins'],
): Located {
  const origin = p.row !== undefined ? origins[p.row - 2] : undefined;
  const text = sheetRows(bare(p), origins);
  if (origin) {
    const row = origin.row + 1;
    const found = columnOf(doc, origin.sheet, p.column);
    const col = found?.index;
    // The grid's header, not the site file's key: "column L (mH/km)", not "column l_mh_km".
    const name = found?.header ?? p.column;
    return {
      where: [`${origin.sheet} row ${row}`, name ? `column ${name}` : ''].filter(Boolean).join(', '),
      text: withHeader(text, p.column, found?.header),
      target: { sheet: origin.sheet, row, ...(col !== undefined ? { col } : {}) },
      key: `${origin.sheet}|${row}|${p.column ?? ''}`,
    };
  }
  // Settings: the Site sheet row that holds the value.
  if (p.row === undefined && (p.column === 'hz' || /^settings: /.test(p.message))) {
    const site = findSheet(doc.sheets, SHEETS.settings);
    const r = p.column === 'hz' ? settingsRow(site, SETTING_LABELS.hz) : undefined;
    return {
      where: r !== undefined ? `${SHEETS.settings} row ${r + 1}` : `${SHEETS.settings} sheet`,
      text: text.replace(/^settings: /, ''),
      ...(site
        ? { target: { sheet: site.name, row: (r ?? 0) + 1, ...(r !== undefined ? { col: 1 } : {}) } }
        : {}),
    };
  }
  if (p.bus) {
    const buses = findSheet(doc.sheets, SHEETS.buses);
    const r = buses?.cells.findIndex((row, i) => i > 0 && row[0] === p.bus);
    return {
      where: `bus ${p.bus}`,
      text,
      ...(buses && r !== undefined && r > 0 ? { target: { sheet: buses.name, row: r + 1, col: 0 } } : {}),
    };
  }
  return { where: '', text };
}
