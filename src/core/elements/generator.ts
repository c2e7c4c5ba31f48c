// Synchronous generators, load reference: an over-excited machine delivers kvar (Q < 0).
import { tanFromCos } from './powerTriangle.ts';

/** Reactive power of a generator at output P and power factor, kvar: −P·tan φ, +P·tan φ when absorbing. */
export function generatorReactivePower(pKw: number, cosPhi: number, absorbing = false): number {
  return (absorbing ? 1 : -1) * pKw * tanFromCos(cosPhi);
}

/** Stator-current limit of reactive capability at output P, kvar (magnitude): √(S² − P²). */
export function generatorReactiveCapability(sKva: number, pKw: number): number {
  return Math.sqrt((sKva - pKw) * (sKva + pKw));
}
