// Operating cases: how a row's load factor and quantity in service are read for one case.
//
// For developers (and mirrored by the workbook builder), the rules are:
// - Load factor in case c: the row's `load:<c>` value, else its `load` value, else 1.
//   So a blank case cell means "as in the default case", as blank means "default" everywhere.
// - Load factor 0 switches the item OFF in that case: it draws and delivers nothing. This is
//   what an estimator means by typing 0 for "pump stopped at night". A motor that runs idle
//   still draws its magnetising kvar: enter a small load factor (e.g. 0.05) for that, and
//   KVAR.MOTOR gives ≈ Q0. (KVAR.MOTOR itself at load 0 returns Q0; the roll-up does not call
//   it for a stopped motor.)
// - Loads and generators scale with the load factor (P = p_kw·load), so 0 is off naturally.
// - Capacitors and reactors: the load factor is the share of the nameplate in service
//   (1 = all steps in, 0.5 = half of them, 0 = switched out); it must lie in [0, 1].
// - Cables: 0 = de-energised, any other value = energised; charging does not depend on load.
// - Transformers and lines: the load column is not used; their loading is the apparent power
//   of the bus they feed. They are always energised.
// - `running` (default `qty`) units are in service in every case; element P and Q are per
//   unit times running. Transformers or lines with running n share their to_bus equally
//   (n identical units in parallel), so losses are n·loss(S/n).
import { findKind } from '../kinds/index.ts';
import { entryOf } from '../text/nameTable.ts';
import type { EquipmentRow } from './model.ts';

export interface LoadFactor {
  readonly value: number;
  /** The column the value came from ('load:<case>', 'load', or 'load' for the default 1). */
  readonly column: string;
  /** true when neither column gave a value (default 1). */
  readonly defaulted: boolean;
}

export function loadFactor(row: EquipmentRow, caseName: string): LoadFactor {
  const own = entryOf(row.loads, caseName);
  if (own !== undefined) return { value: own, column: `load:${caseName}`, defaulted: false };
  if (row.values.load !== undefined) return { value: row.values.load, column: 'load', defaulted: false };
  return { value: 1, column: 'load', defaulted: true };
}

/** Units in service: running, else qty, else 1. */
export function unitsRunning(row: EquipmentRow): number {
  return row.values.running ?? row.values.qty ?? 1;
}

/** Allowed load factors of a kind: [lo, hi] inclusive; undefined = not used (branches, unknown kinds). */
export function loadRange(kind: string): readonly [number, number] | undefined {
  return findKind(kind)?.load?.range;
}

/** Is the item switched on in this case? */
export function inService(row: EquipmentRow, caseName: string): boolean {
  if (loadRange(row.kind) === undefined) return true;
  return loadFactor(row, caseName).value !== 0;
}

/** Case lookup: exact name first, then ignoring letter case. */
export function resolveCase(cases: readonly string[], name: string): string | undefined {
  return cases.find((c) => c === name) ?? cases.find((c) => c.toLowerCase() === name.toLowerCase());
}
