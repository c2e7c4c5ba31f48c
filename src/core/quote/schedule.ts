// The countable items of a bus's compensation: capacitor units, detuning reactors, switching
// devices per step by current class, the controller, sections or frames, the incomer, discharge
// devices (MV) and shunt reactors with their switching device. Pure: a BankSpec in, items out.
// How a bank's properties are read is bankSpec.ts's; the sizing constants are itemRules.ts's.
import type { BankSpec, StageGroup } from './bankSpec.ts';
import {
  CAPACITOR_CURRENT_FACTOR,
  CONTROLLER_OUTPUTS,
  MAX_LV_FUSE_SWITCH_A,
  MAX_MV_CONTACTOR_A,
  MAX_MV_CONTACTOR_KV,
  MAX_UNIT_KVAR_LV,
  MAX_UNIT_KVAR_MV,
  MIN_MV_BREAKER_A,
  MV_CONTACTOR_CLASSES_A,
  MV_DISCHARGE_DEVICES_PER_STEP,
  MV_UNITS_MULTIPLE,
  REACTOR_CURRENT_FACTOR,
  SECTION_KVAR_LV_DETUNED,
  SECTION_KVAR_LV_PLAIN,
  currentClass,
  lineCurrentA,
} from './itemRules.ts';

/** What a rate is per: a piece, or a kvar (nameplate for capacitors, rating for reactors). */
export type PricedUnit = 'pc' | 'kvar';

export interface ScheduleItem {
  readonly bus: string;
  /** The rate table's key for this item (e.g. "LV contactor 125 A"). */
  readonly code: string;
  /** What it is, with its sizes, for the reader. */
  readonly what: string;
  /** Pieces; null when an input it depends on is blank. */
  readonly count: number | null;
  readonly unit: PricedUnit;
  /** Quantity in `unit` (pieces, or kvar in total); null when unknown. */
  readonly quantity: number | null;
  /** Why the quantity is unknown, naming the input to fill in. */
  readonly missing?: string;
}

const r1 = (x: number) => Math.round(x * 100) / 100;
const fmt = (x: number) => String(r1(x));

/** Capacitor units for `stages` stages (or the fixed part) of nameplate `nameplate` each. */
function capacitorUnits(
  spec: BankSpec,
  part: string,
  nameplate: number | null,
  stages: number,
): ScheduleItem {
  const code = spec.low_voltage ? 'LV capacitor' : 'MV capacitor';
  if (nameplate === null)
    return {
      bus: spec.bus,
      code,
      what: `capacitor units, ${part}`,
      count: null,
      unit: 'kvar',
      quantity: null,
      missing: `capacitor rated voltage is unknown for bus ${spec.bus}: the detuning cannot be built (Compensation sheet, columns "Detuning p (%)" and "Capacitor rated voltage (kV)")`,
    };
  // Each stage is built of whole units: LV three-phase units up to the largest size; MV
  // single-phase units in star, a multiple of three times the units in series of the rating.
  const series = spec.units_in_series ?? 1;
  const perStage = spec.low_voltage
    ? Math.ceil(nameplate / MAX_UNIT_KVAR_LV - 1e-9)
    : MV_UNITS_MULTIPLE *
      series *
      Math.ceil(nameplate / (MV_UNITS_MULTIPLE * MAX_UNIT_KVAR_MV * series) - 1e-9);
  const unitKvar = nameplate / perStage;
  return {
    bus: spec.bus,
    code,
    what: `capacitor units, ${part}: ${perStage} a stage, ${perStage * stages} × ${fmt(unitKvar)} kvar nameplate at ${spec.u_rated_kv} kV rated${spec.u_rated_from === 'design' ? " (the design's rating)" : ''}${spec.low_voltage ? ', three-phase' : `, single-phase units of ${r3(unitKv(spec, series))} kV in star, ${series} in series a phase`}`,
    count: perStage * stages,
    unit: 'kvar',
    quantity: nameplate * stages,
  };
}

const r3 = (x: number) => Math.round(x * 1000) / 1000;
/** Rated voltage of one single-phase unit of a star bank: the bank's over √3 and the units in series. */
const unitKv = (spec: BankSpec, series: number) => (spec.u_rated_kv ?? 0) / (Math.sqrt(3) * series);

const stagesText = (g: StageGroup) =>
  `${g.stages} ${g.stages === 1 ? 'stage' : 'stages'} of ${fmt(g.kvar)} kvar`;

/** The device switching a circuit of `kvar` at the bus: LV contactor; MV contactor or breaker by class. */
function switchingDevice(spec: BankSpec, kvar: number, factor: number): { code: string; amps: number } {
  const amps = lineCurrentA(kvar, spec.u_kv) * factor;
  if (spec.low_voltage) return { code: `LV contactor ${classText(currentClass(amps))}`, amps };
  const contactor = currentClass(amps, MV_CONTACTOR_CLASSES_A);
  if (contactor !== null && amps <= MAX_MV_CONTACTOR_A && spec.u_kv <= MAX_MV_CONTACTOR_KV)
    return { code: `MV contactor ${contactor} A`, amps };
  return { code: `MV breaker ${classText(currentClass(Math.max(amps, MIN_MV_BREAKER_A)))}`, amps };
}

const classText = (c: number | null) => (c === null ? 'above 4000 A' : `${c} A`);

function incomer(spec: BankSpec, total: number): ScheduleItem {
  const amps = lineCurrentA(total, spec.u_kv) * CAPACITOR_CURRENT_FACTOR;
  const code = spec.low_voltage
    ? amps <= MAX_LV_FUSE_SWITCH_A
      ? `LV fuse-switch ${classText(currentClass(amps))}`
      : `LV breaker ${classText(currentClass(amps))}`
    : `MV breaker ${classText(currentClass(Math.max(amps, MIN_MV_BREAKER_A)))}`;
  return {
    bus: spec.bus,
    code,
    what: `bank incomer for ${fmt(total)} kvar (${fmt(amps)} A with the 1.43 capacitor margin)`,
    count: 1,
    unit: 'pc',
    quantity: 1,
  };
}

function pieces(spec: BankSpec, code: string, what: string, count: number): ScheduleItem {
  return { bus: spec.bus, code, what, count, unit: 'pc', quantity: count };
}

/** One controller per section of the design, the smallest model with outputs for its largest section. */
function controllers(sections: readonly number[]): { outputs: number; count: number } {
  const most = sections.reduce((m, n) => Math.max(m, n), 0);
  const largest = CONTROLLER_OUTPUTS[CONTROLLER_OUTPUTS.length - 1] as number;
  return { outputs: CONTROLLER_OUTPUTS.find((o) => o >= most) ?? largest, count: sections.length };
}

/**
 * Every item of one bus's bank and reactor, in the order an offer lists them. Stages of one size
 * are one line each (capacitor units, detuning reactors, switching devices), since each size has
 * its own make-up and current class: a 1:2:2 bank of 25/50/50 kvar takes one device for 25 kvar
 * and two for 50 kvar.
 */
export function busSchedule(spec: BankSpec): ScheduleItem[] {
  const items: ScheduleItem[] = [];
  const total = spec.fixed_kvar + spec.step_kvar * spec.controller_steps;
  const lv = spec.low_voltage;
  const groups = spec.stage_groups.filter((g) => g.stages > 0);
  if (total > 0) {
    for (const g of groups) items.push(capacitorUnits(spec, stagesText(g), g.nameplate_kvar, g.stages));
    if (spec.fixed_kvar > 0)
      items.push(capacitorUnits(spec, `fixed ${fmt(spec.fixed_kvar)} kvar`, spec.fixed_nameplate_kvar, 1));
    if (spec.p_pct > 0) {
      const code = `${lv ? 'LV' : 'MV'} detuning reactor ${spec.p_pct} %`;
      const tuned = `p = ${spec.p_pct} %, tuned to ${fmt(spec.tuned_hz ?? 0)} Hz (order ${fmt(spec.tuning_order ?? 0)})`;
      const reactors = (what: string, count: number, kvar: number): ScheduleItem => ({
        bus: spec.bus,
        code,
        what: `detuning reactors, ${what}, ${tuned}; kvar of the outputs they carry`,
        count,
        unit: 'kvar',
        quantity: kvar * count,
      });
      for (const g of groups) items.push(reactors(`one per stage, ${stagesText(g)}`, g.stages, g.kvar));
      if (spec.fixed_kvar > 0) items.push(reactors('one for the fixed part', 1, spec.fixed_kvar));
    }
    for (const g of groups) {
      // Each stage's device is sized by the current of that stage.
      const sw = switchingDevice(spec, g.kvar, CAPACITOR_CURRENT_FACTOR);
      items.push(
        pieces(
          spec,
          sw.code,
          `stage switching, one per stage of ${fmt(g.kvar)} kvar (${fmt(sw.amps)} A with the 1.43 capacitor margin)`,
          g.stages,
        ),
      );
    }
    if (spec.steps > 0) {
      const c = controllers(spec.sections);
      items.push(
        pieces(spec, `Step controller ${c.outputs} outputs`, `controller for ${spec.steps} steps`, c.count),
      );
    }
    if (lv) {
      const per = spec.p_pct > 0 ? SECTION_KVAR_LV_DETUNED : SECTION_KVAR_LV_PLAIN;
      const n = Math.ceil(total / per - 1e-9);
      items.push(pieces(spec, 'LV section', `cubicle sections, up to ${per} kvar each`, n));
    } else {
      const stages = spec.steps + (spec.fixed_kvar > 0 ? 1 : 0);
      items.push(pieces(spec, 'MV frame', 'bank frames or enclosures, one per stage', stages));
    }
    items.push(incomer(spec, total));
    if (!lv && spec.steps > 0)
      items.push(
        pieces(
          spec,
          'MV discharge VT',
          `fast-discharge voltage transformers, ${MV_DISCHARGE_DEVICES_PER_STEP} per switched step`,
          MV_DISCHARGE_DEVICES_PER_STEP * spec.steps,
        ),
      );
  }
  if (spec.reactor_kvar > 0) {
    items.push({
      bus: spec.bus,
      code: `${lv ? 'LV' : 'MV'} shunt reactor`,
      what: `shunt reactor ${fmt(spec.reactor_kvar)} kvar at ${spec.u_kv} kV`,
      count: 1,
      unit: 'kvar',
      quantity: spec.reactor_kvar,
    });
    const sw = switchingDevice(spec, spec.reactor_kvar, REACTOR_CURRENT_FACTOR);
    items.push(pieces(spec, sw.code, `reactor switching (${fmt(sw.amps)} A)`, 1));
  }
  return items;
}
