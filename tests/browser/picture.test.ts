// The site diagram, the Checks jumps, and cell marks and choices, in Debian's chromium.
// Screenshots go to test-artifacts/ (20-… to 24-…) and were looked at when these tests were
// written. The keyboard, layout and look are in habits.test.ts.
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, startApp, stopApp, type AppUnderTest, type Browser } from './harness.ts';
import { cell, cellText, columnOf, openSheet, rowWith, selectCell, typeInCell } from './gridHelpers.ts';

let app: AppUnderTest | undefined;
let browser: Browser;
let page: Page;
let dir: string;

beforeAll(async () => {
  app = await startApp();
  ({ browser, page } = app);
  dir = await mkdtemp(join(tmpdir(), 'kl-picture-'));
});

afterAll(async () => {
  await stopApp(app);
  if (dir) await rm(dir, { recursive: true, force: true });
});

const address = () => page.locator('[data-testid="fb-address"]').textContent();
const caption = () => page.locator('[data-testid="sheet-caption"] strong').textContent();
const diagram = () => page.locator('[data-testid="diagram"]');
const checksSummary = () => page.locator('[data-testid="checks-summary"]').textContent();

const column = (header: string) => columnOf(page, header);
const rowOf = (text: string) => rowWith(page, text);

async function panel(name: string, open: boolean): Promise<void> {
  const pressed = await page.locator(`[data-testid="toggle-${name}"]`).getAttribute('aria-pressed');
  if ((pressed === 'true') !== open) await page.click(`[data-testid="toggle-${name}"]`);
}

async function undo(): Promise<void> {
  await page.locator('[data-testid="undo"]').click();
}

describe('site diagram', () => {
  it('draws the buses of the demo with their figures, and a bus added on a sheet shows up', async () => {
    await panel('diagram', true);
    for (const bus of ['MV-11', 'LV-REF', 'LV-SVC']) await diagram().locator(`[data-bus="${bus}"]`).waitFor();
    // The figures are the Buses sheet's: P of LV-REF in the first case as the grid shows it.
    const text = (await diagram().locator('[data-bus="LV-REF"]').textContent()) ?? '';
    expect(text).toMatch(/P [\d,]+\.\d kW/);
    expect(text).toMatch(/cos φ 0\.\d{3}/);
    expect(await diagram().locator('.kl-dg-band-label').allTextContents()).toEqual(['11 kV', '0.4 kV']);
    await screenshot(page, '20-diagram');

    await openSheet(page, 'Transformers');
    const row = 3; // below the demo's two transformers
    await typeInCell(page, row, await column('Tag'), 'TX9');
    await typeInCell(page, row, await column('Bus'), 'MV-11');
    await typeInCell(page, row, await column('Feeds bus'), 'LV-NEW');
    await typeInCell(page, row, await column('Rating (kVA)'), '400');
    await expect.poll(() => diagram().locator('[data-bus="LV-NEW"]').count(), { timeout: 10_000 }).toBe(1);
    // The Buses sheet follows the equipment: the new bus has its row at once, so it is drawn
    // with figures, not as a bus waiting for a row.
    await expect
      .poll(() => diagram().locator('[data-bus="LV-NEW"]').getAttribute('class'), { timeout: 10_000 })
      .not.toMatch(/is-off-sheet/);
    expect(await diagram().locator('[data-bus="LV-NEW"]').textContent()).toMatch(/P [\d,]+\.\d kW/);
    await expect
      .poll(() => diagram().locator('[data-bus="LV-NEW"] .kl-dg-feeder-label').allTextContents(), {
        timeout: 10_000,
      })
      .toEqual(['TX9', '400 kVA']);
    await screenshot(page, '21-diagram-bus-added');
    for (let i = 0; i < 4; i++) await undo();
    await expect.poll(() => diagram().locator('[data-bus="LV-NEW"]').count(), { timeout: 10_000 }).toBe(0);
  });

  it('a click on a bus selects its row on the Buses sheet', async () => {
    await diagram().locator('[data-bus="LV-SVC"] .kl-dg-box').click();
    await expect.poll(caption).toBe('Buses');
    const r = await rowOf('LV-SVC');
    expect(await address()).toBe(`Buses!A${r + 1}`);
  });

  it('marks a bus in error on the diagram and on the charts, not as 0 kvar', async () => {
    await openSheet(page, 'Motors');
    const cos = await column('cos φ');
    await typeInCell(page, 1, cos, '1.3');
    await expect
      .poll(() => diagram().locator('[data-bus="LV-REF"]').getAttribute('class'), { timeout: 10_000 })
      .toMatch(/is-error/);
    expect(await diagram().locator('[data-bus="LV-REF"] title').first().textContent()).toMatch(
      /error: .*cos_phi/,
    );
    expect(await diagram().locator('[data-bus="LV-SVC"]').getAttribute('class')).not.toMatch(/is-error/);
    await screenshot(page, '22-diagram-error');
    await panel('charts', true);
    const charts = page.locator('[data-testid="charts"]');
    await charts.locator('.kl-bar-row.is-error[data-bus="LV-REF"]').waitFor();
    expect(await charts.locator('.kl-bar-row.is-error[data-bus="LV-REF"]').textContent()).toMatch(/#N\/A/);
    await undo();
    await expect.poll(() => charts.locator('.kl-bar-row.is-error').count()).toBe(0);
  });

  it('downloads the diagram as a standalone SVG', async () => {
    await panel('diagram', true);
    await diagram().locator('[data-bus="LV-REF"]').waitFor();
    const download = page.waitForEvent('download');
    await page.click('[data-testid="diagram-download"]');
    const d = await download;
    expect(d.suggestedFilename()).toMatch(/diagram.*\.svg$/);
    const path = join(dir, 'diagram.svg');
    await d.saveAs(path);
    const svg = await readFile(path, 'utf8');
    expect(svg).toMatch(/^<\?xml/);
    expect(svg).toContain('<style>');
    expect(svg).toContain('.kl-dg-bar');
    expect(svg).toContain('LV-REF');
    expect(svg).toMatch(/not a design document/);
  });
});

describe('Checks: each entry jumps to its cell', () => {
  async function jump(where: RegExp): Promise<void> {
    await panel('checks', true);
    const item = page.locator('.kl-check', { has: page.locator('.kl-check-where', { hasText: where }) });
    await item.first().waitFor({ timeout: 20_000 });
    await item.first().locator('button').click();
  }

  it('a Site-sheet problem: named by the Site row, jumps to the value cell', async () => {
    await panel('checks', true);
    await openSheet(page, 'Site');
    const r = await rowOf('Frequency');
    await typeInCell(page, r, 1, '55');
    const entry = page.locator('.kl-check.is-error', { hasText: 'got 55' });
    await entry.first().waitFor({ timeout: 20_000 });
    expect(await checksSummary()).toMatch(/^1 error/);
    expect(await entry.locator('.kl-check-where').textContent()).toBe(`Site row ${r + 1}, column Frequency`);
    await openSheet(page, 'Motors');
    await jump(/^Site row/);
    await expect.poll(caption).toBe('Site');
    expect(await address()).toBe(`Site!B${r + 1}`);
    await screenshot(page, '23-checks-site-row');
    await undo();
  });

  it('an input on an equipment sheet: jumps to that column, not column A', async () => {
    await openSheet(page, 'Motors');
    const cos = await column('cos φ');
    await typeInCell(page, 2, cos, '1.4');
    await openSheet(page, 'Site');
    await jump(/^Motors row 3, column cos φ$/);
    await expect.poll(caption).toBe('Motors');
    expect(await address()).toBe(`Motors!${String.fromCharCode(65 + cos)}3`);
    await undo();
  });

  it('a bus typo: reported at the row that has it, rows in the text are sheet rows', async () => {
    await openSheet(page, 'Loads');
    const busCol = await column('Bus');
    await typeInCell(page, 2, busCol, 'LV-REFF');
    // The panel recomputes a moment after the last edit: wait for the entry about the typo.
    const entry = page.locator('.kl-check.is-error', { hasText: 'LV-REFF' });
    await entry.first().waitFor({ timeout: 20_000 });
    expect(await checksSummary()).toMatch(/^1 error/);
    expect(await entry.locator('.kl-check-text').textContent()).toContain('LV-REFF (Loads row 3)');
    await openSheet(page, 'Site');
    await jump(/^Loads row 3, column Bus$/);
    await expect.poll(caption).toBe('Loads');
    expect(await address()).toBe(`Loads!${String.fromCharCode(65 + busCol)}3`);
    await undo();
    await expect.poll(checksSummary, { timeout: 20_000 }).toMatch(/^0 errors/);
  });
});

describe('Checks: a design finding jumps to its bus', () => {
  it('on the solar collector at night, cable charging shows its bus on the Buses sheet', async () => {
    await page.click('[data-testid="menu-workbook"]');
    await page.click('[data-testid="menu-template"]');
    await page.click('[data-testid="template-solar-collector"]');
    await expect.poll(() => page.locator('[data-testid="title"]').inputValue()).toMatch(/Solar park/);
    await panel('checks', true);
    const item = page.locator('.kl-check', { hasText: 'case night' }).filter({ has: page.locator('button') });
    await item.first().waitFor({ timeout: 20_000 });
    const bus = /^bus (\S+)/.exec((await item.first().locator('.kl-check-where').textContent()) ?? '')?.[1];
    expect(bus).toBeDefined();
    await item.first().locator('button').click();
    await expect.poll(caption).toBe('Buses');
    const r = await rowOf(bus as string);
    expect(await address()).toBe(`Buses!A${r + 1}`);
  });
});

describe('cell choices and marks from sheet metadata', () => {
  it('marks an assumed value, ends the mark when typed over, and keeps a choice cell to its list', async () => {
    const doc = {
      format: 'kvar-ledger-workbook',
      version: 1,
      title: 'Marks and choices',
      sheets: [
        {
          name: 'Setup',
          columns: [
            { header: 'Setting', width: 24 },
            { header: 'Value', width: 12 },
          ],
          cells: [
            ['Setting', 'Value'],
            ['Requirement', 'cos φ'],
            ['Frequency (Hz)', 50],
            ['Rating (kVA)', 1000],
            ['Load losses (kW)', 7.6],
          ],
          choices: [
            { row: 1, col: 1, options: ['cos φ', 'tan φ'], message: 'The requirement is cos φ or tan φ.' },
            { row: 2, col: 1, options: ['50', '60'], message: 'The frequency must be 50 or 60 Hz.' },
          ],
          marks: [
            {
              row: 4,
              col: 1,
              kind: 'assumed',
              note: 'maximum for 1000 kVA, EU 548/2014 Tier 2',
              value: 7.6,
            },
          ],
        },
      ],
    };
    const path = join(dir, 'marks.kvar.json');
    await writeFile(path, JSON.stringify(doc));
    const chooser = page.waitForEvent('filechooser');
    await page.click('[data-testid="menu-workbook"]');
    await page.click('[data-testid="menu-open"]');
    await (await chooser).setFiles(path);
    await expect.poll(caption).toBe('Setup');

    const assumed = cell(page, 4, 1);
    expect(await assumed.getAttribute('class')).toMatch(/kl-mark-assumed/);
    expect(await assumed.getAttribute('title')).toMatch(
      /^Assumed: maximum for 1000 kVA, EU 548\/2014 Tier 2/,
    );
    expect(await cell(page, 2, 1).getAttribute('class')).toMatch(/kl-choice/);
    await screenshot(page, '24-marks-choices');

    // A value outside the list is refused with the sheet's message; the cell keeps its value.
    await typeInCell(page, 2, 1, '55');
    expect(await page.locator('[data-testid="notice"]').textContent()).toMatch(
      /The frequency must be 50 or 60 Hz\. \(choose "50" or "60"; got "55"\)/,
    );
    // What was typed stays in the cell's editor to mend; Escape gives the cell back its value.
    const editor = page.locator('.kl-grid-host textarea.handsontableInput');
    await expect.poll(() => editor.inputValue()).toBe('55');
    await page.keyboard.press('Escape');
    expect(await cellText(page, 2, 1)).toBe('50');
    await typeInCell(page, 3, 1, '1250');
    await typeInCell(page, 2, 1, '60');
    expect(await cellText(page, 2, 1)).toBe('60');

    // Alt+↓ opens the list; arrows and Enter pick.
    await selectCell(page, 1, 1);
    await page.keyboard.press('Alt+ArrowDown');
    const list = page.locator('[data-testid="choice-list"]');
    await list.waitFor();
    expect(await list.locator('button').allTextContents()).toEqual(['cos φ', 'tan φ']);
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('Enter');
    await expect.poll(() => cellText(page, 1, 1)).toBe('tan φ');
    // The ▾ at the cell's right edge opens it with the mouse.
    const box = await cell(page, 1, 1).boundingBox();
    await page.mouse.click((box?.x ?? 0) + (box?.width ?? 0) - 8, (box?.y ?? 0) + 8);
    await list.waitFor();
    await list.locator('button', { hasText: 'cos φ' }).click();
    await expect.poll(() => cellText(page, 1, 1)).toBe('cos φ');

    // Typing over the assumed value ends the assumption.
    await typeInCell(page, 4, 1, '8.1');
    await expect.poll(() => cell(page, 4, 1).getAttribute('class')).not.toMatch(/kl-mark-assumed/);
    await undo();
    await expect.poll(() => cell(page, 4, 1).getAttribute('class')).toMatch(/kl-mark-assumed/);
  });
});

describe('typical values for a tender-stage list', () => {
  it('fills the blanks of a motor given only its rating, marks them, lists them in Checks', async () => {
    await page.click('[data-testid="menu-workbook"]');
    await page.click('[data-testid="menu-template"]');
    await page.click('[data-testid="template-cold-store"]');
    await expect.poll(() => page.locator('[data-testid="title"]').inputValue()).toMatch(/Cold store/);
    await openSheet(page, 'Motors');
    const row = 6; // the first empty row below the demo's five motors
    await typeInCell(page, row, await column('Tag'), 'M-TYP');
    await typeInCell(page, row, await column('Bus'), 'LV-REF');
    await typeInCell(page, row, await column('Rated output (kW)'), '11');
    await page.click('[data-testid="menu-edit"]');
    await page.click('[data-testid="menu-typical"]');
    await expect
      .poll(() => page.locator('[data-testid="notice"]').textContent())
      .toMatch(/blank value\(s\) filled with typical values, marked as assumed/);
    // IE3, 4-pole, 11 kW: 91.4 % (IEC 60034-30-1 Table 2).
    const eff = cell(page, row, await column('Efficiency'));
    expect(await eff.textContent()).toBe('0.914');
    expect(await eff.getAttribute('class')).toMatch(/kl-mark-assumed/);
    expect(await eff.getAttribute('title')).toMatch(/^Assumed: 11 kW, 4-pole, class IE3; IEC 60034-30-1/);
    await panel('checks', true);
    const listed = page.locator('.kl-check', { hasText: 'typical values put in for blanks' });
    await listed.first().waitFor({ timeout: 20_000 });
    expect(await listed.first().textContent()).toMatch(/row 7 Efficiency/);
    await screenshot(page, '25-typical-values');
    // The nameplate value replaces the assumption.
    await typeInCell(page, row, await column('Efficiency'), '0.92');
    await expect.poll(() => eff.getAttribute('class')).not.toMatch(/kl-mark-assumed/);
  });
});

describe('the page', () => {
  it('logged no console errors', () => {
    expect(browser.errors).toEqual([]);
  });
});
