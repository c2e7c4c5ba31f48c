// The series loss of a line or feeder cable row: with R as typed when given; else with R from
// the copper or aluminium cross-section by IEC 60228 (CABLE.R.CU, CABLE.R.AL) at the conductor
// temperature; else 0, which validation reports (lineResistance.ts). And their rating from
// the rated current.
import { S_UNIT, call, col, ifPositive, mul, num, type Expr } from './expr.ts';

/** Rated kVA of one unit from its current rating: √3·U·I (kV × A = kVA); blank I gives 0, no rating. */
export const RATED_KVA: Expr = mul(num(Math.sqrt(3)), mul(col('u_kv'), col('i_rated_a')));

/** R from the cross-section, Ω/km; 0 when neither section is given. */
const FROM_SECTION: Expr = ifPositive(
  col('cu_mm2'),
  call('CABLE.R.CU', col('cu_mm2'), col('theta_c')),
  ifPositive(col('al_mm2'), call('CABLE.R.AL', col('al_mm2'), col('theta_c')), num(0)),
);

/**
 * 3·I²·R at the kVA carried per unit. The loss is linear in R, so R from the section multiplies
 * the loss at 1 Ω/km: the table's formula then appears once in the exported cell, not once per
 * argument guard of KW.LINE.LOSS (which would pass the 8 192 characters an xlsx formula holds).
 */
export const SERIES_LOSS: Expr = ifPositive(
  col('r_ohm_km'),
  call('KW.LINE.LOSS', col('u_kv'), S_UNIT, col('r_ohm_km'), col('len_km')),
  mul(call('KW.LINE.LOSS', col('u_kv'), S_UNIT, num(1), col('len_km')), FROM_SECTION),
);
