// Nothing typed is lost in the browser: an edit made just before a reload (20 times) or before
// the tab is closed (10 times) is there after it, every time; two tabs on one workbook never
// overwrite each other (the later one works on a copy), a newer page that upgrades the storage gets it without losing the open tab's last edit,
// and the page asks before closing while a change is not safe. Each test has a fresh profile;
// the tabs of a test are pages of one persistent browser context.
import { afterEach, beforeAll, afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { buildApp, launch, openApp, serve, type Browser } from './harness.ts';
import { addSheet, cellText, openSheet, saved, typeInCell } from './gridHelpers.ts';

let server: { url: string; close(): Promise<void> };
let browser: Browser | undefined;

beforeAll(async () => {
  await buildApp();
  server = await serve();
});

afterAll(async () => {
  await server?.close();
});

afterEach(async () => {
  await browser?.close();
  browser = undefined;
});

const notice = (page: Page) => page.locator('[data-testid="notice"]').textContent();
const saveStatus = (page: Page) => page.locator('[data-testid="save-status"]').textContent();

async function ready(page: Page): Promise<void> {
  await page.waitForSelector('#app[data-ready="true"]', { timeout: 60_000 });
  await page.waitForSelector('.kl-grid-host td');
}

describe('edits made just before the page goes away', () => {
  it('are kept across 20 reloads, each issued right after the edit (20 of 20)', async () => {
    browser = await launch();
    const page = browser.page;
    // A reload may meet the "leave the page?" question while a write is under way: leave.
    const asked: string[] = [];
    page.on('dialog', (d) => {
      asked.push(d.type());
      void d.accept();
    });
    await openApp(page, server.url);
    await addSheet(page, 'Scratch');
    await saved(page);
    const kept: boolean[] = [];
    const gaps: number[] = [];
    for (let i = 1; i <= 20; i++) {
      const value = String(1000 + i);
      await typeInCell(page, i % 5, i % 3, value);
      // The reload goes out as soon as Enter has committed the edit.
      const typed = Date.now();
      const reloading = page.reload({ waitUntil: 'commit' });
      gaps.push(Date.now() - typed);
      await reloading;
      await ready(page);
      await openSheet(page, 'Scratch');
      kept.push((await cellText(page, i % 5, i % 3)) === value);
    }
    console.log(
      `reloads issued ${Math.max(...gaps)} ms or less after each edit; "leave the page?" asked ${asked.length} time(s)`,
    );
    expect(kept.filter(Boolean)).toHaveLength(20);
    // Every edit is in place at the end, and the page says which edits came from the journal.
    for (let i = 16; i <= 20; i++) expect(await cellText(page, i % 5, i % 3)).toBe(String(1000 + i));
  });
});

describe('edits made just before the tab is closed', () => {
  it('are kept, 10 closes out of 10', async () => {
    browser = await launch();
    let page = browser.page;
    await openApp(page, server.url);
    await addSheet(page, 'Scratch');
    await saved(page);
    const kept: boolean[] = [];
    for (let i = 1; i <= 10; i++) {
      const value = String(2000 + i);
      await typeInCell(page, i % 4, 1, value);
      // Closed straight after Enter, without the "leave the page?" step.
      await page.close();
      page = await browser.context.newPage();
      await openApp(page, server.url);
      await openSheet(page, 'Scratch');
      kept.push((await cellText(page, i % 4, 1)) === value);
    }
    expect(kept.filter(Boolean)).toHaveLength(10);
  });
});

describe('two tabs on one workbook', () => {
  it('the later tab works on a copy, with a notice, and neither overwrites the other', async () => {
    browser = await launch();
    const first = browser.page;
    await openApp(first, server.url);
    await addSheet(first, 'Scratch');
    await typeInCell(first, 0, 0, 'from the first tab');
    await saved(first);

    const second = await browser.context.newPage();
    await openApp(second, server.url);
    expect(await notice(second)).toMatch(/already open in another tab\. This tab works on a copy/);
    expect(await saveStatus(second)).toMatch(/copy/i);
    await expect.poll(() => notice(first)).toMatch(/also open in another tab/);

    await openSheet(second, 'Scratch');
    expect(await cellText(second, 0, 0)).toBe('from the first tab');
    await typeInCell(second, 1, 0, 'from the second tab');
    await expect.poll(() => saveStatus(second)).toMatch(/^Copy saved in this browser/);
    await typeInCell(first, 2, 0, 'first tab again');
    await saved(first);

    // Both reload: the first keeps its own work only; the second's edit is in its copy.
    await first.reload();
    await ready(first);
    await openSheet(first, 'Scratch');
    expect(await cellText(first, 0, 0)).toBe('from the first tab');
    expect(await cellText(first, 1, 0)).toBe('');
    expect(await cellText(first, 2, 0)).toBe('first tab again');

    await first.click('[data-testid="menu-workbook"]');
    await first.click('[data-testid="menu-bring-copy"]');
    const copies = first.locator('[data-testid="copies"] li');
    await expect.poll(() => copies.count()).toBe(1);
    await copies.first().locator('[data-testid="copy-bring-back"]').click();
    await expect.poll(() => notice(first)).toMatch(/Brought back the copy/);
    await openSheet(first, 'Scratch');
    expect(await cellText(first, 1, 0)).toBe('from the second tab');
    expect(browser.errors).toEqual([]);
  });
});

describe('a newer page that upgrades the browser storage', () => {
  it('gets it at once; the open tab keeps its last edit, says it no longer saves, and asks before closing', async () => {
    browser = await launch();
    const open = browser.page;
    await openApp(open, server.url);
    await addSheet(open, 'Scratch');
    await saved(open);
    await typeInCell(open, 0, 0, 'typed just before');

    // Another page asks for the next version of the database (as a newer Kvar Ledger would).
    const newer = await browser.context.newPage();
    await newer.goto(`${server.url}missing-page`);
    const version = await newer.evaluate(
      () =>
        new Promise<number>((resolve, reject) => {
          const probe = indexedDB.open('kvar-ledger');
          probe.onsuccess = () => {
            const next = probe.result.version + 1;
            probe.result.close();
            const req = indexedDB.open('kvar-ledger', next);
            req.onblocked = () => reject(new Error('blocked by the open tab'));
            req.onsuccess = () => {
              req.result.close();
              resolve(req.result.version);
            };
            req.onerror = () => reject(req.error ?? new Error('the request failed'));
          };
        }),
    );
    expect(version).toBeGreaterThan(1);
    await expect.poll(() => saveStatus(open)).toBe('NOT SAVED');
    expect(await notice(open)).toMatch(/newer version in another tab/);

    // A change now cannot be kept in the browser: closing asks first.
    await typeInCell(open, 1, 0, 'not kept in the browser');
    const asked = new Promise<string>((resolve) => open.once('dialog', (d) => resolve(d.type())));
    await open.close({ runBeforeUnload: true });
    expect(await asked).toBe('beforeunload');

    // The edit typed before the upgrade is in the store.
    await newer.goto(server.url);
    await ready(newer);
    await openSheet(newer, 'Scratch');
    expect(await cellText(newer, 0, 0)).toBe('typed just before');
  });
});
