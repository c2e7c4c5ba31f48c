// The cached contents must always equal a fresh read from the engine, and documents handed out
// earlier must not change afterwards.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { CellContent, WorkbookDoc } from '../../src/core/workbook/document.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { SheetContents } from '../../src/ui/model/sheetContents.ts';

const small: WorkbookDoc = {
  format: 'kvar-ledger-workbook',
  version: 1,
  title: 't',
  sheets: [
    {
      name: 'A',
      cells: [
        [1, 2, '=A1+B1'],
        ['x', null, '=KVA.TOTAL(A1,B1)'],
      ],
    },
    { name: 'B', cells: [['=A!C1*2']] },
  ],
};

/** A fresh read, bypassing the session's cache. */
const fresh = (s: WorkbookSession, id: number) => new SheetContents(s.engine).get(id);

describe('sheet contents cache', () => {
  it('agrees with a fresh read after any sequence of edits', () => {
    const content = fc.oneof(
      fc.constant<CellContent>(null),
      fc.integer({ min: -50, max: 50 }).map<CellContent>((n) => n),
      fc.constantFrom<CellContent>('tag', 'TRUE', '=A1*2', '=kva.total(1,2)', '=SUM(A1:B2)', ''),
    );
    const edit = fc.record({ row: fc.nat(6), col: fc.nat(4), content });
    fc.assert(
      fc.property(
        fc.array(fc.array(edit, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 8 }),
        (batches) => {
          const s = WorkbookSession.fromDoc(small);
          for (const b of batches) s.setCells(0, b);
          expect(s.sheetContents(0)).toEqual(fresh(s, 0));
          expect(s.sheetContents(1)).toEqual(fresh(s, 1));
        },
      ),
      { numRuns: 60 },
    );
  });

  it('keeps formulas of an opened file as they were written there', () => {
    const s = WorkbookSession.fromDoc({
      ...small,
      sheets: [{ name: 'A', cells: [[1, '=kva.total(A1, 2)']] }],
    });
    expect(s.toDoc().sheets[0]?.cells).toEqual([[1, '=kva.total(A1, 2)']]);
    expect(s.engine.getCellValue({ sheet: 0, row: 0, col: 1 })).toBeCloseTo(Math.sqrt(5), 12);
  });

  it('keeps a document handed out before an edit as it was', () => {
    const s = WorkbookSession.fromDoc(small);
    const before = s.toDoc();
    const copy = JSON.parse(JSON.stringify(before)) as WorkbookDoc;
    s.setCells(0, [{ row: 0, col: 0, content: 99 }]);
    s.setBlock(0, 1, 0, [['y', 7]]);
    expect(before).toEqual(copy);
    expect(s.toDoc().sheets[0]?.cells[0]?.[0]).toBe(99);
  });

  it('reads a sheet again after rows move or an undo', () => {
    const s = WorkbookSession.fromDoc(small);
    s.insertRows(0, 0, 1);
    expect(s.sheetContents(1)).toEqual([['=A!C2*2']]);
    s.undo();
    expect(s.sheetContents(1)).toEqual([['=A!C1*2']]);
    expect(s.sheetContents(0)).toEqual(fresh(s, 0));
  });

  it('follows a live workbook whose bus totals spill, through edits of its inputs', () => {
    const site = readSiteFile(
      readFileSync(new URL('../../templates/solar-collector.json', import.meta.url), 'utf8'),
    ).site;
    const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const id = s.engine.getSheetId('Buses') as number;
    const cables = s.engine.getSheetId('Cables') as number;
    s.setCells(cables, [{ row: 1, col: 3, content: 5 }]);
    expect(s.sheetContents(cables)).toEqual(fresh(s, cables));
    expect(s.sheetContents(id)).toEqual(fresh(s, id));
  });
});
