// Design options in the page: on the demo, a bank input typed into an option's block on the
// Design options sheet changes that option's total and payback at once, as the core prices the
// option with that bank (compare.ts over the same rates and tariff), leaves the chosen design (the
// Quantities and cost sheet's total) alone, and one Ctrl+Z puts the option's figures back.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
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
