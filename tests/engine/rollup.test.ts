// BUS.SUM, BUS.SUM.ABS and BUS.SUM.DEL: the kernel on its own, and in the engine against the
// engine's own SUMIF / SUMIFS (an independent implementation of the same sums: the export writes
// those), for random tables, bus names differing in case, numbers as names, text and errors.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CellError, ErrorType } from 'hyperformula';
import { createEngine, createPlainEngine, readCell } from '../../src/engine/index.ts';
import { sumForBus, type Cell, type KeyedColumn } from '../../src/engine/rollupPlugin.ts';

const pair = (keys: Cell[], values: Cell[]): KeyedColumn => ({
  height: keys.length,
  key: (r) => keys[r] ?? null,
  value: (r) => values[r] ?? null,
});

describe('sumForBus (kernel)', () => {
  const a = pair(['MCC1', 'MCC2', 'mcc1', null, 'MCC1'], [10, 5, -4, 100, 'text']);
  it('adds the rows naming the bus, ignoring case; blanks and text count as nothing', () => {
    expect(sumForBus('MCC1', [a], 'all')).toBe(6);
    expect(sumForBus('mcc2', [a], 'all')).toBe(5);
    expect(sumForBus('EMPTY', [a], 'all')).toBe(0);
  });
  it('splits absorbed (positive) and delivered (size of the negative)', () => {
    expect(sumForBus('MCC1', [a], 'absorbed')).toBe(10);
    expect(sumForBus('MCC1', [a], 'delivered')).toBe(4);
  });
  it('adds over several pairs', () => {
    const b = pair(['MCC1'], [2.5]);
    expect(sumForBus('MCC1', [a, b], 'all')).toBe(8.5);
  });
  it('an error on a matching row is the result; on another bus it does not matter', () => {
    const err = new CellError(ErrorType.NA, 'bad row');
    const c = pair(['A', 'B'], [1, err]);
    expect(sumForBus('B', [c], 'all')).toBe(err);
    expect(sumForBus('A', [c], 'all')).toBe(1);
  });
  it('a number names the bus of its text; a blank bus sums nothing', () => {
    const c = pair([1, '1', 2], [3, 4, 5]);
    expect(sumForBus(1, [c], 'all')).toBe(7);
    expect(sumForBus(null, [c], 'all')).toBe(0);
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
          const args = `Items!$A$1:$A$${n1},Items!$B$1:$B$${n1},More!$A$1:$A$${n2},More!$B$1:$B$${n2}`;
          const own = createEngine([
            ...data,
            {
              name: 'Buses',
              cells: list.map((b, i) => [
                b,
                `=BUS.SUM($A${i + 1},${args})`,
                `=BUS.SUM.ABS($A${i + 1},${args})`,
                `=BUS.SUM.DEL($A${i + 1},${args})`,
              ]),
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

  it('says which argument does not match in size', () => {
    const hf = createEngine([
      {
        name: 'Items',
        cells: [
          ['A', 1],
          ['A', 2],
        ],
      },
      { name: 'Buses', cells: [['A', '=BUS.SUM($A1,Items!$A$1:$A$2,Items!$B$1:$B$1)']] },
    ]);
    const r = readCell(hf, 'Buses', 0, 1);
    expect(r.ok).toBe(false);
    if (!r.ok)
      expect(r.message).toContain(
        'argument 3 (values) has 1 rows but argument 2 (bus column on Items) has 2',
      );
  });
});
