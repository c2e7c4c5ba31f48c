// The size Kvar Ledger supports and the largest value each input column may hold. Every door
// (the page's import and open, the command line, the workbook engine) checks against these
// numbers, so a file refused in one place is refused in all of them with the same words.
//
// Sizes: the largest site the benchmarks measure (tests/bench/sizes.ts: 50,000 equipment rows
// on 1,000 buses) is what is supported; beyond it the page and the export slow past use.
// Magnitudes: a value above these bounds is taken as a typing error (a unit slip, an extra
// digit), not as plant. They are generous on purpose (common practice, not a standard): the
// largest motors and generators built are in the hundreds of MW, the highest AC system voltage
// in service is 1,100 kV class, the largest single transformers about 1,500 MVA.
import type { NumericColumn, Site } from './model.ts';
import { error, type Problem } from './problems.ts';
import { formatNumber } from '../registry/messages.ts';

/** Equipment rows of one site, all kinds together (and so also of one kind). */
export const MAX_EQUIPMENT_ROWS = 50_000;
/** Buses of one site. */
export const MAX_BUSES = 1_000;
/** Operating cases of one site (each adds columns to every equipment sheet). */
export const MAX_CASES = 20;
/** Rows of any one sheet of a workbook: a full equipment sheet plus its header and notes. */
export const MAX_SHEET_ROWS = MAX_EQUIPMENT_ROWS + 1_000;
/**
 * Above this many equipment rows the design options are worked out only when asked for: five
 * designs take seconds there (about 10 s at 10,000 rows on the bench machine), and the Design
 * options sheet's blocks would add tens of formulas per bus and option. The Checks panel then
 * redoes them on request, the sheet keeps the options' inputs without formulas, and the export
 * says so on its cover.
 */
export const OPTIONS_UNASKED_MAX_ROWS = 2_000;
/** Columns of any one sheet (the widest built sheet at MAX_CASES cases is far below). */
export const MAX_SHEET_COLUMNS = 512;

/** 50000 → "50,000" */
export const grouped = (n: number): string => n.toLocaleString('en');

export interface ColumnBound {
  /** Largest allowed value (inclusive). */
  readonly max: number;
  readonly unit: string;
}

/**
 * Largest size of each magnitude column, either sign. Fractions and percentages (eff, cos_phi,
 * load, i0_pct, uk_pct, p_pct) are bounded by the catalogue functions' own domains already.
 */
export const COLUMN_BOUNDS: Readonly<Partial<Record<NumericColumn, ColumnBound>>> = {
  qty: { max: 10_000, unit: 'units' },
  running: { max: 10_000, unit: 'units' },
  p_kw: { max: 1_000_000, unit: 'kW' },
  s_kva: { max: 2_000_000, unit: 'kVA' },
  p0_kw: { max: 100_000, unit: 'kW' },
  pk_kw: { max: 100_000, unit: 'kW' },
  u_kv: { max: 1_200, unit: 'kV' },
  u_rated_kv: { max: 1_200, unit: 'kV' },
  c_uf_km: { max: 100, unit: 'µF/km' },
  l_mh_km: { max: 100, unit: 'mH/km' },
  r_ohm_km: { max: 1_000, unit: 'Ω/km' },
  x_ohm_km: { max: 1_000, unit: 'Ω/km' },
  c_nf_km: { max: 100_000, unit: 'nF/km' },
  len_km: { max: 5_000, unit: 'km' },
  q_kvar: { max: 1_000_000, unit: 'kvar' },
};

/** "at most 1,000,000 kW" for a value too large, "at least -1,000,000 kW" for one too negative. */
export function boundText(b: ColumnBound, value: number): string {
  const unit = b.unit ? ` ${b.unit}` : '';
  return value < 0 ? `at least -${grouped(b.max)}${unit}` : `at most ${grouped(b.max)}${unit}`;
}

/** Values beyond the bound of their column, as problems naming the row and the column. */
export function magnitudeProblems(
  values: Readonly<Partial<Record<NumericColumn, number>>>,
  at: (column: string) => { row: number; column: string; tag?: string },
): Problem[] {
  const out: Problem[] = [];
  for (const [column, value] of Object.entries(values) as Array<[NumericColumn, number | undefined]>) {
    const b = COLUMN_BOUNDS[column];
    if (b === undefined || value === undefined || Math.abs(value) <= b.max) continue;
    out.push(
      error(
        at(column),
        `${column} must be ${boundText(b, value)} (a larger value is taken as a typing error); got ${formatNumber(value)}`,
      ),
    );
  }
  return out;
}

/** The one sentence every door uses when a site is bigger than supported. */
export function tooManyText(what: string, count: number, max: number): string {
  return `${grouped(count)} ${what}; Kvar Ledger supports at most ${grouped(max)} (see README, Limits)`;
}

/** Size problems of a whole site: too many rows, buses or cases. Empty when within limits. */
export function siteSizeProblems(site: Site): Problem[] {
  const out: Problem[] = [];
  if (site.equipment.length > MAX_EQUIPMENT_ROWS)
    out.push(
      error({}, `the site has ${tooManyText('equipment rows', site.equipment.length, MAX_EQUIPMENT_ROWS)}`),
    );
  if (site.settings.cases.length > MAX_CASES)
    out.push(
      error({}, `the site has ${tooManyText('operating cases', site.settings.cases.length, MAX_CASES)}`),
    );
  const buses = new Set<string>();
  for (const r of site.equipment) {
    if (r.bus !== '') buses.add(r.bus);
    if (r.to_bus !== undefined && r.to_bus !== '') buses.add(r.to_bus);
  }
  if (buses.size > MAX_BUSES)
    out.push(error({}, `the site has ${tooManyText('buses', buses.size, MAX_BUSES)}`));
  return out;
}

/**
 * Equipment rows of a workbook: the rows below the header of its equipment sheets (named by the
 * caller: the workbook builder's layout), for the doors that open a workbook rather than a list.
 */
export function workbookEquipmentRows(
  sheets: ReadonlyArray<{ readonly name: string; readonly cells: readonly unknown[] }>,
  equipmentSheets: readonly string[],
): number {
  let rows = 0;
  for (const s of sheets) if (equipmentSheets.includes(s.name)) rows += Math.max(0, s.cells.length - 1);
  return rows;
}
