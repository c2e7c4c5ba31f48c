// The engine's kept list of array formulas (src/engine/arrayNodes.ts) against the library's own
// search over every graph node (hyperformula 3.5.0's DependencyGraph.arrayFormulaNodes), run in
// the same process: on random sheets with spilling formulas, after random cell edits and row and
// column inserts and removals, both must list the same nodes in the same order, and the sheet
// must hold the same values as when the library searches.
import { afterEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { HyperFormula } from 'hyperformula';
import { createEngine } from '../../src/engine/index.ts';
import { installArrayNodeIndex, useArrayNodeIndex } from '../../src/engine/arrayNodes.ts';

afterEach(() => useArrayNodeIndex(true));

const SIZE = 6;
const colName = (c: number) => String.fromCharCode(65 + c);
const at = (r: number, c: number) => `${colName(c)}${r + 1}`;

/**
 * A number, a plain formula, or one that spills down (TRANSPOSE of part of the first row, which
 * holds numbers only: the library cannot build a sheet whose spills read other spills).
 */
const cellArb = fc.oneof(
  fc.integer({ min: -9, max: 9 }),
  fc.tuple(fc.nat(SIZE - 1), fc.nat(SIZE - 1)).map(([r, c]) => `=${at(r, c)}*2`),
  fc
    .tuple(fc.nat(SIZE - 1), fc.integer({ min: 1, max: 3 }))
    .map(([c, n]) => `=TRANSPOSE(${at(0, c)}:${at(0, Math.min(SIZE - 1, c + n))})`),
);
const numberRowArb = fc.array(fc.integer({ min: -9, max: 9 }), { minLength: SIZE, maxLength: SIZE });

type Op =
  | { kind: 'set'; r: number; c: number; v: number | string }
  | { kind: 'addRows' | 'removeRows' | 'addColumns' | 'removeColumns'; at: number; n: number };

const opArb: fc.Arbitrary<Op> = fc.oneof(
  fc
    .tuple(fc.nat(SIZE - 1), fc.nat(SIZE - 1), cellArb)
    .map(([r, c, v]) => ({ kind: 'set' as const, r, c, v })),
  fc
    .tuple(
      fc.constantFrom('addRows', 'removeRows', 'addColumns', 'removeColumns') as fc.Arbitrary<
        'addRows' | 'removeRows' | 'addColumns' | 'removeColumns'
      >,
      fc.nat(SIZE - 1),
      fc.integer({ min: 1, max: 2 }),
    )
    .map(([kind, at, n]) => ({ kind, at, n })),
);

function apply(hf: HyperFormula, op: Op): void {
  if (op.kind === 'set') hf.setCellContents({ sheet: 0, row: op.r, col: op.c }, op.v);
  else hf[op.kind](0, [op.at, op.n]);
}

interface Internals {
  arrayFormulaNodes(): Iterable<{ idInGraph?: number }>;
}
const internals = (hf: HyperFormula) => (hf as unknown as { dependencyGraph: Internals }).dependencyGraph;

/** Node ids listed, by the kept list or by the library's search. */
function listed(hf: HyperFormula, kept: boolean): (number | undefined)[] {
  useArrayNodeIndex(kept);
  try {
    return [...internals(hf).arrayFormulaNodes()].map((n) => n.idInGraph);
  } finally {
    useArrayNodeIndex(true);
  }
}

/** The message `f` throws, or '' when it does not. */
function failure(f: () => void): string {
  try {
    f();
    return '';
  } catch (e) {
    return e instanceof Error ? e.message.slice(0, 40) : String(e);
  }
}

const values = (hf: HyperFormula) =>
  hf
    .getSheetValues(0)
    .flat()
    .map((v) => (typeof v === 'object' && v !== null && 'type' in v ? `#${String(v.type)}` : v));

function sheetOf(cells: readonly (number | string)[]): (number | string)[][] {
  return Array.from({ length: SIZE }, (_, r) => cells.slice(r * SIZE, (r + 1) * SIZE));
}

describe('the kept list of array formulas', () => {
  it('is installed on this version of the library', () => {
    expect(installArrayNodeIndex()).toBe(true);
  });

  it('lists what the library finds, in its order, after random edits', () => {
    let spilled = 0;
    fc.assert(
      fc.property(
        numberRowArb,
        fc.array(cellArb, { minLength: SIZE * (SIZE - 1), maxLength: SIZE * (SIZE - 1) }),
        fc.array(opArb, { minLength: 1, maxLength: 12 }),
        (first, cells, ops) => {
          const sheet = [{ name: 'S', cells: sheetOf([...first, ...cells]) }];
          const ours = createEngine(sheet);
          useArrayNodeIndex(false);
          const theirs = createEngine(sheet);
          useArrayNodeIndex(true);
          try {
            expect(listed(ours, true)).toEqual(listed(ours, false));
            for (const op of ops) {
              // The library itself fails on some sequences of overlapping spills ("Unknown
              // node", "Unknown array"): the kept list must then fail alike, and the run ends.
              const ourError = failure(() => apply(ours, op));
              useArrayNodeIndex(false);
              const theirError = failure(() => apply(theirs, op));
              useArrayNodeIndex(true);
              expect(ourError).toBe(theirError);
              if (theirError) return;
              const kept = listed(ours, true);
              expect(kept).toEqual(listed(ours, false));
              spilled += kept.length;
              expect(values(ours)).toEqual(values(theirs));
            }
          } finally {
            ours.destroy();
            theirs.destroy();
          }
        },
      ),
      { numRuns: 60 },
    );
    // The runs must have held array formulas to compare, not only plain cells.
    expect(spilled).toBeGreaterThan(50);
  });

  it('finds a spilling formula typed after the workbook was opened, and forgets a removed one', () => {
    const hf = createEngine([{ name: 'S', cells: [[1, 2, 3]] }]);
    try {
      expect(listed(hf, true)).toEqual([]);
      hf.setCellContents({ sheet: 0, row: 2, col: 0 }, '=TRANSPOSE(A1:C1)');
      expect(listed(hf, true)).toHaveLength(1);
      expect(hf.getCellValue({ sheet: 0, row: 4, col: 0 })).toBe(3);
      hf.addRows(0, [1, 1]);
      expect(hf.getCellValue({ sheet: 0, row: 5, col: 0 })).toBe(3);
      hf.setCellContents({ sheet: 0, row: 3, col: 0 }, null);
      expect(listed(hf, true)).toEqual([]);
      expect(listed(hf, false)).toEqual([]);
    } finally {
      hf.destroy();
    }
  });
});
