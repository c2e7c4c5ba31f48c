// Branches loaded above their rating in some case. The loading is the apparent power through the
// branch over its rating (the Loading column of its sheet), taken after compensation, which is
// what the plant carries; the loading before compensation is quoted beside it. A transformer
// above 100 % of its rated power exceeds its nameplate continuous rating (IEC 60076-1 defines
// rated power as the continuous loading; short overloads follow the loading guide IEC 60076-7).
// A line or feeder cable with a rated current is loaded at S/(√3·U·I_rated): above 100 % its
// conductor runs hotter than its rating allows (the rating as installed, from the maker or the
// IEC 60287 calculation, with its grouping and ambient).
import type { CaseCompensation } from './compensate.ts';
import { designWarning, type DesignWarning } from './warnings.ts';

/** Loading above this, in %, is reported (the rating itself). */
export const OVERLOAD_PCT = 100;

export function overloadWarnings(cases: readonly CaseCompensation[]): DesignWarning[] {
  const out: DesignWarning[] = [];
  for (const r of cases) {
    for (const e of r.after.elements) {
      const after = e.loading_pct;
      if (after === undefined || !(after > OVERLOAD_PCT + 1e-9)) continue;
      const before = r.before.elements.find((x) => x.row === e.row)?.loading_pct;
      const was = before === undefined ? '' : ` (${before.toFixed(1)} % before compensation)`;
      out.push(
        designWarning(
          'warning',
          'overload',
          { row: e.row, tag: e.tag, bus: e.bus, case: r.case },
          `${e.kind} ${e.tag} carries ${after.toFixed(1)} % of its rating after compensation${was}: above its rated continuous loading; check the rating, spread the load, or add a unit`,
        ),
      );
    }
  }
  return out;
}
