// The Compensation sheet counts the cable and line charging of a bank's zone in its resonance and
// voltage-rise columns, as Checks and the design do. Hand-worked here, independently of the code:
// - charging Q = 2πf·C·len·U² per line or cable (IEC 60287-1-1 / any cable handbook);
// - short-circuit power below a transformer and along a line: reactances in series
//   (IEC 60909-0): 1/Ssc = 1/Ssc_up + uk/S, then + X/U² with X = 2πf·L·len;
// - parallel resonance h = √(Ssc/Qc) (IEEE Std 1036), voltage rise 100·Qc/Ssc (IEEE Std 1036).
// The solar template at night with one more 33 kV cable, energised at night only, and a plain
// bank typed on block A's 33 kV bus (joined to the collector bus by its cable feeder: one zone).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import { zoneChargingMost } from '../../../src/core/site/chargingResonance.ts';
import { buildBusGraph } from '../../../src/core/site/graph.ts';
import type { Site } from '../../../src/core/site/model.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { COMP_HEADERS } from '../../../src/core/workbook/compensationColumns.ts';
import { busRow, liveEngine, num, portableEngine, valueAt } from './engineDoc.ts';

const SOLAR = join(import.meta.dirname, '../../../templates/solar-collector.json');
const raw = JSON.parse(readFileSync(SOLAR, 'utf8')) as {
  settings: { sscMva: number };
  equipment: Array<Record<string, number | string>>;
};
const base = readSiteFile(readFileSync(SOLAR, 'utf8')).site;
// A 33 kV cable of 3 km at 0.3 µF/km on block B's bus, energised at night only (invented).
const CABLE = { u: 33, c: 0.3e-6, len: 3 };
const site: Site = {
  ...base,
  equipment: [
    ...base.equipment,
    {
      row: 1000,
      tag: 'CB-X',
      bus: 'BLK-B',
      kind: 'cable',
      values: { u_kv: CABLE.u, c_uf_km: CABLE.c * 1e6, len_km: CABLE.len },
      loads: { noon: 0, night: 1 },
    },
  ],
};
const bank: BankChoice = { bus: 'BLK-A', fixed_kvar: 0, step_kvar: 300, steps: 4 };

// Hand figures.
const q = (cF: number, len: number, uKv: number) => (2 * Math.PI * 50 * cF * len * (uKv * 1e3) ** 2) / 1e3;
const lines = raw.equipment
  .filter((r) => r.kind === 'line')
  .reduce((s, r) => s + q((r.c_nf_km as number) * 1e-9, r.len_km as number, 33), 0);
const cable = q(CABLE.c, CABLE.len, CABLE.u); // about 308 kvar
const nightCharging = lines + cable;
const gt = raw.equipment.find((r) => r.tag === 'GT1') as Record<string, number>;
const sscMv = 1 / (1 / raw.settings.sscMva + (gt.uk_pct as number) / 100 / ((gt.s_kva as number) / 1000));
const fa = raw.equipment.find((r) => r.tag === 'F-A') as Record<string, number>;
const xLine = 2 * Math.PI * 50 * (fa.l_mh_km as number) * 1e-3 * (fa.len_km as number);
const sscA = 1 / (1 / sscMv + xLine / 33 ** 2); // MVA at BLK-A
const order = (kvar: number) => Math.sqrt((sscA * 1000) / kvar);

describe('charging in the Compensation sheet: the solar template with a plain bank on a collector bus', () => {
  it('the hand figures: about 2.7 Mvar of charging at night against about 357 MVA', () => {
    expect(nightCharging).toBeCloseTo(2386 + 308, -1);
    expect(sscA).toBeCloseTo(357, 0);
  });

  it('the core counts the most charging of any case (night) for every bus of the zone', () => {
    const graph = buildBusGraph(site.equipment);
    const most = zoneChargingMost(
      site,
      graph,
      site.settings.cases.map((c) => rollUp(site, c)),
    );
    for (const bus of ['MV-33', 'BLK-A', 'BLK-B', 'BLK-D'])
      expect(most.get(bus)).toBeCloseTo(nightCharging, 6);
    // Behind a transformer is another zone, with no charging of its own.
    expect(most.get('INV-A')).toBe(0);
  });

  for (const flavour of ['live', 'portable'] as const) {
    it(`the ${flavour} sheet counts it in resonance and voltage rise, as the hand does`, () => {
      const doc = buildWorkbook(site, { flavour, banks: [bank] });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      const at = (bus: string, h: string) =>
        valueAt(hf, doc, 'Compensation', busRow(doc, bus, 'Compensation'), h);
      expect(num(at('BLK-A', COMP_HEADERS.zoneCharging))).toBeCloseTo(nightCharging, 6);
      expect(num(at('MV-33', COMP_HEADERS.zoneCharging))).toBeCloseTo(nightCharging, 6);
      expect(num(at('INV-B', COMP_HEADERS.zoneCharging))).toBe(0);
      expect(num(at('BLK-A', COMP_HEADERS.ssc))).toBeCloseTo(sscA, 6);
      expect(num(at('BLK-A', COMP_HEADERS.orderStep))).toBeCloseTo(order(300 + nightCharging), 9);
      expect(num(at('BLK-A', COMP_HEADERS.orderTotal))).toBeCloseTo(order(1200 + nightCharging), 9);
      // 11.0 and 10.0: both within 10 % of the 11th.
      expect(at('BLK-A', COMP_HEADERS.check)).toMatchObject({ ok: true, value: 'may come near the 11th' });
      expect(num(at('BLK-A', COMP_HEADERS.vriseTotal))).toBeCloseTo(
        (100 * (1200 + nightCharging)) / (sscA * 1000),
        9,
      );
      // One stage's step is its own kvar: the charging is there before and after.
      expect(num(at('BLK-A', COMP_HEADERS.vriseStep))).toBeCloseTo((100 * 300) / (sscA * 1000), 9);
    });
  }

  it('a detuned bank leaves the charging out of its own resonance order', () => {
    const doc = buildWorkbook(site, { flavour: 'live', banks: [{ ...bank, p_pct: 7 }] });
    const hf = liveEngine(doc);
    const got = num(
      valueAt(hf, doc, 'Compensation', busRow(doc, 'BLK-A', 'Compensation'), COMP_HEADERS.orderTotal),
    );
    // h = 1/√(p + Qc/Ssc) with the capacitors' own kvar Q·(1 − p) (IEEE Std 1036 with a series reactor).
    expect(got).toBeCloseTo(1 / Math.sqrt(0.07 + (1200 * 0.93) / (sscA * 1000)), 9);
  });

  it('Checks warns of the same resonance, naming the charging', () => {
    const w = assessBanks(site, [bank]).warnings.filter((x) => x.code === 'resonance' && x.bus === 'BLK-A');
    expect(w).toHaveLength(1);
    expect(w[0]?.message).toMatch(/kvar of cable and line charging/);
    expect(w[0]?.message).toMatch(/near the 11th harmonic/);
  });
});
