// The Supply column: what feeds a motor or what a load is. Spellings accepted (case, hyphens),
// refusals that name row, column, allowed values and the value given, and the value kept through
// the site file, the workbook and the list import.
import { describe, expect, it } from 'vitest';
import { mergeProblems, validateSite } from '../../../src/core/site/validate.ts';
import { readSiteFile, writeSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { MOTOR_SUPPLIES, LOAD_SUPPLIES, readSupply } from '../../../src/core/kinds/index.ts';
import { readHeader } from '../../../src/io/import/headers.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD = 'tag,bus,kind,p_kw,eff,cos_phi,u_kv,supply,s_kva,uk_pct,i0_pct,p0_kw,pk_kw,to_bus';
const XFMR = 'T1,MV,transformer,,,,0.4,,1000,6,1,0.693,7.6,LV';
const motor = (tag: string, supply: string) => `${tag},LV,motor,75,0.95,0.86,0.4,${supply},,,,,,`;
const load = (tag: string, supply: string) => `${tag},LV,load,40,,0.9,0.4,${supply},,,,,,`;

function problemsOf(rows: string[]) {
  const { site, problems } = siteFromCsv([HEAD, XFMR, ...rows].join('\n'));
  return { site, problems: mergeProblems(problems, validateSite(site)) };
}

describe('reading the Supply column', () => {
  it.each([
    ['', 'direct-on-line'],
    ['DOL', 'direct-on-line'],
    ['Direct on line', 'direct-on-line'],
    ['star delta', 'star-delta'],
    ['Soft-Starter', 'soft starter'],
    ['vsd 6 pulse', 'VSD 6-pulse'],
    ['  VSD-6-Pulse ', 'VSD 6-pulse'],
    ['vsd afe', 'VSD AFE'],
  ])('a motor reads %j as %s', (typed, name) => {
    const r = readSupply(typed, MOTOR_SUPPLIES);
    expect(r.ok && r.arrangement.name).toBe(name);
  });
  it.each([
    ['', 'linear'],
    ['UPS', 'rectifier/UPS'],
    ['Rectifier/ups', 'rectifier/UPS'],
    ['Electronic-Lighting', 'electronic lighting'],
    ['single phase electronic', 'electronic lighting'],
    ['VSD 6-pulse', 'VSD 6-pulse'],
  ])('a load reads %j as %s', (typed, name) => {
    const r = readSupply(typed, LOAD_SUPPLIES);
    expect(r.ok && r.arrangement.name).toBe(name);
  });

  it('accepts the spellings on motors and loads and keeps a blank as the default', () => {
    const { problems } = problemsOf([motor('M1', ''), motor('M2', 'vsd-6-pulse'), load('L1', 'UPS')]);
    expect(problems).toEqual([]);
  });

  it('refuses another spelling, naming row, column, the allowed values and the value given', () => {
    const { problems } = problemsOf([motor('M1', 'VFD'), load('L1', 'star-delta')]);
    expect(problems.filter((p) => p.severity === 'error').map((p) => [p.row, p.column, p.message])).toEqual([
      [
        3,
        'supply',
        'row 3, column supply: supply of a motor must be one of direct-on-line (the default when blank), star-delta, soft starter, VSD 6-pulse, VSD AFE (case and hyphens do not matter); got "VFD"',
      ],
      [
        4,
        'supply',
        'row 4, column supply: supply of a load must be one of linear (the default when blank), rectifier/UPS, electronic lighting, VSD 6-pulse (case and hyphens do not matter); got "star-delta"',
      ],
    ]);
  });

  it('warns that a supply on another kind is ignored', () => {
    const rows = [XFMR.replace('0.4,,1000', '0.4,UPS,1000'), motor('M1', '')];
    const { site, problems } = siteFromCsv([HEAD, ...rows].join('\n'));
    const found = validateSite(site).filter((p) => p.column === 'supply');
    expect(problems).toEqual([]);
    expect(found.map((p) => [p.severity, p.row])).toEqual([['warning', 2]]);
    expect(found[0]?.message).toMatch(/ignored for a transformer \(got "UPS"\)/);
  });

  it('is kept as typed by the site file and the workbook', () => {
    const { site } = problemsOf([motor('M1', 'VSD-6-pulse'), load('L1', 'electronic lighting')]);
    const again = readSiteFile(writeSiteFile(site)).site;
    expect(again.equipment.map((r) => r.supply)).toEqual([undefined, 'VSD-6-pulse', 'electronic lighting']);
    const book = siteFromWorkbook(buildWorkbook(site, { flavour: 'portable' })).site;
    const byTag = new Map(book.equipment.map((r) => [r.tag, r.supply]));
    expect([byTag.get('T1'), byTag.get('M1'), byTag.get('L1')]).toEqual([
      undefined,
      'VSD-6-pulse',
      'electronic lighting',
    ]);
  });

  it('a transformer row keeps a supply in its "Other values" cell, so nothing typed is lost', () => {
    const { site } = siteFromCsv([HEAD, XFMR.replace('0.4,,1000', '0.4,UPS,1000')].join('\n'));
    const book = siteFromWorkbook(buildWorkbook(site, { flavour: 'portable' })).site;
    expect(book.equipment.find((r) => r.tag === 'T1')?.supply).toBe('UPS');
  });

  it.each(['Starter type', 'Supply', 'Starting method', 'Drive', 'Fed by'])(
    'the list import reads the header %j as supply',
    (h) => {
      expect(readHeader(h).target).toBe('supply');
    },
  );
});
