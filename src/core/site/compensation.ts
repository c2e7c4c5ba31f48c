// Compensation design for a whole site across all its operating cases.
//
// 1. The need: at the point of connection, per case, the capacitive kvar to come down to the
//    lagging limit and the inductive kvar to come up to the leading limit (requirement.ts).
//    The same is reported for every bus, as if a bank there alone had to meet the requirement.
// 2. Capacitors go where the lagging demand is, sized over all cases and checked by rolling the
//    site up again with them in place (capacitorPlacement.ts, bankSizing.ts).
// 3. Where the site is still leading beyond the limit (cable and line charging at light load,
//    or fixed capacitors), a shunt reactor goes on the bus with the most charging, switched in
//    only in the cases that need it (reactorDesign.ts).
// 4. The outcome by the one rule for after compensation (compensate.ts) and its findings
//    (designOutcome.ts). The shapes the design shares live in designBasics.ts, the design as
//    the Compensation sheet's inputs in designChoices.ts.
import type { EquipmentRow, Site } from './model.ts';
import { buildBusGraph } from './graph.ts';
import { rollUp, SiteStructureError, type CaseBalance } from './rollup.ts';
import { nameTable } from '../text/nameTable.ts';
import type { BankChoice } from './bankChoice.ts';
import { compensate } from './compensate.ts';
import { kvarNeeded, requirementBand } from './requirement.ts';
import { busShortCircuit } from './shortCircuit.ts';
import { chargingResonanceWarnings } from './chargingResonance.ts';
import { busVoltages } from './voltages.ts';
import { checkInstalled } from './installedChecks.ts';
import { sortWarnings, type DesignWarning } from './warnings.ts';
import type { BusNeed, CompensationDesign, CompensationOptions } from './designBasics.ts';
import { choicesFromDesign } from './designChoices.ts';
import { placeCapacitors } from './capacitorPlacement.ts';
import { designReactor } from './reactorDesign.ts';
import { afterChecks, caseOutcomes } from './designOutcome.ts';

export type {
  BusNeed,
  CaseOutcome,
  CompensationDesign,
  CompensationOptions,
  PowerPoint,
  ReactorDesign,
} from './designBasics.ts';
export { choicesFromDesign } from './designChoices.ts';

/**
 * Design over all cases of a valid site (validateSite without errors; a site that is not a tree
 * throws SiteStructureError from the roll-up). `balance` may hold balances already computed
 * (one case or several); missing cases are rolled up here.
 */
export function designCompensation(
  site: Site,
  balance?: CaseBalance | readonly CaseBalance[],
  options: CompensationOptions = {},
): CompensationDesign {
  const given: readonly CaseBalance[] =
    balance === undefined
      ? []
      : 'case' in balance
        ? [balance as CaseBalance]
        : (balance as readonly CaseBalance[]);
  const cases = site.settings.cases;
  const before = cases.map((c) => given.find((b) => b.case === c) ?? rollUp(site, c));
  const req = site.settings.requirement;
  const band = requirementBand(req);
  const graph = buildBusGraph(site.equipment);
  const ssc = busShortCircuit(site, graph);
  const voltages = busVoltages(site.equipment).voltages;
  const warnings: DesignWarning[] = [
    ...checkInstalled(site, graph, ssc, voltages),
    ...chargingResonanceWarnings(site, graph, ssc, before),
  ];
  const needs: BusNeed[] = before.flatMap((bal) =>
    bal.buses.map((b) => ({ bus: b.bus, case: bal.case, ...kvarNeeded(b.p_kw, b.q_kvar, req) })),
  );
  const taken = new Set(site.equipment.map((r) => r.tag));
  const firstRow = site.equipment.reduce((m, r) => Math.max(m, r.row), 0) + 1;

  const caps = placeCapacitors({ site, options, before, graph, ssc, voltages, taken, nextRow: firstRow });
  warnings.push(...caps.warnings);
  const reactor = designReactor({
    site,
    options,
    before,
    afterCaps: caps.after,
    banks: caps.banks,
    voltages,
    root: graph.root,
    taken,
    nextRow: caps.nextRow,
  });
  warnings.push(...reactor.warnings);
  const { reactors } = reactor;

  const proposedRows: EquipmentRow[] = [...caps.rows, ...reactor.rows];
  // The outcome by the one rule for after compensation (compensate.ts): what the workbook shows.
  const result = compensate(site, choicesFromDesign(caps.banks, reactors), before);
  const after = result.map((r) => r.after);
  const banks = caps.banks.map((b) => ({
    ...b,
    steps_in: nameTable(
      result.map((r) => [r.case, r.banks.find((x) => x.bus === b.bus)?.steps_in ?? 0] as const),
    ),
  }));
  const finalReactors = reactors.map((x) => ({
    ...x,
    in_service: nameTable(
      result.map((r) => [r.case, (r.banks.find((y) => y.bus === x.bus)?.reactor_kvar ?? 0) > 0] as const),
    ),
  }));
  const outcomes = caseOutcomes(result, req);
  warnings.push(...afterChecks(outcomes, result, req));
  return {
    requirement: band.text,
    lag_tan: band.lagTan,
    lead_tan: band.leadTan,
    needs,
    banks,
    reactors: finalReactors,
    cases: outcomes,
    proposedRows,
    after,
    warnings: sortWarnings(warnings),
  };
}

/**
 * The design's choices, or none when the site cannot be designed yet (e.g. it is not a tree).
 * `before`: the site's balances already rolled up, as designCompensation takes them.
 */
export function proposeChoices(
  site: Site,
  options: CompensationOptions = {},
  before?: readonly CaseBalance[],
): BankChoice[] {
  let design: CompensationDesign;
  try {
    design = designCompensation(site, before, options);
  } catch (e) {
    if (e instanceof SiteStructureError) return [];
    throw e;
  }
  return choicesFromDesign(design.banks, design.reactors);
}
