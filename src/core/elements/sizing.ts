// Sizing reactive compensation: how many kvar move a load to a target power factor or tan φ.
import { tanFromCos } from './powerTriangle.ts';

/** kvar per kW to move from cos_from to cos_to (both lagging): tan φ1 − tan φ2. */
export function kvarPerKw(cosFrom: number, cosTo: number): number {
  return tanFromCos(cosFrom) - tanFromCos(cosTo);
}

/** kvar to add to reach a lagging cos φ target: Q − P·tan φ_target (> 0 capacitive, < 0 inductive). */
export function kvarToPowerFactor(pKw: number, qKvar: number, cosTarget: number): number {
  return qKvar - pKw * tanFromCos(cosTarget);
}

/** kvar to add to reach a tan φ target: Q − P·tan_target. */
export function kvarToTan(pKw: number, qKvar: number, tanTarget: number): number {
  return qKvar - pKw * tanTarget;
}

/**
 * Tolerance, in steps, below which a quotient counts as whole: 1.1/0.1 is 11.000000000000002 in
 * binary floating point and must give 11 steps, not 12.
 */
export const STEP_TOLERANCE = 1e-9;

/** q rounded up to whole steps; 0 when q ≤ 0. */
export function roundUpToSteps(qKvar: number, stepKvar: number): number {
  if (qKvar <= 0) return 0;
  return Math.ceil(Math.max(0, qKvar / stepKvar - STEP_TOLERANCE)) * stepKvar;
}
