// Loads given by active power and power factor. Load reference: Q > 0 absorbed (lagging).
import { tanFromCos } from './powerTriangle.ts';

/** Reactive power of a load, kvar: P·tan(acos cos φ); negative (delivered) when leading. */
export function loadReactivePower(pKw: number, cosPhi: number, leading = false): number {
  return (leading ? -1 : 1) * pKw * tanFromCos(cosPhi);
}
