// One equipment sheet: the inputs as typed, then per case the load factor used and P and Q
// (shunt items), or the apparent power carried and the losses (transformers and lines), all as
// catalogue formulas. The rules mirror the site roll-up (src/core/site/cases.ts):
// load factor = the case's own, else the default, else 1; load 0 or no unit running = off;
// capacitors and reactors scale with the load factor; transformers and lines share their
// carried power among the units running (at least one).
import type { EquipmentRow, NumericColumn, TextColumn } from '../site/model.ts';
import type { CellContent, SheetDoc } from './document.ts';
import type { EquipmentSheetLayout } from './buildLayout.ts';
import { otherValues, type SheetColumns } from './buildColumns.ts';
import { settingRef } from './buildSettings.ts';
import { cell } from './buildRefs.ts';

export interface EquipmentSheetPlan {
  readonly layout: EquipmentSheetLayout;
  /** Row i of the list sits in cells row i + 1 (row 0 is the header); rows are kept together by bus. */
  readonly rows: readonly EquipmentRow[];
  /** Each bus's block of rows: first and last cell row (0-based, inclusive). */
  readonly blocks: ReadonlyMap<string, { readonly first: number; readonly last: number }>;
  readonly cols: SheetColumns;
}

export interface EquipmentContext {
  readonly cases: readonly string[];
  /** Reference to the apparent power of a bus in a case (Buses sheet), or undefined for an unknown bus. */
  readonly busApparentPower: (bus: string, caseIndex: number) => string | undefined;
}

function inputValue(row: EquipmentRow, key: TextColumn | NumericColumn): CellContent {
  switch (key) {
    case 'tag':
      return row.tag;
    case 'bus':
      return row.bus;
    case 'kind':
      return row.kind;
    case 'description':
      return row.description ?? null;
    case 'to_bus':
      return row.to_bus ?? null;
    default:
      return row.values[key] ?? null;
  }
}

export function formatOther(pairs: ReadonlyArray<[string, string | number]>): string {
  return pairs.map(([k, v]) => `${k}=${v}`).join('; ');
}

/** Formulas of one shunt item in case k. */
function shuntFormulas(
  row: EquipmentRow,
  at: (key: TextColumn | NumericColumn) => string,
  n: string,
  x: string,
): { p?: string; q: string } {
  const off = `OR(${n}=0,${x}=0)`;
  const hz = settingRef('hz');
  const guard = (body: string) => `=IF(${off},0,${body})`;
  switch (row.kind) {
    case 'motor':
      return {
        p: guard(`${n}*KW.MOTOR(${at('p_kw')},${at('eff')},${x})`),
        q: guard(`${n}*KVAR.MOTOR(${at('p_kw')},${at('eff')},${at('cos_phi')},${x},${at('i0_pct')})`),
      };
    case 'load':
      return {
        p: guard(`${n}*${at('p_kw')}*${x}`),
        q: guard(`${n}*KVAR.LOAD(${at('p_kw')}*${x},${at('cos_phi')})`),
      };
    case 'generator':
      // Delivered active power counts negative; KVAR.GEN already gives delivered kvar as negative.
      return {
        p: guard(`-${n}*${at('p_kw')}*${x}`),
        q: guard(`${n}*KVAR.GEN(${at('p_kw')}*${x},${at('cos_phi')})`),
      };
    case 'cable':
      return { q: guard(`${n}*KVAR.CABLE(${at('u_kv')},${at('c_uf_km')},${at('len_km')},${hz})`) };
    case 'capacitor':
      // Nameplate at the site frequency: rated and operating frequency are both the site's.
      return {
        q: guard(
          `${n}*${x}*KVAR.CAPBANK(${at('q_kvar')},${at('u_rated_kv')},${at('u_kv')},${at('p_pct')},${hz},${hz})`,
        ),
      };
    case 'reactor':
      return { q: guard(`${n}*${x}*KVAR.REACTOR(${at('q_kvar')},${at('u_rated_kv')},${at('u_kv')})`) };
    default:
      return { q: '=0' };
  }
}

export function buildEquipmentSheet(plan: EquipmentSheetPlan, ctx: EquipmentContext): SheetDoc {
  const { layout, cols, rows } = plan;
  const header: CellContent[] = cols.columns.map((c) => c.header);
  const cells: CellContent[][] = [header];
  rows.forEach((row, i) => {
    const r = i + 1;
    const out: CellContent[] = new Array<CellContent>(cols.columns.length).fill(null);
    const here = (col: number) => cell(r, col);
    const at = (key: TextColumn | NumericColumn): string => {
      const col = cols.input.get(key);
      if (col === undefined) throw new Error(`sheet ${layout.sheet} has no ${key} column`);
      return here(col);
    };
    for (const [key, col] of cols.input) out[col] = inputValue(row, key);
    if (cols.loadDefault !== undefined) out[cols.loadDefault] = row.values.load ?? null;
    cols.loadCase?.forEach((col, k) => (out[col] = row.loads[ctx.cases[k] as string] ?? null));
    if (cols.other !== undefined) {
      const pairs = otherValues(layout, row);
      out[cols.other] = pairs.length > 0 ? formatOther(pairs) : null;
    }
    const qty = at('qty');
    const running = at('running');
    const units = `IF(ISBLANK(${running}),IF(ISBLANK(${qty}),1,${qty}),${running})`;
    const n = here(cols.inService);
    if (layout.role === 'shunt') {
      out[cols.inService] = `=${units}`;
      ctx.cases.forEach((_, k) => {
        const own = here((cols.loadCase as readonly number[])[k] as number);
        const dflt = here(cols.loadDefault as number);
        const xCol = (cols.loadUsed as readonly number[])[k] as number;
        out[xCol] = `=IF(ISBLANK(${own}),IF(ISBLANK(${dflt}),1,${dflt}),${own})`;
        const f = shuntFormulas(row, at, n, here(xCol));
        if (cols.p) out[cols.p[k] as number] = f.p ?? '=0';
        out[(cols.q as readonly number[])[k] as number] = f.q;
      });
      if (cols.plainCap !== undefined) {
        // What a capacitor without a detuning reactor delivers with every unit in, whatever the
        // case: the capacitance the supply sees at harmonics (the Compensation sheet's resonance).
        const hz = settingRef('hz');
        out[cols.plainCap] =
          row.kind === 'capacitor'
            ? `=IF(N(${at('p_pct')})>0,0,-${n}*KVAR.CAPBANK(${at('q_kvar')},${at('u_rated_kv')},${at('u_kv')},${at('p_pct')},${hz},${hz}))`
            : '=0';
      }
    } else {
      // At least one unit carries the bus it feeds, whatever `running` says.
      out[cols.inService] = `=MAX(1,${units})`;
      branchFormulas(row, out, r, cols, ctx, n, at);
    }
    cells.push(out);
  });
  return { name: layout.sheet, cells, columns: cols.columns, purpose: layout.purpose };
}

function branchFormulas(
  row: EquipmentRow,
  out: CellContent[],
  r: number,
  cols: SheetColumns,
  ctx: EquipmentContext,
  n: string,
  at: (key: TextColumn | NumericColumn) => string,
): void {
  const hz = settingRef('hz');
  const qDel = cols.qDelivered;
  // Not a branch (it feeds no known bus): it carries nothing and is in no bus total.
  if (!row.to_bus || ctx.busApparentPower(row.to_bus, 0) === undefined) return;
  if (row.kind === 'line' && qDel !== undefined) {
    out[qDel] = `=-${n}*KVAR.LINE(${at('u_kv')},0,${at('l_mh_km')},${at('c_nf_km')},${at('len_km')},${hz})`;
  }
  ctx.cases.forEach((_, k) => {
    const s = ctx.busApparentPower(row.to_bus as string, k) as string;
    const sCol = (cols.sCarried as readonly number[])[k] as number;
    out[sCol] = `=${s}`;
    const sUnit = `${cell(r, sCol)}/${n}`;
    if (row.kind === 'transformer') {
      out[(cols.loading as readonly number[])[k] as number] = `=100*${sUnit}/${at('s_kva')}`;
      out[(cols.pLoss as readonly number[])[k] as number] =
        `=${n}*KW.XFMR.LOSS(${at('s_kva')},${at('p0_kw')},${at('pk_kw')},${sUnit})`;
      out[(cols.qLoss as readonly number[])[k] as number] =
        `=${n}*(KVAR.XFMR.MAG(${at('s_kva')},${at('i0_pct')},${at('p0_kw')})+KVAR.XFMR.LEAK(${at('s_kva')},${at('uk_pct')},${sUnit},${at('pk_kw')}))`;
    } else if (qDel !== undefined) {
      // Series absorption = net line kvar at this loading + the charging it offsets.
      out[(cols.qAbsorbed as readonly number[])[k] as number] =
        `=${n}*KVAR.LINE(${at('u_kv')},${sUnit},${at('l_mh_km')},${at('c_nf_km')},${at('len_km')},${hz})+${cell(r, qDel)}`;
    }
  });
}
