// A motor fed by a drive draws the drive's displacement factor from the supply, not its own
// nameplate cos φ: one expression for the roll-up, the live workbook and the export.
// Hand-worked: P = P_out·x/η (KW.MOTOR's definition, IEC 60034-2-1: efficiency = output/input),
// Q = P·tan(acos(DPF)) (power triangle), DPF 0.96 for a 6-pulse drive (common practice, from
// memory: 0.95–0.98), 1 for an active front end at its default set point (common practice).
import { describe, expect, it } from 'vitest';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { SIX_PULSE_DISPLACEMENT } from '../../../src/core/kinds/index.ts';
import { busRow, liveEngine, num, portableEngine, sheet, valueAt } from '../workbook/engineDoc.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD =
  'tag,bus,kind,to_bus,qty,running,p_kw,eff,cos_phi,load,u_kv,supply,s_kva,uk_pct,i0_pct,p0_kw,pk_kw';
// Two invented 630 kVA transformers feed the buses from MV.
const XFMRS = [
  'T1,MV,transformer,PUMPS,,,,,,,0.4,,630,6,1,0.6,6.5',
  'T2,MV,transformer,DOL,,,,,,,0.4,,630,6,1,0.6,6.5',
];
// Invented: three 55 kW pumps on a 6-pulse drive each (two running at 80 %), one on an active
// front end at full load, and a direct-on-line pump for contrast on its own bus.
const ROWS = [
  ...XFMRS,
  'PD,PUMPS,motor,,3,2,55,0.94,0.85,0.8,0.4,VSD 6-pulse,,,,,',
  'PA,PUMPS,motor,,1,1,55,0.94,0.85,1,0.4,vsd-afe,,,,,',
  'PL,DOL,motor,,1,1,55,0.94,0.85,0.8,0.4,,,,,,',
];

/** tan(acos(c)) by Pythagoras: sin = √(1 − c²), tan = sin/c. */
const tanOf = (c: number) => Math.sqrt(1 - c * c) / c;

describe('a bus of drive-fed pumps', () => {
  const { site, problems } = siteFromCsv([HEAD, ...ROWS].join('\n'));
  it('is valid', () => {
    expect([...problems, ...validateSite(site)].filter((p) => p.severity === 'error')).toEqual([]);
  });

  it('still refuses a nameplate cos φ no motor has, though the drive hides it from the supply', () => {
    const rows = ROWS.map((r) => (r.startsWith('PD,') ? r.replace(',0.85,0.8,', ',1.4,0.8,') : r));
    const bad = siteFromCsv([HEAD, ...rows].join('\n')).site;
    const errors = validateSite(bad).filter((p) => p.severity === 'error');
    expect(errors).toEqual([
      expect.objectContaining({
        column: 'cos_phi',
        message: expect.stringMatching(/must be in \(0, 1\]; got 1\.4/),
      }),
    ]);
  });

  // By hand: 6-pulse pumps: P = 2 · 55 · 0.8 / 0.94 = 93.617 kW; Q = P · tan(acos 0.96) = 27.305 kvar.
  // AFE pump: P = 55 / 0.94 = 58.511 kW; Q = 0.
  const p6 = (2 * 55 * 0.8) / 0.94;
  const pAfe = 55 / 0.94;
  const handP = p6 + pAfe;
  const handQ = p6 * tanOf(0.96);

  it('rolls up P from the nameplate and efficiency, Q from the drive displacement factor', () => {
    expect(SIX_PULSE_DISPLACEMENT).toBe(0.96);
    expect(handQ).toBeCloseTo(27.305, 3);
    const bus = rollUp(site, 'normal').buses.find((b) => b.bus === 'PUMPS');
    expect(bus?.p_kw).toBeCloseTo(handP, 9);
    expect(bus?.q_kvar).toBeCloseTo(handQ, 9);
    expect(bus?.cos_phi).toBeCloseTo(handP / Math.hypot(handP, handQ), 9);
  });

  it('the same motor direct-on-line keeps its own cos φ (more kvar than behind the drive)', () => {
    const dol = rollUp(site, 'normal').buses.find((b) => b.bus === 'DOL');
    // KVAR.MOTOR at 80 % with Q0 = 0.7·Qr: Q = Qr·(0.7 + 0.3·0.8²), Qr = 55/0.94·tan(acos 0.85).
    const qr = (55 / 0.94) * tanOf(0.85);
    expect(dol?.q_kvar).toBeCloseTo(qr * (0.7 + 0.3 * 0.64), 9);
    expect(dol?.q_kvar ?? 0).toBeGreaterThan(handQ / 2);
  });

  it.each(['live', 'portable'] as const)('the %s workbook computes the same Q', (flavour) => {
    const doc = buildWorkbook(site, { flavour, banks: [] });
    const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
    const q = num(valueAt(hf, doc, 'Buses', busRow(doc, 'PUMPS'), 'Q normal (kvar)'));
    expect(q).toBeCloseTo(handQ, 9);
    const motors = sheet(doc, 'Motors');
    const qCol = motors.cells[0]?.indexOf('Q normal (kvar)') ?? -1;
    const formula = String(motors.cells[motors.cells.findIndex((r) => r[0] === 'PD')]?.[qCol]);
    // The choice is on the Supply cell, printed readably.
    expect(formula).toMatch(/IF\(LOWER\(TRIM\(SUBSTITUTE\([A-Z]+2,"-"," "\)\)\)="vsd 6 pulse",KVAR\.LOAD\(/);
    hf.destroy();
  });

  it('editing the Supply cell in the live workbook changes the bus at once', () => {
    const doc = buildWorkbook(site, { flavour: 'live', banks: [] });
    const hf = liveEngine(doc);
    const motors = sheet(doc, 'Motors');
    const supplyCol = motors.cells[0]?.indexOf('Supply') ?? -1;
    const row = motors.cells.findIndex((r) => r[0] === 'PL');
    hf.setCellContents({ sheet: hf.getSheetId('Motors') as number, row, col: supplyCol }, 'Vsd 6 Pulse');
    const q = num(valueAt(hf, doc, 'Buses', busRow(doc, 'DOL'), 'Q normal (kvar)'));
    expect(q).toBeCloseTo(((55 * 0.8) / 0.94) * tanOf(0.96), 9);
    hf.destroy();
  });
});

describe('a drive-fed motor alone on its bus', () => {
  // Invented: a 90 kW fan on a 6-pulse drive, alone below its own transformer, target cos φ 1.
  const { site } = siteFromCsv(
    [
      HEAD,
      'T1,MV,transformer,LVM,,,,,,,0.4,,630,4,1,0.6,6.5',
      'F1,LVM,motor,,1,1,90,0.94,0.85,1,0.4,VSD 6-pulse,,,,,',
    ].join('\n'),
    { requirement: { kind: 'cosphi', target: 1 }, sscMva: 250 },
  );
  it('gets an ordinary bank: no capacitor at its terminals, no self-excitation limit', () => {
    const bank = designCompensation(site).banks.find((b) => b.bus === 'LVM');
    expect(bank).toBeDefined();
    expect(bank?.switching).not.toBe('switched with the motor');
    expect(bank?.self_excitation_limit_kvar).toBeUndefined();
    expect(bank?.why).not.toMatch(/individual compensation/);
    // The same fan direct-on-line is compensated at its terminals, switched with it.
    const dol = { ...site, equipment: site.equipment.map(({ supply: _s, ...r }) => r) };
    expect(designCompensation(dol).banks.find((b) => b.bus === 'LVM')?.switching).toBe(
      'switched with the motor',
    );
  });
});
