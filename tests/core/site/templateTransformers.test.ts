// Templates follow their own advice: every template transformer up to 3 150 kVA stays within the
// maximum losses of Commission Regulation (EU) No 548/2014, Annex I, Tier 2 (from 1 July 2021),
// Table I.1, liquid-immersed (values from memory, written out here apart from the app's table).
// Larger units are judged there by the peak efficiency index instead, which this test leaves out.
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

/** Rating kVA → [Pk max kW, P0 max kW], the rows the templates use. */
const TIER2_LIQUID: Record<number, readonly [number, number]> = {
  250: [2.35, 0.27],
  800: [6.0, 0.585],
  1000: [7.6, 0.693],
  1600: [12.0, 1.08],
  3150: [23.0, 1.98],
};

const dir = join(import.meta.dirname, '../../../templates');

describe('template transformers meet EU 548/2014 Tier 2', () => {
  for (const f of readdirSync(dir).filter((n) => n.endsWith('.json'))) {
    it(f, () => {
      const { equipment } = JSON.parse(readFileSync(join(dir, f), 'utf8')) as {
        equipment: Array<Record<string, string | number>>;
      };
      const units = equipment.filter((r) => r.kind === 'transformer' && (r.s_kva as number) <= 3150);
      for (const r of units) {
        const limit = TIER2_LIQUID[r.s_kva as number];
        expect(limit, `${f} ${String(r.tag)}: add the ${String(r.s_kva)} kVA row`).toBeDefined();
        const [pk, p0] = limit as readonly [number, number];
        expect(r.pk_kw as number, `${f} ${String(r.tag)} pk_kw`).toBeLessThanOrEqual(pk);
        expect(r.p0_kw as number, `${f} ${String(r.tag)} p0_kw`).toBeLessThanOrEqual(p0);
      }
    });
  }
});
