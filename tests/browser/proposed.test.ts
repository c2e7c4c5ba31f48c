// A detuning typed alone on the Compensation sheet, by keyboard on the demo: the row fills with
// the design's bank, each filled cell marked as proposed (class and hover note, not a colour
// alone); typing over a value ends its mark; one Ctrl+Z takes the typed value back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, startApp, stopApp, type AppUnderTest, type Browser } from './harness.ts';
import { cell, cellText, columnOf, openSheet, selectCell, typeInCell } from './gridHelpers.ts';

let app: AppUnderTest | undefined;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  app = await startApp();
  ({ browser, page } = app);
  // The design behind a detuning typed alone loads once the workbook is on screen.
  await page.waitForSelector('#app[data-proposer="ready"]', { state: 'attached' });
});

afterAll(async () => {
  await stopApp(app);
});

describe('a detuning typed alone', () => {
  it('fills the row with the proposed bank, marked; typing over a value ends its mark', async () => {
    expect(browser).toBeDefined();
    await openSheet(page, 'Compensation');
    const fixed = await columnOf(page, 'Fixed (kvar)');
    const step = await columnOf(page, 'Step (kvar)');
    const steps = await columnOf(page, 'Steps');
    const series = await columnOf(page, 'Step series');
    const p = await columnOf(page, 'Detuning p (%)');
    // The first bus row where the demo's design put a bank (its steps are filled).
    let row = 0;
    for (let r = 1; r < 12 && row === 0; r++) if ((await cellText(page, r, steps)).trim() !== '') row = r;
    expect(row).toBeGreaterThan(0);
    const stepBefore = (await cellText(page, row, step)).trim();

    // Clear the sizes (fixed part to step series, one selection), then type only p = 7 %.
    await selectCell(page, row, fixed);
    for (let c = fixed; c < series; c++) await page.keyboard.press('Shift+ArrowRight');
    await page.keyboard.press('Delete');
    await typeInCell(page, row, p, '7');

    const stepCell = cell(page, row, step);
    await expect.poll(async () => (await cellText(page, row, step)).trim()).not.toBe('');
    expect(await stepCell.getAttribute('class')).toMatch(/kl-mark-proposed/);
    expect(await stepCell.getAttribute('title')).toMatch(
      /^Proposed: proposed by the design on .* UTC for bus .*, detuned 7 %.*typing over it makes the value yours/,
    );
    expect(await cell(page, row, steps).getAttribute('class')).toMatch(/kl-mark-proposed/);
    // The detuning itself was typed: no mark on it.
    expect(await cell(page, row, p).getAttribute('class')).not.toMatch(/kl-mark-proposed/);
    await screenshot(page, 'proposed-detuning');
    // The proposal is the design's for 7 %; the demo's own bank may differ, so only its presence counts.
    expect(stepBefore).not.toBe('');

    // Typing over the step makes it the user's: the value stays, the mark goes.
    await typeInCell(page, row, step, '33');
    await expect.poll(async () => (await cellText(page, row, step)).trim()).toBe('33.0');
    expect(await cell(page, row, step).getAttribute('class')).not.toMatch(/kl-mark-proposed/);
    expect(await cell(page, row, steps).getAttribute('class')).toMatch(/kl-mark-proposed/);

    // One Ctrl+Z: the proposed step and its mark are back.
    await page.keyboard.press('Control+z');
    await expect
      .poll(async () => (await cell(page, row, step).getAttribute('class')) ?? '')
      .toMatch(/kl-mark-proposed/);
  });
});
