// Finding cells and driving the app the way a user does (clicks and keys).
import type { Locator, Page } from 'playwright-core';

/** A cell of the main grid by 0-based row and column (row headers excluded). */
export function cell(page: Page, row: number, col: number): Locator {
  return page.locator('.kl-grid-host .ht_master .htCore tbody tr').nth(row).locator('td').nth(col);
}

export async function cellText(page: Page, row: number, col: number): Promise<string> {
  return (await cell(page, row, col).textContent()) ?? '';
}

export async function selectCell(page: Page, row: number, col: number): Promise<void> {
  await cell(page, row, col).click();
}

/** Type into the active cell and commit with Enter. */
export async function typeInCell(page: Page, row: number, col: number, text: string): Promise<void> {
  await selectCell(page, row, col);
  await page.keyboard.type(text, { delay: 5 });
  await page.keyboard.press('Enter');
}

export async function openSheet(page: Page, name: string): Promise<void> {
  await page.locator(`[data-testid="sheet-tab"][data-sheet="${name}"]`).click();
  await page.waitForFunction(
    (n) => document.querySelector('[data-testid="sheet-caption"] strong')?.textContent === n,
    name,
  );
}

export async function addSheet(page: Page, name: string): Promise<void> {
  await page.click('[data-testid="sheet-add"]');
  const input = page.locator('[data-testid="prompt"] input');
  await input.fill(name);
  await page.locator('[data-testid="prompt"] .kl-btn-primary').click();
  await page.waitForFunction(
    (n) => document.querySelector('[data-testid="sheet-caption"] strong')?.textContent === n,
    name,
  );
}

export async function sheetNames(page: Page): Promise<string[]> {
  return page
    .locator('[data-testid="sheet-tab"]')
    .evaluateAll((els) => els.map((e) => e.getAttribute('data-sheet') ?? ''));
}

export async function saved(page: Page): Promise<void> {
  await page.waitForFunction(() =>
    /^Saved in this browser/.test(document.querySelector('[data-testid="save-status"]')?.textContent ?? ''),
  );
}
