import { X, call, col, mul } from './expr.ts';
import { defineKind } from './spec.ts';
import { BANKS_SHEET } from './sheets.ts';

export const REACTOR = defineKind({
  name: 'reactor',
  sheet: BANKS_SHEET,
  role: 'shunt',
  required: ['q_kvar', 'u_rated_kv'],
  load: { range: [0, 1], meaning: 'share of the nameplate switched in' },
  voltageAt: 'bus',
  shunt: { q: mul(X, call('KVAR.REACTOR', col('q_kvar'), col('u_rated_kv'), col('u_kv'))) },
  summary:
    'absorbed kvar at the operating voltage (KVAR.REACTOR) × the share switched in, times the units running',
});
