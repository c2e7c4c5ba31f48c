// BUS.SUMS and BUS.SUMS.SPLIT: the kernel on its own, and in the engine against the engine's own
// SUMIF/SUMIFS (a conditional sum every spreadsheet program has) on random tables.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CellError, ErrorType } from 'hyperformula';
import { createEngine, createPlainEngine, readCell } from '../../src/engine/index.ts';
import { sumByBus, type Cell, type KeyedColumns } from '../../src/engine/rollupPlugin.ts';

function pair(keys: Cell[], values: Cell[][]): KeyedColumns {
  return {
    height: keys.length,
    width: values[0]?.length ?? 0,
    key: (r) => keys[r] ?? null,
    value: (r, c) => values[r]?.[c] ?? null,
  };
}

const rows = (r: ReturnType<typeof sumByBus>) => {
  if (!r.ok) throw new Error(r.message);
  return r.rows;
};

describe('sumByBus (kernel)', () => {
  it('sums per bus over several tables, ignoring case, text and blanks', () => {
    const a = pair(
      ['MCC1', 'mcc1', 'MCC2', null, ''],
      [
        [1, 10],
        [2, 'x'],
        [4, 40],
        [8, 80],
        [16, 160],
      ],
    );
    const b = pair(
      ['Mcc2', 'MCC1'],
      [
        [100, null],
        [true, 1000],
      ],
    );
    expect(rows(sumByBus(['MCC1', 'MCC2', 'EMPTY'], [a, b], false))).toEqual([
      [3, 1010],
      [104, 40],
      [0, 0],
    ]);
  });

  it('refuses a row that names a bus outside the list, saying where (SUMIF would drop it silently)', () => {
    const a: KeyedColumns = { ...pair(['MCC1', 'MCC9'], [[1], [2]]), where: (r) => `Motors row ${r + 40}` };
    expect(sumByBus(['MCC1'], [a], false)).toEqual({
      ok: false,
      message:
        'Motors row 41 names bus "MCC9", which is not among the buses summed here (MCC1); correct the bus name, or rebuild the workbook if the item moved to another bus',
    });
  });

  it('splits into the positive part and the size of the negative part', () => {
    const a = pair(['A', 'A', 'B', 'A'], [[5], [-2], [-7], [0]]);
    expect(rows(sumByBus(['A', 'B'], [a], true))).toEqual([
      [5, 2],
      [0, 7],
    ]);
  });

  it('keeps an error on the bus it belongs to', () => {
    const err = new CellError(ErrorType.NA, 'bad row');
    const a = pair(
      ['A', 'B', 'B'],
      [
        [1, 1],
        [err, 2],
        [3, 3],
      ],
    );
    const out = rows(sumByBus(['A', 'B'], [a], false));
    expect(out[0]).toEqual([1, 1]);
    expect(out[1]?.[0]).toBe(err);
    expect(out[1]?.[1]).toBe(5);
    const split = rows(sumByBus(['A', 'B'], [a], true));
    expect(split[1]?.slice(0, 2)).toEqual([err, err]);
  });

  it('matches a bus name the engine read as a number', () => {
    expect(rows(sumByBus([1, '2'], [pair([1, 2, '1'], [[1], [2], [4]])], false))).toEqual([[5], [2]]);
  });

  it('gives every row of a bus listed twice the same totals', () => {
    expect(rows(sumByBus(['A', 'a'], [pair(['A'], [[3]])], false))).toEqual([[3], [3]]);
  });
});

describe('BUS.SUMS in the engine equals SUMIF / SUMIFS', () => {
  const busNames = ['MV', 'LV1', 'LV2', 'lv2', 'PUMP'];
  const row = fc.tuple(
    fc.constantFrom(...busNames, null),
    fc.double({ min: -1e4, max: 1e4, noNaN: true }),
    fc.integer({ min: -500, max: 500 }),
  );

  it('for random tables (sum and split, two tables)', () => {
    fc.assert(
      fc.property(
        fc.array(row, { minLength: 1, maxLength: 40 }),
        fc.array(row, { minLength: 1, maxLength: 15 }),
        (t1, t2) => {
          const list = ['MV', 'LV1', 'LV2', 'PUMP', 'NONE'];
          const items = (t: typeof t1) => t.map(([b, x, y]) => [b, x, y]);
          const sheets = [
            { name: 'Items', cells: items(t1) },
            { name: 'More', cells: items(t2) },
            { name: 'Buses', cells: list.map((b) => [b]) },
          ];
          const n1 = t1.length,
            n2 = t2.length,
            nb = list.length;
          const own = createEngine([
            ...sheets.slice(0, 2),
            {
              name: 'Buses',
              cells: list.map((b, i) => [
                b,
                i === 0
                  ? `=BUS.SUMS($A$1:$A$${nb},Items!$A$1:$A$${n1},Items!$B$1:$C$${n1},More!$A$1:$A$${n2},More!$B$1:$C$${n2})`
                  : null,
                null,
                i === 0
                  ? `=BUS.SUMS.SPLIT($A$1:$A$${nb},Items!$A$1:$A$${n1},Items!$B$1:$C$${n1},More!$A$1:$A$${n2},More!$B$1:$C$${n2})`
                  : null,
                null,
                null,
                null,
              ]),
            },
          ]);
          const sumif = (col: string, extra?: string) => (r: number) =>
            ['Items', 'More']
              .map((s, k) => {
                const n = k === 0 ? n1 : n2;
                const keys = `${s}!$A$1:$A$${n}`,
                  vals = `${s}!$${col}$1:$${col}$${n}`;
                return extra
                  ? `SUMIFS(${vals},${keys},$A${r},${vals},"${extra}")`
                  : `SUMIF(${keys},$A${r},${vals})`;
              })
              .join('+');
          const plain = createPlainEngine([
            ...sheets.slice(0, 2),
            {
              name: 'Buses',
              cells: list.map((b, i) => [
                b,
                `=${sumif('B')(i + 1)}`,
                `=${sumif('C')(i + 1)}`,
                `=${sumif('B', '>0')(i + 1)}`,
                `=-(${sumif('B', '<0')(i + 1)})`,
                `=${sumif('C', '>0')(i + 1)}`,
                `=-(${sumif('C', '<0')(i + 1)})`,
              ]),
            },
          ]);
          for (let r = 0; r < nb; r++) {
            for (let c = 1; c <= 6; c++) {
              const x = readCell(own, 'Buses', r, c),
                y = readCell(plain, 'Buses', r, c);
              if (!x.ok || !y.ok)
                throw new Error(`row ${r} col ${c}: ${JSON.stringify(x)} ${JSON.stringify(y)}`);
              const a = x.value as number,
                b = y.value as number;
              if (Math.abs(a - b) > 1e-9 * Math.max(1, Math.abs(a), Math.abs(b)))
                throw new Error(`row ${r} col ${c}: BUS.SUMS ${a}, SUMIF ${b}`);
            }
          }
        },
      ),
      { numRuns: 15 },
    );
  });

  it('spills one row per bus and updates after an edit', () => {
    const hf = createEngine([
      {
        name: 'Items',
        cells: [
          ['A', 1],
          ['B', 2],
          ['A', 3],
        ],
      },
      {
        name: 'Buses',
        cells: [
          ['A', '=BUS.SUMS(A1:A2,Items!A1:A3,Items!B1:B3)'],
          ['B', null],
        ],
      },
    ]);
    expect([readCell(hf, 'Buses', 0, 1), readCell(hf, 'Buses', 1, 1)]).toEqual([
      { ok: true, value: 4 },
      { ok: true, value: 2 },
    ]);
    hf.setCellContents({ sheet: hf.getSheetId('Items') as number, row: 1, col: 0 }, [['a']]); // moved to bus A
    expect([readCell(hf, 'Buses', 0, 1), readCell(hf, 'Buses', 1, 1)]).toEqual([
      { ok: true, value: 6 },
      { ok: true, value: 0 },
    ]);
  });

  it('names the sheet and row of an item on a bus outside the list', () => {
    const hf = createEngine([
      {
        name: 'Items',
        cells: [
          ['A', 1],
          ['B', 2],
        ],
      },
      { name: 'Buses', cells: [['A', '=BUS.SUMS(A1:A1,Items!A1:A2,Items!B1:B2)']] },
    ]);
    expect(readCell(hf, 'Buses', 0, 1)).toEqual({
      ok: false,
      error: '#N/A',
      message:
        'BUS.SUMS: Items row 2 names bus "B", which is not among the buses summed here (A); correct the bus name, or rebuild the workbook if the item moved to another bus',
    });
  });

  it('reads a named range through the engine when an argument is not a plain range', () => {
    const hf = createEngine([
      {
        name: 'Items',
        cells: [
          ['A', 1],
          ['B', 2],
          ['A', 3],
        ],
      },
      { name: 'Buses', cells: [['A'], ['B']] },
    ]);
    hf.addNamedExpression('ItemBuses', '=Items!$A$1:$A$3');
    hf.setCellContents({ sheet: hf.getSheetId('Buses') as number, row: 0, col: 1 }, [
      ['=BUS.SUMS(A1:A2,ItemBuses,Items!B1:B3)'],
    ]);
    expect([readCell(hf, 'Buses', 0, 1), readCell(hf, 'Buses', 1, 1)]).toEqual([
      { ok: true, value: 4 },
      { ok: true, value: 2 },
    ]);
  });

  it('says what is wrong with the arguments', () => {
    const hf = createEngine([
      {
        name: 'S',
        cells: [
          ['A', 1, 2],
          ['B', 3, 4],
          ['C', 5, 6],
        ],
      },
    ]);
    const at = (f: string) => {
      hf.setCellContents({ sheet: 0, row: 5, col: 0 }, [[f]]);
      return readCell(hf, 'S', 5, 0);
    };
    expect(at('=BUS.SUMS(A1:A3,A1:A3)')).toMatchObject({
      ok: false,
      message: 'BUS.SUMS: takes a bus list and then pairs of (bus column, values); got 2 arguments',
    });
    expect(at('=BUS.SUMS(A1:B3,A1:A3,B1:B3)')).toMatchObject({
      ok: false,
      message: 'BUS.SUMS: argument 1 (bus list) must be one column; got 2 columns',
    });
    expect(at('=BUS.SUMS(A1:A3,A1:A3,B1:B2)')).toMatchObject({
      ok: false,
      message:
        'BUS.SUMS: argument 3 (values) has 2 rows but argument 2 (bus column) has 3; they must cover the same rows',
    });
    expect(at('=BUS.SUMS.SPLIT(A1:A3,A1:A3,B1:C3,A1:A3,B1:B3)')).toMatchObject({
      ok: false,
      message:
        'BUS.SUMS.SPLIT: argument 5 (values) has 1 columns but argument 3 has 2; every values range must have as many columns',
    });
  });

  it('is unknown to the plain engine (so the portable flavour must not use it)', () => {
    const hf = createPlainEngine([{ name: 'S', cells: [['A', 1], ['=BUS.SUMS(A1:A1,A1:A1,B1:B1)']] }]);
    expect(readCell(hf, 'S', 1, 0)).toMatchObject({ ok: false, error: '#NAME?' });
  });
});
