// Accepting an import: a new workbook document, the open one untouched; refusals say why.
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { readSiteFile } from '../../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../../src/core/workbook/document.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import {
  applyImport,
  previewImport,
  proposeMapping,
  tableFromCsvText,
} from '../../../src/io/import/index.ts';

function deepFreeze<T>(x: T): T {
  if (x && typeof x === 'object') {
    Object.values(x).forEach(deepFreeze);
    Object.freeze(x);
  }
  return x;
}

let current: WorkbookDoc;
let before: string;
beforeAll(() => {
  const { site } = readSiteFile(readFileSync('templates/cold-store.json', 'utf8'));
  current = deepFreeze(buildWorkbook(site, { flavour: 'live' }));
  before = JSON.stringify(current);
});

function preview(csv: string) {
  const t = tableFromCsvText('client.csv', csv);
  if (!t.ok) throw new Error(t.problem.message);
  return previewImport(proposeMapping(t.value), { settings: siteFromWorkbook(current).site.settings });
}

const EXTRA =
  'Item,Fed from,Type,Motor kW,Eff %,PF,Load factor (summer-day),Load factor (winter-night)\nFAN-9,LV-SVC,motor,11,92,0.84,1,0.5\nPMP-9,LV-SVC,motor,15,93,0.85,0.8,0\n';

describe('applyImport', () => {
  it('appends the list to the open site and rebuilds the workbook, leaving the open one untouched', () => {
    const r = applyImport(current, preview(EXTRA), { mode: 'append' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.added).toBe(2);
    const tags = r.site.equipment.map((e) => e.tag);
    expect(tags.slice(-2)).toEqual(['FAN-9', 'PMP-9']);
    expect(tags.length).toBe(siteFromWorkbook(current).site.equipment.length + 2);
    const fan = r.site.equipment.find((e) => e.tag === 'FAN-9')!;
    expect(fan.values).toMatchObject({ p_kw: 11, eff: 0.92, cos_phi: 0.84 });
    expect(fan.loads).toEqual({ 'summer-day': 1, 'winter-night': 0.5 });
    expect(
      siteFromWorkbook(r.doc)
        .site.equipment.map((e) => e.tag)
        .sort(),
    ).toEqual([...tags].sort());
    expect(r.doc.title).toBe(current.title);
    expect(JSON.stringify(current)).toBe(before);
  });

  it('refuses tags already in the workbook when appending', () => {
    const r = applyImport(current, preview('tag,bus,kind,p_kw,cos_phi\nLED,LV-SVC,load,5,0.9\n'), {
      mode: 'append',
    });
    expect(r).toMatchObject({
      ok: false,
      message: expect.stringMatching(/row 2, column tag: tag "LED" is already used in the workbook/),
    });
  });

  it('refuses rows with errors unless the user leaves them out', () => {
    const p = preview(EXTRA + 'BAD-1,LV-SVC,motor,x,93,0.85,1,1\n');
    const refused = applyImport(current, p, { mode: 'append' });
    expect(refused).toMatchObject({
      ok: false,
      message: expect.stringMatching(
        /^1 row\(s\) of the list have errors \(first: row 4, column D \(Motor kW\): must be a number; got "x"\)/,
      ),
    });
    const r = applyImport(current, p, { mode: 'append', dropRowsWithErrors: true });
    expect(r.ok && [r.added, r.dropped]).toEqual([2, 1]);
  });

  it('replaces the equipment and adds new operating cases', () => {
    const r = applyImport(
      current,
      preview('tag,bus,kind,p_kw,cos_phi,load:weekend\nL1,MAIN,load,100,0.9,0.3\n'),
      { mode: 'replace' },
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.site.equipment.map((e) => e.tag)).toEqual(['L1']);
    expect(r.site.settings.cases).toEqual(['summer-day', 'winter-night', 'weekend']);
  });

  it('replacing keeps the site settings, or takes the defaults of a new site when asked', () => {
    const list = 'tag,bus,kind,p_kw,cos_phi,load,load:weekend\nL1,MAIN,load,100,0.9,1,0.3\n';
    const kept = applyImport(current, preview(list), { mode: 'replace', settings: 'keep' });
    const fresh = applyImport(current, preview(list), { mode: 'replace', settings: 'defaults' });
    if (!kept.ok || !fresh.ok) throw new Error('the import was refused');
    const was = siteFromWorkbook(current).site.settings;
    // Kept: the open site's 180 MVA supply, its cases and notes, plus the list's weekend case.
    expect(kept.site.settings).toEqual({ ...was, cases: ['summer-day', 'winter-night', 'weekend'] });
    // Defaults: 50 Hz, cos φ ≥ 0.95, no short-circuit power, no notes; the name stays, the
    // plain load column is the default case and the list's own weekend case stays.
    expect(fresh.site.settings).toEqual({
      name: was.name,
      hz: 50,
      cases: ['normal', 'weekend'],
      requirement: { kind: 'cosphi', target: 0.95 },
    });
    expect(siteFromWorkbook(fresh.doc).site.settings.sscMva).toBeUndefined();
    expect(fresh.doc.title).toBe(current.title);
    // Adding to the equipment always keeps the settings.
    const added = applyImport(current, preview(EXTRA), { mode: 'append', settings: 'defaults' });
    if (!added.ok) throw new Error('the import was refused');
    expect(added.site.settings.sscMva).toBe(180);
  });

  it('refuses when a required column is not mapped', () => {
    const r = applyImport(current, preview('Item,Motor kW\nM1,5\n'), { mode: 'append' });
    expect(r).toMatchObject({
      ok: false,
      message: 'map a column to bus, kind first; these columns are required',
    });
  });
});
