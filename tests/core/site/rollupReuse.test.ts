// A roll-up with banks switched in (compensate.ts) takes the items of the balance without them
// instead of computing every row again. The shortcut must give exactly the full roll-up, and
// must not be taken from a balance of another case or of another site. The sites are the
// invented templates; the reference is the same roll-up without the shortcut.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Site } from '../../../src/core/site/model.ts';
import { rollUp, type BusExtra } from '../../../src/core/site/rollup.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';

const template = (name: string): Site =>
  readSiteFile(readFileSync(new URL(`../../../templates/${name}.json`, import.meta.url), 'utf8')).site;

/** A bank's output on every bus, and a reactor on the root: what compensate adds. */
function extras(site: Site, caseName: string): Map<string, BusExtra> {
  const buses = rollUp(site, caseName).buses;
  return new Map(
    buses.map((b, i) => [b.bus, { q_absorbed_kvar: i === 0 ? 40 : 0, q_delivered_kvar: 25 * (i + 1) }]),
  );
}

describe('roll-up with banks, from the items of the balance without them', () => {
  for (const name of ['cold-store', 'pumping-station', 'solar-collector']) {
    it(`${name}: equals the full roll-up in every case`, () => {
      const site = template(name);
      for (const c of site.settings.cases) {
        const extra = extras(site, c);
        const full = rollUp(site, c, extra);
        expect(rollUp(site, c, extra, rollUp(site, c))).toEqual(full);
        // From a balance that already has banks in: its items are the same.
        expect(rollUp(site, c, extra, full)).toEqual(full);
      }
    });
  }

  it('ignores a balance of another case or of another site', () => {
    const site = template('pumping-station');
    const [first, second] = site.settings.cases as [string, string];
    const extra = extras(site, first);
    const full = rollUp(site, first, extra);
    expect(rollUp(site, first, extra, rollUp(site, second))).toEqual(full);
    // The same rows with one motor's load changed: another site, other items.
    const other: Site = {
      ...site,
      equipment: site.equipment.map((r) =>
        r.kind === 'motor' ? { ...r, values: { ...r.values, p_kw: (r.values.p_kw ?? 0) * 2 } } : r,
      ),
    };
    expect(rollUp(other, first, extra, rollUp(site, first))).toEqual(rollUp(other, first, extra));
    expect(rollUp(other, first, extra).root.p_kw).not.toBe(full.root.p_kw);
  });
});
