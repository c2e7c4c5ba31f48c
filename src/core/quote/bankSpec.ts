// The one place the schedule reads a bank's properties from the design's inputs: what the
// Compensation sheet holds per bus (BankChoice) plus the bus voltage and the frequency. A richer
// design (rated-voltage series, switching classes, detuning choices) plugs in here alone.
import type { BankChoice } from '../site/bankChoice.ts';
import { runCall } from '../site/calls.ts';
import { isLowVoltage } from '../site/bankRules.ts';
import { sectionsOf } from '../site/stepRules.ts';
import { DEFAULT_STEP_SERIES, STAGE_RATIOS, controllerCount, stagesOfRatio } from '../site/stepSeries.ts';

/** The physical stages of one size: each is bought, switched and detuned as a unit. */
export interface StageGroup {
  /** Size in smallest steps (one of STAGE_RATIOS). */
  readonly ratio: number;
  /** Output of one stage at the operating voltage, kvar. */
  readonly kvar: number;
  /** Physical stages of this size (0 when the series has none). */
  readonly stages: number;
  /** Nameplate kvar at u_rated_kv of one stage (null when unknown). */
  readonly nameplate_kvar: number | null;
}

export interface BankSpec {
  readonly bus: string;
  /** Operating voltage of the bus, kV. */
  readonly u_kv: number;
  readonly low_voltage: boolean;
  /** Outputs at the operating voltage, kvar. */
  readonly fixed_kvar: number;
  readonly step_kvar: number;
  /** Physical stages, and the smallest steps they switch (the controller step count of their series). */
  readonly steps: number;
  readonly controller_steps: number;
  /** The stages by size, one group per STAGE_RATIOS entry in order (stages 0 where the series has none). */
  readonly stage_groups: readonly StageGroup[];
  /** Detuning factor, % (0 = plain), and the order and frequency it tunes to (null when plain). */
  readonly p_pct: number;
  readonly tuning_order: number | null;
  readonly tuned_hz: number | null;
  /**
   * Capacitor rated voltage, kV: as typed on the sheet, else the design's by its one rule
   * (CAPBANK.URATED of the voltage across the capacitors, capacitorRatings.ts); null when neither
   * can be had (a detuning the catalogue refuses).
   */
  readonly u_rated_kv: number | null;
  /** Where u_rated_kv came from. */
  readonly u_rated_from: 'typed' | 'design';
  /** Units in series per phase for that rating (CAPBANK.USERIES); null when the rating is unknown. */
  readonly units_in_series: number | null;
  /** Nameplate kvar at u_rated_kv giving the fixed part's output (null when unknown). */
  readonly fixed_nameplate_kvar: number | null;
  /** Shunt reactor, kvar at the operating voltage (0 when none). */
  readonly reactor_kvar: number;
  /** Steps of each section (a controller each), as the design splits them (stepRules.ts); [] without steps. */
  readonly sections: readonly number[];
}

const positive = (x: number | undefined): number => (x !== undefined && x > 0 ? x : 0);

/**
 * Nameplate kvar at uRated for an output of 1 kvar at u: 1 / |KVAR.CAPBANK(1, uRated, u, p, f, f)|,
 * the Compensation sheet's step nameplate formula; null for arguments the catalogue refuses.
 */
function nameplatePerOutput(uRated: number, u: number, p: number, hz: number): number | null {
  const r = runCall({ fn: 'KVAR.CAPBANK', args: [1, uRated, u, p, hz, hz], columns: [] });
  return r.ok && r.value !== 0 ? 1 / Math.abs(r.value) : null;
}

/** The design's rating for capacitors of a p % detuned bank at u: CAPBANK.URATED(CAPBANK.UCAP(u, p), f). */
function designRating(u: number, p: number, hz: number): number | null {
  const across = runCall({ fn: 'CAPBANK.UCAP', args: [u, p], columns: [] });
  if (!across.ok) return null;
  const r = runCall({ fn: 'CAPBANK.URATED', args: [across.value, hz], columns: [] });
  return r.ok ? r.value : null;
}

function unitsInSeries(uRated: number, hz: number): number | null {
  const r = runCall({ fn: 'CAPBANK.USERIES', args: [uRated, hz], columns: [] });
  return r.ok ? r.value : null;
}

function tuningOrder(p: number): number | null {
  if (!(p > 0)) return null;
  const r = runCall({ fn: 'CAPBANK.TUNE', args: [p], columns: [] });
  return r.ok ? r.value : null;
}

/** The bank on one bus as the schedule needs it. */
export function bankSpec(choice: BankChoice, uKv: number, hz: number): BankSpec {
  const p = positive(choice.p_pct);
  const fixed = positive(choice.fixed_kvar);
  const step = positive(choice.step_kvar);
  const steps = step > 0 ? Math.max(0, Math.floor(choice.steps ?? 0)) : 0;
  const typed = choice.u_rated_kv !== undefined && choice.u_rated_kv > 0 ? choice.u_rated_kv : null;
  const uRated = typed ?? designRating(uKv, p, hz);
  const per = uRated === null ? null : nameplatePerOutput(uRated, uKv, p, hz);
  const order = tuningOrder(p);
  const series = choice.series ?? DEFAULT_STEP_SERIES;
  const stageGroups = STAGE_RATIOS.map((ratio) => ({
    ratio,
    kvar: step * ratio,
    stages: steps > 0 ? stagesOfRatio(series, steps, ratio) : 0,
    nameplate_kvar: per === null ? null : step * ratio * per,
  }));
  return {
    bus: choice.bus,
    u_kv: uKv,
    low_voltage: isLowVoltage(uKv),
    fixed_kvar: fixed,
    step_kvar: steps > 0 ? step : 0,
    steps,
    controller_steps: controllerCount(series, steps),
    stage_groups: stageGroups,
    p_pct: p,
    tuning_order: order,
    tuned_hz: order === null ? null : order * hz,
    u_rated_kv: uRated,
    u_rated_from: typed === null ? 'design' : 'typed',
    units_in_series: uRated === null ? null : unitsInSeries(uRated, hz),
    fixed_nameplate_kvar: per === null || fixed === 0 ? null : fixed * per,
    reactor_kvar: positive(choice.reactor_kvar),
    sections: steps > 0 ? sectionsOf(steps) : [],
  };
}
