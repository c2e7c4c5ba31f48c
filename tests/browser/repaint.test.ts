// After an edit the page redraws only what changed: the charts keep their drawing and move the
// bars and numbers that changed; the grid leaves the text of cells whose value did not change
// alone. Nodes are tagged in the page before the edit and looked for after it. (A motor typed
// into a blank row, which makes the grid sync its copy of the sheet, is in living.test.ts.)
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startApp, stopApp, type AppUnderTest } from './harness.ts';
import { cellText, columnOf, openSheet, typeInCell } from './gridHelpers.ts';

let app: AppUnderTest | undefined;
let page: Page;

beforeAll(async () => {
  app = await startApp();
  page = app.page;
});

afterAll(async () => {
  await stopApp(app);
});

type Tagged = Node & { klTag?: string };

describe('repaint after an edit', () => {
  it('moves the chart bars in the drawing on screen and leaves unchanged cells alone', async () => {
    await openSheet(page, 'Motors');
    await page.click('[data-testid="toggle-charts"]');
    const charts = page.locator('[data-testid="charts"]');
    await charts.locator('svg.kl-bars').waitFor();
    const col = await columnOf(page, 'Rated output (kW)');
    const pBefore = await charts
      .locator('[data-testid="triangle-table"] tr.is-before td')
      .first()
      .textContent();
    // Tag the bar chart, the triangle table's P cell and the text node of the motor's tag (column A).
    await page.evaluate(() => {
      const tag = (n: Node | null | undefined, t: string) => n && ((n as Tagged).klTag = t);
      tag(document.querySelector('[data-testid="charts"] svg.kl-bars'), 'bars');
      tag(document.querySelector('[data-testid="triangle-table"] tr.is-before td'), 'p');
      const a2 = [...document.querySelectorAll('.kl-grid-host tr[aria-rowindex="3"] td[aria-colindex="2"]')];
      for (const td of a2) tag(td.firstChild, 'a2');
    });
    await typeInCell(page, 1, col, '400');
    await expect
      .poll(() => charts.locator('[data-testid="triangle-table"] tr.is-before td').first().textContent())
      .not.toBe(pBefore);
    const kept = await page.evaluate(() => {
      const tagOf = (n: Node | null | undefined) => (n as Tagged | null | undefined)?.klTag;
      const a2 = [...document.querySelectorAll('.kl-grid-host tr[aria-rowindex="3"] td[aria-colindex="2"]')];
      return {
        bars: tagOf(document.querySelector('[data-testid="charts"] svg.kl-bars')),
        p: tagOf(document.querySelector('[data-testid="triangle-table"] tr.is-before td')),
        a2: a2.map((td) => tagOf(td.firstChild)),
      };
    });
    expect(kept.bars).toBe('bars');
    expect(kept.p).toBe('p');
    expect(kept.a2.length).toBeGreaterThan(0);
    expect(kept.a2.every((t) => t === 'a2')).toBe(true);
    expect(await cellText(page, 1, col)).toMatch(/^400/);
    await page.keyboard.press('Control+z');
    await expect
      .poll(() => charts.locator('[data-testid="triangle-table"] tr.is-before td').first().textContent())
      .toBe(pBefore);
    await page.click('[data-testid="toggle-charts"]');
  });
});
