// Case names are names, not object keys: "toString", "constructor" and "__proto__" read, check,
// roll up and write back like any other name (they gave false load-factor errors before).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSiteFile, writeSiteFile } from '../../../src/core/site/siteFile.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { rollUpAll } from '../../../src/core/site/rollup.ts';
import { parseEquipmentTable } from '../../../src/core/site/parse.ts';
import { entryOf, nameTable } from '../../../src/core/text/nameTable.ts';
import { dimensionOfUnit, isKnownUnitSpelling, unitFor } from '../../../src/io/import/units.ts';

const TEMPLATES = ['cold-store', 'pumping-station', 'solar-collector'];
const template = (id: string) =>
  readFileSync(new URL(`../../../templates/${id}.json`, import.meta.url), 'utf8');

/** The template with its two cases renamed; `rename` maps text written with the old names. */
function renamed(id: string, to: readonly [string, string]) {
  const text = template(id);
  const from = readSiteFile(text).site.settings.cases as [string, string];
  const swap = (t: string) =>
    t
      .replaceAll(`"${from[0]}"`, `"${to[0]}"`)
      .replaceAll(`load:${from[0]}"`, `load:${to[0]}"`)
      .replaceAll(`"${from[1]}"`, `"${to[1]}"`)
      .replaceAll(`load:${from[1]}"`, `load:${to[1]}"`);
  return { original: readSiteFile(text).site, text: swap(text), swap };
}

describe('case names that are also object property names', () => {
  for (const id of TEMPLATES) {
    for (const names of [
      ['toString', '__proto__'],
      ['constructor', 'hasOwnProperty'],
    ] as const) {
      it(`${id} with cases ${names.join(' and ')}: no false errors, the same balances`, () => {
        const r = renamed(id, names);
        const { site, problems } = readSiteFile(r.text);
        expect(problems).toEqual([]);
        expect(site.settings.cases).toEqual(names);
        expect(validateSite(site)).toEqual([]);
        expect(JSON.stringify(rollUpAll(site))).toBe(r.swap(JSON.stringify(rollUpAll(r.original))));
        // Written back and read again: every load:<case> value is still there.
        const again = readSiteFile(writeSiteFile(site)).site;
        expect(again.equipment.map((e) => ({ ...e.loads }))).toEqual(
          site.equipment.map((e) => ({ ...e.loads })),
        );
      });
    }
  }

  it('a case read from a table holds only its own load factors', () => {
    const t = parseEquipmentTable([
      ['tag', 'bus', 'kind', 'p_kw', 'cos_phi', 'load:__proto__', 'load:toString'],
      ['L1', 'B', 'load', '10', '0.8', '0.5', ''],
    ]);
    const loads = t.equipment[0]?.loads ?? {};
    expect(entryOf(loads, '__proto__')).toBe(0.5);
    expect(entryOf(loads, 'toString')).toBeUndefined();
    expect(loads['toString' as string]).toBeUndefined();
    expect(Object.keys(loads)).toEqual(['__proto__']);
  });
});

describe('name tables', () => {
  it('hold "__proto__" as an entry and inherit nothing', () => {
    const t = nameTable<number>([['__proto__', 1]]);
    expect(Object.keys(t)).toEqual(['__proto__']);
    expect(t['constructor']).toBeUndefined();
    expect(JSON.parse(JSON.stringify(t))).toEqual(JSON.parse('{"__proto__":1}'));
    expect(entryOf({ a: 1 } as Record<string, number>, 'toString')).toBeUndefined();
  });
});

describe('unit spellings in imported headers', () => {
  it('a header unit that is an object property name is no unit', () => {
    for (const w of ['constructor', 'toString', '__proto__']) {
      expect(isKnownUnitSpelling(w)).toBe(false);
      expect(dimensionOfUnit(w)).toBeUndefined();
      expect(unitFor('p_kw', w)).toBeUndefined();
    }
    expect(unitFor('p_kw', 'MW')?.factor).toBe(1000);
  });
});
