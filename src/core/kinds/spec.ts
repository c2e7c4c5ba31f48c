// An equipment kind, defined once: where it lives in the workbook, which values it needs and
// their ranges, whether it is a shunt item or a branch (transformer, line), how it behaves per
// operating case, and its physics as expressions (evaluated for the roll-up, printed as the
// workbook's formulas). Adding a kind = one file with a defineKind call, registered in index.ts.
import type { Expr } from './expr.ts';
import { columnSpec, type ColumnSpec } from './columns.ts';
import type { SupplyArrangement } from './supply.ts';

/** One input column of an equipment sheet: an interchange column, with a sheet-specific header if needed. */
export interface SheetInput {
  readonly key: string;
  readonly header: string;
  readonly format?: string;
  readonly width: number;
}

/** An equipment sheet: its name, what it is for, and its input columns in order. */
export interface SheetSpec {
  /** Stable id used in code and tests, e.g. 'motors'. */
  readonly id: string;
  /** Sheet name in the workbook, e.g. 'Motors'. */
  readonly name: string;
  readonly purpose: string;
  readonly inputs: readonly SheetInput[];
}

/** An input column from the interchange catalogue, optionally with this sheet's own header. */
export function input(key: string, header?: string): SheetInput {
  const c: ColumnSpec = columnSpec(key);
  return { key, header: header ?? c.header, width: c.width, ...(c.format ? { format: c.format } : {}) };
}

export function defineSheet(spec: SheetSpec): SheetSpec {
  return Object.freeze(spec);
}

/** How the per-case load factor is read for a kind. */
export interface LoadRule {
  /** Allowed load factors, inclusive. */
  readonly range: readonly [number, number];
  /** What the value means, said in the reference and on the sheet. */
  readonly meaning: string;
}

/** Where a row's u_kv puts a bus voltage: its own bus, the bus it feeds, or both ends. */
export type VoltageAt = 'bus' | 'to_bus' | 'both';

/** A shunt item: P and Q of ONE unit at load factor x (the framework multiplies by the units in service). */
export interface ShuntPhysics {
  readonly p?: Expr;
  readonly q: Expr;
  /** Capacitive kvar the supply sees at harmonics with the unit fully in (plain capacitors), for resonance. */
  readonly resonanceKvar?: Expr;
}

/** A branch carrying the bus it feeds: losses of ONE unit carrying sUnit kVA. */
export interface BranchPhysics {
  readonly pLoss?: Expr;
  /** kvar absorbed in series at this loading. */
  readonly qAbsorbed: Expr;
  /** kvar delivered (charging) whatever the loading, as a positive amount. */
  readonly qDelivered?: Expr;
  /**
   * Rated power of one unit in kVA, for the loading in %: a required column (a transformer's
   * s_kva), or an expression of optional columns (blank or 0: no rating, no loading).
   */
  readonly rating?: string | Expr;
}

/** What the design and checks need to know about a kind beyond its physics. */
export interface KindTraits {
  /** A capacitor: counts in resonance and in installed compensation. */
  readonly capacitor?: boolean;
  /** An induction motor: individual compensation and self-excitation apply. */
  readonly motor?: boolean;
  /** Delivers kvar by charging (cables, lines): a shunt reactor may be needed at light load. */
  readonly charging?: boolean;
}

export interface KindSpec {
  /** The value of the Kind column and of `kind` in a list, e.g. 'motor'. */
  readonly name: string;
  readonly sheet: SheetSpec;
  readonly role: 'shunt' | 'branch';
  /** Numeric columns that must be given (beyond tag and bus; a branch also needs to_bus). */
  readonly required: readonly string[];
  /** Per-case load factor; absent for branches (their loading is the bus they feed). */
  readonly load?: LoadRule;
  readonly voltageAt: VoltageAt;
  readonly shunt?: ShuntPhysics;
  readonly branch?: BranchPhysics;
  readonly traits?: KindTraits;
  /** What may be named in the Supply column, the default (blank) first; absent: no Supply column. */
  readonly supplies?: readonly SupplyArrangement[];
  /** One line for the reference: what the kind's rows compute. */
  readonly summary: string;
}

export function defineKind(spec: KindSpec): KindSpec {
  if (
    (spec.role === 'shunt') !== (spec.shunt !== undefined) ||
    (spec.role === 'branch') !== (spec.branch !== undefined)
  ) {
    throw new Error(`kind ${spec.name}: a ${spec.role} kind defines ${spec.role} physics and nothing else`);
  }
  if (spec.role === 'shunt' && !spec.load)
    throw new Error(`kind ${spec.name}: a shunt kind needs a load rule`);
  for (const key of spec.required) columnSpec(key);
  return Object.freeze(spec);
}
