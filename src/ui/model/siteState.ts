// The living model's state beside the engine: for every equipment row what it is (item or not,
// kind, bus, fed bus, voltage), the structure the Buses, Compensation and Quantities and cost
// sheets were last written for, and the cells the user typed over. Immutable: every step makes a new state, and undo puts
// an old one back with the engine's own undo.
import {
  busSignature,
  type RowInfo,
  type RowRef,
  type WorkbookStructure,
} from '../../core/workbook/structure.ts';
import type { Rendered } from '../../core/workbook/render.ts';
import type { CellContent } from '../../core/workbook/document.ts';
import { settingsRows } from '../../core/workbook/settingsLayout.ts';
import { summaryRow } from '../../core/workbook/renderCompensation.ts';
import { quantitiesExtent } from '../../core/workbook/quantitiesLayout.ts';
import { OPTIONS_SHEET } from '../../core/workbook/optionsLayout.ts';

/** Per option block (index), bank inputs (input column → content) by bus key. */
export type RetiredOptions = readonly ReadonlyMap<string, ReadonlyMap<number, CellContent>>[];

export interface SiteState {
  readonly cases: readonly string[];
  /** Per equipment sheet (registry order), rows[i] is cell row i + 1. */
  readonly rows: readonly (readonly RowInfo[])[];
  /** What the Buses and Compensation sheets hold, with row positions as the engine has them now. */
  readonly rendered: WorkbookStructure;
  /** Per sheet id, the cells in generated places the user typed over ("row,col"). */
  readonly overrides: ReadonlyMap<number, ReadonlySet<string>>;
  /** Rows (header included) of the generated block of the Buses and Compensation sheets. */
  readonly extent: {
    readonly buses: number;
    readonly comp: number;
    readonly quant: number;
    readonly opts: number;
  };
  /** The Design options sheet holds inputs only (a site too large for its formulas). */
  readonly optionsCompact: boolean;
  /** Assumptions listed on the Site sheet (its layout). */
  readonly notes: number;
  /** Bank inputs of buses that went away, by bus key: back when the bus returns. */
  readonly retired: ReadonlyMap<string, ReadonlyMap<number, CellContent>>;
  /** The same for the Design options sheet: per option block, the banks of buses that went away. */
  readonly retiredOptions: RetiredOptions;
  /**
   * Bus keys whose sums the engine widened over blank rows inserted inside one of their runs of
   * rows (it stretches a range over rows inserted within it): written again at the next change of
   * items, before anything typed into those rows could count on them.
   */
  readonly widened?: ReadonlySet<string>;
}

export function stateOf(
  r: Rendered,
  overrides: ReadonlyMap<number, ReadonlySet<string>>,
  notes: number,
): SiteState {
  const n = r.structure.buses.length;
  return {
    cases: r.structure.cases,
    rows: r.structure.sheets.map((s) => s.rows),
    rendered: r.structure,
    overrides,
    extent: {
      buses: n + 1,
      comp: n > 0 ? summaryRow(n) + 1 : 1,
      quant: quantitiesExtent(n, r.structure.cases.length),
      opts: r.doc.sheets.find((s) => s.name === OPTIONS_SHEET)?.cells.length ?? 0,
    },
    optionsCompact: r.optionsCompact,
    notes,
    retired: new Map(),
    retiredOptions: [],
  };
}

export function siteRows(state: SiteState) {
  return settingsRows(state.cases.length, state.notes);
}

/** A position after rows were inserted (count > 0) or removed (count < 0) at `at`; undefined when removed. */
export function movedRow(row: number, at: number, count: number): number | undefined {
  if (count >= 0) return row >= at ? row + count : row;
  const removedEnd = at - count;
  if (row < at) return row;
  if (row < removedEnd) return undefined;
  return row + count;
}

/**
 * The rendered structure with the positions on one sheet moved as the engine moves references
 * when rows are inserted or removed there. A reference into removed rows becomes a position no
 * structure can have (-1), so the signature differs and the sheets are written anew.
 */
export function moveRendered(
  s: WorkbookStructure,
  sheet: number,
  at: number,
  count: number,
): WorkbookStructure {
  const move = (ref: RowRef | undefined): RowRef | undefined => {
    if (!ref || ref.sheet !== sheet) return ref;
    return { sheet, row: movedRow(ref.row, at, count) ?? -1 };
  };
  return {
    ...s,
    buses: s.buses.map((b) => {
      const feeder = move(b.feeder);
      const voltage = move(b.voltage);
      return { ...b, ...(feeder ? { feeder } : {}), ...(voltage ? { voltage } : {}) };
    }),
  };
}

/** Overrides of a sheet with rows inserted or removed. */
export function moveOverrides(set: ReadonlySet<string> | undefined, at: number, count: number): Set<string> {
  const out = new Set<string>();
  for (const key of set ?? []) {
    const [r, c] = key.split(',').map(Number) as [number, number];
    const moved = movedRow(r, at, count);
    if (moved !== undefined) out.add(`${moved},${c}`);
  }
  return out;
}

export function sameBuses(a: WorkbookStructure, b: WorkbookStructure): boolean {
  return busSignature(a) === busSignature(b);
}
