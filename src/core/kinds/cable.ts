import { HZ, call, col } from './expr.ts';
import { defineKind } from './spec.ts';
import { CABLES_SHEET } from './sheets.ts';

export const CABLE = defineKind({
  name: 'cable',
  sheet: CABLES_SHEET,
  role: 'shunt',
  required: ['u_kv', 'c_uf_km', 'len_km'],
  load: { range: [0, 1], meaning: '0 = de-energised, any other value = energised' },
  voltageAt: 'bus',
  shunt: { q: call('KVAR.CABLE', col('u_kv'), col('c_uf_km'), col('len_km'), HZ) },
  traits: { charging: true },
  summary: 'charging kvar delivered while energised (KVAR.CABLE), times the units running',
});
