// A feeder cable: a cable that feeds a bus is a branch like a line, with its series R and X
// given per km in Ω (the way cable makers state them) and its charging in µF/km like a cable
// on the Cables sheet. Every value but voltage and length is optional: a blank R (with no
// cross-section) or X counts no loss and validation says so on the row (lineResistance.ts), a
// blank C counts no charging, a blank rated current gives no loading.
import { HZ, S_UNIT, call, col, ifPositive, neg, num } from './expr.ts';
import { defineKind } from './spec.ts';
import { RATED_KVA, SERIES_LOSS } from './conductor.ts';
import { FEEDERS_SHEET } from './sheets.ts';

export const FEEDER = defineKind({
  name: 'feeder',
  sheet: FEEDERS_SHEET,
  role: 'branch',
  required: ['u_kv', 'len_km'],
  voltageAt: 'both',
  branch: {
    pLoss: SERIES_LOSS,
    rating: RATED_KVA,
    qAbsorbed: ifPositive(
      col('x_ohm_km'),
      call('KVAR.SERIES', col('u_kv'), S_UNIT, col('x_ohm_km'), col('len_km')),
      num(0),
    ),
    qDelivered: ifPositive(
      col('c_uf_km'),
      neg(call('KVAR.CABLE', col('u_kv'), col('c_uf_km'), col('len_km'), HZ)),
      num(0),
    ),
  },
  traits: { charging: true },
  summary:
    'series loss 3·I²·R (KW.LINE.LOSS; R as given, or by CABLE.R.CU / CABLE.R.AL from the cross-section) and absorption 3·I²·X (KVAR.SERIES, when X is given) at the loading of the bus it feeds, and charging ω·C·U² (KVAR.CABLE, when C is given)',
});
