// Unknown names and circular references, found without an engine, agree with the engine's own
// verdict (#NAME? and #CYCLE!) on every formula of a set of hand-made sheets.
import { DetailedCellError, ErrorType } from 'hyperformula';
import { describe, expect, it } from 'vitest';
import type { CellContent, WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { createEngine } from '../../../src/engine/index.ts';
import { checkFormulas } from '../../../src/io/xlsx/checkFormulas.ts';
import { areaOf } from '../../../src/io/xlsx/formulaRefs.ts';

const doc = (sheets: Record<string, CellContent[][]>): WorkbookDoc => ({
  format: 'kvar-ledger-workbook',
  version: 1,
  title: 't',
  sheets: Object.entries(sheets).map(([name, cells]) => ({ name, cells })),
});

/** Cells the engine marks #NAME? or #CYCLE!, as "Sheet!A1 code". */
function engineVerdict(d: WorkbookDoc): string[] {
  const hf = createEngine(d.sheets);
  const out: string[] = [];
  d.sheets.forEach((s) =>
    s.cells.forEach((row, r) =>
      row.forEach((c, col) => {
        const v = hf.getCellValue({ sheet: hf.getSheetId(s.name) as number, row: r, col });
        if (!(v instanceof DetailedCellError) || typeof c !== 'string' || !c.startsWith('=')) return;
        const a1 = `${s.name}!${String.fromCharCode(65 + col)}${r + 1}`;
        // A cell that only depends on a loop shows #CYCLE! too; the check names the loop's own cells.
        if (v.type === ErrorType.NAME) out.push(`${a1} unknown-function`);
        if (v.type === ErrorType.CYCLE && v.address === a1) out.push(`${a1} circular-reference`);
      }),
    ),
  );
  hf.destroy();
  return out.sort();
}

const CASES: Record<string, WorkbookDoc> = {
  'two-cell loop': doc({ S: [['=B1+1', '=A1*2', '=SUM(1,2)']] }),
  'dependents of a loop': doc({ S: [['=B1+1', '=A1*2', '=A1+5', '=SUM(A1:B1)']] }),
  'self in own range': doc({ S: [[1], ['=SUM(A1:A3)'], [3]] }),
  'loop across sheets': doc({ A: [['=B!A1']], 'B b': [[]], B: [["='A'!A1+1"]] }),
  'whole column': doc({ S: [['=SUM(B:B)', '=A1']] }),
  'row range, no loop': doc({
    S: [
      [1, 2],
      ['=SUM(1:1)', '=A2*2'],
    ],
  }),
  'unknown function and name': doc({ S: [['=FROBNICATE(1)', '=ZZTOP+1', '=KVA.TOTAL(3,4)', '=IFNA(1,2)']] }),
  'long chain, no loop': doc({ S: Array.from({ length: 300 }, (_, i) => [i === 0 ? 1 : `=A${i}+1`]) }),
};

describe('checkFormulas', () => {
  it.each(Object.keys(CASES))('%s: agrees with the engine', (name) => {
    const d = CASES[name] as WorkbookDoc;
    const mine = checkFormulas(d)
      .map((p) => `${p.where} ${p.code}`)
      .sort();
    expect(mine).toEqual(engineVerdict(d));
  });

  it('checks only the given rows when asked', () => {
    const d = doc({ S: [['=B1+1', '=A1*2'], ['=NOPE(1)']] });
    expect(checkFormulas(d, new Map([['S', new Set([1])]])).map((p) => p.where)).toEqual(['S!A2']);
    expect(checkFormulas(d, new Map())).toEqual([]);
  });

  it('reads reference tokens into areas', () => {
    expect(areaOf("'My ''sheet'''!$B$2:A10", 'S')).toEqual({
      sheet: "My 'sheet'",
      r0: 1,
      r1: 9,
      c0: 0,
      c1: 1,
    });
    expect(areaOf('C:A', 'S')).toEqual({ sheet: 'S', r0: 0, r1: Infinity, c0: 0, c1: 2 });
    expect(areaOf('Data!3:5', 'S')).toEqual({ sheet: 'Data', r0: 2, r1: 4, c0: 0, c1: Infinity });
  });
});
