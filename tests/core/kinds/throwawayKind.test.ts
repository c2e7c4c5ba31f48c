// Adding an equipment kind is one definition: a throwaway kind (an electric heater bank of our
// own invention, on a sheet of its own), registered through the registry alone, is validated,
// rolled up, written to the live workbook, computed by the engine and exported with classic
// formulas, with no other file touched. Its physics: P = rated P × load factor, Q = 0 (a
// resistive load, cos φ = 1 by definition).
import { describe, expect, it } from 'vitest';
import {
  defineKind,
  defineSheet,
  input,
  mul,
  col,
  num,
  X,
  registerKind,
} from '../../../src/core/kinds/index.ts';
import type { Site } from '../../../src/core/site/model.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { createEngine, createPlainEngine, readCell } from '../../../src/engine/index.ts';
import { handOffDoc } from '../../../src/ui/app/handOff.ts';
import { expandDoc } from '../workbook/engineDoc.ts';

const HEATERS = defineSheet({
  id: 'heaters',
  name: 'Heaters',
  purpose: 'Resistive heaters: P = rated P × load factor, no kvar.',
  inputs: [
    input('tag'),
    input('description'),
    input('bus'),
    input('qty'),
    input('running'),
    input('p_kw'),
    input('u_kv'),
  ],
});

registerKind(
  defineKind({
    name: 'heater',
    sheet: HEATERS,
    role: 'shunt',
    required: ['p_kw'],
    load: { range: [0, 1], meaning: 'share of the rated power' },
    voltageAt: 'bus',
    shunt: { p: mul(col('p_kw'), X), q: num(0) },
    summary: 'P = rated P × load factor, no kvar',
  }),
);

const MOTOR = {
  row: 2,
  tag: 'M1',
  bus: 'LV',
  kind: 'motor',
  values: { p_kw: 30, eff: 0.92, cos_phi: 0.85, u_kv: 0.4 },
  loads: {},
};
const HEATER = {
  row: 3,
  tag: 'H1',
  bus: 'LV',
  kind: 'heater',
  values: { p_kw: 40, qty: 2 },
  loads: { mild: 0.25 },
};
const site: Site = {
  settings: {
    name: 'Heater test',
    hz: 50,
    cases: ['cold', 'mild'],
    requirement: { kind: 'cosphi', target: 0.95 },
  },
  equipment: [MOTOR, HEATER],
};
const motorP = 30 / 0.92; // KW.MOTOR at full load: Pout / η

describe('a kind defined through the registry alone', () => {
  it('is validated: a missing rated power is reported on its row and column', () => {
    expect(validateSite(site)).toEqual([]);
    const bad: Site = { ...site, equipment: [MOTOR, { ...HEATER, values: { qty: 2 } }] };
    expect(validateSite(bad).map((p) => p.message)).toContain(
      'row 3, column p_kw: p_kw is required for a heater and is blank',
    );
  });

  it('is rolled up: 2 × 40 kW in the cold case, 2 × 10 kW in the mild one, no kvar', () => {
    expect(rollUp(site, 'cold').root.p_kw).toBeCloseTo(motorP + 80, 9);
    expect(rollUp(site, 'mild').root.p_kw).toBeCloseTo(motorP + 20, 9);
    const motorOnly: Site = { ...site, equipment: [MOTOR] };
    expect(rollUp(site, 'cold').root.q_kvar).toBeCloseTo(rollUp(motorOnly, 'cold').root.q_kvar, 9);
  });

  it('gets its sheet in the live workbook, and the engine computes the same totals', () => {
    const doc = buildWorkbook(site, { flavour: 'live', banks: [] });
    expect(doc.sheets.find((s) => s.name === 'Heaters')?.cells[1]?.[0]).toBe('H1');
    const hf = createEngine(doc.sheets);
    const header = doc.sheets.find((s) => s.name === 'Buses')?.cells[0] ?? [];
    const r = readCell(hf, 'Buses', 1, header.indexOf('P cold (kW)'));
    expect(r).toEqual({ ok: true, value: expect.closeTo(motorP + 80, 9) });
  });

  it('is exported with classic formulas that an engine without our functions computes alike', () => {
    const portable = handOffDoc(buildWorkbook(site, { flavour: 'live', banks: [] })).doc;
    const plain = createPlainEngine(expandDoc(portable).sheets);
    const header = portable.sheets.find((s) => s.name === 'Buses')?.cells[0] ?? [];
    const r = readCell(plain, 'Buses', 1, header.indexOf('P mild (kW)'));
    expect(r).toEqual({ ok: true, value: expect.closeTo(motorP + 20, 9) });
  });
});
