// The resistance of a line row: optional, because tender-stage lists often leave it out, but
// never silently 0. Blank says that the line's kW losses are not counted; negative is refused;
// a value outside what conductors have says so with the range and, where it fits, the unit the
// value was probably typed in.
import type { EquipmentRow } from './model.ts';
import { error, say, warning, type Problem } from './problems.ts';
import { formatNumber } from '../registry/messages.ts';

/**
 * Usual per-phase resistance of line and cable conductors, Ω/km: IEC 60228 class 2 conductors
 * run from 12.1 Ω/km (1.5 mm² copper) to 0.0072 Ω/km (2 500 mm² copper) at 20 °C (values from
 * memory), and overhead conductors lie inside that span. Common practice.
 */
export const LINE_R_OHM_KM = { lo: 0.005, hi: 15 } as const;

type At = (column: string) => { row: number; column: string; tag?: string };

const COLUMN = 'r_ohm_km';

/** Problems with a line row's resistance (nothing for other kinds). */
export function lineResistanceProblems(row: EquipmentRow, at: At): Problem[] {
  if (row.kind !== 'line') return [];
  const r = row.values[COLUMN];
  const name = row.tag ? `line ${row.tag}` : 'this line';
  if (r === undefined)
    return [
      warning(
        at(COLUMN),
        `${COLUMN} is blank, so the kW losses of ${name} (3·I²·R) are not counted before or after compensation; enter the conductor's resistance per phase in Ω/km from the maker's data`,
      ),
    ];
  if (r < 0) return [error(at(COLUMN), say.outOfRange(COLUMN, '≥ 0 Ω/km (blank when not known)', r))];
  if (r >= LINE_R_OHM_KM.lo && r <= LINE_R_OHM_KM.hi) return [];
  const perMetre = r * 1000;
  const reread =
    perMetre >= LINE_R_OHM_KM.lo && perMetre <= LINE_R_OHM_KM.hi
      ? `; typed in Ω/m? ${formatNumber(r)} Ω/m is ${formatNumber(perMetre)} Ω/km`
      : '';
  return [
    warning(
      at(COLUMN),
      `${COLUMN} ${formatNumber(r)} Ω/km is outside the usual ${formatNumber(LINE_R_OHM_KM.lo)}–${formatNumber(LINE_R_OHM_KM.hi)} Ω/km of line and cable conductors (IEC 60228 class 2, 1.5 mm² to 2 500 mm² copper, from memory)${reread}; check the datasheet`,
    ),
  ];
}
