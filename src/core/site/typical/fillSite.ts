// Typical values for the blanks of a site's equipment rows, by the one rule (typicalFillRow):
// the command line and the list import fill a site as it is read, before it is validated, so a
// list without efficiencies becomes a site that balances. Each value is listed with its row,
// tag, column and source, so the workbook built from the site can mark it as assumed.
import type { EquipmentRow, Site } from '../model.ts';
import { typicalFillRow } from './fillRow.ts';

export interface AssumedInput {
  /** Index of the row in the site's equipment. */
  readonly index: number;
  /** The row's number in the file it was read from (header = row 1), for messages. */
  readonly row: number;
  readonly tag: string;
  readonly kind: string;
  readonly column: string;
  readonly value: number;
  /** Basis and source: "11 kW, 4-pole, class IE3; IEC 60034-30-1 …". */
  readonly note: string;
}

export interface SiteFill {
  readonly site: Site;
  readonly assumed: readonly AssumedInput[];
  /** Blanks that stay blank, and why ("row 7 (M-12): eff: …"). */
  readonly notAssumed: readonly string[];
}

/** The site with its blank motor and transformer inputs filled; rows without a fill stay the same objects. */
export function fillSiteTypical(site: Site): SiteFill {
  const assumed: AssumedInput[] = [];
  const notAssumed: string[] = [];
  const equipment = site.equipment.map((r, index): EquipmentRow => {
    const fill = typicalFillRow(r.kind, (key) => r.values[key]);
    for (const why of fill.notAssumed) notAssumed.push(`row ${r.row}${r.tag ? ` (${r.tag})` : ''}: ${why}`);
    if (fill.writes.length === 0) return r;
    const values = { ...r.values };
    for (const w of fill.writes) {
      values[w.column] = w.value;
      assumed.push({
        index,
        row: r.row,
        tag: r.tag,
        kind: r.kind,
        column: w.column,
        value: w.value,
        note: w.note,
      });
    }
    return { ...r, values };
  });
  return { site: { ...site, equipment }, assumed, notAssumed };
}
