// The one-page summary's figures: read from the live workbook's own cells (what the sheets show),
// equal to what the core computes for the same workbook (what `kvar-ledger balance` and `quote`
// print), and following an edit in the same step. The demo is the cold-store template.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { planBusColumns } from '../../../src/core/workbook/busColumns.ts';
import { planCompensationColumns } from '../../../src/core/workbook/compensationColumns.ts';
import {
  QC,
  QUANTITIES_SHEET,
  savingRowOf,
  summaryRowOf,
} from '../../../src/core/workbook/quantitiesLayout.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { readSummary, type SummaryData } from '../../../src/ui/summary/summaryData.ts';
import { workbookOf } from '../../../src/ui/templates/templateBuild.ts';
import { coreFaces } from '../living/faces.ts';
import { coreQuote } from '../living/quoteFaces.ts';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));

async function open(id: string): Promise<WorkbookSession> {
  return WorkbookSession.fromDoc(await workbookOf(id, readFileSync(`${ROOT}templates/${id}.json`, 'utf8')));
}

function summaryOf(s: WorkbookSession): SummaryData {
  return readSummary((name) => {
    const id = s.engine.getSheetId(name);
    return id === undefined ? undefined : s.engine.getSheetValues(id);
  });
}

const sheet = (s: WorkbookSession, name: string) => s.engine.getSheetId(name) as number;
const value = (s: WorkbookSession, name: string, row: number, col: number) =>
  s.engine.getCellValue({ sheet: sheet(s, name), row, col });
const num = (v: unknown): number => {
  if (typeof v !== 'number') throw new Error(`expected a number, got ${JSON.stringify(v)}`);
  return v;
};

describe('the summary of the cold-store demo', () => {
  it('shows the Buses and Compensation cells of the point of connection, per case', async () => {
    const s = await open('cold-store');
    const d = summaryOf(s);
    const cases = d.cases.map((c) => c.name);
    expect(cases).toEqual(['summer-day', 'winter-night']);
    expect(d.site).toBe('Cold store on an 11 kV supply (invented demo)');
    expect(d.connection).toBe('MV-11');
    const b = planBusColumns(cases);
    const comp = planCompensationColumns(cases);
    d.cases.forEach((c, k) => {
      const cell = (col: number[] | readonly number[]) => value(s, 'Buses', 1, col[k] as number);
      expect(c.p).toBe(cell(b.p));
      expect(c.qBefore).toBe(cell(b.q));
      expect(c.cosBefore).toBe(cell(b.cos));
      expect(c.tanBefore).toBe(cell(b.tan));
      expect(c.qAfter).toBe(cell(b.qAfter));
      expect(c.cosAfter).toBe(cell(b.cosAfter));
      expect(c.tanAfter).toBe(cell(b.tanAfter));
      expect(c.within).toBe(value(s, 'Compensation', 1, comp.within[k] as number));
      // cos φ = P / √(P² + Q²) for sinusoidal quantities (IEC 60050-131-11-46, power factor),
      // tan φ = Q / P: the cells agree with the power triangle of the summary's own P and Q.
      const [p, q] = [num(c.p), num(c.qBefore)];
      expect(num(c.cosBefore)).toBeCloseTo(Math.abs(p) / Math.hypot(p, q), 9);
      expect(num(c.tanBefore)).toBeCloseTo(q / p, 9);
      expect(num(c.tanAfter)).toBeCloseTo(num(c.qAfter) / num(c.pAfter), 9);
    });
  });

  it('agrees with the core (what the command line prints) before and after compensation', async () => {
    const s = await open('cold-store');
    const d = summaryOf(s);
    const core = coreFaces(s);
    if (!core) throw new Error('the demo should read without errors');
    const root = core.faces.buses[0];
    d.cases.forEach((c, k) => {
      const [p, q, cos, pA, qA] = root?.cases[k] ?? [];
      expect(num(c.p)).toBeCloseTo(num(p), 6);
      expect(num(c.qBefore)).toBeCloseTo(num(q), 6);
      expect(num(c.cosBefore)).toBeCloseTo(num(cos), 9);
      expect(num(c.qAfter)).toBeCloseTo(num(qA), 6);
      expect(num(c.cosAfter)).toBeCloseTo(num(pA) / Math.hypot(num(pA), num(qA)), 9);
      expect(c.within).toBe(core.faces.within[k] ? 'yes' : 'no');
    });
  });

  it("shows the rating the quote prices: a blank rating is the design's, and says so", async () => {
    const s = await open('cold-store');
    const comp = planCompensationColumns(['day', 'night']);
    const row = (s.sheetContents(sheet(s, 'Compensation')) as unknown[][]).findIndex(
      (r) => r[0] === 'LV-REF',
    );
    expect(row).toBeGreaterThan(0);
    s.setCells(sheet(s, 'Compensation'), [{ row, col: comp.input.u_rated_kv, content: null }]);
    const line = summaryOf(s).banks.find((b) => b.bus === 'LV-REF');
    // 400 V with 7 % detuning: the capacitors see 0.4 / (1 − 0.07) = 0.430 kV, and their rating
    // must be at least 1.1 × that, 0.473 kV (common practice, from memory); the first LV rating
    // of the IEC 60831-1 series at or above it is 0.48 kV.
    expect((0.4 / (1 - 0.07)) * 1.1).toBeCloseTo(0.473, 3);
    expect(line?.uRated).toBe(0.48);
    expect(line?.uRatedByDesign).toBe(true);
    s.setCells(sheet(s, 'Compensation'), [{ row, col: comp.input.u_rated_kv, content: 0.525 }]);
    const typed = summaryOf(s).banks.find((b) => b.bus === 'LV-REF');
    expect([typed?.uRated, typed?.uRatedByDesign]).toEqual([0.525, false]);
  });

  it('lists the banks of the Compensation sheet and the cost, saving and payback of the Quantities sheet', async () => {
    const s = await open('cold-store');
    const d = summaryOf(s);
    // The template's banks: LV-REF 12.5 + 5 × 40 kvar at 7 % (drives), 0.48 kV; LV-SVC 7.5 kvar fixed
    // and 3 stages of 1:2:4 from 10 kvar (10 + 20 + 40: 7 steps of 10 kvar) at 14 % (electronic
    // load), 0.525 kV: 77.5 kvar in all.
    expect(
      d.banks.map((b) => [
        b.bus,
        b.fixed,
        b.step,
        b.steps,
        b.series,
        b.controllerSteps,
        b.detuning,
        b.uRated,
        b.total,
      ]),
    ).toEqual([
      ['LV-REF', 12.5, 40, 5, undefined, 5, 7, 0.48, 212.5],
      ['LV-SVC', 7.5, 10, 3, '1:2:4', 7, 14, 0.525, 7.5 + 10 + 20 + 40],
    ]);
    const n = 3; // buses MV-11, LV-REF, LV-SVC
    const m = d.money;
    if (!m) throw new Error('no money block');
    expect(m.total).toBe(value(s, QUANTITIES_SHEET, summaryRowOf(n, 'Total'), QC.cost));
    expect(m.saving).toBe(value(s, QUANTITIES_SHEET, savingRowOf(n, 2, 'Annual saving'), QC.cost));
    expect(m.currency).toBe('EUR');
    expect(m.unpriced).toEqual([]);
    // The core prices the same schedule (src/core/quote): the same total; payback = total / saving.
    expect(num(m.total)).toBeCloseTo(num(coreQuote(s).face.total), 6);
    expect(num(m.payback)).toBeCloseTo(num(m.total) / num(m.saving), 9);
    expect(d.demoValues).toBe(true);
    expect(d.bars.get('summer-day')?.map((b) => b.bus)).toEqual(['MV-11', 'LV-REF', 'LV-SVC']);
  });

  it('lists the schedule item by item, as the core prices it', async () => {
    const s = await open('cold-store');
    const m = summaryOf(s).money;
    if (!m) throw new Error('no money block');
    // The core's schedule (src/core/quote) for the same workbook: the same lines, bus by bus.
    const core = coreQuote(s).face.buses.flatMap((b) =>
      b.lines.map((l) => [b.bus, l.code, l.count, l.quantity, l.cost]),
    );
    expect(core.length).toBeGreaterThan(6);
    const page = m.schedule.flatMap((b) => b.items.map((l) => [b.bus, l.item, l.count, l.quantity, l.cost]));
    expect(page.length).toBe(core.length);
    page.forEach((line, i) => {
      const want = core[i] ?? [];
      expect(line.slice(0, 3), `line ${i}`).toEqual(want.slice(0, 3));
      expect(num(line[3])).toBeCloseTo(num(want[3]), 9);
      expect(num(line[4])).toBeCloseTo(num(want[4]), 6);
    });
    // Per-stage switching of the 1:2:4 bank: a contactor line per stage size, each counted once.
    const svc = m.schedule.find((b) => b.bus === 'LV-SVC');
    const contactors = svc?.items.filter((l) => String(l.item).startsWith('LV contactor')) ?? [];
    expect(contactors.map((l) => l.count)).toEqual([1, 1, 1]);
    // Each bus's subtotal is its block's sum on the sheet, and the core's.
    for (const b of coreQuote(s).face.buses)
      expect(num(m.schedule.find((x) => x.bus === b.bus)?.subtotal)).toBeCloseTo(num(b.subtotal), 6);
  });
});

describe('the summary after an edit', () => {
  it('follows a bank typed on the Compensation sheet: cos φ after, total and payback change', async () => {
    const s = await open('cold-store');
    const before = summaryOf(s);
    const cases = before.cases.map((c) => c.name);
    const comp = planCompensationColumns(cases);
    // LV-REF is row 2 of the Compensation sheet: 5 steps become 3.
    const row = s.sheetContents(sheet(s, 'Compensation')).findIndex((r) => r[0] === 'LV-REF');
    s.setCells(sheet(s, 'Compensation'), [{ row, col: comp.input.steps, content: 3 }]);
    const after = summaryOf(s);
    expect(after.banks.find((b) => b.bus === 'LV-REF')?.total).toBe(12.5 + 3 * 40);
    expect(num(after.money?.total)).toBeLessThan(num(before.money?.total));
    expect(num(after.cases[0]?.qAfter)).toBeGreaterThan(num(before.cases[0]?.qAfter));
    const core = coreFaces(s);
    const [, , , pA, qA] = core?.faces.buses[0]?.cases[0] ?? [];
    expect(num(after.cases[0]?.qAfter)).toBeCloseTo(num(qA), 6);
    expect(num(after.cases[0]?.cosAfter)).toBeCloseTo(num(pA) / Math.hypot(num(pA), num(qA)), 9);
    expect(num(after.money?.total)).toBeCloseTo(num(coreQuote(s).face.total), 6);
  });

  it('says "unpriced" and why when a rate is no number, never a smaller total', async () => {
    const s = await open('cold-store');
    const rates = sheet(s, 'Rates');
    const row = s.sheetContents(rates).findIndex((r) => r[0] === 'LV capacitor');
    s.setCells(rates, [{ row, col: 2, content: 'on request' }]);
    const m = summaryOf(s).money;
    expect(m?.total).toBe('unpriced');
    expect(m?.payback).toBe('unpriced');
    expect(m?.unpriced).toEqual(['LV-REF: LV capacitor — no rate', 'LV-SVC: LV capacitor — no rate']);
  });

  it('shows no bank lines and no saving where no bank is chosen', async () => {
    const s = await open('cold-store');
    const comp = planCompensationColumns(summaryOf(s).cases.map((c) => c.name));
    const id = sheet(s, 'Compensation');
    const cells = s
      .sheetContents(id)
      .map((r, row) => ({ row, bus: r[0] }))
      .filter((r) => r.row > 0 && typeof r.bus === 'string' && r.bus !== '' && r.bus !== 'All banks')
      .flatMap(({ row }) => Object.values(comp.input).map((col) => ({ row, col, content: null })));
    s.setCells(id, cells);
    const d = summaryOf(s);
    expect(d.banks).toEqual([]);
    expect(d.money?.saving).toBe(0);
    expect(d.money?.payback).toBe('no saving');
    d.cases.forEach((c) => expect(c.qAfter).toBe(c.qBefore));
  });
});
