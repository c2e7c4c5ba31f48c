// A cos φ requirement that is lagging only: the tariff bills drawn kvar alone, so a site that
// delivers kvar at light load (cable charging) needs no reactor. By hand (power triangle,
// IEC 60050-131): 100 kW and an 11 kV cable of 0.3 µF/km over 10 km delivering
// ω·C·len·U² = 2π·50·0.3e-6·10·11 000² ≈ 1 140 kvar: cos φ = 100/√(100² + 1 140²) ≈ 0.087 leading.
// Symmetric cos φ ≥ 0.95 asks for 1 140 − 100·tan(acos 0.95) ≈ 1 107 kvar inductive; lagging
// only asks for nothing.
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { kvarNeeded } from '../../../src/core/site/requirement.ts';
import { readSiteFile, writeSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { busRow, liveEngine, num, portableEngine, valueAt } from '../workbook/engineDoc.ts';
import { siteFromCsv } from './fixtures.ts';

const CSV =
  'tag,bus,kind,p_kw,cos_phi,u_kv,c_uf_km,len_km\nL1,MAIN,load,100,1,11,,\nK1,MAIN,cable,,,11,0.3,10';
const charging = (2 * Math.PI * 50 * 0.3e-6 * 10 * 11000 ** 2) / 1000;

describe('cos φ lagging only', () => {
  it('the need: none inductive when lagging only; Q − P·tan φ when symmetric', () => {
    const sym = kvarNeeded(100, -charging, { kind: 'cosphi', target: 0.95 });
    expect(sym.inductive_kvar).toBeCloseTo(charging - 100 * Math.tan(Math.acos(0.95)), 6);
    const lag = kvarNeeded(100, -charging, { kind: 'cosphi', target: 0.95, lagOnly: true });
    expect(lag).toEqual({ capacitive_kvar: 0, inductive_kvar: 0 });
    // Drawing kvar it is the same rule: 100 kW at 200 kvar → 200 − 100·tan(acos 0.95).
    const draw = kvarNeeded(100, 200, { kind: 'cosphi', target: 0.95, lagOnly: true });
    expect(draw.capacitive_kvar).toBeCloseTo(200 - 100 * Math.tan(Math.acos(0.95)), 6);
  });

  it('the design adds a reactor only for the symmetric requirement', () => {
    const sym = siteFromCsv(CSV, { requirement: { kind: 'cosphi', target: 0.95 } }).site;
    const lag = siteFromCsv(CSV, { requirement: { kind: 'cosphi', target: 0.95, lagOnly: true } }).site;
    expect(designCompensation(sym).reactors.length).toBe(1);
    expect(designCompensation(lag).reactors).toEqual([]);
    // …and finds it within the requirement before and after, in Checks' rule too.
    expect(designCompensation(lag).cases.every((c) => c.met_before && c.met_after)).toBe(true);
    expect(assessBanks(lag, []).warnings.filter((w) => w.code === 'requirement-not-met')).toEqual([]);
    expect(assessBanks(sym, []).warnings.some((w) => w.code === 'requirement-not-met')).toBe(true);
  });

  it('survives the site file and the Site sheet', () => {
    const site = siteFromCsv(CSV, { requirement: { kind: 'cosphi', target: 0.95, lagOnly: true } }).site;
    const back = readSiteFile(writeSiteFile(site, []));
    expect(back.site.settings.requirement).toEqual({ kind: 'cosphi', target: 0.95, lagOnly: true });
    const fromSheet = siteFromWorkbook(buildWorkbook(site, { flavour: 'live' })).site;
    expect(fromSheet.settings.requirement).toEqual({ kind: 'cosphi', target: 0.95, lagOnly: true });
  });

  it('the Compensation sheet asks for no inductive kvar and finds the site within, live and portable', () => {
    for (const [lagOnly, need, within] of [
      [true, 0, 'yes'],
      [false, charging - 100 * Math.tan(Math.acos(0.95)), 'no'],
    ] as const) {
      const req = { kind: 'cosphi' as const, target: 0.95, ...(lagOnly ? { lagOnly } : {}) };
      const site = siteFromCsv(CSV, { requirement: req }).site;
      for (const flavour of ['live', 'portable'] as const) {
        const doc = buildWorkbook(site, { flavour, banks: [] });
        const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
        const r = busRow(doc, 'MAIN', 'Compensation');
        expect(num(valueAt(hf, doc, 'Compensation', r, 'Inductive need normal (kvar)'))).toBeCloseTo(need, 6);
        expect(valueAt(hf, doc, 'Compensation', r, 'Within requirement normal')).toEqual({
          ok: true,
          value: within,
        });
      }
    }
  });
});
