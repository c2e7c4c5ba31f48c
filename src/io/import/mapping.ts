// The header-mapping step: for each column of a client's list, the interchange column it feeds
// (or none) and the unit its numbers are in. Suggested from remembered choices, our synonym
// table and the units in the headers; the user can change any of it before the preview.
import { columnLabel, findKind, kindNames } from '../../core/kinds/index.ts';
import { NUMERIC_COLUMNS, TEXT_COLUMNS } from '../../core/site/model.ts';
import { CASE_PREFIX } from '../../core/site/parse.ts';
import { columnLetters as columnLetter } from '../../core/workbook/refs.ts';
import { readHeader } from './headers.ts';
import { recall, remember, type MappingMemory } from './memory.ts';
import type { RawCell, RawTable } from './table.ts';
import { dimensionOf, ownUnit, unitFor, type UnitChoice } from './units.ts';

export type MappingReason = 'remembered' | 'exact' | 'synonym' | 'unit' | 'user' | 'none';

export interface ColumnMapping {
  /** 0-based column in the file. */
  readonly index: number;
  /** 'A', 'B', ... as the user's spreadsheet program shows it. */
  readonly letter: string;
  readonly header: string;
  /** Interchange column (p_kw, cos_phi, ...), 'load:<case>', or null: the column is ignored. */
  readonly target: string | null;
  /** The unit the column's numbers are in; its factor converts to the target's unit. */
  readonly unit: UnitChoice;
  readonly why: MappingReason;
  /** A short explanation for the dialog, e.g. "unit MW from the header" or "values above 1: read as %". */
  readonly note?: string;
}

export interface MappingProposal {
  readonly table: RawTable;
  /** 1-based row of the header in the file. */
  readonly headerRow: number;
  readonly columns: readonly ColumnMapping[];
  /** Required targets (tag, bus, kind) that no column feeds yet. */
  readonly missing: readonly string[];
  /** The kind of every row when no column feeds kind ("every row is a motor"). */
  readonly defaultKind?: string;
}

export const REQUIRED_TARGETS = ['tag', 'bus', 'kind'] as const;
/** How far down a header row is looked for (title rows above it are common). */
export const HEADER_SEARCH_ROWS = 15;

const RANK: Readonly<Record<MappingReason, number>> = {
  user: 5,
  remembered: 4,
  exact: 3,
  synonym: 2,
  unit: 1,
  none: 0,
};

function cellText(c: RawCell | undefined): string {
  return c === null || c === undefined ? '' : String(c);
}

/** The row among the first few whose cells read as the most known headers. */
export function findHeaderRow(rows: readonly (readonly RawCell[])[]): number {
  let best = 0;
  let bestScore = 0;
  rows.slice(0, HEADER_SEARCH_ROWS).forEach((r, i) => {
    const score = r.filter((c) => typeof c === 'string' && readHeader(c).target !== null).length;
    if (score > bestScore) {
      best = i;
      bestScore = score;
    }
  });
  return best;
}

/**
 * Fractions given as percent (efficiency 95, load 80) are spotted from the values: every
 * non-zero value above 1 and at most 100. A single 1.3 among 0.86s stays an error to report.
 */
function percentFromValues(target: string, values: readonly RawCell[]): boolean {
  if (dimensionOf(target) !== 'fraction') return false;
  const nums = values
    .map((v) =>
      typeof v === 'number'
        ? v
        : typeof v === 'string' && v.trim() !== '' && !v.includes('%')
          ? Number(v.replace(',', '.'))
          : NaN,
    )
    .filter((x) => Number.isFinite(x) && x !== 0);
  return nums.length > 0 && nums.every((x) => x > 1 && x <= 100);
}

function suggest(
  index: number,
  header: string,
  values: readonly RawCell[],
  memory: MappingMemory | undefined,
): ColumnMapping {
  const base = { index, letter: columnLetter(index), header };
  const remembered = recall(memory, header);
  if (remembered) {
    const t = remembered.target;
    const unit = t === null ? ownUnit('tag') : (unitFor(t, remembered.unit ?? '') ?? ownUnit(t));
    return { ...base, target: t, unit, why: 'remembered', note: 'as chosen last time' };
  }
  const reading = readHeader(header);
  if (reading.target === null) {
    const note =
      header.trim() === ''
        ? 'no header'
        : reading.unitSpelling
          ? `unit ${reading.unitSpelling}, but no column of ours matches the words`
          : 'no column of ours matches';
    return { ...base, target: null, unit: ownUnit('tag'), why: 'none', note };
  }
  const t = reading.target;
  if (reading.unitSpelling !== undefined) {
    const u = unitFor(t, reading.unitSpelling);
    if (u)
      return {
        ...base,
        target: t,
        unit: u,
        why: reading.match,
        note: `unit ${reading.unitSpelling} from the header`,
      };
  }
  if (percentFromValues(t, values)) {
    return {
      ...base,
      target: t,
      unit: unitFor(t, '%') as UnitChoice,
      why: reading.match,
      note: 'values above 1: read as %',
    };
  }
  const own = ownUnit(t);
  const dim = dimensionOf(t);
  const note =
    dim === 'text' || dim === 'count' || dim === 'fraction'
      ? undefined
      : `no unit in the header; ${own.label} assumed`;
  return note === undefined
    ? { ...base, target: t, unit: own, why: reading.match }
    : { ...base, target: t, unit: own, why: reading.match, note };
}

/** Each target fed by one column at most: the better-founded suggestion keeps it. */
function resolveClashes(columns: ColumnMapping[]): ColumnMapping[] {
  const owner = new Map<string, ColumnMapping>();
  for (const c of columns) {
    if (c.target === null) continue;
    const held = owner.get(c.target);
    if (!held || RANK[c.why] > RANK[held.why]) owner.set(c.target, c);
  }
  return columns.map((c) => {
    if (c.target === null) return c;
    const held = owner.get(c.target) as ColumnMapping;
    if (held === c) return c;
    return {
      ...c,
      target: null,
      unit: ownUnit('tag'),
      why: 'none',
      note: `also looks like ${columnLabel(c.target).label}, which column ${held.letter} (${held.header}) feeds`,
    };
  });
}

function missingOf(columns: readonly ColumnMapping[], defaultKind?: string): string[] {
  return REQUIRED_TARGETS.filter(
    (t) => !columns.some((c) => c.target === t) && !(t === 'kind' && defaultKind !== undefined),
  );
}

/** Does a column feed kind? Then it decides, and a kind for every row is not used. */
export function kindColumnMapped(p: MappingProposal): boolean {
  return p.columns.some((c) => c.target === 'kind');
}

/**
 * The user gives every row one kind (a registered kind's name) for a list without a kind
 * column, or takes it back (null). A name not registered is refused with the names there are.
 */
export function withDefaultKind(
  p: MappingProposal,
  kind: string | null,
):
  | { readonly ok: true; readonly proposal: MappingProposal }
  | { readonly ok: false; readonly message: string } {
  if (kind === null) {
    const { defaultKind: _dropped, ...rest } = p;
    return { ok: true, proposal: { ...rest, missing: missingOf(p.columns) } };
  }
  const spec = findKind(kind.trim().toLowerCase());
  if (!spec)
    return {
      ok: false,
      message: `"${kind}" is not a kind of equipment; the kinds are ${kindNames().join(', ')}`,
    };
  return { ok: true, proposal: { ...p, defaultKind: spec.name, missing: missingOf(p.columns, spec.name) } };
}

/** Suggest a mapping for a table just read. */
export function proposeMapping(table: RawTable, memory?: MappingMemory): MappingProposal {
  const h = findHeaderRow(table.rows);
  const header = table.rows[h] ?? [];
  const body = table.rows.slice(h + 1);
  const width = Math.max(header.length, ...body.slice(0, 200).map((r) => r.length));
  const columns: ColumnMapping[] = [];
  for (let i = 0; i < width; i++) {
    columns.push(
      suggest(
        i,
        cellText(header[i]).trim(),
        body.slice(0, 200).map((r) => r[i] ?? null),
        memory,
      ),
    );
  }
  const resolved = resolveClashes(columns);
  return { table, headerRow: h + 1, columns: resolved, missing: missingOf(resolved) };
}

/** The user points column `index` at `target` (null = ignore); a column that fed it before is freed. */
export function withColumnTarget(p: MappingProposal, index: number, target: string | null): MappingProposal {
  const columns = p.columns.map((c): ColumnMapping => {
    if (c.index === index) {
      if (target === null) return { ...c, target: null, unit: ownUnit('tag'), why: 'user' };
      const keep =
        c.target !== null && dimensionOf(c.target) === dimensionOf(target)
          ? unitFor(target, c.unit.label)
          : undefined;
      return { ...c, target, unit: keep ?? ownUnit(target), why: 'user' };
    }
    if (target !== null && c.target === target)
      return {
        ...c,
        target: null,
        unit: ownUnit('tag'),
        why: 'user',
        note: `now fed by column ${columnLetter(index)}`,
      };
    return c;
  });
  return { ...p, columns, missing: missingOf(columns, p.defaultKind) };
}

/** The user picks the unit of column `index` (a label from unitChoicesFor(target)). */
export function withColumnUnit(p: MappingProposal, index: number, unitLabel: string): MappingProposal {
  const columns = p.columns.map((c) => {
    if (c.index !== index || c.target === null) return c;
    const u = unitFor(c.target, unitLabel);
    return u ? { ...c, unit: u, why: 'user' as const } : c;
  });
  return { ...p, columns, missing: missingOf(columns, p.defaultKind) };
}

/** Store the choices of an accepted mapping for next time. */
export function rememberMapping(memory: MappingMemory, p: MappingProposal): MappingMemory {
  return remember(
    memory,
    p.columns
      .filter((c) => c.header !== '')
      .map(
        (c) =>
          [
            c.header,
            c.target === null ? { target: null } : { target: c.target, unit: c.unit.label },
          ] as const,
      ),
  );
}

/** Targets a column may be pointed at in the dialog, `load:<case>` for the given cases. */
export function mappingTargets(cases: readonly string[] = []): string[] {
  return [...TEXT_COLUMNS, ...NUMERIC_COLUMNS, ...cases.map((c) => CASE_PREFIX + c)];
}
