// Branch losses that run away: a chain of low-voltage lines carrying megawatts, each line's I²X
// added to the load of the line above it, grows without bound (the property test of the page
// found one at 3e50 kvar). The roll-up names the first such branch from the bottom as an error
// instead of passing the figure on; the command line refuses the site with it.
import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { EquipmentRow, Site } from '../../../src/core/site/model.ts';
import { rollUp, runawayProblem, RUNAWAY_KVA } from '../../../src/core/site/rollup.ts';
import { writeSiteFile } from '../../../src/core/site/siteFile.ts';
import { draftOptions, standardOptions } from '../../../src/core/site/designOptions.ts';

function chain(uKv: number, lines: number, loadKw: number): Site {
  const equipment: EquipmentRow[] = Array.from({ length: lines }, (_, i) => ({
    row: i + 2,
    tag: `W${i + 1}`,
    bus: `B${i}`,
    kind: 'line',
    to_bus: `B${i + 1}`,
    values: { u_kv: uKv, l_mh_km: 1.1, c_nf_km: 10, len_km: 0.15 },
    loads: {},
  }));
  equipment.push({
    row: lines + 2,
    tag: 'L1',
    bus: `B${lines}`,
    kind: 'load',
    values: { p_kw: loadKw, cos_phi: 0.9, u_kv: uKv },
    loads: {},
  });
  return {
    settings: { name: 'Line chain', hz: 50, cases: ['day'], requirement: { kind: 'cosphi', target: 0.95 } },
    equipment,
  };
}

describe('runaway branch losses', () => {
  it("a bottom line's loss is S²·X/U² (hand check of the growth), below the bound", () => {
    const bal = rollUp(chain(0.4, 1, 2000), 'day');
    // X = 2π·50·1.1 mH/km·0.15 km = 0.05184 Ω; S = 2000/0.9 kVA; Q = S²/U²·X (kVA, kV, Ω → kvar /1000).
    const s = 2000 / 0.9;
    const q = ((s * s) / (0.4 * 0.4)) * ((2 * Math.PI * 50 * 1.1e-3 * 0.15) / 1000);
    const line = bal.elements.find((e) => e.tag === 'W1');
    expect(line?.q_absorbed_kvar).toBeCloseTo(q, 6);
    expect(runawayProblem(bal)).toBeUndefined();
  });

  it('twelve 0.4 kV lines carrying 2 MW run away: an error on a line row, not a figure', () => {
    const bal = rollUp(chain(0.4, 12, 2000), 'day');
    const p = runawayProblem(bal);
    expect(p?.severity).toBe('error');
    expect(p?.message).toMatch(/^row \d+: the line's own losses come to .* kvar .* in case day \(50 Hz\)/);
    const row = p?.row as number;
    const e = bal.elements.find((x) => x.row === row);
    expect(e?.q_absorbed_kvar).toBeGreaterThan(RUNAWAY_KVA);
    // Reported once, at the first line from the bottom that passes the bound.
    expect(bal.problems.filter((x) => x.message.includes('own losses'))).toHaveLength(1);
    const below = bal.elements.filter((x) => x.kind === 'line' && x.row > row);
    for (const b of below) expect(b.q_absorbed_kvar).toBeLessThanOrEqual(RUNAWAY_KVA);
  });

  it('the same chain at 11 kV stays finite and raises nothing', () => {
    const bal = rollUp(chain(11, 12, 2000), 'day');
    expect(runawayProblem(bal)).toBeUndefined();
    expect(bal.root.q_kvar).toBeLessThan(10_000);
  });

  it('the command line refuses such a site, naming the row, instead of an internal error', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kvar-runaway-'));
    const file = join(dir, 'chain.json');
    writeFileSync(file, writeSiteFile(chain(0.4, 12, 2000)));
    const root = fileURLToPath(new URL('../../../', import.meta.url));
    const r = await new Promise<{ code: number; stderr: string }>((resolve) =>
      execFile(
        process.execPath,
        [`${root}src/cli/bin.mjs`, 'balance', file],
        { cwd: root },
        (err, _o, stderr) =>
          resolve({ code: err ? (typeof err.code === 'number' ? err.code : 1) : 0, stderr }),
      ),
    );
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/row \d+: the line's own losses come to/);
    expect(r.stderr).not.toMatch(/internal error/);
  });
});

describe('the design options of a site whose losses run away', () => {
  // The page's property test found a site whose own design balanced but one standard option (a
  // different set of banks) ran away, and building its workbook threw: a workbook starts with
  // blank option blocks instead, and Checks says why when the options are compared.
  it('are none to start a workbook with, where the design itself refuses the site', () => {
    const site = chain(0.4, 12, 2000);
    expect(() => standardOptions(site, undefined)).toThrow(/must be 0 or between/);
    expect(draftOptions(site)).toEqual([]);
  });
});
