// The two sheets the export adds, as plain rows of text: a cover (site, cases, date, assumptions,
// cautions, licence, notes on the export) and the list of catalogue functions used, each written
// out as the plain formula it becomes and with its published source.
import { CATALOGUE, findFunction } from '../../core/functions/index.ts';
import { expandCall } from '../../core/registry/expand.ts';
import { formatNumber } from '../../core/registry/messages.ts';
import { isOptional, type FunctionSpec, type ParamSpec } from '../../core/registry/spec.ts';
import type { SiteSettings } from '../../core/site/model.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';

export const COVER_TITLE = 'Kvar Ledger: reactive power hand-off';

export const CAUTIONS: readonly string[] = [
  'This workbook is an estimate for pricing and early design. It does not replace a design study.',
  'Capacitor banks, resonance and overvoltage can hurt people and damage plant: switching transients, harmonic resonance, motor self-excitation and stored charge are real hazards.',
  'The final design, protection and switching must follow local codes and the utility’s rules, and be checked and signed off by a licensed engineer.',
];

export const ASSUMPTIONS: readonly string[] = [
  'Three-phase, balanced, fundamental frequency; voltages are line-to-line.',
  'Sign of reactive power (load reference): Q > 0 is absorbed (inductive, lagging), Q < 0 is delivered (capacitors, cable charging, over-excited generators).',
  'Every computed cell is a plain formula of classic spreadsheet functions; the functions of the Kvar Ledger catalogue used here are written out on the functions sheet.',
  'Cached values are those computed by Kvar Ledger; the file asks your program to recalculate on opening.',
];

export const LICENCE_LINES: readonly string[] = [
  'Made with Kvar Ledger, free software under the GNU General Public License, version 3 (GPL-3.0-only).',
  'The cached results were computed with the HyperFormula engine, used under the GPL v3.',
];

export interface CoverInput {
  readonly doc: WorkbookDoc;
  readonly settings?: SiteSettings;
  readonly date: Date;
  readonly generator: string;
  /** Export notes: cells written as values, functions needing a newer program. */
  readonly notes: readonly string[];
  readonly functionsSheet: string;
  /** Figures at a glance, as formulas referring to the exported sheets, with their cached values. */
  readonly figures?: readonly CoverFigureRow[];
}

/** A figure of the cover: a formula (no leading '=') with its cached value and number format. */
export interface CoverFigureRow {
  readonly label: string;
  readonly formula: string;
  readonly result: number | string | boolean | null | { readonly error: string };
  readonly format: string;
}

/** [] is a blank line; [label] a heading; [label, text] an entry; a figure is a live formula. */
export type CoverRow = readonly [] | readonly [string] | readonly [string, string] | CoverFigureRow;

export const FIGURES_HEADING = 'At a glance (formulas on the sheets of this file)';

function requirementText(s: SiteSettings): string {
  const r = s.requirement;
  if (r.kind === 'cosphi')
    return r.lagOnly
      ? `cos φ at least ${formatNumber(r.target)} while drawing kvar, no leading limit, at the point of connection`
      : `cos φ at least ${formatNumber(r.target)}, lagging or leading, at the point of connection`;
  return `tan φ at most ${formatNumber(r.lagMax)} lagging and ${formatNumber(r.leadMax)} leading at the point of connection`;
}

function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/** Cover rows: a label in column A, the text in column B; a row without B is a heading. */
export function coverRows(input: CoverInput): CoverRow[] {
  const s = input.settings;
  const rows: CoverRow[] = [[COVER_TITLE], ['Site', s?.name ?? input.doc.title]];
  if (s) {
    rows.push(
      ['Frequency', `${s.hz} Hz`],
      ['Requirement', requirementText(s)],
      ['Operating cases', s.cases.join(', ')],
    );
    if (s.sscMva !== undefined) rows.push(['Supply short-circuit power', `${formatNumber(s.sscMva)} MVA`]);
  }
  rows.push(['Exported', isoDate(input.date)], ['Made by', input.generator], []);
  if (input.figures && input.figures.length > 0) rows.push([FIGURES_HEADING], ...input.figures, []);
  rows.push(['Sheets']);
  for (const sh of input.doc.sheets) rows.push([sh.name, sh.purpose ?? '']);
  rows.push(
    [input.functionsSheet, 'the catalogue functions used, written out as plain formulas, with their sources'],
    [],
  );
  rows.push(['Assumptions']);
  for (const a of [...ASSUMPTIONS, ...(s?.notes ?? [])]) rows.push(['', a]);
  rows.push([], ['Cautions']);
  for (const c of CAUTIONS) rows.push(['', c]);
  rows.push([], ['Licence']);
  for (const l of LICENCE_LINES) rows.push(['', l]);
  if (input.notes.length > 0) {
    rows.push([], ['Notes on this export']);
    for (const n of input.notes) rows.push(['', n]);
  }
  return rows;
}

function paramText(p: ParamSpec): string {
  const unit = p.unit === '1' || p.unit === '' ? '' : ` [${p.unit}]`;
  if (!isOptional(p)) return `${p.name}${unit}`;
  const d = p.default;
  const dflt =
    typeof d === 'number'
      ? formatNumber(d)
      : typeof d === 'boolean'
        ? d
          ? 'TRUE'
          : 'FALSE'
        : d && 'sameAs' in d
          ? d.sameAs
          : 'omitted';
  return `[${p.name}${unit} = ${dflt}]`;
}

/** The plain formula a call becomes, with the parameter names standing for the arguments. */
export function writtenOut(spec: FunctionSpec): string {
  return (
    '=' +
    expandCall(
      spec,
      spec.params.map((p) => p.name),
    )
  );
}

export const FUNCTION_HEADER = [
  'Function',
  'What it gives',
  'Arguments',
  'Result',
  'Written out as',
  'Source',
  'Kind of source',
] as const;

/** One row per catalogue function used, in catalogue order. */
export function functionRows(names: Iterable<string>): string[][] {
  const wanted = new Set([...names].map((n) => findFunction(n)?.name));
  const specs = CATALOGUE.filter((s) => wanted.has(s.name));
  return specs.map((s) => [
    `${s.name}(${s.params.map((p) => p.name).join(', ')})`,
    s.summary,
    s.params.map(paramText).join('; '),
    s.result.unit === '1' ? s.result.doc : `${s.result.unit}: ${s.result.doc}`,
    writtenOut(s),
    s.source.ref,
    s.source.kind,
  ]);
}
