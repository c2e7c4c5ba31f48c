// What compensation saves a year: the utility's reactive charge before and after, and the losses
// it avoids, from P and Q at the point of connection per operating case and the hours each case
// runs. The charge is the one the user enters on the Tariff sheet: a price per kvarh above a free
// share (tan φ × kWh), and/or a penalty per kvar of demand above a free share (tan φ × kW) each
// billing period. Only lagging (drawn) kvar is charged here; tariffs that also charge leading
// kvar are not modelled. The "Quantities and cost" sheet computes the same with formulas.

export interface Tariff {
  /** Price per kvarh drawn above kvarh_free_tan × kWh (0: no energy charge). */
  readonly kvarh_price: number;
  readonly kvarh_free_tan: number;
  /** Penalty per kvar of the largest demand above demand_free_tan × kW, per billing period. */
  readonly demand_price: number;
  readonly demand_free_tan: number;
  readonly periods_per_year: number;
  /** Price per kWh of the energy lost in the site's transformers, lines and cables. */
  readonly energy_price: number;
  /** Hours per year each case runs, by case name; a case not listed runs 0 h. */
  readonly hours: ReadonlyMap<string, number>;
}

/** P and Q at the point of connection in one case, before and after compensation (kW, kvar). */
export interface CaseFlow {
  readonly case: string;
  readonly p_kw: number;
  readonly q_kvar: number;
  readonly p_after_kw: number;
  readonly q_after_kvar: number;
}

export interface CaseSaving {
  readonly case: string;
  readonly hours: number;
  readonly kvarh_before: number;
  readonly kvarh_after: number;
  /** kvar above the free share, before and after (the demand charge takes the largest). */
  readonly excess_before_kvar: number;
  readonly excess_after_kvar: number;
  /** Energy the compensation saves in losses: (P before − P after) × hours, kWh. */
  readonly loss_kwh_saved: number;
}

export interface Saving {
  readonly cases: readonly CaseSaving[];
  readonly charge_before: number;
  readonly charge_after: number;
  readonly losses_saved: number;
  /** charge_before − charge_after + losses_saved, per year. */
  readonly annual_saving: number;
  /** cost / annual_saving in years; null without a cost or without a saving. */
  readonly payback_years: number | null;
}

/** kvar drawn above the free share tan φ × |P|; 0 when within it or leading. */
export function excessKvar(p: number, q: number, freeTan: number): number {
  return Math.max(0, q - freeTan * Math.abs(p));
}

export function annualSaving(flows: readonly CaseFlow[], t: Tariff, cost: number | null): Saving {
  const cases = flows.map((f): CaseSaving => {
    const hours = t.hours.get(f.case) ?? 0;
    return {
      case: f.case,
      hours,
      kvarh_before: excessKvar(f.p_kw, f.q_kvar, t.kvarh_free_tan) * hours,
      kvarh_after: excessKvar(f.p_after_kw, f.q_after_kvar, t.kvarh_free_tan) * hours,
      excess_before_kvar: hours > 0 ? excessKvar(f.p_kw, f.q_kvar, t.demand_free_tan) : 0,
      excess_after_kvar: hours > 0 ? excessKvar(f.p_after_kw, f.q_after_kvar, t.demand_free_tan) : 0,
      loss_kwh_saved: (f.p_kw - f.p_after_kw) * hours,
    };
  });
  const sum = (pick: (c: CaseSaving) => number) => cases.reduce((s, c) => s + pick(c), 0);
  const max = (pick: (c: CaseSaving) => number) => cases.reduce((m, c) => Math.max(m, pick(c)), 0);
  const charge = (kvarh: number, demand: number) =>
    t.kvarh_price * kvarh + t.demand_price * t.periods_per_year * demand;
  const charge_before = charge(
    sum((c) => c.kvarh_before),
    max((c) => c.excess_before_kvar),
  );
  const charge_after = charge(
    sum((c) => c.kvarh_after),
    max((c) => c.excess_after_kvar),
  );
  const losses_saved = t.energy_price * sum((c) => c.loss_kwh_saved);
  const annual_saving = charge_before - charge_after + losses_saved;
  // A saving so small that the cost over it overflows pays nothing back (the sheet says "no saving").
  const payback = cost !== null && annual_saving > 0 ? cost / annual_saving : null;
  return {
    cases,
    charge_before,
    charge_after,
    losses_saved,
    annual_saving,
    payback_years: payback !== null && Number.isFinite(payback) ? payback : null,
  };
}
