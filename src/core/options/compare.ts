// Design options side by side: the same site compensated in a few ways a tender engineer weighs
// (the banks as they stand, the design's proposal, plain capacitors everywhere, every bank
// detuned, one bank at the point of connection), each priced at the same rates and judged by the
// same rules: cost, what it saves a year, simple payback, whether the requirement is met in every
// case, and how many findings Checks would list. Every figure comes from the one after-
// compensation rule (compensate.ts via assessBanks.ts), the schedule, cost and saving of
// src/core/quote, so an option's figures are what the workbook shows once its banks are
// typed onto the Compensation sheet.
import { assessBanks } from '../site/assessBanks.ts';
import { bankTotal, type BankChoice } from '../site/bankChoice.ts';
import { proposeChoices } from '../site/compensation.ts';
import { buildBusGraph } from '../site/graph.ts';
import type { Site } from '../site/model.ts';
import { DEFAULT_STEP_SERIES } from '../site/stepSeries.ts';
import { busVoltages } from '../site/voltages.ts';
// Straight from the quote's modules, not its index: see the architecture test (first download).
import { priceSchedule } from '../quote/cost.ts';
import type { RateTable } from '../quote/rates.ts';
import { annualSaving, type Tariff } from '../quote/saving.ts';
import { siteSchedule } from '../quote/siteSchedule.ts';

export type OptionId = 'current' | 'proposal' | 'plain' | 'detuned' | 'central';

export interface OptionSpec {
  readonly id: OptionId;
  readonly name: string;
  /** What the option is, in a line. */
  readonly summary: string;
  readonly banks: readonly BankChoice[];
}

export interface OptionFigures extends OptionSpec {
  /** The name of an earlier option with the very same banks, when there is one. */
  readonly sameAs?: string;
  readonly capacitor_kvar: number;
  readonly reactor_kvar: number;
  /** Equipment plus surcharges at the rates; null when any line is unpriced. */
  readonly total: number | null;
  readonly unpriced_lines: number;
  readonly currency: string;
  readonly annual_saving: number;
  readonly payback_years: number | null;
  /** The requirement at the point of connection is met after compensation in every case. */
  readonly meets_every_case: boolean;
  readonly errors: number;
  readonly warnings: number;
}

/** The detuning the common options give every bus, % (0 = plain capacitors). */
export const DETUNED_OPTION_P = 7;

/**
 * The options compared for a site: the banks it holds (when it holds any), the design's
 * proposal, plain capacitors on every bus, 7 % detuning on every bus, and one bank at the point
 * of connection. A site that does not roll up gets none.
 */
export function standardOptions(site: Site, held: readonly BankChoice[] | undefined): OptionSpec[] {
  const graph = buildBusGraph(site.equipment);
  if (graph.root === undefined) return [];
  const everyBus = (p: number) => Object.fromEntries(graph.order.map((b) => [b, p]));
  const out: OptionSpec[] = [];
  if (held !== undefined)
    out.push({
      id: 'current',
      name: 'Banks as given',
      summary: "the banks the workbook's Compensation sheet or the site file holds",
      banks: held,
    });
  out.push(
    {
      id: 'proposal',
      name: 'Proposed design',
      summary: 'a bank on each bus whose own items draw kvar, detuned where harmonic sources call for it',
      banks: proposeChoices(site),
    },
    {
      id: 'plain',
      name: 'Plain capacitors',
      summary: 'the proposed buses, no detuning reactors anywhere',
      banks: proposeChoices(site, { detuning: everyBus(0) }),
    },
    {
      id: 'detuned',
      name: `All detuned ${DETUNED_OPTION_P} %`,
      summary: `the proposed buses, every bank with ${DETUNED_OPTION_P} % detuning reactors`,
      banks: proposeChoices(site, { detuning: everyBus(DETUNED_OPTION_P) }),
    },
    {
      id: 'central',
      name: 'One bank at the connection',
      summary: busVoltages(site.equipment).voltages.has(graph.root)
        ? `a single bank on ${graph.root}, the point of connection; the transformers below still carry their kvar`
        : `no bank: no row on ${graph.root}, the point of connection, states its voltage (u_kv), so no bank there can be sized`,
      banks: proposeChoices(site, { bankBuses: [graph.root] }),
    },
  );
  return out;
}

/**
 * The banks without their notes, fields in one order, in bus order: two options with the same
 * key install the same (a blank series is the equal-stage one).
 */
function banksKey(banks: readonly BankChoice[]): string {
  const canonical = banks.map((b) =>
    Object.entries(b)
      .filter(([k, v]) => k !== 'note' && v !== undefined && !(k === 'series' && v === DEFAULT_STEP_SERIES))
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)),
  );
  return JSON.stringify(canonical.map((e) => JSON.stringify(e)).sort());
}

/** Each option priced, its saving and payback worked out, and judged, at the same rates and tariff. */
export function compareOptions(
  site: Site,
  specs: readonly OptionSpec[],
  rates: RateTable,
  tariff: Tariff,
): OptionFigures[] {
  const seen = new Map<string, string>();
  return specs.map((spec) => {
    const key = banksKey(spec.banks);
    const sameAs = seen.get(key);
    if (sameAs === undefined) seen.set(key, spec.name);
    const assessment = assessBanks(site, spec.banks);
    const quote = priceSchedule(siteSchedule(site, spec.banks), rates);
    const flows = assessment.cases.map((c) => ({
      case: c.case,
      p_kw: c.before.root.p_kw,
      q_kvar: c.before.root.q_kvar,
      p_after_kw: c.after.root.p_kw,
      q_after_kvar: c.after.root.q_kvar,
    }));
    const saving = annualSaving(flows, tariff, quote.total);
    const count = (severity: string) => assessment.warnings.filter((w) => w.severity === severity).length;
    return {
      ...spec,
      ...(sameAs !== undefined ? { sameAs } : {}),
      capacitor_kvar: spec.banks.reduce((s, b) => s + bankTotal(b), 0),
      reactor_kvar: spec.banks.reduce((s, b) => s + (b.reactor_kvar ?? 0), 0),
      total: quote.total,
      unpriced_lines: quote.buses.reduce((n, b) => n + b.lines.filter((l) => l.cost === null).length, 0),
      currency: quote.currency,
      annual_saving: saving.annual_saving,
      payback_years: saving.payback_years,
      meets_every_case: assessment.cases.every((c) => c.within_after),
      errors: count('error'),
      warnings: count('warning'),
    };
  });
}
