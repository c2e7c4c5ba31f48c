// Step 4 of the site design (compensation.ts): what the proposal gives, by the one rule for
// after compensation: the point of connection before and after per case, and the findings on
// it (requirement still missed, buses overcompensated by a bank or installed capacitors).
import type { Site } from './model.ts';
import type { BusBalance } from './rollup.ts';
import type { CaseCompensation } from './compensate.ts';
import { findKind } from '../kinds/index.ts';
import { kvarNeeded, meets } from './requirement.ts';
import { TOL_KVAR, type CaseOutcome, type PowerPoint } from './designBasics.ts';
import { designWarning, type DesignWarning } from './warnings.ts';

const point = (b: BusBalance): PowerPoint => ({
  p_kw: b.p_kw,
  q_kvar: b.q_kvar,
  s_kva: b.s_kva,
  cos_phi: b.cos_phi,
  tan_phi: b.tan_phi,
  sense: b.sense,
});

/** The point of connection before and after, per case, and whether the requirement is met. */
export function caseOutcomes(
  result: readonly CaseCompensation[],
  req: Site['settings']['requirement'],
): CaseOutcome[] {
  return result.map((r) => {
    const b = r.before;
    const a = r.after;
    return {
      case: b.case,
      before: point(b.root),
      after: point(a.root),
      need: r.need,
      met_before: meets(b.root.p_kw, b.root.q_kvar, req, TOL_KVAR),
      met_after: r.within_after,
    };
  });
}

/** Findings on the outcome: the requirement still missed, buses overcompensated. */
export function afterChecks(
  outcomes: readonly CaseOutcome[],
  result: readonly CaseCompensation[],
  req: Site['settings']['requirement'],
): DesignWarning[] {
  const out: DesignWarning[] = [];
  outcomes.forEach((o, i) => {
    const r = result[i] as CaseCompensation;
    const bal = r.after;
    if (!o.met_after) {
      const n = kvarNeeded(o.after.p_kw, o.after.q_kvar, req);
      const what =
        n.capacitive_kvar > 0
          ? `${n.capacitive_kvar.toFixed(0)} kvar capacitive still missing`
          : `${n.inductive_kvar.toFixed(0)} kvar inductive still missing`;
      out.push(
        designWarning(
          'warning',
          'requirement-not-met',
          { bus: bal.root.bus, case: o.case },
          `after compensation the point of connection is at cos φ ${o.after.cos_phi?.toFixed(3) ?? '–'} ${o.after.sense} (${what}); review the steps or add compensation`,
        ),
      );
    }
    const leadingTooFar = kvarNeeded(o.after.p_kw, o.after.q_kvar, req).inductive_kvar > TOL_KVAR;
    const installed = new Map<string, string[]>();
    for (const e of r.before.elements) {
      if (!findKind(e.kind)?.traits?.capacitor || !(e.q_delivered_kvar > 0)) continue;
      installed.set(e.bus, [...(installed.get(e.bus) ?? []), e.tag]);
    }
    for (const b of bal.buses) {
      const bank = r.banks.find((x) => x.bus === b.bus && x.output_kvar > 0);
      const tags = installed.get(b.bus) ?? [];
      if ((tags.length === 0 && !bank) || b.own_q_kvar >= 0) continue;
      const what = [
        ...(bank ? [`the bank's ${bank.output_kvar.toFixed(1)} kvar`] : []),
        ...(tags.length > 0 ? [`installed capacitors ${tags.join(', ')}`] : []),
      ].join(' and ');
      out.push(
        designWarning(
          leadingTooFar ? 'warning' : 'info',
          'overcompensation',
          { bus: b.bus, case: o.case },
          `bus ${b.bus} is overcompensated: its own items deliver ${(-b.own_q_kvar).toFixed(1)} kvar with ${what} in service; switch capacitors out at light load`,
        ),
      );
    }
  });
  return out;
}
