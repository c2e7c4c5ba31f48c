// The utility's requirement at the point of connection, as a band of tan φ: how far the site may
// draw kvar (lagging) and deliver kvar (leading) per kW. A cos φ target is read as the same limit
// both ways (cos φ ≥ target, lagging or leading), since many grid codes penalise both, unless it
// is lagging only (a tariff that bills drawn kvar alone: no leading limit, so never a reactor);
// a tan φ requirement gives the two limits separately. At the point of connection the band may be
// referred to a rated power instead of the case's own P (grid codes for generating sites state
// the kvar a plant must stay within as a share of its rated power, so it holds at night too).
import type { Requirement } from './model.ts';
import { runCall } from './calls.ts';
import { tanFromCos } from '../elements/powerTriangle.ts';
import { formatNumber } from '../registry/messages.ts';
import { MAGNITUDE } from '../registry/spec.ts';

export interface Band {
  /** Largest Q/|P| drawn (lagging). */
  readonly lagTan: number;
  /** Largest −Q/|P| delivered (leading). */
  readonly leadTan: number;
  readonly text: string;
}

export function requirementBand(r: Requirement): Band {
  const band = limitsOf(r);
  return r.refKw === undefined
    ? band
    : { ...band, text: `${band.text}, referred to ${formatNumber(r.refKw)} kW rated power` };
}

function limitsOf(r: Requirement): Band {
  if (r.kind === 'cosphi') {
    const t = tanFromCos(r.target);
    if (r.lagOnly)
      return {
        lagTan: t,
        leadTan: Number.POSITIVE_INFINITY,
        text: `cos φ ≥ ${formatNumber(r.target)} lagging (tan φ ≤ ${t.toFixed(4)}); leading not limited`,
      };
    return {
      lagTan: t,
      leadTan: t,
      text: `cos φ ≥ ${formatNumber(r.target)} lagging or leading (|tan φ| ≤ ${t.toFixed(4)})`,
    };
  }
  return {
    lagTan: r.lagMax,
    leadTan: r.leadMax,
    text: `tan φ between ${formatNumber(-r.leadMax)} (leading) and ${formatNumber(r.lagMax)} (lagging)`,
  };
}

const snap = (x: number): number => (Math.abs(x) < MAGNITUDE.min ? 0 : x);

export interface Need {
  /** Capacitive kvar to add to come down to the lagging limit (0 when within). */
  readonly capacitive_kvar: number;
  /** Inductive kvar to add to come up to the leading limit (0 when within). */
  readonly inductive_kvar: number;
}

/**
 * kvar needed at a bus with totals P, Q to meet the band. Through the catalogue: KVAR.TOPF for a
 * cos φ target, KVAR.TOTAN for a tan φ band. Exported power (P < 0) is judged by |P|.
 */
export function kvarNeeded(pKw: number, qKvar: number, r: Requirement): Need {
  const band = requirementBand(r);
  // Totals below the catalogue's smallest size are rounding residue: 0 (the functions refuse them).
  const p = snap(Math.abs(pKw));
  qKvar = snap(qKvar);
  const lag =
    r.kind === 'cosphi'
      ? runCall({ fn: 'KVAR.TOPF', args: [p, qKvar, r.target], columns: [] })
      : runCall({ fn: 'KVAR.TOTAN', args: [p, qKvar, band.lagTan], columns: [] });
  if (!lag.ok) throw new Error(lag.message);
  if (!Number.isFinite(band.leadTan)) return { capacitive_kvar: Math.max(0, lag.value), inductive_kvar: 0 };
  const lead = runCall({ fn: 'KVAR.TOTAN', args: [p, qKvar, -band.leadTan], columns: [] });
  if (!lead.ok) throw new Error(lead.message);
  return { capacitive_kvar: Math.max(0, lag.value), inductive_kvar: Math.max(0, -lead.value) };
}

/**
 * The active power the band is applied to at the point of connection: the rated power when the
 * requirement is referred to it (a generating site), else the case's own |P|.
 */
export function referencePowerKw(pKw: number, r: Requirement): number {
  return r.refKw ?? Math.abs(pKw);
}

/** kvar needed at the point of connection, P referred as the requirement says (referencePowerKw). */
export function connectionNeed(pKw: number, qKvar: number, r: Requirement): Need {
  return kvarNeeded(referencePowerKw(pKw, r), qKvar, r);
}

/** The point of connection within the band, with a small tolerance for rounding (kvar). */
export function meets(pKw: number, qKvar: number, r: Requirement, tolKvar = 1e-6): boolean {
  const n = connectionNeed(pKw, qKvar, r);
  return n.capacitive_kvar <= tolKvar && n.inductive_kvar <= tolKvar;
}
