// Where each column of an equipment sheet sits: the sheet's inputs, the load factors (default and
// per case), a catch-all for values the sheet has no column for, then the computed columns.
// Formulas, bus sums, the reader and the page all use this one plan.
import type { KindSpec, SheetSpec } from '../kinds/index.ts';
import type { ColumnInfo } from './document.ts';
import { FORMATS, HEADERS } from './layout.ts';

export interface EquipmentColumns {
  readonly sheet: SheetSpec;
  readonly kinds: readonly KindSpec[];
  readonly role: 'shunt' | 'branch';
  readonly input: ReadonlyMap<string, number>;
  readonly loadDefault?: number;
  readonly loadCase?: readonly number[];
  /** "name=value; ..." for values this sheet has no column for. */
  readonly other: number;
  /** Columns a user types into (a row with any of them filled in is an item). */
  readonly inputCols: readonly number[];
  /** First computed column; every column from here on is written by Kvar Ledger. */
  readonly firstComputed: number;
  readonly inService: number;
  // Shunt sheets, per case.
  readonly loadUsed?: readonly number[];
  readonly p?: readonly number[];
  readonly q?: readonly number[];
  readonly resonance?: number;
  // Branch sheets, per case (before and after compensation) and the charging once.
  readonly sCarried?: readonly number[];
  readonly loading?: readonly number[];
  readonly pLoss?: readonly number[];
  readonly qLoss?: readonly number[];
  readonly sCarriedAfter?: readonly number[];
  readonly loadingAfter?: readonly number[];
  readonly pLossAfter?: readonly number[];
  readonly qLossAfter?: readonly number[];
  readonly qCharging?: number;
  readonly columns: readonly ColumnInfo[];
}

export function planEquipmentColumns(
  sheet: SheetSpec,
  kinds: readonly KindSpec[],
  cases: readonly string[],
): EquipmentColumns {
  const role = kinds[0]?.role ?? 'shunt';
  const columns: ColumnInfo[] = [];
  const add = (info: ColumnInfo): number => columns.push(info) - 1;
  const computed = (header: string, format: string | undefined, width: number) =>
    add({
      header,
      ...(format ? { format } : {}),
      width: Math.max(width, Math.min(header.length + 1, 18)),
      computed: true,
    });
  const perCase = (header: (c: string) => string, format: string, width: number) =>
    cases.map((c) => computed(header(c), format, width));

  const input = new Map<string, number>();
  for (const c of sheet.inputs)
    input.set(c.key, add({ header: c.header, width: c.width, ...(c.format ? { format: c.format } : {}) }));
  const usesLoad = kinds.some((k) => k.load !== undefined);
  const loadDefault = usesLoad ? add({ header: HEADERS.loadDefault, format: '0.00', width: 9 }) : undefined;
  const loadCase = usesLoad
    ? cases.map((c) =>
        add({
          header: HEADERS.loadCase(c),
          format: '0.00',
          width: Math.max(9, Math.min(HEADERS.loadCase(c).length + 1, 18)),
        }),
      )
    : undefined;
  const other = add({ header: HEADERS.other, width: 18 });
  const inputCols = [
    ...input.values(),
    ...(loadDefault !== undefined ? [loadDefault] : []),
    ...(loadCase ?? []),
    other,
  ];
  const firstComputed = columns.length;
  const inService = computed(HEADERS.inService, FORMATS.count, 9);
  const base = {
    sheet,
    kinds,
    role,
    input,
    other,
    inputCols,
    firstComputed,
    inService,
    ...(loadDefault !== undefined ? { loadDefault } : {}),
    ...(loadCase ? { loadCase } : {}),
  };
  if (role === 'shunt') {
    const loadUsed = perCase(HEADERS.loadUsed, '0.00', 9);
    const p = kinds.some((k) => k.shunt?.p) ? perCase(HEADERS.p, FORMATS.kw, 10) : undefined;
    const q = perCase(HEADERS.q, FORMATS.kvar, 10);
    const resonance = kinds.some((k) => k.shunt?.resonanceKvar)
      ? computed(HEADERS.resonance, FORMATS.kvar, 12)
      : undefined;
    return {
      ...base,
      loadUsed,
      ...(p ? { p } : {}),
      q,
      ...(resonance !== undefined ? { resonance } : {}),
      columns,
    };
  }
  const rated = kinds.some((k) => k.branch?.rating);
  const hasP = kinds.some((k) => k.branch?.pLoss);
  const qCharging = kinds.some((k) => k.branch?.qDelivered)
    ? computed(HEADERS.qCharging, FORMATS.kvar, 11)
    : undefined;
  const sCarried = perCase(HEADERS.sCarried, FORMATS.kva, 11);
  const loading = rated ? perCase(HEADERS.loading, FORMATS.pct, 9) : undefined;
  const pLoss = hasP ? perCase(HEADERS.pLoss, '0.00', 10) : undefined;
  const qLoss = perCase(HEADERS.qLoss, FORMATS.kvar, 10);
  const sCarriedAfter = perCase(HEADERS.sCarriedAfter, FORMATS.kva, 11);
  const loadingAfter = rated ? perCase(HEADERS.loadingAfter, FORMATS.pct, 9) : undefined;
  const pLossAfter = hasP ? perCase(HEADERS.pLossAfter, '0.00', 10) : undefined;
  const qLossAfter = perCase(HEADERS.qLossAfter, FORMATS.kvar, 10);
  return {
    ...base,
    ...(qCharging !== undefined ? { qCharging } : {}),
    sCarried,
    ...(loading ? { loading } : {}),
    ...(pLoss ? { pLoss } : {}),
    qLoss,
    sCarriedAfter,
    ...(loadingAfter ? { loadingAfter } : {}),
    ...(pLossAfter ? { pLossAfter } : {}),
    qLossAfter,
    columns,
  };
}
