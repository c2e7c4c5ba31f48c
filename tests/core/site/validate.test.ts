// Every validation rule of src/core/site/validate.ts, each message with its row and column.
import { describe, expect, it } from 'vitest';
import { mergeProblems, validateSite } from '../../../src/core/site/validate.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD =
  'tag,bus,kind,qty,running,p_kw,eff,cos_phi,load,load:night,s_kva,uk_pct,i0_pct,p0_kw,pk_kw,to_bus,u_kv,q_kvar,u_rated_kv';
const XFMR = 'T1,MV,transformer,,,,,,,,1000,6,1,0.693,7.6,LV,0.4,,';
const MOTOR = 'M1,LV,motor,,,75,0.95,0.86,0.8,,,,,,,,0.4,,';

function check(rows: string[]) {
  const { site, problems } = siteFromCsv([HEAD, ...rows].join('\n'));
  return mergeProblems(problems, validateSite(site));
}
const errorsOf = (rows: string[]) => check(rows).filter((p) => p.severity === 'error');

describe('validateSite', () => {
  it('accepts a correct site', () => {
    expect(check([XFMR, MOTOR])).toEqual([]);
  });
  it('refuses names spreadsheet files cannot carry, naming the row, column and character', () => {
    const errors = errorsOf([XFMR, MOTOR.replace('M1', 'M\u00071').replace(',LV,', ',L\uD800V,')]);
    expect(errors.map((p) => [p.row, p.column])).toContainEqual([3, 'tag']);
    expect(errors.find((p) => p.column === 'tag')?.message).toBe(
      'row 3, column tag: tag contains the character U+0007 (a control or unpaired character), which spreadsheet files cannot carry; remove it',
    );
    expect(errors.find((p) => p.column === 'bus')?.message).toMatch(/bus contains the character U\+D800/);
    const { site } = siteFromCsv([HEAD, XFMR, MOTOR].join('\n'));
    const named = {
      ...site,
      settings: { ...site.settings, name: 'Plant\uFFFF', cases: ['normal', 'ni\u0000ght'] },
    };
    expect(validateSite(named).map((p) => p.message)).toEqual([
      'settings: the site name contains the character U+FFFF (a control or unpaired character), which spreadsheet files cannot carry; remove it',
      'settings: case name "ni\\u0000ght" contains the character U+0000 (a control or unpaired character), which spreadsheet files cannot carry; remove it',
    ]);
  });
  it('missing tag: row and column tag', () => {
    expect(errorsOf([XFMR, MOTOR.replace('M1', '')])).toEqual([
      {
        severity: 'error',
        row: 3,
        column: 'tag',
        message: 'row 3, column tag: tag is blank; every item needs a unique tag',
      },
    ]);
  });
  it('missing bus: row and column bus', () => {
    expect(errorsOf([XFMR, MOTOR.replace(',LV,', ',,')])).toEqual([
      {
        severity: 'error',
        row: 3,
        column: 'bus',
        tag: 'M1',
        message: 'row 3, column bus: bus is blank; every item must say which bus it is connected to',
      },
    ]);
  });
  it('duplicate tag: names both rows', () => {
    expect(errorsOf([XFMR, MOTOR, MOTOR])).toEqual([
      {
        severity: 'error',
        row: 4,
        column: 'tag',
        tag: 'M1',
        message: 'row 4, column tag: tag "M1" is already used in row 3; tags must be unique',
      },
    ]);
  });
  it('unknown kind (reported by the table reader)', () => {
    expect(errorsOf([XFMR, MOTOR.replace('motor', 'pump')]).map((p) => p.message)).toEqual([
      'row 3, column kind: kind must be one of motor, load, generator, transformer, line, cable, feeder, capacitor, reactor; got "pump"',
    ]);
  });
  it('unknown kind in a site built by a program', () => {
    const { site } = siteFromCsv([HEAD, XFMR, MOTOR].join('\n'));
    const bad = {
      ...site,
      equipment: [
        ...site.equipment,
        {
          ...(site.equipment[1] as (typeof site.equipment)[number]),
          row: 9,
          tag: 'Z',
          kind: 'heater' as never,
        },
      ],
    };
    expect(validateSite(bad).map((p) => p.message)).toContain(
      'row 9, column kind: kind must be one of motor, load, generator, transformer, line, cable, feeder, capacitor, reactor; got "heater"',
    );
  });
  it("a value outside the catalogue function domain, in the catalogue's words", () => {
    expect(errorsOf([XFMR, MOTOR.replace('0.86', '1.3')])).toEqual([
      {
        severity: 'error',
        row: 3,
        column: 'cos_phi',
        tag: 'M1',
        message: 'row 3, column cos_phi: KVAR.MOTOR: argument 3 (cos_phi) must be in (0, 1]; got 1.3',
      },
    ]);
    expect(errorsOf([XFMR.replace(',1,0.693', ',0,0.693'), MOTOR]).map((p) => p.message)).toEqual([
      'row 2, column i0_pct: KVAR.XFMR.MAG: argument 2 (i0_pct) must be in (0, 100); got 0',
    ]);
  });
  it('a load factor out of range names the case column', () => {
    expect(errorsOf([XFMR, MOTOR.replace('0.8,,', '0.8,2,')])).toEqual([
      {
        severity: 'error',
        row: 3,
        column: 'load:night',
        tag: 'M1',
        message: 'row 3, column load:night: load factor of a motor must be in [0, 1.5]; got 2',
      },
    ]);
  });
  it('a missing required value for the kind', () => {
    expect(errorsOf([XFMR, MOTOR.replace('0.95', '')])).toEqual([
      {
        severity: 'error',
        row: 3,
        column: 'eff',
        tag: 'M1',
        message: 'row 3, column eff: eff is required for a motor and is blank',
      },
    ]);
  });
  it('a number that could not be read is reported once, not again as blank', () => {
    expect(errorsOf([XFMR, MOTOR.replace('0.95', 'high')]).map((p) => p.message)).toEqual([
      'row 3, column eff: must be a number; got "high"',
    ]);
  });
  it('a transformer whose to_bus is missing', () => {
    const p = errorsOf([XFMR.replace(',LV,', ',,'), MOTOR]);
    expect(p[0]).toEqual({
      severity: 'error',
      row: 2,
      column: 'to_bus',
      tag: 'T1',
      message: 'row 2, column to_bus: to_bus is blank; a transformer must name the bus it feeds',
    });
  });
  it('a bus fed twice names both feeders and rows', () => {
    expect(errorsOf([XFMR, XFMR.replace('T1', 'T2'), MOTOR])).toEqual([
      {
        severity: 'error',
        row: 3,
        column: 'to_bus',
        tag: 'T2',
        bus: 'LV',
        message:
          'row 3, column to_bus: bus LV is fed twice: by transformer T1 (row 2) and by transformer T2 (row 3); a bus has one feeder (for units in parallel give one row with qty)',
      },
    ]);
  });
  it('a loop of buses', () => {
    const rows = [
      XFMR,
      XFMR.replace('T1,MV', 'T2,LV').replace(',LV,0.4', ',HV,11'),
      XFMR.replace('T1,MV', 'T3,HV').replace(',LV,0.4', ',MV,11'),
      MOTOR,
    ];
    expect(errorsOf(rows).map((p) => [p.row, p.column, p.message])).toEqual([
      [
        2,
        'to_bus',
        'row 2, column to_bus: buses MV → LV → HV → MV form a loop (rows 2, 3, 4); power must flow from the point of connection down a tree',
      ],
    ]);
  });
  it('two buses fed by nothing', () => {
    expect(errorsOf([XFMR, MOTOR, MOTOR.replace('M1,LV', 'M2,LV2')]).map((p) => p.message)).toEqual([
      'row 4, column bus: buses MV (row 2), LV2 (row 4) are each fed by nothing; a site has one point of connection, so every other bus needs a transformer or line (to_bus) feeding it',
    ]);
  });
  it('running above qty, fractional qty, and a transformer with no unit in service', () => {
    expect(errorsOf([XFMR, MOTOR.replace('motor,,', 'motor,2,3')]).map((p) => p.message)).toEqual([
      'row 3, column running: running (3) must not exceed qty (2)',
    ]);
    expect(errorsOf([XFMR, MOTOR.replace('motor,,', 'motor,1.5,')]).map((p) => p.message)).toEqual([
      'row 3, column qty: qty must be a whole number ≥ 0; got 1.5',
    ]);
    expect(errorsOf([XFMR.replace('transformer,,', 'transformer,1,0'), MOTOR]).map((p) => p.message)).toEqual(
      [
        'row 2, column running: a transformer with no unit in service cannot feed bus LV; running must be ≥ 1',
      ],
    );
  });
  it('warns about to_bus on a shunt item and about voltages that disagree on a bus', () => {
    const p = check([XFMR, MOTOR.replace(',,0.4,,', ',MV,0.4,,'), 'C1,LV,capacitor,,,,,,,,,,,,,,11,50,11']);
    expect(p.filter((x) => x.severity === 'warning').map((x) => x.message)).toEqual([
      'row 3, column to_bus: to_bus is used only by transformers and lines; ignored for a motor (use kind line for a feeder)',
      'row 4, column u_kv: u_kv 11 kV differs from 0.4 kV stated for bus LV in row 3 by more than 10 %; check the voltage or the bus',
    ]);
  });
  it('settings: frequency, requirement and empty list', () => {
    const { site } = siteFromCsv([HEAD, XFMR, MOTOR].join('\n'), {
      hz: 55 as never,
      requirement: { kind: 'cosphi', target: 1.2 },
    });
    expect(validateSite(site).map((p) => p.message)).toEqual([
      'column hz: settings: frequency must be 50 or 60 Hz; got 55',
      'settings: target cos φ must be in (0, 1]; got 1.2',
    ]);
    expect(validateSite({ ...site, equipment: [] }).map((p) => p.message)).toEqual([
      'the equipment list has no rows; add at least one item',
    ]);
  });
});
