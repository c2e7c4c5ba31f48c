// The write-ahead record of edits: which rows changed, and replaying entries onto a saved state.
import { describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { changedRows, replay, type JournalRecord } from '../../src/ui/storage/journal.ts';

const doc: WorkbookDoc = {
  format: 'kvar-ledger-workbook',
  version: 1,
  title: 'Plant',
  sheets: [
    {
      name: 'Loads',
      cells: [
        ['tag', 'P'],
        ['M1', 10],
        ['M2', 20],
      ],
    },
    { name: 'Notes', cells: [['a']] },
  ],
};

const rows = (
  seq: number,
  sheet: string,
  length: number,
  changed: Array<[number, unknown[]]>,
): JournalRecord => ({
  seq,
  entry: { kind: 'rows', sheet, length, rows: changed as never },
});

describe('changedRows', () => {
  it('finds the rows replaced or changed, by identity first', () => {
    const before = doc.sheets[0]!.cells;
    const after = [before[0]!, ['M1', 11], before[2]!, ['M3', 30]];
    expect(changedRows(before, after)).toEqual([
      [1, ['M1', 11]],
      [3, ['M3', 30]],
    ]);
    // A new array with the same values is no change.
    expect(
      changedRows(
        before,
        before.map((r) => [...r]),
      ),
    ).toEqual([]);
    // Without a record of the rows before, every row is written.
    expect(changedRows(undefined, before)).toHaveLength(3);
  });
});

describe('replay', () => {
  it('applies the entries right after the saved state, in order', () => {
    const r = replay(doc, 4, [
      { seq: 6, entry: { kind: 'title', title: 'Plant B' } },
      rows(5, 'Loads', 4, [
        [1, ['M1', 11]],
        [3, ['M3', 30]],
      ]),
      rows(7, 'Loads', 2, []),
    ]);
    expect(r.applied).toBe(3);
    expect(r.lastSeq).toBe(7);
    expect(r.doc.title).toBe('Plant B');
    expect(r.doc.sheets[0]!.cells).toEqual([
      ['tag', 'P'],
      ['M1', 11],
    ]);
    expect(r.doc.sheets[1]).toBe(doc.sheets[1]);
    // The saved state itself is not modified.
    expect(doc.sheets[0]!.cells).toHaveLength(3);
  });

  it('stops at a gap: nothing after a skipped number is applied', () => {
    const r = replay(doc, 4, [
      rows(5, 'Loads', 3, [[1, ['M1', 11]]]),
      rows(7, 'Loads', 3, [[2, ['M2', 99]]]),
    ]);
    expect(r.applied).toBe(1);
    expect(r.doc.sheets[0]!.cells[2]).toEqual(['M2', 20]);
  });

  it('ignores entries the saved state already holds, and stops at one that does not fit', () => {
    expect(replay(doc, 4, [rows(3, 'Loads', 3, [[1, ['old', 0]]])]).applied).toBe(0);
    const r = replay(doc, 0, [rows(1, 'Gone', 1, []), { seq: 2, entry: { kind: 'title', title: 'x' } }]);
    expect(r.applied).toBe(0);
    expect(r.doc).toBe(doc);
  });
});
