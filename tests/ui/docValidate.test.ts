import { describe, expect, it } from 'vitest';
import { emptyWorkbook } from '../../src/core/workbook/document.ts';
import { parseWorkbookText, workbookProblems } from '../../src/ui/model/docValidate.ts';
import { freshSheetName, sheetNameProblem } from '../../src/ui/model/sheetNames.ts';

describe('workbook check', () => {
  it('accepts an empty workbook', () => {
    expect(workbookProblems(emptyWorkbook())).toEqual([]);
  });
  it('says where a bad cell is', () => {
    const doc = {
      ...emptyWorkbook(),
      sheets: [
        {
          name: 'Motors',
          cells: [
            [1, 2],
            [3, { x: 1 }],
          ],
        },
      ],
    };
    expect(workbookProblems(doc)).toEqual([
      'Sheet "Motors", cell B2: a value of type object; expected a number, text, TRUE/FALSE or blank.',
    ]);
  });
  it('rejects duplicate sheet names ignoring case', () => {
    const doc = {
      ...emptyWorkbook(),
      sheets: [
        { name: 'Buses', cells: [] },
        { name: 'BUSES', cells: [] },
      ],
    };
    expect(workbookProblems(doc)).toEqual(['Sheet "BUSES" appears twice.']);
  });
  it('rejects other files with a clear message', () => {
    expect(parseWorkbookText('{"format":"kvar-ledger-site","version":1}')).toEqual({
      ok: false,
      message: 'Not a Kvar Ledger workbook: "format" is "kvar-ledger-site"; expected "kvar-ledger-workbook".',
    });
    const bad = parseWorkbookText('{"format": ');
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.message).toMatch(/^The file is not valid JSON/);
  });
  it('reads a valid file', () => {
    const r = parseWorkbookText(JSON.stringify(emptyWorkbook('Pumps')));
    expect(r.ok && r.doc.title).toBe('Pumps');
  });
});

describe('sheet names', () => {
  it('follows the rules of the xlsx hand-off', () => {
    expect(sheetNameProblem('Loads', ['Site'])).toBeUndefined();
    expect(sheetNameProblem('', [])).toMatch(/empty/);
    expect(sheetNameProblem('a/b', [])).toMatch(/character \//);
    expect(sheetNameProblem('x'.repeat(32), [])).toMatch(/at most 31/);
    expect(sheetNameProblem('site', ['Site'])).toMatch(/already a sheet called "Site"/);
    expect(sheetNameProblem('Site', ['Site'], 'Site')).toBeUndefined();
    expect(sheetNameProblem("'quoted'", [])).toMatch(/apostrophe/);
  });
  it('refuses names an xlsx file cannot carry back, saying which character', () => {
    expect(sheetNameProblem('History', [])).toMatch(/reserve/);
    expect(sheetNameProblem('history', [])).toMatch(/reserve/);
    expect(sheetNameProblem('a\u0007b', [])).toMatch(/U\+0007/);
    expect(sheetNameProblem('a\uD800', [])).toMatch(/U\+D800/);
    expect(sheetNameProblem('\uFFFF', [])).toMatch(/U\+FFFF/);
    // A character outside the basic plane (a surrogate pair) is fine.
    expect(sheetNameProblem('Pumps \u{1F6B0}', [])).toBeUndefined();
    expect(sheetNameProblem('__proto__', [])).toBeUndefined();
    expect(sheetNameProblem('007', [])).toMatch(/cannot start with a digit/);
    expect(sheetNameProblem('2nd floor', [])).toMatch(/"Floor 2nd floor"/);
    expect(sheetNameProblem('Floor 2', [])).toBeUndefined();
  });
  it('proposes a name that does not clash', () => {
    expect(freshSheetName(['Site', 'Sheet 3'])).toBe('Sheet 4');
    expect(freshSheetName(['Site', 'Sheet 2'])).toBe('Sheet 3');
  });
});
