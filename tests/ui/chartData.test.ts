import { describe, expect, it } from 'vitest';
import {
  busesToDraw,
  casesOf,
  cosPhi,
  niceCeil,
  readChartData,
  type BusBar,
} from '../../src/ui/charts/chartData.ts';

// Header texts as the workbook builder writes them (src/core/workbook/buildBuses.ts).
const buses = [
  [
    'Bus',
    'Level',
    'Fed by',
    'Upstream bus',
    'U (kV)',
    'P day (kW)',
    'Q day (kvar)',
    'Q absorbed day (kvar)',
    'Q delivered day (kvar)',
    'P night (kW)',
    'Q night (kvar)',
    'Q absorbed night (kvar)',
    'Q delivered night (kvar)',
    'Q absorbed own items day (kvar)',
  ],
  ['POC', 0, null, null, 11, 800, 600, 650, -50, 100, -40, 30, -70, 1],
  ['LV1', 1, 'T1', 'POC', 0.4, 500, 420, 420, 0, 60, 20, 20, 0, 2],
  [null],
  ['Rows added or moved by hand are not part of the bus list.'],
];
const compensation = [
  ['Bus', 'U (kV)', 'Q after day (kvar)', 'Q after night (kvar)'],
  ['LV1', 0.4, 100, 20],
  ['poc', 11, 262.9, -40],
];

describe('chart data', () => {
  it('finds the cases from the bus sheet headers, not the own-items columns', () => {
    expect(casesOf(buses)).toEqual(['day', 'night']);
  });
  it('does not take the after-compensation columns for cases, even for a case called "after hours"', () => {
    // As the Buses sheet heads them: each case, then each case after compensation, then own items.
    const cases = ['day', 'after hours'];
    const header = [
      'Bus',
      ...cases.map((c) => `Q absorbed ${c} (kvar)`),
      ...cases.map((c) => `Q absorbed after ${c} (kvar)`),
      ...cases.map((c) => `Q absorbed own items ${c} (kvar)`),
    ];
    expect(casesOf([header])).toEqual(cases);
  });
  it('reads absorbed and delivered as magnitudes and the net with its sign', () => {
    const d = readChartData(buses, compensation);
    expect(d.bars.get('night')).toEqual([
      { bus: 'POC', absorbed: 30, delivered: 70, net: -40 },
      { bus: 'LV1', absorbed: 20, delivered: 0, net: 20 },
    ]);
  });
  it('takes the point of connection before and after compensation', () => {
    const d = readChartData(buses, compensation);
    expect(d.triangles.get('day')).toEqual({
      bus: 'POC',
      before: { p: 800, q: 600 },
      after: { p: 800, q: 262.9 },
    });
  });
  it('draws no "after" when there is no compensation sheet', () => {
    expect(readChartData(buses, undefined).triangles.get('day')?.after).toBeUndefined();
    expect(readChartData(undefined, undefined).cases).toEqual([]);
  });
  it('cos φ of the 3-4-5 triangle is 0.8 (IEC 60050-131, 131-11-46)', () => {
    expect(cosPhi({ p: 400, q: 300 })).toBeCloseTo(0.8, 15);
    expect(cosPhi({ p: 0, q: 0 })).toBeUndefined();
  });
  it('rounds axis ends up to 1, 2, 2.5 or 5 times a power of ten', () => {
    expect([0.7, 3, 240, 251, 1000, 0].map(niceCeil)).toEqual([1, 5, 250, 500, 1000, 1]);
  });
});

describe('buses drawn', () => {
  it('keeps the point of connection and the largest buses, in sheet order', () => {
    const bars = [5, 1, 9, 3, 7].map((q, i) => ({ bus: `B${i}`, absorbed: q, delivered: 0, net: q }));
    expect(busesToDraw(bars, 3).map((b) => b.bus)).toEqual(['B0', 'B2', 'B4']);
    expect(busesToDraw(bars, 10)).toHaveLength(5);
  });
});

describe('chart data with engine errors', () => {
  const err = { value: '#N/A', message: 'KVAR.MOTOR: argument 3 (cos_phi) must be in (0, 1]; got 1.3' };
  const bad = buses.map((r, i) =>
    i === 2 ? ['LV1', 1, 'T1', 'POC', 0.4, 500, err, err, 0, 60, 20, 20, 0, 2] : r,
  );
  it('marks a bus whose kvar is an error as an error, not as 0 kvar', () => {
    const d = readChartData(bad, compensation);
    const lv1 = d.bars.get('day')?.find((b) => b.bus === 'LV1');
    expect(lv1?.error).toBe(`#N/A ${err.message}`);
    // The other case of the same bus computed fine and has no error.
    expect(d.bars.get('night')?.find((b) => b.bus === 'LV1')?.error).toBeUndefined();
  });
  it('says why the point of connection has no triangle when its P or Q is an error', () => {
    const d = readChartData(
      bad.map((r, i) => (i === 1 ? ['POC', 0, null, null, 11, err, 600, 650, -50, 100, -40, 30, -70, 1] : r)),
      compensation,
    );
    expect(d.triangles.has('day')).toBe(false);
    expect(d.triangleErrors.get('day')).toBe(`POC: #N/A ${err.message}`);
  });
  it('keeps buses in error among the bars drawn when there are too many', () => {
    const many: BusBar[] = Array.from({ length: 40 }, (_, i) => ({
      bus: `B${i}`,
      absorbed: 100 + i,
      delivered: 0,
      net: 100 + i,
    }));
    many[5] = { bus: 'B5', absorbed: 0, delivered: 0, net: 0, error: '#N/A x' };
    expect(busesToDraw(many, 10).map((b) => b.bus)).toContain('B5');
  });
});
