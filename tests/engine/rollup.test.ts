// BUS.SUM, BUS.SUM.ABS and BUS.SUM.DEL: the kernel on its own, and in the engine against the
// engine's own SUMIF / SUMIFS (an independent implementation of the same sums: the export writes
// those), for random tables, bus names differing in case, text and errors. The live workbook
// passes each bus the runs of rows that name it; here the test picks those rows itself.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CellError, ErrorType } from 'hyperformula';
import { createEngine, createPlainEngine, readCell } from '../../src/engine/index.ts';
import { sumOfRuns, type Cell, type ValueColumn } from '../../src/engine/rollupPlugin.ts';

const column = (values: Cell[]): ValueColumn => ({
  height: values.length,
  value: (r) => values[r] ?? null,
});

describe('sumOfRuns (kernel)', () => {
  const a = column([1, -4, 5, null, 'n/a', true]);
  it('adds the numbers; blanks, text and booleans count as nothing', () => {
    expect(sumOfRuns([a], 'all')).toBe(2);
    expect(sumOfRuns([], 'all')).toBe(0);
  });
  it('splits absorbed (positive) and delivered (size of the negative)', () => {
    expect(sumOfRuns([a], 'absorbed')).toBe(6);
    expect(sumOfRuns([a], 'delivered')).toBe(4);
  });
  it('adds over several columns', () => {
    expect(sumOfRuns([a, column([2.5]), column([-1, 3])], 'all')).toBe(6.5);
  });
  it('an error value is the result: the total cannot be known', () => {
    const err = new CellError(ErrorType.DIV_BY_ZERO);
    expect(sumOfRuns([a, column([1, err, 2])], 'all')).toBe(err);
    expect(sumOfRuns([column([err]), a], 'absorbed')).toBe(err);
  });
});

describe('BUS.SUM in the engine equals SUMIF / SUMIFS of the plain engine', () => {
  const busNames = ['MV', 'LV1', 'LV2', 'lv2', 'PUMP'];
  const row = fc.tuple(
    fc.constantFrom(...busNames, null),
    fc.oneof(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.constant(null), fc.constant('n/a')),
  );

  it('for random tables on two sheets, every part', () => {
    fc.assert(
      fc.property(
        fc.array(row, { minLength: 1, maxLength: 40 }),
        fc.array(row, { minLength: 1, maxLength: 15 }),
        (t1, t2) => {
          const list = ['MV', 'LV1', 'LV2', 'PUMP', 'NONE'];
          const items = (t: typeof t1) => t.map(([b, x]) => [b, x]);
          const data = [
            { name: 'Items', cells: items(t1) },
            { name: 'More', cells: items(t2) },
          ];
          const [n1, n2] = [t1.length, t2.length];
          // The rows of each table that name the bus (ignoring case, as SUMIF does): consecutive
          // rows as one range, a lone row as a cell, as the live workbook writes them.
          const runs = (bus: string) =>
            (
              [
                ['Items', t1],
                ['More', t2],
              ] as const
            ).flatMap(([sheet, t]) => {
              const refs: string[] = [];
              let first = -1;
              t.forEach(([b], r) => {
                const hit = b !== null && b.toUpperCase() === bus.toUpperCase();
                const nextHit = t[r + 1]?.[0]?.toUpperCase() === bus.toUpperCase();
                if (hit && first < 0) first = r;
                if (hit && !nextHit) {
                  refs.push(first === r ? `${sheet}!$B$${r + 1}` : `${sheet}!$B$${first + 1}:$B$${r + 1}`);
                  first = -1;
                }
              });
              return refs;
            });
          const call = (fn: string, bus: string) => {
            const args = runs(bus);
            return args.length === 0 ? '=0' : `=${fn}(${args.join(',')})`;
          };
          const own = createEngine([
            ...data,
            {
              name: 'Buses',
              cells: list.map((b) => [b, call('BUS.SUM', b), call('BUS.SUM.ABS', b), call('BUS.SUM.DEL', b)]),
            },
          ]);
          const sumif = (r: number, extra?: string) =>
            ['Items', 'More']
              .map((s, k) => {
                const n = k === 0 ? n1 : n2;
                const keys = `${s}!$A$1:$A$${n}`;
                const vals = `${s}!$B$1:$B$${n}`;
                return extra
                  ? `SUMIFS(${vals},${keys},$A${r},${vals},"${extra}")`
                  : `SUMIF(${keys},$A${r},${vals})`;
              })
              .join('+');
          const plain = createPlainEngine([
            ...data,
            {
              name: 'Buses',
              cells: list.map((b, i) => [
                b,
                `=${sumif(i + 1)}`,
                `=${sumif(i + 1, '>0')}`,
                `=-(${sumif(i + 1, '<0')})`,
              ]),
            },
          ]);
          for (let r = 0; r < list.length; r++) {
            for (let c = 1; c <= 3; c++) {
              const x = readCell(own, 'Buses', r, c);
              const y = readCell(plain, 'Buses', r, c);
              expect(x.ok && y.ok, `row ${r + 1} col ${c}`).toBe(true);
              if (x.ok && y.ok) expect(x.value as number).toBeCloseTo(y.value as number, 6);
            }
          }
        },
      ),
      { numRuns: 30 },
    );
  });

  it('runs of several rows are ranges; a range two columns wide is refused, naming argument and sheet', () => {
    const hf = createEngine([
      {
        name: 'Items',
        cells: [
          ['A', 1],
          ['A', -2],
          ['B', 4],
        ],
      },
      {
        name: 'Buses',
        cells: [['A', '=BUS.SUM.DEL(Items!$B$1:$B$2,Items!$B$3)', '=BUS.SUM(Items!$B$1,Items!$A$1:$B$2)']],
      },
    ]);
    const ok = readCell(hf, 'Buses', 0, 1);
    expect(ok.ok && ok.value).toBe(2);
    const r = readCell(hf, 'Buses', 0, 2);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain('argument 2 (values on Items) must be one column; got 2 columns');
  });
});
