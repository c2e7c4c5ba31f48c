// The Compensation sheet: per bus the bank typed or proposed there and what it does, as
// formulas, following the one rule for after compensation (src/core/site/compensate.ts): the
// need at the point of connection before compensation; each bank covers the same share of its
// size in whole steps; a reactor where the site would still lead beyond the limit; Q and cos φ
// after from the Buses sheet, where the banks sit on their buses and losses follow the
// compensated loading. Every bus has its row, so a bank typed on any bus counts at once.
import type { CellContent } from './document.ts';
import type { BusColumns } from './busColumns.ts';
import { COMP_HEADERS, compensationInputCols, type CompensationColumns } from './compensationColumns.ts';
import { ownSum, nameCellOf, type Flavour, type BusRowIndex } from './busSums.ts';
import { SHEETS } from './layout.ts';
import { absCell, cell, cellOn, rangeOn } from './refs.ts';
import { REQUIREMENT_TEXT, settingRef } from './settingsLayout.ts';
import type { BusInfo, WorkbookStructure } from './structure.ts';
import { CHARACTERISTIC_HARMONICS, RESONANCE_MARGIN } from '../site/harmonics.ts';
import { WITHIN_TOL_KVAR } from '../site/tolerance.ts';
import { textContent } from '../text/cellText.ts';
import { zoneChargingFormula, zoneTopIndex } from './zoneCharging.ts';

export interface CompensationInput {
  readonly s: WorkbookStructure;
  readonly cols: CompensationColumns;
  readonly busCols: BusColumns;
  readonly flavour: Flavour;
  readonly busRows: BusRowIndex;
  /** Inputs typed per bus key: input column → content. */
  readonly inputs: ReadonlyMap<string, ReadonlyMap<number, CellContent>>;
}

/** Row of the summary line "All banks" below n buses (one blank row between). */
export function summaryRow(busCount: number): number {
  return busCount + 2;
}

/** A resonance order span from the first step to the whole bank meets a harmonic within its margin? */
function resonanceCheck(first: string, whole: string): string {
  let text = '""';
  for (let i = CHARACTERISTIC_HARMONICS.length - 1; i >= 0; i--) {
    const h = CHARACTERISTIC_HARMONICS[i] as number;
    text = `IF(AND(${whole}<=${h * (1 + RESONANCE_MARGIN)},${first}>=${h * (1 - RESONANCE_MARGIN)}),"may come near the ${h}th",${text})`;
  }
  return `=IF(OR(${first}="",${whole}=""),"",${text})`;
}

/**
 * The controller step count of `n` stages in series `ser` (stepSeries.ts controllerCount): n for
 * blank or 1:1:1, 2n − 1 for 1:2:2, 2^n − 1 for 1:2:4; 0 without stages; #N/A for another series.
 */
export function controllerStepsFormula(ser: string, n: string): string {
  return `=IF(NOT(${n}>0),0,IF(OR(ISBLANK(${ser}),${ser}="1:1:1"),${n},IF(${ser}="1:2:2",2*${n}-1,IF(${ser}="1:2:4",2^${n}-1,NA()))))`;
}

/**
 * The largest stage, kvar (bankChoice.ts largestStageKvar): the smallest step times 2 (1:2:2 from
 * two stages) or 2^(n − 1) (1:2:4), at least one step; the fixed part when there is no step.
 */
function largestStageFormula(ser: string, n: string, step: string, fixed: string): string {
  const ratio = `IF(AND(${ser}="1:2:2",${n}>=2),2,IF(${ser}="1:2:4",2^MAX(0,INT(${n})-1),1))`;
  return `=IF(${step}>0,${step}*MAX(1,${ratio}),${fixed})`;
}

/** Short-circuit power at a bus: the supply's at the root, through the feeding transformer or line below. */
function sscFormula(
  s: WorkbookStructure,
  b: BusInfo,
  upRow: number | undefined,
  cols: CompensationColumns,
): string | null {
  if (!b.feeder) return b.level === 0 ? `=IF(ISBLANK(${settingRef('ssc')}),"",${settingRef('ssc')})` : null;
  if (upRow === undefined) return null;
  const up = cell(upRow, cols.ssc);
  const f = s.sheets[b.feeder.sheet];
  if (!f) return null;
  const at = (key: string) => {
    const c = f.cols.input.get(key);
    return c === undefined ? undefined : cellOn(f.cols.sheet.name, b.feeder!.row, c, true);
  };
  const n = cellOn(f.cols.sheet.name, b.feeder.row, f.cols.inService, true);
  const [sKva, uk, l, len, u] = [at('s_kva'), at('uk_pct'), at('l_mh_km'), at('len_km'), at('u_kv')];
  if (sKva && uk) {
    // Units in parallel: n·S at the same uk. An unknown supply upstream counts as infinite.
    const sTotal = `${sKva}*${n}`;
    return `=IF(${up}="",SC.MVA.XFMR(${sTotal},${uk}),SC.MVA.XFMR(${sTotal},${uk},${up}))`;
  }
  if (l && len && u) {
    // A line adds its reactance X = 2π·f·L·len / n in series: Ssc = 1 / (1/Ssc_up + X/U²).
    return `=IF(${up}="","",1/(1/${up}+2*PI()*${settingRef('hzInUse')}*${l}*0.001*${len}/${n}/${u}^2))`;
  }
  return null;
}

/** The plain capacitors already on bus i at full output (live: BUS.SUM over its span; export: SUMIF). */
export function plainInstalledCell(input: CompensationInput, i: number): string {
  const b = input.s.buses[i] as BusInfo;
  return ownSum(
    input.s,
    input.busRows,
    input.flavour,
    { name: b.name, nameCell: nameCellOf(i + 1) },
    (c) => c.resonance,
    'all',
  );
}

/** The active power the requirement's limits apply to at the point of connection (requirement.ts). */
function referred(p: string): string {
  const ref = settingRef('refKw');
  return `IF(ISBLANK(${ref}),ABS(${p}),${ref})`;
}

export function renderCompensationSheet(input: CompensationInput): CellContent[][] {
  const { s, cols, busCols, inputs } = input;
  const n = s.buses.length;
  const cells: CellContent[][] = [cols.columns.map((c) => c.header)];
  const sumRow = summaryRow(n);
  const lag = settingRef('lagInUse');
  const lead = settingRef('leadInUse');
  const hz = settingRef('hzInUse');
  const rowOfBus = new Map(s.buses.map((b, i) => [b.key, i + 1]));
  const tops = zoneTopIndex(s);
  s.buses.forEach((b, i) => {
    const r = i + 1;
    const out: CellContent[] = new Array<CellContent>(cols.columns.length).fill(null);
    const here = (col: number) => cell(r, col);
    const bus = (col: number) => cellOn(SHEETS.buses, r, col, true);
    const typed = inputs.get(b.key);
    for (const c of compensationInputCols(cols)) out[c] = typed?.get(c) ?? null;
    const inp = (key: keyof CompensationColumns['input']) => here(cols.input[key]);
    out[cols.bus] = textContent(b.name);
    out[cols.u] = `=${bus(busCols.u)}`;
    const upRow =
      b.upstream === undefined
        ? undefined
        : rowOfBus.get(s.buses.find((x) => x.name === b.upstream)?.key ?? '');
    out[cols.ssc] = sscFormula(s, b, upRow, cols);
    const [fixed, step, steps, ur, reactor] = [
      inp('fixed_kvar'),
      inp('step_kvar'),
      inp('steps'),
      inp('u_rated_kv'),
      inp('reactor_kvar'),
    ];
    // A blank detuning is 0 in every program (IF(ISBLANK), not N(), which one program refuses on a blank).
    const p = `IF(ISBLANK(${inp('p_pct')}),0,${inp('p_pct')})`;
    const total = here(cols.total),
      ssc = here(cols.ssc),
      u = here(cols.u);
    // Steps counts physical stages; the controller switches whole smallest steps up to its count.
    const ctrl = here(cols.controllerSteps);
    out[cols.controllerSteps] = controllerStepsFormula(inp('series'), steps);
    out[cols.largestStage] = largestStageFormula(inp('series'), steps, step, fixed);
    out[cols.total] = `=${fixed}+${step}*${ctrl}`;
    out[cols.tune] = `=IF(${p}>0,CAPBANK.TUNE(${p}),"")`;
    out[cols.uCap] = `=IF(${total}=0,"",CAPBANK.UCAP(${u},${p}))`;
    out[cols.stepNameplate] =
      `=IF(OR(${step}=0,ISBLANK(${ur})),"",-${step}/KVAR.CAPBANK(1,${ur},${u},${p},${hz},${hz}))`;
    out[cols.plainInstalled] = plainInstalledCell(input, i);
    const installed = here(cols.plainInstalled);
    const charging = here(cols.zoneCharging);
    out[cols.zoneCharging] = zoneChargingFormula(s, input.busRows, input.flavour, tops, i);
    const first = `IF(${fixed}>0,${fixed},${step})`;
    // The capacitors alone resonate with the supply: a bank of output Q at the bus holds Q·(1 − p)
    // of capacitor kvar (its output is U²/(Xc − p·Xc)), which RESONANCE.ORDER takes with p. The
    // zone's charging counts with a plain bank only: beside a detuned one it resonates with the
    // supply on its own (Checks reports that), as assessBanks.ts and bankSizing.ts count it.
    const capOnly = (q: string) => `${q}*(1-${p}/100)+${installed}+IF(${p}>0,0,${charging})`;
    out[cols.orderStep] = `=IF(OR(${ssc}="",${total}=0),"",RESONANCE.ORDER(${ssc},${capOnly(first)},${p}))`;
    out[cols.orderTotal] = `=IF(OR(${ssc}="",${total}=0),"",RESONANCE.ORDER(${ssc},${capOnly(total)},${p}))`;
    out[cols.check] = resonanceCheck(here(cols.orderStep), here(cols.orderTotal));
    // One switching operation adds at most the largest stage.
    out[cols.vriseStep] = `=IF(OR(${ssc}="",${total}=0),"",VRISE.PCT(${here(cols.largestStage)},${ssc}))`;
    // The whole bank in, with the plain capacitors and the charging already there.
    out[cols.vriseTotal] =
      `=IF(OR(${ssc}="",${total}=0),"",VRISE.PCT(${total}+${installed}+${charging},${ssc}))`;
    s.cases.forEach((_, k) => {
      // At the point of connection the limits may refer to a rated power (Site sheet), not P.
      const P = r === 1 ? referred(bus(busCols.p[k] as number)) : `ABS(${bus(busCols.p[k] as number)})`;
      const Q = bus(busCols.q[k] as number);
      const at = (list: readonly number[]) => here(list[k] as number);
      const root = (list: readonly number[]) => absCell(1, list[k] as number);
      // As if a bank on this bus alone had to bring it within the requirement.
      out[cols.needCap[k] as number] =
        `=MAX(0,IF(${settingRef('requirement')}="${REQUIREMENT_TEXT.tanphi}",KVAR.TOTAN(${P},${Q},${settingRef('tanLag')}),KVAR.TOPF(${P},${Q},${settingRef('cosTarget')})))`;
      // A motor's own bank is out, fixed part too, while its bus draws no active power (the
      // motor stopped): the rule of compensate.ts, from individualCompensation.ts.
      out[cols.available[k] as number] = b.soleMotor
        ? `=IF(${bus(busCols.p[k] as number)}=0,0,${total})`
        : `=${total}`;
      const avail = at(cols.available);
      const availSum = absCell(sumRow, cols.available[k] as number);
      // The bank's share of the site's need is the same share of its size for every bank in service.
      const share = `${root(cols.needCap)}*${total}/${availSum}`;
      out[cols.stepsIn[k] as number] =
        `=IF(OR(${step}=0,${ctrl}=0,${avail}=0),0,MIN(${ctrl},BANK.ROUNDUP(${share}-${fixed},${step})/${step}))`;
      out[cols.capOut[k] as number] = `=IF(${avail}=0,0,${fixed}+${step}*${at(cols.stepsIn)})`;
      out[cols.reactorIn[k] as number] =
        `=IF(AND(${reactor}>0,${root(cols.needInd)}>${WITHIN_TOL_KVAR}),${reactor},0)`;
      out[cols.qAfter[k] as number] = `=${bus(busCols.qAfter[k] as number)}`;
      out[cols.cosAfter[k] as number] = `=${bus(busCols.cosAfter[k] as number)}`;
      if (r === 1) {
        // The point of connection: still leading beyond the limit with the capacitor outputs in?
        const outs = rangeOn(undefined, 1, cols.capOut[k] as number, n, cols.capOut[k] as number);
        // A blank leading limit (cos φ lagging only) never asks for inductive kvar.
        out[cols.needInd[k] as number] =
          `=IF(${lead}="",0,MAX(0,-KVAR.TOTAN(${P},${Q}-SUM(${outs}),-${lead})))`;
        const PA = referred(bus(busCols.pAfter[k] as number));
        const QA = bus(busCols.qAfter[k] as number);
        out[cols.within[k] as number] =
          `=IF(AND(KVAR.TOTAN(${PA},${QA},${lag})<=${WITHIN_TOL_KVAR},IF(${lead}="",TRUE(),-KVAR.TOTAN(${PA},${QA},-${lead})<=${WITHIN_TOL_KVAR})),"yes","no")`;
      }
    });
    cells.push(out);
  });
  if (n > 0) {
    const blank = () => new Array<CellContent>(cols.columns.length).fill(null);
    const summary = blank();
    summary[cols.bus] = COMP_HEADERS.allBanks;
    summary[cols.total] = `=SUM(${rangeOn(undefined, 1, cols.total, n, cols.total)})`;
    for (const c of cols.available) summary[c] = `=SUM(${rangeOn(undefined, 1, c, n, c)})`;
    cells.push(blank(), summary);
  }
  return cells;
}

export const COMPENSATION_PURPOSE =
  "Per bus: the bank there (inputs: fixed part, smallest step, stages, their series 1:1:1, 1:2:2 or 1:2:4, detuning, capacitor rating, reactor) and what it is: the controller step count, the largest stage, total, tuning, capacitor voltage, resonance order from the first step to the whole bank, voltage rise per stage and with the whole bank in. Resonance and the whole bank's voltage rise count the plain capacitors on the bus and the cable and line charging of the bus's zone (the buses joined to it by lines) in the case with the most charging (last column); a detuned bank's resonance leaves the charging out, which Checks judges on its own. Per case: the need at the bus, the bank in service (a motor's own bank is out while the motor is stopped), the smallest steps the bank switches (each bank in service covers the same share of its size of the need at the point of connection), its output, the reactor in, and Q and cos φ after (from the Buses sheet, losses at the compensated loading). At the point of connection: whether the requirement is met.";
