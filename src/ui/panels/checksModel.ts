// What the Checks panel lists: the inputs' problems (read back from the sheets, then validated)
// and the findings of the compensation design (requirement, resonance, overvoltage, voltage
// rise, self-excitation, overcompensation, cable charging). Each item says where — sheet, grid
// row and column, or the bus and case — and points at the cell to show. Pure: no DOM.
import { rollUpAll, runawayProblem } from '../../core/site/rollup.ts';
import type { Problem, Severity } from '../../core/site/problems.ts';
import type { Site } from '../../core/site/model.ts';
import { validateSite } from '../../core/site/validate.ts';
import { assessBanks } from '../../core/site/assessBanks.ts';
import { choiceFindings } from '../../core/site/sheetChoices.ts';
import { busVoltages } from '../../core/site/voltages.ts';
import { buildBusGraph } from '../../core/site/graph.ts';
import { a1 } from '../model/address.ts';
import { heldAssumptions } from '../../core/workbook/cellMarks.ts';
import type { DesignWarning } from '../../core/site/warnings.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook, type SiteFromWorkbook } from '../../core/workbook/readSite.ts';
import { optionInputItems } from './checksOptions.ts';
import { locateReaderProblem, locateRuleProblem, type CheckItem } from './checksWhere.ts';
import { rateItems, tariffItems } from './checksQuote.ts';

export type { CheckItem, CheckTarget } from './checksWhere.ts';

export interface ChecksReport {
  readonly items: readonly CheckItem[];
  readonly counts: Readonly<Record<Severity, number>>;
  /** Why no design findings are listed (the inputs have errors), when so. */
  readonly designSkipped?: string;
}

function designItem(w: DesignWarning, doc: WorkbookDoc, origins: SiteFromWorkbook['origins']): CheckItem {
  const at = locateRuleProblem(w, doc, origins);
  const parts = [w.bus ? `bus ${w.bus}` : '', w.tag ? `item ${w.tag}` : ''];
  const casePrefix = w.case !== undefined ? `case ${w.case}: ` : '';
  return {
    severity: w.severity,
    code: w.code,
    where: parts.filter(Boolean).join(', ') || at.where,
    text: at.text.startsWith(casePrefix) ? at.text : casePrefix + at.text,
    ...(at.target ? { target: at.target } : {}),
  };
}

const RANK: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

/** Values typed over Kvar Ledger's formulas, assumed values, and formulas left pointing at a removed sheet. */
function workbookItems(doc: WorkbookDoc): CheckItem[] {
  const out: CheckItem[] = [];
  for (const s of doc.sheets) {
    for (const [row, col] of s.overrides ?? []) {
      const header = s.columns?.[col]?.header ?? s.cells[0]?.[col];
      out.push({
        severity: 'warning',
        code: 'override',
        where: `${s.name} row ${row + 1}${header ? `, column "${String(header)}"` : `, cell ${a1(row, col)}`}`,
        text: `the value ${JSON.stringify(s.cells[row]?.[col] ?? null)} is typed over Kvar Ledger's formula and counts as typed; clear the cell to bring the formula back`,
        target: { sheet: s.name, row: row + 1, col },
      });
    }
    const assumed = heldAssumptions(s);
    const first = assumed[0];
    if (first) {
      const named = (m: { row: number; col: number }) =>
        `row ${m.row + 1} ${String(s.columns?.[m.col]?.header ?? s.cells[0]?.[m.col] ?? a1(m.row, m.col))}`;
      const list = assumed.slice(0, 8).map(named).join(', ');
      out.push({
        severity: 'info',
        code: 'assumed',
        where: `${s.name} row ${first.row + 1}`,
        text: `assumed: ${assumed.length} typical value${assumed.length === 1 ? '' : 's'} put in for blanks (${list}${assumed.length > 8 ? ', …' : ''}); replace each with the nameplate or the maker's data when known`,
        target: { sheet: s.name, row: first.row + 1, col: first.col },
      });
    }
    s.cells.forEach((line, row) =>
      line.forEach((v, col) => {
        if (typeof v !== 'string' || !v.startsWith('=') || !v.includes('#REF!')) return;
        out.push({
          severity: 'error',
          code: 'reference',
          where: `${s.name} cell ${a1(row, col)}`,
          text: `the formula ${v} refers to a sheet or cells that were removed (#REF!)`,
          target: { sheet: s.name, row: row + 1, col },
        });
      }),
    );
  }
  return out;
}

export function collectChecks(doc: WorkbookDoc): ChecksReport {
  const read = siteFromWorkbook(doc);
  const items: CheckItem[] = [];
  const said = new Set<string>();
  for (const p of read.problems) {
    const at = locateReaderProblem(p, doc);
    if (at.key && p.severity === 'error') said.add(at.key);
    items.push({
      severity: p.severity,
      code: 'input',
      where: at.where,
      text: at.text,
      ...(at.target ? { target: at.target } : {}),
    });
  }
  const rules = validateSite(read.site);
  for (const p of rules) {
    const at = locateRuleProblem(p, doc, read.origins);
    // The reader already said what is wrong with this cell.
    if (at.key && said.has(at.key)) continue;
    items.push({
      severity: p.severity,
      code: 'input',
      where: at.where,
      text: at.text,
      ...(at.target ? { target: at.target } : {}),
    });
  }
  const inputErrors = items.some((i) => i.severity === 'error');
  items.push(...workbookItems(doc));
  items.push(...rateItems(doc), ...tariffItems(doc, read.site.settings.cases));
  items.push(...optionInputItems(doc, read.site.settings.cases));
  const voltages = busVoltages(read.site.equipment).voltages;
  for (const bus of buildBusGraph(read.site.equipment.filter((r) => r.bus !== '')).firstRow.keys()) {
    if (voltages.has(bus)) continue;
    items.push({
      severity: 'info',
      code: 'bus-voltage-unknown',
      where: `bus ${bus}`,
      text: `bus ${bus} has no voltage: no row on it states U (kV), so its Compensation row shows U = 0 and no bank there can be checked`,
    });
  }
  let designSkipped: string | undefined;
  if (inputErrors) {
    designSkipped = 'The compensation design is checked once the input errors above are mended.';
  } else if (read.site.equipment.length === 0) {
    designSkipped = 'No equipment in this workbook yet.';
  } else {
    try {
      // Findings for the banks on the Compensation sheet (typed, or proposed when the site was built).
      items.push(...assessBanks(read.site, read.banks).warnings.map((w) => designItem(w, doc, read.origins)));
      // Per bus, which choice is typed and what the design proposes for a detuning typed alone.
      items.push(...choiceFindings(read.site, read.banks).map((w) => designItem(w, doc, read.origins)));
    } catch (e) {
      // Losses that run away (megawatts through a low-voltage line) say where; anything else as it came.
      const runaway = runawayOf(read.site);
      const why = runaway?.message ?? (e instanceof Error ? e.message : String(e));
      designSkipped = `The compensation design could not be checked: ${why}`;
    }
  }
  items.sort((a, b) => RANK[a.severity] - RANK[b.severity]);
  const counts = { error: 0, warning: 0, info: 0 };
  for (const i of items) counts[i.severity]++;
  return { items, counts, ...(designSkipped ? { designSkipped } : {}) };
}

/** The first runaway-losses error of any case, if the roll-up gets that far. */
function runawayOf(site: Site): Problem | undefined {
  try {
    return rollUpAll(site)
      .map(runawayProblem)
      .find((p) => p !== undefined);
  } catch {
    return undefined; // a structural problem: listed with the inputs
  }
}
