// Pricing in the page: on the demo, a rate typed on the Rates sheet reaches the "Quantities and
// cost" sheet's total at once, by exactly the change an estimator works out by hand (quantity ×
// change of rate, through installation, engineering and contingency), the simple payback moves
// to the new total over the unchanged annual saving, and one Ctrl+Z puts the total back. The
// quantities come from the core schedule of the same template (src/core/quote).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { ROOT, screenshot, startApp, stopApp, type AppUnderTest, type Browser } from './harness.ts';
import { cellText } from './gridHelpers.ts';
import { demoRateTable, siteSchedule } from '../../src/core/quote/index.ts';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { QC, QUANTITIES_SHEET, savingRowOf, summaryRowOf } from '../../src/core/workbook/quantitiesLayout.ts';
import { columnLetters } from '../../src/core/workbook/refs.ts';
import { inputsFromSite } from '../../src/core/workbook/inputsFromSite.ts';
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
const demoBanks = demo.banks ?? [];
const busCount = renderWorkbook(inputsFromSite(demo.site, demoBanks), { flavour: 'live' }).structure.buses
  .length;
const costCell = (row: number) => `'${QUANTITIES_SHEET}'!${columnLetters(QC.cost)}${row + 1}`;
const TOTAL = costCell(summaryRowOf(busCount, 'Total'));
const cases = demo.site.settings.cases.length;
const SAVING = costCell(savingRowOf(busCount, cases, 'Annual saving'));
const PAYBACK = costCell(savingRowOf(busCount, cases, 'Simple payback (years)'));

async function goTo(address: string): Promise<void> {
  await page.keyboard.press('Control+g');
  const prompt = page.locator('[data-testid="prompt"]');
  await prompt.locator('input').fill(address);
  await page.keyboard.press('Enter');
  await expect.poll(() => page.locator('[data-testid="fb-address"]').textContent()).toBe(address);
}

/** The active cell's value at full precision, as the formula bar shows it. */
async function value(): Promise<number> {
  const text = (await page.locator('[data-testid="fb-value"]').textContent()) ?? '';
  const n = Number(/^\S+/.exec(text.replace(/,/g, ''))?.[0]);
  if (!Number.isFinite(n)) throw new Error(`not a number in the formula bar: "${text}"`);
  return n;
}

async function total(): Promise<number> {
  await goTo(TOTAL);
  return value();
}

async function valueOf(address: string): Promise<number> {
  await goTo(address);
  return value();
}

describe('a rate typed on the Rates sheet', () => {
  it('changes the total by quantity × change, through the surcharges, and the payback with it', async () => {
    const before = await total();
    const saving = await valueOf(SAVING);
    expect(saving).toBeGreaterThan(0);
    expect(await valueOf(PAYBACK)).toBeCloseTo(before / saving, 6);
    const rates = demoRateTable();
    expect(rates.rates[0]?.item).toBe('LV capacitor'); // row 2 of the Rates sheet
    const kvar = siteSchedule(demo.site, demoBanks)
      .flatMap((b) => b.items)
      .filter((i) => i.code === 'LV capacitor')
      .reduce((s, i) => s + (i.quantity ?? 0), 0);
    expect(kvar).toBeGreaterThan(0);
    const old = rates.rates[0]?.rate as number;
    await goTo('Rates!C2');
    await page.keyboard.type(String(old + 10), { delay: 5 });
    await page.keyboard.press('Enter');
    const { Installation, Engineering, Contingency } = rates.surcharges;
    const expected = before + 10 * kvar * (1 + (Installation + Engineering) / 100) * (1 + Contingency / 100);
    const after = await total();
    expect(Math.abs(after - expected)).toBeLessThan(1e-6 * expected);
    // The rates do not change what compensation saves; the payback is the new total over it.
    expect(await valueOf(SAVING)).toBeCloseTo(saving, 6);
    expect(await valueOf(PAYBACK)).toBeCloseTo(after / saving, 6);
    await screenshot(page, 'quantities-total');
    await page.keyboard.press('Control+z');
    await expect.poll(total).toBeCloseTo(before, 6);
  });

  it('a rate that is no number shows "unpriced" as the total, never a smaller sum', async () => {
    await goTo('Rates!C2');
    await page.keyboard.type('ask', { delay: 5 });
    await page.keyboard.press('Enter');
    await goTo(TOTAL);
    await expect.poll(() => cellText(page, summaryRowOf(busCount, 'Total'), QC.cost)).toBe('unpriced');
    await page.keyboard.press('Control+z');
    await expect.poll(total).toBeGreaterThan(0);
  });

  it('logged no console errors', () => {
    expect(browser.errors).toEqual([]);
  });
});
