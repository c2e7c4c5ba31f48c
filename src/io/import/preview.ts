// The preview of an import: the list converted to our columns and units, read and checked by the
// same parser and validation the rest of the app uses, with every problem pointing at the row
// and the column of the client's file. Nothing here changes the open workbook.
import { defaultSettings } from '../../core/site/defaults.ts';
import type { EquipmentRow, Site, SiteSettings } from '../../core/site/model.ts';
import { DEFAULT_CASE, parseEquipmentTable } from '../../core/site/parse.ts';
import { nameTable } from '../../core/text/nameTable.ts';
import { describeWhere, given, problem, type Problem } from '../../core/site/problems.ts';
import { neutraliseText } from '../csv/write.ts';
import { mergeProblems, validateSite } from '../../core/site/validate.ts';
import { fillSiteTypical, type AssumedInput } from '../../core/site/typical/fillSite.ts';
import { kindColumnMapped, type ColumnMapping, type MappingProposal } from './mapping.ts';
import { readCell } from './values.ts';

export interface PreviewRow {
  /** 1-based row in the client's file. */
  readonly row: number;
  /** Converted values by target column (numbers in our units; text as given; null = blank). */
  readonly cells: Readonly<Record<string, string | number | null>>;
  readonly status: 'ok' | 'warning' | 'error';
}

export interface ImportPreview {
  readonly proposal: MappingProposal;
  /** The preview's columns in order (the mapped targets). */
  readonly targets: readonly string[];
  readonly rows: readonly PreviewRow[];
  /** Rows the parser could type (rows with an unknown kind are not among them, but are reported). */
  readonly equipment: readonly EquipmentRow[];
  /** The default case, then the cases of the load:<case> columns. */
  readonly cases: readonly string[];
  /** Every problem, with the file's row and column ("row 7, column C (Motor kW): ..."). */
  readonly problems: readonly Problem[];
  readonly counts: {
    readonly rows: number;
    readonly ok: number;
    readonly withErrors: number;
    readonly withWarnings: number;
  };
  /** True when required columns are mapped and no problem is an error. */
  readonly canApply: boolean;
  /** Typical values put in for blanks (with `fillTypical`); indices into `equipment`. */
  readonly assumed: readonly AssumedInput[];
  /** Blanks that stay blank with `fillTypical`, and why ("row 7 (M-12): eff: …"). */
  readonly notAssumed: readonly string[];
}

export interface PreviewOptions {
  /** The open site's settings: its first case names the plain load column, its other cases are kept. */
  readonly settings?: SiteSettings;
  /**
   * Fill the blank inputs of motors, transformers, feeders and lines with typical values as the rows arrive
   * (before they are checked), each listed as assumed; the workbook marks them.
   */
  readonly fillTypical?: boolean;
}

export const DEFAULT_IMPORT_SETTINGS: SiteSettings = defaultSettings('Imported list');

function isBlank(cells: readonly unknown[]): boolean {
  return cells.every((c) => c === null || c === undefined || (typeof c === 'string' && c.trim() === ''));
}

/** The table in our columns and units, header first, as text for the parser. */
function canonicalTable(
  p: MappingProposal,
  mapped: readonly ColumnMapping[],
  everyRowKind: string | undefined,
): { rows: string[][]; cells: Array<Record<string, string | number | null>>; fileRows: number[] } {
  const rows: string[][] = [[...mapped.map((c) => c.target as string), ...(everyRowKind ? ['kind'] : [])]];
  const cells: Array<Record<string, string | number | null>> = [];
  const fileRows: number[] = [];
  p.table.rows.slice(p.headerRow).forEach((raw, k) => {
    const out: string[] = [];
    const shown = nameTable<string | number | null>();
    for (const c of mapped) {
      const r = readCell(raw[c.index] ?? null, c.target as string, c.unit, p.table.decimalComma);
      const text = r.kind === 'blank' ? '' : r.kind === 'number' ? String(r.value) : r.text;
      out.push(text);
      shown[c.target as string] = r.kind === 'blank' ? null : r.kind === 'number' ? r.value : r.text;
    }
    // The kind chosen for every row, when no column gives it (a row blank in the mapped
    // columns stays blank, so the parser skips it as before).
    if (everyRowKind) {
      const blank = out.every((t) => t === '');
      out.push(blank ? '' : everyRowKind);
      shown.kind = blank ? null : everyRowKind;
    }
    // Blank rows stay in place (the parser skips them) so row numbers keep matching the file.
    rows.push(isBlank(raw) ? out.map(() => '') : out);
    cells.push(shown);
    fileRows.push(p.headerRow + 1 + k);
  });
  return { rows, cells, fileRows };
}

/** Point a problem at the client's column: "row 7, column C (Motor kW)". */
function inFileTerms(pr: Problem, byTarget: ReadonlyMap<string, ColumnMapping>): Problem {
  const c = pr.column === undefined ? undefined : byTarget.get(pr.column);
  if (!c) return pr;
  const oldPrefix = describeWhere(pr);
  const text =
    oldPrefix && pr.message.startsWith(oldPrefix + ': ')
      ? pr.message.slice(oldPrefix.length + 2)
      : pr.message;
  const where = {
    ...(pr.row !== undefined ? { row: pr.row } : {}),
    column: `${c.letter} (${c.header || c.target})`,
    ...(pr.bus !== undefined ? { bus: pr.bus } : {}),
    ...(pr.tag !== undefined ? { tag: pr.tag } : {}),
  };
  return problem(pr.severity, where, text);
}

function settingsWith(base: SiteSettings, cases: readonly string[]): SiteSettings {
  const all = [...base.cases];
  for (const c of cases) if (!all.includes(c)) all.push(c);
  return { ...base, cases: all };
}

/**
 * Text that a spreadsheet program would run as a formula (the CSV writer's rule: a leading = + -
 * @, tab or carriage return, unless it is a plain number). It is imported as text and never
 * run; the preview points it out so the user sees what the client's file held.
 */
function formulaLookalikes(
  cells: ReadonlyArray<Readonly<Record<string, string | number | null>>>,
  fileRows: readonly number[],
): Problem[] {
  const out: Problem[] = [];
  cells.forEach((c, k) => {
    for (const [target, v] of Object.entries(c)) {
      if (typeof v !== 'string' || neutraliseText(v) === v) continue;
      out.push(
        problem(
          'warning',
          { row: fileRows[k] as number, column: target },
          `${given(v)} looks like a formula; it is imported as text and never run`,
        ),
      );
    }
  });
  return out;
}

/** A preview row's cells with the typical values assumed for it (in the columns the file maps). */
function shownWith(
  cells: Readonly<Record<string, string | number | null>>,
  row: number,
  assumed: readonly AssumedInput[],
): Readonly<Record<string, string | number | null>> {
  const mine = assumed.filter((a) => a.row === row && a.column in cells);
  if (mine.length === 0) return cells;
  const out = { ...cells };
  for (const a of mine) out[a.column] = a.value;
  return out;
}

/** Convert, parse and check the table under a mapping. */
export function previewImport(p: MappingProposal, opts: PreviewOptions = {}): ImportPreview {
  const base = opts.settings ?? DEFAULT_IMPORT_SETTINGS;
  const mapped = p.columns.filter((c) => c.target !== null);
  const byTarget = new Map(mapped.map((c) => [c.target as string, c]));
  const everyRowKind = kindColumnMapped(p) ? undefined : p.defaultKind;
  const { rows, cells, fileRows } = canonicalTable(p, mapped, everyRowKind);
  const parsed = parseEquipmentTable(rows, {
    headerRow: p.headerRow,
    defaultCase: base.cases[0] ?? DEFAULT_CASE,
  });
  const settings = settingsWith(base, parsed.cases);
  const read: Site = { settings, equipment: parsed.equipment };
  const fill = opts.fillTypical ? fillSiteTypical(read) : undefined;
  const site = fill?.site ?? read;
  const validated = site.equipment.length > 0 ? validateSite(site) : [];
  const problems = mergeProblems(parsed.problems, [...validated, ...formulaLookalikes(cells, fileRows)]).map(
    (x) => inFileTerms(x, byTarget),
  );
  const worst = new Map<number, 'warning' | 'error'>();
  for (const x of problems) {
    if (x.row === undefined || x.severity === 'info') continue;
    if (x.severity === 'error' || !worst.has(x.row)) worst.set(x.row, x.severity);
  }
  const previewRows: PreviewRow[] = [];
  cells.forEach((c, k) => {
    const row = fileRows[k] as number;
    if (isBlank(Object.values(c))) return;
    previewRows.push({ row, cells: shownWith(c, row, fill?.assumed ?? []), status: worst.get(row) ?? 'ok' });
  });
  const withErrors = previewRows.filter((r) => r.status === 'error').length;
  const withWarnings = previewRows.filter((r) => r.status === 'warning').length;
  return {
    proposal: p,
    targets: [...mapped.map((c) => c.target as string), ...(everyRowKind ? ['kind'] : [])],
    rows: previewRows,
    equipment: site.equipment,
    cases: parsed.cases,
    problems,
    counts: {
      rows: previewRows.length,
      ok: previewRows.length - withErrors - withWarnings,
      withErrors,
      withWarnings,
    },
    canApply: p.missing.length === 0 && !problems.some((x) => x.severity === 'error'),
    assumed: fill?.assumed ?? [],
    notAssumed: fill?.notAssumed ?? [],
  };
}
