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
  it('counts the error cells of the watched sheet and follows edits', () => {
    const s = WorkbookSession.fromDoc(doc);
    const t = new ErrorTracker(s.engine);
    t.watch(0);
    // KVAR.LOAD with cos φ 1.2 is out of its domain; COSPHI(0.8, 0) is fine.
    expect(t.list()).toEqual([[1, 1]]);
    s.setCells(0, [{ row: 1, col: 0, content: 0.9 }]);
    expect(t.needsScan).toBe(false);
    expect(t.count()).toBe(0);
    s.setCells(0, [{ row: 0, col: 0, content: 0 }]);
    expect(t.list()).toEqual([[0, 1]]);
    t.watch(1);
    expect(t.list()).toEqual([[0, 0]]);
    t.dispose();
  });

  it('scans again after rows move', () => {
    const s = WorkbookSession.fromDoc(doc);
    const t = new ErrorTracker(s.engine);
    t.watch(0);
    expect(t.list()).toEqual([[1, 1]]);
    s.insertRows(0, 0, 2);
    t.invalidate();
    expect(t.list()).toEqual([[3, 1]]);
  });
});
