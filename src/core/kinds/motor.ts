import { X, call, col, div, mul, num } from './expr.ts';
import { defineKind } from './spec.ts';
import { MOTORS_SHEET } from './sheets.ts';
import { MOTOR_SUPPLIES, bySupply } from './supply.ts';

const electricalKw = call('KW.MOTOR', col('p_kw'), col('eff'), X);

export const MOTOR = defineKind({
  name: 'motor',
  sheet: MOTORS_SHEET,
  role: 'shunt',
  required: ['p_kw', 'eff', 'cos_phi'],
  load: { range: [0, 1.5], meaning: 'share of the rated output (0 = stopped)' },
  voltageAt: 'bus',
  shunt: {
    p: electricalKw,
    // A drive-fed motor's own cos φ stays behind the drive: the supply sees the drive's
    // displacement factor (src/core/kinds/supply.ts) on the electrical kW, written P_out·x/η as
    // KW.MOTOR computes it (its calls nested would expand past the 8,192 characters of an xlsx formula).
    q: bySupply(
      MOTOR_SUPPLIES,
      (dpf) => call('KVAR.LOAD', div(mul(col('p_kw'), X), col('eff')), num(dpf)),
      call('KVAR.MOTOR', col('p_kw'), col('eff'), col('cos_phi'), X, col('i0_pct')),
    ),
  },
  traits: { motor: true },
  supplies: MOTOR_SUPPLIES,
  summary:
    "electrical P (KW.MOTOR) and Q (KVAR.MOTOR; fed by a drive: KVAR.LOAD at the drive's displacement factor) at the load factor, times the units running",
});
