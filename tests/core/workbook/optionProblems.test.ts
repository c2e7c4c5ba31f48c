// A bank input typed on the Design options sheet that cannot be read is said, with its sheet, row
// and column, as on the Compensation sheet: the option is listed without figures until it is
// mended (never worked out as if the cell were blank), Checks names the cell, and the rest of the
// workbook (the balance, the chosen design, the other options) goes on. Text that reads as a
// number counts as that number, as the sheet's own arithmetic takes it (the engine is the check).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { isUnread, optionsOfDoc, sheetOptions } from '../../../src/core/options/index.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { CellContent, WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { optionDrafts } from '../../../src/core/workbook/optionDrafts.ts';
import {
  OPTIONS_SHEET,
  blockOrigin,
  planOptionColumns,
  type OptionColumns,
} from '../../../src/core/workbook/optionsLayout.ts';
import { busLineRow } from '../../../src/core/workbook/quantitiesLayout.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { collectChecks } from '../../../src/ui/panels/checksModel.ts';
import { liveEngine, sheet } from './engineDoc.ts';
import {
  coreOptions,
  engineValue,
  expectSameOptions,
  figuresOf,
  sheetOptions as sheetFaces,
} from './optionFaces.ts';

const { site, banks } = readSiteFile(readFileSync('templates/cold-store.json', 'utf8'));
const cases = site.settings.cases;
const cols: OptionColumns = planOptionColumns(cases);
const base = buildWorkbook(site, { flavour: 'live', ...(banks ? { banks } : {}) });
const busCount = sheet(base, 'Buses').cells.length - 1;

/** Option 2's first bus line that has a step size typed: its row on the sheet. */
function stepLine(doc: WorkbookDoc): number {
  const cells = sheet(doc, OPTIONS_SHEET).cells;
  const origin = blockOrigin(1, busCount, cases.length);
  for (let i = 0; i < busCount; i++) {
    const r = busLineRow(i, origin);
    if (typeof cells[r]?.[cols.input.step_kvar] === 'number') return r;
  }
  throw new Error('option 2 has no bank with steps in this template');
}

/** The workbook with one cell of the Design options sheet typed over. */
function typed(row: number, col: number, content: CellContent): WorkbookDoc {
  return {
    ...base,
    sheets: base.sheets.map((s) =>
      s.name !== OPTIONS_SHEET
        ? s
        : {
            ...s,
            cells: s.cells.map((line, r) =>
              r === row ? line.map((v, c) => (c === col ? content : v)) : line,
            ),
          },
    ),
  };
}

const row = stepLine(base);

describe('a bank input on the Design options sheet that cannot be read', () => {
  it.each([
    ['text', 'forty', `must be a number; got "forty"`],
    ['a negative size', -25, 'must be ≥ 0; got -25'],
    ['TRUE', true, 'must be a number; got TRUE'],
    ['a formula', '=20*2', 'holds the formula =20*2; inputs are read as typed numbers'],
  ] as const)('%s is said with its sheet, row and column', (_what, content, said) => {
    const doc = typed(row, cols.input.step_kvar, content);
    const option = optionDrafts(sheet(doc, OPTIONS_SHEET), cases).find((d) => d.block === 1);
    expect(option?.problems.map((p) => p.message)).toEqual([
      `sheet ${OPTIONS_SHEET}, row ${row + 1}, column "Step (kvar)": ${said}`,
    ]);
  });

  it('a step series that is a number (a time of day) or does not fit its steps is said too', () => {
    const asTime = typed(row, cols.input.series, 0.0423);
    const p1 = optionDrafts(sheet(asTime, OPTIONS_SHEET), cases).find((d) => d.block === 1)?.problems;
    expect(p1?.[0]?.message).toMatch(
      new RegExp(
        `^sheet ${OPTIONS_SHEET}, row ${row + 1}, column "Step series": must be one of .*got the number 0.0423`,
      ),
    );
    const odd = typed(row, cols.input.series, '1:3:9');
    const p2 = optionDrafts(sheet(odd, OPTIONS_SHEET), cases).find((d) => d.block === 1)?.problems;
    expect(p2).toHaveLength(1);
    expect(p2?.[0]?.message).toContain(`row ${row + 1}, column "Step series"`);
  });

  it('leaves that option without figures and works out every other one as before', () => {
    const before = optionsOfDoc(base);
    const after = optionsOfDoc(typed(row, cols.input.step_kvar, 'forty'));
    if (!before.ok || !after.ok) throw new Error('the template has input errors');
    expect(after.options.map((o) => o.id)).toEqual(before.options.map((o) => o.id));
    after.options.forEach((o, k) => {
      if (o.id === 'plain') {
        expect(isUnread(o)).toBe(true);
        expect(o.unread?.[0]).toContain(`row ${row + 1}, column "Step (kvar)"`);
      } else expect(figuresOf(o)).toEqual(figuresOf(before.options[k]!));
    });
  });

  it('does not touch the balance: the site and its banks read back as before, without a problem', () => {
    const read = siteFromWorkbook(typed(row, cols.input.step_kvar, 'forty'));
    const was = siteFromWorkbook(base);
    expect(read.problems).toEqual(was.problems);
    expect(read.banks).toEqual(was.banks);
  });

  it('Checks names the cell, goes to it, and still checks the design', () => {
    const report = collectChecks(typed(row, cols.input.step_kvar, 'forty'));
    const items = report.items.filter((i) => i.code === 'options');
    expect(items).toHaveLength(1);
    expect(items[0]).toMatchObject({
      severity: 'error',
      where: `${OPTIONS_SHEET} row ${row + 1}, column Step (kvar)`,
      target: { sheet: OPTIONS_SHEET, row: row + 1, col: cols.input.step_kvar },
    });
    expect(items[0]?.text).toBe(
      'must be a number; got "forty"; the option "Plain capacitors" is not worked out until this is mended',
    );
    expect(report.designSkipped).toBeUndefined();
    expect(collectChecks(base).items.filter((i) => i.code === 'options')).toEqual([]);
  });
});

describe('text that reads as a number in an option input', () => {
  it('counts as that number, as the sheet in the engine counts it', () => {
    const doc = typed(row, cols.input.step_kvar, '35');
    const spec = sheetOptions(sheet(doc, OPTIONS_SHEET), cases).find((o) => o.id === 'plain');
    expect(spec?.unread).toBeUndefined();
    const numeric = typed(row, cols.input.step_kvar, 35);
    // The engine evaluates the sheet with the text; the core reads the same workbook.
    const hf = liveEngine(doc);
    const shown = sheetFaces(engineValue(hf), [1]);
    hf.destroy();
    const asNumber = coreOptions(numeric).filter((o) => o.block === 1);
    expectSameOptions(shown, asNumber, 'sheet with text 35');
    expectSameOptions(
      coreOptions(doc).filter((o) => o.block === 1),
      asNumber,
      'core with text 35',
    );
  });
});
