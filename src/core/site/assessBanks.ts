// Findings for the banks a workbook holds (typed on its Compensation sheet, or proposed there):
// what Checks lists and the CLI prints. Each bank is judged by the same rules the design uses
// (bankRules.ts): capacitor voltage against its rating, resonance at every switching state,
// voltage rise per step; then the outcome by the one rule for after compensation (compensate.ts):
// the requirement per case, and buses left delivering kvar with capacitors in.
import type { Site } from './model.ts';
import { bankTotal, controllerStepsOf, largestStageKvar, type BankChoice } from './bankChoice.ts';
import { buildBusGraph } from './graph.ts';
import { busShortCircuit } from './shortCircuit.ts';
import { infiniteSupplyNote } from './supplyStrength.ts';
import { overloadWarnings } from './overload.ts';
import { chargingResonanceWarnings, zoneCapacitance, zoneTops } from './chargingResonance.ts';
import { busVoltages } from './voltages.ts';
import { checkInstalled, installedCapacitorKvar, ratingMarginWarning } from './installedChecks.ts';
import {
  CAP_OVERVOLTAGE_LIMIT,
  STEP_VRISE_LIMIT_PCT,
  capacitorVoltage,
  nearHarmonic,
  ratedBelowMargin,
  resonanceOrderOf,
  voltageRise,
} from './bankRules.ts';
import { compensate, type CaseCompensation } from './compensate.ts';
import type { CaseBalance } from './rollup.ts';
import { detuningAdvice } from './detuningCheck.ts';
import { relevantHarmonics } from './detuningChoice.ts';
import { harmonicShares } from './harmonicSources.ts';
import { connectionNeed } from './requirement.ts';
import { designWarning, sortWarnings, type DesignWarning } from './warnings.ts';
import { findKind } from '../kinds/index.ts';
import { formatNumber } from '../registry/messages.ts';

export interface Assessment {
  readonly cases: readonly CaseCompensation[];
  readonly warnings: readonly DesignWarning[];
}

const f = (x: number, d = 1) => x.toFixed(d);

/** Of the switching states near a harmonic, the one nearest it (relative distance of the order). */
function nearestState(
  states: readonly number[],
  orderOf: (q: number) => { order: number; near: number | undefined } | undefined,
): { q: number; order: number; near: number } | undefined {
  let best: { q: number; order: number; near: number; off: number } | undefined;
  for (const q of states) {
    const r = orderOf(q);
    if (r?.near === undefined) continue;
    const off = Math.abs(r.order / r.near - 1);
    if (best === undefined || off < best.off) best = { q, order: r.order, near: r.near, off };
  }
  return best && { q: best.q, order: best.order, near: best.near };
}

function bankWarnings(
  site: Site,
  choices: readonly BankChoice[],
  cases: readonly CaseCompensation[],
): DesignWarning[] {
  const out: DesignWarning[] = [];
  const graph = buildBusGraph(site.equipment);
  const tops = zoneTops(graph);
  // Charging of the bank's zone per case (a plain bank resonates with it; see chargingResonance.ts).
  const zones = cases.map((r) => ({ case: r.case, zones: zoneCapacitance(site, graph, r.before) }));
  const ssc = busShortCircuit(site, graph);
  const voltages = busVoltages(site.equipment).voltages;
  const hz = site.settings.hz;
  for (const c of choices) {
    const total = bankTotal(c);
    if (total <= 0) continue;
    const u = voltages.get(c.bus)?.u_kv;
    if (u === undefined) {
      out.push(
        designWarning(
          'warning',
          'bus-voltage-unknown',
          { bus: c.bus },
          `the bank on bus ${c.bus} cannot be checked: the bus has no voltage (state u_kv on a row of the bus)`,
        ),
      );
      continue;
    }
    const p = c.p_pct ?? 0;
    for (const w of detuningAdvice(site, graph, c)) out.push(w);
    const uc = capacitorVoltage(u, p);
    if (c.u_rated_kv !== undefined && uc > c.u_rated_kv * (1 + 1e-9)) {
      out.push(
        designWarning(
          uc > CAP_OVERVOLTAGE_LIMIT * c.u_rated_kv ? 'error' : 'warning',
          'capacitor-overvoltage',
          { bus: c.bus },
          `the capacitors of the bank on bus ${c.bus} see ${f(uc, 3)} kV (CAPBANK.UCAP) but are rated ${formatNumber(c.u_rated_kv)} kV; choose a higher rated voltage`,
        ),
      );
    } else if (c.u_rated_kv !== undefined && ratedBelowMargin(uc, c.u_rated_kv)) {
      out.push(ratingMarginWarning(`the bank on bus ${c.bus}`, { bus: c.bus }, uc, c.u_rated_kv, p, hz));
    }
    const sc = ssc.get(c.bus);
    if (!sc) {
      out.push(
        designWarning(
          'info',
          'resonance-not-assessed',
          { bus: c.bus },
          `resonance and voltage rise of the bank on bus ${c.bus} not assessed: the short-circuit power there is unknown (give it on the Site sheet)`,
        ),
      );
      continue;
    }
    const plain = (graph.items.get(c.bus) ?? [])
      .filter((r) => findKind(r.kind)?.traits?.capacitor && !((r.values.p_pct ?? 0) > 0))
      .reduce((s, r) => s + installedCapacitorKvar(r, hz), 0);
    const fixed = c.fixed_kvar ?? 0;
    const step = c.step_kvar ?? 0;
    // Every position the controller switches: whole smallest steps up to its step count.
    const positions = Math.max(0, Math.floor(controllerStepsOf(c)));
    const states = [fixed, ...Array.from({ length: positions }, (_, k) => fixed + (k + 1) * step)].filter(
      (q) => q > 0,
    );
    // A detuned bank's capacitors alone: its output Q at the bus is U²/(Xc·(1 − p)), so the
    // capacitor-only kvar in RESONANCE.ORDER is Q·(1 − p/100). Charging counts with a plain bank
    // only: beside a detuned one it resonates with the supply on its own (chargingResonance.ts).
    const relevant = relevantHarmonics(harmonicShares(c.bus, site, graph));
    const top = tops.get(c.bus) ?? c.bus;
    const chargingBy =
      p > 0
        ? [{ case: undefined, kvar: 0 }]
        : zones.map((z) => ({ case: z.case, kvar: z.zones.get(top)?.charging_kvar ?? 0 }));
    // Every case whose charging brings a switching state near a harmonic gets its finding, the
    // state nearest the harmonic in that case: a finding tied to the first case found would
    // vanish from a listing of another case (`balance --case night`) where it holds as well.
    const seen = new Set<string>();
    for (const ch of chargingBy) {
      const worst = nearestState(states, (q) => {
        const order = resonanceOrderOf(sc.ssc_mva, q * (1 - p / 100) + plain + ch.kvar, p);
        return order === undefined ? undefined : { order, near: nearHarmonic(order) };
      });
      if (worst === undefined) continue;
      const { q, order, near } = worst;
      const withCharging = ch.kvar > 0 ? ` and ${f(ch.kvar)} kvar of cable and line charging` : '';
      // The design's rule (detuningChoice.ts): near an order nothing on the bus or below
      // produces (no 6-pulse source, only the background 5th and 7th), information only.
      const produced = relevant.includes(near);
      const message = `with ${f(q + plain)} kvar connected${withCharging} the bank on bus ${c.bus} resonates at order ${f(order, 2)}${infiniteSupplyNote(sc)}, near the ${near}th harmonic${produced ? '' : `, which no item on bus ${c.bus} or below produces (no 6-pulse drive or rectifier)`}; choose another detuning or step size`;
      const where = { bus: c.bus, ...(ch.case !== undefined && ch.kvar > 0 ? { case: ch.case } : {}) };
      // Cases without charging give the same finding, for no case in particular: said once.
      const key = `${where.case ?? ''}|${message}`;
      if (seen.has(key)) continue;
      seen.add(key);
      out.push(designWarning(produced ? 'warning' : 'info', 'resonance', where, message));
    }
    const stage = largestStageKvar(c);
    const rise = voltageRise(stage, sc.ssc_mva);
    if (rise > STEP_VRISE_LIMIT_PCT) {
      out.push(
        designWarning(
          'warning',
          'voltage-rise',
          { bus: c.bus },
          `switching one ${f(stage)} kvar stage on bus ${c.bus} raises the voltage by ${f(rise, 2)} % (VRISE.PCT)${infiniteSupplyNote(sc)}, above ${STEP_VRISE_LIMIT_PCT} %; use smaller steps`,
        ),
      );
    }
  }
  return out;
}

function outcomeWarnings(site: Site, cases: readonly CaseCompensation[]): DesignWarning[] {
  const out: DesignWarning[] = [];
  for (const r of cases) {
    const a = r.after.root;
    const before = r.before.root;
    if (r.need.inductive_kvar > 0.5) {
      const charging = r.before.elements
        .filter((e) => findKind(e.kind)?.traits?.charging)
        .reduce((sum, e) => sum + e.q_delivered_kvar, 0);
      const reactor = r.banks.filter((b) => b.reactor_kvar > 0);
      const covered =
        reactor.length > 0
          ? `; the reactor on bus ${reactor.map((b) => b.bus).join(', ')} switches in (${f(
              reactor.reduce((x, b) => x + b.reactor_kvar, 0),
              0,
            )} kvar)`
          : '; no reactor in the workbook covers it';
      out.push(
        designWarning(
          'warning',
          'charging-dominates',
          { bus: before.bus, case: r.case },
          `the point of connection delivers ${f(-before.q_kvar, 0)} kvar at ${f(before.p_kw, 0)} kW (cable and line charging ${f(charging, 0)} kvar), beyond the leading limit${covered}`,
        ),
      );
    }
    if (!r.within_after) {
      const n = connectionNeed(a.p_kw, a.q_kvar, site.settings.requirement);
      const what =
        n.capacitive_kvar > 0
          ? `${f(n.capacitive_kvar, 0)} kvar capacitive still missing`
          : `${f(n.inductive_kvar, 0)} kvar inductive still missing`;
      out.push(
        designWarning(
          'warning',
          'requirement-not-met',
          { bus: a.bus, case: r.case },
          `after compensation the point of connection is at cos φ ${a.cos_phi?.toFixed(3) ?? '–'} ${a.sense} (${what}); review the banks`,
        ),
      );
    }
    for (const b of r.banks) {
      const bus = r.after.buses.find((x) => x.bus === b.bus);
      if (!bus || b.output_kvar <= 0 || bus.own_q_kvar >= 0) continue;
      out.push(
        designWarning(
          'info',
          'overcompensation',
          { bus: b.bus, case: r.case },
          `bus ${b.bus} is overcompensated: its own items deliver ${f(-bus.own_q_kvar)} kvar with the bank's ${f(b.output_kvar)} kvar in; fewer steps at light load`,
        ),
      );
    }
  }
  return out;
}

/**
 * Findings for a valid site with these banks (SiteStructureError when it does not roll up).
 * `before`: the site's balances already rolled up (any cases missing are rolled up here).
 */
export function assessBanks(
  site: Site,
  choices: readonly BankChoice[],
  before?: readonly CaseBalance[],
): Assessment {
  const graph = buildBusGraph(site.equipment);
  const cases = compensate(site, choices, before);
  const tops = zoneTops(graph);
  const warnings = [
    ...checkInstalled(site, graph, busShortCircuit(site, graph), busVoltages(site.equipment).voltages),
    ...bankWarnings(site, choices, cases),
    ...overloadWarnings(cases),
    ...chargingResonanceWarnings(
      site,
      graph,
      busShortCircuit(site, graph),
      cases.map((r) => r.before),
      (name, top) =>
        (cases.find((r) => r.case === name)?.banks ?? [])
          .filter((b) => tops.get(b.bus) === top)
          .reduce((s, b) => s + b.reactor_kvar, 0),
    ),
    ...outcomeWarnings(site, cases),
  ];
  return { cases, warnings: sortWarnings(warnings) };
}
