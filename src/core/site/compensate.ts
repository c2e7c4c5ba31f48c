// What the banks chosen per bus do in every case: the one rule for "after compensation" that the
// live workbook, the exported workbook, the command line and Checks all follow.
//
// Per case:
// 1. The need: the capacitive kvar that brings the point of connection, as it is before
//    compensation, to the lagging limit (KVAR.TOPF for a cos φ target, KVAR.TOTAN for tan φ).
// 2. Each bank covers the same share of its size: need × (its total ÷ the total of all banks in
//    service). Its controller switches whole smallest steps (BANK.ROUNDUP) above the fixed part
//    to cover that share, never more than its controller step count (1:2:2 and 1:2:4 stages
//    give more positions than stages: stepSeries.ts). When the banks together are big enough, their
//    outputs add up to at least the need. A bank that is a motor's own capacitor is out, fixed
//    part too, in the cases where the motor is stopped (individualCompensation.ts).
// 3. A shunt reactor goes in, whole, in the cases where the point of connection would still be
//    leading beyond the limit with those capacitor outputs (cable charging at light load).
// 4. After: the site is rolled up again with each bank's output and reactor on its bus, so the
//    transformers and lines carry the compensated loading and their losses are taken at it.
// The requirement is judged on that last roll-up.
import type { Site } from './model.ts';
import { runCall } from './calls.ts';
import { bankTotal, controllerStepsOf, type BankChoice } from './bankChoice.ts';
import { connectionNeed, referencePowerKw, requirementBand, type Need } from './requirement.ts';
import { rollUp, type BusExtra, type CaseBalance } from './rollup.ts';
import { buildBusGraph, type BusGraph } from './graph.ts';
import { soleMotorOf, switchedOutWithMotor } from './individualCompensation.ts';

export { WITHIN_TOL_KVAR } from './tolerance.ts';
import { WITHIN_TOL_KVAR } from './tolerance.ts';

export interface BankInCase {
  readonly bus: string;
  readonly total_kvar: number;
  readonly steps_in: number;
  /** false when the bank is a motor's own capacitor and the motor is stopped in this case. */
  readonly in_service: boolean;
  /** Output switched in, kvar at the operating voltage (fixed part + steps in). */
  readonly output_kvar: number;
  /** Reactor switched in, kvar (0 when none or not needed in this case). */
  readonly reactor_kvar: number;
}

export interface CaseCompensation {
  readonly case: string;
  readonly before: CaseBalance;
  /** Need at the point of connection before compensation. */
  readonly need: Need;
  /** Inductive kvar still needed at the point of connection with the capacitor outputs (reactor rule). */
  readonly inductive_need_kvar: number;
  readonly banks: readonly BankInCase[];
  readonly after: CaseBalance;
  readonly within_after: boolean;
}

/** q rounded up to whole steps through the catalogue (BANK.ROUNDUP); 0 when q ≤ 0. */
function roundUp(q: number, step: number): number {
  const r = runCall({ fn: 'BANK.ROUNDUP', args: [q, step], columns: [] });
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

/**
 * Smallest steps a bank switches in for a share of the need (the workbook's Steps-in formula): up
 * to its controller step count, whatever series its stages follow.
 */
export function stepsIn(choice: BankChoice, share: number): number {
  const step = choice.step_kvar ?? 0;
  const steps = controllerStepsOf(choice);
  if (step === 0 || steps === 0) return 0;
  return Math.min(steps, roundUp(share - (choice.fixed_kvar ?? 0), step) / step);
}

/** Within the requirement at P, Q: neither lagging nor leading beyond its limit by more than the tolerance. */
export function withinRequirement(site: Site, pKw: number, qKvar: number): boolean {
  const band = requirementBand(site.settings.requirement);
  const p = referencePowerKw(pKw, site.settings.requirement);
  const lag = runCall({ fn: 'KVAR.TOTAN', args: [p, qKvar, band.lagTan], columns: [] });
  const lead = Number.isFinite(band.leadTan)
    ? runCall({ fn: 'KVAR.TOTAN', args: [p, qKvar, -band.leadTan], columns: [] })
    : ({ ok: true, value: 0 } as const);
  if (!lag.ok || !lead.ok) return false;
  return lag.value <= WITHIN_TOL_KVAR && -lead.value <= WITHIN_TOL_KVAR;
}

/** Choices for buses of the site only, one per bus (the first given), as the Compensation sheet holds them. */
function byBus(site: Site, before: CaseBalance, choices: readonly BankChoice[]): BankChoice[] {
  const known = new Set(before.buses.map((b) => b.bus));
  const seen = new Set<string>();
  return choices.filter((c) => {
    if (!known.has(c.bus) || seen.has(c.bus)) return false;
    seen.add(c.bus);
    return true;
  });
}

/** The compensation of one case (the site must roll up: a tree with one point of connection). */
export function compensateCase(
  site: Site,
  caseName: string,
  choices: readonly BankChoice[],
  given?: CaseBalance,
  graph: BusGraph = buildBusGraph(site.equipment),
): CaseCompensation {
  const before = given ?? rollUp(site, caseName);
  const banks = byBus(site, before, choices);
  const req = site.settings.requirement;
  const band = requirementBand(req);
  const root = before.root;
  const need = connectionNeed(root.p_kw, root.q_kvar, req);
  const busP = new Map(before.buses.map((b) => [b.bus, b.p_kw]));
  const available = banks.map(
    (c) => !switchedOutWithMotor(soleMotorOf(c.bus, graph) !== undefined, busP.get(c.bus) ?? 0),
  );
  const sumTotal = banks.reduce((s, c, i) => s + (available[i] ? bankTotal(c) : 0), 0);
  const outputs = banks.map((c, i) => {
    const total = bankTotal(c);
    if (!available[i]) return { c, total, n: 0, out: 0, on: false };
    const share = sumTotal === 0 ? 0 : (need.capacitive_kvar * total) / sumTotal;
    const n = sumTotal === 0 ? 0 : stepsIn(c, share);
    return { c, total, n, out: (c.fixed_kvar ?? 0) + (c.step_kvar ?? 0) * n, on: true };
  });
  const capOut = outputs.reduce((s, o) => s + o.out, 0);
  // No leading limit (cos φ lagging only): never inductive kvar, as the Compensation sheet.
  const lead = Number.isFinite(band.leadTan)
    ? runCall({
        fn: 'KVAR.TOTAN',
        args: [referencePowerKw(root.p_kw, req), root.q_kvar - capOut, -band.leadTan],
        columns: [],
      })
    : ({ ok: true, value: 0 } as const);
  if (!lead.ok) throw new Error(lead.message);
  const inductive = Math.max(0, -lead.value);
  const extra = new Map<string, BusExtra>();
  const inCase: BankInCase[] = outputs.map(({ c, total, n, out, on }) => {
    const reactor = (c.reactor_kvar ?? 0) > 0 && inductive > WITHIN_TOL_KVAR ? (c.reactor_kvar as number) : 0;
    extra.set(c.bus, { q_absorbed_kvar: reactor, q_delivered_kvar: out });
    return {
      bus: c.bus,
      total_kvar: total,
      in_service: on,
      steps_in: n,
      output_kvar: out,
      reactor_kvar: reactor,
    };
  });
  const after = extra.size === 0 ? before : rollUp(site, caseName, extra, before);
  return {
    case: before.case,
    before,
    need,
    inductive_need_kvar: inductive,
    banks: inCase,
    after,
    within_after: withinRequirement(site, after.root.p_kw, after.root.q_kvar),
  };
}

/** Every case of the site, in the order of the settings. */
export function compensate(
  site: Site,
  choices: readonly BankChoice[],
  given?: readonly CaseBalance[],
): CaseCompensation[] {
  const graph = buildBusGraph(site.equipment);
  return site.settings.cases.map((c) =>
    compensateCase(
      site,
      c,
      choices,
      given?.find((b) => b.case === c),
      graph,
    ),
  );
}
