// A bank (and a shunt reactor) chosen for a bus: what the Compensation sheet's inputs hold, what
// the design proposes and what the CLI reads back from a workbook. Outputs in kvar at the bus's
// operating voltage; blanks mean none.

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

/** Fixed part plus every step, kvar (0 when nothing is given). */
export function bankTotal(c: BankChoice | undefined): number {
  if (!c) return 0;
  return (c.fixed_kvar ?? 0) + (c.step_kvar ?? 0) * (c.steps ?? 0);
}

export function hasBankChoice(choice: BankChoice | undefined): boolean {
  return bankTotal(choice) > 0;
}

export function hasReactorChoice(choice: BankChoice | undefined): boolean {
  return (choice?.reactor_kvar ?? 0) > 0;
}
