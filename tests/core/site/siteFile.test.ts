// The site file: templates read cleanly, write back byte for byte (diff-friendly, one row per
// line), and bad files get messages that say what and where.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { jsonErrorOffset, lineAndCharacter } from '../../../src/core/site/jsonWhere.ts';
import { readSiteFile, writeSiteFile } from '../../../src/core/site/siteFile.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { rollUpAll } from '../../../src/core/site/rollup.ts';
import { designCompensation } from '../../../src/core/site/compensation.ts';

const TEMPLATES = ['cold-store.json', 'pumping-station.json', 'solar-collector.json'];
const text = (name: string) => readFileSync(new URL(`../../../templates/${name}`, import.meta.url), 'utf8');

const file = (settings: object, equipment: unknown[]) =>
  JSON.stringify({
    format: 'kvar-ledger-site',
    version: 1,
    settings: {
      name: 'x',
      hz: 50,
      cases: ['a', 'b'],
      requirement: { kind: 'cosphi', target: 0.95 },
      ...settings,
    },
    equipment,
  });

describe('templates', () => {
  for (const name of TEMPLATES) {
    it(`${name}: valid, two or more cases, written back unchanged, one equipment row per line`, () => {
      const t = text(name);
      const { site, problems, banks } = readSiteFile(t);
      expect(problems).toEqual([]);
      expect(validateSite(site)).toEqual([]);
      expect(site.settings.cases.length).toBeGreaterThanOrEqual(2);
      expect(writeSiteFile(site, banks)).toBe(t);
      const rowLines = t.split('\n').filter((l) => l.trimStart().startsWith('{"tag"'));
      expect(rowLines).toHaveLength(site.equipment.length);
      expect(site.settings.notes?.some((n) => /licensed engineer/.test(n))).toBe(true);
    });
  }
  it('each template tells its story', () => {
    const [cold, pump, solar] = TEMPLATES.map((n) => readSiteFile(text(n)).site);
    // Cold store: 11 kV supply, two unit transformers.
    expect(cold?.equipment.filter((r) => r.kind === 'transformer')).toHaveLength(2);
    expect(cold?.equipment.find((r) => r.kind === 'cable')?.values.u_kv).toBe(11);
    // Pumping station: MV motors and an installed detuned bank.
    expect(pump?.equipment.some((r) => r.kind === 'motor' && (r.values.u_kv ?? 0) > 1)).toBe(true);
    expect(pump?.equipment.some((r) => r.kind === 'capacitor' && (r.values.p_pct ?? 0) > 0)).toBe(true);
    // Solar collector: leading at the connection at night because of the feeders' charging, so a reactor.
    const night = rollUpAll(solar as NonNullable<typeof solar>).find((b) => b.case === 'night');
    expect(night?.root.sense).toBe('leading');
    expect(designCompensation(solar as NonNullable<typeof solar>).reactors).toHaveLength(1);
  });
});

describe('readSiteFile messages', () => {
  it('invalid JSON, with line and character', () => {
    const { problems } = readSiteFile('{\n  "format": "kvar-ledger-site",\n  "version": 1,,\n}');
    expect(problems).toHaveLength(1);
    expect(problems[0]?.message).toMatch(/^the site file is not valid JSON at line 3, character 16: /);
  });
  it('not a site file, or another version', () => {
    expect(readSiteFile('{"a":1}').problems[0]?.message).toBe(
      'not a site file: expected "format": "kvar-ledger-site" at the top level',
    );
    expect(readSiteFile('{"format":"kvar-ledger-site","version":7}').problems[0]?.message).toBe(
      'site file version 7 is not supported; this program reads version 1',
    );
  });
  it('settings with their key in the message', () => {
    const { problems } = readSiteFile(
      file({ hz: 55, cases: [], requirement: { kind: 'pf' }, sscMva: -3 }, [
        { tag: 'L', bus: 'B', kind: 'load', p_kw: 1, cos_phi: 1 },
      ]),
    );
    expect(problems.map((p) => p.message)).toEqual([
      'column settings.hz: settings.hz must be 50 or 60; got 55',
      'column settings.cases: settings.cases must be a list of case names, the first being the default case; got []',
      'column settings.requirement: settings.requirement kind must be "cosphi" or "tanphi"; got "pf"',
      'column settings.sscMva: settings.sscMva must be a number > 0 (MVA); got -3',
    ]);
  });
  it('equipment rows: row numbers count the rows of the list; bad values and unknown keys', () => {
    const { site, problems } = readSiteFile(
      file({}, [
        { tag: 'L1', bus: 'B', kind: 'load', p_kw: 10, cos_phi: 0.9, 'load:b': 0.5 },
        { tag: 'L2', bus: 'B', kind: 'load', p_kw: 'lots', cos_phi: 0.9 },
        { tag: 'L3', bus: 'B', kind: 'load', p_kw: [1], cos_phi: 0.9, colour: 'red', 'load:c': 1 },
        'not a row',
      ]),
    );
    expect(problems.map((p) => p.message)).toEqual([
      'row 4: an equipment row must be an object like {"tag":"M1","bus":"LV1","kind":"motor",...}; got "not a row"',
      'row 3, column p_kw: must be a number or text; got [1]',
      'column colour: unknown column "colour" is ignored',
      'column load:c: case "c" is not among the site\'s cases (a, b); column ignored',
      'row 2, column p_kw: must be a number; got "lots"',
    ]);
    expect(site.equipment.map((r) => [r.row, r.tag])).toEqual([
      [1, 'L1'],
      [2, 'L2'],
      [3, 'L3'],
    ]);
    expect(site.equipment[0]?.loads).toEqual({ b: 0.5 });
  });
  it('writes loads in case order and round-trips a site', () => {
    const { site } = readSiteFile(
      file({}, [
        { tag: 'M', bus: 'B', kind: 'motor', 'load:b': 0, p_kw: 5, eff: 0.9, cos_phi: 0.8, 'load:a': 1 },
      ]),
    );
    const out = writeSiteFile(site);
    expect(out).toContain(
      '{"tag":"M","bus":"B","kind":"motor","p_kw":5,"eff":0.9,"cos_phi":0.8,"load:a":1,"load:b":0}',
    );
    expect(readSiteFile(out).site).toEqual(site);
  });
});

describe('jsonErrorOffset', () => {
  const parses = (t: string) => {
    try {
      JSON.parse(t);
      return true;
    } catch {
      return false;
    }
  };
  it('agrees with JSON.parse on valid and broken texts (property)', () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.nat(), fc.constantFrom('', ',', '}', '"', 'x', ' '), (v, cut, junk) => {
        const good = JSON.stringify(v, null, cut % 3);
        expect(jsonErrorOffset(good)).toBeUndefined();
        const bad = good.slice(0, cut % (good.length + 1)) + junk;
        expect(jsonErrorOffset(bad) === undefined).toBe(parses(bad));
      }),
    );
  });
  it('points at the offending character', () => {
    expect(lineAndCharacter('{\n "a": 1,\n}', jsonErrorOffset('{\n "a": 1,\n}') as number)).toBe(
      'line 3, character 1',
    );
    expect(jsonErrorOffset('{"format": kvar}')).toBe(11);
  });
});
