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
import type { Site } from '../site/model.ts';
import { DEFAULT_STEP_SERIES } from '../site/stepSeries.ts';
import { BLOCK_IDS, type OptionSpec } from '../site/designOptions.ts';
import type { SheetDoc } from '../workbook/document.ts';
import { optionDrafts } from '../workbook/optionDrafts.ts';
export {
  BLOCK_IDS,
  DETUNED_OPTION_P,
  draftOptions,
  givenOption,
  standardOptions,
  type OptionId,
  type OptionSpec,
} from '../site/designOptions.ts';
// Straight from the quote's modules, not its index: see the architecture test (first download).
import { priceSchedule } from '../quote/cost.ts';
import type { RateTable } from '../quote/rates.ts';
import { annualSaving, type Tariff } from '../quote/saving.ts';
import { siteSchedule } from '../quote/siteSchedule.ts';

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

/** An option whose inputs could not all be read: listed with what is wrong, no figures. */
export interface UnreadOption extends OptionSpec {
  readonly unread: readonly string[];
}

export type OptionOutcome = OptionFigures | UnreadOption;

export const isUnread = (o: OptionSpec): o is UnreadOption => o.unread !== undefined && o.unread.length > 0;

/** The options typed on a Design options sheet, each with the id of its block. */
export function sheetOptions(sheet: SheetDoc, cases: readonly string[]): OptionSpec[] {
  return optionDrafts(sheet, cases).map((d) => ({
    id: BLOCK_IDS[d.block] ?? 'proposal',
    name: d.name,
    summary: d.summary,
    banks: d.banks,
    ...(d.problems.length > 0 ? { unread: d.problems.map((p) => p.message) } : {}),
  }));
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

/**
 * The options as a workbook holds them: each one whose inputs were all read compared as
 * compareOptions does, each other one as it was, with what could not be read.
 */
export function weighOptions(
  site: Site,
  specs: readonly OptionSpec[],
  rates: RateTable,
  tariff: Tariff,
): OptionOutcome[] {
  const figures = compareOptions(
    site,
    specs.filter((s) => !isUnread(s)),
    rates,
    tariff,
  );
  let next = 0;
  return specs.map((s) => (isUnread(s) ? s : (figures[next++] as OptionFigures)));
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
