// `--kind KIND`: a list without a kind column, every row one kind. Without it the message names
// both ways out; a name that is no kind, or --kind on a file that is no list, is a wrong command
// line (exit 2). The figures by hand: a motor's electrical input P = P_out / η.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/balance.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const tmp = mkdtempSync(join(tmpdir(), 'kvar-kind-'));
const file = join(tmp, 'pumps.csv');
writeFileSync(
  file,
  'Item,Switchboard,Motor kW,Eff %,PF,u_kv\nP-1,MCC-1,11,91,0.85,0.4\nP-2,MCC-1,15,92,0.86,0.4\n',
);

async function balance(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await run(argv, { out: (t) => void (out += t), err: (t) => void (err += t) });
  return { code, out, err };
}

describe('kvar-ledger balance --kind', () => {
  it('without a kind column or --kind, says both ways out', async () => {
    const r = await balance(file);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(
      /no column for kind .*use --map COLUMN=kind, or give every row one kind with --kind KIND/,
    );
  });

  it('--kind motor reads every row as a motor', async () => {
    const r = await balance(file, '--kind', 'motor', '--json');
    expect(r.code, r.err).toBe(0);
    const out = JSON.parse(r.out) as { buses: Array<{ bus: string; own_p_kw: number }> };
    expect(out.buses.find((b) => b.bus === 'MCC-1')?.own_p_kw).toBeCloseTo(11 / 0.91 + 15 / 0.92, 9);
  });

  it('refuses a name that is no kind, and --kind on a site file', async () => {
    const bad = await balance(file, '--kind', 'pump');
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--kind pump: "pump" is not a kind of equipment; the kinds are motor, load/);
    const site = await balance(join(ROOT, 'templates/cold-store.json'), '--kind', 'motor');
    expect(site.code).toBe(2);
    expect(site.err).toMatch(/--map, --unit and --kind apply to equipment lists/);
  });
});
