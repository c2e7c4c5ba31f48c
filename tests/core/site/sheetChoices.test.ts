// The design reads the Compensation sheet's choices per bus (sheetChoices.ts): a detuning typed
// alone gets the design's bank with that detuning; a typed bank stays as typed and the design
// covers only what it leaves, on the open buses; design options give way to typed choices and
// say so. The outcome is judged by the one rule for after compensation (compensate.ts).
import { describe, expect, it } from 'vitest';
import { compensate } from '../../../src/core/site/compensate.ts';
import { proposeChoices } from '../../../src/core/site/compensation.ts';
import { designWithSheet } from '../../../src/core/site/sheetChoices.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';

// Invented: an 11 kV bus feeding a 1,000 kVA transformer to 500 kW of 0.4 kV load, cos φ 0.95 asked.
const site = readSiteFile(
  JSON.stringify({
    format: 'kvar-ledger-site',
    version: 1,
    settings: {
      name: 'sheet choices',
      hz: 50,
      cases: ['day', 'night'],
      requirement: { kind: 'cosphi', target: 0.95 },
      sscMva: 250,
    },
    equipment: [
      {
        tag: 'T1',
        bus: 'MV',
        kind: 'transformer',
        to_bus: 'LV',
        s_kva: 1000,
        uk_pct: 6,
        i0_pct: 1,
        p0_kw: 1.5,
        pk_kw: 10,
        u_kv: 0.4,
      },
      { tag: 'MV-L', bus: 'MV', kind: 'load', p_kw: 400, cos_phi: 0.8, u_kv: 11 },
      { tag: 'L1', bus: 'LV', kind: 'load', p_kw: 300, cos_phi: 0.8, u_kv: 0.4, 'load:night': 0.5 },
      { tag: 'L2', bus: 'LV', kind: 'load', p_kw: 200, cos_phi: 0.95, u_kv: 0.4 },
    ],
  }),
).site;
const met = (choices: Parameters<typeof compensate>[1]) =>
  compensate(site, choices).every((r) => r.within_after);

describe('the design reads the Compensation sheet per bus', () => {
  it('open buses: the same proposal as the design alone', () => {
    const r = designWithSheet(site, undefined);
    expect(r.choices).toEqual(proposeChoices(site));
    // The design's own choice here (7 %: a plain bank would resonate near the 7th).
    expect(r.choices.find((c) => c.bus === 'LV')?.p_pct).toBe(7);
    expect([...r.origins.values()].every((o) => o === 'proposed')).toBe(true);
    expect(met(r.choices)).toBe(true);
  });

  it('a detuning typed alone: the design proposes that bus’s bank with it', () => {
    const r = designWithSheet(site, [{ bus: 'LV', p_pct: 14 }]);
    const lv = r.choices.find((c) => c.bus === 'LV');
    expect(lv?.p_pct).toBe(14);
    expect((lv?.step_kvar ?? 0) + (lv?.fixed_kvar ?? 0)).toBeGreaterThan(0);
    expect(r.origins.get('LV')).toBe('detuning typed');
    expect(met(r.choices)).toBe(true);
  });

  it('a typed bank stays as typed; the design covers what it leaves on the open bus', () => {
    const typed = { bus: 'LV', fixed_kvar: 50 };
    const r = designWithSheet(site, [typed]);
    expect(r.choices).toContainEqual(typed);
    expect(r.origins.get('LV')).toBe('typed');
    expect(r.origins.get('MV')).toBe('proposed');
    expect(r.choices.filter((c) => c.bus === 'LV')).toHaveLength(1);
    expect(met([typed])).toBe(false);
    expect(met(r.choices)).toBe(true);
  });

  it('options give way to typed choices and say so; they still reach the open buses', () => {
    const r = designWithSheet(site, [{ bus: 'LV', fixed_kvar: 50 }], {
      detuning: { LV: 14, MV: 7 },
      bankBuses: ['LV', 'MV'],
    });
    expect(r.overridden).toEqual([
      '--detune LV=14 set aside: a bank is typed on bus LV',
      '--bank-bus LV set aside: a bank is typed on bus LV',
    ]);
    expect(r.choices.find((c) => c.bus === 'LV')).toEqual({ bus: 'LV', fixed_kvar: 50 });
    expect(r.choices.find((c) => c.bus === 'MV')?.p_pct).toBe(7);
  });

  it('a typed detuning wins over --detune and --third-harmonic on its bus', () => {
    const r = designWithSheet(site, [{ bus: 'LV', p_pct: 5.67 }], {
      detuning: { LV: 14 },
      thirdHarmonic: true,
    });
    expect(r.choices.find((c) => c.bus === 'LV')?.p_pct).toBe(5.67);
    expect(r.overridden).toEqual([
      '--detune LV=14 set aside: detuning 5.67 % is typed on bus LV',
      '--third-harmonic does not change bus LV: detuning 5.67 % is typed there',
    ]);
  });
});
