// Resonance includes all capacitance: cable and line charging. Hand-worked here, independently of the code:
// - charging ω·C·U² per line (IEC 60287-1-1 / any cable handbook: Q = 2πf·C·U²);
// - short-circuit power below a transformer: supply and S/uk in series (IEC 60909-0, reactances);
// - parallel resonance h = √(Ssc/Qc) (IEEE Std 1036), with a shunt reactor Qr in parallel with the
//   supply h = √((Ssc + Qr)/Qc) (lumped admittances balancing at h: h·Qc = Ssc/h + Qr/h);
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';

const SOLAR = join(import.meta.dirname, '../../../templates/solar-collector.json');

describe('the solar template at night: collector cables resonate with the grid', () => {
  const { site, banks } = readSiteFile(readFileSync(SOLAR, 'utf8'));
  const raw = JSON.parse(readFileSync(SOLAR, 'utf8')) as {
    settings: { sscMva: number };
    equipment: Array<Record<string, number | string>>;
  };
  // Every 33 kV feeder's charging, from the template's own figures (c in nF/km).
  const lines = raw.equipment.filter((r) => r.kind === 'line');
  const charging = lines.reduce(
    (s, r) => s + (2 * Math.PI * 50 * (r.c_nf_km as number) * 1e-9 * (r.len_km as number) * 33e3 ** 2) / 1e3,
    0,
  ); // 27.9 km · 250 nF/km = 6.975 µF → about 2 386 kvar
  const gt = raw.equipment.find((r) => r.tag === 'GT1') as Record<string, number>;
  const sscMv = 1 / (1 / raw.settings.sscMva + (gt.uk_pct as number) / 100 / ((gt.s_kva as number) / 1000)); // 428.6 MVA

  it('the hand calculation itself: about 2.39 Mvar of charging against 428.6 MVA, near the 13th', () => {
    expect(charging).toBeCloseTo(2386, 0);
    expect(sscMv).toBeCloseTo(428.57, 2);
    expect(Math.sqrt((sscMv * 1000) / charging)).toBeGreaterThan(13 * 0.9);
  });

  it('Checks reports it at night, with the reactor the template switches in', () => {
    const a = assessBanks(site, banks ?? []);
    const night = a.cases.find((c) => c.case === 'night');
    const reactor = night?.banks.reduce((s, b) => s + b.reactor_kvar, 0) ?? 0;
    expect(reactor).toBeGreaterThan(0);
    // The reactor is in parallel with the supply: h = √((Ssc + Qr)/Qc).
    const order = Math.sqrt((sscMv * 1000 + reactor) / charging);
    expect(Math.abs(order / 13 - 1)).toBeLessThan(0.1);
    const w = a.warnings.filter((x) => x.code === 'resonance' && x.bus === 'MV-33' && x.case === 'night');
    expect(w).toHaveLength(1);
    expect(w[0]?.message).toContain(`${charging.toFixed(1)} kvar of cable and line charging`);
    expect(w[0]?.message).toContain(`order ${order.toFixed(2)}`);
    expect(w[0]?.message).toMatch(/within 10 % of the 13th harmonic/);
    // Voltage held up by the charging: 100·Qc/Ssc (IEEE Std 1036).
    expect(w[0]?.message).toContain(`${((100 * charging) / (sscMv * 1000)).toFixed(2)} %`);
  });

  it('the design reports it too, before any bank', () => {
    const d = designCompensation(site);
    expect(
      d.warnings.some((x) => x.code === 'resonance' && x.bus === 'MV-33' && /charging/.test(x.message)),
    ).toBe(true);
  });
});
