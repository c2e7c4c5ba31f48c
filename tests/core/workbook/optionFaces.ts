// Test helpers: the design options as the Design options sheet shows them (its table, evaluated
// by an engine) and as the core works them out (compare.ts) for the same workbook.
import type { HyperFormula } from 'hyperformula';
import {
  compareOptions,
  isUnread,
  type OptionFigures,
  type OptionOutcome,
} from '../../../src/core/options/index.ts';
import { rateRowsOf, readRateTable, readTariff, tariffRowsOf } from '../../../src/core/quote/index.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { optionDrafts } from '../../../src/core/workbook/optionDrafts.ts';
import { OPTIONS_SHEET, TABLE, tableRow } from '../../../src/core/workbook/optionsLayout.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { expect } from 'vitest';

export interface OptionFace {
  /** The block on the sheet (0–3). */
  readonly block: number;
  readonly name: string;
  readonly capacitor: number;
  readonly reactor: number;
  /** null: unpriced. */
  readonly total: number | null;
  readonly saving: number;
  /** null: unpriced or no saving. */
  readonly payback: number | null;
  readonly met: boolean;
}

const numOrNull = (v: unknown) => (typeof v === 'number' ? v : null);

function number(v: unknown, what: string): number {
  if (typeof v !== 'number') throw new Error(`${what}: expected a number, got ${JSON.stringify(v)}`);
  return v;
}

/** The table's lines of these blocks as an engine holding the workbook evaluates them (by sheet name). */
export function sheetOptions(
  value: (sheet: string, row: number, col: number) => unknown,
  blocks: readonly number[],
): OptionFace[] {
  return blocks.map((block) => {
    const at = (c: { col: number }) => value(OPTIONS_SHEET, tableRow(block), c.col);
    const name = String(at(TABLE.option));
    return {
      block,
      name,
      capacitor: number(at(TABLE.capacitor), `${name} capacitors`),
      reactor: number(at(TABLE.reactor), `${name} reactors`),
      total: numOrNull(at(TABLE.total)),
      saving: number(at(TABLE.saving), `${name} saving`),
      payback: numOrNull(at(TABLE.payback)),
      met: at(TABLE.met) === 'yes',
    };
  });
}

export const engineValue = (hf: HyperFormula) => (sheet: string, row: number, col: number) =>
  hf.getCellValue({ sheet: hf.getSheetId(sheet) as number, row, col });

/** The options typed on the workbook's sheet, worked out by the core at its Rates and Tariff sheets. */
export function coreOptions(doc: WorkbookDoc): OptionFace[] {
  const { site } = siteFromWorkbook(doc);
  const cases = site.settings.cases;
  const drafts = optionDrafts(
    doc.sheets.find((s) => s.name === OPTIONS_SHEET),
    cases,
  );
  const rates = readRateTable(rateRowsOf(doc) ?? []).table;
  const tariff = readTariff(tariffRowsOf(doc) ?? [], cases).tariff;
  const specs = drafts.map((d) => ({ ...d, id: 'proposal' as const }));
  return compareOptions(site, specs, rates, tariff).map((f, j) => ({
    block: drafts[j]?.block ?? -1,
    name: f.name,
    capacitor: f.capacitor_kvar,
    reactor: f.reactor_kvar,
    total: f.total,
    saving: f.annual_saving,
    payback: f.payback_years,
    met: f.meets_every_case,
  }));
}

/** Relative 1e-9 with a floor of 1e-9 of the scale: the two sides differ by rounding only. */
export function expectSameOptions(
  sheet: readonly OptionFace[],
  core: readonly OptionFace[],
  where = '',
): void {
  expect(sheet.length, where).toBe(core.length);
  sheet.forEach((s, j) => {
    const c = core[j] as OptionFace;
    const label = `${where} option ${j + 1} (${c.name})`;
    expect(s.name, label).toBe(c.name);
    for (const key of ['capacitor', 'reactor', 'total', 'saving', 'payback'] as const) {
      const [a, b] = [s[key], c[key]];
      if (b === null || a === null) expect(a, `${label} ${key}`).toBe(b);
      else
        expect(Math.abs(a - b), `${label} ${key}: sheet ${a}, core ${b}`).toBeLessThanOrEqual(
          1e-9 * Math.max(1, Math.abs(a), Math.abs(b)),
        );
    }
    expect(s.met, `${label} met`).toBe(c.met);
  });
}

/** An option's figures; fails the test, with what could not be read, when it was not worked out. */
export function figuresOf(o: OptionOutcome): OptionFigures {
  if (isUnread(o)) throw new Error(`option ${o.name} was not worked out: ${o.unread.join('; ')}`);
  return o;
}
