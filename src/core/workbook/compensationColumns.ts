// The columns of the Compensation sheet: per bus the bank chosen there (inputs) and what it is
// (total, tuning, capacitor voltage, resonance, voltage rise), then per case what it does (need,
// steps in, output, reactor, Q and cos φ after) and, at the point of connection, whether the
// requirement is met.
import type { ColumnInfo } from './document.ts';
import { FORMATS } from './layout.ts';

export const BANK_INPUTS = [
  { key: 'fixed_kvar', header: 'Fixed (kvar)', format: FORMATS.kvar, width: 9 },
  { key: 'step_kvar', header: 'Step (kvar)', format: FORMATS.kvar, width: 9 },
  { key: 'steps', header: 'Steps', format: FORMATS.count, width: 7 },
  // Text: 1:1:1, 1:2:2 or 1:2:4 (stepSeries.ts); blank is 1:1:1, so older sheets read as before.
  { key: 'series', header: 'Step series', format: undefined, width: 8 },
  { key: 'p_pct', header: 'Detuning p (%)', format: '0.00', width: 9 },
  { key: 'u_rated_kv', header: 'Capacitor rated voltage (kV)', format: '0.0##', width: 11 },
  { key: 'reactor_kvar', header: 'Reactor (kvar)', format: FORMATS.kvar, width: 9 },
] as const;
export type BankInputKey = (typeof BANK_INPUTS)[number]['key'];
export const NOTE_HEADER = 'Design notes';

export const COMP_HEADERS = {
  bus: 'Bus',
  u: 'U (kV)',
  ssc: 'Short-circuit power (MVA)',
  controllerSteps: 'Controller steps',
  largestStage: 'Largest stage (kvar)',
  total: 'Bank total (kvar)',
  tune: 'Tuning order',
  uCap: 'Capacitor voltage (kV)',
  stepNameplate: 'Step nameplate (kvar)',
  plainInstalled: 'Plain capacitors installed (kvar)',
  orderStep: 'Resonance order, first step',
  orderTotal: 'Resonance order, whole bank',
  check: 'Resonance check',
  vriseStep: 'Voltage rise per step (%)',
  vriseTotal: 'Voltage rise, whole bank (%)',
  needCap: (c: string) => `Capacitive need ${c} (kvar)`,
  available: (c: string) => `Bank in service ${c} (kvar)`,
  stepsIn: (c: string) => `Steps in ${c}`,
  capOut: (c: string) => `Capacitor output ${c} (kvar)`,
  reactorIn: (c: string) => `Reactor in ${c} (kvar)`,
  qAfter: (c: string) => `Q after ${c} (kvar)`,
  cosAfter: (c: string) => `cos φ after ${c}`,
  needInd: (c: string) => `Inductive need ${c} (kvar)`,
  within: (c: string) => `Within requirement ${c}`,
  zoneCharging: 'Charging in zone, most of any case (kvar)',
  /** Label of the summary row below the buses. */
  allBanks: 'All banks',
} as const;

export interface CompensationColumns {
  readonly bus: 0;
  readonly u: number;
  readonly ssc: number;
  readonly input: Readonly<Record<BankInputKey, number>>;
  readonly controllerSteps: number;
  readonly largestStage: number;
  readonly total: number;
  readonly tune: number;
  readonly uCap: number;
  readonly stepNameplate: number;
  readonly plainInstalled: number;
  readonly orderStep: number;
  readonly orderTotal: number;
  readonly check: number;
  readonly vriseStep: number;
  readonly vriseTotal: number;
  readonly note: number;
  readonly needCap: readonly number[];
  readonly available: readonly number[];
  readonly stepsIn: readonly number[];
  readonly capOut: readonly number[];
  readonly reactorIn: readonly number[];
  readonly qAfter: readonly number[];
  readonly cosAfter: readonly number[];
  readonly needInd: readonly number[];
  readonly within: readonly number[];
  /** Cable and line charging of the bus's zone (zoneCharging.ts); last, so older sheets keep their columns. */
  readonly zoneCharging: number;
  readonly columns: readonly ColumnInfo[];
}

/**
 * Appends a column to `columns` and returns its index: at least as wide as its header (up to 16
 * characters), computed unless said otherwise. Shared by the sheets that lay out bank columns.
 */
export function columnAdder(columns: ColumnInfo[]) {
  return (header: string, format: string | undefined, width: number, computed = true): number =>
    columns.push({
      header,
      ...(format ? { format } : {}),
      width: Math.max(width, Math.min(header.length + 1, 16)),
      ...(computed ? { computed } : {}),
    }) - 1;
}

export function planCompensationColumns(cases: readonly string[]): CompensationColumns {
  const columns: ColumnInfo[] = [{ header: COMP_HEADERS.bus, width: 14 }];
  const add = columnAdder(columns);
  const u = add(COMP_HEADERS.u, FORMATS.kv, 8);
  const ssc = add(COMP_HEADERS.ssc, '0.0', 10);
  const input = Object.fromEntries(
    BANK_INPUTS.map((b) => [b.key, add(b.header, b.format, b.width, false)]),
  ) as Record<BankInputKey, number>;
  const fixed = {
    controllerSteps: add(COMP_HEADERS.controllerSteps, FORMATS.count, 9),
    largestStage: add(COMP_HEADERS.largestStage, FORMATS.kvar, 9),
    total: add(COMP_HEADERS.total, FORMATS.kvar, 9),
    tune: add(COMP_HEADERS.tune, '0.00', 8),
    uCap: add(COMP_HEADERS.uCap, '0.000', 9),
    stepNameplate: add(COMP_HEADERS.stepNameplate, FORMATS.kvar, 9),
    plainInstalled: add(COMP_HEADERS.plainInstalled, FORMATS.kvar, 10),
    orderStep: add(COMP_HEADERS.orderStep, '0.00', 9),
    orderTotal: add(COMP_HEADERS.orderTotal, '0.00', 9),
    check: add(COMP_HEADERS.check, undefined, 14),
    vriseStep: add(COMP_HEADERS.vriseStep, '0.00', 9),
    vriseTotal: add(COMP_HEADERS.vriseTotal, '0.00', 9),
    note: add(NOTE_HEADER, undefined, 40, false),
  };
  const per = {
    needCap: [] as number[],
    available: [] as number[],
    stepsIn: [] as number[],
    capOut: [] as number[],
    reactorIn: [] as number[],
    qAfter: [] as number[],
    cosAfter: [] as number[],
    needInd: [] as number[],
    within: [] as number[],
  };
  for (const c of cases) {
    per.needCap.push(add(COMP_HEADERS.needCap(c), FORMATS.kvar, 10));
    per.available.push(add(COMP_HEADERS.available(c), FORMATS.kvar, 10));
    per.stepsIn.push(add(COMP_HEADERS.stepsIn(c), FORMATS.count, 7));
    per.capOut.push(add(COMP_HEADERS.capOut(c), FORMATS.kvar, 10));
    per.reactorIn.push(add(COMP_HEADERS.reactorIn(c), FORMATS.kvar, 9));
    per.qAfter.push(add(COMP_HEADERS.qAfter(c), FORMATS.kvar, 10));
    per.cosAfter.push(add(COMP_HEADERS.cosAfter(c), FORMATS.pf, 8));
    per.needInd.push(add(COMP_HEADERS.needInd(c), FORMATS.kvar, 10));
    per.within.push(add(COMP_HEADERS.within(c), undefined, 9));
  }
  const zoneCharging = add(COMP_HEADERS.zoneCharging, FORMATS.kvar, 11);
  return { bus: 0, u, ssc, input, ...fixed, ...per, zoneCharging, columns };
}

/** Input columns of the Compensation sheet (typed by the user, kept per bus). */
export function compensationInputCols(cols: CompensationColumns): number[] {
  return [...Object.values(cols.input), cols.note];
}
