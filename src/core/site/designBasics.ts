// What every step of the site's compensation design shares: its options, the shapes of its
// result, the tolerance it meets the requirement to, the most passes it takes, and the tags of
// the rows it proposes.
import type { EquipmentRow } from './model.ts';
import type { BusBalance, CaseBalance } from './rollup.ts';
import type { Need } from './requirement.ts';
import type { BankDesign } from './bankSizing.ts';
import type { DesignWarning } from './warnings.ts';

export interface CompensationOptions {
  /** Buses that may receive a capacitor bank; default: buses whose own items draw kvar. */
  readonly bankBuses?: readonly string[];
  /** Detuning per bus, % (0, 5.67, 7 or 14), overriding the automatic choice. */
  readonly detuning?: Readonly<Record<string, number>>;
  /** Significant 3rd harmonic (many single-phase loads): detune at 14 % instead of 7 %. */
  readonly thirdHarmonic?: boolean;
  /** Bus for a shunt reactor; default: the bus with the most cable and line charging. */
  readonly reactorBus?: string;
  /** Buses that get a bank besides those (a detuning typed alone on the Compensation sheet). */
  readonly alsoBankBuses?: readonly string[];
  /** Buses whose bank is typed: no proposal there (sheetChoices.ts). */
  readonly typedBuses?: readonly string[];
}

export interface ReactorDesign {
  readonly bus: string;
  readonly u_kv: number;
  readonly q_kvar: number;
  readonly in_service: Readonly<Record<string, boolean>>;
  readonly why: string;
}

export interface PowerPoint {
  readonly p_kw: number;
  readonly q_kvar: number;
  readonly s_kva: number;
  readonly cos_phi: number | null;
  readonly tan_phi: number | null;
  readonly sense: BusBalance['sense'];
}

export interface CaseOutcome {
  readonly case: string;
  readonly before: PowerPoint;
  readonly after: PowerPoint;
  readonly need: Need;
  readonly met_before: boolean;
  readonly met_after: boolean;
}

export interface BusNeed extends Need {
  readonly bus: string;
  readonly case: string;
}

export interface CompensationDesign {
  readonly requirement: string;
  readonly lag_tan: number;
  readonly lead_tan: number;
  readonly needs: readonly BusNeed[];
  readonly banks: readonly BankDesign[];
  readonly reactors: readonly ReactorDesign[];
  readonly cases: readonly CaseOutcome[];
  /** The rows that install the proposal (tags NEW-...), for the workbook and the file. */
  readonly proposedRows: readonly EquipmentRow[];
  /** Balances with the proposal in place, one per case. */
  readonly after: readonly CaseBalance[];
  readonly warnings: readonly DesignWarning[];
}

/** A requirement counts as met within this many kvar. */
export const TOL_KVAR = 0.5;
/** Roll-ups to check a proposal (transformer kvar moves with the loading), at most. */
export const MAX_PASSES = 4;

/** `base`, or `base-2`, `base-3` … the first not taken; it is taken from then on. */
export function uniqueTag(base: string, taken: Set<string>): string {
  let tag = base;
  for (let i = 2; taken.has(tag); i++) tag = `${base}-${i}`;
  taken.add(tag);
  return tag;
}
