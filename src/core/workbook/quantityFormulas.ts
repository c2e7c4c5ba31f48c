// The item lines of one bus's block on the "Quantities and cost" sheet, as plain formulas over
// the bus line (the bank as read from the Compensation sheet). They follow the sizing rules of
// src/core/quote/schedule.ts with the same named constants of itemRules.ts, so the sheet counts
// what `kvar-ledger quote` counts; tests/ui/living compares the two after random edits.
import { LV_MAX_KV } from '../site/bankRules.ts';
import { itemRules } from '../quote/index.ts';
import type { CellContent } from './document.ts';
import { QC, type Slot } from './quantitiesLayout.ts';
import { STAGE_RATIOS } from '../site/stepSeries.ts';
import { cell } from './refs.ts';

const {
  CAPACITOR_CURRENT_FACTOR,
  CONTROLLER_OUTPUTS,
  CURRENT_CLASSES_A,
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
} = itemRules;

/**
 * The core's 1e-9 slack at class and size boundaries, written as a quotient: the engine prints
 * 1e-9 in exponent form when it re-reads a formula, and a literal it prints another way than it
 * was typed breaks its undo (the cached formula is looked up by its printed text).
 */
const EPS = '1/1000000000';

/** One item line: the cells Item, Description, Count, Quantity, Unit, Current (the rest is pricing). */
export interface ItemCells {
  readonly item: string;
  readonly what: string;
  readonly count: string;
  readonly quantity: string;
  readonly unit: 'pc' | 'kvar';
  readonly amps?: string;
}

/** "125 A" for the smallest class at or above the current in `amps`; "above 4000 A" past them all. */
export function classText(amps: string, classes: readonly number[] = CURRENT_CLASSES_A): string {
  const last = classes[classes.length - 1] as number;
  let f = `"above ${last} A"`;
  for (let i = classes.length - 1; i >= 0; i--) {
    const c = classes[i] as number;
    f = `IF(${c}>=${amps}-${EPS},"${c} A",${f})`;
  }
  return f;
}

/**
 * The bank as its bus line holds it: references to the bus line's basis cells. Relative, so a
 * kind of line reads the same in every bus's block: the engine parses each such formula once and
 * shares it (about half the engine's memory at 10,000 rows with absolute references instead).
 */
function basis(busRow: number) {
  const b = (col: number) => cell(busRow, col);
  const u = b(QC.u);
  return {
    u,
    fixed: b(QC.fixed),
    step: b(QC.step),
    steps: b(QC.steps),
    p: b(QC.p),
    uRated: b(QC.uRated),
    per: b(QC.perKvar),
    total: b(QC.total),
    reactor: b(QC.reactor),
    inSeries: b(QC.inSeries),
    known: `AND(ISNUMBER(${u}),${u}>0)`,
    lv: `${u}<=${LV_MAX_KV}`,
  };
}

// Numbers joined into a text are rounded first: engines print a number's full digits differently.
// Even so Gnumeric printed ROUND(0.48,3) with 20 digits, so the capacitor rating is left to the
// bus line's own column rather than written into the description.
// A number joined into a text is printed from whole numbers: Gnumeric printed ROUND(6.12,2)
// joined to a text as 6.1199999999999999999, and a decimal tie (7.5 kvar × 1.21 = 9.075, a hair
// below in binary) rounded to 9.08 in LibreOffice and 9.07 in our engine. The hundredths (or
// thousandths) are counted as a whole number, nudged 1e-7 up so a tie rounds up everywhere, and
// written as integer part, point and digits without trailing zeros: the same text in every program.
function decimalText(x: string, places: 2 | 3): string {
  const scale = 10 ** places;
  const c = `ROUND(ABS(${x})*${scale}+1/10000000,0)`;
  const d = `MOD(${c},${scale})`;
  const digits =
    places === 2
      ? `IF(MOD(${d},10)=0,${d}/10,RIGHT("0"&${d},2))`
      : `IF(MOD(${d},100)=0,${d}/100,IF(MOD(${d},10)=0,RIGHT("0"&${d}/10,2),RIGHT("00"&${d},3)))`;
  return `(IF(${x}<0,"-","")&INT(${c}/${scale})&IF(${d}=0,"","."&${digits}))`;
}
const r2 = (x: string) => decimalText(x, 2);
const r3 = (x: string) => decimalText(x, 3);

const lineCurrent = (kvar: string, u: string, factor: number) => `${kvar}/(SQRT(3)*${u})*${factor}`;

/** The device switching a circuit whose current is in `amps`: LV contactor; MV contactor or breaker. */
function switchingCode(amps: string, u: string, lv: string): string {
  const mvContactor = `"MV contactor "&${classText(amps, MV_CONTACTOR_CLASSES_A)}`;
  const mvBreaker = `"MV breaker "&${classText(`MAX(${amps},${MIN_MV_BREAKER_A})`)}`;
  return `IF(${lv},"LV contactor "&${classText(amps)},IF(AND(${amps}<=${MAX_MV_CONTACTOR_A},${u}<=${MAX_MV_CONTACTOR_KV}),${mvContactor},${mvBreaker}))`;
}

/** Controllers for n steps: the smallest model with enough outputs, else several of the largest. */
function controllerOutputs(n: string): string {
  const largest = CONTROLLER_OUTPUTS[CONTROLLER_OUTPUTS.length - 1] as number;
  let f = String(largest);
  for (let i = CONTROLLER_OUTPUTS.length - 1; i >= 0; i--) {
    const o = CONTROLLER_OUTPUTS[i] as number;
    f = `IF(${n}<=${o},${o},${f})`;
  }
  return f;
}
function controllerCount(n: string): string {
  const largest = CONTROLLER_OUTPUTS[CONTROLLER_OUTPUTS.length - 1] as number;
  return `IF(${n}<=${largest},1,ROUNDUP(${n}/${largest},0))`;
}

/**
 * Physical stages of size STAGE_RATIOS[g] (1, 2, 4, 8 smallest steps), from the bus line's basis:
 * its smallest steps c = (total − fixed) / step over n stages tell the series apart (c = n equal
 * stages; c = 2n − 1 for 1:2:2, one stage of 1 and n − 1 of 2; else 1:2:4, one stage of each
 * size below 2^n; n = 2 gives c = 3 and the same stages in both), as stepSeries.ts stagesOfRatio.
 */
function stagesOfSize(k: ReturnType<typeof basis>, g: number): string {
  const [n, c] = [k.steps, `IF(${k.step}>0,ROUND((${k.total}-${k.fixed})/${k.step},0),0)`];
  if (g === 0) return `IF(${n}>0,IF(${c}<=${n},${n},1),0)`;
  if (g === 1) return `IF(${c}<=${n},0,IF(${c}=2*${n}-1,${n}-1,1))`;
  return `IF(${c}<=${n},0,IF(${c}=2*${n}-1,0,IF(${n}>${g},1,0)))`;
}

/** The stage-size index of a per-size slot ("stageSwitching2" → 2). */
const sizeIndex = (slot: Slot) => Number(slot.slice(-1));

/** Formulas of one item line at `row` of the bus whose bus line is `busRow`. */
export function itemCells(slot: Slot, row: number, busRow: number): ItemCells {
  const k = basis(busRow);
  const here = (col: number) => cell(row, col);
  const item = here(QC.item);
  const when = (cond: string, then: string) =>
    `=IF(${item}="","",${cond === '' ? then : `IF(${cond},${then},"")`})`;
  const onlyIf = (cond: string, code: string) => `=IF(AND(${k.known},${cond}),${code},"")`;
  const lvOrMv = `IF(${k.lv},"LV","MV")`;
  const capacitors = (part: string, kvar: string, times: string, present: string): ItemCells => {
    const nameplate = `${kvar}*${k.per}`;
    // Each stage is built of whole units: LV three-phase units up to the largest size; MV
    // single-phase units in star, a multiple of three times the units in series of the rating.
    const perStage = `IF(${k.lv},ROUNDUP(${nameplate}/${MAX_UNIT_KVAR_LV}-${EPS},0),${MV_UNITS_MULTIPLE}*${k.inSeries}*ROUNDUP(${nameplate}/(${MV_UNITS_MULTIPLE * MAX_UNIT_KVAR_MV}*${k.inSeries})-${EPS},0))`;
    const count = here(QC.count);
    return {
      item: onlyIf(present, `IF(${k.lv},"LV capacitor","MV capacitor")`),
      what: when(
        '',
        `IF(${k.per}="","capacitor units, ${part}: the capacitor rated voltage is unknown (Compensation sheet: detuning)","capacitor units, ${part}: "&${count}/${times}&" a stage, "&${count}&" × "&${r2(`${nameplate}*${times}/${count}`)}&" kvar nameplate at the rated voltage, "&IF(${k.lv},"three-phase","single-phase in star, "&${k.inSeries}&" in series a phase"))`,
      ),
      count: when('', `IF(${k.per}="","",${perStage}*${times})`),
      quantity: when('', `IF(${k.per}="","",${nameplate}*${times})`),
      unit: 'kvar',
    };
  };
  const tuned = `"p = "&${k.p}&" %, tuned to order "&${r2(`CAPBANK.TUNE(${k.p})`)}&"; kvar of the outputs they carry"`;
  const reactors = (what: string, count: string, kvar: string, present: string): ItemCells => ({
    item: onlyIf(`${present},${k.p}>0`, `${lvOrMv}&" detuning reactor "&${k.p}&" %"`),
    what: when('', `"detuning reactors, ${what}, "&${tuned}`),
    count: when('', count),
    quantity: when('', `${kvar}*${count}`),
    unit: 'kvar',
  });
  // The stages of this line's size (per-size slots only).
  const stage = () => {
    const g = sizeIndex(slot);
    const stages = stagesOfSize(k, g);
    const kvar = `${k.step}*${STAGE_RATIOS[g] as number}`;
    const text = `"&${stages}&IF(${stages}=1," stage"," stages")&" of "&${r2(kvar)}&" kvar`;
    return { stages, kvar, text };
  };
  switch (slot) {
    case 'stageCapacitors0':
    case 'stageCapacitors1':
    case 'stageCapacitors2':
    case 'stageCapacitors3': {
      const { stages, kvar, text } = stage();
      return capacitors(text, kvar, stages, `${stages}>0`);
    }
    case 'fixedCapacitors':
      return capacitors(`fixed "&${r2(k.fixed)}&" kvar`, k.fixed, '1', `${k.fixed}>0`);
    case 'stageDetuning0':
    case 'stageDetuning1':
    case 'stageDetuning2':
    case 'stageDetuning3': {
      const { stages, kvar, text } = stage();
      return reactors(`one per stage, ${text}`, stages, kvar, `${stages}>0`);
    }
    case 'fixedDetuning':
      return reactors('one for the fixed part', '1', k.fixed, `${k.fixed}>0`);
    case 'stageSwitching0':
    case 'stageSwitching1':
    case 'stageSwitching2':
    case 'stageSwitching3': {
      // Each stage's device is sized by the current of that stage.
      const { stages, kvar: stageKvar } = stage();
      const amps = here(QC.amps);
      return {
        item: onlyIf(`${stages}>0`, switchingCode(amps, k.u, k.lv)),
        what: when(
          '',
          `"stage switching, one per stage of "&${r2(stageKvar)}&" kvar, "&${r2(amps)}&" A with the ${CAPACITOR_CURRENT_FACTOR} capacitor margin"`,
        ),
        count: when('', stages),
        quantity: when('', stages),
        unit: 'pc',
        amps: `=IF(AND(${k.known},${stages}>0),${lineCurrent(stageKvar, k.u, CAPACITOR_CURRENT_FACTOR)},"")`,
      };
    }
    case 'controller': {
      const count = controllerCount(k.steps);
      return {
        item: onlyIf(`${k.steps}>0`, `"Step controller "&${controllerOutputs(k.steps)}&" outputs"`),
        what: when('', `"controller for "&${k.steps}&" steps"`),
        count: when('', count),
        quantity: when('', count),
        unit: 'pc',
      };
    }
    case 'enclosure': {
      const per = `IF(${k.p}>0,${SECTION_KVAR_LV_DETUNED},${SECTION_KVAR_LV_PLAIN})`;
      const count = `IF(${k.lv},ROUNDUP(${k.total}/${per}-${EPS},0),${k.steps}+IF(${k.fixed}>0,1,0))`;
      return {
        item: onlyIf(`${k.total}>0`, `IF(${k.lv},"LV section","MV frame")`),
        what: when(
          '',
          `IF(${k.lv},"cubicle sections, up to "&${per}&" kvar each","bank frames or enclosures, one per stage")`,
        ),
        count: when('', count),
        quantity: when('', count),
        unit: 'pc',
      };
    }
    case 'incomer': {
      const amps = here(QC.amps);
      const code = `IF(${k.lv},IF(${amps}<=${MAX_LV_FUSE_SWITCH_A},"LV fuse-switch ","LV breaker ")&${classText(amps)},"MV breaker "&${classText(`MAX(${amps},${MIN_MV_BREAKER_A})`)})`;
      return {
        item: onlyIf(`${k.total}>0`, code),
        what: when(
          '',
          `"bank incomer for "&${r2(k.total)}&" kvar, "&${r2(amps)}&" A with the ${CAPACITOR_CURRENT_FACTOR} capacitor margin"`,
        ),
        count: when('', '1'),
        quantity: when('', '1'),
        unit: 'pc',
        amps: `=IF(AND(${k.known},${k.total}>0),${lineCurrent(k.total, k.u, CAPACITOR_CURRENT_FACTOR)},"")`,
      };
    }
    case 'discharge': {
      const count = `${MV_DISCHARGE_DEVICES_PER_STEP}*${k.steps}`;
      return {
        item: onlyIf(`NOT(${k.lv}),${k.steps}>0`, '"MV discharge VT"'),
        what: when(
          '',
          `"fast-discharge voltage transformers, ${MV_DISCHARGE_DEVICES_PER_STEP} per switched step"`,
        ),
        count: when('', count),
        quantity: when('', count),
        unit: 'pc',
      };
    }
    case 'shuntReactor':
      return {
        item: onlyIf(`${k.reactor}>0`, `${lvOrMv}&" shunt reactor"`),
        what: when('', `"shunt reactor "&${r2(k.reactor)}&" kvar at "&${r3(k.u)}&" kV"`),
        count: when('', '1'),
        quantity: when('', k.reactor),
        unit: 'kvar',
      };
    case 'reactorSwitching': {
      const amps = here(QC.amps);
      return {
        item: onlyIf(`${k.reactor}>0`, switchingCode(amps, k.u, k.lv)),
        what: when('', `"reactor switching, "&${r2(amps)}&" A"`),
        count: when('', '1'),
        quantity: when('', '1'),
        unit: 'pc',
        amps: `=IF(AND(${k.known},${k.reactor}>0),${lineCurrent(k.reactor, k.u, REACTOR_CURRENT_FACTOR)},"")`,
      };
    }
  }
}

/** Cells of a line as a row of the sheet (pricing columns left to the caller). */
export function itemRow(c: ItemCells, width: number): CellContent[] {
  const out = new Array<CellContent>(width).fill(null);
  out[QC.item] = c.item;
  out[QC.what] = c.what;
  out[QC.count] = c.count;
  out[QC.quantity] = c.quantity;
  out[QC.unit] = c.unit;
  if (c.amps !== undefined) out[QC.amps] = c.amps;
  return out;
}
