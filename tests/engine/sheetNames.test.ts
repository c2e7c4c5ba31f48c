// Sheet names are names, not object keys: a sheet called "__proto__", "constructor" or
// "toString" opens, computes, saves and reopens like any other.
import { describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { createEngine } from '../../src/engine/index.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';

const OBJECT_WORDS = ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf'];

const doc = (name: string): WorkbookDoc => ({
  format: 'kvar-ledger-workbook',
  version: 1,
  title: 'names',
  sheets: [
    { name: 'Sum', cells: [[`='${name}'!A1+'${name}'!A2`]] },
    { name, cells: [[5], [6]] },
  ],
});

describe('sheet names that are also object property names', () => {
  for (const name of OBJECT_WORDS) {
    it(`"${name}": the engine builds it and formulas reach it`, () => {
      const hf = createEngine(doc(name).sheets);
      expect(hf.getSheetNames()).toEqual(['Sum', name]);
      expect(hf.getCellValue({ sheet: 0, row: 0, col: 0 })).toBe(11);
    });

    it(`"${name}": the workbook saves and reopens with it`, () => {
      const saved = WorkbookSession.fromDoc(doc(name)).toDoc();
      expect(saved.sheets.map((s) => s.name)).toEqual(['Sum', name]);
      const again = WorkbookSession.fromDoc(JSON.parse(JSON.stringify(saved)) as WorkbookDoc);
      expect(again.sheetNames()).toEqual(['Sum', name]);
      expect(again.engine.getCellValue({ sheet: again.sheetIds()[0] as number, row: 0, col: 0 })).toBe(11);
    });
  }

  it('a sheet added and renamed to "__proto__" keeps its contents', () => {
    const s = WorkbookSession.fromDoc(doc('Other'));
    const id = s.addSheet('constructor');
    s.setCells(id, [{ row: 0, col: 0, content: 42 }]);
    s.renameSheet(id, '__proto__');
    const back = WorkbookSession.fromDoc(s.toDoc());
    expect(back.sheetNames()).toEqual(['Sum', 'Other', '__proto__']);
    expect(back.sheetContents(back.sheetIds()[2] as number)).toEqual([[42]]);
  });
});
