import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { build } from 'vite';
import { ROOT, launch, serve } from './harness.ts';
await build({ root: ROOT, logLevel: 'error', configFile: join(ROOT, 'vite.config.ts'), build: { minify: false, outDir: '/tmp/kl-dbg', emptyOutDir: true } });
const s = await serve('/tmp/kl-dbg');
const b = await launch();
const page = b.page;
try {
  await page.goto(s.url);
  await page.waitForSelector('#app[data-ready="true"]');
  await page.click('[data-testid=sheet-tab][data-sheet="Motors"]');
  await page.locator('.kl-grid-host .ht_master .htCore tbody tr').nth(1).locator('td').nth(3).click();
  await page.waitForTimeout(2000);
  const cdp = await b.context.newCDPSession(page);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
  await cdp.send('Profiler.start');
  for (let k = 0; k < 5; k++) {
    await page.keyboard.type(String(5 + k));
    await page.keyboard.press('Enter');
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
  }
  const { profile } = await cdp.send('Profiler.stop') as any;
  // total (inclusive) time per function
  const nodes = new Map<number, any>(profile.nodes.map((n: any) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const incl = new Map<string, number>();
  profile.samples.forEach((id: number, i: number) => {
    const dt = profile.timeDeltas[i] ?? 0;
    const seen = new Set<string>();
    for (let cur: number | undefined = id; cur !== undefined; cur = parent.get(cur)) {
      const n = nodes.get(cur);
      const k = `${n.callFrame.functionName || '(anon)'} ${n.callFrame.url.split('/').pop()}:${n.callFrame.lineNumber}`;
      if (seen.has(k)) continue;
      seen.add(k);
      incl.set(k, (incl.get(k) ?? 0) + dt);
    }
  });
  console.log([...incl].sort((a, b) => b[1] - a[1]).slice(0, 60).map(([k, v]) => `${(v / 5000).toFixed(1)}ms/edit ${k}`).join('\n'));
} finally {
  await b.close();
  await s.close();
}
