// A motor's own capacitor is connected at its terminals and switched with it (common practice:
// one contactor for both), so it is out while the motor is stopped. Checked by hand on a small
// site, through the one rule (compensate.ts) and through the workbook's formulas (live, and
// expanded to classic functions in an engine without ours, as other programs read the export).
import { describe, expect, it } from 'vitest';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import { compensate } from '../../../src/core/site/compensate.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { busRow, close, liveEngine, num, portableEngine, valueAt } from '../workbook/engineDoc.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,p_kw,eff,cos_phi,i0_pct,s_kva,uk_pct,p0_kw,pk_kw,to_bus,u_kv,load:day,load:night';
const { site, problems } = siteFromCsv(
  [
    HEAD,
    'T1,MV,transformer,,,,1,1000,6,1.1,10.5,LV,10',
    'T2,MV,transformer,,,,1.5,250,4,0.4,3.2,LVM,10',
    'L1,LV,load,400,,0.8,,,,,,,0.4,1,1',
    // The motor runs by day and is stopped at night; its own capacitor is on its bus alone.
    'M1,LVM,motor,75,0.95,0.85,30,,,,,,0.4,1,0',
  ].join('\n'),
  { cases: ['day', 'night'], requirement: { kind: 'cosphi', target: 0.95 } },
);
const banks: BankChoice[] = [
  { bus: 'LV', step_kvar: 25, steps: 12 },
  { bus: 'LVM', fixed_kvar: 20 },
];

describe("a motor's own capacitor switches with the motor", () => {
  it('site reads without problems', () => expect(problems).toEqual([]));
  const [day, night] = compensate(site, banks);

  it('by day the motor runs and its 20 kvar is in: the bus draws Qr − 20', () => {
    // Qr = P/η · tan φ = 75/0.95 · tan(acos 0.85) = 48.93 kvar (KVAR.MOTOR at full load).
    const qr = (75 / 0.95) * Math.tan(Math.acos(0.85));
    expect(qr).toBeCloseTo(48.93, 2);
    const motorBank = day?.banks.find((b) => b.bus === 'LVM');
    expect(motorBank).toMatchObject({ in_service: true, output_kvar: 20 });
    expect(day?.after.buses.find((b) => b.bus === 'LVM')?.q_kvar).toBeCloseTo(qr - 20, 9);
  });

  it('at night the motor is stopped: its capacitor is out, and the LV bank covers the whole need', () => {
    const motorBank = night?.banks.find((b) => b.bus === 'LVM');
    expect(motorBank).toMatchObject({ in_service: false, output_kvar: 0, steps_in: 0 });
    // Before the rule the bus delivered the 20 kvar (−20, leading) with nothing running.
    expect(night?.after.buses.find((b) => b.bus === 'LVM')?.q_kvar).toBe(0);
    // The need at the point of connection, by hand: Q − P·tan(acos 0.95), in whole 25 kvar steps.
    const root = rollUp(site, 'night').root;
    const need = root.q_kvar - root.p_kw * Math.tan(Math.acos(0.95));
    const lvBank = night?.banks.find((b) => b.bus === 'LV');
    expect(lvBank?.steps_in).toBe(Math.ceil(need / 25));
    expect(night?.within_after).toBe(true);
  });

  for (const flavour of ['live', 'portable'] as const)
    it(`the ${flavour} workbook switches it the same way`, () => {
      const doc = buildWorkbook(site, { flavour, banks });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      const comp = (bus: string, h: string) =>
        num(valueAt(hf, doc, 'Compensation', busRow(doc, bus, 'Compensation'), h));
      for (const r of [day, night]) {
        const c = r?.case as string;
        for (const b of r?.banks ?? []) {
          expect(comp(b.bus, `Capacitor output ${c} (kvar)`), `${b.bus} ${c}`).toBe(b.output_kvar);
          expect(comp(b.bus, `Steps in ${c}`), `${b.bus} ${c}`).toBe(b.steps_in);
          expect(comp(b.bus, `Bank in service ${c} (kvar)`)).toBe(b.in_service ? b.total_kvar : 0);
        }
        const qAfter = num(valueAt(hf, doc, 'Buses', busRow(doc, 'MV'), `Q after ${c} (kvar)`));
        expect(close(qAfter, r?.after.root.q_kvar as number), c).toBe(true);
      }
    });
});
