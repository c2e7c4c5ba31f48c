import { X, call, col, mul, neg } from './expr.ts';
import { defineKind } from './spec.ts';
import { GENERATORS_SHEET } from './sheets.ts';

// Delivered active power counts negative in bus totals; KVAR.GEN already gives delivered kvar
// as a negative number (an over-excited machine).
export const GENERATOR = defineKind({
  name: 'generator',
  sheet: GENERATORS_SHEET,
  role: 'shunt',
  required: ['p_kw', 'cos_phi'],
  load: { range: [0, 1.5], meaning: 'share of the rated P delivered (0 = stopped)' },
  voltageAt: 'bus',
  shunt: {
    p: neg(mul(col('p_kw'), X)),
    q: call('KVAR.GEN', mul(col('p_kw'), X), col('cos_phi')),
  },
  summary: 'delivers P (negative in bus totals) and kvar (KVAR.GEN), times the units running',
});
