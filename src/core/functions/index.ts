// The only list of catalogue functions. Adding a function: write its spec in a family file,
// then add it here (in the order of functions.md).
import type { FunctionSpec } from '../registry/spec.ts';
import { COSPHI, KVA_TOTAL, TANPHI } from './powerTriangle.ts';
import { KVAR_GEN, KVAR_GEN_MAX, KVAR_LOAD, KVAR_MOTOR, KVAR_MOTORCAP_MAX, KW_MOTOR } from './loads.ts';
import { KVAR_XFMR_LEAK, KVAR_XFMR_MAG, KW_XFMR_LOSS, XFMR_UKMIN } from './transformers.ts';

export const CATALOGUE: readonly FunctionSpec[] = [
  KVA_TOTAL, COSPHI, TANPHI,
  KVAR_LOAD, KW_MOTOR, KVAR_MOTOR, KVAR_MOTORCAP_MAX, KVAR_GEN, KVAR_GEN_MAX,
  KVAR_XFMR_MAG, KVAR_XFMR_LEAK, KW_XFMR_LOSS, XFMR_UKMIN,
];

const byName = new Map(CATALOGUE.map((f) => [f.name, f]));
export function findFunction(name: string): FunctionSpec | undefined {
  return byName.get(name.toUpperCase());
}
