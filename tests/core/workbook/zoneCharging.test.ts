// The Compensation sheet counts the cable and line charging of a bank's zone in its resonance and
// voltage-rise columns, as Checks and the design do. Hand-worked here, independently of the code:
// - charging Q = 2πf·C·len·U² per line or cable (IEC 60287-1-1 / any cable handbook);
// - short-circuit power below a transformer and along a line: reactances in series
//   (IEC 60909-0): 1/Ssc = 1/Ssc_up + uk/S, then + X/U² with X = 2πf·L·len;
// - parallel resonance h = √(Ssc/Qc) (IEEE Std 1036), voltage rise 100·Qc/Ssc (IEEE Std 1036).
// The solar template at night with one more 33 kV cable, energised at night only, and a plain
// bank typed on block A's 33 kV bus (joined to the collector bus by its cable feeder: one zone).
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { designCompensation, proposeChoices } from '../../../src/core/site/compensation.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { zoneChargingMost } from '../../../src/core/site/chargingResonance.ts';
import { buildBusGraph } from '../../../src/core/site/graph.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { COMP_HEADERS } from '../../../src/core/workbook/compensationColumns.ts';
import { busRow, liveEngine, num, portableEngine, valueAt } from './engineDoc.ts';
import { bank, lines, nightCharging, order, site, sscA } from './chargedSolar.ts';

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

  it('Checks warns of the same resonance in each case, naming that case’s charging', () => {
    const w = assessBanks(site, [bank]).warnings.filter((x) => x.code === 'resonance' && x.bus === 'BLK-A');
    // Near the 11th at noon (the lines' charging) and at night (with the cable too): a listing of
    // either case (`balance --case night`) shows it.
    expect(w.map((x) => x.case)).toEqual(['noon', 'night']);
    expect(w[0]?.message).toContain(`${lines.toFixed(1)} kvar of cable and line charging`);
    expect(w[1]?.message).toContain(`${nightCharging.toFixed(1)} kvar of cable and line charging`);
    for (const x of w) {
      expect(x.message).toMatch(/near the 11th harmonic/);
      // The inverters are no 6-pulse source: information, by the design's rule.
      expect(x.severity).toBe('info');
    }
  });
});

describe('the design counts the same charging: a 20 kV cable beside a proposed plain bank', () => {
  // Invented: a 10 km 20 kV cable of 0.25 µF/km on the point of connection (250 MVA), one
  // 1,600 kVA transformer to a 1,200 kW load at cos φ 0.75; cos φ 0.95 asked; the bank on 20 kV.
  const file = JSON.stringify({
    format: 'kvar-ledger-site',
    version: 1,
    settings: {
      name: 'cable beside a bank',
      hz: 50,
      cases: ['day'],
      requirement: { kind: 'cosphi', target: 0.95 },
      sscMva: 250,
    },
    equipment: [
      { tag: 'C1', bus: 'MV', kind: 'cable', u_kv: 20, c_uf_km: 0.25, len_km: 10 },
      {
        tag: 'T1',
        bus: 'MV',
        kind: 'transformer',
        to_bus: 'LV',
        s_kva: 1600,
        uk_pct: 6,
        i0_pct: 1,
        p0_kw: 2,
        pk_kw: 14,
        u_kv: 0.4,
      },
      { tag: 'L1', bus: 'LV', kind: 'load', p_kw: 1200, cos_phi: 0.75, u_kv: 0.4 },
    ],
  });
  const { site: s, problems } = readSiteFile(file);
  const charging = (2 * Math.PI * 50 * 0.25e-6 * 10 * 20e3 ** 2) / 1e3; // 314.16 kvar

  it('resonance and voltage rise of the proposal, by hand and on the sheet', () => {
    expect(problems.filter((p) => p.severity === 'error')).toEqual([]);
    const d = designCompensation(s, undefined, { bankBuses: ['MV'] });
    const b = d.banks.find((x) => x.bus === 'MV');
    expect(b?.p_pct).toBe(0);
    const total = b?.total_kvar as number;
    const last = b?.resonance[b.resonance.length - 1];
    expect(last?.charging_kvar).toBeCloseTo(charging, 9);
    expect(last?.order).toBeCloseTo(Math.sqrt(250_000 / (total + charging)), 9);
    expect(b?.vrise_total_pct).toBeCloseTo((100 * (total + charging)) / 250_000, 9);
    const doc = buildWorkbook(s, { flavour: 'live', banks: proposeChoices(s, { bankBuses: ['MV'] }) });
    const hf = liveEngine(doc);
    const at = (h: string) => num(valueAt(hf, doc, 'Compensation', busRow(doc, 'MV', 'Compensation'), h));
    expect(at(COMP_HEADERS.orderTotal)).toBeCloseTo(last?.order as number, 9);
    expect(at(COMP_HEADERS.vriseTotal)).toBeCloseTo(b?.vrise_total_pct as number, 9);
  });
});
