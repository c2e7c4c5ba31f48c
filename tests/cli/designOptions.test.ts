// `kvar-ledger balance` with the design's own choices: detuning per bus, the buses that may get a
// bank, the reactor's bus, a significant 3rd harmonic. Each reaches the proposed banks on the
// buses a file leaves open; a bank or a detuning the file types wins on its bus, and the output
// names the option set aside. A bus that is not on the site is refused naming the option and the
// buses there.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/balance.ts';

const COLD = join(fileURLToPath(new URL('../../', import.meta.url)), 'templates/cold-store.json');
const tmp = mkdtempSync(join(tmpdir(), 'kvar-design-options-'));
/** The cold store with these bank rows instead of its own (none: every bus open). */
function coldWith(banks: readonly object[] | undefined, name: string): string {
  const file = JSON.parse(readFileSync(COLD, 'utf8')) as Record<string, unknown>;
  if (banks === undefined) delete file.banks;
  else file.banks = banks;
  const path = join(tmp, `${name}.json`);
  writeFileSync(path, JSON.stringify(file));
  return path;
}
const OPEN = coldWith(undefined, 'open');

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
    const r = await balance(OPEN, '--json', '--detune', 'LV-SVC=0', '--detune', 'LV-REF=14');
    expect(r.code).toBe(0);
    const banks = banksOf(r.out);
    expect(banks.find((b) => b.bus === 'LV-SVC')?.p_pct).toBeUndefined();
    const ref = banks.find((b) => b.bus === 'LV-REF');
    expect(ref?.p_pct).toBe(14);
    // 400 V behind 14 %: 400/0.86 = 465.1 V; × 1.1 = 511.6 V → 525 V units (makers' IEC range).
    expect(ref?.u_rated_kv).toBe(0.525);
  });

  it('--third-harmonic: where a bank must be detuned, 14 %', async () => {
    const r = await balance(OPEN, '--json', '--third-harmonic');
    expect(banksOf(r.out).map((b) => b.p_pct)).toEqual([14, 14]);
  });

  it('--bank-bus: banks only where allowed', async () => {
    const r = await balance(OPEN, '--json', '--bank-bus', 'LV-REF');
    expect(banksOf(r.out).map((b) => b.bus)).toEqual(['LV-REF']);
  });

  it('the file’s typed banks win over the options, and the output says which were set aside', async () => {
    const r = await balance(COLD, '--json', '--detune', 'LV-REF=14');
    const comp = (
      JSON.parse(r.out) as {
        compensation: { banks_from: string; options_set_aside: string[]; banks: Bank[] };
      }
    ).compensation;
    expect(comp.banks.map((b) => [b.bus, b.p_pct])).toEqual([
      ['LV-REF', 7],
      ['LV-SVC', 14],
    ]);
    expect(comp.options_set_aside).toEqual(['--detune LV-REF=14 set aside: a bank is typed on bus LV-REF']);
    const text = await balance(COLD, '--detune', 'LV-REF=14');
    expect(text.out).toContain(
      'design options set aside:\n  --detune LV-REF=14 set aside: a bank is typed on bus LV-REF\n',
    );
  });

  it('a detuning typed alone on a bus: with a design option the design proposes that bank with it', async () => {
    const file = coldWith([{ bus: 'LV-REF', p_pct: 5.67 }], 'detuning-alone');
    const r = await balance(file, '--json', '--third-harmonic');
    const comp = (
      JSON.parse(r.out) as {
        compensation: { banks_from: string; banks: Array<Bank & { chosen: string; steps?: number }> };
      }
    ).compensation;
    const ref = comp.banks.find((b) => b.bus === 'LV-REF');
    expect(ref?.p_pct).toBe(5.67);
    expect(ref?.chosen).toBe('detuning typed');
    expect(ref?.steps).toBeGreaterThan(0);
    // The open bus follows the option: 14 % where a bank must be detuned.
    expect(comp.banks.find((b) => b.bus === 'LV-SVC')).toMatchObject({ p_pct: 14, chosen: 'proposed' });
    expect(comp.banks_from).toBe('file and proposed');
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
