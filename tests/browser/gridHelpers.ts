// Finding cells and driving the app the way a user does (clicks and keys).
import type { Locator, Page } from 'playwright-core';

/**
 * A cell of the grid by 0-based row and column. Found by the grid's aria indices (row headers
 * and the column header row count as 1), because with frozen rows and columns a cell can be
 * drawn twice: in the main table, under an overlay, and in the overlay on top. The overlays
 * come after the main table in the page, so the last match is the one a user sees and clicks.
 */
export function cell(page: Page, row: number, col: number): Locator {
  return page.locator(`.kl-grid-host tr[aria-rowindex="${row + 2}"] td[aria-colindex="${col + 2}"]`).last();
}

/** The 0-based column whose header (row 1 of a sheet with a header row) reads `header`. */
export async function columnOf(page: Page, header: string): Promise<number> {
  const cols = await page
    .locator('.kl-grid-host tr[aria-rowindex="2"] td')
    .evaluateAll(
      (tds, h) =>
        tds
          .filter((td) => td.textContent?.trim() === h)
          .map((td) => Number(td.getAttribute('aria-colindex')) - 2),
      header,
    );
  if (cols.length === 0) throw new Error(`no column headed "${header}" in sight`);
  return cols[0] as number;
}

/** The 0-based row whose first cell reads `text` (the first such row in sight). */
export async function rowWith(page: Page, text: string): Promise<number> {
  const rows = await page
    .locator('.kl-grid-host td[aria-colindex="2"]')
    .evaluateAll(
      (tds, t) =>
        tds
          .filter((td) => td.textContent?.trim() === t)
          .map((td) => Number(td.parentElement?.getAttribute('aria-rowindex')) - 2),
      text,
    );
  if (rows.length === 0) throw new Error(`no row with "${text}" in column A in sight`);
  return rows[0] as number;
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
