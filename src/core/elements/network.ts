// Supply-side checks: short-circuit power, parallel resonance with the bank, voltage rise.

/** Short-circuit power at a transformer's secondary, MVA: 1/((uk/100)/(S/1000) + 1/Ssc_up); infinite supply when omitted. */
export function shortCircuitMvaBehindTransformer(sKva: number, ukPct: number, sscUpMva?: number): number {
  const zt = ukPct / 100 / (sKva / 1000);
  return sscUpMva === undefined ? 1 / zt : 1 / (zt + 1 / sscUpMva);
}

/**
 * Parallel-resonance harmonic order of a bank with the supply: 1/√(p/100 + Qc/(Ssc·1000)).
 * With p = 0 this is √(Ssc·1000/Qc); with a detuning reactor the order moves below the tuning order.
 */
export function resonanceOrder(sscMva: number, qCapKvar: number, pPct = 0): number {
  return 1 / Math.sqrt(pPct / 100 + qCapKvar / (sscMva * 1000));
}

/** Steady-state voltage rise when a bank is switched in, %: 100·Qc/(Ssc·1000). */
export function voltageRisePct(qCapKvar: number, sscMva: number): number {
  return (100 * qCapKvar) / (sscMva * 1000);
}
