// The Buses sheet: one row per bus (the point of connection first, then level by level), per
// case ΣP, ΣQ with absorbed and delivered apart, S, cos φ, tan φ and the sense; then the items
// connected to the bus itself. A bus's total = its own items + for every transformer or line it
// feeds: the total of the bus fed + that branch's losses at that loading. The branches are
// referenced cell by cell, so there is no circular reference. The own items are summed by bus
// name: in the 'live' flavour by one BUS.SUMS call per bus over the block of rows kept together
// for that bus (an edit then reaches that bus and the buses above it only), in the 'portable'
// flavour by SUMIF/SUMIFS over whole columns (classic functions any program knows; a row added
// at the bottom in another program still counts).
import type { CellContent, ColumnInfo, SheetDoc } from './document.ts';
import { FORMATS, SHEETS } from './buildLayout.ts';
import type { EquipmentSheetPlan } from './buildEquipment.ts';
import {
  absCell,
  cell,
  cellOn,
  columnLetters,
  columnOn,
  rangeOn,
  sheetPrefix,
  textLiteral,
} from './buildRefs.ts';

export type Flavour = 'live' | 'portable';

export interface BusColumns {
  readonly bus: 0;
  readonly level: 1;
  readonly fedBy: 2;
  readonly upstream: 3;
  readonly u: 4;
  /** Per case. */
  readonly p: readonly number[];
  readonly q: readonly number[];
  readonly qAbs: readonly number[];
  readonly qDel: readonly number[];
  readonly s: readonly number[];
  readonly cos: readonly number[];
  readonly tan: readonly number[];
  readonly sense: readonly number[];
  /** Items connected to the bus itself, per case. */
  readonly pOwn: readonly number[];
  readonly qAbsOwn: readonly number[];
  readonly qDelOwn: readonly number[];
  readonly qOwn: readonly number[];
  readonly columns: readonly ColumnInfo[];
}

export function planBusColumns(cases: readonly string[]): BusColumns {
  const columns: ColumnInfo[] = [
    { header: 'Bus', width: 14 },
    { header: 'Level', format: FORMATS.count, width: 6 },
    { header: 'Fed by', width: 12 },
    { header: 'Upstream bus', width: 14 },
    { header: 'U (kV)', format: '0.0##', width: 8, computed: true },
  ];
  const add = (header: string, format: string | undefined, width: number) =>
    columns.push({
      header,
      ...(format ? { format } : {}),
      width: Math.max(width, header.length + 1),
      computed: true,
    }) - 1;
  const p: number[] = [],
    q: number[] = [],
    qAbs: number[] = [],
    qDel: number[] = [],
    s: number[] = [],
    cos: number[] = [],
    tan: number[] = [],
    sense: number[] = [];
  for (const c of cases) {
    p.push(add(`P ${c} (kW)`, FORMATS.kw, 10));
    q.push(add(`Q ${c} (kvar)`, FORMATS.kvar, 10));
    qAbs.push(add(`Q absorbed ${c} (kvar)`, FORMATS.kvar, 10));
    qDel.push(add(`Q delivered ${c} (kvar)`, FORMATS.kvar, 10));
    s.push(add(`S ${c} (kVA)`, FORMATS.kva, 10));
    cos.push(add(`cos φ ${c}`, FORMATS.pf, 8));
    tan.push(add(`tan φ ${c}`, FORMATS.pf, 8));
    sense.push(add(`Sense ${c}`, undefined, 9));
  }
  // Own items: P per case, then absorbed/delivered pairs (one spilled block in 'live'), then net Q.
  const pOwn = cases.map((c) => add(`P own items ${c} (kW)`, FORMATS.kw, 10));
  const qAbsOwn: number[] = [],
    qDelOwn: number[] = [];
  for (const c of cases) {
    qAbsOwn.push(add(`Q absorbed own items ${c} (kvar)`, FORMATS.kvar, 10));
    qDelOwn.push(add(`Q delivered own items ${c} (kvar)`, FORMATS.kvar, 10));
  }
  const qOwn = cases.map((c) => add(`Q own items ${c} (kvar)`, FORMATS.kvar, 10));
  return {
    bus: 0,
    level: 1,
    fedBy: 2,
    upstream: 3,
    u: 4,
    p,
    q,
    qAbs,
    qDel,
    s,
    cos,
    tan,
    sense,
    pOwn,
    qAbsOwn,
    qDelOwn,
    qOwn,
    columns,
  };
}

export interface BusEntry {
  readonly name: string;
  readonly level?: number;
  readonly fedBy?: string;
  readonly upstream?: string;
  /** Reference to the input cell that states the bus voltage. */
  readonly uRef?: string;
}

/** A transformer or line leaving a bus: where its row sits and which bus it feeds. */
export interface BranchRef {
  readonly plan: EquipmentSheetPlan;
  /** 0-based row in cells. */
  readonly row: number;
  readonly toBus: string;
}

export interface BusSheetInput {
  readonly cases: readonly string[];
  readonly buses: readonly BusEntry[];
  readonly cols: BusColumns;
  readonly plans: readonly EquipmentSheetPlan[];
  readonly branchesFrom: ReadonlyMap<string, readonly BranchRef[]>;
  readonly flavour: Flavour;
}

/**
 * SUMIF criterion for a bus: the name cell, or an exact-match text when the name holds pattern
 * characters (* ? ~). Undefined for a name starting with < > or =, which conditional sums read
 * as a comparison in one program or another: such a bus sums its own block of rows instead.
 */
export function criterion(name: string, nameCell: string): string | undefined {
  if (/^[<>=]/.test(name)) return undefined;
  if (/^[A-Za-z0-9 _.\-/]+$/.test(name)) return nameCell;
  return textLiteral('=' + name.replace(/[~*?]/g, (c) => '~' + c));
}

/** Rows and columns of the shunt sheets that feed per-bus sums. */
function shuntBlocks(plans: readonly EquipmentSheetPlan[], which: 'p' | 'q') {
  return plans
    .filter((pl) => pl.layout.role === 'shunt' && pl.rows.length > 0 && pl.cols[which] !== undefined)
    .map((pl) => ({
      sheet: pl.layout.sheet,
      blocks: pl.blocks,
      busCol: pl.cols.input.get('bus') as number,
      cols: pl.cols[which] as readonly number[],
    }));
}

/**
 * 'portable': one bus's own items in case k as classic conditional sums over whole columns
 * (a row a colleague adds at the bottom in another program still counts); `positive` keeps
 * the positive values only. A bus whose name cannot be a criterion sums its own rows instead.
 */
function portableSum(
  blocks: ReturnType<typeof shuntBlocks>,
  k: number,
  bus: string,
  nameCell: string,
  positive: boolean,
): string {
  const crit = criterion(bus, nameCell);
  const parts = blocks.flatMap((bl) => {
    const col = bl.cols[k] as number;
    if (crit === undefined) {
      const own = bl.blocks.get(bus);
      if (!own) return [];
      const vals = rangeOn(bl.sheet, own.first, col, own.last, col);
      return [positive ? `SUMIF(${vals},">0")` : `SUM(${vals})`];
    }
    const keys = columnOn(bl.sheet, bl.busCol);
    const vals = columnOn(bl.sheet, col);
    return [positive ? `SUMIFS(${vals},${keys},${crit},${vals},">0")` : `SUMIF(${keys},${crit},${vals})`];
  });
  return parts.length === 0 ? '0' : parts.join('+');
}

export function buildBusesSheet(input: BusSheetInput): SheetDoc {
  const { cases, buses, cols, plans, branchesFrom, flavour } = input;
  const cells: CellContent[][] = [cols.columns.map((c) => c.header)];
  const rowOf = new Map(buses.map((b, i) => [b.name, i + 1]));
  const pBlocks = shuntBlocks(plans, 'p');
  const qBlocks = shuntBlocks(plans, 'q');

  buses.forEach((b, i) => {
    const r = i + 1;
    const out: CellContent[] = new Array<CellContent>(cols.columns.length).fill(null);
    out[cols.bus] = b.name;
    out[cols.level] = b.level ?? null;
    out[cols.fedBy] = b.fedBy ?? null;
    out[cols.upstream] = b.upstream ?? null;
    out[cols.u] = b.uRef !== undefined ? `=${b.uRef}` : null;
    const here = (col: number) => cell(r, col);
    cases.forEach((_, k) => {
      const P = here(cols.p[k] as number),
        Q = here(cols.q[k] as number),
        S = here(cols.s[k] as number);
      const terms = {
        p: [here(cols.pOwn[k] as number)],
        abs: [here(cols.qAbsOwn[k] as number)],
        del: [here(cols.qDelOwn[k] as number)],
      };
      for (const br of branchesFrom.get(b.name) ?? []) {
        const to = rowOf.get(br.toBus);
        if (to === undefined) continue;
        const child = (c: readonly number[]) => cell(to, c[k] as number);
        const on = (c: number) => cellOn(br.plan.layout.sheet, br.row, c, true);
        const bc = br.plan.cols;
        if (bc.pLoss && bc.qLoss) {
          terms.p.push(`(${child(cols.p)}+${on(bc.pLoss[k] as number)})`);
          terms.abs.push(`(${child(cols.qAbs)}+${on(bc.qLoss[k] as number)})`);
          terms.del.push(child(cols.qDel));
        } else if (bc.qAbsorbed && bc.qDelivered !== undefined) {
          terms.p.push(child(cols.p));
          terms.abs.push(`(${child(cols.qAbs)}+${on(bc.qAbsorbed[k] as number)})`);
          terms.del.push(`(${child(cols.qDel)}+${on(bc.qDelivered)})`);
        }
      }
      out[cols.p[k] as number] = '=' + terms.p.join('+');
      out[cols.qAbs[k] as number] = '=' + terms.abs.join('+');
      out[cols.qDel[k] as number] = '=' + terms.del.join('+');
      out[cols.q[k] as number] = `=${here(cols.qAbs[k] as number)}-${here(cols.qDel[k] as number)}`;
      out[cols.s[k] as number] = `=KVA.TOTAL(${P},${Q})`;
      out[cols.cos[k] as number] = `=IF(${S}=0,"",COSPHI(${P},${Q}))`;
      out[cols.tan[k] as number] = `=IF(${P}=0,"",TANPHI(${P},${Q}))`;
      out[cols.sense[k] as number] = `=IF(${Q}>0,"lagging",IF(${Q}<0,"leading","unity"))`;
      out[cols.qOwn[k] as number] = `=${here(cols.qAbsOwn[k] as number)}-${here(cols.qDelOwn[k] as number)}`;
      if (flavour === 'portable') {
        const nameCell = `$${cell(r, cols.bus)}`;
        out[cols.pOwn[k] as number] = `=${portableSum(pBlocks, k, b.name, nameCell, false)}`;
        out[cols.qAbsOwn[k] as number] = `=${portableSum(qBlocks, k, b.name, nameCell, true)}`;
        // Delivered = absorbed − net: the net SUMIF passes on an error value where SUMIFS would skip it.
        out[cols.qDelOwn[k] as number] =
          `=${here(cols.qAbsOwn[k] as number)}-(${portableSum(qBlocks, k, b.name, nameCell, false)})`;
      }
    });
    cells.push(out);
  });
  if (flavour === 'live')
    buses.forEach((b, i) => writeLiveSums(cells[i + 1] as CellContent[], cols, i + 1, b.name, plans));
  return {
    name: SHEETS.buses,
    cells,
    columns: cols.columns,
    purpose:
      "Every bus in every case: what it draws from upstream (own items, plus each bus it feeds and that transformer's or line's losses), S, cos φ, tan φ; the point of connection is the first row." +
      (flavour === 'live'
        ? ' Each bus sums the rows kept together for it on the equipment sheets: after adding, removing or moving items between buses, rebuild the workbook (the Site sheet counts the rows added since).'
        : ''),
  };
}

/**
 * The bus's own items in 'live': one BUS.SUMS call for P per case and one BUS.SUMS.SPLIT call
 * for absorbed/delivered kvar per case, each over this bus's block of rows on every sheet. One
 * call per case, not one for all cases: an edit in one case then reaches only that case's
 * totals and what hangs on them (with banks on most buses, half the cells to revisit).
 */
function writeLiveSums(
  row: CellContent[],
  cols: BusColumns,
  r: number,
  bus: string,
  plans: readonly EquipmentSheetPlan[],
): void {
  const pairs = (which: 'p' | 'q', k: number) =>
    plans.flatMap((pl) => {
      const block = pl.blocks.get(bus);
      const vc = pl.cols[which];
      if (pl.layout.role !== 'shunt' || !block || !vc) return [];
      const busCol = pl.cols.input.get('bus') as number;
      const c = vc[k] as number;
      return [
        `${rangeOn(pl.layout.sheet, block.first, busCol, block.last, busCol)},${rangeOn(pl.layout.sheet, block.first, c, block.last, c)}`,
      ];
    });
  const me = absCell(r, cols.bus);
  cols.pOwn.forEach((col, k) => {
    const p = pairs('p', k);
    row[col] = p.length > 0 ? `=BUS.SUMS(${me},${p.join(',')})` : '=0';
    const q = pairs('q', k);
    if (q.length > 0) row[cols.qAbsOwn[k] as number] = `=BUS.SUMS.SPLIT(${me},${q.join(',')})`;
    else for (const c of [cols.qAbsOwn[k] as number, cols.qDelOwn[k] as number]) row[c] = '=0';
  });
}

export const LAYOUT_CHECK_LABEL = 'Rows added or removed since this layout was built';

/**
 * A Site sheet row for the 'live' flavour: how many equipment rows were added or removed on the
 * shunt sheets since the workbook was built. Not 0 → rebuild so every bus sums all its rows.
 */
export function layoutCheckRow(plans: readonly EquipmentSheetPlan[]): CellContent[] {
  const shunt = plans.filter((pl) => pl.layout.role === 'shunt');
  const tagCol = (pl: EquipmentSheetPlan) => columnLetters(pl.cols.input.get('tag') as number);
  const counts = shunt
    .map((pl) => `COUNTA(${sheetPrefix(pl.layout.sheet)}$${tagCol(pl)}:$${tagCol(pl)})`)
    .join('+');
  const built = shunt.reduce((n, pl) => n + pl.rows.filter((r) => r.tag !== '').length + 1, 0);
  return [
    LAYOUT_CHECK_LABEL,
    `=${counts}-${built}`,
    null,
    'Each bus sums the rows kept together for it on the equipment sheets: when this is not 0, rebuild the workbook so new or moved items count.',
  ];
}
