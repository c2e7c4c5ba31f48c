import { X, call, col, mul } from './expr.ts';
import { defineKind } from './spec.ts';
import { LOADS_SHEET } from './sheets.ts';
import { LOAD_SUPPLIES } from './supply.ts';

export const LOAD = defineKind({
  name: 'load',
  sheet: LOADS_SHEET,
  role: 'shunt',
  required: ['p_kw', 'cos_phi'],
  load: { range: [0, 1.5], meaning: 'share of the rated P (0 = off)' },
  voltageAt: 'bus',
  shunt: {
    p: mul(col('p_kw'), X),
    q: call('KVAR.LOAD', mul(col('p_kw'), X), col('cos_phi')),
  },
  supplies: LOAD_SUPPLIES,
  summary: 'P = rated P × load factor, Q from cos φ (KVAR.LOAD), times the units running',
});
