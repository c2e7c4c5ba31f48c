// The Design options sheet follows the buses as the Compensation sheet does: an option's bank on a
// bus that goes away is kept aside and comes back with the bus, a renamed bus keeps its banks in
// every option, and the proposed marks on option inputs move with their bus when the blocks'
// rows move. Every change undoes in one step. Expected values are read from the sheet before the
// edit (what was typed or drafted), never computed by the code under test.
import { describe, expect, it } from 'vitest';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { heldProposals } from '../../../src/core/workbook/cellMarks.ts';
import type { CellContent, CellMark } from '../../../src/core/workbook/document.ts';
import { OPTIONS_SHEET, optionLabel, planOptionColumns } from '../../../src/core/workbook/optionsLayout.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { columnOf as col, sheetIdOf as id } from './sessionLookups.ts';
import { PLANT } from '../../core/workbook/sites.ts';
import { FIRST_CASE_ROW } from '../../../src/core/workbook/settingsLayout.ts';

const cols = planOptionColumns(PLANT.settings.cases);
const INPUTS = Object.values(cols.input);

const open = () => WorkbookSession.fromDoc(buildWorkbook(PLANT, { flavour: 'live' }));

/** Row of `bus`'s line in option j's block, found by the block's label and the bus name (-1: none). */
function optionLine(s: WorkbookSession, j: number, bus: string): number {
  const rows = s.sheetContents(id(s, OPTIONS_SHEET));
  let block = -1;
  for (let r = 1; r < rows.length; r++) {
    const label = rows[r]?.[1];
    if (typeof label === 'string' && label.startsWith('Option ')) {
      block = label === optionLabel(j) ? j : -1;
      continue;
    }
    if (block === j && rows[r]?.[0] === bus) return r;
  }
  return -1;
}

/** The option inputs on `bus`'s line of option j, input column → content (non-blank only). */
function optionBank(s: WorkbookSession, j: number, bus: string): Map<number, CellContent> {
  const row = optionLine(s, j, bus);
  const line = row < 0 ? [] : (s.sheetContents(id(s, OPTIONS_SHEET))[row] ?? []);
  const out = new Map<number, CellContent>();
  for (const c of INPUTS) if (line[c] !== null && line[c] !== undefined) out.set(c, line[c]);
  return out;
}

const banksOf = (s: WorkbookSession, bus: string) => [0, 1, 2, 3].map((j) => optionBank(s, j, bus));

/** The proposed marks of the options sheet that still hold their value. */
const heldMarks = (s: WorkbookSession): CellMark[] =>
  heldProposals(s.toDoc().sheets.find((x) => x.name === OPTIONS_SHEET)!);

/** A motor on bus `on` typed into row `row` of the Motors sheet. */
function typeMotor(s: WorkbookSession, row: number, tag: string, on: string) {
  s.setCells(id(s, 'Motors'), [
    { row, col: col(s, 'Motors', 'Tag'), content: tag },
    { row, col: col(s, 'Motors', 'Bus'), content: on },
    { row, col: col(s, 'Motors', 'Rated output (kW)'), content: 30 },
    { row, col: col(s, 'Motors', 'Efficiency'), content: 0.92 },
    { row, col: col(s, 'Motors', 'cos φ'), content: 0.84 },
  ]);
}

/** A bus AUX of one motor (after the others), with a bank typed for it in options 1 and 3. */
function withAux() {
  const s = open();
  const row = s.sheetContents(id(s, 'Motors')).length;
  typeMotor(s, row, 'M9', 'AUX');
  const [first, third] = [optionLine(s, 0, 'AUX'), optionLine(s, 2, 'AUX')];
  expect(Math.min(first, third)).toBeGreaterThan(0);
  s.setCells(id(s, OPTIONS_SHEET), [
    { row: first, col: cols.input.step_kvar, content: 40 },
    { row: first, col: cols.input.steps, content: 3 },
    { row: third, col: cols.input.step_kvar, content: 60 },
    { row: third, col: cols.input.steps, content: 3 },
  ]);
  const banks = banksOf(s, 'AUX');
  expect(banks.map((b) => b.get(cols.input.step_kvar))).toEqual([40, undefined, 60, undefined]);
  return { s, motorRow: row, banks };
}

describe('an option’s bank on a bus that goes away', () => {
  it('is kept aside when the bus’s only row is deleted and comes back with the bus', () => {
    const { s, motorRow, banks } = withAux();
    const motors = id(s, 'Motors');
    s.removeRows(motors, motorRow, 1);
    expect(optionLine(s, 0, 'AUX')).toBe(-1);
    // Another bus's banks stay where they were.
    const lv1 = banksOf(s, 'LV1');
    typeMotor(s, motorRow, 'M9', 'AUX');
    expect(banksOf(s, 'AUX')).toEqual(banks);
    expect(banksOf(s, 'LV1')).toEqual(lv1);
  });

  it('is kept aside when the bus cell names another bus, back when it names this one again', () => {
    const { s, motorRow, banks } = withAux();
    const motors = id(s, 'Motors');
    const busCol = col(s, 'Motors', 'Bus');
    s.setCells(motors, [{ row: motorRow, col: busCol, content: 'LV1' }]);
    expect(optionLine(s, 0, 'AUX')).toBe(-1);
    s.setCells(motors, [{ row: motorRow, col: busCol, content: 'AUX' }]);
    expect(banksOf(s, 'AUX')).toEqual(banks);
  });

  it('undo brings the bus and its banks back; the banks kept aside are part of each step', () => {
    const { s, motorRow, banks } = withAux();
    const motors = id(s, 'Motors');
    const busCol = col(s, 'Motors', 'Bus');
    s.setCells(motors, [{ row: motorRow, col: busCol, content: 'LV1' }]);
    s.undo();
    expect(banksOf(s, 'AUX')).toEqual(banks);
    s.redo();
    expect(optionLine(s, 0, 'AUX')).toBe(-1);
    s.setCells(motors, [{ row: motorRow, col: busCol, content: 'AUX' }]);
    expect(banksOf(s, 'AUX')).toEqual(banks);
    // Undo the return: the bus goes again; typed back, it finds its banks kept aside once more.
    s.undo();
    expect(optionLine(s, 0, 'AUX')).toBe(-1);
    s.setCells(motors, [{ row: motorRow, col: busCol, content: 'AUX' }]);
    expect(banksOf(s, 'AUX')).toEqual(banks);
  });
});

describe('a bus renamed on the Buses sheet', () => {
  it('keeps its banks in every option, with their proposed marks; undo renames them back', () => {
    const s = open();
    const before = banksOf(s, 'LV2');
    expect(before.filter((b) => b.size > 0).length).toBeGreaterThan(1);
    const marksBefore = heldMarks(s);
    const lv2Rows = [0, 1, 2, 3].map((j) => optionLine(s, j, 'LV2'));
    const lv2Marks = marksBefore.filter((m) => lv2Rows.includes(m.row));
    expect(lv2Marks.length).toBeGreaterThan(0);
    const buses = id(s, 'Buses');
    const row = s.sheetContents(buses).findIndex((r) => r[0] === 'LV2');
    s.setCells(buses, [{ row, col: 0, content: 'LV-SOUTH' }]);
    expect(optionLine(s, 0, 'LV2')).toBe(-1);
    expect(banksOf(s, 'LV-SOUTH')).toEqual(before);
    // Every mark LV2's banks had is on LV-SOUTH's line of the same option.
    const blockOfRow = new Map([0, 1, 2, 3].map((j) => [optionLine(s, j, 'LV-SOUTH'), j]));
    const want = lv2Marks.map((m) => [optionLine(s, lv2Rows.indexOf(m.row), 'LV-SOUTH'), m.col, m.value]);
    const after = heldMarks(s);
    expect(after.length).toBe(marksBefore.length);
    expect(after.filter((m) => blockOfRow.has(m.row)).map((m) => [m.row, m.col, m.value])).toEqual(want);
    s.undo();
    expect(banksOf(s, 'LV2')).toEqual(before);
    expect(heldMarks(s)).toEqual(marksBefore);
  });
});

describe('the proposed marks of option inputs', () => {
  it('move with their bus when a new bus moves the blocks’ rows, and back on undo', () => {
    const s = open();
    const marksBefore = heldMarks(s);
    expect(marksBefore.length).toBeGreaterThan(0);
    // Each mark by option and bus, as the sheet has it now.
    const busAt = (r: number) => String(s.sheetContents(id(s, OPTIONS_SHEET))[r]?.[0]);
    const blockAt = (r: number) =>
      [0, 1, 2, 3].filter((j) => {
        const title = s.sheetContents(id(s, OPTIONS_SHEET)).findIndex((l) => l[1] === optionLabel(j));
        return title < r;
      }).length - 1;
    const placed = marksBefore.map((m) => ({ j: blockAt(m.row), bus: busAt(m.row), m }));
    // A transformer typed above the others feeds a new bus, which the sheet lists before the others.
    const xf = id(s, 'Transformers');
    s.insertRows(xf, 1, 1);
    s.setCells(xf, [
      { row: 1, col: col(s, 'Transformers', 'Tag'), content: 'T0' },
      { row: 1, col: col(s, 'Transformers', 'Bus'), content: 'MV' },
      { row: 1, col: col(s, 'Transformers', 'Feeds bus'), content: 'AUX' },
      { row: 1, col: col(s, 'Transformers', 'Rating (kVA)'), content: 630 },
      { row: 1, col: col(s, 'Transformers', 'uk (%)'), content: 6 },
    ]);
    const moved = placed.map((p) => ({ ...p.m, row: optionLine(s, p.j, p.bus) }));
    expect(moved.some((m, k) => m.row !== marksBefore[k]?.row)).toBe(true);
    const after = heldMarks(s);
    const key = (m: CellMark) => `${m.row},${m.col},${String(m.value)}`;
    expect(after.map(key).sort()).toEqual(moved.map(key).sort());
    s.undo();
    expect(heldMarks(s)).toEqual(marksBefore);
  });
});

describe('a case added on the Site sheet', () => {
  // Every block grows by a line per case (its saving rows), so every bus line but the first
  // block's moves: the workbook is written anew from its inputs and the marks must come along.
  it('keeps every proposed mark on its option input; undo gives the old layout back', () => {
    const s = open();
    const site = s.site!;
    const before = heldMarks(s);
    const marked = (s.toDoc().sheets.find((x) => x.name === OPTIONS_SHEET)?.marks ?? []).length;
    expect(before.length).toBe(marked);
    expect(before.length).toBeGreaterThan(0);
    const valuesOf = (list: readonly CellMark[]) => list.map((m) => m.value).sort();
    s.setCells(site.ids.site, [
      { row: FIRST_CASE_ROW + site.state.cases.length, col: 1, content: 'standby' },
    ]);
    expect(site.state.cases).toContain('standby');
    const after = heldMarks(s);
    expect(after.length).toBe(before.length);
    expect(valuesOf(after)).toEqual(valuesOf(before));
    expect(after.map((m) => m.row)).not.toEqual(before.map((m) => m.row));
    s.undo();
    expect(heldMarks(s)).toEqual(before);
    s.destroy();
  });
});
