// The largest capacitor switched with a motor: KVAR.MOTORCAP.MAX = 0.9·√3·U·I0 (common practice,
// cf. NEMA MG 1 Part 14: the capacitor's current stays below the motor's no-load current, so the
// motor cannot self-excite when it is switched off with its capacitor).
//
// I0 is the nameplate no-load current (i0_pct) when given. When it is blank the limit must not
// rest on a guess that overstates it, so the default is the lowest typical no-load current for
// the motor's size over 2 to 8 poles (the 2-pole column of NO_LOAD_CURRENT_TYPICAL: common
// practice, from memory), sizes outside the table read at its nearest end. The findings say the
// value was assumed and ask for the nameplate one.
import type { EquipmentRow } from './model.ts';
import { runCall } from './calls.ts';
import { motorNoLoadReactivePower } from '../elements/motor.ts';
import { lookup } from './typical/interpolate.ts';
import { MOTOR_MAX_KW, MOTOR_MIN_KW, NO_LOAD_CURRENT_TYPICAL, POLES } from './typical/motors.ts';

export interface SelfExcitationLimit {
  /** Largest capacitor output per motor unit, kvar at the operating voltage. */
  readonly kvar: number;
  /** No-load current used, % of rated current. */
  readonly i0_pct: number;
  /** true when i0_pct was blank and the conservative default was used. */
  readonly i0_assumed: boolean;
}

/** The conservative default no-load current for a motor of this rated output, % (see above). */
export function conservativeNoLoadCurrent(pKw: number): number {
  const size = Math.min(Math.max(pKw, MOTOR_MIN_KW), MOTOR_MAX_KW);
  let lowest = Infinity;
  for (const poles of POLES)
    lowest = Math.min(lowest, lookup(NO_LOAD_CURRENT_TYPICAL[poles], size) ?? Infinity);
  return lowest;
}

/** KVAR.MOTORCAP.MAX for one unit of the motor at voltage u, with the no-load current it rests on. */
export function motorCapacitorLimit(motor: EquipmentRow, uKv: number): SelfExcitationLimit | undefined {
  const { p_kw: p, eff, cos_phi: cos, i0_pct: given } = motor.values;
  if (p === undefined || eff === undefined || cos === undefined || !(uKv > 0)) return undefined;
  const i0 = given ?? conservativeNoLoadCurrent(p);
  if (!Number.isFinite(i0)) return undefined;
  const q0 = motorNoLoadReactivePower(p, eff, cos, i0);
  if (!(q0 > 0)) return undefined;
  const i0A = q0 / (Math.sqrt(3) * uKv);
  const r = runCall({ fn: 'KVAR.MOTORCAP.MAX', args: [uKv, i0A], columns: ['u_kv', 'i0_pct'] });
  return r.ok ? { kvar: r.value, i0_pct: i0, i0_assumed: given === undefined } : undefined;
}

/** The words a finding adds when the no-load current was assumed. */
export function assumedI0Text(motor: EquipmentRow, limit: SelfExcitationLimit): string {
  if (!limit.i0_assumed) return '';
  return ` (no-load current not given: ${limit.i0_pct.toFixed(1)} % assumed, the lowest typical for ${motor.values.p_kw} kW, common practice; give the nameplate no-load current in i0_pct of motor ${motor.tag})`;
}
