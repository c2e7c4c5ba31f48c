// Where each column of an equipment sheet sits: the inputs of the layout, the load factors per
// case, a catch-all for values the sheet has no column for, then the computed columns. The
// formulas (buildEquipment.ts), the bus totals (buildBuses.ts) and the reader all use this map.
import type { EquipmentRow, NumericColumn, TextColumn } from '../site/model.ts';
import type { ColumnInfo } from './document.ts';
import { FORMATS, HEADERS, type EquipmentSheetLayout } from './buildLayout.ts';

export interface SheetColumns {
  readonly input: ReadonlyMap<TextColumn | NumericColumn, number>;
  /** The interchange `load` column and the `load:<case>` columns (sheets that use load factors). */
  readonly loadDefault?: number;
  readonly loadCase?: readonly number[];
  /** "name=value; ..." for values this sheet has no column for (present only when needed). */
  readonly other?: number;
  readonly inService: number;
  /** Shunt sheets. */
  readonly loadUsed?: readonly number[];
  readonly p?: readonly number[];
  readonly q?: readonly number[];
  /** Capacitors and reactors: a capacitor's full output when it is not detuned (for resonance). */
  readonly plainCap?: number;
  /** Transformers and lines: apparent power carried per case. */
  readonly sCarried?: readonly number[];
  /** Transformers. */
  readonly loading?: readonly number[];
  readonly pLoss?: readonly number[];
  readonly qLoss?: readonly number[];
  /** Lines: charging (one value) and series absorption per case. */
  readonly qDelivered?: number;
  readonly qAbsorbed?: readonly number[];
  readonly columns: readonly ColumnInfo[];
}

/** Values of a row that the layout has no column for, in interchange terms. */
export function otherValues(
  layout: EquipmentSheetLayout,
  row: EquipmentRow,
): Array<[string, string | number]> {
  const keys = new Set<string>(layout.inputs.map((c) => c.key));
  const out: Array<[string, string | number]> = [];
  if (row.to_bus !== undefined && !keys.has('to_bus')) out.push(['to_bus', row.to_bus]);
  for (const [k, v] of Object.entries(row.values)) {
    if (v === undefined) continue;
    if (k === 'load' ? layout.usesLoad : keys.has(k)) continue;
    out.push([k, v]);
  }
  if (!layout.usesLoad) for (const [c, v] of Object.entries(row.loads)) out.push([`load:${c}`, v]);
  return out;
}

export function planColumns(
  layout: EquipmentSheetLayout,
  cases: readonly string[],
  rows: readonly EquipmentRow[],
): SheetColumns {
  const columns: ColumnInfo[] = [];
  const add = (info: ColumnInfo): number => columns.push(info) - 1;
  const perCase = (header: (c: string) => string, format: string, width: number) =>
    cases.map((c) =>
      add({ header: header(c), format, width: Math.max(width, header(c).length + 1), computed: true }),
    );

  const input = new Map<TextColumn | NumericColumn, number>();
  for (const c of layout.inputs)
    input.set(c.key, add({ header: c.header, width: c.width, ...(c.format ? { format: c.format } : {}) }));
  let loadDefault: number | undefined;
  let loadCase: number[] | undefined;
  if (layout.usesLoad) {
    loadDefault = add({ header: HEADERS.loadDefault, format: '0.00', width: 9 });
    loadCase = cases.map((c) =>
      add({
        header: HEADERS.loadCase(c),
        format: '0.00',
        width: Math.max(9, HEADERS.loadCase(c).length + 1),
      }),
    );
  }
  const needsOther = rows.some((r) => otherValues(layout, r).length > 0);
  const other = needsOther ? add({ header: HEADERS.other, width: 24 }) : undefined;
  const inService = add({ header: HEADERS.inService, format: FORMATS.count, width: 9, computed: true });

  const base = {
    input,
    inService,
    ...(loadDefault !== undefined ? { loadDefault } : {}),
    ...(loadCase ? { loadCase } : {}),
    ...(other !== undefined ? { other } : {}),
  };
  if (layout.role === 'shunt') {
    const loadUsed = perCase(HEADERS.loadUsed, '0.00', 9);
    const p = layout.hasP ? perCase(HEADERS.p, FORMATS.kw, 10) : undefined;
    const q = perCase(HEADERS.q, FORMATS.kvar, 10);
    const plainCap =
      layout.id === 'banks'
        ? add({ header: HEADERS.plainCap, format: FORMATS.kvar, width: 12, computed: true })
        : undefined;
    return {
      ...base,
      loadUsed,
      ...(p ? { p } : {}),
      q,
      ...(plainCap !== undefined ? { plainCap } : {}),
      columns,
    };
  }
  if (layout.id === 'transformers') {
    const sCarried = perCase(HEADERS.sLoad, FORMATS.kva, 11);
    const loading = perCase(HEADERS.loading, FORMATS.pct, 9);
    const pLoss = perCase(HEADERS.pLoss, '0.00', 10);
    const qLoss = perCase(HEADERS.qLoss, FORMATS.kvar, 10);
    return { ...base, sCarried, loading, pLoss, qLoss, columns };
  }
  const qDelivered = add({ header: HEADERS.qCharging, format: FORMATS.kvar, width: 11, computed: true });
  const sCarried = perCase(HEADERS.sLoad, FORMATS.kva, 11);
  const qAbsorbed = perCase(HEADERS.qSeries, FORMATS.kvar, 11);
  return { ...base, qDelivered, sCarried, qAbsorbed, columns };
}
