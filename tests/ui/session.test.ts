// The open-workbook model over the real engine (with the catalogue plugin): one undo step per
// action, sheet order and column descriptions restored with the cells.
import { describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';

const doc: WorkbookDoc = {
  format: 'kvar-ledger-workbook',
  version: 1,
  title: 'Test site',
  sheets: [
    {
      name: 'Site',
      cells: [
        ['P (kW)', 'Q (kvar)'],
        [300, 400],
      ],
      columns: [{ header: 'P (kW)', format: '0.0' }, { header: 'Q (kvar)' }],
      purpose: 'inputs',
    },
    { name: 'Results', cells: [['S (kVA)'], ['=KVA.TOTAL(Site!A2,Site!B2)']] },
    { name: 'Notes', cells: [['free text']] },
  ],
};

const value = (s: WorkbookSession, sheet: string, row: number, col: number) =>
  s.engine.getCellValue({ sheet: s.engine.getSheetId(sheet) as number, row, col });

describe('WorkbookSession', () => {
  it('round-trips a document unchanged', () => {
    const s = WorkbookSession.fromDoc(doc);
    expect(s.toDoc()).toEqual(doc);
    expect(value(s, 'Results', 1, 0)).toBe(500); // 3-4-5 triangle
  });

  it("keeps a sheet's choices and marks through opening and saving", () => {
    const marked: WorkbookDoc = {
      ...doc,
      sheets: [
        {
          name: 'Setup',
          cells: [
            ['Setting', 'Value'],
            ['Frequency (Hz)', 50],
            ['Load losses (kW)', 7.6],
          ],
          choices: [{ row: 1, col: 1, options: ['50', '60'], message: 'The frequency must be 50 or 60 Hz.' }],
          marks: [{ row: 2, col: 1, kind: 'assumed', note: 'typical value', value: 7.6 }],
        },
      ],
    };
    const s = WorkbookSession.fromDoc(marked);
    const setup = s.engine.getSheetId('Setup') as number;
    expect(s.meta(setup).marks).toEqual(marked.sheets[0]?.marks);
    expect(s.meta(setup).choices).toEqual(marked.sheets[0]?.choices);
    expect(s.toDoc()).toEqual(marked);
  });

  it('undoes and redoes an edit, one step per action', () => {
    const s = WorkbookSession.fromDoc(doc);
    const site = s.engine.getSheetId('Site') as number;
    s.setCells(site, [
      { row: 1, col: 0, content: 600 },
      { row: 1, col: 1, content: 800 },
    ]);
    expect(value(s, 'Results', 1, 0)).toBe(1000);
    expect(s.undo()).toBe(true);
    expect(value(s, 'Results', 1, 0)).toBe(500);
    expect(s.redo()).toBe(true);
    expect(value(s, 'Results', 1, 0)).toBe(1000);
  });

  it('brings a deleted sheet back in its place with its columns', () => {
    const s = WorkbookSession.fromDoc(doc);
    const site = s.engine.getSheetId('Site') as number;
    s.removeSheet(site);
    expect(s.sheetNames()).toEqual(['Results', 'Notes']);
    expect((value(s, 'Results', 1, 0) as { type: string }).type).toBe('REF');
    s.addSheet('Extra'); // may take the freed engine id
    s.undo();
    s.undo();
    expect(s.toDoc()).toEqual(doc);
    expect(value(s, 'Results', 1, 0)).toBe(500);
  });

  it('keeps sheet names valid and unique', () => {
    const s = WorkbookSession.fromDoc(doc);
    expect(() => s.addSheet('site')).toThrow(/already a sheet called "Site"/);
    expect(() => s.renameSheet(s.engine.getSheetId('Notes') as number, 'a:b')).toThrow(/character :/);
    s.renameSheet(s.engine.getSheetId('Site') as number, 'Inputs');
    expect(value(s, 'Results', 1, 0)).toBe(500);
    expect(s.toDoc().sheets[1]?.cells[1]?.[0]).toBe('=KVA.TOTAL(Inputs!A2,Inputs!B2)');
    s.undo();
    expect(s.sheetNames()).toEqual(['Site', 'Results', 'Notes']);
  });

  it('refuses to delete the last sheet', () => {
    const s = WorkbookSession.fromDoc({ ...doc, sheets: [doc.sheets[2]!] });
    expect(() => s.removeSheet(s.sheetIds()[0]!)).toThrow(/at least one sheet/);
  });

  it('fills down moving relative references', () => {
    const s = WorkbookSession.fromDoc({
      ...doc,
      sheets: [
        {
          name: 'F',
          cells: [
            [3, 4, '=KVA.TOTAL(A1,B1)'],
            [6, 8],
            [30, 40],
          ],
        },
      ],
    });
    s.fill(
      { start: { sheet: 0, row: 0, col: 2 }, end: { sheet: 0, row: 0, col: 2 } },
      { start: { sheet: 0, row: 1, col: 2 }, end: { sheet: 0, row: 2, col: 2 } },
    );
    expect(s.sheetContents(0).map((r) => r[2])).toEqual([
      '=KVA.TOTAL(A1,B1)',
      '=KVA.TOTAL(A2,B2)',
      '=KVA.TOTAL(A3,B3)',
    ]);
    expect(value(s, 'F', 2, 2)).toBe(50);
    s.undo();
    expect(s.sheetContents(0)[2]).toEqual([30, 40]);
  });

  it('moves references of a copied block to where it is pasted', () => {
    const s = WorkbookSession.fromDoc({
      ...doc,
      sheets: [{ name: 'F', cells: [[3, 4, '=KVA.TOTAL(A1,B1)']] }],
    });
    const moved = s.movedContents(
      { start: { sheet: 0, row: 0, col: 0 }, end: { sheet: 0, row: 0, col: 2 } },
      { sheet: 0, row: 4, col: 1 },
    );
    expect(moved).toEqual([[3, 4, '=KVA.TOTAL(B5,C5)']]);
  });

  it('inserts and removes rows as undoable steps that move references', () => {
    const s = WorkbookSession.fromDoc(doc);
    const site = s.engine.getSheetId('Site') as number;
    s.insertRows(site, 1, 2);
    expect(s.toDoc().sheets[1]?.cells[1]?.[0]).toBe('=KVA.TOTAL(Site!A4,Site!B4)');
    s.removeRows(site, 1, 2);
    expect(s.toDoc()).toEqual(doc);
    s.undo();
    s.undo();
    expect(s.toDoc()).toEqual(doc);
  });
});
