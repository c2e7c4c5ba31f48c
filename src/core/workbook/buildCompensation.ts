// The Compensation sheet: per bus, the bank chosen there (inputs: fixed part, step size, number
// of steps, detuning, capacitor rated voltage, shunt reactor) and what it does, as formulas.
// Per case the banks share the capacitive need of the point of connection in proportion to the
// lagging kvar of their buses' own items, and each switches whole steps (BANK.ROUNDUP) to cover
// its share; a reactor goes in when the point of connection is still leading beyond the limit
// with the capacitors in. These are the rules of the compensation design
// (src/core/site/compensation.ts), here live. Transformer losses stay at their values before
// compensation: entering a bank as equipment gives the exact figure on the Buses sheet.
//
// Every edit changes the site's need, so everything that hangs on it is revisited by the engine
// after every edit: those formulas are written only where a bank or reactor is (and on the
// buses above it), and resonance is judged per bank, not per case.
import type { CellContent, SheetDoc } from './document.ts';
import { SHEETS } from './buildLayout.ts';
import type { EquipmentSheetPlan } from './buildEquipment.ts';
import { criterion, type BranchRef, type BusColumns, type BusEntry, type Flavour } from './buildBuses.ts';
import { REQUIREMENT_TEXT, settingRef } from './buildSettings.ts';
import { absCell, cell, cellOn, columnOn, rangeOn } from './buildRefs.ts';
import {
  BANK_INPUTS,
  SUMMARY_LABELS,
  hasBankChoice,
  hasReactorChoice,
  type BankChoice,
  type CompensationColumns,
} from './buildCompensationColumns.ts';

export {
  BANK_INPUTS,
  NOTE_HEADER,
  SUMMARY_LABELS,
  planCompensationColumns,
  type BankChoice,
  type CompensationColumns,
} from './buildCompensationColumns.ts';

/** Tolerance for "within the requirement", kvar (as the design's). */
const TOL_KVAR = 0.5;
/** Characteristic harmonics and the margin around them (as src/core/site/bankRules.ts). */
const HARMONICS = [5, 7, 11, 13];
const MARGIN = 0.1;

export interface CompensationSheetInput {
  readonly cases: readonly string[];
  readonly buses: readonly BusEntry[];
  readonly busCols: BusColumns;
  readonly cols: CompensationColumns;
  readonly flavour: Flavour;
  /** The transformer or line feeding each bus. */
  readonly feederOf: ReadonlyMap<string, BranchRef>;
  readonly childrenOf: ReadonlyMap<string, readonly string[]>;
  /** The Capacitors and reactors sheet (installed equipment). */
  readonly banksPlan: EquipmentSheetPlan | undefined;
  readonly choices: ReadonlyMap<string, BankChoice>;
}

/**
 * Switching a bank step by step moves the resonance order from the first step's down to the
 * whole bank's: a characteristic harmonic (with its margin) inside that span may be met.
 */
function resonanceCheck(first: string, whole: string): string {
  let text = '""';
  for (let i = HARMONICS.length - 1; i >= 0; i--) {
    const h = HARMONICS[i] as number;
    text = `IF(AND(${whole}<=${h * (1 + MARGIN)},${first}>=${h * (1 - MARGIN)}),"may come near the ${h}th",${text})`;
  }
  return `=IF(OR(${first}="",${whole}=""),"",${text})`;
}

/** Short-circuit power at a bus: the supply's at the root, through the feeding transformer or line below. */
function sscFormula(entry: BusEntry, feeder: BranchRef | undefined, up: string | undefined): string | null {
  if (!feeder) return entry.level === 0 ? `=IF(ISBLANK(${settingRef('ssc')}),"",${settingRef('ssc')})` : null;
  if (up === undefined) return null;
  const sheet = feeder.plan.layout.sheet;
  const at = (key: 's_kva' | 'uk_pct' | 'l_mh_km' | 'len_km' | 'u_kv') =>
    cellOn(sheet, feeder.row, feeder.plan.cols.input.get(key) as number, true);
  const n = cellOn(sheet, feeder.row, feeder.plan.cols.inService, true);
  if (feeder.plan.layout.id === 'transformers') {
    // Units in parallel: n·S at the same uk. An unknown supply upstream counts as infinite.
    const s = `${at('s_kva')}*${n}`;
    return `=IF(${up}="",SC.MVA.XFMR(${s},${at('uk_pct')}),SC.MVA.XFMR(${s},${at('uk_pct')},${up}))`;
  }
  // A line adds its reactance X = 2π·f·L·len / n in series: Ssc = 1 / (1/Ssc_up + X/U²).
  return `=IF(${up}="","",1/(1/${up}+2*PI()*${settingRef('hz')}*${at('l_mh_km')}*0.001*${at('len_km')}/${n}/${at('u_kv')}^2))`;
}

export function buildCompensationSheet(input: CompensationSheetInput): SheetDoc {
  const { cases, buses, busCols, cols, flavour, feederOf, childrenOf, banksPlan, choices } = input;
  const cells: CellContent[][] = [cols.columns.map((c) => c.header)];
  const rowOf = new Map(buses.map((b, i) => [b.name, i + 1]));
  const lag = settingRef('lagInUse');
  const lead = settingRef('leadInUse');
  const reqKind = settingRef('requirement');
  // Below the buses, after one blank row: how the site need is shared among the banks.
  const summaryRows = {
    count: buses.length + 2,
    weight: buses.length + 3,
    perKvar: buses.length + 4,
    even: buses.length + 5,
  };
  const switching = busesWithSwitching(buses, childrenOf, choices);
  const n = buses.length;
  buses.forEach((b, i) => {
    const r = i + 1;
    const out: CellContent[] = new Array<CellContent>(cols.columns.length).fill(null);
    const here = (col: number) => cell(r, col);
    const bus = (col: number) => cellOn(SHEETS.buses, r, col, true);
    const inp = (key: keyof CompensationColumns['input']) => here(cols.input[key]);
    out[cols.bus] = b.name;
    out[cols.u] = `=${bus(busCols.u)}`;
    const feeder = feederOf.get(b.name);
    const upRow = feeder ? rowOf.get(feeder.plan.rows[feeder.row - 1]?.bus ?? '') : undefined;
    out[cols.ssc] = sscFormula(b, feeder, upRow === undefined ? undefined : cell(upRow, cols.ssc));
    const choice = choices.get(b.name);
    const hasBank = hasBankChoice(choice);
    const hasReactor = hasReactorChoice(choice);
    const isRoot = b.level === 0;
    for (const k of BANK_INPUTS) out[cols.input[k.key]] = choice?.[k.key] ?? null;
    out[cols.note] = choice?.note ?? null;
    const [fixed, step, steps, p, ur, reactor] = [
      inp('fixed_kvar'),
      inp('step_kvar'),
      inp('steps'),
      `N(${inp('p_pct')})`,
      inp('u_rated_kv'),
      inp('reactor_kvar'),
    ];
    const total = here(cols.total),
      ssc = here(cols.ssc),
      u = here(cols.u);
    out[cols.total] = `=${fixed}+${step}*${steps}`;
    out[cols.tune] = `=IF(${p}>0,CAPBANK.TUNE(${p}),"")`;
    out[cols.uCap] = `=IF(${total}=0,"",CAPBANK.UCAP(${u},${p}))`;
    out[cols.stepNameplate] =
      `=IF(OR(${step}=0,ISBLANK(${ur})),"",-${step}/KVAR.CAPBANK(1,${ur},${u},${p},${settingRef('hz')},${settingRef('hz')}))`;
    out[cols.vriseStep] = `=IF(OR(${ssc}="",${total}=0),"",VRISE.PCT(IF(${step}>0,${step},${fixed}),${ssc}))`;
    out[cols.vriseTotal] = `=IF(OR(${ssc}="",${total}=0),"",VRISE.PCT(${total},${ssc}))`;
    if (hasBank) {
      const installed = here(cols.plainInstalled);
      out[cols.plainInstalled] = plainInstalled(b.name, cell(r, cols.bus), r, cols, flavour, banksPlan);
      const first = `IF(${fixed}>0,${fixed},${step})`;
      out[cols.orderStep] =
        `=IF(OR(${ssc}="",${total}=0),"",RESONANCE.ORDER(${ssc},${first}+${installed},${p}))`;
      out[cols.orderTotal] =
        `=IF(OR(${ssc}="",${total}=0),"",RESONANCE.ORDER(${ssc},${total}+${installed},${p}))`;
      out[cols.check] = resonanceCheck(here(cols.orderStep), here(cols.orderTotal));
    }
    cases.forEach((_, k) => {
      const P = `ABS(${bus(busCols.p[k] as number)})`;
      const Q = bus(busCols.q[k] as number);
      const at = (list: readonly number[]) => here(list[k] as number);
      const root = (list: readonly number[]) => absCell(1, list[k] as number);
      // As if a bank on this bus alone had to bring it within the requirement.
      out[cols.needCap[k] as number] =
        `=MAX(0,IF(${reqKind}="${REQUIREMENT_TEXT.tanphi}",KVAR.TOTAN(${P},${Q},${settingRef('tanLag')}),KVAR.TOPF(${P},${Q},${settingRef('cosTarget')})))`;
      if (hasBank) {
        // The bank's share of the site's need: by the lagging kvar of its bus's own items, as
        // need/weight × own kvar, or need/count when no bank's bus lags (one of the two summary
        // terms is 0). Every edit revisits this cell on every bank: kept short.
        const ownQ = cellOn(SHEETS.buses, r, busCols.qOwn[k] as number, true);
        const sum = (row: number) => absCell(row, cols.needCap[k] as number);
        const share = `(${sum(summaryRows.perKvar)}*MAX(0,${ownQ})+${sum(summaryRows.even)})`;
        out[cols.stepsIn[k] as number] =
          `=IF(OR(${step}=0,${steps}=0),0,MIN(${steps},BANK.ROUNDUP(${share}-${fixed},${step})/${step}))`;
        out[cols.capOut[k] as number] = `=${fixed}+${step}*${at(cols.stepsIn)}`;
      }
      if (hasReactor)
        out[cols.reactorIn[k] as number] =
          `=IF(AND(${reactor}>0,${root(cols.needInd)}>${TOL_KVAR}),${reactor},0)`;
      if (switching.has(b.name) || isRoot) {
        // Q after: this bus's banks, and what the banks below change on the buses they sit on.
        const below = (childrenOf.get(b.name) ?? [])
          .filter((c) => switching.has(c))
          .map((c) => {
            const cr = rowOf.get(c) as number;
            return `-(${cellOn(SHEETS.buses, cr, busCols.q[k] as number, true)}-${cell(cr, cols.qAfter[k] as number)})`;
          })
          .join('');
        out[cols.qAfter[k] as number] =
          `=${Q}${hasBank ? `-${at(cols.capOut)}` : ''}${hasReactor ? `+${at(cols.reactorIn)}` : ''}${below}`;
        out[cols.cosAfter[k] as number] =
          `=IF(AND(${P}=0,${at(cols.qAfter)}=0),"",COSPHI(${P},${at(cols.qAfter)}))`;
      }
      if (isRoot) {
        // The point of connection: still leading beyond the limit with every capacitor in?
        const outs = rangeOn(undefined, 1, cols.capOut[k] as number, n, cols.capOut[k] as number);
        out[cols.needInd[k] as number] = `=MAX(0,-KVAR.TOTAN(${P},${Q}-SUM(${outs}),-${lead}))`;
        out[cols.within[k] as number] =
          `=IF(AND(KVAR.TOTAN(${P},${at(cols.qAfter)},${lag})<=${TOL_KVAR},-KVAR.TOTAN(${P},${at(cols.qAfter)},-${lead})<=${TOL_KVAR}),"yes","no")`;
      }
    });
    cells.push(out);
  });
  if (buses.length > 0) cells.push(...summaryBlock(input));
  return {
    name: SHEETS.compensation,
    cells,
    columns: cols.columns,
    purpose:
      "Per bus: the bank chosen there (inputs) and what it is: total, tuning, capacitor voltage, resonance order from the first step to the whole bank, voltage rise; per case the kvar needed there, the steps the bank switches to cover its share of the site's need, Q and cos φ after; at the point of connection whether the requirement is met. " +
      'Transformer losses are taken before compensation. Switching formulas are written for buses that have a bank or reactor: after entering one on another bus, rebuild the workbook.',
  };
}

/** Buses with a bank or reactor on them or on a bus below them. */
function busesWithSwitching(
  buses: readonly BusEntry[],
  childrenOf: ReadonlyMap<string, readonly string[]>,
  choices: ReadonlyMap<string, BankChoice>,
): Set<string> {
  const out = new Set<string>();
  const visit = (bus: string, seen: Set<string>): boolean => {
    if (seen.has(bus)) return out.has(bus);
    seen.add(bus);
    const c = choices.get(bus);
    let any = hasBankChoice(c) || hasReactorChoice(c);
    for (const child of childrenOf.get(bus) ?? []) any = visit(child, seen) || any;
    if (any) out.add(bus);
    return any;
  };
  const seen = new Set<string>();
  for (const b of buses) visit(b.name, seen);
  return out;
}

/**
 * Plain (not detuned) capacitors already on a bank's bus, at full output: with the bank they
 * set the resonance. 'live': BUS.SUMS over the bus's own rows; 'portable': SUMIF.
 */
function plainInstalled(
  bus: string,
  busCell: string,
  r: number,
  cols: CompensationColumns,
  flavour: Flavour,
  plan: EquipmentSheetPlan | undefined,
): string {
  const col = plan?.cols.plainCap;
  const own = plan?.blocks.get(bus);
  if (!plan || col === undefined || !own) return '=0';
  const busCol = plan.cols.input.get('bus') as number;
  const block = (c: number) => rangeOn(plan.layout.sheet, own.first, c, own.last, c);
  if (flavour === 'live') return `=BUS.SUMS(${absCell(r, cols.bus)},${block(busCol)},${block(col)})`;
  const crit = criterion(bus, `$${busCell}`);
  // A name a criterion cannot hold: this bus's own rows.
  return crit === undefined
    ? `=SUM(${block(col)})`
    : `=SUMIF(${columnOn(plan.layout.sheet, busCol)},${crit},${columnOn(plan.layout.sheet, col)})`;
}

/** Terms of about 40 characters each: 120 keep a formula far below the xlsx limit of 8,192. */
const TERMS_PER_FORMULA = 120;

function summaryBlock(input: CompensationSheetInput): CellContent[][] {
  const { cols, busCols, buses, cases, choices } = input;
  const n = buses.length;
  const totals = rangeOn(undefined, 1, cols.total, n, cols.total);
  const blank = () => new Array<CellContent>(cols.columns.length).fill(null);
  const count = blank();
  count[cols.bus] = SUMMARY_LABELS.count;
  count[cols.total] = `=COUNTIF(${totals},">0")`;
  const weight = blank();
  weight[cols.bus] = SUMMARY_LABELS.weight;
  // Named bank by bank (not a SUMIFS over every bus), so an edit on a bus without a bank does not reach it.
  const withBank = buses
    .map((b, i) => ({ b, r: i + 1 }))
    .filter(({ b }) => hasBankChoice(choices.get(b.name)));
  // A formula may hold at most 8,192 characters in xlsx: many banks are summed in parts, one row
  // per part below the summary, and the weight row adds the parts.
  const parts: CellContent[][] = [];
  const firstPartRow = n + 6;
  cases.forEach((_, k) => {
    const c = cols.needCap[k] as number;
    const terms = withBank.map(
      ({ r }) =>
        `IF(${absCell(r, cols.total)}>0,MAX(0,${cellOn(SHEETS.buses, r, busCols.qOwn[k] as number, true)}),0)`,
    );
    if (terms.length <= TERMS_PER_FORMULA) {
      weight[c] = terms.length === 0 ? '=0' : `=${terms.join('+')}`;
      return;
    }
    const refs: string[] = [];
    for (let i = 0, part = 0; i < terms.length; i += TERMS_PER_FORMULA, part++) {
      const row = (parts[part] ??= blank());
      row[cols.bus] = `${SUMMARY_LABELS.weightPart} ${part + 1}`;
      row[c] = `=${terms.slice(i, i + TERMS_PER_FORMULA).join('+')}`;
      refs.push(absCell(firstPartRow + part, c));
    }
    weight[c] = `=${refs.join('+')}`;
  });
  const perKvar = blank();
  perKvar[cols.bus] = SUMMARY_LABELS.perKvar;
  const even = blank();
  even[cols.bus] = SUMMARY_LABELS.even;
  const r0 = n + 3;
  cases.forEach((_, k) => {
    const c = cols.needCap[k] as number;
    const [need, w] = [absCell(1, c), absCell(r0, c)];
    perKvar[c] = `=IF(${w}=0,0,${need}/${w})`;
    even[c] = `=IF(${w}=0,${need}/${absCell(n + 2, cols.total)},0)`;
  });
  return [blank(), count, weight, perKvar, even, ...parts];
}
