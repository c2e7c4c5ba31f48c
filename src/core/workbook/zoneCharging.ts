// The cable and line charging in a bus's zone, as a formula of the Compensation sheet: the rule of
// src/core/site/chargingResonance.ts (zoneChargingMost) written over the equipment sheets. Buses
// joined by lines (no transformer between) form one zone; its charging is every energised
// cable's delivered kvar on a bus of the zone plus every line's charging whose sending bus is in
// the zone. The sheet counts the case with the most charging (the lowest resonance order).
import { busKey } from '../site/busNames.ts';
import type { EquipmentColumns } from './equipmentColumns.ts';
import { ownSum, nameCellOf, type BusRowIndex, type Flavour } from './busSums.ts';
import { cellOn } from './refs.ts';
import type { WorkbookStructure } from './structure.ts';

/** Index of each bus's zone top in `s.buses`: walk up through feeders that carry charging (lines). */
export function zoneTopIndex(s: WorkbookStructure): number[] {
  const top: number[] = [];
  s.buses.forEach((b, i) => {
    const f = b.feeder ? s.sheets[b.feeder.sheet]?.rows[b.feeder.row - 1] : undefined;
    const up = b.upstream === undefined ? undefined : s.busIndex.get(busKey(b.upstream));
    // Buses come level by level, so the bus above already has its top.
    top.push(f?.kind?.traits?.charging && up !== undefined && up < i ? (top[up] as number) : i);
  });
  return top;
}

/** A shunt sheet whose kinds all deliver charging (the cables): its per-case Q column. */
const chargingQ = (k: number) => (c: EquipmentColumns) =>
  c.role === 'shunt' && c.kinds.length > 0 && c.kinds.every((kind) => kind.traits?.charging)
    ? c.q?.[k]
    : undefined;

/** The formula of bus i's zone charging, kvar (≥ 0), the most of any case. */
export function zoneChargingFormula(
  s: WorkbookStructure,
  busRows: BusRowIndex,
  flavour: Flavour,
  tops: readonly number[],
  i: number,
): string {
  const members = s.buses.map((_, j) => j).filter((j) => tops[j] === tops[i]);
  const keys = new Set(members.map((j) => s.buses[j]?.key));
  const lines: string[] = [];
  for (const sheet of s.sheets) {
    const q = sheet.cols.qCharging;
    if (sheet.cols.role !== 'branch' || q === undefined) continue;
    sheet.rows.forEach((r, at) => {
      if (r.present && r.kind?.traits?.charging && keys.has(busKey(r.bus)))
        lines.push(cellOn(sheet.cols.sheet.name, at + 1, q, true));
    });
  }
  const perCase = s.cases.map((_, k) => {
    const cables = members
      .map((j) => {
        const b = s.buses[j] as WorkbookStructure['buses'][number];
        return ownSum(
          s,
          busRows,
          flavour,
          { name: b.name, nameCell: nameCellOf(j + 1) },
          chargingQ(k),
          'all',
        );
      })
      .filter((f) => f !== '=0')
      .map((f) => `(${f.slice(1)})`);
    // Cables deliver: their Q is negative. A line's charging column is already the delivered kvar.
    const parts = [...(cables.length > 0 ? [`-(${cables.join('+')})`] : []), ...lines];
    return parts.length > 0 ? parts.join('+') : '0';
  });
  return `=MAX(0,${perCase.join(',')})`;
}

/** Indices of every bus that shares a zone with one of these bus keys (their charging cells follow an edit there). */
export function zoneMatesOf(
  s: WorkbookStructure,
  tops: readonly number[],
  keys: ReadonlySet<string>,
): number[] {
  const hit = new Set<number>();
  for (const key of keys) {
    const i = s.busIndex.get(key);
    if (i !== undefined) hit.add(tops[i] as number);
  }
  return s.buses.map((_, j) => j).filter((j) => hit.has(tops[j] as number));
}
