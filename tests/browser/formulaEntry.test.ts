// Committing a typed formula in the browser, in the cell and in the formula bar: an open bracket
// is closed on Enter; ';' between arguments is read as ','; a ';' that cannot be (a decimal comma
// elsewhere) gets a message in words in the formula bar, not the engine's parser dump.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { buildApp, launch, openApp, serve, type Browser } from './harness.ts';
import { addSheet, cellText, selectCell, typeInCell } from './gridHelpers.ts';

let server: { url: string; close(): Promise<void> };
let browser: Browser;
let page: Page;

beforeAll(async () => {
  await buildApp();
  server = await serve();
  browser = await launch();
  page = browser.page;
  await openApp(page, server.url);
  await addSheet(page, 'Entry');
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const fb = (id: string) => page.locator(`[data-testid="fb-${id}"]`);

async function typeInBar(row: number, col: number, text: string): Promise<void> {
  await selectCell(page, row, col);
  await fb('input').fill(text);
  await fb('input').press('Enter');
}

describe('a typed formula on Enter', () => {
  it('in the cell: the open bracket is closed', async () => {
    await typeInCell(page, 0, 0, '=SUM(1,2');
    await expect.poll(() => cellText(page, 0, 0)).toBe('3');
    await selectCell(page, 0, 0);
    await expect.poll(() => fb('input').inputValue()).toBe('=SUM(1,2)');
  });

  it('in the cell: ";" between arguments is read as ","', async () => {
    await typeInCell(page, 1, 0, '=KVA.TOTAL(3;4)');
    await expect.poll(() => cellText(page, 1, 0)).toBe('5');
  });

  it('in the formula bar: both, in one formula', async () => {
    await typeInBar(2, 0, '=KVA.TOTAL(6;8');
    await expect.poll(() => cellText(page, 2, 0)).toBe('10');
    await selectCell(page, 2, 0);
    await expect.poll(() => fb('input').inputValue()).toBe('=KVA.TOTAL(6,8)');
  });

  it('";" beside a decimal comma stays as typed and is explained in words', async () => {
    await typeInCell(page, 3, 0, '=KVAR.LOAD(50;0,9)');
    await selectCell(page, 3, 0);
    await expect.poll(() => fb('problem').textContent()).toMatch(/";" at character 14 is not read here/);
    const problem = (await fb('problem').textContent()) ?? '';
    expect(problem).toContain('arguments are separated by "," and decimals written with "."');
    expect(problem).not.toMatch(/Parsing error|-->/);
    await expect.poll(() => fb('input').inputValue()).toBe('=KVAR.LOAD(50;0,9)');
  });

  it('logged no console errors', () => {
    expect(browser.errors).toEqual([]);
  });
});
