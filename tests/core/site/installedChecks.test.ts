// Output of the capacitors already in the list. Rated output scales with the square of the
// voltage for a fixed capacitance (IEC 60831-1 defines rated output from rated capacitance,
// frequency and voltage: Q = 2πf·C·U²); the expected values are recomputed that way here.
import { describe, expect, it } from 'vitest';
import { installedCapacitorKvar } from '../../../src/core/site/installedChecks.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,qty,running,u_kv,q_kvar,u_rated_kv,p_pct';

function capacitor(row: string) {
  const { site, problems } = siteFromCsv(`${HEAD}\n${row}`);
  expect(problems).toEqual([]);
  return { site, row: site.equipment[0] as (typeof site.equipment)[number] };
}

describe('installedCapacitorKvar', () => {
  it('two running 50 kvar / 440 V units at 400 V: 2·ωC·U² with C from the nameplate', () => {
    const { row } = capacitor('C1,LV,capacitor,2,2,0.4,50,0.44,');
    const c = 50e3 / (2 * Math.PI * 50 * 440 ** 2); // farad per unit, from the nameplate at 50 Hz
    const expected = (2 * (2 * Math.PI * 50 * c * 400 ** 2)) / 1e3;
    expect(installedCapacitorKvar(row, 50)).toBeCloseTo(expected, 9);
  });

  it('a row the catalogue refuses (detuned at p = 100 %) delivers nothing, and validation reports it', () => {
    const { site, row } = capacitor('C1,LV,capacitor,1,1,0.4,50,0.44,100');
    expect(installedCapacitorKvar(row, 50)).toBe(0);
    const problems = validateSite(site).filter((p) => p.severity === 'error');
    expect(problems.map((p) => [p.row, p.column])).toEqual([[2, 'p_pct']]);
    expect(problems[0]?.message).toMatch(/must be in \[0, 100\); got 100/);
  });

  it('a row without nameplate kvar or rated voltage delivers nothing', () => {
    expect(installedCapacitorKvar(capacitor('C1,LV,capacitor,1,1,0.4,,0.44,').row, 50)).toBe(0);
  });
});
