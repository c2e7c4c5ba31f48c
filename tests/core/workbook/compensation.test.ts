// The Compensation sheet: the design's banks as inputs, their consequences as formulas. Checked
// against the compensation design (src/core/site/compensation.ts) for every template, and for one
// bus against the textbook formulas written out here.
import { describe, expect, it } from 'vitest';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { buildBusGraph } from '../../../src/core/site/graph.ts';
import type { Site } from '../../../src/core/site/model.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { busShortCircuit } from '../../../src/core/site/shortCircuit.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { PLANT } from './sites.ts';
import { busRow, close, liveEngine, num, templateSites, valueAt } from './engineDoc.ts';

const SITES: Array<{ name: string; site: Site }> = [
  { name: 'invented plant', site: PLANT },
  ...templateSites(),
];

describe('Compensation sheet follows the compensation design', () => {
  for (const { name, site } of SITES) {
    it(name, () => {
      const design = designCompensation(site);
      const doc = buildWorkbook(site, { flavour: 'live' });
      const hf = liveEngine(doc);
      const at = (bus: string, h: string) =>
        valueAt(hf, doc, 'Compensation', busRow(doc, bus, 'Compensation'), h);
      for (const bank of design.banks) {
        expect(num(at(bank.bus, 'Bank total (kvar)'))).toBe(bank.total_kvar);
        for (const c of site.settings.cases)
          expect(num(at(bank.bus, `Steps in ${c}`)), `${bank.bus} ${c}`).toBe(bank.steps_in[c]);
        // Every template's banks have a supply to rise against.
        expect([bank.vrise_step_pct, bank.vrise_total_pct]).not.toContain(null);
        expect(
          close(num(at(bank.bus, 'Voltage rise per step (%)')), bank.vrise_step_pct as number, 1e-12),
        ).toBe(true);
        expect(
          close(num(at(bank.bus, 'Voltage rise, whole bank (%)')), bank.vrise_total_pct as number, 1e-12),
        ).toBe(true);
        // Without a reactor the capacitors see the bus voltage: the same formula covers both.
        expect(close(num(at(bank.bus, 'Capacitor voltage (kV)')), bank.u_cap_kv, 1e-12)).toBe(true);
        expect(close(num(at(bank.bus, 'Step nameplate (kvar)')), bank.step_rated_kvar, 1e-9)).toBe(true);
        // Resonance from the first switching state to the whole bank, plain installed capacitors included.
        expect(bank.resonance.length).toBeGreaterThan(0);
        const [first, last] = [bank.resonance[0], bank.resonance[bank.resonance.length - 1]];
        expect(close(num(at(bank.bus, 'Resonance order, first step')), first?.order ?? NaN, 1e-12)).toBe(
          true,
        );
        expect(close(num(at(bank.bus, 'Resonance order, whole bank')), last?.order ?? NaN, 1e-12)).toBe(true);
        const near = bank.resonance.some((x) => x.near !== null);
        expect(at(bank.bus, 'Resonance check')).toMatchObject({
          ok: true,
          value: near ? expect.stringMatching(/^may come near the \d+th$/) : '',
        });
      }
      for (const r of design.reactors) {
        for (const c of site.settings.cases)
          expect(num(at(r.bus, `Reactor in ${c} (kvar)`))).toBe(r.in_service[c] ? r.q_kvar : 0);
      }
      const root = rollUp(site, site.settings.cases[0] as string).root.bus;
      for (const o of design.cases)
        expect(at(root, `Within requirement ${o.case}`)).toEqual({
          ok: true,
          value: o.met_after ? 'yes' : 'no',
        });
      // Short-circuit power per bus, as the design computes it.
      const ssc = busShortCircuit(site, buildBusGraph(site.equipment));
      for (const [bus, s] of ssc)
        expect(close(num(at(bus, 'Short-circuit power (MVA)')), s.ssc_mva, 1e-12), bus).toBe(true);
    });
  }

  it('without banks the point of connection shows where the requirement is missed', () => {
    for (const { site } of SITES) {
      const design = designCompensation(site);
      const doc = buildWorkbook(site, { flavour: 'live', banks: [] });
      const hf = liveEngine(doc);
      const root = rollUp(site, site.settings.cases[0] as string).root.bus;
      for (const o of design.cases) {
        expect(
          valueAt(hf, doc, 'Compensation', busRow(doc, root, 'Compensation'), `Within requirement ${o.case}`),
        ).toEqual({ ok: true, value: o.met_before ? 'yes' : 'no' });
      }
    }
  });
});

/**
 * Smallest steps a bank's stages add up to, from the ratio notation itself: 1:1:1… stages of
 * one step each, 1:2:2… one then twos, 1:2:4… doubling (the sum of the stage ratios).
 */
function positionsOf(series: unknown, stages: number): number {
  const ratio = (i: number) => (series === '1:2:2' ? (i === 0 ? 1 : 2) : series === '1:2:4' ? 2 ** i : 1);
  let sum = 0;
  for (let i = 0; i < stages; i++) sum += ratio(i);
  return sum;
}

describe('one bus by hand (invented plant, bus LV2, case day)', () => {
  const doc = buildWorkbook(PLANT, { flavour: 'live' });
  const hf = liveEngine(doc);
  const r = busRow(doc, 'LV2', 'Compensation');
  const at = (h: string) => num(valueAt(hf, doc, 'Compensation', r, h));
  const bus = rollUp(PLANT, 'day').buses.find((b) => b.bus === 'LV2');
  if (!bus) throw new Error('no LV2');

  it('short-circuit power below 2 × 1000 kVA, uk 6 %, from 250 MVA: 1/(0.06/2 + 1/250) (IEC 60909-0 impedances in series)', () => {
    expect(close(at('Short-circuit power (MVA)'), 1 / (0.06 / 2 + 1 / 250), 1e-12)).toBe(true);
  });

  it('capacitive need Q − P·tan(acos 0.95) (power triangle, IEC 60050-131)', () => {
    const want = bus.q_kvar - bus.p_kw * Math.tan(Math.acos(0.95));
    expect(close(at('Capacitive need day (kvar)'), want, 1e-12)).toBe(true);
  });

  it('steps: whole steps covering its share of the site need less the fixed part, at most the steps installed', () => {
    // The rule (README, "After compensation"): every bank covers the same share of its size of the
    // need at the point of connection. Recomputed here from the roll-up and the typed banks.
    const day = rollUp(PLANT, 'day');
    const siteNeed = day.root.q_kvar - day.root.p_kw * Math.tan(Math.acos(0.95));
    const totalOf = (bus: string) => {
      const row = busRow(doc, bus, 'Compensation');
      const v = (h: string) => {
        const x = valueAt(hf, doc, 'Compensation', row, h);
        return x.ok && typeof x.value === 'number' ? x.value : 0;
      };
      const series = valueAt(hf, doc, 'Compensation', row, 'Step series');
      return v('Fixed (kvar)') + v('Step (kvar)') * positionsOf(series.ok ? series.value : '', v('Steps'));
    };
    const buses = rollUp(PLANT, 'day').buses.map((b) => b.bus);
    const sum = buses.reduce((a, b) => a + totalOf(b), 0);
    const share = (siteNeed * totalOf('LV2')) / sum;
    const [fixed, step, stages] = [at('Fixed (kvar)'), at('Step (kvar)'), at('Steps')];
    const series = valueAt(hf, doc, 'Compensation', r, 'Step series');
    const steps = positionsOf(series.ok ? series.value : '', stages);
    expect(step).toBeGreaterThan(0);
    expect(at('Controller steps')).toBe(steps);
    expect(at('Steps in day')).toBe(Math.min(steps, Math.ceil((share - fixed) / step - 1e-9)));
    expect(at('Capacitor output day (kvar)')).toBe(fixed + step * at('Steps in day'));
  });

  it('resonance order of the whole bank with 7 % detuning, the old 50 kvar plain capacitor included: 1/√(p/100 + Qc/Ssc), Qc the capacitors alone, Q·(1 − p) (RESONANCE.ORDER in FUNCTIONS.md)', () => {
    const ssc = at('Short-circuit power (MVA)');
    // CB2: 50 kvar at its rated 0.4 kV, no detuning: it counts in full.
    expect(at('Plain capacitors installed (kvar)')).toBe(50);
    const series = valueAt(hf, doc, 'Compensation', r, 'Step series');
    const total =
      at('Fixed (kvar)') + at('Step (kvar)') * positionsOf(series.ok ? series.value : '', at('Steps'));
    expect(at('Bank total (kvar)')).toBe(total);
    expect(
      close(
        at('Resonance order, whole bank'),
        // The bank's output Q = U²/(Xc·(1 − p)) at the bus: its capacitors hold Q·(1 − p).
        1 / Math.sqrt(0.07 + (total * 0.93 + 50) / (ssc * 1000)),
        1e-12,
      ),
    ).toBe(true);
    expect(
      close(
        at('Resonance order, first step'),
        1 / Math.sqrt(0.07 + (at('Fixed (kvar)') * 0.93 + 50) / (ssc * 1000)),
        1e-12,
      ),
    ).toBe(true);
    expect(valueAt(hf, doc, 'Compensation', r, 'Resonance check')).toEqual({ ok: true, value: '' });
  });

  it('voltage rise of one step: 100·Qc/Ssc (common practice, ΔU/U ≈ Q/Ssc)', () => {
    // The design's step at 400 V is within the 50 kvar contactor limit (stepRules.ts).
    expect(at('Step (kvar)')).toBe(50);
    expect(
      close(
        at('Voltage rise per step (%)'),
        (100 * at('Step (kvar)')) / (at('Short-circuit power (MVA)') * 1000),
        1e-12,
      ),
    ).toBe(true);
  });

  it('cos φ after = P/√(P² + Q after²)', () => {
    const q = at('Q after day (kvar)');
    expect(close(q, bus.q_kvar - at('Capacitor output day (kvar)'), 1e-12)).toBe(true);
    expect(close(at('cos φ after day'), bus.p_kw / Math.hypot(bus.p_kw, q), 1e-12)).toBe(true);
  });
});

describe('a bank changed on the sheet changes its consequences', () => {
  it('a smaller step switches more steps; without steps the root misses the target', () => {
    const doc = buildWorkbook(PLANT, { flavour: 'live' });
    const hf = liveEngine(doc);
    const sheetId = hf.getSheetId('Compensation') as number;
    const header = doc.sheets.find((s) => s.name === 'Compensation')?.cells[0] as string[];
    const r = busRow(doc, 'LV2', 'Compensation');
    const stepsDay = () => num(valueAt(hf, doc, 'Compensation', r, 'Steps in day'));
    const before = stepsDay();
    hf.setCellContents({ sheet: sheetId, row: r, col: header.indexOf('Step (kvar)') }, [[30]]);
    hf.setCellContents({ sheet: sheetId, row: r, col: header.indexOf('Steps') }, [[12]]);
    expect(stepsDay()).toBeGreaterThan(before);
    hf.setCellContents({ sheet: sheetId, row: r, col: header.indexOf('Steps') }, [[0]]);
    hf.setCellContents({ sheet: sheetId, row: r, col: header.indexOf('Fixed (kvar)') }, [[0]]);
    hf.setCellContents(
      { sheet: sheetId, row: busRow(doc, 'LV1', 'Compensation'), col: header.indexOf('Steps') },
      [[0]],
    );
    expect(
      valueAt(hf, doc, 'Compensation', busRow(doc, 'MV', 'Compensation'), 'Within requirement night'),
    ).toEqual({ ok: true, value: 'no' });
  });
});
