// siteFromWorkbook: the inputs of a workbook back into a Site, so what a user typed in the app
// becomes the site the balance, the compensation design and the export work from. Columns are
// found by their header text; computed columns are ignored; a row whose inputs are all blank is
// skipped; every value that cannot be read is reported with its sheet, row and column.
import {
  NUMERIC_COLUMNS,
  type EquipmentKind,
  type EquipmentRow,
  type NumericColumn,
  type Site,
  type TextColumn,
} from '../site/model.ts';
import type { Problem } from '../site/problems.ts';
import type { SheetDoc, WorkbookDoc } from './document.ts';
import { equipmentSheets, type SheetInput } from '../kinds/index.ts';
import type { BankChoice } from '../site/bankChoice.ts';
import { nameTable } from '../text/nameTable.ts';
import { HEADERS, SHEETS } from './layout.ts';
import { BANK_INPUTS, NOTE_HEADER } from './compensationColumns.ts';
import { readBankInputs } from './readBankInputs.ts';

/** What this reader needs of an equipment sheet: its name, inputs and the kinds it holds. */
interface EquipmentSheetLayout {
  readonly sheet: string;
  readonly inputs: readonly SheetInput[];
  readonly kinds: readonly string[];
  readonly usesLoad: boolean;
}

function layouts(): EquipmentSheetLayout[] {
  return equipmentSheets().map((s) => ({
    sheet: s.sheet.name,
    inputs: s.sheet.inputs,
    kinds: s.kinds.map((k) => k.name),
    usesLoad: s.kinds.some((k) => k.load !== undefined),
  }));
}
import {
  findSheet,
  headerIndex,
  readNumber,
  readText,
  report,
  type CellValueReader,
  type ReadContext,
  type Spot,
} from './readCells.ts';
import { readSettings } from './readSettings.ts';

export type { CellValueReader } from './readCells.ts';

export interface ReadOptions {
  /** Values of formula cells (e.g. from the engine), for inputs a user wrote as formulas. */
  readonly valueAt?: CellValueReader;
}

export interface SiteFromWorkbook {
  readonly site: Site;
  readonly problems: Problem[];
  /** The banks entered on the Compensation sheet (pass to buildWorkbook to keep them). */
  readonly banks: BankChoice[];
  /**
   * For each equipment row (same order): the sheet and 0-based cell row it came from. The rows'
   * own `row` numbers count the sheets as one list; messages of this reader name sheet and row.
   */
  readonly origins: Array<{ readonly sheet: string; readonly row: number }>;
}

const NUMERIC = new Set<string>(NUMERIC_COLUMNS);

type Role =
  | { kind: 'text'; key: TextColumn }
  | { kind: 'number'; key: NumericColumn }
  | { kind: 'case'; caseName: string }
  | { kind: 'other' };

function roles(
  doc: SheetDoc,
  layout: EquipmentSheetLayout,
  cases: readonly string[],
): Array<{ col: number; header: string; role: Role }> {
  const index = headerIndex(doc);
  const out: Array<{ col: number; header: string; role: Role }> = [];
  const take = (header: string, role: Role) => {
    const col = index.get(header.toLowerCase());
    if (col !== undefined) out.push({ col, header, role });
  };
  for (const c of layout.inputs)
    take(
      c.header,
      NUMERIC.has(c.key)
        ? { kind: 'number', key: c.key as NumericColumn }
        : { kind: 'text', key: c.key as TextColumn },
    );
  if (layout.usesLoad) {
    take(HEADERS.loadDefault, { kind: 'number', key: 'load' });
    for (const c of cases) take(HEADERS.loadCase(c), { kind: 'case', caseName: c });
  }
  take(HEADERS.other, { kind: 'other' });
  return out;
}

function readOther(
  text: string,
  at: Spot,
  cases: readonly string[],
  ctx: ReadContext,
  row: {
    values: Partial<Record<NumericColumn, number>>;
    loads: Record<string, number>;
    to_bus?: string;
    supply?: string;
  },
): void {
  for (const part of text.split(';')) {
    const p = part.trim();
    if (p === '') continue;
    const eq = p.indexOf('=');
    const key = eq < 0 ? p : p.slice(0, eq).trim();
    const value = eq < 0 ? '' : p.slice(eq + 1).trim();
    const n = Number(value);
    if (key === 'to_bus' && value !== '') row.to_bus = value;
    else if (key === 'supply' && value !== '') row.supply = value;
    else if (key.startsWith('load:') && cases.includes(key.slice(5)) && value !== '' && Number.isFinite(n))
      row.loads[key.slice(5)] = n;
    else if (NUMERIC.has(key) && value !== '' && Number.isFinite(n)) row.values[key as NumericColumn] = n;
    else
      report(
        ctx,
        'warning',
        at,
        `"${p}" is not a value this sheet can keep (write name=number, e.g. s_kva=500); ignored`,
      );
  }
}

function readEquipmentSheet(
  doc: SheetDoc,
  layout: EquipmentSheetLayout,
  cases: readonly string[],
  ctx: ReadContext,
  out: EquipmentRow[],
  origins: SiteFromWorkbook['origins'],
): void {
  const cols = roles(doc, layout, cases);
  for (const key of ['tag', 'bus'] as const) {
    const h = layout.inputs.find((c) => c.key === key)?.header;
    if (h && !cols.some((c) => c.header === h)) {
      ctx.problems.push({
        severity: 'error',
        message: `sheet ${doc.name}: the header row has no "${h}" column; its rows cannot be read`,
        column: key,
      });
      return;
    }
  }
  for (let r = 1; r < doc.cells.length; r++) {
    const cells = doc.cells[r] ?? [];
    if (
      cols.every((c) => {
        const v = cells[c.col];
        return v === null || v === undefined || (typeof v === 'string' && v.trim() === '');
      })
    )
      continue;
    const text: Partial<Record<TextColumn, string>> = {};
    const row = {
      values: {} as Partial<Record<NumericColumn, number>>,
      loads: nameTable<number>(),
    } as {
      values: Partial<Record<NumericColumn, number>>;
      loads: Record<string, number>;
      to_bus?: string;
      supply?: string;
    };
    const tagCol = cols.find((c) => c.role.kind === 'text' && c.role.key === 'tag');
    const tag = tagCol
      ? readText(doc, { sheet: doc.name, row: r, col: tagCol.col, header: tagCol.header, column: 'tag' }, ctx)
      : undefined;
    for (const c of cols) {
      const at: Spot = { sheet: doc.name, row: r, col: c.col, header: c.header, ...(tag ? { tag } : {}) };
      const role = c.role;
      if (role.kind === 'text') {
        const t = readText(doc, { ...at, column: role.key }, ctx);
        if (t !== undefined) text[role.key] = t;
      } else if (role.kind === 'number') {
        const n = readNumber(doc, { ...at, column: role.key }, ctx);
        if (n !== undefined) row.values[role.key] = n;
      } else if (role.kind === 'case') {
        const n = readNumber(doc, { ...at, column: `load:${role.caseName}` }, ctx);
        if (n !== undefined) row.loads[role.caseName] = n;
      } else {
        const t = readText(doc, at, ctx);
        if (t !== undefined) readOther(t, at, cases, ctx, row);
      }
    }
    if (text.to_bus !== undefined) row.to_bus = text.to_bus;
    if (text.supply !== undefined) row.supply = text.supply;
    const kind = kindOf(
      layout,
      text.kind,
      {
        sheet: doc.name,
        row: r,
        col: cols.find((c) => c.role.kind === 'text' && c.role.key === 'kind')?.col ?? 0,
        header: 'Kind',
        column: 'kind',
        ...(tag ? { tag } : {}),
      },
      ctx,
    );
    if (kind === undefined) continue;
    out.push({
      // Numbered as one list across the sheets (header = row 1), so every row number is unique;
      // `origins` says which sheet and row each came from.
      row: out.length + 2,
      tag: text.tag ?? '',
      bus: text.bus ?? '',
      kind,
      ...(text.description !== undefined ? { description: text.description } : {}),
      ...(row.to_bus !== undefined ? { to_bus: row.to_bus } : {}),
      ...(row.supply !== undefined ? { supply: row.supply } : {}),
      values: row.values,
      loads: row.loads,
    });
    origins.push({ sheet: doc.name, row: r });
  }
}

function kindOf(
  layout: EquipmentSheetLayout,
  given: string | undefined,
  at: Spot,
  ctx: ReadContext,
): EquipmentKind | undefined {
  if (layout.kinds.length === 1) return layout.kinds[0];
  const k = (given ?? '').toLowerCase();
  const found = layout.kinds.find((x) => x === k);
  if (found) return found;
  report(
    ctx,
    'error',
    at,
    `kind must be one of ${layout.kinds.join(', ')} on this sheet; got ${given === undefined ? 'a blank cell' : `"${given}"`}; row skipped`,
  );
  return undefined;
}

function readBanks(doc: SheetDoc | undefined, ctx: ReadContext): BankChoice[] {
  if (!doc) return [];
  const index = headerIndex(doc);
  const columns = BANK_INPUTS.flatMap((b) => {
    const col = index.get(b.header.toLowerCase());
    return col === undefined ? [] : [{ key: b.key, col, header: b.header }];
  });
  const out: BankChoice[] = [];
  for (let r = 1; r < doc.cells.length; r++) {
    const bus = readText(doc, { sheet: doc.name, row: r, col: 0, header: 'Bus' }, ctx);
    if (bus === undefined) break; // the bus list ends at the first blank row; a summary follows
    const { inputs, any } = readBankInputs(doc, r, columns, ctx);
    const choice: { -readonly [K in keyof BankChoice]: BankChoice[K] } = { bus, ...inputs };
    const noteCol = index.get(NOTE_HEADER.toLowerCase());
    const note =
      noteCol === undefined
        ? undefined
        : readText(doc, { sheet: doc.name, row: r, col: noteCol, header: NOTE_HEADER }, ctx);
    if (note !== undefined) choice.note = note;
    if (any || note !== undefined) out.push(choice);
  }
  return out;
}

export function siteFromWorkbook(doc: WorkbookDoc, opts: ReadOptions = {}): SiteFromWorkbook {
  const problems: Problem[] = [];
  const ctx: ReadContext = { problems, ...(opts.valueAt ? { valueAt: opts.valueAt } : {}) };
  const settings = readSettings(findSheet(doc.sheets, SHEETS.settings), ctx);
  const equipment: EquipmentRow[] = [];
  const origins: SiteFromWorkbook['origins'] = [];
  for (const layout of layouts()) {
    const sheet = findSheet(doc.sheets, layout.sheet);
    if (sheet) readEquipmentSheet(sheet, layout, settings.cases, ctx, equipment, origins);
  }
  const banks = readBanks(findSheet(doc.sheets, SHEETS.compensation), ctx);
  return { site: { settings, equipment }, problems, banks, origins };
}
