// How much of a bus's load injects harmonics: the kVA of the items on the bus and every bus it
// feeds, by what feeds them (the Supply column, src/core/kinds/supply.ts), against the rating of
// the transformer feeding the bus (or, with none, the bus's own load), in each case with the
// units running. The detuning choice (detuningChoice.ts) reads it.
import { findKind, readSupply, type HarmonicClass } from '../kinds/index.ts';
import type { BusGraph } from './graph.ts';
import type { EquipmentRow, Site } from './model.ts';
import { branchUnits, shuntPower } from './rowPower.ts';

export interface HarmonicShares {
  /** The case where the sources are the largest share of the reference. */
  readonly case: string;
  /** kVA of six-pulse sources (6-pulse drives, rectifiers/UPS) on the bus and below. */
  readonly six_pulse_kva: number;
  /** kVA of single-phase electronic load (electronic lighting) on the bus and below. */
  readonly single_phase_kva: number;
  /** What the shares are of: the feeding transformer's rating, or the load's kVA. */
  readonly reference_kva: number;
  /** "transformer T1 (630 kVA)" or "the load on bus X and below (412 kVA)". */
  readonly reference: string;
  /** (six-pulse + single-phase) / reference. */
  readonly share: number;
}

/** The bus and every bus it feeds, through transformers and lines. */
function busesBelow(bus: string, graph: BusGraph): string[] {
  const out = [bus];
  for (let i = 0; i < out.length; i++) {
    for (const b of graph.branches.get(out[i] as string) ?? []) {
      if (b.to_bus !== undefined && !out.includes(b.to_bus)) out.push(b.to_bus);
    }
  }
  return out;
}

function classOf(row: EquipmentRow): HarmonicClass | undefined {
  const kind = findKind(row.kind);
  if (!kind?.supplies) return undefined;
  const r = readSupply(row.supply, kind.supplies);
  return r.ok ? r.arrangement.harmonics : undefined;
}

/** A motor fed by a drive (its Supply names an arrangement with its own displacement factor). */
export function isDriveFed(row: EquipmentRow): boolean {
  const kind = findKind(row.kind);
  if (!kind?.supplies) return false;
  const r = readSupply(row.supply, kind.supplies);
  return r.ok && r.arrangement.displacement !== undefined;
}

/** The feeding transformer's rating (all units), or undefined when a line or nothing feeds the bus. */
function transformerRating(bus: string, graph: BusGraph): { kva: number; text: string } | undefined {
  const t = graph.feeder.get(bus);
  if (!t || t.kind !== 'transformer' || !(t.values.s_kva && t.values.s_kva > 0)) return undefined;
  const kva = t.values.s_kva * branchUnits(t);
  return { kva, text: `transformer ${t.tag} (${Math.round(kva)} kVA)` };
}

/** The harmonic-source shares of a bus in its worst case; undefined when nothing draws power there. */
export function harmonicShares(bus: string, site: Site, graph: BusGraph): HarmonicShares | undefined {
  const rows = busesBelow(bus, graph).flatMap((b) => graph.items.get(b) ?? []);
  const rating = transformerRating(bus, graph);
  let worst: HarmonicShares | undefined;
  for (const c of site.settings.cases) {
    let six = 0;
    let single = 0;
    let load = 0;
    for (const row of rows) {
      const cls = classOf(row);
      const kind = findKind(row.kind);
      if (cls === undefined || !kind) continue;
      const r = shuntPower(row, kind, c, site.settings.hz);
      if (!r.ok) continue;
      const s = Math.hypot(r.p, r.q);
      load += s;
      if (cls === 'six-pulse') six += s;
      else if (cls === 'single-phase') single += s;
    }
    const ref = rating ?? { kva: load, text: `the load on bus ${bus} and below (${Math.round(load)} kVA)` };
    if (!(ref.kva > 0)) continue;
    const share = (six + single) / ref.kva;
    if (worst === undefined || share > worst.share) {
      worst = {
        case: c,
        six_pulse_kva: six,
        single_phase_kva: single,
        reference_kva: ref.kva,
        reference: ref.text,
        share,
      };
    }
  }
  return worst;
}
