// Compensation design for a whole site across all its operating cases.
//
// 1. The need: at the point of connection, per case, the capacitive kvar to come down to the
//    lagging limit and the inductive kvar to come up to the leading limit (requirement.ts).
//    The same is reported for every bus, as if a bank there alone had to meet the requirement.
// 2. Capacitors go where the lagging demand is: by default every bus whose own items draw kvar
//    (or the buses named in options.bankBuses). In each case the root's need is shared among
//    them in proportion to their own lagging kvar; a bus whose largest share stays below the
//    minimum bank size gives its share to the others. Each bank is sized over all cases
//    (bankSizing.ts) and its steps follow the need case by case.
// 3. The proposal is checked by rolling the site up again with the proposed rows added; if the
//    requirement is still missed (e.g. transformer kvar that moved with the loading), the
//    shortfall is added and the banks resized, a few passes at most.
// 4. Where the site is still leading beyond the limit (cable and line charging at light load,
//    or fixed capacitors), a shunt reactor goes on the bus with the most charging, switched in
//    only in the cases that need it.
import type { EquipmentRow, Requirement, Site } from './model.ts';
import { buildBusGraph } from './graph.ts';
import { rollUp, SiteStructureError, type BusBalance, type CaseBalance } from './rollup.ts';
import { findKind } from '../kinds/index.ts';
import { entryOf, nameTable } from '../text/nameTable.ts';
import type { BankChoice } from './bankChoice.ts';
import { compensate, type CaseCompensation } from './compensate.ts';
import {
  connectionNeed,
  kvarNeeded,
  meets,
  referencePowerKw,
  requirementBand,
  type Need,
} from './requirement.ts';
import { busShortCircuit } from './shortCircuit.ts';
import { chargingResonanceWarnings, zoneChargingMost } from './chargingResonance.ts';
import { busVoltages } from './voltages.ts';
import {
  MIN_BANK_KVAR_LV,
  MIN_BANK_KVAR_MV,
  REACTOR_ROUNDING_KVAR,
  REACTOR_SERIES_KVAR,
  isLowVoltage,
} from './bankRules.ts';
import { bankRows, sizeBank, type BankDesign } from './bankSizing.ts';
import { DEFAULT_STEP_SERIES } from './stepSeries.ts';
import { checkInstalled } from './installedChecks.ts';
import { designWarning, sortWarnings, type DesignWarning } from './warnings.ts';

export interface CompensationOptions {
  /** Buses that may receive a capacitor bank; default: buses whose own items draw kvar. */
  readonly bankBuses?: readonly string[];
  /** Detuning per bus, % (0, 5.67, 7 or 14), overriding the automatic choice. */
  readonly detuning?: Readonly<Record<string, number>>;
  /** Significant 3rd harmonic (many single-phase loads): detune at 14 % instead of 7 %. */
  readonly thirdHarmonic?: boolean;
  /** Bus for a shunt reactor; default: the bus with the most cable and line charging. */
  readonly reactorBus?: string;
  /** Buses that get a bank besides those (a detuning typed alone on the Compensation sheet). */
  readonly alsoBankBuses?: readonly string[];
  /** Buses whose bank is typed: no proposal there (sheetChoices.ts). */
  readonly typedBuses?: readonly string[];
}

export interface ReactorDesign {
  readonly bus: string;
  readonly u_kv: number;
  readonly q_kvar: number;
  readonly in_service: Readonly<Record<string, boolean>>;
  readonly why: string;
}

export interface PowerPoint {
  readonly p_kw: number;
  readonly q_kvar: number;
  readonly s_kva: number;
  readonly cos_phi: number | null;
  readonly tan_phi: number | null;
  readonly sense: BusBalance['sense'];
}

export interface CaseOutcome {
  readonly case: string;
  readonly before: PowerPoint;
  readonly after: PowerPoint;
  readonly need: Need;
  readonly met_before: boolean;
  readonly met_after: boolean;
}

export interface BusNeed extends Need {
  readonly bus: string;
  readonly case: string;
}

export interface CompensationDesign {
  readonly requirement: string;
  readonly lag_tan: number;
  readonly lead_tan: number;
  readonly needs: readonly BusNeed[];
  readonly banks: readonly BankDesign[];
  readonly reactors: readonly ReactorDesign[];
  readonly cases: readonly CaseOutcome[];
  /** The rows that install the proposal (tags NEW-...), for the workbook and the file. */
  readonly proposedRows: readonly EquipmentRow[];
  /** Balances with the proposal in place, one per case. */
  readonly after: readonly CaseBalance[];
  readonly warnings: readonly DesignWarning[];
}

const TOL_KVAR = 0.5;
const MAX_PASSES = 4;

const point = (b: BusBalance): PowerPoint => ({
  p_kw: b.p_kw,
  q_kvar: b.q_kvar,
  s_kva: b.s_kva,
  cos_phi: b.cos_phi,
  tan_phi: b.tan_phi,
  sense: b.sense,
});

function uniqueTag(base: string, taken: Set<string>): string {
  let tag = base;
  for (let i = 2; taken.has(tag); i++) tag = `${base}-${i}`;
  taken.add(tag);
  return tag;
}

/** Share of the root's need per bus and case, in proportion to each bus's own lagging kvar. */
function allocate(
  candidates: readonly string[],
  before: readonly CaseBalance[],
  need: readonly number[],
): Map<string, Record<string, number>> {
  const out = new Map<string, Record<string, number>>(candidates.map((b) => [b, nameTable<number>()]));
  before.forEach((bal, i) => {
    const byBus = new Map(bal.buses.map((x) => [x.bus, x]));
    const weights = candidates.map((b) => Math.max(0, byBus.get(b)?.own_q_kvar ?? 0));
    const sum = weights.reduce((a, w) => a + w, 0);
    // need/sum × weight (or need/count): the Compensation sheet computes it in this order too.
    const n = need[i] ?? 0;
    candidates.forEach((b, k) => {
      (out.get(b) as Record<string, number>)[bal.case] =
        sum > 0 ? (n / sum) * (weights[k] as number) : n / candidates.length;
    });
  });
  return out;
}

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
  let nextRow = site.equipment.reduce((m, r) => Math.max(m, r.row), 0) + 1;

  // Capacitors.
  const rootNeed = before.map((b) => connectionNeed(b.root.p_kw, b.root.q_kvar, req).capacitive_kvar);
  let banks: BankDesign[] = [];
  let capRows: EquipmentRow[] = [];
  let bankWarnings: DesignWarning[] = [];
  // The balances with the current proposal in place (none yet: the balances as given).
  let afterCaps: CaseBalance[] = before;
  if (Math.max(...rootNeed) > TOL_KVAR) {
    const laggingBuses = new Set(
      before.flatMap((bal) => bal.buses.filter((x) => x.own_q_kvar > 0).map((x) => x.bus)),
    );
    const lagging = (b: string) => laggingBuses.has(b);
    const typed = new Set(options.typedBuses ?? []);
    const wanted = [...(options.bankBuses ?? graph.order.filter(lagging)), ...(options.alsoBankBuses ?? [])];
    let candidates = [...new Set(wanted)].filter((b) => {
      if (typed.has(b)) return false;
      if (voltages.has(b)) return true;
      warnings.push(
        designWarning(
          'warning',
          'bus-voltage-unknown',
          { bus: b },
          `no bank proposed on bus ${b}: its voltage is unknown (no row on it states u_kv)`,
        ),
      );
      return false;
    });
    if (candidates.length === 0 && graph.root !== undefined && voltages.has(graph.root) && typed.size === 0)
      candidates = [graph.root];
    const extra = rootNeed.map(() => 0);
    const charging = zoneChargingMost(site, graph, before);
    for (let pass = 0; pass < MAX_PASSES && candidates.length > 0; pass++) {
      const need = rootNeed.map((n, i) => n + (extra[i] as number));
      let shares = allocate(candidates, before, need);
      const big = candidates.filter(
        (b) =>
          Math.max(...Object.values(shares.get(b) ?? {})) >=
          (isLowVoltage(voltages.get(b)?.u_kv ?? 0) ? MIN_BANK_KVAR_LV : MIN_BANK_KVAR_MV),
      );
      if (big.length > 0 && big.length < candidates.length) shares = allocate(big, before, need);
      const chosen = big.length > 0 ? big : candidates;
      banks = [];
      capRows = [];
      bankWarnings = [];
      const tagsNow = new Set(taken);
      for (const bus of chosen) {
        const sized = sizeBank(bus, shares.get(bus) ?? {}, {
          site,
          graph,
          sc: ssc.get(bus),
          uKv: (voltages.get(bus) as { u_kv: number }).u_kv,
          chargingKvar: charging.get(bus) ?? 0,
          ...(entryOf(options.detuning, bus) !== undefined
            ? { detuning: entryOf(options.detuning, bus) as number }
            : {}),
          ...(options.thirdHarmonic ? { thirdHarmonic: true } : {}),
        });
        if (sized.bank.total_kvar <= 0) continue;
        banks.push(sized.bank);
        bankWarnings.push(...sized.warnings);
        const rows = bankRows(sized.bank, uniqueTag(`NEW-C-${bus}`, tagsNow), nextRow, cases);
        nextRow += rows.length;
        capRows.push(...rows);
      }
      const result = compensate(site, choicesFromDesign(banks, []), before);
      afterCaps = result.map((r) => r.after);
      const short = afterCaps.map((b) => connectionNeed(b.root.p_kw, b.root.q_kvar, req).capacitive_kvar);
      if (short.every((s) => s <= TOL_KVAR)) break;
      short.forEach((s, i) => (extra[i] = (extra[i] as number) + s));
    }
    for (const r of capRows) taken.add(r.tag);
  }
  warnings.push(...bankWarnings);

  // Shunt reactor where the site is leading beyond the limit even with every step out.
  const leadNeed = afterCaps.map((b) => connectionNeed(b.root.p_kw, b.root.q_kvar, req).inductive_kvar);
  const reactors: ReactorDesign[] = [];
  let reactorRows: EquipmentRow[] = [];
  if (Math.max(...leadNeed) > TOL_KVAR) {
    const worst = leadNeed.indexOf(Math.max(...leadNeed));
    const bal = afterCaps[worst] as CaseBalance;
    const bus = options.reactorBus ?? chargingBus(bal, voltages, graph.root);
    const u = bus === undefined ? undefined : voltages.get(bus)?.u_kv;
    if (bus === undefined || u === undefined) {
      warnings.push(
        designWarning(
          'warning',
          'bus-voltage-unknown',
          { bus: bus ?? graph.root ?? '' },
          'a shunt reactor is needed but no bus with a known voltage is available for it (state u_kv on a row of the bus)',
        ),
      );
    } else {
      const inService = nameTable<boolean>();
      cases.forEach((c, i) => (inService[c] = (leadNeed[i] as number) > TOL_KVAR));
      const tag = uniqueTag(`NEW-R-${bus}`, taken);
      const loads = nameTable<number>();
      for (const c of cases) loads[c] = inService[c] ? 1 : 0;
      const rowFor = (q: number): EquipmentRow[] => [
        {
          row: nextRow,
          tag,
          description: 'proposed shunt reactor',
          bus,
          kind: 'reactor',
          values: { q_kvar: q, u_rated_kv: u, u_kv: u },
          loads,
        },
      ];
      // As for the capacitors: check by rolling up again; transformer kvar moves with the loading.
      const want = [...leadNeed];
      let q = reactorSize(afterCaps, want, band.lagTan + band.leadTan, req);
      for (let pass = 1; pass < MAX_PASSES; pass++) {
        const trial: ReactorDesign = { bus, u_kv: u, q_kvar: q, in_service: inService, why: '' };
        const short = compensate(site, choicesFromDesign(banks, [trial]), before).map(
          (r) => connectionNeed(r.after.root.p_kw, r.after.root.q_kvar, req).inductive_kvar,
        );
        if (short.every((x, i) => x <= TOL_KVAR || !inService[cases[i] as string])) break;
        short.forEach((x, i) => (want[i] = (want[i] as number) + (inService[cases[i] as string] ? x : 0)));
        q = reactorSize(afterCaps, want, band.lagTan + band.leadTan, req);
      }
      reactors.push({
        bus,
        u_kv: u,
        q_kvar: q,
        in_service: inService,
        why: 'cable and line charging (or fixed capacitors) leave the point of connection leading beyond the limit at light load',
      });
      reactorRows = rowFor(q);
      before.forEach((b, i) => {
        if ((leadNeed[i] as number) <= TOL_KVAR) return;
        const charging = b.elements
          .filter((e) => findKind(e.kind)?.traits?.charging)
          .reduce((s, e) => s + e.q_delivered_kvar, 0);
        warnings.push(
          designWarning(
            'warning',
            'charging-dominates',
            { bus: b.root.bus, case: b.case },
            `the point of connection delivers ${(-b.root.q_kvar).toFixed(0)} kvar at ${b.root.p_kw.toFixed(0)} kW (cable and line charging ${charging.toFixed(0)} kvar), beyond the leading limit; a ${q} kvar shunt reactor on bus ${bus} is proposed for this case`,
          ),
        );
      });
    }
  }

  const proposedRows = [...capRows, ...reactorRows];
  // The outcome by the one rule for after compensation (compensate.ts): what the workbook shows.
  const result = compensate(site, choicesFromDesign(banks, reactors), before);
  const after = result.map((r) => r.after);
  banks = banks.map((b) => ({
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
  const outcomes: CaseOutcome[] = result.map((r) => {
    const b = r.before;
    const a = r.after;
    return {
      case: b.case,
      before: point(b.root),
      after: point(a.root),
      need: r.need,
      met_before: meets(b.root.p_kw, b.root.q_kvar, req, TOL_KVAR),
      met_after: r.within_after,
    };
  });
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
 * Reactor rating: enough for the largest leading excess, yet not so much that a case it is
 * switched in for ends up lagging beyond the limit (its window is need .. need + (lag+lead)·|P|).
 * A standard rating inside every window if there is one, else a made-to-order rating: the need
 * rounded up to REACTOR_ROUNDING_KVAR, or finer when the window is narrower.
 */
function reactorSize(
  bal: readonly CaseBalance[],
  need: readonly number[],
  bandWidth: number,
  req: Requirement,
): number {
  let lo = 0;
  let hi = Infinity;
  need.forEach((n, i) => {
    if (n <= TOL_KVAR) return;
    lo = Math.max(lo, n);
    hi = Math.min(hi, n + bandWidth * referencePowerKw((bal[i] as CaseBalance).root.p_kw, req));
  });
  const standard = REACTOR_SERIES_KVAR.find((q) => q >= lo && q <= hi);
  if (standard !== undefined) return standard;
  // Made to order: the coarsest rounding that still lands inside the window (narrow when P is small).
  for (const step of [REACTOR_ROUNDING_KVAR, 10, 1]) {
    const q = Math.ceil(lo / step - 1e-9) * step;
    if (q <= hi) return q;
  }
  return Math.ceil(lo);
}

/** The bus with the most cable and line charging in this case (lines count at their upstream bus). */
function chargingBus(
  bal: CaseBalance,
  voltages: ReadonlyMap<string, unknown>,
  root: string | undefined,
): string | undefined {
  const byBus = new Map<string, number>();
  for (const e of bal.elements) {
    if (findKind(e.kind)?.traits?.charging && voltages.has(e.bus))
      byBus.set(e.bus, (byBus.get(e.bus) ?? 0) + e.q_delivered_kvar);
  }
  let best = root !== undefined && voltages.has(root) ? root : undefined;
  let most = best === undefined ? -1 : (byBus.get(best) ?? 0);
  for (const [b, q] of byBus) if (q > most) [best, most] = [b, q];
  return best;
}

function afterChecks(
  outcomes: readonly CaseOutcome[],
  result: readonly CaseCompensation[],
  req: Site['settings']['requirement'],
): DesignWarning[] {
  const out: DesignWarning[] = [];
  outcomes.forEach((o, i) => {
    const r = result[i] as CaseCompensation;
    const bal = r.after;
    if (!o.met_after) {
      const n = kvarNeeded(o.after.p_kw, o.after.q_kvar, req);
      const what =
        n.capacitive_kvar > 0
          ? `${n.capacitive_kvar.toFixed(0)} kvar capacitive still missing`
          : `${n.inductive_kvar.toFixed(0)} kvar inductive still missing`;
      out.push(
        designWarning(
          'warning',
          'requirement-not-met',
          { bus: bal.root.bus, case: o.case },
          `after compensation the point of connection is at cos φ ${o.after.cos_phi?.toFixed(3) ?? '–'} ${o.after.sense} (${what}); review the steps or add compensation`,
        ),
      );
    }
    const leadingTooFar = kvarNeeded(o.after.p_kw, o.after.q_kvar, req).inductive_kvar > TOL_KVAR;
    const installed = new Map<string, string[]>();
    for (const e of r.before.elements) {
      if (!findKind(e.kind)?.traits?.capacitor || !(e.q_delivered_kvar > 0)) continue;
      installed.set(e.bus, [...(installed.get(e.bus) ?? []), e.tag]);
    }
    for (const b of bal.buses) {
      const bank = r.banks.find((x) => x.bus === b.bus && x.output_kvar > 0);
      const tags = installed.get(b.bus) ?? [];
      if ((tags.length === 0 && !bank) || b.own_q_kvar >= 0) continue;
      const what = [
        ...(bank ? [`the bank's ${bank.output_kvar.toFixed(1)} kvar`] : []),
        ...(tags.length > 0 ? [`installed capacitors ${tags.join(', ')}`] : []),
      ].join(' and ');
      out.push(
        designWarning(
          leadingTooFar ? 'warning' : 'info',
          'overcompensation',
          { bus: b.bus, case: o.case },
          `bus ${b.bus} is overcompensated: its own items deliver ${(-b.own_q_kvar).toFixed(1)} kvar with ${what} in service; switch capacitors out at light load`,
        ),
      );
    }
  });
  return out;
}

/** The design as the Compensation sheet's inputs: one choice per bus with a bank or reactor. */
export function choicesFromDesign(
  banks: readonly BankDesign[],
  reactors: readonly Pick<ReactorDesign, 'bus' | 'q_kvar' | 'why'>[],
): BankChoice[] {
  const byBus = new Map<string, { -readonly [K in keyof BankChoice]: BankChoice[K] }>();
  const get = (bus: string) => {
    let c = byBus.get(bus);
    if (!c) byBus.set(bus, (c = { bus }));
    return c;
  };
  for (const b of banks) {
    const c = get(b.bus);
    if (b.fixed_kvar > 0) c.fixed_kvar = b.fixed_kvar;
    if (b.steps > 0) {
      c.step_kvar = b.step_kvar;
      c.steps = b.steps;
      if (b.series !== DEFAULT_STEP_SERIES) c.series = b.series;
    }
    if (b.p_pct > 0) c.p_pct = b.p_pct;
    c.u_rated_kv = b.u_rated_kv;
    c.note = b.why;
  }
  for (const r of reactors) {
    const c = get(r.bus);
    c.reactor_kvar = r.q_kvar;
    if (r.why) c.note = c.note ? `${c.note}; reactor: ${r.why}` : `reactor: ${r.why}`;
  }
  return [...byBus.values()];
}

/** The design's choices, or none when the site cannot be designed yet (e.g. it is not a tree). */
export function proposeChoices(site: Site, options: CompensationOptions = {}): BankChoice[] {
  let design: CompensationDesign;
  try {
    design = designCompensation(site, undefined, options);
  } catch (e) {
    if (e instanceof SiteStructureError) return [];
    throw e;
  }
  return choicesFromDesign(design.banks, design.reactors);
}
