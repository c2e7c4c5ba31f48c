// Bus names are compared ignoring case, as spreadsheet programs compare the names a conditional
// sum looks for: "LV1" and "lv1" are one bus. Readers pass every row through here so the roll-up,
// the workbook and the export all see one spelling per bus: the first one met.
import type { EquipmentRow } from './model.ts';
import { warning, type Problem } from './problems.ts';

/** The key two spellings of one bus share. */
export function busKey(name: string): string {
  return name.toUpperCase();
}

/** Rows with each bus and to_bus written as that bus's first spelling; a warning per other spelling. */
export function unifyBusNames(rows: readonly EquipmentRow[]): { rows: EquipmentRow[]; problems: Problem[] } {
  const first = new Map<string, { name: string; row: number }>();
  const problems: Problem[] = [];
  const spell = (
    name: string | undefined,
    row: EquipmentRow,
    column: 'bus' | 'to_bus',
  ): string | undefined => {
    if (name === undefined || name === '') return name;
    const key = busKey(name);
    const known = first.get(key);
    if (!known) {
      first.set(key, { name, row: row.row });
      return name;
    }
    if (known.name !== name) {
      problems.push(
        warning(
          { row: row.row, column, bus: known.name, ...(row.tag ? { tag: row.tag } : {}) },
          `bus "${name}" is written "${known.name}" in row ${known.row}; bus names are compared ignoring case, so both are bus ${known.name}`,
        ),
      );
    }
    return known.name;
  };
  const out = rows.map((r) => {
    const bus = spell(r.bus, r, 'bus') ?? r.bus;
    const to = spell(r.to_bus, r, 'to_bus');
    if (bus === r.bus && to === r.to_bus) return r;
    return { ...r, bus, ...(to !== undefined ? { to_bus: to } : {}) };
  });
  return { rows: out, problems };
}
