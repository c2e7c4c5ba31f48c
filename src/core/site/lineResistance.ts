// The series impedance of a line or feeder cable row: optional, because tender-stage lists
// often leave it out, but never silently 0. A blank R with no cross-section (cu_mm2, al_mm2)
// says that the row's kW losses are not counted, a feeder's blank X that its series kvar is
// not; negative is refused; a value outside what conductors have says so with the range and,
// where it fits, the unit it was probably typed in.
import type { EquipmentRow } from './model.ts';
import { error, say, warning, type Problem } from './problems.ts';
import { formatNumber } from '../registry/messages.ts';

/**
 * Usual per-phase resistance of line and cable conductors, Ω/km: IEC 60228 class 2 conductors
 * run from 12.1 Ω/km (1.5 mm² copper) to 0.0072 Ω/km (2 500 mm² copper) at 20 °C (values from
 * memory), and overhead conductors lie inside that span. Common practice.
 */
export const LINE_R_OHM_KM = { lo: 0.005, hi: 15 } as const;

/**
 * Usual positive-sequence reactance of power cables, Ω/km: about 0.07–0.2 for three-core and
 * trefoil cables from LV to 132 kV, up to about 0.45 for single cores laid far apart or an
 * overhead line entered here (common practice, from memory); the range is kept wide.
 */
export const FEEDER_X_OHM_KM = { lo: 0.03, hi: 0.6 } as const;

type At = (column: string) => { row: number; column: string; tag?: string };

interface Quantity {
  readonly column: string;
  readonly what: string;
  readonly range: { readonly lo: number; readonly hi: number };
  readonly usual: string;
  readonly blankMeans: (name: string) => string;
}

const R: Quantity = {
  column: 'r_ohm_km',
  what: "enter the conductor's resistance per phase in Ω/km from the maker's data, or its cross-section in cu_mm2 or al_mm2",
  range: LINE_R_OHM_KM,
  usual: 'line and cable conductors (IEC 60228 class 2, 1.5 mm² to 2 500 mm² copper, from memory)',
  blankMeans: (name) => `the kW losses of ${name} (3·I²·R) are not counted before or after compensation`,
};

const X: Quantity = {
  column: 'x_ohm_km',
  what: "enter the cable's series reactance per phase in Ω/km from the maker's data",
  range: FEEDER_X_OHM_KM,
  usual: 'power cables (common practice, from memory)',
  blankMeans: (name) => `the series kvar of ${name} (3·I²·X) is not counted before or after compensation`,
};

/** Per kind: the series quantities its rows give per km (a line's X comes from its inductance). */
const BY_KIND: Readonly<Record<string, readonly Quantity[]>> = {
  line: [R],
  feeder: [R, X],
};

/** Problems with a line's or feeder cable's series resistance and reactance (nothing for other kinds). */
export function lineResistanceProblems(row: EquipmentRow, at: At): Problem[] {
  const quantities = BY_KIND[row.kind];
  if (!quantities) return [];
  const name = row.tag ? `${row.kind} ${row.tag}` : `this ${row.kind}`;
  const v = row.values;
  const cu = (v.cu_mm2 ?? 0) > 0;
  const al = (v.al_mm2 ?? 0) > 0;
  const fromSection = v.r_ohm_km === undefined && (cu || al);
  return [
    ...quantities.flatMap((q) => (q === R && fromSection ? [] : quantityProblems(v[q.column], q, name, at))),
    ...(cu && al
      ? [
          warning(
            at('al_mm2'),
            `both cu_mm2 and al_mm2 are given for ${name}; R ${v.r_ohm_km === undefined ? 'comes from the copper section' : 'is the r_ohm_km typed'}, so clear the metal the conductor is not`,
          ),
        ]
      : []),
  ];
}

function quantityProblems(v: number | undefined, q: Quantity, name: string, at: At): Problem[] {
  if (v === undefined)
    return [warning(at(q.column), `${q.column} is blank, so ${q.blankMeans(name)}; ${q.what}`)];
  if (v < 0) return [error(at(q.column), say.outOfRange(q.column, '≥ 0 Ω/km (blank when not known)', v))];
  if (v >= q.range.lo && v <= q.range.hi) return [];
  const perMetre = v * 1000;
  const reread =
    perMetre >= q.range.lo && perMetre <= q.range.hi
      ? `; typed in Ω/m? ${formatNumber(v)} Ω/m is ${formatNumber(perMetre)} Ω/km`
      : '';
  return [
    warning(
      at(q.column),
      `${q.column} ${formatNumber(v)} Ω/km is outside the usual ${formatNumber(q.range.lo)}–${formatNumber(q.range.hi)} Ω/km of ${q.usual}${reread}; check the datasheet`,
    ),
  ];
}
