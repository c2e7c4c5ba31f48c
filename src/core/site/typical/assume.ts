// Tender-stage lists rarely carry nameplates. Given one equipment row, say which blank inputs
// can take a typical value, the value, and where it comes from. Nothing here writes to a
// workbook: the caller decides to fill the cells and mark them as assumed; a value the user
// types replaces the assumption.
import type { EquipmentKind, NumericColumn } from '../model.ts';
import {
  motorCosPhi,
  motorEfficiency,
  motorNoLoadCurrent,
  type EfficiencyClass,
  type Poles,
} from './motors.ts';
import type { TypicalSource } from './sources.ts';
import { CABLE_X_BANDS, cableReactance } from './cables.ts';
import { LINE_BANDS, LINE_TYPICAL_ABOVE_KV, lineCapacitance, lineInductance } from './lines.ts';
import {
  ecodesignLosses,
  transformerNoLoadCurrent,
  ukMinimum,
  type Cooling,
  type TypicalNumber,
} from './transformers.ts';

export interface AssumedValue {
  readonly column: NumericColumn;
  /** In the column's own unit (eff as a fraction, losses in kW, uk and i0 in %). */
  readonly value: number;
  readonly source: TypicalSource;
  /** One line for a cell's note: what was assumed and on which basis. */
  readonly note: string;
}

export interface Assumptions {
  readonly assumed: readonly AssumedValue[];
  /** Why a blank input could not take a typical value (rating missing, size outside the tables). */
  readonly notAssumed: readonly string[];
}

export interface AssumeOptions {
  /** Efficiency class for motors (default IE3, the EU minimum for most new motors since 2021). */
  readonly motorClass?: EfficiencyClass;
  /** Poles of a motor when the list does not say (default 4, the commonest). */
  readonly poles?: Poles;
  /** Transformer cooling when the list does not say (default liquid-immersed). */
  readonly cooling?: Cooling;
}

/** What the function reads of a row: its kind and numbers (an EquipmentRow fits). */
export interface RowInputs {
  readonly kind: EquipmentKind;
  readonly values: Partial<Record<NumericColumn, number>>;
}

const round = (x: number, step: number) => Math.round(x / step) * step;
const fix = (x: number, step: number) =>
  Number(round(x, step).toFixed(Math.max(0, -Math.floor(Math.log10(step)))));

function isBlank(v: number | undefined): boolean {
  return v === undefined || !Number.isFinite(v);
}

export function assumeTypical(row: RowInputs, opts: AssumeOptions = {}): Assumptions {
  if (row.kind === 'motor') return assumeMotor(row.values, opts);
  if (row.kind === 'transformer') return assumeTransformer(row.values, opts);
  if (row.kind === 'feeder') return assumeFeeder(row.values);
  if (row.kind === 'line') return assumeLine(row.values);
  return { assumed: [], notAssumed: [] };
}

function collect(
  values: RowInputs['values'],
  wanted: ReadonlyArray<{
    column: NumericColumn;
    get: () => TypicalNumber | undefined;
    step: number;
    basis: string;
  }>,
  missing: string,
): Assumptions {
  const assumed: AssumedValue[] = [];
  const notAssumed: string[] = [];
  for (const w of wanted) {
    if (!isBlank(values[w.column])) continue;
    const t = w.get();
    if (!t) {
      notAssumed.push(`${w.column}: ${missing}`);
      continue;
    }
    const value = fix(t.value, w.step);
    assumed.push({
      column: w.column,
      value,
      source: t.source,
      note: `assumed ${value} (${w.basis}; ${t.source.label})`,
    });
  }
  return { assumed, notAssumed };
}

function assumeFeeder(values: RowInputs['values']): Assumptions {
  const u = values.u_kv;
  if (isBlank(u) || !((u as number) > 0))
    return {
      assumed: [],
      notAssumed: isBlank(values.x_ohm_km) ? ['x_ohm_km: no typical value without the voltage (u_kv)'] : [],
    };
  return collect(
    values,
    [{ column: 'x_ohm_km', get: () => cableReactance(u as number), step: 0.01, basis: `${u} kV cable` }],
    `no typical reactance above ${CABLE_X_BANDS[CABLE_X_BANDS.length - 1]?.upToKv} kV: take the maker's data`,
  );
}

function assumeLine(values: RowInputs['values']): Assumptions {
  const u = values.u_kv;
  if (isBlank(u) || !((u as number) > 0)) {
    const blank = (['l_mh_km', 'c_nf_km'] as const).filter((c) => isBlank(values[c]));
    return { assumed: [], notAssumed: blank.map((c) => `${c}: no typical value without the voltage (u_kv)`) };
  }
  const kv = u as number;
  const basis = `${kv} kV single-circuit overhead line`;
  const top = LINE_BANDS[LINE_BANDS.length - 1]?.upToKv;
  return collect(
    values,
    [
      { column: 'l_mh_km', get: () => lineInductance(kv), step: 0.01, basis },
      { column: 'c_nf_km', get: () => lineCapacitance(kv), step: 0.1, basis },
    ],
    kv > LINE_TYPICAL_ABOVE_KV
      ? `no typical value above ${top} kV, where bundled conductors and double circuits decide: take the utility's or the maker's data`
      : `no typical value at or below ${LINE_TYPICAL_ABOVE_KV} kV, where open-wire lines and aerial bundled cables differ threefold: take the maker's data`,
  );
}

function assumeMotor(values: RowInputs['values'], opts: AssumeOptions): Assumptions {
  const p = values.p_kw;
  const cls = opts.motorClass ?? 'IE3';
  const poles = opts.poles ?? 4;
  if (isBlank(p) || !((p as number) > 0)) {
    const blank = (['eff', 'cos_phi', 'i0_pct'] as const).filter((c) => isBlank(values[c]));
    return {
      assumed: [],
      notAssumed: blank.map((c) => `${c}: no typical value without the rated output (p_kw)`),
    };
  }
  const kw = p as number;
  const basis = `${kw} kW, ${poles}-pole`;
  return collect(
    values,
    [
      {
        column: 'eff',
        get: () => {
          const e = motorEfficiency(kw, cls, poles);
          return e && { value: e.value / 100, source: e.source };
        },
        step: 0.001,
        basis: `${basis}, class ${cls}`,
      },
      { column: 'cos_phi', get: () => motorCosPhi(kw, poles), step: 0.01, basis },
      { column: 'i0_pct', get: () => motorNoLoadCurrent(kw, poles), step: 0.1, basis },
    ],
    `${kw} kW is outside the typical-value tables (0.75 kW to 1 000 kW, ${cls} ${poles}-pole)`,
  );
}

function assumeTransformer(values: RowInputs['values'], opts: AssumeOptions): Assumptions {
  const s = values.s_kva;
  const cooling = opts.cooling ?? 'liquid';
  if (isBlank(s) || !((s as number) > 0)) {
    const blank = (['uk_pct', 'p0_kw', 'pk_kw', 'i0_pct'] as const).filter((c) => isBlank(values[c]));
    return {
      assumed: [],
      notAssumed: blank.map((c) => `${c}: no typical value without the rating (s_kva)`),
    };
  }
  const kva = s as number;
  const losses = ecodesignLosses(kva, cooling);
  const basis = `${kva} kVA`;
  const lossBasis = `${basis}, ${cooling === 'dry' ? 'dry-type' : 'liquid-immersed'}, maximum allowed`;
  return collect(
    values,
    [
      { column: 'uk_pct', get: () => ukMinimum(kva), step: 0.1, basis: `${basis}, minimum` },
      { column: 'p0_kw', get: () => losses?.p0, step: 0.001, basis: lossBasis },
      { column: 'pk_kw', get: () => losses?.pk, step: 0.001, basis: lossBasis },
      { column: 'i0_pct', get: () => transformerNoLoadCurrent(kva), step: 0.01, basis },
    ],
    `${kva} kVA is outside the typical-value tables (losses up to 3 150 kVA, uk up to 100 000 kVA)`,
  );
}
