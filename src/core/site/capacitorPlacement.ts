// Step 2 of the site design (compensation.ts): capacitors go where the lagging demand is. By
// default every bus whose own items draw kvar (or the buses named in options.bankBuses) is a
// candidate; in each case the root's need is shared among them in proportion to their own
// lagging kvar; a bus whose largest share stays below the minimum bank size gives its share to
// the others. Each bank is sized over all cases (bankSizing.ts). The proposal is checked by the
// one rule for after compensation; a shortfall (transformer kvar that moved with the loading) is
// added and the banks resized, a few passes at most.
import type { EquipmentRow, Site } from './model.ts';
import type { BusGraph } from './graph.ts';
import type { CaseBalance } from './rollup.ts';
import type { BusShortCircuit } from './shortCircuit.ts';
import { entryOf, nameTable } from '../text/nameTable.ts';
import { compensate } from './compensate.ts';
import { connectionNeed } from './requirement.ts';
import { zoneChargingMost } from './chargingResonance.ts';
import { MIN_BANK_KVAR_LV, MIN_BANK_KVAR_MV, isLowVoltage } from './bankRules.ts';
import { bankRows, sizeBank, type BankDesign } from './bankSizing.ts';
import { MAX_PASSES, TOL_KVAR, uniqueTag, type CompensationOptions } from './designBasics.ts';
import { choicesFromDesign } from './designChoices.ts';
import { designWarning, type DesignWarning } from './warnings.ts';

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

export interface PlacementInput {
  readonly site: Site;
  readonly options: CompensationOptions;
  /** Balances before compensation, one per case of the site. */
  readonly before: readonly CaseBalance[];
  readonly graph: BusGraph;
  readonly ssc: ReadonlyMap<string, BusShortCircuit>;
  readonly voltages: ReadonlyMap<string, { u_kv: number }>;
  /** Tags in use; the proposed rows' tags are added. */
  readonly taken: Set<string>;
  /** Row number the first proposed row takes. */
  readonly nextRow: number;
}

export interface Placement {
  readonly banks: BankDesign[];
  /** The rows that install the banks (tags NEW-C-…). */
  readonly rows: EquipmentRow[];
  /** Findings on buses left out (voltage unknown), then the sizing's own. */
  readonly warnings: DesignWarning[];
  /** The balances with the banks in place (the balances before, when none is needed). */
  readonly after: readonly CaseBalance[];
  /** Row number the next proposed row takes. */
  readonly nextRow: number;
}

/** The capacitor banks that bring the point of connection within the lagging limit in every case. */
export function placeCapacitors(input: PlacementInput): Placement {
  const { site, options, before, graph, ssc, voltages, taken } = input;
  const req = site.settings.requirement;
  const cases = site.settings.cases;
  let nextRow = input.nextRow;
  const warnings: DesignWarning[] = [];
  const rootNeed = before.map((b) => connectionNeed(b.root.p_kw, b.root.q_kvar, req).capacitive_kvar);
  let banks: BankDesign[] = [];
  let capRows: EquipmentRow[] = [];
  let bankWarnings: DesignWarning[] = [];
  // The balances with the current proposal in place (none yet: the balances as given).
  let afterCaps: readonly CaseBalance[] = before;
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
  return { banks, rows: capRows, warnings: [...warnings, ...bankWarnings], after: afterCaps, nextRow };
}
