// The power triangle, load reference: Q > 0 absorbed (lagging), Q < 0 delivered (leading).

/** Apparent power √(P² + Q²), kVA. hypot avoids overflow for large inputs. */
export function apparentPower(pKw: number, qKvar: number): number {
  return Math.hypot(pKw, qKvar);
}

/** |P| / S; undefined when S = 0 (no power factor exists). */
export function powerFactor(pKw: number, qKvar: number): number | undefined {
  const s = Math.hypot(pKw, qKvar);
  return s === 0 ? undefined : Math.abs(pKw) / s;
}

/** Q / P; undefined when P = 0. */
export function tanPhi(pKw: number, qKvar: number): number | undefined {
  return pKw === 0 ? undefined : qKvar / pKw;
}

/** tan(acos(cos φ)) computed as √(1 − c²)/c, exact for c = 1 and stable near it. */
export function tanFromCos(cosPhi: number): number {
  return Math.sqrt(1 - cosPhi * cosPhi) / cosPhi;
}
