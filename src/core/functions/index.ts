// The only list of catalogue functions. Adding a function: write its spec in a family file,
// then add it here.
import type { FunctionSpec } from '../registry/spec.ts';
import { COSPHI, KVA_TOTAL, TANPHI } from './powerTriangle.ts';

export const CATALOGUE: readonly FunctionSpec[] = [KVA_TOTAL, COSPHI, TANPHI];

const byName = new Map(CATALOGUE.map((f) => [f.name, f]));
export function findFunction(name: string): FunctionSpec | undefined {
  return byName.get(name.toUpperCase());
}
