// Step 3 of the site design (compensation.ts): where the site is still leading beyond the limit
// with every capacitor step out (cable and line charging at light load, or fixed capacitors), a
// shunt reactor goes on the bus with the most charging, switched in only in the cases that need
// it, sized within every such case's window and checked by the one rule for after compensation.
import type { EquipmentRow, Requirement, Site } from './model.ts';
import type { CaseBalance } from './rollup.ts';
import type { BankDesign } from './bankSizing.ts';
import { findKind } from '../kinds/index.ts';
import { nameTable } from '../text/nameTable.ts';
import { compensate } from './compensate.ts';
import { connectionNeed, referencePowerKw, requirementBand } from './requirement.ts';
import { REACTOR_ROUNDING_KVAR, REACTOR_SERIES_KVAR } from './bankRules.ts';
import {
  MAX_PASSES,
  TOL_KVAR,
  uniqueTag,
  type CompensationOptions,
  type ReactorDesign,
} from './designBasics.ts';
import { choicesFromDesign } from './designChoices.ts';
import { designWarning, type DesignWarning } from './warnings.ts';

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

export interface ReactorInput {
  readonly site: Site;
  readonly options: CompensationOptions;
  /** Balances before compensation, one per case of the site. */
  readonly before: readonly CaseBalance[];
  /** Balances with the proposed capacitor banks in place. */
  readonly afterCaps: readonly CaseBalance[];
  /** The proposed capacitor banks (they stay in while the reactor is checked). */
  readonly banks: readonly BankDesign[];
  readonly voltages: ReadonlyMap<string, { u_kv: number }>;
  readonly root: string | undefined;
  /** Tags in use; the reactor's tag is added. */
  readonly taken: Set<string>;
  /** Row number the reactor's row takes. */
  readonly nextRow: number;
}

export interface ReactorPlacement {
  readonly reactors: ReactorDesign[];
  /** The row that installs the reactor (tag NEW-R-…), or none. */
  readonly rows: EquipmentRow[];
  readonly warnings: DesignWarning[];
}

/** A shunt reactor where the site is leading beyond the limit even with every step out. */
export function designReactor(input: ReactorInput): ReactorPlacement {
  const { site, options, before, afterCaps, banks, voltages, taken, nextRow } = input;
  const req = site.settings.requirement;
  const band = requirementBand(req);
  const cases = site.settings.cases;
  const warnings: DesignWarning[] = [];
  const leadNeed = afterCaps.map((b) => connectionNeed(b.root.p_kw, b.root.q_kvar, req).inductive_kvar);
  const reactors: ReactorDesign[] = [];
  let reactorRows: EquipmentRow[] = [];
  if (Math.max(...leadNeed) > TOL_KVAR) {
    const worst = leadNeed.indexOf(Math.max(...leadNeed));
    const bal = afterCaps[worst] as CaseBalance;
    const bus = options.reactorBus ?? chargingBus(bal, voltages, input.root);
    const u = bus === undefined ? undefined : voltages.get(bus)?.u_kv;
    if (bus === undefined || u === undefined) {
      warnings.push(
        designWarning(
          'warning',
          'bus-voltage-unknown',
          { bus: bus ?? input.root ?? '' },
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
  return { reactors, rows: reactorRows, warnings };
}
