// Every structural edit an estimator makes, by keyboard and mouse on the demo, counts at once:
// after each one the root bus's P and Q on the Buses sheet (read from the formula bar, ten
// significant digits) equal the core roll-up of the workbook the page saves (the figures the
// command line prints for that file), the edit moved them the way it must, and one Ctrl+Z puts
// the previous figures back (one undo step), Ctrl+Y brings the edit back.
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, startApp, stopApp, type AppUnderTest, type Browser } from './harness.ts';
import { cell, columnOf, openSheet, rowWith, selectCell, typeInCell } from './gridHelpers.ts';
import { parseWorkbookText } from '../../src/ui/model/docValidate.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { coreFaces } from '../ui/living/faces.ts';

let app: AppUnderTest | undefined;
let browser: Browser;
let page: Page;
let dir: string;

beforeAll(async () => {
  app = await startApp();
  ({ browser, page } = app);
  dir = await mkdtemp(join(tmpdir(), 'kl-living-'));
});

afterAll(async () => {
  await stopApp(app);
  if (dir) await rm(dir, { recursive: true, force: true });
});

const ROOT_BUS = 'MV-11';
const FIRST_CASE = 'summer-day';
type PQ = { p: number; q: number };

/** The value of a cell at full precision, as the formula bar shows it. */
async function valueAt(row: number, col: number): Promise<number> {
  await selectCell(page, row, col);
  const text = (await page.locator('[data-testid="fb-value"]').textContent()) ?? '';
  // The value and its unit ("1357.092339 kW").
  const n = Number(/^\S+/.exec(text.replace(/,/g, ''))?.[0]);
  if (!Number.isFinite(n)) throw new Error(`not a number in the formula bar: "${text}"`);
  return n;
}

/** Root P and Q of the first case, read from the Buses sheet as the page shows them. */
async function rootOnPage(): Promise<PQ> {
  await openSheet(page, 'Buses');
  const r = await rowWith(page, ROOT_BUS);
  const p = await valueAt(r, await columnOf(page, `P ${FIRST_CASE} (kW)`));
  const q = await valueAt(r, await columnOf(page, `Q ${FIRST_CASE} (kvar)`));
  return { p, q };
}

/** Root P and Q by the core roll-up of the workbook the page saves now (Ctrl+S). */
async function rootOfSavedFile(): Promise<PQ> {
  const download = page.waitForEvent('download');
  await page.keyboard.press('Control+s');
  const path = join(dir, 'saved.kvar.json');
  await (await download).saveAs(path);
  const opened = parseWorkbookText(await readFile(path, 'utf8'));
  if (!opened.ok) throw new Error(opened.message);
  const s = WorkbookSession.fromDoc(opened.doc);
  const core = coreFaces(s);
  s.destroy();
  if (!core) throw new Error('the saved workbook has input errors');
  const k = core.cases.indexOf(FIRST_CASE);
  const root = core.faces.buses.find((b) => b.bus === ROOT_BUS)?.cases[k];
  if (!root) throw new Error(`no ${ROOT_BUS} in the saved workbook`);
  return { p: root[0], q: root[1] };
}

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-8 * Math.max(1, Math.abs(a), Math.abs(b));

/**
 * Do an edit on the Motors sheet, then check: page = core of the saved file; the change is what `expectChange` says;
 * Ctrl+Z once per action (`steps`: one per typed cell, one for any other edit) gives back the
 * figures from before, Ctrl+Y as often brings the edit back. Returns the figures after the edit.
 */
async function editAndCheck(
  what: string,
  edit: () => Promise<void>,
  expectChange: (before: PQ, after: PQ) => void,
  steps = 1,
): Promise<PQ> {
  const before = await rootOnPage();
  await openSheet(page, 'Motors');
  await edit();
  await expect.poll(async () => close((await rootOnPage()).p, before.p), { timeout: 10_000 }).toBe(false);
  const after = await rootOnPage();
  const core = await rootOfSavedFile();
  expect(close(after.p, core.p), `${what}: page P ${after.p}, core ${core.p}`).toBe(true);
  expect(close(after.q, core.q), `${what}: page Q ${after.q}, core ${core.q}`).toBe(true);
  expectChange(before, after);
  for (let i = 0; i < steps; i++) await page.keyboard.press('Control+z');
  const undone = await rootOnPage();
  expect(close(undone.p, before.p) && close(undone.q, before.q), `${what}: ${steps} × Ctrl+Z`).toBe(true);
  for (let i = 0; i < steps; i++) await page.keyboard.press('Control+y');
  const redone = await rootOnPage();
  expect(close(redone.p, after.p) && close(redone.q, after.q), `${what}: Ctrl+Y`).toBe(true);
  return after;
}

async function rowMenu(row: number, col: number, item: string): Promise<void> {
  await cell(page, row, col).click({ button: 'right' });
  await page.locator('[data-testid="grid-menu"] .kl-menu-item', { hasText: item }).click();
}

// A motor of 90 kW output at 95 % efficiency draws 90 / 0.95 = 94.7 kW at full load; on the root
// bus the transformer's losses at the new loading come on top, so P rises by at least that much
// (input power by definition of efficiency, IEC 60034-2-1).
const MOTOR = { kw: 90, eff: 0.95, cos: 0.86 };
const MOTOR_INPUT = MOTOR.kw / MOTOR.eff;

/** Type a motor's five inputs, one cell after the other (five undo steps). */
async function typeMotor(row: number, tag: string, bus: string): Promise<void> {
  await openSheet(page, 'Motors');
  await typeInCell(page, row, await columnOf(page, 'Tag'), tag);
  await typeInCell(page, row, await columnOf(page, 'Bus'), bus);
  await typeInCell(page, row, await columnOf(page, 'Rated output (kW)'), String(MOTOR.kw));
  await typeInCell(page, row, await columnOf(page, 'Efficiency'), String(MOTOR.eff));
  await typeInCell(page, row, await columnOf(page, 'cos φ'), String(MOTOR.cos));
}

describe('the equipment list is a living table', () => {
  it('a motor typed into the first empty row of Motors counts at once', async () => {
    // The demo lists five motors (sheet rows 2–6): row 7 is the first empty one.
    await editAndCheck(
      'typed motor',
      () => typeMotor(6, 'M-NEW1', 'LV-REF'),
      (b, a) => expect(a.p - b.p).toBeGreaterThan(MOTOR_INPUT),
      5,
    );
    await screenshot(page, '30-living-typed');
  });

  it('rows inserted above an existing row take a motor that counts', async () => {
    await openSheet(page, 'Motors');
    await rowMenu(3, await columnOf(page, 'Bus'), 'Insert rows above');
    await editAndCheck(
      'inserted row',
      () => typeMotor(3, 'M-INS', 'LV-SVC'),
      (b, a) => expect(a.p - b.p).toBeGreaterThan(MOTOR_INPUT),
      5,
    );
  });

  it('two rows pasted from another spreadsheet count, each on its bus', async () => {
    await openSheet(page, 'Motors');
    const tag = await columnOf(page, 'Tag');
    const bus = await columnOf(page, 'Bus');
    const kw = await columnOf(page, 'Rated output (kW)');
    expect(kw - bus).toBeGreaterThan(1);
    // Tag, Description, Bus, Qty, Running, Rated output, Efficiency, cos φ: the sheet's column order.
    const line = (t: string, b: string) =>
      [t, 'pasted', b, '', '', String(MOTOR.kw), String(MOTOR.eff), String(MOTOR.cos)].join('\t');
    await page.evaluate(
      (text) => navigator.clipboard.writeText(text),
      `${line('M-P1', 'LV-REF')}\n${line('M-P2', 'LV-SVC')}\n`,
    );
    await editAndCheck(
      'pasted rows',
      async () => {
        await selectCell(page, 9, tag);
        await page.keyboard.press('Control+v');
      },
      (b, a) => expect(a.p - b.p).toBeGreaterThan(2 * MOTOR_INPUT),
    );
  });

  it('fill down copies a quantity to the rows below, and they count', async () => {
    await openSheet(page, 'Motors');
    const qty = await columnOf(page, 'Qty');
    await typeInCell(page, 9, qty, '3');
    // Rows 10 and 11 (M-P1, M-P2) now: 3 × M-P1; fill the 3 down onto M-P2.
    await editAndCheck(
      'fill down',
      async () => {
        await selectCell(page, 9, qty);
        await page.keyboard.down('Shift');
        await selectCell(page, 10, qty);
        await page.keyboard.up('Shift');
        await page.keyboard.press('Control+d');
      },
      (b, a) => expect(a.p - b.p).toBeGreaterThan(2 * MOTOR_INPUT),
    );
  });

  it('deleting a row takes its motor out of the totals', async () => {
    await openSheet(page, 'Motors');
    const bus = await columnOf(page, 'Bus');
    await editAndCheck(
      'deleted row',
      () => rowMenu(3, bus, 'Delete rows'),
      (b, a) => expect(b.p - a.p).toBeGreaterThan(MOTOR_INPUT),
    );
  });

  it("changing a row's bus moves its motor; the root still carries it", async () => {
    await openSheet(page, 'Motors');
    const bus = await columnOf(page, 'Bus');
    const r = await rowWith(page, 'M-NEW1');
    await editAndCheck(
      'bus changed',
      () => typeInCell(page, r, bus, 'LV-SVC'),
      // Same load, another transformer: only the transformers' losses differ (a few kW at most).
      (b, a) => {
        expect(Math.abs(a.p - b.p)).toBeLessThan(0.05 * MOTOR_INPUT);
        expect(a.p).not.toBe(b.p);
      },
    );
  });

  it('cut and paste moves rows without changing the totals; sorting likewise', async () => {
    await openSheet(page, 'Motors');
    const tag = await columnOf(page, 'Tag');
    const r = await rowWith(page, 'M-NEW1');
    const before = await rootOnPage();
    await openSheet(page, 'Motors');
    await selectCell(page, r, tag);
    await page.keyboard.down('Shift');
    await selectCell(page, r, await columnOf(page, 'cos φ'));
    await page.keyboard.up('Shift');
    await page.keyboard.press('Control+x');
    const cut = await rootOnPage();
    expect(before.p - cut.p).toBeGreaterThan(MOTOR_INPUT);
    await openSheet(page, 'Motors');
    await selectCell(page, 14, tag);
    await page.keyboard.press('Control+v');
    await expect.poll(async () => close((await rootOnPage()).p, before.p), { timeout: 10_000 }).toBe(true);
    expect(close((await rootOfSavedFile()).p, before.p)).toBe(true);

    await openSheet(page, 'Motors');
    await rowMenu(1, await columnOf(page, 'Rated output (kW)'), 'Sort rows by this column, descending');
    await openSheet(page, 'Motors');
    const kw = await columnOf(page, 'Rated output (kW)');
    expect(Number((await cell(page, 1, kw).textContent())?.replace(/,/g, ''))).toBe(250);
    await screenshot(page, '31-living-sorted');
    const sorted = await rootOnPage();
    expect(close(sorted.p, before.p) && close(sorted.q, before.q)).toBe(true);
    await page.keyboard.press('Control+z');
    await openSheet(page, 'Motors');
    expect(await rowWith(page, 'M-NEW1')).toBe(14);
  });

  it('a bus renamed on the Buses sheet is renamed on every row, totals unchanged', async () => {
    const before = await rootOnPage();
    await openSheet(page, 'Buses');
    await typeInCell(page, await rowWith(page, 'LV-SVC'), 0, 'LV-SERVICE');
    await openSheet(page, 'Motors');
    const bus = await columnOf(page, 'Bus');
    const row = await rowWith(page, 'M-NEW1'); // moved to LV-SVC above
    await expect.poll(() => cell(page, row, bus).textContent()).toBe('LV-SERVICE');
    const after = await rootOnPage();
    expect(close(after.p, before.p) && close(after.q, before.q)).toBe(true);
    const core = await rootOfSavedFile();
    expect(close(core.p, after.p)).toBe(true);
  });

  it('logged no console errors', () => {
    expect(browser.errors).toEqual([]);
  });
});
