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

/** Longer than any double-click interval (the grid library's and the system's). */
const DOUBLE_CLICK_GAP_MS = 800;
let lastCellClick = 0;

/** Select a cell of the sheet on screen through the go-to box (Ctrl+G); the formula bar must agree. */
export async function selectCell(page: Page, row: number, col: number): Promise<void> {
  const want = `!${letters(col)}${row + 1}`;
  // Any cell in sight gives the grid the keyboard (the last match is the one drawn on top). Two
  // clicks on that cell close together are a double click, which opens its editor and turns
  // Ctrl+G into typing: the click waits until the last one is long past.
  const since = Date.now() - lastCellClick;
  if (since < DOUBLE_CLICK_GAP_MS) await page.waitForTimeout(DOUBLE_CLICK_GAP_MS - since);
  await page.locator('.kl-grid-host tr[aria-rowindex="3"] td[aria-colindex="2"]').last().click();
  lastCellClick = Date.now();
  await page.keyboard.press('Control+g');
  const box = page.locator('[data-testid="prompt"] input');
  await box.waitFor({ state: 'visible', timeout: 10_000 }).catch(() => {
    throw new Error(`the go-to box (Ctrl+G) did not open to select ${want.slice(1)}`);
  });
  await box.fill(want.slice(1));
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
  /** What starts the clock: the Enter key, Ctrl+D, or a click on a menu item. */
  start: 'Enter' | 'fill' | 'click';
  t0: number;
  t1: number;
  seen: boolean;
}

type ProbeWindow = Record<string, Probe>;

/**
 * Watch `selector` for changes under the name `name`; an armed probe records the start (see
 * Probe.start) and the frame after the first change. Several probes may watch different elements.
 */
export async function installPaintProbe(page: Page, selector: string, name = 'klProbe'): Promise<void> {
  const found = await page.evaluate(
    ([sel, key]) => {
      const target = document.querySelector(sel as string);
      if (!target) return false;
      const probe: Probe = { armed: false, start: 'Enter', t0: 0, t1: 0, seen: false };
      (window as unknown as ProbeWindow)[key as string] = probe;
      // No named functions in here: the bench runs under tsx, whose name-keeping helper the page lacks.
      document.addEventListener(
        'keydown',
        (e) => {
          const starts =
            (probe.start === 'Enter' && e.key === 'Enter') ||
            (probe.start === 'fill' && e.ctrlKey && e.key.toLowerCase() === 'd');
          if (starts && probe.armed && probe.t0 === 0) probe.t0 = performance.now();
        },
        true,
      );
      document.addEventListener(
        'click',
        (e) => {
          const starts = probe.start === 'click' && (e.target as Element | null)?.closest('[role=menuitem]');
          if (starts && probe.armed && probe.t0 === 0) probe.t0 = performance.now();
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
    },
    [selector, name],
  );
  if (!found) throw new Error(`the page has no ${selector} to watch`);
}

async function arm(page: Page, name: string, start: Probe['start']): Promise<void> {
  await page.evaluate(
    ([key, how]) =>
      Object.assign((window as unknown as ProbeWindow)[key as string] as Probe, {
        armed: true,
        start: how,
        t0: 0,
        t1: 0,
        seen: false,
      }),
    [name, start],
  );
}

/** The probe's start and end on the page's clock (ms since navigation), once it has seen its frame. */
async function settled(page: Page, name: string): Promise<{ t0: number; t1: number }> {
  const handle = await page.waitForFunction(
    (key) => {
      const p = (window as unknown as ProbeWindow)[key];
      return p && p.t1 > 0 ? { t0: p.t0, t1: p.t1 } : false;
    },
    name,
    { timeout: WAIT_MS },
  );
  return (await handle.jsonValue()) as { t0: number; t1: number };
}

/** Type a value into the active cell and press Enter; ms from Enter to the repainted watched element. */
export async function measureEditPaint(page: Page, value: string, name = 'klProbe'): Promise<number> {
  const { t0, t1 } = await editPaint(page, value, name);
  return t1 - t0;
}

/** As measureEditPaint, with both ends on the page's clock (ms since navigation). */
export async function editPaint(
  page: Page,
  value: string,
  name = 'klProbe',
): Promise<{ t0: number; t1: number }> {
  await arm(page, name, 'Enter');
  await page.keyboard.type(value);
  await page.keyboard.press('Enter');
  return settled(page, name);
}

/**
 * A structural edit as a user makes it: with a whole row selected, Edit → Insert rows below
 * (timed to the repainted grid, watched by `gridProbe`), then Ctrl+D fills the row above into the
 * new one (timed to the repainted bus totals, watched by `totalsProbe`). The row must be selected
 * across every column before the call.
 */
export async function measureInsertAndFill(
  page: Page,
  gridProbe: string,
  totalsProbe: string,
): Promise<{ insertMs: number; fillMs: number }> {
  await page.click('[data-testid=menu-edit]');
  await arm(page, gridProbe, 'click');
  await page.click('[data-testid=menu-insert-below]');
  const insert = await settled(page, gridProbe);
  await arm(page, totalsProbe, 'fill');
  await page.keyboard.press('Control+d');
  const fill = await settled(page, totalsProbe);
  return { insertMs: insert.t1 - insert.t0, fillMs: fill.t1 - fill.t0 };
}

/**
 * Scroll the grid with the mouse wheel while an edit recalculates: the longest gap between two
 * frames (ms) from the first wheel step to the last, and how many gaps exceed 50 ms. The edit is
 * typed into the active cell a few steps into the scrolling.
 */
export async function scrollDuringEdit(
  page: Page,
  value: string,
): Promise<{ longestFrameMs: number; framesOver50: number; frames: number }> {
  await page.evaluate(() => {
    const w = window as unknown as { klFrames: number[]; klFramesOn: boolean; klTick: FrameRequestCallback };
    w.klFrames = [];
    w.klFramesOn = true;
    w.klTick = (t: number) => {
      w.klFrames.push(t);
      if (w.klFramesOn) requestAnimationFrame(w.klTick);
    };
    requestAnimationFrame(w.klTick);
  });
  const grid = await page.locator('[data-testid=grid] .ht_master').boundingBox();
  if (!grid) throw new Error('the grid is not on screen');
  await page.mouse.move(grid.x + grid.width / 2, grid.y + grid.height / 2);
  for (let k = 0; k < 24; k++) {
    await page.mouse.wheel(0, k % 12 < 6 ? 120 : -120);
    if (k === 4) {
      await page.keyboard.type(value);
      await page.keyboard.press('Enter');
    }
    await page.waitForTimeout(40);
  }
  return page.evaluate(() => {
    const w = window as unknown as { klFrames: number[]; klFramesOn: boolean };
    w.klFramesOn = false;
    const gaps = w.klFrames.slice(1).map((t, i) => t - (w.klFrames[i] as number));
    return {
      longestFrameMs: Math.max(0, ...gaps),
      framesOver50: gaps.filter((g) => g > 50).length,
      frames: gaps.length,
    };
  });
}
