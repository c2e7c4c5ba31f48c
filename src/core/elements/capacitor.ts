// Capacitor steps, with or without a series detuning reactor of p % (p = X_L/X_C at fundamental).
// Operation order mirrors the plain-formula expansions.

/** Detuning factor at the operating frequency: p/100·(f/fr)², the branch's X_L/X_C. Resonance at ≥ 1. */
export function detuningAtFrequency(pPct: number, fRatedHz: number, fHz: number): number {
  const fr = fHz / fRatedHz;
  return (pPct / 100) * (fr * fr);
}

/**
 * Output of a capacitor step, kvar (load reference, so < 0): −Qr·(U/Ur)²·(f/fr)/(1 − p/100·(f/fr)²).
 * Caller checks the branch is below resonance (detuningAtFrequency < 1).
 */
export function capacitorBankKvar(
  qRatedKvar: number,
  uRatedKv: number,
  uKv = uRatedKv,
  pPct = 0,
  fRatedHz = 50,
  fHz = fRatedHz,
): number {
  const ur = uKv / uRatedKv;
  const fr = fHz / fRatedHz;
  return (-qRatedKvar * (ur * ur) * fr) / (1 - detuningAtFrequency(pPct, fRatedHz, fHz));
}

/** Voltage across the capacitors of a detuned step, kV: U/(1 − p/100). */
export function detunedCapacitorVoltage(uKv: number, pPct: number): number {
  return uKv / (1 - pPct / 100);
}

/** Series resonance (tuning) order of a detuned step: n = 1/√(p/100). */
export function tuningOrder(pPct: number): number {
  return 1 / Math.sqrt(pPct / 100);
}
