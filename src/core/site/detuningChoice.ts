// Plain capacitors, 7 % or 14 % detuning for a proposed bank: from the harmonic sources on its bus
// (harmonicSources.ts) and the resonance of a plain bank over every switching state, near the
// harmonics those sources actually produce. A per-bus detuning given by the user, or an installed
// detuned bank on the bus, wins. Every threshold is a named constant with its kind of source.
import { DEFAULT_DETUNING_PCT, RESONANCE_MARGIN, THIRD_HARMONIC_DETUNING_PCT } from './bankRules.ts';
import type { HarmonicShares } from './harmonicSources.ts';
import { designWarning, type DesignWarning } from './warnings.ts';

/**
 * Above this share of harmonic-source kVA against the feeding transformer's rating a bank is
 * detuned whatever its resonance (common practice, from memory: makers' selection guides keep
 * standard capacitors below about 10–20 % of non-linear load and detune above; we take 15 %, the
 * middle, where the usual rule of thumb stops offering standard capacitors).
 */
export const HARMONIC_SHARE_LIMIT = 0.15;
/**
 * 14 % instead of 7 % when single-phase electronic load is at least this share of the harmonic
 * sources: its 3rd harmonic then dominates, and a 7 % bank (tuned to order 3.78) would amplify it
 * (common practice: 14 %, tuned to 2.67, below the 3rd).
 */
export const THIRD_HARMONIC_SOURCE_SHARE = 0.5;
/** Orders every network carries from background distortion, sources on site or not (common practice). */
export const BACKGROUND_HARMONICS: readonly number[] = [5, 7];
/** Orders six-pulse converters produce, h = 6k ± 1 (published: IEEE Std 519, IEC 61000-2-4). */
export const SIX_PULSE_HARMONICS: readonly number[] = [5, 7, 11, 13];
/** Order single-phase electronic load produces above all (published: IEEE Std 519 discusses triplens). */
export const SINGLE_PHASE_HARMONIC = 3;

export interface DetuningInput {
  readonly bus: string;
  readonly shares: HarmonicShares | undefined;
  /** A plain bank's resonance over its switching states; empty when not assessed. */
  readonly plainSweep: ReadonlyArray<{ readonly kvar: number; readonly order: number }>;
  readonly assessed: boolean;
  /** The user's detuning for this bus (the Compensation sheet or --detune). */
  readonly explicit?: number;
  /** An installed detuned bank's p on the bus. */
  readonly installed?: number;
  /** The --third-harmonic option: 14 % wherever a bank is detuned. */
  readonly thirdHarmonic?: boolean;
}

export interface DetuningChoice {
  readonly p: number;
  /** What chose it, for the design's why (starts with "; "). */
  readonly why: string;
  /** The harmonics that matter on this bus (resonance near others is reported as info only). */
  readonly relevant: readonly number[];
  readonly finding?: DesignWarning;
}

const pct = (x: number) => `${(100 * x).toFixed(0)} %`;
/** 3rd, 5th, 7th … */
export const ordinal = (h: number) => `${h}${h % 10 === 3 && h % 100 !== 13 ? 'rd' : 'th'}`;
const orders = (hs: readonly number[]) =>
  hs.length <= 1
    ? hs.map(ordinal).join('')
    : `${hs.slice(0, -1).map(ordinal).join(', ')} or ${ordinal(hs[hs.length - 1] as number)}`;

/** The orders the bus's sources produce, plus the background 5th and 7th. */
export function relevantHarmonics(shares: HarmonicShares | undefined): number[] {
  const out = new Set(BACKGROUND_HARMONICS);
  if (shares && shares.six_pulse_kva > 0) for (const h of SIX_PULSE_HARMONICS) out.add(h);
  if (shares && shares.single_phase_kva > 0) out.add(SINGLE_PHASE_HARMONIC);
  return [...out].sort((a, b) => a - b);
}

function nearOf(order: number, among: readonly number[]): number | undefined {
  return among.find((h) => Math.abs(order - h) <= RESONANCE_MARGIN * h);
}

/** "harmonic sources (…) are 39 % of transformer T1 (630 kVA) in case normal", or none. */
export function sharesText(s: HarmonicShares | undefined): string {
  if (!s || s.six_pulse_kva + s.single_phase_kva === 0) return 'no harmonic sources on the bus or below';
  const parts = [
    ...(s.six_pulse_kva > 0 ? [`6-pulse drives and rectifiers ${Math.round(s.six_pulse_kva)} kVA`] : []),
    ...(s.single_phase_kva > 0 ? [`single-phase electronic load ${Math.round(s.single_phase_kva)} kVA`] : []),
  ];
  const what = parts.length > 0 ? `harmonic sources (${parts.join(', ')})` : 'harmonic sources';
  return `${what} are ${pct(s.share)} of ${s.reference} in case ${s.case}`;
}

/** Single-phase electronic load is at least THIRD_HARMONIC_SOURCE_SHARE of the sources. */
export function thirdDominates(s: HarmonicShares | undefined): boolean {
  if (!s) return false;
  const total = s.six_pulse_kva + s.single_phase_kva;
  return total > 0 && s.single_phase_kva / total >= THIRD_HARMONIC_SOURCE_SHARE;
}

export function chooseDetuning(input: DetuningInput): DetuningChoice {
  const { bus, shares } = input;
  const relevant = relevantHarmonics(shares);
  if (input.explicit !== undefined)
    return { p: input.explicit, why: `; detuning ${input.explicit} % as chosen for this bus`, relevant };
  if (input.installed !== undefined)
    return { p: input.installed, why: `; detuned at ${input.installed} % like the installed bank`, relevant };
  const detuned =
    input.thirdHarmonic || thirdDominates(shares) ? THIRD_HARMONIC_DETUNING_PCT : DEFAULT_DETUNING_PCT;
  const third =
    detuned === THIRD_HARMONIC_DETUNING_PCT
      ? input.thirdHarmonic
        ? ' (the 3rd harmonic is significant, as the option says)'
        : ` (single-phase electronic load is at least ${pct(THIRD_HARMONIC_SOURCE_SHARE)} of the sources: the 3rd dominates)`
      : '';
  let p = 0;
  let why: string;
  const resonant = input.plainSweep
    .map((r) => ({ ...r, near: nearOf(r.order, relevant) }))
    .find((r) => r.near !== undefined);
  if (shares && shares.share > HARMONIC_SHARE_LIMIT) {
    p = detuned;
    why = `; detuned at ${p} %${third}: ${sharesText(shares)}, above ${pct(HARMONIC_SHARE_LIMIT)}`;
  } else if (resonant) {
    p = detuned;
    why = `; detuned at ${p} %${third}: ${sharesText(shares)} (at most ${pct(HARMONIC_SHARE_LIMIT)}), but a plain bank with ${resonant.kvar.toFixed(1)} kvar connected would resonate at order ${resonant.order.toFixed(2)}, near the ${ordinal(resonant.near as number)}, which the bus carries`;
  } else {
    const checked = input.assessed
      ? `no switching state of a plain bank resonates within ${pct(RESONANCE_MARGIN)} of the ${orders(relevant)}`
      : 'resonance not assessed (short-circuit power unknown)';
    const none = !shares || shares.six_pulse_kva + shares.single_phase_kva === 0;
    const limit = none ? '' : ` (at most ${pct(HARMONIC_SHARE_LIMIT)})`;
    why = `; plain capacitors: ${sharesText(shares)}${limit} and ${checked}`;
  }
  const finding = designWarning(
    'info',
    'detuning-choice',
    { bus },
    `bank on bus ${bus}${why.replace(/^;/, ':')}`,
  );
  return { p, why, relevant, finding };
}
