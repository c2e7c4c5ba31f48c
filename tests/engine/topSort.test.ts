// The engine's recalculation walk over typed arrays (src/engine/topSort.ts) against the
// library's own: on random workbooks, cycles and ranges included, both must visit, order and
// recompute exactly the same cells, and every edit must leave the same values. The reference
// here is the library's own method (hyperformula 3.5.0's Tarjan walk), run in the same process.
import { afterEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { HyperFormula } from 'hyperformula';
import { createEngine } from '../../src/engine/index.ts';
import { installFastTopSort, useFastTopSort } from '../../src/engine/topSort.ts';

afterEach(() => useFastTopSort(true));

const SIZE = 5; // a 5 × 5 sheet: small enough for many cycles, big enough for long chains
const colName = (c: number) => String.fromCharCode(65 + c);
const ref = (i: number) => `${colName(i % SIZE)}${Math.floor(i / SIZE) + 1}`;

/** One cell: a number, or a formula over one to three other cells or a range (maybe itself). */
const cellArb = fc.oneof(
  fc.integer({ min: -50, max: 50 }),
  fc
    .array(fc.integer({ min: 0, max: SIZE * SIZE - 1 }), { minLength: 1, maxLength: 3 })
    .map((refs) => `=${refs.map(ref).join('+')}+1`),
  fc
    .tuple(fc.integer({ min: 0, max: SIZE * SIZE - 1 }), fc.integer({ min: 0, max: SIZE * SIZE - 1 }))
    .map(([a, b]) => `=SUM(${ref(Math.min(a, b))}:${ref(Math.max(a, b))})`),
);
const sheetArb = fc.array(cellArb, { minLength: SIZE * SIZE, maxLength: SIZE * SIZE });
const editArb = fc.tuple(fc.integer({ min: 0, max: SIZE * SIZE - 1 }), cellArb);

function rows(cells: readonly (number | string)[]): (number | string)[][] {
  return Array.from({ length: SIZE }, (_, r) => cells.slice(r * SIZE, (r + 1) * SIZE));
}

/** Every value of the sheet, errors by their type (a cycle reads #CYCLE!). */
function values(hf: HyperFormula): unknown[] {
  return hf
    .getSheetValues(0)
    .flat()
    .map((v) => (typeof v === 'object' && v !== null && 'type' in v ? `#${String(v.type)}` : v));
}

/** Run `f` with the given walk in place, restoring ours afterwards. */
function withWalk<T>(fast: boolean, f: () => T): T {
  useFastTopSort(fast);
  try {
    return f();
  } finally {
    useFastTopSort(true);
  }
}

interface Graph {
  getNodes(): { idInGraph?: number }[];
  getTopSortedWithSccSubgraphFrom(
    modified: { idInGraph?: number }[],
    recompute: (n: { idInGraph?: number }) => boolean,
    onCycle: (n: { idInGraph?: number }) => void,
  ): { sorted: { idInGraph?: number }[]; cycled: { idInGraph?: number }[] };
}
const graphOf = (hf: HyperFormula) =>
  (hf as unknown as { dependencyGraph: { graph: Graph } }).dependencyGraph.graph;

describe('the recalculation walk over typed arrays', () => {
  it('is in place for the pinned engine version (an upgrade that moves it fails here)', () => {
    expect(installFastTopSort()).toBe(true);
  });

  it('visits, orders and recomputes the same cells as the library on random graphs', () => {
    fc.assert(
      fc.property(
        sheetArb,
        fc.array(fc.nat(), { minLength: 1, maxLength: 6 }),
        fc.nat(),
        (cells, picks, salt) => {
          const hf = createEngine([{ name: 'S', cells: rows(cells) }]);
          try {
            const graph = graphOf(hf);
            const nodes = graph.getNodes();
            const modified = picks.map((k) => nodes[k % nodes.length] as { idInGraph?: number });
            const run = (fast: boolean) =>
              withWalk(fast, () => {
                const log: string[] = [];
                // "Did the value change?" answered by a fixed rule, so both walks get the same answers.
                const recompute = (n: { idInGraph?: number }) => {
                  log.push(`r${n.idInGraph}`);
                  return ((n.idInGraph ?? 0) + salt) % 3 !== 0;
                };
                const onCycle = (n: { idInGraph?: number }) => void log.push(`c${n.idInGraph}`);
                const out = graph.getTopSortedWithSccSubgraphFrom([...modified], recompute, onCycle);
                return {
                  log,
                  sorted: out.sorted.map((n) => n.idInGraph),
                  cycled: out.cycled.map((n) => n.idInGraph),
                };
              });
            const ours = run(true);
            expect(ours).toEqual(run(false));
            // A second walk on the same graph starts clean (the scratch state was cleared).
            expect(run(true)).toEqual(ours);
          } finally {
            hf.destroy();
          }
        },
      ),
      { numRuns: 150 },
    );
  });

  it('leaves the same values as the library after random edits, cycles included', () => {
    fc.assert(
      fc.property(sheetArb, fc.array(editArb, { minLength: 1, maxLength: 12 }), (cells, edits) => {
        const ours = withWalk(true, () => createEngine([{ name: 'S', cells: rows(cells) }]));
        const theirs = withWalk(false, () => createEngine([{ name: 'S', cells: rows(cells) }]));
        try {
          expect(values(ours)).toEqual(values(theirs));
          for (const [at, content] of edits) {
            const address = { sheet: 0, row: Math.floor(at / SIZE), col: at % SIZE };
            withWalk(true, () => ours.setCellContents(address, content));
            withWalk(false, () => theirs.setCellContents(address, content));
            expect(values(ours)).toEqual(values(theirs));
          }
        } finally {
          ours.destroy();
          theirs.destroy();
        }
      }),
      { numRuns: 100 },
    );
  });

  it('recalculates a chain and a range sum after an edit', () => {
    const hf = createEngine([{ name: 'S', cells: [[1, '=A1+1', '=B1*2', '=SUM(A1:C1)']] }]);
    try {
      hf.setCellContents({ sheet: 0, row: 0, col: 0 }, 10);
      // By hand: B1 = 11, C1 = 22, D1 = 10 + 11 + 22 = 43.
      expect(hf.getSheetValues(0)[0]).toEqual([10, 11, 22, 43]);
    } finally {
      hf.destroy();
    }
  });
});
