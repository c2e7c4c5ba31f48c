import { it } from 'vitest';
import { buildApp, launch, openApp, serve, screenshot } from './harness.ts';
import { openSheet } from './gridHelpers.ts';
it('look', async () => {
  await buildApp();
  const s = await serve();
  const b = await launch();
  const page = b.page;
  try {
    await openApp(page, s.url);
    await page.click('[data-testid="menu-workbook"]');
    await page.click('[data-testid="menu-template"]');
    await page.click('[data-testid="template-solar-collector"]');
    await page.waitForFunction(() => /Solar/.test((document.querySelector('[data-testid=title]') as HTMLInputElement).value));
    await openSheet(page, 'Compensation');
    await page.click('[data-testid="toggle-charts"]');
    await page.locator('.kl-seg', { hasText: 'night' }).click();
    await page.waitForTimeout(300);
    await screenshot(page, 'look-solar-night');
    console.log('ERR', b.errors);
  } finally {
    await b.close();
    await s.close();
  }
});
