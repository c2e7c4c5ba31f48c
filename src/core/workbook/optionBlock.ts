// One option's block on the Design options sheet, as plain formulas. Per bus, on its bus line:
// the bank typed for the option, what it does per case by the one rule for after compensation
// (compensate.ts, as the Compensation sheet writes it: each bank in service covers the same share
// of its size of the need at the point of connection before compensation, in whole steps; a
// reactor where the site would still lead beyond the limit), and the option's roll-up after it
// (as the Buses sheet's after columns: own items, the bank and reactor, each bus fed and its
// feeder's losses, taken here at the option's own loading by the feeder's physics). Below each bus
// line the Quantities sheet's item lines read the option's bank; then the cost summary, the
// saving over the option's flows at the point of connection, and whether it meets the
// requirement in every case.
import { WITHIN_TOL_KVAR } from '../site/tolerance.ts';
import { textContent } from '../text/cellText.ts';
import type { BusColumns } from './busColumns.ts';
import type { CompensationColumns } from './compensationColumns.ts';
import type { CellContent, CellMark } from './document.ts';
import { SHEETS } from './layout.ts';
import type { OptionInputs } from './optionInputs.ts';
import { MET_LABEL, TITLE, optionLabel, type OptionColumns } from './optionsLayout.ts';
import { QC, SLOTS, busLineRow, savingCaseRow, slotRow, summaryRowOf } from './quantitiesLayout.ts';
import { controllerStepsFormula } from './renderCompensation.ts';
import { fedBuses } from './renderBuses.ts';
import { branchLossesFrom } from './renderEquipment.ts';
import { bankLine, costSummary, itemLines } from './renderQuantities.ts';
import { savingRows } from './renderSaving.ts';
import { absCell, cell, cellOn, rangeOn } from './refs.ts';
import { settingRef } from './settingsLayout.ts';
import type { BusInfo, WorkbookStructure } from './structure.ts';

export interface BlockInput {
  readonly s: WorkbookStructure;
  readonly cols: OptionColumns;
  readonly busCols: BusColumns;
  readonly comp: CompensationColumns;
  readonly hasRates: boolean;
  readonly hasTariff: boolean;
}

/** The active power the requirement's limits apply to at the point of connection (requirement.ts). */
function referred(p: string): string {
  const ref = settingRef('refKw');
  return `IF(ISBLANK(${ref}),ABS(${p}),${ref})`;
}

interface Place {
  readonly input: BlockInput;
  readonly origin: number;
  readonly fed: Map<string, number[]>;
}

/** Bus i's bus line: the Quantities bus line over the option's inputs, then the bank's cases and roll-up. */
function busLine(p: Place, i: number, typed: OptionInputs): { line: CellContent[]; marks: CellMark[] } {
  const { s, cols, busCols, comp } = p.input;
  const n = s.buses.length;
  const b = s.buses[i] as BusInfo;
  const r = busLineRow(i, p.origin);
  const here = (col: number) => cell(r, col);
  const inp = (key: keyof OptionColumns['input']) => here(cols.input[key]);
  const line = new Array<CellContent>(cols.columns.length).fill(null);
  bankLine({
    row: r,
    lastRow: slotRow(i, SLOTS[SLOTS.length - 1] as (typeof SLOTS)[number], p.origin),
    busName: textContent(b.name),
    u: cellOn(SHEETS.buses, i + 1, busCols.u, true),
    inp,
  }).forEach((v, c) => (line[c] = v));
  const values = typed.banks.get(b.key);
  for (const [c, v] of values ?? []) line[c] = v;
  const marks = (typed.marks.get(b.key) ?? []).map((m) => ({ ...m, row: r }));

  const [fixed, step, reactor] = [inp('fixed_kvar'), inp('step_kvar'), inp('reactor_kvar')];
  const ctrl = here(cols.controllerSteps);
  const total = here(cols.bankTotal);
  line[cols.controllerSteps] = controllerStepsFormula(inp('series'), inp('steps'));
  line[cols.bankTotal] = `=${fixed}+${step}*${ctrl}`;
  const lastBlockRow = busLineRow(n, p.origin) - 1;
  const bus = (col: number) => cellOn(SHEETS.buses, i + 1, col, true);
  s.cases.forEach((_, k) => {
    const col = (key: keyof OptionColumns['perCase']) => cols.perCase[key][k] as number;
    const at = (key: keyof OptionColumns['perCase']) => here(col(key));
    const avail = at('available');
    line[col('available')] = b.soleMotor ? `=IF(${bus(busCols.p[k] as number)}=0,0,${total})` : `=${total}`;
    const availSum = `SUM(${rangeOn(undefined, p.origin, col('available'), lastBlockRow, col('available'))})`;
    const need = cellOn(SHEETS.compensation, 1, comp.needCap[k] as number, true);
    const share = `${need}*${total}/${availSum}`;
    line[col('stepsIn')] =
      `=IF(OR(${step}=0,${ctrl}=0,${avail}=0),0,MIN(${ctrl},BANK.ROUNDUP(${share}-${fixed},${step})/${step}))`;
    line[col('capOut')] = `=IF(${avail}=0,0,${fixed}+${step}*${at('stepsIn')})`;
    const needInd = absCell(savingCaseRow(n, k, p.origin), cols.root.needInd);
    line[col('reactorIn')] = `=IF(AND(${reactor}>0,${needInd}>${WITHIN_TOL_KVAR}),${reactor},0)`;
    // The roll-up after, term by term as the Buses sheet's after columns.
    const P = [bus(busCols.pOwn[k] as number)];
    const abs = [bus(busCols.qAbsOwn[k] as number), at('reactorIn')];
    const del = [bus(busCols.qDelOwn[k] as number), at('capOut')];
    for (const j of p.fed.get(b.key) ?? []) {
      const child = s.buses[j] as BusInfo;
      const f = s.sheets[(child.feeder as { sheet: number }).sheet];
      if (!f) continue;
      const cr = busLineRow(j, p.origin);
      const term = (key: keyof OptionColumns['perCase'], loss: string | undefined) =>
        loss === undefined ? cell(cr, col(key)) : `(${cell(cr, col(key))}+${loss})`;
      const charging =
        f.cols.qCharging === undefined
          ? undefined
          : cellOn(f.cols.sheet.name, (child.feeder as { row: number }).row, f.cols.qCharging, true);
      P.push(term('pAfter', f.cols.pLossAfter ? cell(cr, col('feederP')) : undefined));
      abs.push(term('qAbsAfter', cell(cr, col('feederQ'))));
      del.push(term('qDelAfter', charging));
    }
    line[col('pAfter')] = '=' + P.join('+');
    line[col('qAbsAfter')] = '=' + abs.join('+');
    line[col('qDelAfter')] = '=' + del.join('+');
    line[col('sAfter')] = `=KVA.TOTAL(${at('pAfter')},${at('qAbsAfter')}-${at('qDelAfter')})`;
    if (b.feeder) {
      const f = s.sheets[b.feeder.sheet];
      if (f) {
        const [pl, ql] = branchLossesFrom(f.cols, b.feeder.row, f.rows[b.feeder.row - 1]?.kind, at('sAfter'));
        line[col('feederP')] = `=${pl}`;
        line[col('feederQ')] = `=${ql}`;
      }
    }
  });
  return { line, marks };
}

/** The point of connection after the option, per case, on the saving block's case lines. */
function rootCells(p: Place, line: CellContent[], k: number): void {
  const { s, cols, busCols } = p.input;
  const n = s.buses.length;
  const r = savingCaseRow(n, k, p.origin);
  const rootLine = busLineRow(0, p.origin);
  const per = (key: keyof OptionColumns['perCase']) => absCell(rootLine, cols.perCase[key][k] as number);
  const [PA, QA] = [cell(r, cols.root.p), cell(r, cols.root.q)];
  line[cols.root.p] = `=${per('pAfter')}`;
  line[cols.root.q] = `=${per('qAbsAfter')}-${per('qDelAfter')}`;
  line[cols.root.cos] = `=IF(KVA.TOTAL(${PA},${QA})=0,"",COSPHI(${PA},${QA}))`;
  const before = (c: readonly number[]) => cellOn(SHEETS.buses, 1, c[k] as number, true);
  const outs = rangeOn(
    undefined,
    p.origin,
    cols.perCase.capOut[k] as number,
    busLineRow(n, p.origin) - 1,
    cols.perCase.capOut[k] as number,
  );
  const [lag, lead] = [settingRef('lagInUse'), settingRef('leadInUse')];
  // A blank leading limit (cos φ lagging only) never asks for inductive kvar.
  line[cols.root.needInd] =
    `=IF(${lead}="",0,MAX(0,-KVAR.TOTAN(${referred(before(busCols.p))},${before(busCols.q)}-SUM(${outs}),-${lead})))`;
  line[cols.root.within] =
    `=IF(AND(KVAR.TOTAN(${referred(PA)},${QA},${lag})<=${WITHIN_TOL_KVAR},IF(${lead}="",TRUE(),-KVAR.TOTAN(${referred(PA)},${QA},-${lead})<=${WITHIN_TOL_KVAR})),"yes","no")`;
}

/** Option j's block: title line, then everything below it, from row `title`. */
export function renderBlock(
  input: BlockInput,
  j: number,
  title: number,
  typed: OptionInputs,
): { rows: CellContent[][]; marks: CellMark[] } {
  const { s, cols } = input;
  const width = cols.columns.length;
  const n = s.buses.length;
  const origin = title + 1;
  const p: Place = { input, origin, fed: fedBuses(s) };
  const wide = (r: readonly CellContent[]) => {
    const out = new Array<CellContent>(width).fill(null);
    r.forEach((v, c) => (out[c] = v));
    return out;
  };
  const head = new Array<CellContent>(width).fill(null);
  head[TITLE.name] = typed.name;
  head[TITLE.label] = optionLabel(j);
  head[TITLE.what] = typed.what;
  const rows: CellContent[][] = [head];
  const marks: CellMark[] = [];
  const currency = absCell(summaryRowOf(n, 'Currency', origin), QC.cost);
  for (let i = 0; i < n; i++) {
    const bl = busLine(p, i, typed);
    rows.push(bl.line);
    marks.push(...bl.marks);
    rows.push(...itemLines(input, i, currency, origin).map(wide));
  }
  rows.push(...costSummary(input, n, origin).map(wide));
  // The saving reads the option's P and Q after at the connection from its own case lines.
  const saving = savingRows(n, s.cases, input.hasTariff, {
    origin,
    after: (k) => [
      cell(savingCaseRow(n, k, origin), cols.root.p),
      cell(savingCaseRow(n, k, origin), cols.root.q),
    ],
  }).map(wide);
  s.cases.forEach((_, k) => rootCells(p, saving[2 + k] as CellContent[], k));
  rows.push(...saving);
  const met = new Array<CellContent>(width).fill(null);
  const first = savingCaseRow(n, 0, origin);
  const within = rangeOn(undefined, first, cols.root.within, first + s.cases.length - 1, cols.root.within);
  met[QC.bus] = MET_LABEL;
  met[QC.cost] = `=IF(COUNTIF(${within},"yes")=${s.cases.length},"yes","no")`;
  rows.push(met);
  return { rows, marks };
}
