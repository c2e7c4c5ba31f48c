// Conductor resistance from the cross-section: IEC 60228 Table 2, the maximum DC resistance at
// 20 °C of class 2 (stranded) conductors, plain copper and aluminium, in Ω/km (values from
// memory; aluminium class 2 starts at 10 mm²). At another temperature θ the resistance is
// R20·(1 + α20·(θ − 20)) with α20 = 3.93e-3 /K for copper and 4.03e-3 /K for aluminium
// (IEC 60287-1-1 Table 1, from memory).

export type ConductorMetal = 'cu' | 'al';

/** [cross-section mm², copper Ω/km, aluminium Ω/km or undefined] in increasing size. */
export const IEC60228_CLASS2: ReadonlyArray<readonly [number, number, number | undefined]> = [
  [1.5, 12.1, undefined],
  [2.5, 7.41, undefined],
  [4, 4.61, undefined],
  [6, 3.08, undefined],
  [10, 1.83, 3.08],
  [16, 1.15, 1.91],
  [25, 0.727, 1.2],
  [35, 0.524, 0.868],
  [50, 0.387, 0.641],
  [70, 0.268, 0.443],
  [95, 0.193, 0.32],
  [120, 0.153, 0.253],
  [150, 0.124, 0.206],
  [185, 0.0991, 0.164],
  [240, 0.0754, 0.125],
  [300, 0.0601, 0.1],
  [400, 0.047, 0.0778],
  [500, 0.0366, 0.0605],
  [630, 0.0283, 0.0469],
  [800, 0.0221, 0.0367],
  [1000, 0.0176, 0.0291],
  [1200, 0.0151, 0.0247],
  [1400, 0.0129, 0.0212],
  [1600, 0.0113, 0.0186],
  [1800, 0.0101, 0.0165],
  [2000, 0.009, 0.0149],
  [2500, 0.0072, 0.0127],
];

/** Temperature coefficient of resistance at 20 °C, 1/K (IEC 60287-1-1 Table 1, from memory). */
export const ALPHA20: Readonly<Record<ConductorMetal, number>> = { cu: 3.93e-3, al: 4.03e-3 };

/** The standard cross-sections the table gives for a metal, mm². */
export function standardSections(metal: ConductorMetal): number[] {
  return IEC60228_CLASS2.filter((r) => (metal === 'cu' ? r[1] : r[2]) !== undefined).map((r) => r[0]);
}

/** DC resistance at 20 °C, Ω/km, of a standard class 2 section; undefined for a size not in the table. */
export function resistance20(metal: ConductorMetal, areaMm2: number): number | undefined {
  const row = IEC60228_CLASS2.find((r) => r[0] === areaMm2);
  return row ? (metal === 'cu' ? row[1] : row[2]) : undefined;
}

/** Resistance at θ °C from the value at 20 °C: R20·(1 + α20·(θ − 20)). */
export function resistanceAt(metal: ConductorMetal, r20: number, thetaC: number): number {
  return r20 * (1 + ALPHA20[metal] * (thetaC - 20));
}
