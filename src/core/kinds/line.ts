import { HZ, S_UNIT, call, col, neg, num, sub } from './expr.ts';
import { defineKind } from './spec.ts';
import { RATED_KVA, SERIES_LOSS } from './conductor.ts';
import { LINES_SHEET } from './sheets.ts';

const net = (s: typeof S_UNIT) =>
  call('KVAR.LINE', col('u_kv'), s, col('l_mh_km'), col('c_nf_km'), col('len_km'), HZ);

export const LINE = defineKind({
  name: 'line',
  sheet: LINES_SHEET,
  role: 'branch',
  required: ['u_kv', 'l_mh_km', 'c_nf_km', 'len_km'],
  voltageAt: 'both',
  branch: {
    // The resistance is optional (typed, or from the cross-section): with neither, no loss is
    // counted and validation says so on the row (lineResistance.ts), so the gap is never silent.
    pLoss: SERIES_LOSS,
    rating: RATED_KVA,
    // Series absorption = the net kvar at this loading + the charging it offsets.
    qAbsorbed: sub(net(S_UNIT), net(num(0))),
    qDelivered: neg(net(num(0))),
  },
  traits: { charging: true },
  summary:
    'series loss 3·I²·R (KW.LINE.LOSS; R as given, or by CABLE.R.CU / CABLE.R.AL from the cross-section) and absorption 3·I²·X at the loading of the bus it feeds, and charging ω·C·U² (KVAR.LINE)',
});
