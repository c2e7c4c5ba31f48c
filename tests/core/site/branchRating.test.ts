// A line's or feeder cable's rated current gives its loading, S/(√3·U·I_rated), and the overload
// warning covers it like a transformer's. By hand (I = S/(√3·U), written out here): 8 MVA at
// 20 kV is 230.9 A, so a line rated 200 A carries 115.5 %; 250 kW at cos φ 0.85 and 400 V draw
// 294.1 kVA, 424.5 A, so a cable rated 400 A carries 106.1 % and one rated 500 A 84.9 %.
import { describe, expect, it } from 'vitest';
import { assessBanks } from '../../../src/core/site/assessBanks.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { liveEngine, portableEngine, sheet, valueAt } from '../workbook/engineDoc.ts';
import { siteFromCsv } from './fixtures.ts';

const HEAD =
  'tag,bus,kind,to_bus,u_kv,r_ohm_km,x_ohm_km,l_mh_km,c_nf_km,len_km,i_rated_a,p_kw,cos_phi,load:night';
const settings = { cases: ['day', 'night'], sscMva: 250 };
const amps = (sKva: number, uKv: number) => sKva / (Math.sqrt(3) * uKv);

const lineSite = (rated: string) =>
  siteFromCsv(
    [HEAD, `L1,MV,line,B2,20,0.12,,1.2,10,5,${rated},,,`, 'X1,B2,load,,20,,,,,,,6400,0.8,0.5'].join('\n'),
    settings,
  ).site;
const feederSite = (rated: string) =>
  siteFromCsv(
    [HEAD, `F1,LV,feeder,DB1,0.4,0.0991,0.08,,,0.2,${rated},,,`, 'P1,DB1,load,,0.4,,,,,,,250,0.85,0.5'].join(
      '\n',
    ),
    settings,
  ).site;

const overloads = (site: ReturnType<typeof lineSite>) =>
  assessBanks(site, []).warnings.filter((w) => w.code === 'overload');

describe('a line rated 200 A carrying 8 MVA at 20 kV', () => {
  const site = lineSite('200');
  it('validates, and its loading is 230.9/200 = 115.5 % in the day case, half that at night', () => {
    expect(validateSite(site)).toEqual([]);
    expect(amps(8000, 20)).toBeCloseTo(230.94, 2);
    const day = rollUp(site, 'day').elements.find((e) => e.tag === 'L1');
    expect(day?.loading_pct).toBeCloseTo((100 * amps(8000, 20)) / 200, 9);
    const night = rollUp(site, 'night').elements.find((e) => e.tag === 'L1');
    expect(night?.loading_pct).toBeCloseTo((100 * amps(4000, 20)) / 200, 9);
  });

  it('is reported overloaded in the day case only, with the figure', () => {
    const w = overloads(site);
    expect(w.map((x) => [x.case, x.tag])).toEqual([['day', 'L1']]);
    expect(w[0]?.message).toContain(
      `line L1 carries ${((100 * amps(8000, 20)) / 200).toFixed(1)} % of its rating`,
    );
  });
});

describe('a 400 V feeder cable to a 250 kW board at cos φ 0.85', () => {
  it('rated 400 A: 106.1 % by day, overloaded; rated 500 A: 84.9 %, nothing', () => {
    const s = 250 / 0.85;
    expect(amps(s, 0.4)).toBeCloseTo(424.5, 1);
    // The cable carries the board alone (its own losses count upstream, at its sending end).
    const f1 = rollUp(feederSite('400'), 'day').elements.find((e) => e.tag === 'F1');
    expect(f1?.loading_pct).toBeCloseTo((100 * amps(s, 0.4)) / 400, 9);
    expect(overloads(feederSite('400')).map((x) => [x.case, x.tag])).toEqual([['day', 'F1']]);
    expect(overloads(feederSite('500'))).toEqual([]);
  });

  it('no rating: no loading and no warning', () => {
    const f1 = rollUp(feederSite(''), 'day').elements.find((e) => e.tag === 'F1');
    expect(f1?.loading_pct).toBeUndefined();
    expect(overloads(feederSite(''))).toEqual([]);
  });
});

describe('the workbook shows the same loading', () => {
  for (const flavour of ['live', 'portable'] as const)
    it(`${flavour}: Loading day on the Lines and Feeders sheets; blank without a rating`, () => {
      for (const [site, name, tag] of [
        [lineSite('200'), 'Lines', 'L1'],
        [feederSite('400'), 'Feeders', 'F1'],
      ] as const) {
        const doc = buildWorkbook(site, { flavour, banks: [] });
        const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
        const at = sheet(doc, name).cells.findIndex((row) => row[0] === tag);
        const want = rollUp(site, 'day').elements.find((e) => e.tag === tag)?.loading_pct as number;
        expect(valueAt(hf, doc, name, at, 'Loading day (%)')).toEqual({
          ok: true,
          value: expect.closeTo(want, 9),
        });
      }
      const doc = buildWorkbook(feederSite(''), { flavour, banks: [] });
      const hf = flavour === 'live' ? liveEngine(doc) : portableEngine(doc);
      const at = sheet(doc, 'Feeders').cells.findIndex((row) => row[0] === 'F1');
      expect(valueAt(hf, doc, 'Feeders', at, 'Loading day (%)')).toEqual({ ok: true, value: '' });
    });
});
