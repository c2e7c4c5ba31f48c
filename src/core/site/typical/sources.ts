// Where each typical value comes from, said the way an estimator cites it. Every table in this
// folder names one of these; "from memory" and "common practice" mark values not checked
// against the printed source here, so a user knows to confirm them before relying on them.
import type { SourceKind } from '../../registry/spec.ts';

export interface TypicalSource {
  /** Short label shown beside an assumed value. */
  readonly label: string;
  /** The published document and table, or the practice it reflects. */
  readonly ref: string;
  readonly kind: SourceKind;
}

export const SOURCES = {
  ecoDesignLiquid: {
    label: 'EU 548/2014 Tier 2 (liquid-immersed)',
    ref: 'Commission Regulation (EU) No 548/2014, Annex I, Table I.1: maximum load losses Pk and no-load losses P0 for three-phase liquid-immersed medium power transformers ≤ 3 150 kVA (Um ≤ 24 kV / ≤ 1.1 kV), Tier 2 (from 1 July 2021); values from memory',
    kind: 'from memory',
  },
  ecoDesignDry: {
    label: 'EU 548/2014 Tier 2 (dry-type)',
    ref: 'Commission Regulation (EU) No 548/2014, Annex I, Table I.2: maximum load losses Pk and no-load losses P0 for three-phase dry-type medium power transformers ≤ 3 150 kVA (Um ≤ 24 kV / ≤ 1.1 kV), Tier 2 (from 1 July 2021); values from memory',
    kind: 'from memory',
  },
  shortCircuitImpedance: {
    label: 'IEC 60076-5 Table 1',
    ref: 'IEC 60076-5:2006, Table 1: recognised minimum values of short-circuit impedance for transformers with two separate windings, by rated power; values from memory',
    kind: 'from memory',
  },
  transformerNoLoadCurrent: {
    label: 'typical no-load current (common practice)',
    ref: 'No-load current of distribution and power transformers by rating as commonly quoted in manufacturers’ data; common practice, values from memory',
    kind: 'common practice',
  },
  motorEfficiencyPolynomial: {
    label: 'IEC 60034-30-1 IE3, 4-pole 50 Hz',
    ref: 'IEC 60034-30-1:2014 interpolation η = A·x³ + B·x² + C·x + D, x = log10(P/1 kW), IE3 4-pole 50 Hz (A 0.0773, B −1.8951, C 9.2984, D 83.7025), as published in UK SI 2021/745 Schedule 16 Table 28',
    kind: 'published',
  },
  motorEfficiencyTable: {
    label: 'IEC 60034-30-1 class table',
    ref: 'IEC 60034-30-1:2014, tables of nominal minimum efficiency at 50 Hz by class (IE1 to IE4), rated output and poles; values from memory',
    kind: 'from memory',
  },
  motorPowerFactor: {
    label: 'typical cos φ (common practice)',
    ref: 'Full-load power factor of low-voltage cage induction motors (400 V, 50 Hz) by rated output and poles as commonly found in catalogues; common practice, values from memory',
    kind: 'common practice',
  },
  motorNoLoadCurrent: {
    label: 'typical no-load current (common practice)',
    ref: 'No-load current of low-voltage cage induction motors as a share of rated current, by rated output and poles, as commonly found in catalogues; common practice, values from memory',
    kind: 'common practice',
  },
  supplyShortCircuit: {
    label: 'typical short-circuit power by voltage level (common practice)',
    ref: 'Short-circuit power at the point of connection of an industrial site as commonly met in European distribution networks, by nominal voltage (about a third to a half of the switchgear ratings usual at that level: 16 kA at 10 kV, 16 kA at 20 kV, 25 kA at 33 kV); common practice, values from memory: a placeholder until the utility states its minimum and maximum',
    kind: 'common practice',
  },
  cableReactance: {
    label: 'typical cable reactance by voltage (common practice)',
    ref: 'Series reactance of power cables as commonly quoted in makers’ data: about 0.08 Ω/km for low-voltage multicore cables and about 0.11 Ω/km for medium-voltage single-core XLPE cables in trefoil (up to 36 kV); common practice, values from memory',
    kind: 'common practice',
  },
  lineGeometry: {
    label: 'typical overhead line L and C by voltage (common practice)',
    ref: 'Inductance and capacitance per phase of single-circuit overhead lines with one conductor per phase, L = 0.2·ln(D/r′) mH/km and C = 55.6/ln(D/r) nF/km as in power-system textbooks (e.g. Grainger and Stevenson, Power System Analysis, chapters 4 and 5), at the spacings and conductor sizes commonly used: about 1.2 m and r ≈ 6 mm up to 36 kV (1.1 mH/km, 10.5 nF/km), about 4.5 m and r ≈ 10.5 mm at 66–132 kV (1.25 mH/km, 9.2 nF/km); common practice, values from memory',
    kind: 'common practice',
  },
} as const satisfies Record<string, TypicalSource>;

export type SourceId = keyof typeof SOURCES;
