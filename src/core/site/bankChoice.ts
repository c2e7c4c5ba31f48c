// A bank (and a shunt reactor) chosen for a bus: what the Compensation sheet's inputs hold, what
// the design proposes and what the CLI reads back from a workbook. Outputs in kvar at the bus's
// operating voltage; blanks mean none. A bank's step is its smallest stage, its steps its
// physical stages, and its series (blank: 1:1:1) how the stages grow; the controller switches
// whole smallest steps up to its step count (stepSeries.ts).
import { DEFAULT_STEP_SERIES, controllerCount, largestRatio, type StepSeries } from './stepSeries.ts';

export interface BankChoice {
  readonly bus: string;
  readonly fixed_kvar?: number;
  readonly step_kvar?: number;
  /** Physical stages (each with its contactor or breaker). */
  readonly steps?: number;
  /** How the stages grow, in smallest steps; blank: equal stages. */
  readonly series?: StepSeries;
  readonly p_pct?: number;
  readonly u_rated_kv?: number;
  readonly reactor_kvar?: number;
  /** Why it was chosen and what to watch (kept as text). */
  readonly note?: string;
}

/** Positions the bank's controller switches, in smallest steps (the controller step count). */
export function controllerStepsOf(c: BankChoice): number {
  return controllerCount(c.series ?? DEFAULT_STEP_SERIES, c.steps ?? 0);
}

/**
 * The most one switching operation adds, kvar: the largest stage (at least one smallest step when
 * a step is given), or the fixed part of a bank without steps. Voltage rise per step reads it.
 */
export function largestStageKvar(c: BankChoice): number {
  const step = c.step_kvar ?? 0;
  if (!(step > 0)) return c.fixed_kvar ?? 0;
  return step * Math.max(1, largestRatio(c.series ?? DEFAULT_STEP_SERIES, c.steps ?? 0));
}

/** Fixed part plus every stage, kvar (0 when nothing is given). */
export function bankTotal(c: BankChoice | undefined): number {
  if (!c) return 0;
  return (c.fixed_kvar ?? 0) + (c.step_kvar ?? 0) * controllerStepsOf(c);
}

export function hasBankChoice(choice: BankChoice | undefined): boolean {
  return bankTotal(choice) > 0;
}

export function hasReactorChoice(choice: BankChoice | undefined): boolean {
  return (choice?.reactor_kvar ?? 0) > 0;
}
