// The Buses sheet: one row per bus (the point of connection first, then level by level). A bus's
// total is its own items plus, for every transformer or line it feeds, the total of the bus fed
// and that branch's losses, before compensation and after it (each bank's output and reactor on
// its bus, the branches' losses at the compensated loading). Branches are referenced cell by
// cell, so there is no circular reference.
import type { CellContent } from './document.ts';
import type { BusColumns } from './busColumns.ts';
import type { CompensationColumns } from './compensationColumns.ts';
import { ownSum, nameCellOf, type Flavour, type BusRowIndex } from './busSums.ts';
import { SHEETS } from './layout.ts';
import { cell, cellOn } from './refs.ts';
import type { BusInfo, WorkbookStructure } from './structure.ts';
import { busKey } from '../site/busNames.ts';
import { textContent } from '../text/cellText.ts';

export interface BusesInput {
  readonly s: WorkbookStructure;
  readonly cols: BusColumns;
  readonly comp: CompensationColumns;
  readonly flavour: Flavour;
  readonly busRows: BusRowIndex;
}

/** The own-items sums of bus i: [column, formula] on the Buses sheet. */
export function ownSumCells(input: BusesInput, i: number): Array<readonly [number, string]> {
  const { s, cols, flavour, busRows } = input;
  const b = s.buses[i] as BusInfo;
  const r = i + 1;
  const bus = { name: b.name, nameCell: nameCellOf(r) };
  const out: Array<readonly [number, string]> = [];
  s.cases.forEach((_, k) => {
    out.push([cols.pOwn[k] as number, ownSum(s, busRows, flavour, bus, (c) => c.p?.[k], 'all')]);
    out.push([cols.qAbsOwn[k] as number, ownSum(s, busRows, flavour, bus, (c) => c.q?.[k], 'absorbed')]);
    const absorbed = cell(r, cols.qAbsOwn[k] as number);
    out.push([
      cols.qDelOwn[k] as number,
      ownSum(s, busRows, flavour, bus, (c) => c.q?.[k], 'delivered', absorbed),
    ]);
  });
  return out;
}

/** Each bus's buses fed through a transformer or line (indices into s.buses), by bus key. */
export function fedBuses(s: WorkbookStructure): Map<string, number[]> {
  const out = new Map<string, number[]>();
  s.buses.forEach((b, j) => {
    if (!b.feeder || b.upstream === undefined) return;
    const key = busKey(b.upstream);
    out.set(key, [...(out.get(key) ?? []), j]);
  });
  return out;
}

export function renderBusesSheet(input: BusesInput): CellContent[][] {
  const { s, cols, comp } = input;
  const cells: CellContent[][] = [cols.columns.map((c) => c.header)];
  const children = fedBuses(s);
  s.buses.forEach((b, i) => {
    const r = i + 1;
    const out: CellContent[] = new Array<CellContent>(cols.columns.length).fill(null);
    const here = (col: number) => cell(r, col);
    out[cols.bus] = textContent(b.name);
    out[cols.level] = b.level ?? null;
    if (b.feeder) {
      const f = s.sheets[b.feeder.sheet];
      const tagCol = f?.cols.input.get('tag');
      if (f && tagCol !== undefined)
        out[cols.fedBy] = `=${cellOn(f.cols.sheet.name, b.feeder.row, tagCol, true)}`;
    }
    out[cols.upstream] = b.upstream === undefined ? null : textContent(b.upstream);
    if (b.voltage) {
      const v = s.sheets[b.voltage.sheet];
      const uCol = v?.cols.input.get('u_kv');
      if (v && uCol !== undefined) out[cols.u] = `=${cellOn(v.cols.sheet.name, b.voltage.row, uCol, true)}`;
    }
    s.cases.forEach((_, k) => {
      const before = {
        p: [here(cols.pOwn[k] as number)],
        abs: [here(cols.qAbsOwn[k] as number)],
        del: [here(cols.qDelOwn[k] as number)],
      };
      const compOut = cellOn(SHEETS.compensation, r, comp.capOut[k] as number, true);
      const compReactor = cellOn(SHEETS.compensation, r, comp.reactorIn[k] as number, true);
      const after = {
        p: [here(cols.pOwn[k] as number)],
        abs: [here(cols.qAbsOwn[k] as number), compReactor],
        del: [here(cols.qDelOwn[k] as number), compOut],
      };
      for (const j of children.get(b.key) ?? []) {
        const child = s.buses[j] as BusInfo;
        const f = s.sheets[(child.feeder as { sheet: number }).sheet];
        if (!f) continue;
        const row = (child.feeder as { row: number }).row;
        const on = (c: number | undefined) =>
          c === undefined ? undefined : cellOn(f.cols.sheet.name, row, c, true);
        const cr = j + 1;
        const term = (childCol: readonly number[], branch: string | undefined) =>
          branch === undefined
            ? cell(cr, childCol[k] as number)
            : `(${cell(cr, childCol[k] as number)}+${branch})`;
        before.p.push(term(cols.p, on(f.cols.pLoss?.[k])));
        before.abs.push(term(cols.qAbs, on(f.cols.qLoss?.[k])));
        before.del.push(term(cols.qDel, on(f.cols.qCharging)));
        after.p.push(term(cols.pAfter, on(f.cols.pLossAfter?.[k])));
        after.abs.push(term(cols.qAbsAfter, on(f.cols.qLossAfter?.[k])));
        after.del.push(term(cols.qDelAfter, on(f.cols.qCharging)));
      }
      const P = here(cols.p[k] as number),
        Q = here(cols.q[k] as number),
        S = here(cols.s[k] as number);
      out[cols.p[k] as number] = '=' + before.p.join('+');
      out[cols.qAbs[k] as number] = '=' + before.abs.join('+');
      out[cols.qDel[k] as number] = '=' + before.del.join('+');
      out[cols.q[k] as number] = `=${here(cols.qAbs[k] as number)}-${here(cols.qDel[k] as number)}`;
      out[cols.s[k] as number] = `=KVA.TOTAL(${P},${Q})`;
      out[cols.cos[k] as number] = `=IF(${S}=0,"",COSPHI(${P},${Q}))`;
      out[cols.tan[k] as number] = `=IF(${P}=0,"",TANPHI(${P},${Q}))`;
      out[cols.sense[k] as number] = `=IF(${Q}>0,"lagging",IF(${Q}<0,"leading","unity"))`;
      const PA = here(cols.pAfter[k] as number),
        QA = here(cols.qAfter[k] as number),
        SA = here(cols.sAfter[k] as number);
      out[cols.pAfter[k] as number] = '=' + after.p.join('+');
      out[cols.qAbsAfter[k] as number] = '=' + after.abs.join('+');
      out[cols.qDelAfter[k] as number] = '=' + after.del.join('+');
      out[cols.qAfter[k] as number] =
        `=${here(cols.qAbsAfter[k] as number)}-${here(cols.qDelAfter[k] as number)}`;
      out[cols.sAfter[k] as number] = `=KVA.TOTAL(${PA},${QA})`;
      out[cols.cosAfter[k] as number] = `=IF(${SA}=0,"",COSPHI(${PA},${QA}))`;
      out[cols.tanAfter[k] as number] = `=IF(${PA}=0,"",TANPHI(${PA},${QA}))`;
      out[cols.qOwn[k] as number] = `=${here(cols.qAbsOwn[k] as number)}-${here(cols.qDelOwn[k] as number)}`;
    });
    for (const [c, f] of ownSumCells(input, i)) out[c] = f;
    cells.push(out);
  });
  return cells;
}

export const BUSES_PURPOSE =
  "Every bus in every case, before and after compensation: what it draws from upstream (its own items, plus each bus it feeds and that transformer's or line's losses), S, cos φ, tan φ. After compensation each bank's output and reactor sit on their bus and the losses are taken at the compensated loading. The point of connection is the first row.";
