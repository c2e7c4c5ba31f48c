// Sizing one capacitor bank on one bus from its share of the need in every case: fixed part,
// step size and number of steps, detuning, capacitor voltage and rating, resonance at every
// switching state, voltage rise. The rules and series live in bankRules.ts.
import type { EquipmentRow, Site } from './model.ts';
import { runCall } from './calls.ts';
import { unitsRunning } from './cases.ts';
import type { BusGraph } from './graph.ts';
import type { BusShortCircuit } from './shortCircuit.ts';
import {
  FIXED_SERIES_KVAR,
  STEP_SERIES_KVAR,
  STEP_VRISE_LIMIT_PCT,
  chooseCapacitorRating,
  capacitorVoltage,
  MAX_STEPS,
  chooseStep,
  type StepPlan,
  nearHarmonic,
  outputPerNameplateKvar,
  resonanceOrderOf,
  roundDownToSeries,
  voltageRise,
} from './bankRules.ts';
import { installedCapacitorKvar, soleMotorOf } from './installedChecks.ts';
import { assumedI0Text, motorCapacitorLimit, type SelfExcitationLimit } from './selfExcitation.ts';
import { designWarning, type DesignWarning } from './warnings.ts';
import type { CapacitorRating } from './capacitorRatings.ts';
import { entryOf, nameTable } from '../text/nameTable.ts';
import { grouped } from './limits.ts';
import { DEFAULT_STEP_SERIES, largestRatio, type StepSeries } from './stepSeries.ts';
import { chooseDetuning } from './detuningChoice.ts';
import { harmonicShares, isDriveFed } from './harmonicSources.ts';
import { isCapacitorKind } from '../kinds/index.ts';

export interface ResonancePoint {
  /** Capacitor kvar connected on the bus in this switching state (installed plain + this bank). */
  readonly kvar: number;
  /** Cable and line charging of the zone counted with it (plain banks only), kvar. */
  readonly charging_kvar: number;
  readonly order: number;
  /** The characteristic harmonic it is too close to, or null. */
  readonly near: number | null;
}

export interface BankDesign {
  readonly bus: string;
  readonly u_kv: number;
  /** Outputs at the operating voltage, kvar (positive numbers: what the bank delivers). */
  readonly fixed_kvar: number;
  /** The smallest stage, kvar; physical stages; their series; positions the controller switches. */
  readonly step_kvar: number;
  readonly steps: number;
  readonly series: StepSeries;
  readonly controller_steps: number;
  /** Stages per section (a panel with its own controller), and what switches them: for a schedule. */
  readonly sections: readonly number[];
  readonly switching: StepPlan['switching'] | 'fixed, switched with its feeder' | 'switched with the motor';
  readonly total_kvar: number;
  /** Detuning factor, % (0 = none) and the tuning order it gives. */
  readonly p_pct: number;
  readonly tuning_order: number | null;
  /** Voltage across the capacitors (CAPBANK.UCAP) and the rated voltage chosen for them. */
  readonly u_cap_kv: number;
  readonly u_rated_kv: number;
  /** The units it is built from: unit rated voltage, units in series, arrangement, series cited. */
  readonly capacitor_units: CapacitorRating;
  /** Nameplate kvar at u_rated_kv that gives the outputs above. */
  readonly step_rated_kvar: number;
  readonly fixed_rated_kvar: number;
  readonly ssc_mva: number | null;
  readonly resonance: readonly ResonancePoint[];
  readonly vrise_step_pct: number | null;
  readonly vrise_total_pct: number | null;
  /** Smallest steps switched in, per case (the controller's choice: whole steps covering the bus's share). */
  readonly steps_in: Readonly<Record<string, number>>;
  /** For individual motor compensation: KVAR.MOTORCAP.MAX of the motor. */
  readonly self_excitation_limit_kvar?: number;
  /** The no-load current that limit rests on, and whether it was assumed (i0_pct blank). */
  readonly self_excitation?: SelfExcitationLimit;
  readonly why: string;
}

export interface BankContext {
  readonly site: Site;
  readonly graph: BusGraph;
  readonly sc: BusShortCircuit | undefined;
  readonly uKv: number;
  /** Cable and line charging in the bus's zone, the most of any case (chargingResonance.ts). */
  readonly chargingKvar?: number;
  readonly detuning?: number;
  readonly thirdHarmonic?: boolean;
}

const MERGED_SERIES = [...new Set([...FIXED_SERIES_KVAR, ...STEP_SERIES_KVAR])].sort((a, b) => a - b);

/** Magnetising kvar of the transformer(s) feeding the bus (the usual fixed part), or 0. */
function feederNoLoadKvar(bus: string, graph: BusGraph): number {
  const t = graph.feeder.get(bus);
  if (!t || t.kind !== 'transformer') return 0;
  const r = runCall({
    fn: 'KVAR.XFMR.MAG',
    args: [t.values.s_kva, t.values.i0_pct, t.values.p0_kw],
    columns: [],
  });
  return r.ok ? r.value * Math.max(unitsRunning(t), 1) : 0;
}

function stepsFor(share: number, fixed: number, step: number, steps: number): number {
  if (steps === 0 || step <= 0) return 0;
  const r = runCall({ fn: 'BANK.ROUNDUP', args: [share - fixed, step], columns: [] });
  return r.ok ? Math.min(steps, Math.round(r.value / step)) : steps;
}

/** Size the bank for a bus given its share of the need per case (kvar at the operating voltage). */
export function sizeBank(
  bus: string,
  share: Readonly<Record<string, number>>,
  ctx: BankContext,
): { bank: BankDesign; warnings: DesignWarning[] } {
  const warnings: DesignWarning[] = [];
  const { site, graph, sc, uKv } = ctx;
  const charging = ctx.chargingKvar ?? 0;
  const hz = site.settings.hz;
  const shares = Object.values(share);
  const most = Math.max(0, ...shares);
  const least = Math.max(0, Math.min(...shares));
  const installed = (graph.items.get(bus) ?? []).filter((r) => isCapacitorKind(r.kind));
  const plainInstalled = installed
    .filter((r) => !(r.values.p_pct && r.values.p_pct > 0))
    .reduce((s, r) => s + installedCapacitorKvar(r, hz), 0);
  const installedP = installed.map((r) => r.values.p_pct ?? 0).find((p) => p > 0);

  let fixed: number;
  let step = 0;
  let steps = 0;
  let series: StepSeries = DEFAULT_STEP_SERIES;
  let positions = 0;
  let sections: readonly number[] = [];
  let switching: BankDesign['switching'] = 'fixed, switched with its feeder';
  let why: string;
  // A drive-fed motor is not compensated at its terminals (the drive stands between): no
  // individual capacitor and no self-excitation limit; the bank is an ordinary one.
  const motor = soleMotorOf(bus, graph);
  const limit = motor && !isDriveFed(motor) ? motorCapacitorLimit(motor, uKv) : undefined;
  if (motor && limit !== undefined) {
    const perBus = limit.kvar * Math.max(unitsRunning(motor), 1);
    fixed = roundDownToSeries(Math.min(most, perBus), MERGED_SERIES);
    switching = 'switched with the motor';
    why = `individual compensation of motor ${motor.tag}: one fixed capacitor switched with it, at most KVAR.MOTORCAP.MAX per motor`;
    const where = {
      bus,
      tag: motor.tag,
      ...(limit.i0_assumed ? { row: motor.row, column: 'i0_pct' } : {}),
    };
    const assumed = assumedI0Text(motor, limit);
    if (fixed < most - 1e-6) {
      warnings.push(
        designWarning(
          'info',
          'self-excitation',
          where,
          `the bank on bus ${bus} is limited to ${fixed} kvar by the self-excitation limit of motor ${motor.tag} (${limit.kvar.toFixed(1)} kvar per motor${assumed}); the rest is left to banks elsewhere`,
        ),
      );
    } else if (limit.i0_assumed) {
      warnings.push(
        designWarning(
          'info',
          'self-excitation',
          where,
          `the ${fixed} kvar capacitor proposed for motor ${motor.tag} on bus ${bus} stays within its self-excitation limit of ${limit.kvar.toFixed(1)} kvar per motor${assumed}`,
        ),
      );
    }
  } else {
    fixed = roundDownToSeries(Math.min(feederNoLoadKvar(bus, graph), least), FIXED_SERIES_KVAR);
    const variable = most - fixed;
    if (variable > 1e-6) {
      const chosen = chooseStep(variable, uKv);
      ({ step, steps, series, sections, switching } = chosen);
      positions = chosen.controller_steps;
      if (chosen.capped)
        warnings.push(
          designWarning(
            'warning',
            'bank-capped',
            { bus },
            `bus ${bus} would need ${grouped(Math.round(variable))} kvar of switched capacitors, more than the largest bank proposed (${positions} × ${step} kvar = ${grouped(positions * step)} kvar in ${sections.length} section${sections.length === 1 ? '' : 's'}); the bank is capped there. Check the input: an overloaded transformer, a quantity or a power typed too large`,
          ),
        );
    }
    why =
      fixed > 0
        ? "fixed part for the feeding transformer's no-load kvar, automatic steps for the rest"
        : 'automatic steps';
    if (series !== DEFAULT_STEP_SERIES)
      why += `: ${steps} stages in the series ${series} give ${positions} controller steps of ${step} kvar, with fewer stages and contactors than equal ones`;
    if (sections.length > 1)
      why += ` in ${sections.length} sections of ${sections.join(' + ')} steps (one controller of at most ${MAX_STEPS} outputs each)`;
  }
  const total = fixed + step * positions;
  const states = [fixed, ...Array.from({ length: positions }, (_, k) => fixed + (k + 1) * step)].filter(
    (q) => q > 0,
  );

  const sweep = (p: number): ResonancePoint[] =>
    sc === undefined
      ? []
      : states.map((q) => {
          const kvar = q + plainInstalled;
          // The capacitors alone: a detuned bank's output q holds q·(1 − p) of capacitor kvar.
          // Charging counts with a plain bank only: beside a detuned one it resonates with the
          // supply on its own (chargingResonance.ts), as Checks judges it (assessBanks.ts).
          const withCharging = p > 0 ? 0 : charging;
          const order = resonanceOrderOf(
            sc.ssc_mva,
            q * (1 - p / 100) + plainInstalled + withCharging,
            p,
          ) as number;
          return { kvar, charging_kvar: withCharging, order, near: nearHarmonic(order) ?? null };
        });
  const choice = chooseDetuning({
    bus,
    shares: harmonicShares(bus, site, graph),
    plainSweep: sweep(0),
    assessed: sc !== undefined,
    ...(ctx.detuning !== undefined ? { explicit: ctx.detuning } : {}),
    ...(installedP !== undefined ? { installed: installedP } : {}),
    ...(ctx.thirdHarmonic ? { thirdHarmonic: true } : {}),
  });
  const p = choice.p;
  why += choice.why;
  if (choice.finding) warnings.push(choice.finding);
  if (sc === undefined) {
    warnings.push(
      designWarning(
        'info',
        'resonance-not-assessed',
        { bus },
        `resonance and voltage rise of the proposed bank on bus ${bus} not assessed: the short-circuit power there is unknown (give sscMva in the settings)`,
      ),
    );
  }
  const resonance = sweep(p);
  for (const r of resonance.filter((x) => x.near !== null)) {
    // Near an order nothing on the bus produces (no 6-pulse source, only background 5th/7th): info.
    const produced = choice.relevant.includes(r.near as number);
    warnings.push(
      designWarning(
        produced ? 'warning' : 'info',
        'resonance',
        { bus },
        `with ${r.kvar.toFixed(1)} kvar connected${r.charging_kvar > 0 ? ` and ${r.charging_kvar.toFixed(1)} kvar of cable and line charging` : ''} the bank on bus ${bus} resonates at order ${r.order.toFixed(2)}, near the ${r.near}th harmonic${produced ? '' : `, which no item on bus ${bus} or below produces (no 6-pulse drive or rectifier)`}; choose another detuning or step size`,
      ),
    );
  }
  if (p > 0 && plainInstalled > 0) {
    warnings.push(
      designWarning(
        'warning',
        'detuned-and-plain-mixed',
        { bus },
        `the proposed detuned bank on bus ${bus} would share it with ${plainInstalled.toFixed(1)} kvar of plain capacitors; detune those too`,
      ),
    );
  }

  const uCap = capacitorVoltage(uKv, p);
  const rating = chooseCapacitorRating(uCap, hz);
  const uRated = rating.bank_rated_kv;
  const perNameplate = outputPerNameplateKvar(uRated, uKv, p, hz);
  // One switching operation adds at most the largest stage.
  const stage = step > 0 ? step * largestRatio(series, steps) : fixed;
  const vStep = sc === undefined || total === 0 ? null : voltageRise(stage, sc.ssc_mva);
  // The whole bank in, with the plain capacitors and the cable and line charging already there.
  const vTotal =
    sc === undefined || total === 0 ? null : voltageRise(total + plainInstalled + charging, sc.ssc_mva);
  if (vStep !== null && vStep > STEP_VRISE_LIMIT_PCT) {
    warnings.push(
      designWarning(
        'warning',
        'voltage-rise',
        { bus },
        `switching one ${stage} kvar stage on bus ${bus} raises the voltage by ${vStep.toFixed(2)} % (VRISE.PCT), above ${STEP_VRISE_LIMIT_PCT} %; use smaller steps`,
      ),
    );
  }
  const stepsIn = nameTable<number>();
  for (const c of site.settings.cases) stepsIn[c] = stepsFor(entryOf(share, c) ?? 0, fixed, step, positions);
  const bank: BankDesign = {
    bus,
    u_kv: uKv,
    fixed_kvar: fixed,
    step_kvar: step,
    steps,
    series,
    controller_steps: positions,
    total_kvar: total,
    p_pct: p,
    tuning_order: p > 0 ? 1 / Math.sqrt(p / 100) : null,
    u_cap_kv: uCap,
    u_rated_kv: uRated,
    capacitor_units: rating,
    step_rated_kvar: step / perNameplate,
    fixed_rated_kvar: fixed / perNameplate,
    ssc_mva: sc?.ssc_mva ?? null,
    resonance,
    vrise_step_pct: vStep,
    vrise_total_pct: vTotal,
    steps_in: stepsIn,
    sections,
    switching,
    ...(limit !== undefined ? { self_excitation_limit_kvar: limit.kvar, self_excitation: limit } : {}),
    why,
  };
  return { bank, warnings };
}

/** The equipment rows that install a bank: a fixed row (always in) and a stepped row (share in service per case). */
export function bankRows(
  bank: BankDesign,
  tagBase: string,
  firstRow: number,
  cases: readonly string[],
): EquipmentRow[] {
  const rows: EquipmentRow[] = [];
  const common = {
    u_rated_kv: bank.u_rated_kv,
    u_kv: bank.u_kv,
    ...(bank.p_pct > 0 ? { p_pct: bank.p_pct } : {}),
  };
  if (bank.fixed_kvar > 0) {
    rows.push({
      row: firstRow,
      tag: `${tagBase}-F`,
      description: 'proposed fixed capacitor',
      bus: bank.bus,
      kind: 'capacitor',
      values: { q_kvar: bank.fixed_rated_kvar, ...common },
      loads: nameTable<number>(),
    });
  }
  if (bank.steps > 0) {
    // One unit per smallest step the controller switches: the stages of a 1:2:2 or 1:2:4 bank
    // are whole multiples of the smallest, so its output is the same.
    const n = bank.controller_steps;
    const loads = nameTable<number>();
    for (const c of cases) loads[c] = (entryOf(bank.steps_in, c) ?? 0) / n;
    const stages = bank.series === DEFAULT_STEP_SERIES ? '' : ` (${bank.steps} stages ${bank.series})`;
    rows.push({
      row: firstRow + rows.length,
      tag: `${tagBase}-S`,
      description: `proposed ${n} × ${bank.step_kvar} kvar steps${stages}`,
      bus: bank.bus,
      kind: 'capacitor',
      values: { qty: n, running: n, q_kvar: bank.step_rated_kvar, ...common },
      loads,
    });
  }
  return rows;
}
