// `kvar-ledger balance` says what the Compensation sheet shows for a plain bank beside cable and
// line charging: the solar template with a night-only cable and a plain bank on a collector bus
// (tests/core/workbook/chargedSolar.ts, hand figures and sources there). Already at noon, with the
// feeders' charging alone, the bank comes within 10 % of the 11th (h = √(Ssc/(Q + charging)),
// IEEE Std 1036), and at night with the cable's charging too: each case's listing names its own.
// The inverters are no 6-pulse source: information, naming the charging.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/balance.ts';
import { writeSiteFile } from '../../src/core/site/siteFile.ts';
import { bank, lines, nightCharging, order, site } from '../core/workbook/chargedSolar.ts';

async function bankResonance(caseName: string) {
  const file = join(mkdtempSync(join(tmpdir(), 'kvar-zone-')), 'charged.json');
  writeFileSync(file, writeSiteFile(site, [bank]));
  let out = '';
  const code = await run([file, '--json', '--case', caseName], {
    out: (t) => void (out += t),
    err: () => {},
  });
  expect(code).toBe(0);
  const warnings = (
    JSON.parse(out) as { warnings: Array<{ code?: string; message: string; severity: string }> }
  ).warnings;
  return warnings.filter((x) => x.message.includes('the bank on bus BLK-A resonates'));
}

describe('balance: resonance with the zone’s charging', () => {
  it('names the charging and the order, as Checks and the sheet count it', async () => {
    const w = await bankResonance('noon');
    expect(w).toHaveLength(1);
    expect(w[0]?.message).toContain(`${lines.toFixed(1)} kvar of cable and line charging`);
    // Of the states within 10 % of the 11th, the nearest: one step gives 11.53 (4.8 % off), two
    // steps 10.93 (0.6 % off), so two steps (600 kvar) are named.
    expect(Math.abs(order(300 + lines) / 11 - 1)).toBeGreaterThan(Math.abs(order(600 + lines) / 11 - 1));
    expect(w[0]?.message).toContain('with 600.0 kvar connected');
    expect(w[0]?.message).toContain(`order ${order(600 + lines).toFixed(2)}`);
    expect(w[0]?.message).toMatch(/near the 11th harmonic, which no item on bus BLK-A or below produces/);
    expect(w[0]?.severity).toBe('info');
  });

  it('--case night lists it too, with the night’s charging (not only the first case found)', async () => {
    const w = await bankResonance('night');
    expect(w).toHaveLength(1);
    expect(w[0]?.message).toContain(`${nightCharging.toFixed(1)} kvar of cable and line charging`);
    expect(w[0]?.message).toMatch(/near the 11th harmonic/);
  });
});
