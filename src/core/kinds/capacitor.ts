import { HZ, X, call, col, ifPositive, mul, neg, num } from './expr.ts';
import { defineKind } from './spec.ts';
import { BANKS_SHEET } from './sheets.ts';

// Nameplate taken at the site frequency (rated and operating frequency are both the site's).
const output = call('KVAR.CAPBANK', col('q_kvar'), col('u_rated_kv'), col('u_kv'), col('p_pct'), HZ, HZ);

export const CAPACITOR = defineKind({
  name: 'capacitor',
  sheet: BANKS_SHEET,
  role: 'shunt',
  required: ['q_kvar', 'u_rated_kv'],
  load: { range: [0, 1], meaning: 'share of the nameplate switched in' },
  voltageAt: 'bus',
  shunt: {
    q: mul(X, output),
    // A plain (not detuned) capacitor with every unit in: what the supply sees at harmonics.
    resonanceKvar: ifPositive(col('p_pct'), num(0), neg(output)),
  },
  traits: { capacitor: true },
  summary: 'output at the operating voltage (KVAR.CAPBANK) × the share switched in, times the units running',
});
