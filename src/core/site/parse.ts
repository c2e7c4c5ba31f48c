// From a table of text (a CSV, the first sheet of an xlsx, or the site file's rows) to
// equipment rows in the interchange columns of the design. This step only reads: header names,
// numbers, kinds. Whether the values make sense is validate.ts's job.
import { kindNames } from '../kinds/index.ts';
import {
  NUMERIC_COLUMNS,
  TEXT_COLUMNS,
  type EquipmentKind,
  type EquipmentRow,
  type NumericColumn,
  type TextColumn,
} from './model.ts';
import { error, say, warning, type Problem } from './problems.ts';
import { unifyBusNames } from './busNames.ts';
import { nameTable } from '../text/nameTable.ts';

/** Name of the case driven by the plain `load` column when the source does not name it. */
import { DEFAULT_CASE } from './defaults.ts';
export { DEFAULT_CASE };
/** Header prefix of the per-case load factor columns, e.g. `load:night`. */
export const CASE_PREFIX = 'load:';

export interface ParseOptions {
  /** Name of the first case (the plain `load` column); default DEFAULT_CASE. */
  readonly defaultCase?: string;
  /** Row number of the header row, for messages; default 1 (data starts at 2). */
  readonly headerRow?: number;
  /** Accept "0,95" as 0.95 (lists from decimal-comma locales, usually ';'-separated). */
  readonly decimalComma?: boolean;
  /** When given, `load:<case>` columns naming another case are ignored with a warning. */
  readonly knownCases?: readonly string[];
}

export interface ParseResult {
  readonly equipment: EquipmentRow[];
  readonly problems: Problem[];
  /** The default case, then the cases of the `load:<case>` columns in header order. */
  readonly cases: string[];
}

type ColumnRole =
  | { readonly kind: 'text'; readonly name: TextColumn }
  | { readonly kind: 'number'; readonly name: NumericColumn }
  | { readonly kind: 'case'; readonly name: string; readonly caseName: string };

/** Header text → canonical column name: case-insensitive, spaces and dashes read as '_'. */
export function normaliseHeader(text: string): string {
  const t = text.trim();
  const colon = t.indexOf(':');
  if (colon >= 0 && t.slice(0, colon).trim().toLowerCase() === 'load')
    return CASE_PREFIX + t.slice(colon + 1).trim();
  return t.toLowerCase().replace(/[\s-]+/g, '_');
}

const TEXT_SET = new Set<string>(TEXT_COLUMNS);
const NUMBER_SET = new Set<string>(NUMERIC_COLUMNS);
const REQUIRED_HEADERS: readonly TextColumn[] = ['tag', 'bus', 'kind'];
/** Columns holding a fraction: "95%" means 0.95 there. */
const FRACTION_COLUMNS = new Set<string>(['eff', 'cos_phi', 'load']);

const NUMBER_TEXT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Parse one cell as a number; undefined when blank; an Error message text when not a number. */
export function parseNumberCell(
  text: string,
  column: string,
  decimalComma = false,
): number | undefined | { bad: string } {
  let t = text.trim();
  if (t === '') return undefined;
  let scale = 1;
  if (t.endsWith('%')) {
    t = t.slice(0, -1).trim();
    if (FRACTION_COLUMNS.has(column) || column.startsWith(CASE_PREFIX)) scale = 0.01;
  }
  if (decimalComma && /^[+-]?\d*,\d+$/.test(t)) t = t.replace(',', '.');
  if (!NUMBER_TEXT.test(t)) return { bad: say.notANumber(text) };
  return Number(t) * scale;
}

function mapHeader(
  header: readonly string[],
  headerRow: number,
  knownCases: readonly string[] | undefined,
  problems: Problem[],
): Array<ColumnRole | undefined> {
  const seen = new Map<string, number>();
  return header.map((raw, i) => {
    const name = normaliseHeader(raw);
    if (name === '') return undefined;
    const first = seen.get(name);
    if (first !== undefined) {
      problems.push(warning({ row: headerRow, column: raw.trim() }, say.duplicateColumn(raw.trim(), first)));
      return undefined;
    }
    seen.set(name, i + 1);
    if (TEXT_SET.has(name)) return { kind: 'text', name: name as TextColumn };
    if (NUMBER_SET.has(name)) return { kind: 'number', name: name as NumericColumn };
    if (name.startsWith(CASE_PREFIX)) {
      const caseName = name.slice(CASE_PREFIX.length);
      if (caseName === '') {
        problems.push(
          warning(
            { row: headerRow, column: raw.trim() },
            `column ${JSON.stringify(raw.trim())} names no case (write load:<case>); ignored`,
          ),
        );
        return undefined;
      }
      if (knownCases && !knownCases.includes(caseName)) {
        problems.push(
          warning(
            { row: headerRow, column: name },
            `case "${caseName}" is not among the site's cases (${knownCases.join(', ')}); column ignored`,
          ),
        );
        return undefined;
      }
      return { kind: 'case', name, caseName };
    }
    problems.push(warning({ row: headerRow, column: raw.trim() }, say.unknownColumn(raw.trim())));
    return undefined;
  });
}

function isBlankRow(cells: readonly string[]): boolean {
  return cells.every((c) => c.trim() === '');
}

/** Read the table whose first row is the header. Rows that cannot be typed are reported, not kept. */
export function parseEquipmentTable(
  rows: readonly (readonly string[])[],
  opts: ParseOptions = {},
): ParseResult {
  const problems: Problem[] = [];
  const headerRow = opts.headerRow ?? 1;
  const defaultCase = opts.defaultCase ?? DEFAULT_CASE;
  const header = rows[0];
  if (!header || isBlankRow(header)) {
    problems.push(
      error(
        { row: headerRow },
        'the table is empty; the first row must hold the column headers (tag, bus, kind, ...)',
      ),
    );
    return { equipment: [], problems, cases: [defaultCase] };
  }
  const roles = mapHeader(header, headerRow, opts.knownCases, problems);
  for (const req of REQUIRED_HEADERS) {
    if (!roles.some((r) => r?.kind === 'text' && r.name === req)) {
      problems.push(
        error({ row: headerRow, column: req }, `the header row has no ${req} column; it is required`),
      );
    }
  }
  const cases = [defaultCase];
  for (const r of roles) if (r?.kind === 'case' && !cases.includes(r.caseName)) cases.push(r.caseName);

  const equipment: EquipmentRow[] = [];
  rows.slice(1).forEach((cells, k) => {
    const rowNo = headerRow + 1 + k;
    if (isBlankRow(cells)) return;
    const row = readRow(cells, roles, rowNo, opts.decimalComma ?? false, problems);
    if (row) equipment.push(row);
  });
  const unified = unifyBusNames(equipment);
  return { equipment: unified.rows, problems: [...problems, ...unified.problems], cases };
}

function readRow(
  cells: readonly string[],
  roles: ReadonlyArray<ColumnRole | undefined>,
  rowNo: number,
  decimalComma: boolean,
  problems: Problem[],
): EquipmentRow | undefined {
  const text: Partial<Record<TextColumn, string>> = {};
  const values: Partial<Record<NumericColumn, number>> = {};
  const loads = nameTable<number>();
  cells.forEach((cell, i) => {
    const role = roles[i];
    if (!role) {
      if (i >= roles.length && cell.trim() !== '') {
        problems.push(
          warning(
            { row: rowNo, column: `#${i + 1}` },
            `value ${JSON.stringify(cell.trim())} is beyond the last header column; ignored`,
          ),
        );
      }
      return;
    }
    if (role.kind === 'text') {
      const t = cell.trim();
      if (t !== '') text[role.name] = t;
      return;
    }
    const n = parseNumberCell(cell, role.name, decimalComma);
    if (n === undefined) return;
    if (typeof n === 'object') {
      problems.push(error({ row: rowNo, column: role.name }, n.bad));
      return;
    }
    if (role.kind === 'number') values[role.name] = n;
    else loads[role.caseName] = n;
  });
  const kindText = text.kind ?? '';
  const kind = kindText.toLowerCase() as EquipmentKind;
  const where = { row: rowNo, column: 'kind', ...(text.tag ? { tag: text.tag } : {}) };
  if (kindText === '') {
    problems.push(error(where, `kind is blank; it must be one of ${kindNames().join(', ')}`));
    return undefined;
  }
  if (!kindNames().includes(kind)) {
    problems.push(error(where, say.unknownKind(kindText, kindNames())));
    return undefined;
  }
  return {
    row: rowNo,
    tag: text.tag ?? '',
    bus: text.bus ?? '',
    kind,
    ...(text.description !== undefined ? { description: text.description } : {}),
    ...(text.to_bus !== undefined ? { to_bus: text.to_bus } : {}),
    ...(text.supply !== undefined ? { supply: text.supply } : {}),
    values,
    loads,
  };
}
