// The columns of the Compensation sheet: per bus the bank chosen there (inputs) and what it is
// (static: totals, tuning, capacitor voltage, resonance, voltage rise), then per case what it
// does (need, steps in, output, reactor, Q and cos φ after).
import type { ColumnInfo } from './document.ts';
import { FORMATS } from './buildLayout.ts';

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

export function hasBankChoice(choice: BankChoice | undefined): boolean {
  return (
    choice !== undefined &&
    ((choice.fixed_kvar ?? 0) > 0 || ((choice.step_kvar ?? 0) > 0 && (choice.steps ?? 0) > 0))
  );
}

export function hasReactorChoice(choice: BankChoice | undefined): boolean {
  return (choice?.reactor_kvar ?? 0) > 0;
}

export const BANK_INPUTS = [
  { key: 'fixed_kvar', header: 'Fixed (kvar)', format: FORMATS.kvar, width: 9 },
  { key: 'step_kvar', header: 'Step (kvar)', format: FORMATS.kvar, width: 9 },
  { key: 'steps', header: 'Steps', format: FORMATS.count, width: 7 },
  { key: 'p_pct', header: 'Detuning p (%)', format: '0.00', width: 9 },
  { key: 'u_rated_kv', header: 'Capacitor rated voltage (kV)', format: '0.0##', width: 11 },
  { key: 'reactor_kvar', header: 'Reactor (kvar)', format: FORMATS.kvar, width: 9 },
] as const;
export const NOTE_HEADER = 'Design notes';

export const SUMMARY_LABELS = {
  count: 'Buses with a bank',
  weight: 'Lagging kvar of their own items (kvar)',
  perKvar: 'Site need per kvar of that (kvar/kvar)',
  even: 'Site need per bank when none lags (kvar)',
  /** Partial sums of the weight row when it has too many banks for one formula. */
  weightPart: 'Lagging kvar of their own items, part',
} as const;

export interface CompensationColumns {
  readonly bus: 0;
  readonly u: number;
  readonly ssc: number;
  readonly input: Readonly<Record<(typeof BANK_INPUTS)[number]['key'], number>>;
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
  /** Per case. */
  readonly needCap: readonly number[];
  readonly stepsIn: readonly number[];
  readonly capOut: readonly number[];
  readonly reactorIn: readonly number[];
  readonly qAfter: readonly number[];
  readonly cosAfter: readonly number[];
  readonly needInd: readonly number[];
  readonly within: readonly number[];
  readonly columns: readonly ColumnInfo[];
}

export function planCompensationColumns(cases: readonly string[]): CompensationColumns {
  const columns: ColumnInfo[] = [{ header: 'Bus', width: 14 }];
  const add = (header: string, format: string | undefined, width: number, computed = true) =>
    columns.push({
      header,
      ...(format ? { format } : {}),
      width: Math.max(width, Math.min(header.length + 1, 16)),
      ...(computed ? { computed } : {}),
    }) - 1;
  const u = add('U (kV)', '0.0##', 8);
  const ssc = add('Short-circuit power (MVA)', '0.0', 10);
  const input = Object.fromEntries(
    BANK_INPUTS.map((b) => [b.key, add(b.header, b.format, b.width, false)]),
  ) as CompensationColumns['input'];
  const fixed = {
    total: add('Bank total (kvar)', FORMATS.kvar, 9),
    tune: add('Tuning order', '0.00', 8),
    uCap: add('Capacitor voltage (kV)', '0.000', 9),
    stepNameplate: add('Step nameplate (kvar)', FORMATS.kvar, 9),
    plainInstalled: add('Plain capacitors installed (kvar)', FORMATS.kvar, 10),
    orderStep: add('Resonance order, first step', '0.00', 9),
    orderTotal: add('Resonance order, whole bank', '0.00', 9),
    check: add('Resonance check', undefined, 14),
    vriseStep: add('Voltage rise per step (%)', '0.00', 9),
    vriseTotal: add('Voltage rise, whole bank (%)', '0.00', 9),
    note: add(NOTE_HEADER, undefined, 40, false),
  };
  const per = {
    needCap: [] as number[],
    stepsIn: [] as number[],
    capOut: [] as number[],
    reactorIn: [] as number[],
    qAfter: [] as number[],
    cosAfter: [] as number[],
    needInd: [] as number[],
    within: [] as number[],
  };
  for (const c of cases) {
    per.needCap.push(add(`Capacitive need ${c} (kvar)`, FORMATS.kvar, 10));
    per.stepsIn.push(add(`Steps in ${c}`, FORMATS.count, 7));
    per.capOut.push(add(`Capacitor output ${c} (kvar)`, FORMATS.kvar, 10));
    per.reactorIn.push(add(`Reactor in ${c} (kvar)`, FORMATS.kvar, 9));
    per.qAfter.push(add(`Q after ${c} (kvar)`, FORMATS.kvar, 10));
    per.cosAfter.push(add(`cos φ after ${c}`, FORMATS.pf, 8));
    per.needInd.push(add(`Inductive need ${c} (kvar)`, FORMATS.kvar, 10));
    per.within.push(add(`Within requirement ${c}`, undefined, 9));
  }
  return { bus: 0, u, ssc, input, ...fixed, ...per, columns };
}
