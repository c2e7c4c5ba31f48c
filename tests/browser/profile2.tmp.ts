import { launch, serve } from './harness.ts';
const s = await serve();
const b = await launch();
const page = b.page;
const big = process.env.BIG === '1';
try {
  await page.goto(s.url);
  await page.waitForSelector('#app[data-ready="true"]');
  if (big) {
    await page.click('[data-testid=menu-workbook]');
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.click('[data-testid=menu-open]')]);
    await chooser.setFiles('/tmp/kl-big.kvar.json');
    await page.waitForFunction(() => (document.querySelector('[data-testid=title]') as HTMLInputElement)?.value === 'Big site', undefined, { timeout: 300000 });
  }
  if (process.env.CHARTS) await page.click('[data-testid=toggle-charts]');
  await page.click('[data-testid=sheet-tab][data-sheet="Motors"]');
  await page.locator('.kl-grid-host .ht_master .htCore tbody tr').nth(1).locator('td').nth(3).click();
  await page.waitForTimeout(4000);
  const cdp = await b.context.newCDPSession(page);
  await cdp.send('Performance.enable');
  const get = async () => Object.fromEntries(((await cdp.send('Performance.getMetrics')) as any).metrics.map((m: any) => [m.name, m.value]));
  const m0 = await get();
  const N = 5;
  for (let k = 0; k < N; k++) {
    await page.keyboard.type(String(5 + k));
    await page.keyboard.press('Enter');
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
  }
  const m1 = await get();
  for (const key of ['TaskDuration', 'ScriptDuration', 'LayoutDuration', 'RecalcStyleDuration', 'LayoutCount', 'RecalcStyleCount']) console.log(key, ((m1[key] - m0[key]) / N * (key.endsWith('Count') ? 1 : 1000)).toFixed(1), 'per edit');
} finally {
  await b.close();
  await s.close();
}
