// CABLE.R.CU and CABLE.R.AL against IEC 60228 Table 2 (class 2 conductors, maximum DC resistance
// at 20 °C, Ω/km; values from memory, typed here apart from the code), cell by cell: through the
// engine's own functions and through the piecewise classic formula the export writes, which an
// engine without our functions computes. At 70 °C: R20·(1 + α20·50) with α20 = 3.93e-3 /K
// copper, 4.03e-3 /K aluminium (IEC 60287-1-1 Table 1, from memory).
import { afterAll, describe, expect, it } from 'vitest';
import { createEngine, createPlainEngine, readCell, type HyperFormula } from '../../src/engine/index.ts';
import { expandFormula } from '../../src/io/formula/expand.ts';

// [mm², copper, aluminium] (aluminium class 2 from 10 mm²)
const TABLE_2: ReadonlyArray<readonly [number, number, number | null]> = [
  [1.5, 12.1, null],
  [2.5, 7.41, null],
  [4, 4.61, null],
  [6, 3.08, null],
  [10, 1.83, 3.08],
  [16, 1.15, 1.91],
  [25, 0.727, 1.2],
  [35, 0.524, 0.868],
  [50, 0.387, 0.641],
  [70, 0.268, 0.443],
  [95, 0.193, 0.32],
  [120, 0.153, 0.253],
  [150, 0.124, 0.206],
  [185, 0.0991, 0.164],
  [240, 0.0754, 0.125],
  [300, 0.0601, 0.1],
  [400, 0.047, 0.0778],
  [500, 0.0366, 0.0605],
  [630, 0.0283, 0.0469],
  [800, 0.0221, 0.0367],
  [1000, 0.0176, 0.0291],
  [1200, 0.0151, 0.0247],
  [1400, 0.0129, 0.0212],
  [1600, 0.0113, 0.0186],
  [1800, 0.0101, 0.0165],
  [2000, 0.009, 0.0149],
  [2500, 0.0072, 0.0127],
];

const engines: HyperFormula[] = [];
afterAll(() => engines.forEach((e) => e.destroy()));

/** The call in A2 reading area and temperature from A1 and B1, with our functions and expanded. */
function pair(name: string) {
  const call = `=${name}(A1,B1)`;
  const expanded = expandFormula(call);
  if (!expanded.ok) throw new Error(expanded.message);
  const own = createEngine([{ name: 'S', cells: [[], [call]] }]);
  const plain = createPlainEngine([{ name: 'S', cells: [[], [expanded.formula]] }]);
  engines.push(own, plain);
  return (area: number, theta: number | null) =>
    [own, plain].map((hf) => {
      hf.setCellContents({ sheet: hf.getSheetId('S') as number, row: 0, col: 0 }, [[area, theta]]);
      return readCell(hf, 'S', 1, 0);
    });
}

describe.each([
  ['CABLE.R.CU', 1, 3.93e-3],
  ['CABLE.R.AL', 2, 4.03e-3],
] as const)('%s against IEC 60228 Table 2', (name, column, alpha) => {
  const run = pair(name);
  const rows = TABLE_2.filter((r) => r[column] !== null);

  it('every standard size at 20 °C (blank temperature), with and without our functions', () => {
    for (const row of rows) {
      const want = row[column] as number;
      for (const got of run(row[0], null)) expect(got, `${row[0]} mm²`).toEqual({ ok: true, value: want });
    }
  });

  it('every standard size at 70 °C: R20·(1 + α20·50)', () => {
    for (const row of rows) {
      const want = (row[column] as number) * (1 + alpha * 50);
      for (const got of run(row[0], 70)) {
        expect(got.ok, `${row[0]} mm²`).toBe(true);
        expect(got.ok ? got.value : NaN).toBeCloseTo(want, 12);
      }
    }
  });

  it('a size the table does not hold is an error in both, never a neighbour', () => {
    for (const area of [180, 241, 2400])
      for (const got of run(area, null)) expect(got.ok, `${area} mm²`).toBe(false);
  });
});
