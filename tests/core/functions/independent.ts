// Independent routes to the catalogue's numbers, for tests. Nothing here imports src: each is a
// small calculation of its own, by a different route where one exists (phasors and complex power
// with complex.js, Pythagoras instead of trigonometry, a root found by bisection instead of a
// closed form, ohms instead of per-unit), so a slip in the catalogue cannot hide in both.
// Conventions: three-phase, balanced; U line-to-line; load reference (absorbed Q > 0).
import Complex from 'complex.js';

export const omega = (fHz: number): number => 2 * Math.PI * fHz;

/** Root of a continuous f on [lo, hi] where f changes sign, by bisection (to the last bit). */
export function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  const fa = f(a);
  if (Math.sign(fa) === Math.sign(f(b))) throw new Error(`no sign change of f on [${lo}, ${hi}]`);
  for (let i = 0; i < 200 && a < b; i++) {
    const m = (a + b) / 2;
    if (m === a || m === b) break;
    if (Math.sign(f(m)) === Math.sign(fa)) a = m;
    else b = m;
  }
  return (a + b) / 2;
}

/** Reactive power of P at power factor cos φ, by Pythagoras on S = P/cos φ (no trigonometry). */
export function qFromPowerFactor(pKw: number, cosPhi: number): number {
  const s = pKw / cosPhi;
  return Math.sqrt(s * s - pKw * pKw);
}

/** Complex power drawn by a star of three equal impedances `z` (Ω) at line voltage `uKv`, kVA. */
export function starPower(uKv: number, z: Complex): Complex {
  const uPhase = new Complex((uKv * 1000) / Math.sqrt(3), 0);
  const current = uPhase.div(z);
  return uPhase.mul(current.conjugate()).mul(3).div(1000);
}

/** Star-equivalent capacitance per phase (F) of a capacitor rated qKvar at uRatedKv and fRatedHz. */
export function capacitanceOfRating(qKvar: number, uRatedKv: number, fRatedHz: number): number {
  return (qKvar * 1000) / (omega(fRatedHz) * (uRatedKv * 1000) ** 2);
}

/**
 * A capacitor step as a series L–C branch per phase: C from the nameplate, the reactor's
 * reactance p % of the capacitor's at the rated frequency. Impedance at frequency f, Ω.
 */
export function detunedBranch(qKvar: number, uRatedKv: number, pPct: number, fRatedHz: number) {
  const c = capacitanceOfRating(qKvar, uRatedKv, fRatedHz);
  const l = ((pPct / 100) * (1 / (omega(fRatedHz) * c))) / omega(fRatedHz);
  return {
    impedance: (fHz: number) => new Complex(0, omega(fHz) * l - 1 / (omega(fHz) * c)),
    capacitorImpedance: (fHz: number) => new Complex(0, -1 / (omega(fHz) * c)),
  };
}

/** Output of a capacitor step (kvar, < 0) from its branch impedance. */
export function capacitorStepKvar(
  qKvar: number,
  uRatedKv: number,
  uKv: number,
  pPct = 0,
  fRatedHz = 50,
  fHz = fRatedHz,
): number {
  return starPower(uKv, detunedBranch(qKvar, uRatedKv, pPct, fRatedHz).impedance(fHz)).im;
}

/** Line-to-line voltage across the capacitors of a detuned step (kV), by the L–C voltage divider. */
export function detunedCapacitorKv(uKv: number, pPct: number): number {
  const branch = detunedBranch(100, uKv, pPct, 50); // any rating: the divider depends on p only
  return new Complex(uKv, 0).mul(branch.capacitorImpedance(50)).div(branch.impedance(50)).abs();
}

/** Series resonance of a detuned step as a multiple of the rated frequency: the zero of its reactance. */
export function tuningOrderByBisection(pPct: number): number {
  const branch = detunedBranch(100, 0.4, pPct, 50);
  return bisect((h) => branch.impedance(50 * h).im, 1e-3, 1e3);
}

/**
 * Parallel resonance of the supply (a reactance giving sscMva at the fundamental) with a
 * capacitor step of qKvar (detuned p %): the harmonic order where the admittance seen from the
 * bus is zero, found by bisection. Any voltage gives the same order; 1 kV is used.
 */
export function parallelResonanceOrder(sscMva: number, qKvar: number, pPct = 0): number {
  const xSource = 1 / sscMva; // Ω at 1 kV: U²/Ssc
  const branch = detunedBranch(qKvar, 1, pPct, 50);
  const admittance = (h: number) =>
    new Complex(0, h * xSource).inverse().add(branch.impedance(50 * h).inverse()).im;
  const below = pPct > 0 ? tuningOrderByBisection(pPct) * (1 - 1e-12) : 1e3;
  return bisect(admittance, 1e-3, below);
}

/** Short-circuit power at a transformer's secondary (MVA), adding ohms at 0.4 kV. */
export function shortCircuitMvaInOhms(sKva: number, ukPct: number, sscUpMva?: number): number {
  const u2 = 0.4 ** 2; // kV²: MVA = kV²/Ω
  const zTransformer = ((ukPct / 100) * u2) / (sKva / 1000);
  const zSupply = sscUpMva === undefined ? 0 : u2 / sscUpMva;
  return u2 / (zTransformer + zSupply);
}

/** Voltage rise (%) when qKvar is switched onto a bus of sscMva: ΔU ≈ X·Q/U, at 13.8 kV in ohms. */
export function voltageRiseApprox(qKvar: number, sscMva: number): number {
  const u = 13.8; // kV; the result does not depend on it
  const x = (u * u) / sscMva; // Ω
  const deltaKv = (x * (qKvar / 1000)) / u; // Ω·Mvar/kV = kV
  return (100 * deltaKv) / u;
}

/** Net reactive power of a line (kvar) from phasors: 3·I²·X in series minus the shunt charging. */
export function lineNetKvarByPhasors(
  uKv: number,
  sKva: number,
  lMhKm: number,
  cNfKm: number,
  lenKm: number,
  fHz = 50,
): number {
  const current = (sKva * 1000) / (Math.sqrt(3) * uKv * 1000); // A
  const series = new Complex(0, omega(fHz) * lMhKm * 1e-3 * lenKm).mul(3 * current * current).div(1000);
  const shunt = starPower(uKv, new Complex(0, omega(fHz) * cNfKm * 1e-9 * lenKm).inverse());
  return series.add(shunt).im;
}

/**
 * Series loss of a line (kW) from the phase current as a phasor at power factor `cosPhi`: the
 * voltage across the conductor's resistance times the current, summed over three phases. The
 * loss must not depend on cos φ, only on the apparent power.
 */
export function lineLossByPhasors(
  uKv: number,
  sKva: number,
  rOhmKm: number,
  lenKm: number,
  cosPhi = 0.85,
): number {
  const uPhase = (uKv * 1000) / Math.sqrt(3);
  const sPhase = new Complex(cosPhi, Math.sqrt(1 - cosPhi * cosPhi)).mul((sKva * 1000) / 3); // VA
  const current = sPhase.div(uPhase).conjugate(); // A
  const drop = current.mul(rOhmKm * lenKm); // V across the resistance
  return drop.mul(current.conjugate()).mul(3).re / 1000;
}

/**
 * Series absorption of a line or cable (kvar) from the phase current as a phasor at power factor
 * `cosPhi`: the voltage across the series reactance times the conjugate current, three phases,
 * imaginary part. Like the loss, it must depend on the apparent power alone.
 */
export function seriesKvarByPhasors(
  uKv: number,
  sKva: number,
  xOhmKm: number,
  lenKm: number,
  cosPhi = 0.85,
): number {
  const uPhase = (uKv * 1000) / Math.sqrt(3);
  const sPhase = new Complex(cosPhi, Math.sqrt(1 - cosPhi * cosPhi)).mul((sKva * 1000) / 3); // VA
  const current = sPhase.div(uPhase).conjugate(); // A
  const drop = current.mul(new Complex(0, xOhmKm * lenKm)); // V across the reactance
  return drop.mul(current.conjugate()).mul(3).im / 1000;
}

/** Surge impedance loading (MW): the through power at which the line's net Q is zero, by bisection. */
export function silByBisection(uKv: number, lMhKm: number, cNfKm: number): number {
  return bisect((mw) => lineNetKvarByPhasors(uKv, mw * 1000, lMhKm, cNfKm, 1), 1e-3, 1e5);
}

/** Charging of a cable (kvar, < 0): the star of its shunt capacitances. */
export function cableChargingKvar(uKv: number, cUfKm: number, lenKm: number, fHz = 50): number {
  return starPower(uKv, new Complex(0, omega(fHz) * cUfKm * 1e-6 * lenKm).inverse()).im;
}

/** Installed kvar in whole steps covering `need`, counted in exact integers of 1e-9 kvar. */
export function wholeSteps(needKvar: number, stepKvar: number): number {
  if (needKvar <= 0) return 0;
  const need = BigInt(Math.round(needKvar * 1e9));
  const step = BigInt(Math.round(stepKvar * 1e9));
  const steps = (need + step - 1n) / step;
  return Number(steps * step) / 1e9;
}
