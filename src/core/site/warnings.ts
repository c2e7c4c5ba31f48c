// Findings of the compensation design, each with a severity, a code a program can sort on, and
// the row, bus and case it concerns. Wording follows problems.ts: where first, then what.
import { problem, type Problem, type Severity, type Where } from './problems.ts';

export type WarningCode =
  | 'requirement-not-met'
  | 'resonance'
  | 'resonance-not-assessed'
  | 'supply-unknown'
  | 'overload'
  | 'capacitor-overvoltage'
  | 'capacitor-underrated-use'
  | 'capacitor-rating-margin'
  | 'voltage-rise'
  | 'self-excitation'
  | 'overcompensation'
  | 'charging-dominates'
  | 'bus-voltage-unknown'
  | 'detuned-and-plain-mixed'
  | 'bank-capped'
  | 'detuning-choice'
  | 'bank-choice';

export interface DesignWarning extends Problem {
  readonly code: WarningCode;
  readonly case?: string;
}

export function designWarning(
  severity: Severity,
  code: WarningCode,
  where: Where & { case?: string },
  text: string,
): DesignWarning {
  const base = problem(severity, where, where.case !== undefined ? `case ${where.case}: ${text}` : text);
  return { ...base, code, ...(where.case !== undefined ? { case: where.case } : {}) };
}

const RANK: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

/** Most severe first, then by bus and row, so the list reads top-down. */
export function sortWarnings(list: readonly DesignWarning[]): DesignWarning[] {
  return [...list].sort(
    (a, b) =>
      RANK[a.severity] - RANK[b.severity] ||
      (a.bus ?? '').localeCompare(b.bus ?? '') ||
      (a.row ?? 0) - (b.row ?? 0),
  );
}
