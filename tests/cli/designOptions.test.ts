// `kvar-ledger balance` with the design's own choices: detuning per bus, the buses that may get a
// bank, the reactor's bus, a significant 3rd harmonic. Each reaches the proposed banks, and a bus
// that is not on the site is refused naming the option and the buses there.
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/balance.ts';

const COLD = join(fileURLToPath(new URL('../../', import.meta.url)), 'templates/cold-store.json');

async function balance(...argv: string[]) {
  let out = '';
  let err = '';
  const code = await run(argv, { out: (t) => void (out += t), err: (t) => void (err += t) });
  return { code, out, err };
}

type Bank = { bus: string; p_pct?: number; u_rated_kv?: number };
const banksOf = (out: string) => (JSON.parse(out) as { compensation: { banks: Bank[] } }).compensation.banks;

describe('balance: design choices', () => {
  it('the template as shipped: its own banks, LV-REF at 7 % (drives), LV-SVC at 14 % (electronic load)', async () => {
    const r = await balance(COLD, '--json');
    expect(banksOf(r.out).map((b) => [b.bus, b.p_pct])).toEqual([
      ['LV-REF', 7],
      ['LV-SVC', 14],
    ]);
  });

  it('--detune per bus: plain on one, 14 % on the other, with capacitors rated for it', async () => {
    const r = await balance(COLD, '--json', '--detune', 'LV-SVC=0', '--detune', 'LV-REF=14');
    expect(r.code).toBe(0);
    const banks = banksOf(r.out);
    expect(banks.find((b) => b.bus === 'LV-SVC')?.p_pct).toBeUndefined();
    const ref = banks.find((b) => b.bus === 'LV-REF');
    expect(ref?.p_pct).toBe(14);
    // 400 V behind 14 %: 400/0.86 = 465.1 V; × 1.1 = 511.6 V → 525 V units (makers' IEC range).
    expect(ref?.u_rated_kv).toBe(0.525);
  });

  it('--third-harmonic: where a bank must be detuned, 14 %', async () => {
    const r = await balance(COLD, '--json', '--third-harmonic');
    expect(banksOf(r.out).map((b) => b.p_pct)).toEqual([14, 14]);
  });

  it('--bank-bus: banks only where allowed', async () => {
    const r = await balance(COLD, '--json', '--bank-bus', 'LV-REF');
    expect(banksOf(r.out).map((b) => b.bus)).toEqual(['LV-REF']);
  });

  it('a bus not on the site, or a detuning not offered, is a wrong command line (exit 2)', async () => {
    const a = await balance(COLD, '--bank-bus', 'LV-X');
    expect(a.code).toBe(2);
    expect(a.err).toContain('--bank-bus: bus "LV-X" is not on the site; its buses are');
    const b = await balance(COLD, '--detune', 'LV-REF=6');
    expect(b.code).toBe(2);
    expect(b.err).toContain(
      '--detune must be written BUS=P with P one of 0, 5.67, 7, 14 (%); got "LV-REF=6"',
    );
  });
});
