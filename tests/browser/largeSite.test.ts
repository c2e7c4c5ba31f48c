// A large invented site (the benchmark generator's: one point of connection, a ring of MV buses,
// about 300 LV buses, 4,000 equipment rows) in the page: opening it shows progress and can be
// cancelled without touching the open workbook; once open, the diagram stays readable by
// collapsing the deepest level, and a branch opens on demand. Screenshots: 30-… and 31-….
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import { generateSite } from '../bench/generateSite.ts';
import { buildApp, launch, openApp, screenshot, serve, type Browser } from './harness.ts';

let server: { url: string; close(): Promise<void> };
let browser: Browser;
let page: Page;
let dir: string;
let file: string;

beforeAll(async () => {
  const site = generateSite({ rows: 4000, buses: 300 });
  dir = await mkdtemp(join(tmpdir(), 'kl-large-'));
  file = join(dir, 'large-site.kvar.json');
  await writeFile(file, JSON.stringify(buildWorkbook(site, { flavour: 'live' })));
  await buildApp();
  server = await serve();
  browser = await launch();
  page = browser.page;
  await openApp(page, server.url);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
  if (dir) await rm(dir, { recursive: true, force: true });
});

const title = () => page.locator('[data-testid="title"]').inputValue();

async function chooseFile(): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.click('[data-testid="menu-workbook"]');
  await page.click('[data-testid="menu-open"]');
  await (await chooser).setFiles(file);
}

describe('a large site', () => {
  it('shows progress while opening, and Cancel leaves the open workbook as it was', async () => {
    const before = await title();
    // The user's click on Cancel the moment the dialog shows. (Playwright's own click waits for
    // the page to answer, which it does only between the steps of the work; a user's click
    // during a step is queued by the browser, like this one, and seen before the next step.)
    await page.evaluate(() => {
      const w = window as unknown as { klCancelledAt?: string };
      new MutationObserver((_, observer) => {
        const dialog = document.querySelector('[data-testid="progress"]');
        if (!dialog) return;
        observer.disconnect();
        setTimeout(() => {
          w.klCancelledAt = dialog.querySelector('[data-testid="progress-step"]')?.textContent ?? '';
          dialog.querySelector<HTMLButtonElement>('[data-testid="progress-cancel"]')?.click();
        }, 0);
      }).observe(document.body, { childList: true });
    });
    await chooseFile();
    await expect
      .poll(() => page.locator('[data-testid="notice"]').textContent(), { timeout: 60_000 })
      .toBe('Cancelled: the open workbook is unchanged.');
    expect(await page.evaluate(() => (window as unknown as { klCancelledAt?: string }).klCancelledAt)).toBe(
      'Reading the file…',
    );
    expect(await page.locator('[data-testid="progress"]').count()).toBe(0);
    expect(await title()).toBe(before);
  });

  it('opens, and its diagram collapses the deepest level with a way into each branch', async () => {
    await chooseFile();
    await expect.poll(title, { timeout: 120_000 }).toMatch(/^Bench site 4000 rows/);
    await page.click('[data-testid="toggle-diagram"]');
    const diagram = page.locator('[data-testid="diagram"]');
    const summary = diagram.locator('[data-testid="diagram-summary"]');
    await expect.poll(() => summary.textContent(), { timeout: 60_000 }).toMatch(/^300 buses · 16 shown/);
    expect(await diagram.locator('[data-bus]').count()).toBe(16);
    const more = diagram.locator('[data-expand="MV-1"]');
    expect(await more.locator('.kl-dg-more-text').textContent()).toMatch(/^\+\d+ buses below$/);
    await screenshot(page, '31-large-diagram');
    await more.click();
    await expect.poll(() => diagram.locator('[data-bus]').count()).toBeGreaterThan(16);
    expect(await summary.textContent()).toMatch(/^300 buses · \d+ shown/);
    expect(browser.errors).toEqual([]);
  });
});
