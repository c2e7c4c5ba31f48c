// `kvar-ledger balance` prints a bank of a step series with its stages and controller steps, and
// its JSON carries both. A site file whose bank is a 1:2:2 bank of 4 stages, 25 kvar smallest:
// by hand 1 + 2 + 2 + 2 = 7 controller steps, 175 kvar.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/balance.ts';
import { writeSiteFile } from '../../src/core/site/siteFile.ts';
import { siteFromCsv } from '../core/site/fixtures.ts';

const tmp = mkdtempSync(join(tmpdir(), 'kvar-series-'));

async function balance(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await run(argv, { out: (t) => void (out += t), err: (t) => void (err += t) });
  return { code, out, err };
}

function siteFile(bank: Record<string, unknown>): string {
  const { site } = siteFromCsv('tag,bus,kind,p_kw,cos_phi,u_kv\nL1,LV,load,250,0.75,0.4');
  const text = writeSiteFile(site, []).replace('"banks": [\n\n  ]', `"banks": [${JSON.stringify(bank)}]`);
  const file = join(tmp, `site-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(file, text);
  return file;
}

describe('balance with a step series', () => {
  const bank = { bus: 'LV', step_kvar: 25, steps: 4, series: '1:2:2' };

  it('prints the stages, the series and the controller steps', async () => {
    const r = await balance(siteFile(bank));
    expect(r.code).toBe(0);
    expect(r.out).toContain('LV (0.4 kV): 4 stages 1:2:2 = 7 × 25 kvar steps = 175 kvar');
  });

  it('JSON: series, controller steps and total', async () => {
    const r = await balance(siteFile(bank), '--json');
    const doc = JSON.parse(r.out) as { compensation: { banks: Record<string, unknown>[] } };
    expect(doc.compensation.banks[0]).toMatchObject({
      steps: 4,
      series: '1:2:2',
      controller_steps: 7,
      total_kvar: 175,
    });
  });

  it('an unknown series is refused with where and what is allowed', async () => {
    const r = await balance(siteFile({ ...bank, series: '1:2:3' }));
    expect(r.code).toBe(1);
    expect(r.err).toContain('banks[0] series must be one of 1:1:1, 1:2:2, 1:2:4 (blank: 1:1:1); got "1:2:3"');
  });
});
