import { writeFileSync } from 'node:fs';
import { generateSite } from '../bench/generateSite.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import { launch, serve } from './harness.ts';
const doc = buildWorkbook(generateSite({ rows: 10000, buses: 300 }), { flavour: 'live' });
writeFileSync('/tmp/kl-big.kvar.json', JSON.stringify({ ...doc, title: 'Big site' }));
const s = await serve();
const b = await launch();
const page = b.page;
try {
  await page.goto(s.url);
  await page.waitForSelector('#app[data-ready="true"]');
  await page.click('[data-testid=menu-workbook]');
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.click('[data-testid=menu-open]')]);
  let t = Date.now();
  await chooser.setFiles('/tmp/kl-big.kvar.json');
  await page.waitForFunction(() => (document.querySelector('[data-testid=title]') as HTMLInputElement)?.value === 'Big site', undefined, { timeout: 300000 });
  console.log('open ms', Date.now() - t);
  if (process.env.CHARTS) await page.click('[data-testid=toggle-charts]');
  await page.click('[data-testid=sheet-tab][data-sheet="Motors"]');
  await page.locator('.kl-grid-host .ht_master .htCore tbody tr').nth(1).locator('td').nth(3).click();
  await page.waitForTimeout(3000);
  const cdp = await b.context.newCDPSession(page);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.start');
  for (let k = 0; k < 3; k++) {
    t = Date.now();
    await page.keyboard.type(String(5 + k));
    await page.keyboard.press('Enter');
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
    console.log('edit ms', Date.now() - t);
  }
  const { profile } = await cdp.send('Profiler.stop');
  writeFileSync('/tmp/kl-edit.cpuprofile', JSON.stringify(profile));
  // self time by function
  const self = new Map<string, number>();
  const nodes = new Map(profile.nodes.map((n: any) => [n.id, n]));
  const dt = profile.timeDeltas as number[];
  profile.samples.forEach((id: number, i: number) => { const n: any = nodes.get(id); const k = `${n.callFrame.functionName || '(anon)'} ${n.callFrame.url.split('/').pop()}:${n.callFrame.lineNumber}`; self.set(k, (self.get(k) ?? 0) + (dt[i] ?? 0)); });
  console.log([...self].sort((a, b) => b[1] - a[1]).slice(0, 25).map(([k, v]) => `${(v / 1000).toFixed(1)}ms ${k}`).join('\n'));
  console.log('errors', b.errors);
} finally {
  await b.close();
  await s.close();
}
