// Typical data for low-voltage cage induction motors on a tender-stage list that gives only the
// rated output: efficiency by IEC 60034-30-1 class, full-load cos φ and no-load current by size
// and poles. Sizes 0.75 kW to 1 000 kW; outside that no value is assumed.
import { lookup, type RatingTable } from './interpolate.ts';
import { SOURCES } from './sources.ts';
import type { TypicalNumber } from './transformers.ts';

export type EfficiencyClass = 'IE1' | 'IE2' | 'IE3' | 'IE4';
export type Poles = 2 | 4 | 6 | 8;
export const EFFICIENCY_CLASSES: readonly EfficiencyClass[] = ['IE1', 'IE2', 'IE3', 'IE4'];
export const POLES: readonly Poles[] = [2, 4, 6, 8];

/** Rated outputs of the IEC 60034-30-1 tables, kW; from 200 kW to 1 000 kW the value is constant. */
const SIZES = [
  0.75, 1.1, 1.5, 2.2, 3, 4, 5.5, 7.5, 11, 15, 18.5, 22, 30, 37, 45, 55, 75, 90, 110, 132, 160, 200,
];
export const MOTOR_MIN_KW = 0.75;
export const MOTOR_MAX_KW = 1000;

function table(values: readonly number[]): RatingTable {
  const rows = SIZES.map((s, i) => [s, values[i] as number] as const);
  return [...rows, [MOTOR_MAX_KW, values[values.length - 1] as number] as const];
}

/** IEC 60034-30-1 nominal efficiency at 50 Hz, %, by class and poles (from memory). */
export const EFFICIENCY_TABLES: Readonly<Partial<Record<`${EfficiencyClass}-${Poles}`, RatingTable>>> = {
  'IE1-4': table([
    72.1, 75.0, 77.2, 79.7, 81.5, 83.1, 84.7, 86.0, 87.6, 88.7, 89.3, 89.9, 90.7, 91.2, 91.7, 92.1, 92.7,
    93.0, 93.3, 93.5, 93.8, 94.0,
  ]),
  'IE2-4': table([
    79.6, 81.4, 82.8, 84.3, 85.5, 86.6, 87.7, 88.7, 89.8, 90.6, 91.2, 91.6, 92.3, 92.7, 93.1, 93.5, 94.0,
    94.2, 94.5, 94.7, 94.9, 95.1,
  ]),
  'IE3-2': table([
    80.7, 82.7, 84.2, 85.9, 87.1, 88.1, 89.2, 90.1, 91.2, 91.9, 92.4, 92.7, 93.3, 93.7, 94.0, 94.3, 94.7,
    95.0, 95.2, 95.4, 95.6, 95.8,
  ]),
  'IE3-4': table([
    82.5, 84.1, 85.3, 86.7, 87.7, 88.6, 89.6, 90.4, 91.4, 92.1, 92.6, 93.0, 93.6, 93.9, 94.2, 94.6, 95.0,
    95.2, 95.4, 95.6, 95.8, 96.0,
  ]),
  'IE3-6': table([
    78.9, 81.0, 82.5, 84.3, 85.6, 86.8, 88.0, 89.1, 90.3, 91.2, 91.7, 92.2, 92.9, 93.3, 93.7, 94.1, 94.6,
    94.9, 95.1, 95.4, 95.6, 95.8,
  ]),
  'IE4-4': table([
    85.7, 87.2, 88.2, 89.5, 90.4, 91.1, 91.9, 92.6, 93.3, 93.9, 94.2, 94.5, 94.9, 95.2, 95.4, 95.7, 96.0,
    96.1, 96.3, 96.4, 96.6, 96.7,
  ]),
};

/** IEC 60034-30-1 interpolation coefficients, IE3 4-pole 50 Hz, 0.75 kW to 200 kW (published). */
export const IE3_4POLE_COEFFICIENTS = { A: 0.0773, B: -1.8951, C: 9.2984, D: 83.7025 } as const;

/** η % = A·x³ + B·x² + C·x + D with x = log10(P / 1 kW). */
export function efficiencyPolynomial(pKw: number, k = IE3_4POLE_COEFFICIENTS): number {
  const x = Math.log10(pKw);
  return k.A * x ** 3 + k.B * x ** 2 + k.C * x + k.D;
}

/**
 * Nominal efficiency, %: for IE3 4-pole by the published polynomial (constant from 200 kW), for
 * the other classes from the tables, read on a log scale between sizes. Undefined outside
 * 0.75 to 1 000 kW or for a class and pole count not tabulated here.
 */
export function motorEfficiency(
  pKw: number,
  cls: EfficiencyClass = 'IE3',
  poles: Poles = 4,
): TypicalNumber | undefined {
  if (!(pKw >= MOTOR_MIN_KW && pKw <= MOTOR_MAX_KW)) return undefined;
  if (cls === 'IE3' && poles === 4)
    return { value: efficiencyPolynomial(Math.min(pKw, 200)), source: SOURCES.motorEfficiencyPolynomial };
  const t = EFFICIENCY_TABLES[`${cls}-${poles}`];
  const v = t ? lookup(t, pKw) : undefined;
  return v === undefined ? undefined : { value: v, source: SOURCES.motorEfficiencyTable };
}

const BY_SIZE = [0.75, 1.5, 3, 5.5, 11, 22, 37, 55, 90, 160, 250, 400, 1000];
const bySize = (values: readonly number[]): RatingTable =>
  BY_SIZE.map((s, i) => [s, values[i] as number] as const);

/** Full-load cos φ, 400 V 50 Hz cage motors (common practice, from memory). */
export const COS_PHI_TYPICAL: Readonly<Record<Poles, RatingTable>> = {
  2: bySize([0.82, 0.84, 0.86, 0.87, 0.88, 0.89, 0.89, 0.89, 0.9, 0.9, 0.91, 0.91, 0.91]),
  4: bySize([0.75, 0.79, 0.81, 0.83, 0.84, 0.85, 0.86, 0.86, 0.87, 0.87, 0.88, 0.88, 0.88]),
  6: bySize([0.7, 0.73, 0.76, 0.78, 0.8, 0.82, 0.83, 0.84, 0.85, 0.86, 0.86, 0.87, 0.87]),
  8: bySize([0.64, 0.68, 0.71, 0.74, 0.76, 0.79, 0.8, 0.81, 0.82, 0.83, 0.84, 0.85, 0.85]),
};

/** No-load current, % of rated current (common practice, from memory). */
export const NO_LOAD_CURRENT_TYPICAL: Readonly<Record<Poles, RatingTable>> = {
  2: bySize([45, 42, 38, 34, 30, 27, 25, 24, 22, 20, 19, 18, 18]),
  4: bySize([60, 55, 48, 42, 36, 32, 30, 28, 26, 24, 22, 20, 20]),
  6: bySize([68, 63, 58, 52, 45, 41, 38, 36, 33, 30, 28, 26, 26]),
  8: bySize([70, 67, 62, 56, 50, 45, 42, 40, 37, 34, 32, 30, 30]),
};

export function motorCosPhi(pKw: number, poles: Poles = 4): TypicalNumber | undefined {
  const v = lookup(COS_PHI_TYPICAL[poles], pKw);
  return v === undefined ? undefined : { value: v, source: SOURCES.motorPowerFactor };
}

export function motorNoLoadCurrent(pKw: number, poles: Poles = 4): TypicalNumber | undefined {
  const v = lookup(NO_LOAD_CURRENT_TYPICAL[poles], pKw);
  return v === undefined ? undefined : { value: v, source: SOURCES.motorNoLoadCurrent };
}
