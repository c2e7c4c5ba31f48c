// What the bench does inside the page: wait for an interactive grid (timed by the page's own
// clock, which starts at navigation), move to a cell the way a user does (click, arrow keys)
// checking the formula bar's address, and time an edit from the Enter key to the frame after
// the watched element (the bus totals) changed.
import type { Page } from 'playwright-core';

const WAIT_MS = 120_000;

/** 0 → A, 26 → AA. */
function letters(col: number): string {
  let n = col + 1;
  let s = '';
  while (n > 0) {
    s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/**
 * The page's clock (ms since navigation started) at the first frame where the app is ready, the
 * grid has cells and, when given, the open workbook has this title.
 */
export async function readyAt(page: Page, title: string | undefined): Promise<number> {
  const handle = await page.waitForFunction(
    (want) => {
      if (document.getElementById('app')?.dataset.ready !== 'true') return false;
      const t = document.querySelector<HTMLInputElement>('[data-testid=title]');
      if (want !== null && t?.value !== want) return false;
      if (!document.querySelector('[data-testid=grid] .ht_master td')) return false;
      return performance.now();
    },
    title ?? null,
    { polling: 'raf', timeout: WAIT_MS },
  );
  return (await handle.jsonValue()) as number;
}

/** Select a cell of the sheet on screen through the go-to box (Ctrl+G); the formula bar must agree. */
export async function selectCell(page: Page, row: number, col: number): Promise<void> {
  const want = `!${letters(col)}${row + 1}`;
  // Any cell in sight gives the grid the keyboard (the last match is the one drawn on top).
  await page.locator('.kl-grid-host tr[aria-rowindex="3"] td[aria-colindex="2"]').last().click();
  await page.keyboard.press('Control+g');
  await page.locator('[data-testid="prompt"] input').fill(want.slice(1));
  await page.keyboard.press('Enter');
  try {
    await page.waitForFunction(
      (w) =>
        (document.querySelector('[data-testid=fb-address]')?.textContent ?? '')
          .trim()
          .split(/\s/)[0]
          ?.endsWith(w) === true,
      want,
      { timeout: 10_000 },
    );
  } catch {
    const got = await page.textContent('[data-testid=fb-address]');
    throw new Error(`could not select ${want.slice(1)}: the formula bar shows ${got ?? 'nothing'}`);
  }
}

interface Probe {
  armed: boolean;
  t0: number;
  t1: number;
  seen: boolean;
}

/** Watch `selector` for changes; an armed probe records the Enter key and the frame after the first change. */
export async function installPaintProbe(page: Page, selector: string): Promise<void> {
  const found = await page.evaluate((sel) => {
    const target = document.querySelector(sel);
    if (!target) return false;
    const probe: Probe = { armed: false, t0: 0, t1: 0, seen: false };
    (window as unknown as { klProbe: Probe }).klProbe = probe;
    document.addEventListener(
      'keydown',
      (e) => {
        if (probe.armed && e.key === 'Enter' && probe.t0 === 0) probe.t0 = performance.now();
      },
      true,
    );
    new MutationObserver(() => {
      if (!probe.armed || probe.t0 === 0 || probe.seen) return;
      probe.seen = true;
      // The frame after the change: rAF runs before that frame's paint, the task after it runs once painted.
      requestAnimationFrame(() =>
        setTimeout(() => {
          probe.t1 = performance.now();
          probe.armed = false;
        }, 0),
      );
    }).observe(target, { subtree: true, childList: true, characterData: true, attributes: true });
    return true;
  }, selector);
  if (!found) throw new Error(`the page has no ${selector} to watch`);
}

/** Type a value into the active cell and press Enter; ms from Enter to the repainted watched element. */
export async function measureEditPaint(page: Page, value: string): Promise<number> {
  await page.evaluate(() =>
    Object.assign((window as unknown as { klProbe: Probe }).klProbe, {
      armed: true,
      t0: 0,
      t1: 0,
      seen: false,
    }),
  );
  await page.keyboard.type(value);
  await page.keyboard.press('Enter');
  const handle = await page.waitForFunction(
    () => {
      const p = (window as unknown as { klProbe: Probe }).klProbe;
      return p.t1 > 0 ? p.t1 - p.t0 : false;
    },
    undefined,
    { timeout: WAIT_MS },
  );
  return (await handle.jsonValue()) as number;
}
