// The "Options compared" sheet of the export: the design options of the site side by side
// (src/core/quote/options.ts), then the banks of each option, so a colleague can type an
// option's banks onto the Compensation sheet and see its figures as live formulas. The figures
// are values worked out by Kvar Ledger at export, and the sheet says so.
import type { OptionFigures } from '../../core/options/index.ts';
import { CAUTION_SHORT } from '../../core/cautions.ts';

export const OPTIONS_SHEET_NAME = 'Options compared';

export type OptionsCell = string | number | null;

export const OPTIONS_HEADER = [
  'Option',
  'What it is',
  'Capacitors (kvar)',
  'Reactors (kvar)',
  'Total',
  'Currency',
  'Saving a year',
  'Payback (years)',
  'Requirement in every case',
  'Errors',
  'Warnings',
  'Same banks as',
] as const;

export const BANKS_HEADER = [
  'Option',
  'Bus',
  'Fixed (kvar)',
  'Step (kvar)',
  'Steps',
  'Step series',
  'Detuning p (%)',
  'Capacitor rated voltage (kV)',
  'Reactor (kvar)',
] as const;

export const OPTIONS_NOTE =
  "Values worked out by Kvar Ledger when this file was exported, not formulas: each option's cost, saving and findings are what the workbook shows once that option's banks (listed below) are typed onto the Compensation sheet.";

/** The sheet's rows: a note, the options, then the banks of each option that has its own. */
export function optionsSheetRows(options: readonly OptionFigures[]): OptionsCell[][] {
  const rows: OptionsCell[][] = [[OPTIONS_NOTE], [CAUTION_SHORT], [], [...OPTIONS_HEADER]];
  for (const o of options)
    rows.push([
      o.name,
      o.summary,
      o.capacitor_kvar,
      o.reactor_kvar,
      o.total ?? 'unpriced',
      o.currency,
      o.annual_saving,
      o.payback_years ?? '–',
      o.meets_every_case ? 'met' : 'missed',
      o.errors,
      o.warnings,
      o.sameAs ?? null,
    ]);
  rows.push([], [...BANKS_HEADER]);
  for (const o of options) {
    if (o.sameAs) continue;
    for (const b of o.banks)
      rows.push([
        o.name,
        b.bus,
        b.fixed_kvar ?? null,
        b.step_kvar ?? null,
        b.steps ?? null,
        b.series ?? null,
        b.p_pct ?? null,
        b.u_rated_kv ?? null,
        b.reactor_kvar ?? null,
      ]);
  }
  return rows;
}
