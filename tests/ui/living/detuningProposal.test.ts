// A detuning typed alone on a Compensation row: the page writes the bank the core's design
// (designWithSheet, what `kvar-ledger balance` and Checks propose) gives that bus, marked as
// proposed, in the same step. The expected bank is the core's design over the same workbook with
// the row holding the detuning alone, computed here from the document, not read from the page;
// the after-compensation figures are compared with the core's compensate() over that design.
import { beforeAll, describe, expect, it } from 'vitest';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { planCompensationColumns } from '../../../src/core/workbook/compensationColumns.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { designWithSheet } from '../../../src/core/site/sheetChoices.ts';
import { compensate } from '../../../src/core/site/compensate.ts';
import { heldProposals } from '../../../src/core/workbook/cellMarks.ts';
import type { CellContent, WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { loadDetuningProposer } from '../../../src/ui/model/designLoaders.ts';
import { handOffDoc } from '../../../src/ui/app/handOff.ts';
import { exportWorkbookXlsxWithReport, importKvarXlsx } from '../../../src/io/xlsx/index.ts';
import { PLANT } from '../../core/workbook/sites.ts';
import { coreFaces, pageFaces, relDiff } from './faces.ts';

const cases = PLANT.settings.cases;
const plan = planCompensationColumns(cases);
const SIZE_KEYS = ['fixed_kvar', 'step_kvar', 'steps', 'series', 'u_rated_kv', 'reactor_kvar'] as const;

function open() {
  const s = WorkbookSession.fromDoc(buildWorkbook(PLANT, { flavour: 'live' }));
  const comp = s.engine.getSheetId('Compensation') as number;
  const rows = s.sheetContents(comp);
  const row = rows.findIndex((r, i) => i > 0 && typeof r[plan.input.steps] === 'number');
  return { s, comp, row, bus: String(rows[row]?.[0]) };
}

/** The edit an estimator makes: the row's sizes cleared, p = 7 % typed. */
const detuneAlone = (row: number, p: number) => [
  ...SIZE_KEYS.map((k) => ({ row, col: plan.input[k], content: null })),
  { row, col: plan.input.p_pct, content: p },
];

/** The same edit on a saved document, outside the page. */
function withDetuningAlone(doc: WorkbookDoc, row: number, p: number): WorkbookDoc {
  return {
    ...doc,
    sheets: doc.sheets.map((sh) => {
      if (sh.name !== 'Compensation') return sh;
      const cells = sh.cells.map((line) => [...line]);
      const line = cells[row] as CellContent[];
      for (const k of SIZE_KEYS) line[plan.input[k]] = null;
      line[plan.input.p_pct] = p;
      return { ...sh, cells };
    }),
  };
}

// The page loads the design behind a detuning typed alone after opening; here, before any edit.
beforeAll(loadDetuningProposer);

describe('a detuning typed alone takes the design’s bank', () => {
  it('fills the row with designWithSheet’s bank at 7 %, marked as proposed; the bus counts it', () => {
    const { s, comp, row, bus } = open();
    expect(row).toBeGreaterThan(0);
    const expectedDoc = withDetuningAlone(s.toDoc(), row, 7);
    const read = siteFromWorkbook(expectedDoc);
    const want = designWithSheet(read.site, read.banks).choices.find((c) => c.bus === bus);
    expect(want?.p_pct).toBe(7);
    expect(want?.step_kvar).toBeGreaterThan(0);

    s.setCells(comp, detuneAlone(row, 7));
    const cell = (k: (typeof SIZE_KEYS)[number]) => s.sheetContents(comp)[row]?.[plan.input[k]] ?? null;
    expect(cell('step_kvar')).toBe(want?.step_kvar);
    expect(cell('steps')).toBe(want?.steps);
    expect(cell('fixed_kvar')).toBe(want?.fixed_kvar ? want.fixed_kvar : null);
    expect(cell('series')).toBe(want?.series ?? null);
    expect(cell('u_rated_kv')).toBe(want?.u_rated_kv ?? null);
    expect(s.sheetContents(comp)[row]?.[plan.input.p_pct]).toBe(7);

    // Each written cell carries a proposed mark whose note says so and when.
    const doc = s.toDoc();
    const marks = heldProposals(doc.sheets.find((x) => x.name === 'Compensation')!);
    const written = SIZE_KEYS.filter((k) => cell(k) !== null).map((k) => plan.input[k]);
    expect(marks.map((m) => m.col).sort()).toEqual([...written].sort());
    expect(marks.every((m) => m.row === row)).toBe(true);
    expect(marks[0]?.note).toMatch(/^proposed by the design on \d{4}-\d\d-\d\d \d\d:\d\d UTC for bus /);
    expect(marks[0]?.note).toContain('typing over it makes the value yours');

    // The bus's figures after compensation: the core's compensate() over the sheet's banks with
    // this row holding the design's bank (the other rows stay as typed).
    const banks = read.banks.map((c) => (c.bus === bus && want ? want : c));
    const after = compensate(read.site, banks);
    const page = pageFaces(s, cases, after[0]?.after.buses.length ?? 0);
    const i = page.buses.findIndex((b) => b.bus === bus);
    after.forEach((c, k) => {
      const core = c.after.buses.find((b) => b.bus === bus);
      const shown = page.buses[i]?.cases[k];
      expect(relDiff(shown?.[3] ?? NaN, core?.p_kw ?? NaN)).toBeLessThan(1e-9);
      expect(relDiff(shown?.[4] ?? NaN, core?.q_kvar ?? NaN)).toBeLessThan(1e-9);
    });
    // And the whole page still equals the core reading of the saved workbook.
    const core = coreFaces(s);
    expect(core).toBeDefined();
    core?.faces.buses.forEach((b, j) =>
      b.cases.forEach((c, k) => {
        expect(relDiff(page.buses[j]?.cases[k]?.[4] ?? NaN, c[4])).toBeLessThan(1e-9);
      }),
    );
  });

  it('typing over a proposed value keeps it and ends its mark; undo takes the proposal away', () => {
    const { s, comp, row } = open();
    const before = s.sheetContents(comp)[row]?.slice();
    s.setCells(comp, detuneAlone(row, 7));
    const proposedSteps = s.sheetContents(comp)[row]?.[plan.input.steps];
    expect(typeof proposedSteps).toBe('number');
    const typed = (proposedSteps as number) + 1;
    s.setCells(comp, [{ row, col: plan.input.steps, content: typed }]);
    expect(s.sheetContents(comp)[row]?.[plan.input.steps]).toBe(typed);
    const marks = () => heldProposals(s.toDoc().sheets.find((x) => x.name === 'Compensation')!);
    expect(marks().some((m) => m.col === plan.input.steps)).toBe(false);
    expect(marks().length).toBeGreaterThan(0);

    s.undo(); // the typed steps
    expect(s.sheetContents(comp)[row]?.[plan.input.steps]).toBe(proposedSteps);
    s.undo(); // the detuning and its proposal, as one step
    expect(s.sheetContents(comp)[row]).toEqual(before);
    expect(marks()).toEqual([]);
  });

  it('the proposed marks move with their bus when a new bus moves its Compensation row', () => {
    const { s, comp, row, bus } = open();
    s.setCells(comp, detuneAlone(row, 7));
    const layoutMarks = () => heldProposals({ ...s.toDoc().sheets.find((x) => x.name === 'Compensation')! });
    const before = layoutMarks();
    expect(before.length).toBeGreaterThan(0);
    expect(new Set(before.map((m) => m.row))).toEqual(new Set([row]));
    // A transformer typed above the others feeds a new bus, which the sheet lists before this one.
    const xf = s.engine.getSheetId('Transformers') as number;
    s.insertRows(xf, 1, 1);
    s.setCells(xf, [
      { row: 1, col: 0, content: 'T0' },
      { row: 1, col: 2, content: 'MV' },
      { row: 1, col: 3, content: 'AUX' },
      { row: 1, col: 6, content: 630 },
      { row: 1, col: 7, content: 6 },
    ]);
    const rows = s.sheetContents(comp);
    const now = rows.findIndex((r, i) => i > 0 && r[0] === bus);
    expect(now).not.toBe(row);
    const after = layoutMarks();
    expect(after.map((m) => [m.col, m.value])).toEqual(before.map((m) => [m.col, m.value]));
    expect(new Set(after.map((m) => m.row))).toEqual(new Set([now]));
    // Undo takes the new bus away and the marks back to their row.
    s.undo();
    expect(new Set(layoutMarks().map((m) => m.row))).toEqual(new Set([row]));
  });

  it('writes nothing where the design proposes no bank (no need on the site)', () => {
    // The plant's requirement met by anything: cos φ 0.5 needs no kvar on any bus.
    const site = {
      ...PLANT,
      settings: { ...PLANT.settings, requirement: { kind: 'cosphi' as const, target: 0.5 } },
    };
    const s = WorkbookSession.fromDoc(buildWorkbook(site, { flavour: 'live' }));
    const comp = s.engine.getSheetId('Compensation') as number;
    const read = siteFromWorkbook(withDetuningAlone(s.toDoc(), 1, 7));
    const bus = String(s.sheetContents(comp)[1]?.[0]);
    const design = designWithSheet(read.site, read.banks).choices.find((c) => c.bus === bus);
    expect(design?.step_kvar ?? 0).toBe(0);
    s.setCells(comp, detuneAlone(1, 7));
    const line = s.sheetContents(comp)[1] ?? [];
    for (const k of SIZE_KEYS) expect(line[plan.input[k]] ?? null).toBeNull();
    expect(line[plan.input.p_pct]).toBe(7);
  });

  it('the export carries each proposed value with a note; our import reads them back as inputs', async () => {
    const { s, comp, row, bus } = open();
    s.setCells(comp, detuneAlone(row, 7));
    const step = s.sheetContents(comp)[row]?.[plan.input.step_kvar];
    const steps = s.sheetContents(comp)[row]?.[plan.input.steps];
    const handOff = handOffDoc(s.toDoc());
    const bytes = (
      await exportWorkbookXlsxWithReport(handOff.doc, handOff.settings ? { settings: handOff.settings } : {})
    ).bytes;
    const { default: ExcelJS } = await import('exceljs');
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
    const note = wb.getWorksheet('Compensation')!.getCell(row + 1, plan.input.step_kvar + 1).note;
    expect(JSON.stringify(note)).toMatch(/Proposed: proposed by the design on .* for bus /);
    // The cover lists the proposed cells, as it lists assumed ones.
    const cover: string[] = [];
    wb.getWorksheet('Cover')!.eachRow((r) => r.eachCell((c) => cover.push(String(c.value))));
    const stepCell = `Compensation!${String.fromCharCode(65 + plan.input.step_kvar)}${row + 1}`;
    expect(cover.find((t) => t.includes('the design proposed'))).toContain(stepCell);

    const back = await importKvarXlsx(bytes);
    if (!back.ok) throw new Error(back.problem.message);
    const bank = siteFromWorkbook(back.doc).banks.find((c) => c.bus === bus);
    expect(bank?.step_kvar).toBe(step);
    expect(bank?.steps).toBe(steps);
    expect(bank?.p_pct).toBe(7);
  });
});
