// The estimator's habits in Debian's chromium: the keyboard list, the Functions panel following
// its search, the status line's error count, the layout at 1024 px and the contrast of the
// accent. Screenshots go to test-artifacts/ (25-… to 27-…) and were looked at when these tests
// were written.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, startApp, stopApp, type AppUnderTest, type Browser } from './harness.ts';
import { cellText, columnOf, openSheet, rowWith, selectCell, typeInCell } from './gridHelpers.ts';
import { contrastRatio, over, parseColour } from '../../src/ui/format/contrast.ts';

let app: AppUnderTest | undefined;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  app = await startApp();
  ({ browser, page } = app);
});

afterAll(() => stopApp(app));

const address = () => page.locator('[data-testid="fb-address"]').textContent();
const caption = () => page.locator('[data-testid="sheet-caption"] strong').textContent();

const column = (header: string) => columnOf(page, header);
const rowOf = (text: string) => rowWith(page, text);

async function panel(name: string, open: boolean): Promise<void> {
  const pressed = await page.locator(`[data-testid="toggle-${name}"]`).getAttribute('aria-pressed');
  if ((pressed === 'true') !== open) await page.click(`[data-testid="toggle-${name}"]`);
}

async function undo(): Promise<void> {
  await page.locator('[data-testid="undo"]').click();
}

describe('keyboard', () => {
  it('gives the keyboard back to the grid after a toolbar toggle', async () => {
    await openSheet(page, 'Motors');
    await selectCell(page, 1, 0);
    await page.click('[data-testid="toggle-functions"]');
    await page.keyboard.press('ArrowDown');
    expect(await address()).toBe('Motors!A3');
    await page.click('[data-testid="toggle-functions"]');
    await page.keyboard.press('ArrowRight');
    expect(await address()).toBe('Motors!B3');
  });

  it('switches sheets with Ctrl+PageDown and Ctrl+PageUp', async () => {
    await page.keyboard.press('Control+PageDown');
    await expect.poll(caption).toBe('Loads');
    await page.keyboard.press('Control+PageUp');
    await page.keyboard.press('Control+PageUp');
    await expect.poll(caption).toBe('Site');
    await page.keyboard.press('Control+PageDown');
    await expect.poll(caption).toBe('Motors');
  });

  it('opens the cell menu with Shift+F10 and the menu key, and pastes from it', async () => {
    await selectCell(page, 10, 13);
    await page.keyboard.press('Shift+F10');
    const menu = page.locator('[data-testid="grid-menu"]');
    await menu.waitFor();
    expect(await menu.locator('.kl-menu-item').allTextContents()).toEqual(
      expect.arrayContaining([expect.stringMatching(/^PasteCtrl\+V$/)]),
    );
    await page.keyboard.press('Escape');
    await expect.poll(() => menu.count()).toBe(0);
    // Escape gave the keyboard back to the grid.
    await page.keyboard.press('ArrowRight');
    expect(await address()).toBe('Motors!O11');
    await page.keyboard.press('ContextMenu');
    await menu.waitFor();
    await page.keyboard.press('Escape');
    await page.evaluate(() => navigator.clipboard.writeText('42'));
    await page.keyboard.press('Shift+F10');
    await menu.locator('.kl-menu-item', { hasText: 'Paste' }).click();
    await expect.poll(() => cellText(page, 10, 14)).toBe('42');
    await undo();
    await expect.poll(() => cellText(page, 10, 14)).toBe('');
  });

  it('stops Ctrl+Arrow at the edge of the data', async () => {
    await selectCell(page, 1, 0);
    await page.keyboard.press('Control+ArrowDown');
    const lastRow = await page
      .locator('.kl-grid-host td[aria-colindex="2"]')
      .evaluateAll((tds) =>
        Math.max(
          ...tds
            .filter((td) => (td.textContent ?? '').trim() !== '')
            .map((td) => Number(td.parentElement?.getAttribute('aria-rowindex')) - 2),
        ),
      );
    expect(lastRow).toBeGreaterThan(2);
    expect(await address()).toBe(`Motors!A${lastRow + 1}`);
    await page.keyboard.press('Control+ArrowDown');
    expect(await address()).toBe(`Motors!A${lastRow + 1}`);
    await page.keyboard.press('Control+ArrowUp');
    expect(await address()).toBe('Motors!A1');
  });

  it('goes to an address or a tag from the go-to box', async () => {
    await page.keyboard.press('Control+g');
    const prompt = page.locator('[data-testid="prompt"]');
    await prompt.locator('input').fill('Loads!D4');
    await page.keyboard.press('Enter');
    await expect.poll(caption).toBe('Loads');
    expect(await address()).toBe('Loads!D4');
    await page.keyboard.press('Control+g');
    await prompt.locator('input').fill('nowhere-9');
    expect(await prompt.locator('[role="alert"]').textContent()).toMatch(/neither an address/);
    await prompt.locator('input').fill('DOCK');
    await page.keyboard.press('Enter');
    await expect.poll(caption).toBe('Motors');
    const r = await rowOf('DOCK');
    expect(await address()).toBe(`Motors!A${r + 1}`);
  });
});

describe('panels and the status line', () => {
  it("the Functions panel's detail and Insert follow the search", async () => {
    await panel('functions', true);
    await page.fill('[data-testid="ref-search"]', 'motor');
    await page.locator('[data-testid="ref-list"] [data-fn="KVAR.MOTOR"]').click();
    const detail = page.locator('[data-testid="ref-detail"]');
    expect(await detail.locator('h2').textContent()).toBe('KVAR.MOTOR');
    // A search that hides KVAR.MOTOR shows the first function it finds instead.
    await page.fill('[data-testid="ref-search"]', 'cable charging');
    const first = await page.locator('[data-testid="ref-list"] [data-fn]').first().getAttribute('data-fn');
    expect(first).not.toBe('KVAR.MOTOR');
    await expect.poll(() => detail.locator('h2').textContent()).toBe(first);
    await page.fill('[data-testid="ref-search"]', 'no such function at all');
    await expect.poll(() => detail.locator('[data-testid="ref-insert"]').count()).toBe(0);
    await page.fill('[data-testid="ref-search"]', '');
    await panel('functions', false);
  });

  it('the error count is the workbook’s: switching sheets leaves it alone', async () => {
    await openSheet(page, 'Motors');
    const cos = await column('cos φ');
    await typeInCell(page, 1, cos, '1.3');
    const count = page.locator('[data-testid="error-count"]');
    await expect.poll(() => count.textContent()).toMatch(/^\d+ cells? with errors/);
    const n = await count.textContent();
    for (const sheet of ['Site', 'Buses', 'Loads']) {
      await openSheet(page, sheet);
      expect(await count.textContent()).toBe(n);
    }
    // "next" walks the error cells across the sheets, in tab order from the active cell.
    await count.click();
    expect(await address()).toMatch(/^(Transformers|Lines|Cables|Capacitors|Buses|Compensation)/);
    expect(await page.locator('.kl-grid-host td.current').last().getAttribute('class')).toMatch(/kl-err/);
    await undo();
    await expect.poll(() => count.isVisible()).toBe(false);
  });
});

describe('layout and look', () => {
  it('at 1024 px with a panel open shows six columns, keeps Tag and Bus frozen, rounds numbers to fit', async () => {
    await page.setViewportSize({ width: 1024, height: 768 });
    await panel('checks', true);
    await openSheet(page, 'Motors');
    await page.waitForTimeout(300); // the grid refits after the resize (a wait, not an assertion)
    const host = await page.locator('.kl-grid-host').boundingBox();
    // Column letters whose whole header lies inside the grid's box (frozen overlay or main table).
    const edge = (host?.x ?? 0) + (host?.width ?? 0) + 1;
    const inView = await page.locator('.kl-grid-host thead th .colHeader').evaluateAll(
      (spans, right) =>
        [
          ...new Set(
            spans
              .filter((sp) => {
                const r = (sp.closest('th') as HTMLElement).getBoundingClientRect();
                return r.width > 0 && r.right <= right;
              })
              .map((sp) => sp.textContent ?? ''),
          ),
        ].sort(),
      edge,
    );
    expect(inView.slice(0, 6)).toEqual(['A', 'B', 'C', 'D', 'E', 'F']);
    await screenshot(page, '25-motors-1024-panel');

    // Scroll far right: Tag and Bus stay in the frozen columns.
    await selectCell(page, 1, 3);
    for (let i = 0; i < 6; i++) await page.keyboard.press('Control+ArrowRight');
    await page.waitForTimeout(200);
    // Scrolled: the main table no longer starts at the first columns.
    const firstShown = await page
      .locator('.kl-grid-host .ht_master tr[aria-rowindex="3"] td')
      .first()
      .getAttribute('aria-colindex');
    expect(Number(firstShown)).toBeGreaterThan(8);
    const frozen = await page
      .locator('.kl-grid-host .ht_clone_inline_start tbody tr')
      .first()
      .locator('td')
      .allTextContents();
    expect(frozen).toEqual(['Tag', 'Description', 'Bus']);
    await screenshot(page, '26-motors-1024-scrolled');

    // No number is cut with an ellipsis; a cut text tells the whole on hover.
    const cut = await page
      .locator('.kl-grid-host td.kl-num')
      .evaluateAll((tds) => tds.filter((td) => (td.textContent ?? '').includes('…')).length);
    expect(cut).toBe(0);
    const desc = page.locator('.kl-grid-host .ht_clone_inline_start tbody tr').nth(1).locator('td').nth(1);
    const full = await desc.getAttribute('title');
    expect((full ?? '').length).toBeGreaterThan(0);
    await page.setViewportSize({ width: 1440, height: 860 });
  });

  it('draws selection, fill handle and header highlights in the accent, each with contrast ≥ 4.5:1', async () => {
    await openSheet(page, 'Motors');
    await selectCell(page, 2, 4);
    const colours = await page.evaluate(() => {
      const shown = (e: Element) => getComputedStyle(e).display !== 'none';
      const border = [...document.querySelectorAll('.kl-grid-host .wtBorder.current:not(.corner)')].find(
        shown,
      );
      const handle = [...document.querySelectorAll('.kl-grid-host .wtBorder.current.corner')].find(shown);
      const head = document.querySelector('.kl-grid-host thead th.ht__highlight');
      const td = document.querySelector('.kl-grid-host tr[aria-rowindex="4"] td[aria-colindex="6"]');
      const cs = (e: Element | null | undefined) => (e ? getComputedStyle(e) : undefined);
      return {
        border: cs(border)?.backgroundColor,
        handle: cs(handle)?.backgroundColor,
        cell: cs(td)?.backgroundColor,
        headBg: cs(head)?.backgroundColor,
        headInk: cs(head)?.color,
      };
    });
    const c = (t: string | undefined) => {
      const v = t ? parseColour(t) : undefined;
      if (!v) throw new Error(`no colour: ${t}`);
      return v;
    };
    const ground = c(colours.cell);
    expect(colours.border).toBe('rgb(93, 59, 140)');
    expect(contrastRatio(over(c(colours.border), ground), ground)).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(over(c(colours.handle), ground), ground)).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(c(colours.headInk), c(colours.headBg))).toBeGreaterThanOrEqual(4.5);
    // A whole column selected: the active header, white on the accent.
    await page
      .locator('.kl-grid-host thead th', { has: page.locator('.colHeader', { hasText: /^F$/ }) })
      .last()
      .click();
    const active = await page.evaluate(() => {
      const th = document.querySelector('.kl-grid-host thead th.ht__active_highlight');
      return th ? { bg: getComputedStyle(th).backgroundColor, ink: getComputedStyle(th).color } : undefined;
    });
    expect(active).toBeDefined();
    expect(contrastRatio(c(active?.ink), c(active?.bg))).toBeGreaterThanOrEqual(4.5);
    await screenshot(page, '27-accent');
  });

  it('logged no console errors', () => {
    expect(browser.errors).toEqual([]);
  });
});
