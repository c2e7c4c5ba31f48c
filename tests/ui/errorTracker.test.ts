import { describe, expect, it } from 'vitest';
import { ErrorTracker } from '../../src/ui/app/errorTracker.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';

const doc = {
  format: 'kvar-ledger-workbook' as const,
  version: 1 as const,
  title: 't',
  sheets: [
    {
      name: 'A',
      cells: [
        [0.8, '=COSPHI(A1,0)'],
        [1.2, '=KVAR.LOAD(10,A2)'],
      ],
    },
    { name: 'B', cells: [['=1/0']] },
  ],
};

describe('error tracker', () => {
  it('counts the error cells of the whole workbook and follows edits', () => {
    const s = WorkbookSession.fromDoc(doc);
    const t = new ErrorTracker(s.engine);
    // KVAR.LOAD with cos φ 1.2 is out of its domain; COSPHI(0.8, 0) is fine; B has 1/0.
    expect(t.list([0, 1])).toEqual([
      { sheet: 0, row: 1, col: 1 },
      { sheet: 1, row: 0, col: 0 },
    ]);
    s.setCells(0, [{ row: 1, col: 0, content: 0.9 }]);
    expect(t.needsScan).toBe(false);
    expect(t.count()).toBe(1);
    s.setCells(0, [{ row: 0, col: 0, content: 0 }]);
    expect(t.list([0, 1])[0]).toEqual({ sheet: 0, row: 0, col: 1 });
    expect(t.count()).toBe(2);
    t.dispose();
  });

  it('finds the next error in tab order, across sheets, wrapping round', () => {
    const s = WorkbookSession.fromDoc(doc);
    const t = new ErrorTracker(s.engine);
    expect(t.next([0, 1], { sheet: 0, row: 0, col: 0 })).toEqual({ sheet: 0, row: 1, col: 1 });
    expect(t.next([0, 1], { sheet: 0, row: 1, col: 1 })).toEqual({ sheet: 1, row: 0, col: 0 });
    expect(t.next([0, 1], { sheet: 1, row: 0, col: 0 })).toEqual({ sheet: 0, row: 1, col: 1 });
    // Sheet B first in the tab order.
    expect(t.next([1, 0], { sheet: 1, row: 0, col: 0 })).toEqual({ sheet: 0, row: 1, col: 1 });
  });

  it('scans again after rows move', () => {
    const s = WorkbookSession.fromDoc(doc);
    const t = new ErrorTracker(s.engine);
    expect(t.list([0, 1])[0]).toEqual({ sheet: 0, row: 1, col: 1 });
    s.insertRows(0, 0, 2);
    t.invalidate();
    expect(t.list([0, 1])[0]).toEqual({ sheet: 0, row: 3, col: 1 });
  });
});
