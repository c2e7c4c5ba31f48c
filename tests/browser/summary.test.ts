// The one-page summary in the page: the Workbook menu opens it over the demo, it shows the
// figures the workbook's engine computes (the same template opened here through the same
// session code and read with the same reader), and printing it gives exactly one page on A4 and
// on Letter (chromium's print to PDF, pages counted in the PDF's bytes).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { ROOT, screenshot, startApp, stopApp, type AppUnderTest } from './harness.ts';
import { WorkbookSession } from '../../src/ui/model/session.ts';
import { workbookOf } from '../../src/ui/templates/templateBuild.ts';
import { readSummary, shown, type SummaryData } from '../../src/ui/summary/summaryData.ts';

let app: AppUnderTest | undefined;
let page: Page;
let expected: SummaryData;

beforeAll(async () => {
  app = await startApp();
  page = app.page;
  // The demo the page opens is the cold-store template.
  const id = 'cold-store';
  const s = WorkbookSession.fromDoc(
    await workbookOf(id, readFileSync(join(ROOT, `templates/${id}.json`), 'utf8')),
  );
  expected = readSummary((name) => {
    const sheet = s.engine.getSheetId(name);
    return sheet === undefined ? undefined : s.engine.getSheetValues(sheet);
  });
});

afterAll(async () => {
  await stopApp(app);
});

/** Pages of a PDF: its page objects (/Type /Page, not /Pages), as chromium writes them uncompressed. */
function pageCount(pdf: Buffer): number {
  return pdf.toString('latin1').match(/\/Type\s*\/Page(?![a-z])/g)?.length ?? 0;
}

const text = (testId: string) => page.locator(`[data-testid="${testId}"]`).textContent();

describe('the summary page', () => {
  it('opens from the Workbook menu with the engine figures of the demo', async () => {
    await page.click('[data-testid="menu-workbook"]');
    await page.click('[data-testid="menu-summary"]');
    await page.waitForSelector('[data-testid="summary-page"]');
    expect(await text('summary-site')).toBe('Cold store on an 11 kV supply (invented demo)');
    expect(expected.cases.length).toBe(2);
    for (const [k, c] of expected.cases.entries()) {
      expect(await text(`cos-before-${k}`)).toBe(shown(c.cosBefore, '0.000'));
      expect(await text(`tan-before-${k}`)).toBe(shown(c.tanBefore, '0.000'));
      expect(await text(`cos-after-${k}`)).toBe(shown(c.cosAfter, '0.000'));
      expect(await text(`tan-after-${k}`)).toBe(shown(c.tanAfter, '0.000'));
      expect(await text(`within-${k}`)).toBe('yes');
    }
    const m = expected.money;
    if (!m || typeof m.total !== 'number' || typeof m.saving !== 'number' || typeof m.payback !== 'number')
      throw new Error('the demo should be priced');
    expect(await text('summary-total')).toBe(`${shown(m.total, '#,##0')} EUR`);
    expect(await text('summary-saving')).toBe(`${shown(m.saving, '#,##0')} EUR`);
    expect(await text('summary-payback')).toBe(`${shown(m.payback, '0.0')} years`);
    expect(await page.locator('[data-testid="summary-banks"] tbody tr').count()).toBe(2);
    // The schedule: a line per bus with a bank, its items as the Quantities sheet counts them.
    const schedule = page.locator('[data-testid="summary-schedule"] tbody tr');
    expect(await schedule.count()).toBe(m.schedule.length);
    const svc = m.schedule.find((b) => b.bus === 'LV-SVC');
    const svcRow = (await schedule.allInnerTexts()).find((t) => t.startsWith('LV-SVC')) ?? '';
    expect(svcRow).toContain('1 × LV contactor');
    expect(svcRow).toContain(`${shown(svc?.subtotal, '#,##0')} EUR`);
    expect(await page.locator('[data-testid="summary-page"] svg.kl-bars').count()).toBe(2);
    expect(await text('summary-cautions')).toMatch(/can hurt people.*licensed engineer.*INVENTED/s);
    await screenshot(page, 'summary');
  });

  it('prints on one A4 page and on one Letter page, without the grid', async () => {
    await page.waitForSelector('[data-testid="summary-page"]');
    for (const format of ['A4', 'Letter'] as const) {
      await page.click(`[data-testid="summary-paper-${format.toLowerCase()}"]`);
      const pdf = await page.pdf({ format, printBackground: true });
      expect(pageCount(pdf), format).toBe(1);
      // The sheet's name is in the PDF's text; the grid's column letters row is not printed.
      await page.emulateMedia({ media: 'print' });
      expect(await page.locator('.kl-grid-host').isVisible()).toBe(false);
      expect(await page.locator('[data-testid="summary-print"]').isVisible()).toBe(false);
      await page.emulateMedia({ media: null });
    }
  });

  it('counts more than one page when the sheet does not fit (the count can fail)', async () => {
    // A sheet made taller than the paper (a style set through the DOM, as the page's CSP allows).
    const sheet = page.locator('[data-testid="summary-page"]');
    await sheet.evaluate((n: HTMLElement) => (n.style.height = '400mm'));
    expect(pageCount(await page.pdf({ format: 'A4', printBackground: true }))).toBeGreaterThan(1);
    await sheet.evaluate((n: HTMLElement) => (n.style.height = ''));
    expect(pageCount(await page.pdf({ format: 'A4', printBackground: true }))).toBe(1);
  });

  it('closes with Escape and gives the page back', async () => {
    await page.keyboard.press('Escape');
    expect(await page.locator('[data-testid="summary"]').count()).toBe(0);
    expect(await page.locator('.kl-grid-host').isVisible()).toBe(true);
  });

  for (const id of ['pumping-station', 'solar-collector']) {
    it(`fits one A4 and one Letter page for the ${id} template`, async () => {
      await page.click('[data-testid="menu-workbook"]');
      await page.click('[data-testid="menu-template"]');
      await page.click(`[data-testid="template-${id}"]`);
      const site = (
        JSON.parse(readFileSync(join(ROOT, `templates/${id}.json`), 'utf8')) as {
          settings: { name: string };
        }
      ).settings.name;
      await expect.poll(() => page.locator('[data-testid="title"]').inputValue()).toBe(site);
      await page.click('[data-testid="menu-workbook"]');
      await page.click('[data-testid="menu-summary"]');
      expect(await text('summary-site')).toBe(site);
      for (const format of ['A4', 'Letter'] as const) {
        await page.click(`[data-testid="summary-paper-${format.toLowerCase()}"]`);
        expect(pageCount(await page.pdf({ format, printBackground: true })), format).toBe(1);
      }
      await screenshot(page, `summary-${id}`);
      await page.click('[data-testid="summary-close"]');
    });
  }
});
