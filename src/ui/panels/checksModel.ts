// What the Checks panel lists: the inputs' problems (read back from the sheets, then validated)
// and the findings of the compensation design (requirement, resonance, overvoltage, voltage
// rise, self-excitation, overcompensation, cable charging). Each item says where: sheet and row
// in the grid's own numbering, or the bus and case it concerns. Pure: no DOM.
import { describeWhere, type Problem, type Severity } from '../../core/site/problems.ts';
import { mergeProblems, validateSite } from '../../core/site/validate.ts';
import { assessBanks } from '../../core/site/assessBanks.ts';
import { busVoltages } from '../../core/site/voltages.ts';
import { buildBusGraph } from '../../core/site/graph.ts';
import { a1 } from '../model/address.ts';
import type { DesignWarning } from '../../core/site/warnings.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { siteFromWorkbook, type SiteFromWorkbook } from '../../core/workbook/readSite.ts';

export interface CheckItem {
  readonly severity: Severity;
  /** 'input' for a problem with what was typed, else the design finding's code. */
  readonly code: string;
  /** "Motors row 5, column cos_phi", "bus LV-REF, case night", or "" for the whole site. */
  readonly where: string;
  readonly text: string;
  /** Sheet and 1-based grid row to jump to, when the item concerns one equipment row. */
  readonly target?: { readonly sheet: string; readonly row: number };
}

export interface ChecksReport {
  readonly items: readonly CheckItem[];
  readonly counts: Readonly<Record<Severity, number>>;
  /** Why no design findings are listed (the inputs have errors), when so. */
  readonly designSkipped?: string;
}

/** The message without the "row 7, column x: " prefix that problems.ts puts in front. */
function bareText(p: Problem): string {
  const prefix = describeWhere(p);
  return prefix && p.message.startsWith(`${prefix}: `) ? p.message.slice(prefix.length + 2) : p.message;
}

function inputItem(p: Problem, origins: SiteFromWorkbook['origins']): CheckItem {
  // Rows of the site read from a workbook are numbered as one list from 2; origins map them back.
  const origin = p.row !== undefined ? origins[p.row - 2] : undefined;
  const target = origin ? { sheet: origin.sheet, row: origin.row + 1 } : undefined;
  const parts = [
    target ? `${target.sheet} row ${target.row}` : '',
    p.column ? `column ${p.column}` : '',
    !target && p.bus ? `bus ${p.bus}` : '',
  ];
  return {
    severity: p.severity,
    code: 'input',
    where: parts.filter(Boolean).join(', '),
    text: origin ? bareText(p) : p.message,
    ...(target ? { target } : {}),
  };
}

function designItem(w: DesignWarning): CheckItem {
  const parts = [w.bus ? `bus ${w.bus}` : '', w.tag ? `item ${w.tag}` : ''];
  const casePrefix = w.case !== undefined ? `case ${w.case}: ` : '';
  const text = bareText(w);
  return {
    severity: w.severity,
    code: w.code,
    where: parts.filter(Boolean).join(', '),
    text: text.startsWith(casePrefix) ? text : casePrefix + text,
  };
}

const RANK: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

/** Values typed over Kvar Ledger's formulas, and formulas left pointing at a removed sheet. */
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
        target: { sheet: s.name, row: row + 1 },
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
          target: { sheet: s.name, row: row + 1 },
        });
      }),
    );
  }
  return out;
}

export function collectChecks(doc: WorkbookDoc): ChecksReport {
  const read = siteFromWorkbook(doc);
  const problems = mergeProblems(read.problems, validateSite(read.site));
  const items: CheckItem[] = [...problems.map((p) => inputItem(p, read.origins)), ...workbookItems(doc)];
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
  if (problems.some((p) => p.severity === 'error')) {
    designSkipped = 'The compensation design is checked once the input errors above are mended.';
  } else if (read.site.equipment.length === 0) {
    designSkipped = 'No equipment in this workbook yet.';
  } else {
    try {
      // Findings for the banks on the Compensation sheet (typed, or proposed when the site was built).
      items.push(...assessBanks(read.site, read.banks).warnings.map(designItem));
    } catch (e) {
      designSkipped = `The compensation design could not be checked: ${e instanceof Error ? e.message : String(e)}`;
    }
  }
  items.sort((a, b) => RANK[a.severity] - RANK[b.severity]);
  const counts = { error: 0, warning: 0, info: 0 };
  for (const i of items) counts[i.severity]++;
  return { items, counts, ...(designSkipped ? { designSkipped } : {}) };
}
