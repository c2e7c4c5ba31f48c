// The workbook in a real browser (Debian's chromium): the demo, typing formulas with the typing
// help, error messages, undo, clipboard in and out, fill down, sheets, autosave across a
// reload, templates, charts, the reference, hostile text. Screenshots go to test-artifacts/.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { buildApp, launch, openApp, screenshot, serve, type Browser } from './harness.ts';
import {
  addSheet,
  cell,
  columnOf,
  cellText,
  openSheet,
  saved,
  selectCell,
  sheetNames,
  typeInCell,
} from './gridHelpers.ts';
import { qFromPowerFactor } from '../core/functions/independent.ts';

/** How the grid shows a number in General format: 10 significant digits, no trailing zeros. */
const general = (x: number) => String(Number.parseFloat(x.toPrecision(10)));
/** KVA.TOTAL(650, -760) recomputed here: √(650² + 760²). */
const KVA_650_760 = general(Math.sqrt(650 ** 2 + 760 ** 2));
/** KVAR.MOTOR(90, 0.95, 0.85) at full load recomputed here: Q of the input 90/0.95 kW at cos φ 0.85. */
const KVAR_MOTOR_90 = general(qFromPowerFactor(90 / 0.95, 0.85));

let server: { url: string; close(): Promise<void> };
let browser: Browser;
let page: Page;
const dialogs: string[] = [];

beforeAll(async () => {
  await buildApp();
  server = await serve();
  browser = await launch();
  page = browser.page;
  page.on('dialog', (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
  await browser.context.grantPermissions(['clipboard-read', 'clipboard-write'], {
    origin: server.url.replace(/\/$/, ''),
  });
  await openApp(page, server.url);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

afterEach((ctx) => {
  console.log(`after "${ctx.task.name}": ${JSON.stringify(browser.errors)}`);
});

const fb = (id: string) => page.locator(`[data-testid="fb-${id}"]`);

describe('Kvar Ledger in the browser', () => {
  it('runs under a strict Content-Security-Policy', async () => {
    const csp = await page.locator('meta[http-equiv="Content-Security-Policy"]').getAttribute('content');
    expect(csp).toMatch(/script-src 'self';/);
    expect(csp).toMatch(/style-src 'self';/);
    expect(csp).not.toMatch(/unsafe/);
    // The grid's stylesheet comes as a file: no style element is injected at run time.
    expect(await page.locator('style').count()).toBe(0);
  });

  it('opens the demo workbook on the first visit', async () => {
    expect(await page.locator('[data-testid="title"]').inputValue()).toMatch(/Cold store/);
    expect(await sheetNames(page)).toEqual(
      expect.arrayContaining(['Site', 'Motors', 'Transformers', 'Buses', 'Compensation']),
    );
    await openSheet(page, 'Buses');
    // Row 1 is the header row; the first bus is the point of connection with a computed P.
    expect(await cellText(page, 0, 0)).toBe('Bus');
    expect(await cellText(page, 1, 0)).toBe('MV-11');
    expect(Number((await cellText(page, 1, 5)).replace(/,/g, ''))).toBeGreaterThan(0);
    await screenshot(page, '01-demo-buses');
  });

  it('computes a catalogue formula typed into a cell, with the typing help on the way', async () => {
    await addSheet(page, 'Scratch');
    await selectCell(page, 0, 0);
    await page.keyboard.type('=kva.to', { delay: 10 });
    const assist = page.locator('[data-testid="assist"]');
    await expect
      .poll(() => assist.locator('.kl-assist-item.is-active .kl-assist-name').textContent())
      .toBe('KVA.TOTAL');
    await page.keyboard.press('Tab');
    await page.keyboard.type('300,', { delay: 10 });
    // The signature shows, with the second argument (q_kvar, in kvar) marked.
    expect(await assist.locator('.kl-sig-arg.is-active').textContent()).toBe('q_kvar kvar');
    expect(await assist.locator('.kl-sig-doc').textContent()).toMatch(/^q_kvar: reactive power/);
    await screenshot(page, '02-typing-help');
    await page.keyboard.type('400)', { delay: 10 });
    await page.keyboard.press('Enter');
    // The 3-4-5 triangle: √(300² + 400²) = 500 (IEC 60050-131, 131-11-41).
    expect(await cellText(page, 0, 0)).toBe('500');
    await selectCell(page, 0, 0);
    expect(await fb('input').inputValue()).toBe('=KVA.TOTAL(300,400)');
    expect(await fb('value').textContent()).toBe('500');
    expect(await fb('address').textContent()).toBe('Scratch!A1');
  });

  it('marks a bad argument in the grid and explains it in the formula bar', async () => {
    await typeInCell(page, 1, 0, '=KVAR.MOTOR(90,0.95,1.2)');
    const bad = cell(page, 1, 0);
    expect(await bad.getAttribute('class')).toMatch(/\bkl-err\b/);
    // The error style is applied (not only the class name): brick text on a pale ground.
    expect(await bad.evaluate((e) => getComputedStyle(e).fontWeight)).toBe('700');
    expect(await bad.textContent()).toMatch(/^#/);
    await selectCell(page, 1, 0);
    const problem = fb('problem');
    await expect.poll(() => problem.isVisible()).toBe(true);
    expect(await problem.textContent()).toMatch(
      /KVAR\.MOTOR: argument 3 \(cos_phi\) must be in \(0, 1\]; got 1\.2/,
    );
    await expect
      .poll(() => page.locator('[data-testid="error-count"]').textContent())
      .toMatch(/^1 cell with errors/);
    await screenshot(page, '03-error-explained');
  });

  it('undoes and redoes an edit', async () => {
    await typeInCell(page, 2, 0, '42');
    expect(await cellText(page, 2, 0)).toBe('42');
    await selectCell(page, 2, 0);
    await page.keyboard.press('Control+z');
    expect(await cellText(page, 2, 0)).toBe('');
    await page.keyboard.press('Control+y');
    expect(await cellText(page, 2, 0)).toBe('42');
    await page.keyboard.press('Control+z');
    expect(await cellText(page, 2, 0)).toBe('');
  });

  it('takes a tab-separated block pasted from another program', async () => {
    await selectCell(page, 4, 1);
    await page.evaluate(() => navigator.clipboard.writeText('P kW\tQ kvar\n300\t400\n650\t-760\n'));
    await page.keyboard.press('Control+v');
    await expect.poll(() => cellText(page, 6, 2)).toBe('-760');
    expect(await cellText(page, 4, 1)).toBe('P kW');
    expect(await cellText(page, 5, 2)).toBe('400');
    // A formula beside the block sees the pasted numbers, then fill down copies it with moved references.
    await typeInCell(page, 5, 3, '=KVA.TOTAL(B6,C6)');
    expect(await cellText(page, 5, 3)).toBe('500');
    await selectCell(page, 5, 3);
    await page.keyboard.down('Shift');
    await selectCell(page, 6, 3);
    await page.keyboard.up('Shift');
    await page.keyboard.press('Control+d');
    // √(650² + 760²) = 1000.0499987…: the cell shows it rounded to fit its column (how many
    // digits depends on the font), the formula bar shows ten significant digits.
    expect(Number(await cellText(page, 6, 3))).toBeCloseTo(Math.hypot(650, 760), 3);
    await selectCell(page, 6, 3);
    expect(await fb('input').inputValue()).toBe('=KVA.TOTAL(B7,C7)');
    expect(await fb('value').textContent()).toBe(KVA_650_760);
  });

  it('fills with the fill handle, moving relative references', async () => {
    // D6 holds =KVA.TOTAL(B6,C6); drag its handle down over D7 (which fill down already set) and D8.
    await typeInCell(page, 7, 1, '30');
    await typeInCell(page, 7, 2, '40');
    await selectCell(page, 5, 3);
    const handle = page.locator('.kl-grid-host .ht_master .wtBorder.current.corner').first();
    const box = await handle.boundingBox();
    const target = await cell(page, 7, 3).boundingBox();
    expect(box && target).toBeTruthy();
    await page.mouse.move((box?.x ?? 0) + 2, (box?.y ?? 0) + 2);
    await page.mouse.down();
    await page.mouse.move((target?.x ?? 0) + 10, (target?.y ?? 0) + 8, { steps: 6 });
    await page.mouse.up();
    await expect.poll(() => cellText(page, 7, 3)).toBe('50');
    await selectCell(page, 7, 3);
    expect(await fb('input').inputValue()).toBe('=KVA.TOTAL(B8,C8)');
  });

  it('copies values at full precision for other programs', async () => {
    // (Clicking the cell that is already active would open its editor, as a double-click does.)
    await selectCell(page, 6, 2);
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('Control+c');
    await expect
      .poll(() => page.evaluate(() => navigator.clipboard.readText()))
      .toMatch(/^1000\.04999875006\d*$/);
  });

  it('enters text after an apostrophe, in typing and in pasted data, and copies it out as text', async () => {
    await typeInCell(page, 9, 0, "'=1+1");
    await typeInCell(page, 9, 1, "'007");
    expect(await cellText(page, 9, 0)).toBe('=1+1');
    expect(await cellText(page, 9, 1)).toBe('007');
    await selectCell(page, 9, 0);
    expect(await fb('input').inputValue()).toBe("'=1+1");
    await selectCell(page, 10, 0);
    await page.evaluate(() => navigator.clipboard.writeText("'=2+2\t'0042\n"));
    await page.keyboard.press('Control+v');
    await expect.poll(() => cellText(page, 10, 0)).toBe('=2+2');
    expect(await cellText(page, 10, 1)).toBe('0042');
    // Out of the page, formula-like text carries the apostrophe (the CSV writer's rule).
    await selectCell(page, 9, 1);
    await page.keyboard.press('ArrowLeft');
    await page.keyboard.press('Control+c');
    await expect.poll(() => page.evaluate(() => navigator.clipboard.readText())).toBe("'=1+1");
  });

  it('shows hostile text as text', async () => {
    const hostile = '<img src=x onerror=alert(1)>';
    await typeInCell(page, 8, 0, hostile);
    expect(await cellText(page, 8, 0)).toBe(hostile);
    expect(await page.locator('.kl-grid-host img').count()).toBe(0);
    // A sheet name made of markup stays text in the sheet index and the caption.
    const tab = page.locator('[data-testid="sheet-tab"][data-sheet="Scratch"]');
    await tab.dblclick();
    await page.locator('[data-testid="prompt"] input').fill(hostile);
    await page.locator('[data-testid="prompt"] .kl-btn-primary').click();
    await page.waitForSelector(`[data-testid="sheet-tab"][data-sheet="${hostile}"]`);
    expect(await page.locator('.kl-sheets img, .kl-caption img, .kl-formula-bar img').count()).toBe(0);
    expect(await page.locator('[data-testid="sheet-caption"] strong').textContent()).toBe(hostile);
    expect(dialogs).toEqual([]);
  });

  it('keeps every change across a reload', async () => {
    await saved(page);
    await page.reload();
    await page.waitForSelector('#app[data-ready="true"]');
    expect(await page.locator('[data-testid="notice"]').textContent()).toMatch(/^Welcome back/);
    const hostile = '<img src=x onerror=alert(1)>';
    expect(await sheetNames(page)).toContain(hostile);
    await openSheet(page, hostile);
    expect(await cellText(page, 0, 0)).toBe('500');
    expect(Number(await cellText(page, 6, 3))).toBeCloseTo(Math.hypot(650, 760), 3);
    expect(dialogs).toEqual([]);
  });

  it('deletes a sheet after asking, and undo brings it back', async () => {
    const hostile = '<img src=x onerror=alert(1)>';
    await page
      .locator(`[data-testid="sheet-tab"][data-sheet="${hostile}"] + [data-testid="sheet-more"]`)
      .click();
    await page.click('[data-testid="sheet-delete"]');
    const confirm = page.locator('[data-testid="confirm"]');
    expect(await confirm.textContent()).toMatch(/You can bring it back with Undo/);
    await confirm.locator('.kl-btn-danger').click();
    expect(await sheetNames(page)).not.toContain(hostile);
    await page.locator('[data-testid="undo"]').click();
    expect(await sheetNames(page)).toContain(hostile);
    await openSheet(page, hostile);
    expect(await cellText(page, 0, 0)).toBe('500');
  });

  it('redraws the charts when an input changes', async () => {
    await openSheet(page, 'Motors');
    await page.click('[data-testid="toggle-charts"]');
    const charts = page.locator('[data-testid="charts"]');
    await charts.locator('svg.kl-bars').waitFor();
    const netBefore = await charts.locator('.kl-bar-value').first().textContent();
    const beforeRow = await page
      .locator('[data-testid="triangle-table"] tr.is-before td')
      .nth(1)
      .textContent();
    await screenshot(page, '04-charts');
    // Double the rated output of the first motor row: the point of connection draws more kvar.
    const col = await columnOf(page, 'Rated output (kW)');
    expect(col).toBeGreaterThan(0);
    await typeInCell(page, 1, col, '500');
    await expect.poll(() => charts.locator('.kl-bar-value').first().textContent()).not.toBe(netBefore);
    expect(
      await page.locator('[data-testid="triangle-table"] tr.is-before td').nth(1).textContent(),
    ).not.toBe(beforeRow);
    await page.keyboard.press('Control+z');
    await expect.poll(() => charts.locator('.kl-bar-value').first().textContent()).toBe(netBefore);
  });

  it('lists the catalogue with live examples and inserts a call into a cell', async () => {
    await page.click('[data-testid="toggle-functions"]');
    await page.fill('[data-testid="ref-search"]', 'motor');
    await page.locator('[data-testid="ref-list"] [data-fn="KVAR.MOTOR"]').click();
    const detail = page.locator('[data-testid="ref-detail"]');
    expect(await detail.locator('h2').textContent()).toBe('KVAR.MOTOR');
    const rows = detail.locator('[data-testid="ref-examples"] tbody tr');
    expect(await rows.count()).toBeGreaterThan(1);
    expect(await rows.first().locator('td').nth(1).textContent()).toMatch(/^\d/);
    await screenshot(page, '05-function-reference');
    await selectCell(page, 8, 1);
    await detail.locator('[data-testid="ref-insert"]').click();
    // The call goes into the formula bar for the active cell, with the signature shown.
    expect(await fb('input').inputValue()).toBe('=KVAR.MOTOR(');
    expect(await page.locator('[data-testid="assist"] .kl-sig-arg.is-active').textContent()).toBe(
      'p_out_kw kW',
    );
    await page.keyboard.type('90,0.95,0.85)');
    await page.keyboard.press('Enter');
    // Full load: Qr = 90/0.95·tan(acos 0.85) = 58.71 kvar (the catalogue's worked example).
    expect(await cellText(page, 8, 1)).toBe(KVAR_MOTOR_90);
    await page.keyboard.press('Control+z');
    expect(await cellText(page, 8, 1)).toBe('');
  });

  it('opens a template from the menu', async () => {
    await page.click('[data-testid="menu-workbook"]');
    await page.click('[data-testid="menu-template"]');
    await page.locator('[data-testid="templates"] .kl-template').first().waitFor();
    await screenshot(page, '06-templates');
    await page.click('[data-testid="template-pumping-station"]');
    await expect.poll(() => page.locator('[data-testid="title"]').inputValue()).toMatch(/[Pp]umping/);
    await openSheet(page, 'Buses');
    expect(await cellText(page, 0, 0)).toBe('Bus');
    expect((await cellText(page, 1, 0)).length).toBeGreaterThan(0);
  });

  it('shows the cautions and licences', async () => {
    await page.click('[data-testid="about-open"]');
    const about = page.locator('[data-testid="about"]');
    const text = (await about.textContent()) ?? '';
    expect(text).toMatch(/licensed engineer/);
    expect(text).toMatch(/GPL-3\.0/);
    expect(text).toMatch(/non-commercial/);
    await screenshot(page, '07-about');
    await about.locator('.kl-btn-primary').click();
  });

  it('logged no console errors', () => {
    expect(browser.errors).toEqual([]);
  });
});
