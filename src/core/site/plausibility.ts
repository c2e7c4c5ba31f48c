// Values that the catalogue accepts but no real item has: a cable's capacitance typed in nF/km
// in the µF/km column (250 "µF/km" charges like 1 000 cables), a line's in µF/km, transformer
// losses in W in the kW columns or above what EU 548/2014 allows. Each gives a warning with the
// usual range, its source and, where the value fits another unit, that reading.
import type { EquipmentRow } from './model.ts';
import { warning, type Problem } from './problems.ts';
import { ecodesignLosses } from './typical/transformers.ts';
import { formatNumber } from '../registry/messages.ts';

/** Usual per-phase capacitance of power cables, µF/km (common practice, from memory: XLPE and paper cables from LV to 132 kV lie within 0.1–1.5). */
export const CABLE_C_UF_KM = { lo: 0.05, hi: 2 } as const;
/** Usual per-phase capacitance of overhead lines (8–14 nF/km) and of cables entered as lines (100–1 500 nF/km), nF/km (common practice, from memory). */
export const LINE_C_NF_KM = { lo: 5, hi: 2000 } as const;
/** Usual per-phase inductance of overhead lines (0.8–1.4 mH/km) and cables (0.25–0.6 mH/km), mH/km (common practice, from memory). */
export const LINE_L_MH_KM = { lo: 0.15, hi: 2.5 } as const;
/**
 * Losses above the EU 548/2014 Tier 2 maximum by more than this share are flagged. The Regulation
 * allows higher losses for windings of Um 36 kV and dual-voltage units (up to 15 % on no-load
 * losses and 10 % on load losses, from memory), so the margin covers those.
 */
export const ECODESIGN_MARGIN = 0.15;

/** A value is read as W only when, in kW, it is at least this share of the maximum (a datasheet's losses are rarely below a fifth of it). */
const W_READING_FLOOR = 0.2;

type At = (column: string) => { row: number; column: string; tag?: string };

const inRange = (v: number, r: { lo: number; hi: number }) => v >= r.lo && v <= r.hi;

function outside(
  at: At,
  column: string,
  v: number,
  unit: string,
  range: { lo: number; hi: number },
  what: string,
  other?: { factor: number; unit: string },
): Problem[] {
  if (inRange(v, range)) return [];
  const reread = other && inRange(v * other.factor, range);
  return [
    warning(
      at(column),
      `${column} ${formatNumber(v)} ${unit} is outside the usual ${formatNumber(range.lo)}–${formatNumber(range.hi)} ${unit} of ${what} (common practice, from memory)${
        reread
          ? `; typed in ${other.unit}? ${formatNumber(v)} ${other.unit} is ${formatNumber(v * other.factor)} ${unit}`
          : ''
      }; check the datasheet`,
    ),
  ];
}

/** Plausibility warnings for one row whose required values are present. */
export function plausibilityProblems(row: EquipmentRow, at: At): Problem[] {
  const v = row.values;
  if ((row.kind === 'cable' || row.kind === 'feeder') && v.c_uf_km !== undefined && v.c_uf_km > 0)
    return outside(at, 'c_uf_km', v.c_uf_km, 'µF/km', CABLE_C_UF_KM, 'power cables', {
      factor: 1e-3,
      unit: 'nF/km',
    });
  if (row.kind === 'line') {
    const out: Problem[] = [];
    if (v.c_nf_km !== undefined && v.c_nf_km > 0)
      out.push(
        ...outside(at, 'c_nf_km', v.c_nf_km, 'nF/km', LINE_C_NF_KM, 'lines and cables', {
          factor: 1e3,
          unit: 'µF/km',
        }),
      );
    if (v.l_mh_km !== undefined && v.l_mh_km > 0)
      out.push(...outside(at, 'l_mh_km', v.l_mh_km, 'mH/km', LINE_L_MH_KM, 'lines and cables'));
    return out;
  }
  if (row.kind === 'transformer') return transformerLosses(v, at);
  return [];
}

function transformerLosses(v: EquipmentRow['values'], at: At): Problem[] {
  const s = v.s_kva;
  if (s === undefined || !(s > 0)) return [];
  const liquid = ecodesignLosses(s, 'liquid');
  const dry = ecodesignLosses(s, 'dry');
  if (!liquid || !dry) return [];
  const out: Problem[] = [];
  for (const [column, key, label] of [
    ['p0_kw', 'p0', 'no-load'],
    ['pk_kw', 'pk', 'load'],
  ] as const) {
    const x = v[column];
    if (x === undefined || !(x > 0)) continue;
    const most = Math.max(liquid[key].value, dry[key].value);
    if (x <= most * (1 + ECODESIGN_MARGIN)) continue;
    const watts =
      x / 1000 <= most * (1 + ECODESIGN_MARGIN) && x / 1000 >= most * W_READING_FLOOR
        ? `; typed in W? ${formatNumber(x)} W is ${formatNumber(x / 1000)} kW`
        : '';
    out.push(
      warning(
        at(column),
        `${column} ${formatNumber(x)} kW is above the ${label} losses Commission Regulation (EU) No 548/2014 allows a ${formatNumber(s)} kVA transformer (Annex I, Tier 2: ${formatNumber(Number(liquid[key].value.toFixed(3)))} kW liquid-immersed, Table I.1; ${formatNumber(Number(dry[key].value.toFixed(3)))} kW dry-type, Table I.2; values from memory)${watts}; an older unit may exceed it: check the datasheet`,
      ),
    );
  }
  return out;
}
