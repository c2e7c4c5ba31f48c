// The Checks panel in the page: input problems located by sheet row and column, with a way to
// the row; compensation findings once the inputs are sound.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { buildApp, launch, openApp, screenshot, serve, type Browser } from './harness.ts';
import { cellText, openSheet, typeInCell } from './gridHelpers.ts';

let server: { url: string; close(): Promise<void> };
let browser: Browser;
let page: Page;

beforeAll(async () => {
  await buildApp();
  server = await serve();
  browser = await launch();
  page = browser.page;
  await openApp(page, server.url);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const summary = () => page.locator('[data-testid="checks-summary"]');

describe('Checks panel', () => {
  it('lists nothing wrong in the demo, then a typed cos φ of 1.3 as an error at its sheet row and column', async () => {
    await page.click('[data-testid="toggle-checks"]');
    await expect.poll(() => summary().textContent(), { timeout: 20_000 }).toMatch(/^0 errors/);
    await openSheet(page, 'Motors');
    expect(await cellText(page, 0, 7)).toMatch(/cos φ/);
    await typeInCell(page, 1, 7, '1.3');
    await expect.poll(() => summary().textContent(), { timeout: 20_000 }).toMatch(/^1 error,/);
    const item = page.locator('.kl-check.is-error').first();
    expect(await item.locator('.kl-check-where').textContent()).toBe('Motors row 2, column cos_phi');
    expect(await item.locator('.kl-check-text').textContent()).toMatch(/must be in \(0, 1\]; got 1\.3/);
    await screenshot(page, '11-checks');
    await openSheet(page, 'Site');
    await item.locator('button').click();
    await expect
      .poll(() => page.locator('[data-testid="sheet-caption"] strong').textContent())
      .toBe('Motors');
    expect(browser.errors).toEqual([]);
  });
});
