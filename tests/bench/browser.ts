// The page in headless Chromium (Debian's, through playwright-core): the built app served on
// 127.0.0.1, the 10,000-row workbook opened the way a user opens a *.kvar.json file
// (Workbook → Open file…), then a reload, which restores it from the browser's storage: that is
// "navigation to an interactive grid" for this site, and the first edit typed after it gives
// "navigation to the first edit recalculated". Edits are typed into a motor's load cell with the
// charts panel (bus totals) open; each is timed from the Enter key to the next frame after the
// charts changed. Then the grid is scrolled with the wheel while one more edit recalculates (the
// longest gap between frames), and a motor row is copied into a row inserted below it (Edit →
// Insert rows below, then Ctrl+D), timed to the repainted grid and totals. Every edit is applied
// to the site too and the page's root P checked against the floor. Memory from the DevTools
// protocol; initial JavaScript from the built files.
import { mkdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { HEADERS, SHEETS } from '../../src/core/workbook/layout.ts';
import { buildApp, initialJsSize, serveStatic } from './appServer.ts';
import { floorRoots } from './floor.ts';
import { generateSite } from './generateSite.ts';
import type { BrowserResult, Check } from './record.ts';
import { SIZES } from './sizes.ts';
import { median } from './timing.ts';
import { MotorEdits } from './workbookView.ts';
import {
  editPaint,
  installPaintProbe,
  measureEditPaint,
  measureInsertAndFill,
  readyAt,
  scrollDuringEdit,
  selectCell,
} from './pageProbes.ts';

const CHROMIUM = '/usr/bin/chromium';
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
const EDITS = 7;
const WAIT_MS = 120_000;

const firstLine = (e: unknown) => (e instanceof Error ? e.message : String(e)).split('\n')[0] ?? '';

async function heapUsedMb(page: Page): Promise<number> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Performance.enable');
  const { metrics } = await cdp.send('Performance.getMetrics');
  await cdp.detach();
  const used = metrics.find((m) => m.name === 'JSHeapUsedSize')?.value ?? Number.NaN;
  return used / 1048576;
}

/** Root P of the first case as the page shows it on the Buses sheet, checked against the floor of the edited site. */
async function checkRoot(page: Page, edits: MotorEdits): Promise<Check> {
  await page.click(`[data-testid=sheet-tab][data-sheet="${SHEETS.buses}"]`);
  await selectCell(page, 1, 5);
  const text = (await page.textContent('[data-testid=fb-value]')) ?? '';
  const shown = Number(text.replace(/[^0-9.eE+-]/g, ''));
  const want = floorRoots(edits.editedSite()).p[0] as number;
  // The page may show the value rounded to its number format (0.1 kW).
  const ok = Math.abs(shown - want) <= 0.05 + 1e-9 * Math.abs(want);
  return {
    agrees: ok,
    detail: `the page shows root P ${text.trim()} after the edits; the floor of the edited site gives ${want.toFixed(3)}`,
  };
}

export async function measureBrowser(
  workDir: string,
  liveFile: string,
  rows: number,
): Promise<BrowserResult> {
  const outDir = join(workDir, 'app');
  try {
    await buildApp(outDir);
  } catch (e) {
    return { status: 'not available', note: `the app does not build yet: ${firstLine(e)}` };
  }
  const js = initialJsSize(outDir);
  const base = { rows, initialJsBytes: js.bytes, initialJsGzipBytes: js.gzipBytes };
  const { url, server } = await serveStatic(outDir);
  const profile = join(workDir, `chromium-profile-${rows}`);
  mkdirSync(profile, { recursive: true });
  const { chromium } = await import('playwright-core');
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ARGS,
    viewport: { width: 1600, height: 1000 },
  });
  // Which measurement was running, for the note when one fails.
  let stage = 'open the app';
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    page.setDefaultTimeout(WAIT_MS);
    const doc = JSON.parse(readFileSync(liveFile, 'utf8')) as WorkbookDoc;
    await page.goto(url);
    await readyAt(page, undefined);

    // Open the file as a user does; the app autosaves it into the browser's storage.
    await page.click('[data-testid=menu-workbook]');
    const [chooser] = await Promise.all([
      page.waitForEvent('filechooser'),
      page.click('[data-testid=menu-open]'),
    ]);
    const t0 = performance.now();
    await chooser.setFiles(liveFile);
    await readyAt(page, doc.title);
    const fileOpenMs = performance.now() - t0;
    // Edits with the bus totals (charts panel) on screen.
    stage = 'value edits';
    const size = SIZES.find((s) => s.rows === rows) ?? { rows, buses: 300 };
    const site = generateSite(size);
    const edits = new MotorEdits(doc, site);
    await page.click('[data-testid=toggle-charts]');
    await page.click(`[data-testid=sheet-tab][data-sheet="${SHEETS.motors}"]`);
    await selectCell(page, 1, edits.col);
    await installPaintProbe(page, '[data-testid=charts]');
    const times: number[] = [];
    for (let k = 0; k < EDITS; k++) {
      const value = edits.value(k);
      times.push(await measureEditPaint(page, String(value)));
      edits.record(1 + k, value); // Enter moves the selection one row down: the next motor.
    }
    stage = 'scrolling during an edit';
    // Scrolling while the next edit recalculates (Enter has moved the selection to the next motor).
    const scrollValue = edits.value(EDITS);
    const scroll = await scrollDuringEdit(page, String(scrollValue));
    edits.record(1 + EDITS, scrollValue);
    stage = 'structural edit';
    // A structural edit: a row inserted below an unedited motor and that motor filled into it.
    const copied = EDITS + 3;
    await selectCell(page, copied, 0);
    await page.keyboard.press('Shift+End');
    await installPaintProbe(page, '[data-testid=grid]', 'klGridProbe');
    const structural = await measureInsertAndFill(page, 'klGridProbe', 'klProbe');
    edits.duplicate(copied);
    stage = 'heap and root check';
    const jsHeapUsedMb = await heapUsedMb(page);
    const check = await checkRoot(page, edits);

    stage = 'reload';
    // Navigation to an interactive grid of this workbook: a reload restores it from the browser's storage.
    await page.waitForFunction(
      () => document.querySelector('[data-testid=save-status]')?.textContent?.startsWith('Saved') === true,
      undefined,
      { timeout: WAIT_MS },
    );
    await page.reload();
    const openMs = await readyAt(page, doc.title);
    stage = 'first edit after the reload';
    // The first edit after opening, as soon as the grid shows: to its repainted bus totals, on the
    // page's clock (from navigation). The charts panel may come back closed.
    await page.click(`[data-testid=sheet-tab][data-sheet="${SHEETS.motors}"]`);
    if ((await page.locator('[data-testid=charts]').count()) === 0)
      await page.click('[data-testid=toggle-charts]');
    await selectCell(page, 1, edits.col);
    await installPaintProbe(page, '[data-testid=charts]');
    const firstValue = edits.value(EDITS + 1);
    const first = await editPaint(page, String(firstValue));
    edits.record(1, firstValue);
    const restored = await checkRoot(page, edits);
    const note = [
      `file open (choose → interactive) ${Math.round(fileOpenMs)} ms`,
      `structural edit: insert ${Math.round(structural.insertMs)} ms, fill down ${Math.round(structural.fillMs)} ms`,
      `scrolling during an edit: ${scroll.frames} frames, ${scroll.framesOver50} over 50 ms`,
      `edits typed into "${HEADERS.loadCase(site.settings.cases[0] as string)}" of ${SHEETS.motors}`,
      restored.agrees
        ? 'the restored workbook, edited once more, shows the root P of the edited site'
        : `after the reload (restored from browser storage) ${restored.detail}`,
    ].join('; ');
    return {
      status: 'ok',
      note,
      ...base,
      openMs,
      editPaintMs: median(times),
      editPaintRuns: times.length,
      structuralPaintMs: structural.insertMs + structural.fillMs,
      firstEditMs: first.t1,
      scrollLongestFrameMs: scroll.longestFrameMs,
      jsHeapUsedMb,
      check,
    };
  } catch (e) {
    // What the page showed when the step failed, kept after the work files are removed.
    const shot = join(tmpdir(), `kvar-bench-page-failure-${rows}.png`);
    const page = context.pages()[0];
    const saved = page
      ? await page.screenshot({ path: shot }).then(
          () => true,
          () => false,
        )
      : false;
    return {
      status: 'failed',
      note: `${stage}: ${firstLine(e)}${saved ? ` (screenshot: ${shot})` : ''}`,
      ...base,
    };
  } finally {
    await context.close();
    server.close();
  }
}
