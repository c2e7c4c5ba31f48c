// The download budget of the page (README, download size), measured on a fresh build.
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildAndMeasure, INITIAL_JS_BUDGET, ROOT } from './bundleSize.ts';

describe('bundle size', () => {
  it('keeps the initial JavaScript within 437 kB gzip and the xlsx library out of it', async () => {
    const r = await buildAndMeasure();
    await mkdir(join(ROOT, 'test-artifacts'), { recursive: true });
    await writeFile(join(ROOT, 'test-artifacts', 'bundle-size.json'), JSON.stringify(r, null, 1));
    console.log(
      `initial JS ${r.initial.gzip} B gzip; first visit +${r.firstVisitExtra.gzip} B; CSS ${r.css.gzip} B; xlsx ${r.xlsx.gzip} B on demand`,
    );
    expect(r.initial.files.length).toBeGreaterThan(0);
    expect(r.initial.gzip).toBeLessThanOrEqual(INITIAL_JS_BUDGET);
    // The demo on a first visit fits the same budget.
    expect(r.initial.gzip + r.firstVisitExtra.gzip).toBeLessThanOrEqual(INITIAL_JS_BUDGET);
    // The xlsx library exists as its own chunk and is fetched only when importing or exporting.
    expect(r.xlsx.files.length).toBeGreaterThan(0);
    expect(r.xlsx.inInitial).toBe(false);
    expect(r.xlsx.inFirstVisit).toBe(false);
  });
});
