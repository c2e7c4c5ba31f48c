// The only list of catalogue functions. Adding a function: write its spec in a family file,
// then add it here. This order is the order of FUNCTIONS.md and the help panel.
import type { FunctionSpec } from '../registry/spec.ts';
import { COSPHI, KVA_TOTAL, TANPHI } from './powerTriangle.ts';
import { KVAR_GEN, KVAR_GEN_MAX, KVAR_LOAD, KVAR_MOTOR, KVAR_MOTORCAP_MAX, KW_MOTOR } from './loads.ts';
import { KVAR_XFMR_LEAK, KVAR_XFMR_MAG, KW_XFMR_LOSS, XFMR_UKMIN } from './transformers.ts';
import { CABLE_CAP, KVAR_CABLE, KVAR_LINE, LINE_SIL } from './cables.ts';
import { KVAR_SERIES, KW_LINE_LOSS } from './lineLoss.ts';
import { CABLE_R_AL, CABLE_R_CU } from './conductors.ts';
import { CAPBANK_TUNE, CAPBANK_UCAP, KVAR_CAPBANK, KVAR_REACTOR } from './compensation.ts';
import { CAPBANK_URATED, CAPBANK_USERIES } from './capacitorRating.ts';
import { BANK_ROUNDUP, KVAR_PERKW, KVAR_TOPF, KVAR_TOTAN } from './sizing.ts';
import { RESONANCE_ORDER, SC_MVA_XFMR, VRISE_PCT } from './network.ts';

export const CATALOGUE: readonly FunctionSpec[] = [
  KVA_TOTAL,
  COSPHI,
  TANPHI,
  KVAR_LOAD,
  KW_MOTOR,
  KVAR_MOTOR,
  KVAR_MOTORCAP_MAX,
  KVAR_GEN,
  KVAR_GEN_MAX,
  KVAR_XFMR_MAG,
  KVAR_XFMR_LEAK,
  KW_XFMR_LOSS,
  XFMR_UKMIN,
  KVAR_CABLE,
  CABLE_CAP,
  KVAR_LINE,
  LINE_SIL,
  KW_LINE_LOSS,
  KVAR_SERIES,
  CABLE_R_CU,
  CABLE_R_AL,
  KVAR_CAPBANK,
  CAPBANK_UCAP,
  CAPBANK_TUNE,
  CAPBANK_URATED,
  CAPBANK_USERIES,
  KVAR_REACTOR,
  KVAR_PERKW,
  KVAR_TOPF,
  KVAR_TOTAN,
  BANK_ROUNDUP,
  SC_MVA_XFMR,
  RESONANCE_ORDER,
  VRISE_PCT,
];

const byName = new Map(CATALOGUE.map((f) => [f.name, f]));
export function findFunction(name: string): FunctionSpec | undefined {
  return byName.get(name.toUpperCase());
}
