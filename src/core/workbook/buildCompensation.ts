// The Compensation sheet: per bus, the bank chosen there (inputs: fixed part, step size, number
// of steps, detuning, capacitor rated voltage, shunt reactor) and what it does, as formulas.
// Per case the banks share the capacitive need of the point of connection in proportion to the
// lagging kvar of their buses' own items, and each switches whole steps (BANK.ROUNDUP) to cover
// its share; a reactor goes in when the point of connection is still leading beyond the limit
// with the capacitors in. These are the rules of the compensation design
// (src/core/site/compensation.ts), here live. Transformer losses stay at their values before
// compensation: entering a bank as equipment gives the exact figure on the Buses sheet.
import type { CellContent, ColumnInfo, SheetDoc } from './document.ts';
import { FORMATS, SHEETS } from './buildLayout.ts';
import type { EquipmentSheetPlan } from './buildEquipment.ts';
import { criterion, type BranchRef, type BusColumns, type BusEntry, type Flavour } from './buildBuses.ts';
import { REQUIREMENT_TEXT, settingRef } from './buildSettings.ts';
import { absCell, cell, cellOn, columnOn, rangeOn } from './buildRefs.ts';

/** A bank (and reactor) chosen for a bus; outputs in kvar at the bus's operating voltage. */
export interface BankChoice {
  readonly bus: string;
  readonly fixed_kvar?: number;
  readonly step_kvar?: number;
  readonly steps?: number;
  readonly p_pct?: number;
  readonly u_rated_kv?: number;
  readonly reactor_kvar?: number;
  /** Why it was chosen and what to watch (kept as text). */
  readonly note?: string;
}

/** Tolerance for "within the requirement", kvar (as the design's). */
const TOL_KVAR = 0.5;
/** Characteristic harmonics and the margin around them (as src/core/site/bankRules.ts). */
const HARMONICS = [5, 7, 11, 13];
const MARGIN = 0.1;

export const BANK_INPUTS = [
  { key: 'fixed_kvar', header: 'Fixed (kvar)', format: FORMATS.kvar, width: 9 },
  { key: 'step_kvar', header: 'Step (kvar)', format: FORMATS.kvar, width: 9 },
  { key: 'steps', header: 'Steps', format: FORMATS.count, width: 7 },
  { key: 'p_pct', header: 'Detuning p (%)', format: '0.00', width: 9 },
  { key: 'u_rated_kv', header: 'Capacitor rated voltage (kV)', format: '0.0##', width: 11 },
  { key: 'reactor_kvar', header: 'Reactor (kvar)', format: FORMATS.kvar, width: 9 },
] as const;
export const NOTE_HEADER = 'Design notes';

export interface CompensationColumns {
  readonly bus: 0;
  readonly u: 1;
  readonly ssc: 2;
  readonly input: Readonly<Record<(typeof BANK_INPUTS)[number]['key'], number>>;
  readonly total: number;
  readonly tune: number;
  readonly uCap: number;
  readonly stepNameplate: number;
  readonly vriseStep: number;
  readonly vriseTotal: number;
  readonly note: number;
  /** Per case. */
  readonly needCap: readonly number[];
  readonly share: readonly number[];
  readonly stepsIn: readonly number[];
  readonly capOut: readonly number[];
  readonly qAfterCaps: readonly number[];
  readonly needInd: readonly number[];
  readonly reactorIn: readonly number[];
  readonly qAfter: readonly number[];
  readonly cosAfter: readonly number[];
  readonly within: readonly number[];
  readonly connected: readonly number[];
  readonly order: readonly number[];
  readonly check: readonly number[];
  /** Installed reactors and capacitors on the bus (absorbed, delivered) per case. */
  readonly reactorsInstalled: readonly number[];
  readonly capsInstalled: readonly number[];
  readonly columns: readonly ColumnInfo[];
}

export function planCompensationColumns(cases: readonly string[]): CompensationColumns {
  const columns: ColumnInfo[] = [{ header: 'Bus', width: 14 }];
  const add = (header: string, format: string | undefined, width: number, computed = true) =>
    columns.push({ header, ...(format ? { format } : {}), width: Math.max(width, Math.min(header.length + 1, 16)), ...(computed ? { computed } : {}) }) - 1;
  const u = add('U (kV)', '0.0##', 8) as 1;
  const ssc = add('Short-circuit power (MVA)', '0.0', 10) as 2;
  const input = Object.fromEntries(BANK_INPUTS.map((b) => [b.key, add(b.header, b.format, b.width, false)])) as CompensationColumns['input'];
  const total = add('Bank total (kvar)', FORMATS.kvar, 9);
  const tune = add('Tuning order', '0.00', 8);
  const uCap = add('Capacitor voltage (kV)', '0.000', 9);
  const stepNameplate = add('Step nameplate (kvar)', FORMATS.kvar, 9);
  const vriseStep = add('Voltage rise per step (%)', '0.00', 9);
  const vriseTotal = add('Voltage rise, whole bank (%)', '0.00', 9);
  const note = add(NOTE_HEADER, undefined, 40, false);
  const block = {
    needCap: [] as number[], share: [] as number[], stepsIn: [] as number[], capOut: [] as number[], qAfterCaps: [] as number[], needInd: [] as number[],
    reactorIn: [] as number[], qAfter: [] as number[], cosAfter: [] as number[], within: [] as number[], connected: [] as number[], order: [] as number[],
    check: [] as number[],
  };
  for (const c of cases) {
    block.needCap.push(add(`Capacitive need ${c} (kvar)`, FORMATS.kvar, 10));
    block.share.push(add(`Share of the site need ${c} (kvar)`, FORMATS.kvar, 10));
    block.stepsIn.push(add(`Steps in ${c}`, FORMATS.count, 7));
    block.capOut.push(add(`Capacitor output ${c} (kvar)`, FORMATS.kvar, 10));
    block.qAfterCaps.push(add(`Q after capacitors ${c} (kvar)`, FORMATS.kvar, 10));
    block.needInd.push(add(`Inductive need ${c} (kvar)`, FORMATS.kvar, 10));
    block.reactorIn.push(add(`Reactor in ${c} (kvar)`, FORMATS.kvar, 9));
    block.qAfter.push(add(`Q after ${c} (kvar)`, FORMATS.kvar, 10));
    block.cosAfter.push(add(`cos φ after ${c}`, FORMATS.pf, 8));
    block.within.push(add(`Within requirement ${c}`, undefined, 9));
    block.connected.push(add(`Capacitors connected ${c} (kvar)`, FORMATS.kvar, 10));
    block.order.push(add(`Resonance order ${c}`, '0.00', 8));
    block.check.push(add(`Resonance check ${c}`, undefined, 12));
  }
  const reactorsInstalled: number[] = [], capsInstalled: number[] = [];
  for (const c of cases) {
    reactorsInstalled.push(add(`Reactors installed ${c} (kvar)`, FORMATS.kvar, 10));
    capsInstalled.push(add(`Capacitors installed ${c} (kvar)`, FORMATS.kvar, 10));
  }
  return { bus: 0, u, ssc, input, total, tune, uCap, stepNameplate, vriseStep, vriseTotal, note, ...block, reactorsInstalled, capsInstalled, columns };
}

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

function resonanceCheck(order: string): string {
  const tests = HARMONICS.map((h) => `ABS(${order}-${h})<=${MARGIN * h}`);
  let text = '""';
  for (let i = HARMONICS.length - 1; i >= 0; i--) text = `IF(${tests[i]},"near the ${HARMONICS[i]}th",${text})`;
  return `=IF(${order}="","",${text})`;
}

/** Short-circuit power at a bus: the supply's at the root, through the feeding transformer or line below. */
function sscFormula(entry: BusEntry, feeder: BranchRef | undefined, up: string | undefined): string | null {
  if (!feeder) return entry.level === 0 ? `=IF(ISBLANK(${settingRef('ssc')}),"",${settingRef('ssc')})` : null;
  if (up === undefined) return null;
  const sheet = feeder.plan.layout.sheet;
  const at = (key: 's_kva' | 'uk_pct' | 'l_mh_km' | 'len_km' | 'u_kv') => cellOn(sheet, feeder.row, feeder.plan.cols.input.get(key) as number, true);
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
  const summaryRows = { count: buses.length + 2, weight: buses.length + 3 };
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
    const hasReactor = (choice?.reactor_kvar ?? 0) > 0;
    for (const k of BANK_INPUTS) out[cols.input[k.key]] = choice?.[k.key] ?? null;
    out[cols.note] = choice?.note ?? null;
    const [fixed, step, steps, p, ur, reactor] = [inp('fixed_kvar'), inp('step_kvar'), inp('steps'), `N(${inp('p_pct')})`, inp('u_rated_kv'), inp('reactor_kvar')];
    const total = here(cols.total), ssc = here(cols.ssc), u = here(cols.u);
    out[cols.total] = `=${fixed}+${step}*${steps}`;
    out[cols.tune] = `=IF(${p}>0,CAPBANK.TUNE(${p}),"")`;
    out[cols.uCap] = `=IF(${total}=0,"",CAPBANK.UCAP(${u},${p}))`;
    out[cols.stepNameplate] = `=IF(OR(${step}=0,ISBLANK(${ur})),"",-${step}/KVAR.CAPBANK(1,${ur},${u},${p},${settingRef('hz')},${settingRef('hz')}))`;
    out[cols.vriseStep] = `=IF(OR(${ssc}="",${total}=0),"",VRISE.PCT(IF(${step}>0,${step},${fixed}),${ssc}))`;
    out[cols.vriseTotal] = `=IF(OR(${ssc}="",${total}=0),"",VRISE.PCT(${total},${ssc}))`;
    cases.forEach((_, k) => {
      const P = `ABS(${bus(busCols.p[k] as number)})`;
      const Q = bus(busCols.q[k] as number);
      const at = (list: readonly number[]) => here(list[k] as number);
      const root = (list: readonly number[]) => absCell(1, list[k] as number);
      // The buses fed from this one pass on what their banks change: Q before less Q after.
      const below = (list: readonly number[]) => (childrenOf.get(b.name) ?? []).flatMap((c) => {
        const cr = rowOf.get(c);
        return cr === undefined ? [] : [`-(${cellOn(SHEETS.buses, cr, busCols.q[k] as number, true)}-${cell(cr, list[k] as number)})`];
      }).join('');
      const needCap = at(cols.needCap), stepsIn = at(cols.stepsIn), qAfterCaps = at(cols.qAfterCaps);
      const needInd = at(cols.needInd), qAfter = at(cols.qAfter), conn = at(cols.connected), order = at(cols.order);
      // Only buses with a bank or a reactor switch anything: the others get no formulas that
      // depend on the whole site, so an edit elsewhere does not reach them.
      const capOut = hasBank ? `-${at(cols.capOut)}` : '';
      const reactorIn = hasReactor ? `+${at(cols.reactorIn)}` : '';
      // As if a bank on this bus alone had to bring it within the requirement.
      out[cols.needCap[k] as number] =
        `=MAX(0,IF(${reqKind}="${REQUIREMENT_TEXT.tanphi}",KVAR.TOTAN(${P},${Q},${settingRef('tanLag')}),KVAR.TOPF(${P},${Q},${settingRef('cosTarget')})))`;
      if (hasBank) {
        const ownQ = cellOn(SHEETS.buses, r, busCols.qOwn[k] as number, true);
        const summary = (row: number) => absCell(row, cols.share[k] as number);
        out[cols.share[k] as number] =
          `=IF(${total}=0,0,${root(cols.needCap)}*IF(${summary(summaryRows.weight)}=0,1/${summary(summaryRows.count)},MAX(0,${ownQ})/${summary(summaryRows.weight)}))`;
        out[cols.stepsIn[k] as number] = `=IF(OR(${step}=0,${steps}=0),0,MIN(${steps},BANK.ROUNDUP(${at(cols.share)}-${fixed},${step})/${step}))`;
        out[cols.capOut[k] as number] = `=${fixed}+${step}*${stepsIn}`;
        out[cols.connected[k] as number] = `=${at(cols.capOut)}+${at(cols.capsInstalled)}`;
        out[cols.order[k] as number] = `=IF(OR(${ssc}="",${conn}=0),"",RESONANCE.ORDER(${ssc},${conn},${p}))`;
        out[cols.check[k] as number] = resonanceCheck(order);
        if (flavour === 'portable') installedPortable(out, cols, k, b.name, cell(r, cols.bus), banksPlan);
      }
      out[cols.qAfterCaps[k] as number] = `=${Q}${capOut}${below(cols.qAfterCaps)}`;
      out[cols.needInd[k] as number] = `=MAX(0,-KVAR.TOTAN(${P},${qAfterCaps},-${lead}))`;
      if (hasReactor) out[cols.reactorIn[k] as number] = `=IF(AND(${reactor}>0,${root(cols.needInd)}>${TOL_KVAR}),${reactor},0)`;
      out[cols.qAfter[k] as number] = `=${Q}${capOut}${reactorIn}${below(cols.qAfter)}`;
      out[cols.cosAfter[k] as number] = `=IF(AND(${P}=0,${qAfter}=0),"",COSPHI(${P},${qAfter}))`;
      // The requirement holds at the point of connection; other buses are not held to it.
      if (b.level === 0) out[cols.within[k] as number] =
        `=IF(AND(KVAR.TOTAN(${P},${qAfter},${lag})<=${TOL_KVAR},-KVAR.TOTAN(${P},${qAfter},-${lead})<=${TOL_KVAR}),"yes","no")`;
    });
    if (hasBank && flavour === 'live') installedLive(out, cols, r, b.name, banksPlan);
    cells.push(out);
  });
  if (buses.length > 0) cells.push(...summaryBlock(input));
  return {
    name: SHEETS.compensation,
    cells,
    columns: cols.columns,
    purpose: 'Per bus: the bank chosen there (inputs) and, per case, the kvar needed for the requirement, its share of the site\'s need, steps switched in, cos φ after, resonance order and voltage rise; at the point of connection, whether the requirement is met. ' +
      'Transformer losses are taken before compensation. Switching formulas are written for buses that have a bank or reactor: after entering one on another bus, rebuild the workbook.',
  };
}

function hasBankChoice(choice: BankChoice | undefined): boolean {
  return choice !== undefined && ((choice.fixed_kvar ?? 0) > 0 || ((choice.step_kvar ?? 0) > 0 && (choice.steps ?? 0) > 0));
}

/** Capacitors and reactors already installed on a bank's bus ('portable': SUMIFS). */
function installedPortable(out: CellContent[], cols: CompensationColumns, k: number, bus: string, busCell: string, plan: EquipmentSheetPlan | undefined): void {
  if (!plan || plan.rows.length === 0) {
    out[cols.reactorsInstalled[k] as number] = '=0';
    out[cols.capsInstalled[k] as number] = '=0';
    return;
  }
  const busCol = plan.cols.input.get('bus') as number;
  const q = (plan.cols.q as readonly number[])[k] as number;
  const crit = criterion(bus, `$${busCell}`);
  const own = plan.blocks.get(bus);
  if (crit === undefined) {
    // A name a criterion cannot hold: this bus's own rows.
    const vals = own ? rangeOn(plan.layout.sheet, own.first, q, own.last, q) : undefined;
    out[cols.reactorsInstalled[k] as number] = vals ? `=SUMIF(${vals},">0")` : '=0';
    out[cols.capsInstalled[k] as number] = vals ? `=-SUMIF(${vals},"<0")` : '=0';
    return;
  }
  const keys = columnOn(plan.layout.sheet, busCol);
  const vals = columnOn(plan.layout.sheet, q);
  out[cols.reactorsInstalled[k] as number] = `=SUMIFS(${vals},${keys},${crit},${vals},">0")`;
  out[cols.capsInstalled[k] as number] = `=-SUMIFS(${vals},${keys},${crit},${vals},"<0")`;
}

/** The same in 'live': one BUS.SUMS.SPLIT over the bus's block of rows, all cases at once. */
function installedLive(out: CellContent[], cols: CompensationColumns, r: number, bus: string, plan: EquipmentSheetPlan | undefined): void {
  const block = plan?.blocks.get(bus);
  if (!plan || !block) {
    for (const c of [...cols.reactorsInstalled, ...cols.capsInstalled]) out[c] = '=0';
    return;
  }
  const busCol = plan.cols.input.get('bus') as number;
  const q = plan.cols.q as readonly number[];
  out[cols.reactorsInstalled[0] as number] = `=BUS.SUMS.SPLIT(${absCell(r, cols.bus)},` +
    `${rangeOn(plan.layout.sheet, block.first, busCol, block.last, busCol)},${rangeOn(plan.layout.sheet, block.first, q[0] as number, block.last, q[q.length - 1] as number)})`;
}

export const SUMMARY_LABELS = {
  count: 'Buses with a bank',
  weight: 'Lagging kvar of their own items (kvar)',
} as const;

/** The count of banks and, per case, the lagging kvar that weighs each bank's share. */
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
  const withBank = buses.map((b, i) => ({ b, r: i + 1 })).filter(({ b }) => hasBankChoice(choices.get(b.name)));
  cases.forEach((_, k) => {
    const terms = withBank.map(({ r }) => `IF(${absCell(r, cols.total)}>0,MAX(0,${cellOn(SHEETS.buses, r, busCols.qOwn[k] as number, true)}),0)`);
    weight[cols.share[k] as number] = terms.length === 0 ? '=0' : `=${terms.join('+')}`;
  });
  return [blank(), count, weight];
}
