// Checks' word on the detuning of a bank typed (or kept) on the Compensation sheet, by the rule
// the design follows (detuningChoice.ts): a plain bank among more harmonic sources than the limit
// allows, or a 7 % bank where single-phase electronic load (3rd harmonic) dominates the sources.
import { DEFAULT_DETUNING_PCT, THIRD_HARMONIC_DETUNING_PCT } from './bankRules.ts';
import { bankTotal, type BankChoice } from './bankChoice.ts';
import { HARMONIC_SHARE_LIMIT, sharesText, thirdDominates } from './detuningChoice.ts';
import type { BusGraph } from './graph.ts';
import { harmonicShares } from './harmonicSources.ts';
import type { Site } from './model.ts';
import { designWarning, type DesignWarning } from './warnings.ts';

const pct = (x: number) => `${(100 * x).toFixed(0)} %`;

export function detuningAdvice(site: Site, graph: BusGraph, choice: BankChoice): DesignWarning[] {
  if (bankTotal(choice) <= 0) return [];
  const shares = harmonicShares(choice.bus, site, graph);
  if (!shares || !(shares.share > HARMONIC_SHARE_LIMIT)) return [];
  const p = choice.p_pct ?? 0;
  const third = thirdDominates(shares);
  const wanted = third ? THIRD_HARMONIC_DETUNING_PCT : DEFAULT_DETUNING_PCT;
  const where = { bus: choice.bus };
  if (p === 0) {
    return [
      designWarning(
        'warning',
        'detuning-choice',
        where,
        `the plain bank on bus ${choice.bus} shares it with harmonic sources: ${sharesText(shares)}, above ${pct(HARMONIC_SHARE_LIMIT)}; detune it (${wanted} % here) or have the harmonics assessed`,
      ),
    ];
  }
  if (third && p < THIRD_HARMONIC_DETUNING_PCT) {
    return [
      designWarning(
        'info',
        'detuning-choice',
        where,
        `the bank on bus ${choice.bus} is detuned at ${p} %, but single-phase electronic load is most of its harmonic sources (${sharesText(shares)}): the 3rd harmonic dominates; ${THIRD_HARMONIC_DETUNING_PCT} % keeps the tuning below it`,
      ),
    ];
  }
  return [];
}
