// Design options in the page: on the demo, a bank input typed into an option's block on the
// Design options sheet changes that option's total and payback at once, as the core prices the
// option with that bank (compare.ts over the same rates and tariff), leaves the chosen design (the
// Quantities and cost sheet's total) alone, and one Ctrl+Z puts the option's figures back.
import { readFileSync } from 'node:fs';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { selectCell } from './gridHelpers.ts';
import { ROOT, screenshot, startApp, stopApp, type AppUnderTest, type Browser } from './harness.ts';
import { compareOptions, draftOptions } from '../../src/core/options/index.ts';
import { demoRateTable, readTariff, tariffSheetDoc } from '../../src/core/quote/index.ts';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { busKey } from '../../src/core/site/busNames.ts';
import { inputsFromSite } from '../../src/core/workbook/inputsFromSite.ts';
import {
  OPTIONS_SHEET,
  TABLE,
  blockOrigin,
  planOptionColumns,
  tableRow,
} from '../../src/core/workbook/optionsLayout.ts';
import { QC, QUANTITIES_SHEET, busLineRow, summaryRowOf } from '../../src/core/workbook/quantitiesLayout.ts';
import { columnLetters } from '../../src/core/workbook/refs.ts';
import { renderWorkbook } from '../../src/core/workbook/render.ts';

let app: AppUnderTest | undefined;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  app = await startApp();
  ({ browser, page } = app);
});

afterAll(async () => {
  await stopApp(app);
});

// The demo is the cold-store template with its banks.
const demo = readSiteFile(readFileSync(join(ROOT, 'templates/cold-store.json'), 'utf8'));
const structure = renderWorkbook(inputsFromSite(demo.site, demo.banks ?? []), { flavour: 'live' }).structure;
const n = structure.buses.length;
const cases = demo.site.settings.cases;
const at = (sheet: string, row: number, col: number) => `'${sheet}'!${columnLetters(col)}${row + 1}`;
const OPTION_TOTAL = at(OPTIONS_SHEET, tableRow(1), TABLE.total.col);
const OPTION_PAYBACK = at(OPTIONS_SHEET, tableRow(1), TABLE.payback.col);
const CHOSEN_TOTAL = at(QUANTITIES_SHEET, summaryRowOf(n, 'Total'), QC.cost);

async function goTo(address: string): Promise<void> {
  await page.keyboard.press('Control+g');
  const prompt = page.locator('[data-testid="prompt"]');
  await prompt.locator('input').fill(address);
  await page.keyboard.press('Enter');
  await expect.poll(() => page.locator('[data-testid="fb-address"]').textContent()).toBe(address);
}

/** The active cell's value at full precision, as the formula bar shows it. */
async function valueOf(address: string): Promise<number> {
  await goTo(address);
  const text = (await page.locator('[data-testid="fb-value"]').textContent()) ?? '';
  const x = Number(/^\S+/.exec(text.replace(/,/g, ''))?.[0]);
  if (!Number.isFinite(x)) throw new Error(`not a number in the formula bar at ${address}: "${text}"`);
  return x;
}

describe("a bank typed into an option's block", () => {
  it("changes that option's total and payback as the core prices it, not the chosen design's; undo restores", async () => {
    const plain = draftOptions(demo.site)[1]!; // block 2: plain capacitors
    const bank = plain.banks.find((b) => (b.steps ?? 0) > 0)!;
    const i = structure.busIndex.get(busKey(bank.bus)) as number;
    const cols = planOptionColumns(cases);
    const stepsCell = at(OPTIONS_SHEET, busLineRow(i, blockOrigin(1, n, cases.length)), cols.input.steps);
    const [before, payback, chosen] = [
      await valueOf(OPTION_TOTAL),
      await valueOf(OPTION_PAYBACK),
      await valueOf(CHOSEN_TOTAL),
    ];
    await goTo(stepsCell);
    await page.keyboard.type(String((bank.steps as number) + 2), { delay: 5 });
    await page.keyboard.press('Enter');
    // The core's figures for the plain option with two more steps on that bus.
    const tariff = readTariff(tariffSheetDoc(cases).cells, cases).tariff;
    const banks = plain.banks.map((b) => (b === bank ? { ...b, steps: (bank.steps as number) + 2 } : b));
    const [want] = compareOptions(demo.site, [{ ...plain, banks }], demoRateTable(), tariff);
    await expect.poll(() => valueOf(OPTION_TOTAL)).toBeCloseTo(want!.total as number, 6);
    expect(await valueOf(OPTION_TOTAL)).toBeGreaterThan(before);
    expect(await valueOf(OPTION_PAYBACK)).toBeCloseTo(want!.payback_years as number, 6);
    expect(await valueOf(CHOSEN_TOTAL)).toBeCloseTo(chosen, 6);
    await screenshot(page, 'options-edited');
    await page.keyboard.press('Control+z');
    await expect.poll(() => valueOf(OPTION_TOTAL)).toBeCloseTo(before, 6);
    expect(await valueOf(OPTION_PAYBACK)).toBeCloseTo(payback, 6);
  });

  it('logged no console errors', () => {
    expect(browser.errors).toEqual([]);
  });
});

describe('an option input that cannot be read', () => {
  it('is an error in Checks at its row and column, and the option is listed without figures', async () => {
    const cols = planOptionColumns(cases);
    const plain = draftOptions(demo.site)[1]!;
    const bank = plain.banks.find((b) => (b.steps ?? 0) > 0)!;
    const i = structure.busIndex.get(busKey(bank.bus)) as number;
    const row = busLineRow(i, blockOrigin(1, n, cases.length));
    await goTo(at(OPTIONS_SHEET, row, cols.input.steps));
    await page.keyboard.type('six', { delay: 5 });
    await page.keyboard.press('Enter');
    await page.click('[data-testid="toggle-checks"]');
    const summary = page.locator('[data-testid="checks-summary"]');
    await expect.poll(() => summary.textContent(), { timeout: 20_000 }).toMatch(/^1 error,/);
    const item = page.locator('.kl-check.is-error').first();
    expect(await item.locator('.kl-check-where').textContent()).toBe(
      `${OPTIONS_SHEET} row ${row + 1}, column Steps`,
    );
    expect(await item.locator('.kl-check-text').textContent()).toBe(
      'must be a number; got "six"; the option "Plain capacitors" is not worked out until this is mended',
    );
    await page.click('[data-testid="options-compare"]');
    const unread = page.locator('[data-testid="options"] .kl-option[data-unread="true"]');
    await expect.poll(() => unread.count(), { timeout: 30_000 }).toBe(1);
    expect(await unread.textContent()).toContain(
      `row ${row + 1}, column "Steps": must be a number; got "six"`,
    );
    expect(await page.locator('[data-testid="options"] .kl-option').count()).toBe(5);
    await screenshot(page, 'options-unread');
    // Back to the grid (the panel's button has the focus), then undo the typing.
    await selectCell(page, row, 0);
    await page.keyboard.press('Control+z');
    await expect.poll(() => summary.textContent(), { timeout: 20_000 }).toMatch(/^0 errors/);
    await page.click('[data-testid="toggle-checks"]');
  });
});

describe('a workbook saved before the Design options sheet', () => {
  it('opens with the options the design drafts for it, priced as the core prices them', async () => {
    const work = await mkdtemp(join(tmpdir(), 'kvar-options-'));
    const download = page.waitForEvent('download');
    await page.keyboard.press('Control+s');
    const file = join(work, 'older.kvar.json');
    await (await download).saveAs(file);
    const doc = JSON.parse(await readFile(file, 'utf8')) as { sheets: Array<{ name: string }> };
    doc.sheets = doc.sheets.filter((sh) => sh.name !== OPTIONS_SHEET);
    await writeFile(file, JSON.stringify(doc));
    const chooser = page.waitForEvent('filechooser');
    await page.click('[data-testid="menu-workbook"]');
    await page.click('[data-testid="menu-open"]');
    await (await chooser).setFiles(file);
    await expect.poll(() => page.locator('[data-testid="sheet-caption"] strong').textContent()).toBe('Site');
    await selectCell(page, 1, 1);
    // The core's figures for the plain option the design drafts for the demo site.
    const tariff = readTariff(tariffSheetDoc(cases).cells, cases).tariff;
    const [want] = compareOptions(demo.site, [draftOptions(demo.site)[1]!], demoRateTable(), tariff);
    await expect.poll(() => valueOf(OPTION_TOTAL), { timeout: 30_000 }).toBeCloseTo(want!.total as number, 6);
    expect(await valueOf(OPTION_PAYBACK)).toBeCloseTo(want!.payback_years as number, 6);
    await screenshot(page, 'options-drafted');
    await rm(work, { recursive: true, force: true });
  });
});

describe('the page', () => {
  it('logged no console errors after these', () => {
    expect(browser.errors).toEqual([]);
  });
});
