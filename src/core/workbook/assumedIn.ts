// The typical values a workbook already holds as assumed (marks that still hold), as the inputs
// of the site read from it: so a workbook rebuilt from its site (an import that adds rows, the
// command line's export of a saved workbook) keeps the marks the page put there.
import type { AssumedInput } from '../site/typical/fillSite.ts';
import { heldAssumptions } from './cellMarks.ts';
import type { WorkbookDoc } from './document.ts';
import type { SiteFromWorkbook } from './readSite.ts';
import { equipmentPlans } from './structure.ts';

export function assumedInWorkbook(doc: WorkbookDoc, read: SiteFromWorkbook): AssumedInput[] {
  const indexAt = new Map(read.origins.map((o, i) => [`${o.sheet}\u0000${o.row}`, i]));
  const out: AssumedInput[] = [];
  for (const plan of equipmentPlans(read.site.settings.cases)) {
    const sheet = doc.sheets.find((s) => s.name === plan.sheet.name);
    if (!sheet) continue;
    // The reader finds columns by their header text; so does this.
    const keyOf = new Map([...plan.input].map(([key, c]) => [plan.columns[c]?.header, key]));
    for (const m of heldAssumptions(sheet)) {
      const key = keyOf.get(String(sheet.cells[0]?.[m.col] ?? ''));
      const index = indexAt.get(`${sheet.name}\u0000${m.row}`);
      const row = index === undefined ? undefined : read.site.equipment[index];
      const value = row && key ? row.values[key] : undefined;
      if (index === undefined || !row || !key || value === undefined) continue;
      out.push({ index, row: row.row, tag: row.tag, kind: row.kind, column: key, value, note: m.note });
    }
  }
  return out;
}
