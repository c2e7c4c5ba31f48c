import { X, call, col } from './expr.ts';
import { defineKind } from './spec.ts';
import { MOTORS_SHEET } from './sheets.ts';
import { MOTOR_SUPPLIES } from './supply.ts';

export const MOTOR = defineKind({
  name: 'motor',
  sheet: MOTORS_SHEET,
  role: 'shunt',
  required: ['p_kw', 'eff', 'cos_phi'],
  load: { range: [0, 1.5], meaning: 'share of the rated output (0 = stopped)' },
  voltageAt: 'bus',
  shunt: {
    p: call('KW.MOTOR', col('p_kw'), col('eff'), X),
    q: call('KVAR.MOTOR', col('p_kw'), col('eff'), col('cos_phi'), X, col('i0_pct')),
  },
  traits: { motor: true },
  supplies: MOTOR_SUPPLIES,
  summary: 'electrical P (KW.MOTOR) and Q (KVAR.MOTOR) at the load factor, times the units running',
});
