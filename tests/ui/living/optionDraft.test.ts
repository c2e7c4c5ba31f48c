// A workbook saved before the Design options sheet existed opens in the page with blank option
// blocks (the design is not in the first download); once it has loaded, the page drafts the
// standard options into them, as the CLI and the export draft them for the same file: same cells,
// same proposed marks, and the figures the core works out. One undoable step; never over
// anything typed there.
import { beforeAll, describe, expect, it } from 'vitest';
import { draftOptionsOfDoc } from '../../../src/core/options/index.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { optionDrafts } from '../../../src/core/workbook/optionDrafts.ts';
import { OPTIONS_SHEET, TITLE, blockTitleRow } from '../../../src/core/workbook/optionsLayout.ts';
import { renderWorkbook } from '../../../src/core/workbook/render.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { loadOptionDrafter } from '../../../src/ui/model/designLoaders.ts';
import { coreOptions, expectSameOptions, sheetOptions } from '../../core/workbook/optionFaces.ts';
import { PLANT } from '../../core/workbook/sites.ts';

/** The plant as saved before the sheet: every other sheet as it is. */
const saved = buildWorkbook(PLANT, { flavour: 'live' });
const older: WorkbookDoc = { ...saved, sheets: saved.sheets.filter((s) => s.name !== OPTIONS_SHEET) };
const cases = PLANT.settings.cases;

const optionsOf = (doc: WorkbookDoc) => doc.sheets.find((s) => s.name === OPTIONS_SHEET);

function pageValues(s: WorkbookSession) {
  return (sheet: string, row: number, col: number) =>
    s.engine.getCellValue({ sheet: s.engine.getSheetId(sheet) as number, row, col });
}

beforeAll(async () => {
  await loadOptionDrafter();
});

describe('a workbook saved before the Design options sheet, opened in the page', () => {
  it('gets the options the CLI drafts for it, marked as proposed, with the figures the core works out', () => {
    const s = WorkbookSession.fromDoc(older);
    expect(s.awaitsOptionDraft).toBe(true);
    expect(optionDrafts(optionsOf(s.toDoc()), cases)).toEqual([]);
    expect(s.draftMissingOptions()).toBe(true);
    expect(s.awaitsOptionDraft).toBe(false);

    // What `kvar-ledger export` and render.ts make of the same file.
    const cli = optionsOf(renderWorkbook(older, { flavour: 'live', draftOptions: draftOptionsOfDoc }).doc);
    const page = optionsOf(s.toDoc());
    expect(optionDrafts(page, cases)).toEqual(optionDrafts(cli, cases));
    expect(page?.marks).toEqual(cli?.marks);
    expect(page?.marks?.length).toBeGreaterThan(0);
    const doc = s.toDoc();
    expectSameOptions(sheetOptions(pageValues(s), [0, 1, 2, 3]), coreOptions(doc), 'page after drafting');
    s.destroy();
  });

  it('is one step: undo gives the blank blocks back, redo the draft', () => {
    const s = WorkbookSession.fromDoc(older);
    const blank = s.toDoc();
    s.draftMissingOptions();
    const drafted = s.toDoc();
    expect(s.undo()).toBe(true);
    expect(optionsOf(s.toDoc())).toEqual(optionsOf(blank));
    expect(s.redo()).toBe(true);
    expect(optionsOf(s.toDoc())).toEqual(optionsOf(drafted));
    s.destroy();
  });

  it('drafts nothing over an option typed before the design loaded', () => {
    const s = WorkbookSession.fromDoc(older);
    const id = s.engine.getSheetId(OPTIONS_SHEET) as number;
    const buses = s.sheetContents(s.engine.getSheetId('Buses') as number).length - 1;
    const title = blockTitleRow(0, buses, cases.length);
    s.setCells(id, [{ row: title, col: TITLE.name, content: 'Our own option' }]);
    const before = s.toDoc();
    expect(s.draftMissingOptions()).toBe(false);
    expect(s.toDoc()).toEqual(before);
    expect(optionDrafts(optionsOf(before), cases).map((d) => d.name)).toEqual(['Our own option']);
    s.destroy();
  });

  it('a workbook that has the sheet is left as it is', () => {
    const s = WorkbookSession.fromDoc(saved);
    expect(s.awaitsOptionDraft).toBe(false);
    const before = s.toDoc();
    expect(s.draftMissingOptions()).toBe(false);
    expect(s.toDoc()).toEqual(before);
    s.destroy();
  });
});
