import { S_UNIT, add, call, col } from './expr.ts';
import { defineKind } from './spec.ts';
import { TRANSFORMERS_SHEET } from './sheets.ts';

export const TRANSFORMER = defineKind({
  name: 'transformer',
  sheet: TRANSFORMERS_SHEET,
  role: 'branch',
  required: ['s_kva', 'uk_pct', 'i0_pct', 'p0_kw', 'pk_kw'],
  // u_kv of a transformer is its secondary: the voltage of the bus it feeds.
  voltageAt: 'to_bus',
  branch: {
    pLoss: call('KW.XFMR.LOSS', col('s_kva'), col('p0_kw'), col('pk_kw'), S_UNIT),
    qAbsorbed: add(
      call('KVAR.XFMR.MAG', col('s_kva'), col('i0_pct'), col('p0_kw')),
      call('KVAR.XFMR.LEAK', col('s_kva'), col('uk_pct'), S_UNIT, col('pk_kw')),
    ),
    rating: 's_kva',
  },
  summary: 'losses at the loading of the bus it feeds: KW.XFMR.LOSS, KVAR.XFMR.MAG + KVAR.XFMR.LEAK',
});
