// The site diagram without a browser: what it reads of a site and the Buses sheet, and where it
// puts each bus. Sites are invented; the figures come from a Buses sheet written by hand in the
// builder's header texts (src/core/workbook/buildBuses.ts).
import { describe, expect, it } from 'vitest';
import { validateSite } from '../../src/core/site/validate.ts';
import { buildDiagramModel, busFigures } from '../../src/ui/diagram/diagramModel.ts';
import { defaultCollapsed, GEOMETRY, layoutDiagram } from '../../src/ui/diagram/diagramLayout.ts';
import { siteFromCsv } from '../core/site/fixtures.ts';

const CSV = [
  'tag,bus,kind,to_bus,qty,p_kw,eff,cos_phi,s_kva,uk_pct,p0_kw,pk_kw,i0_pct,u_kv,q_kvar,len_km,c_nf_km,l_mh_km,p_pct',
  'T1,POC,transformer,LV1,1,,,,1000,6,1.1,10,1.2,0.4,,,,,',
  'L1,POC,line,MV2,1,,,,,,,,,11,,2,10,1.1,',
  'T2,MV2,transformer,LV2,2,,,,630,6,0.9,6.5,1.3,0.4,,,,,',
  'M1,LV1,motor,,3,55,0.94,0.86,,,,,,0.4,,,,,',
  'M2,LV1,motor,,1,30,0.93,0.85,,,,,,0.4,,,,,',
  'LD1,LV2,load,,1,80,,0.9,,,,,,0.4,,,,,',
  'C1,LV1,capacitor,,2,,,,,,,,,0.4,100,,,,7',
  'R1,MV2,reactor,,1,,,,,,,,,11,50,,,,',
  'GRID,POC,load,,1,1,,1,,,,,,11,,,,,',
].join('\n');

const sheet = [
  [
    'Bus',
    'Level',
    'Fed by',
    'Upstream bus',
    'U (kV)',
    'P day (kW)',
    'Q day (kvar)',
    'cos φ day',
    'P night (kW)',
  ],
  ['POC', 0, null, null, 11, 300, 120, 0.928, 50],
  ['LV1', 1, 'T1', 'POC', 0.4, 200, 90, 0.912, 20],
  [
    'MV2',
    1,
    'L1',
    'POC',
    11,
    90,
    { value: '#N/A', message: 'KVAR.LOAD: argument 2 (cos_phi) must be in (0, 1]; got 1.3' },
    0.9,
    10,
  ],
  [null],
  ['notes after the list'],
];

function model(csv = CSV, caseName = 'day') {
  const { site } = siteFromCsv(csv);
  return buildDiagramModel({ site, problems: validateSite(site), busesSheet: sheet, caseName });
}

describe('diagram model', () => {
  it('follows the bus graph: one root, feeders with their kind, children in row order', () => {
    const m = model();
    expect(m.roots).toEqual(['POC']);
    expect(m.buses.get('POC')?.children).toEqual(['LV1', 'MV2']);
    expect(m.buses.get('LV2')?.parent).toBe('MV2');
    expect(m.buses.get('LV2')?.feeder).toEqual({ kind: 'transformer', tag: 'T2', units: 2, sKva: 630 });
    expect(m.buses.get('MV2')?.feeder?.kind).toBe('line');
    expect(m.buses.get('LV2')?.depth).toBe(2);
  });

  it('counts what hangs on a bus and sums its compensation', () => {
    const lv1 = model().buses.get('LV1');
    expect(lv1?.itemsText).toBe('4 motors');
    expect(lv1?.capacitors).toEqual({ rows: 1, kvar: 200, detuned: true });
    expect(model().buses.get('MV2')?.reactors).toEqual({ rows: 1, kvar: 50, detuned: false });
  });

  it('reads P, Q and cos φ of the chosen case by header text, and an error value as an error', () => {
    const m = model();
    expect(m.buses.get('LV1')?.figures).toEqual({ p: 200, q: 90, cos: 0.912 });
    expect(m.buses.get('LV1')?.sheetRow).toBe(2);
    const mv2 = m.buses.get('MV2');
    expect(mv2?.figures).toEqual({ p: 90, cos: 0.9, failed: { q: '#N/A' } });
    expect(mv2?.errors[0]).toMatch(/^Q day \(kvar\) on the Buses sheet is #N\/A: KVAR\.LOAD: argument 2/);
    // A bus the sheet has no row for yet has no figures and no row to show.
    expect(m.buses.get('LV2')?.sheetRow).toBeUndefined();
    expect(model(CSV, 'night').buses.get('POC')?.figures).toEqual({ p: 50 });
  });

  it('stops the bus list at the first row without a bus name', () => {
    expect([...busFigures(sheet, 'day').keys()]).toEqual(['POC', 'LV1', 'MV2']);
  });

  it('marks an input error on the bus of its row', () => {
    const m = model(CSV.replace('M2,LV1,motor,,1,30,0.93,0.85', 'M2,LV1,motor,,1,30,0.93,1.4'));
    expect(m.buses.get('LV1')?.errors.join(' ')).toMatch(/cos_phi/);
    expect(m.buses.get('POC')?.errors).toEqual([]);
  });

  it('draws a bus named by mistake (a typo) as a second tree, in error', () => {
    const m = model(`${CSV}\nM9,LV-1,motor,,1,7.5,0.9,0.8,,,,,,0.4,,,,,`);
    expect(m.roots).toEqual(['POC', 'LV-1']);
    expect(m.buses.get('LV-1')?.errors.join(' ')).toMatch(/fed by nothing/);
  });
});

describe('diagram layout', () => {
  it('puts voltage levels in bands, highest first, and a line-fed bus one tier down in its band', () => {
    const l = layoutDiagram(model(), new Set());
    expect(l.bands.map((b) => b.label)).toEqual(['11 kV', '0.4 kV']);
    const at = (n: string) => l.buses.find((p) => p.bus.name === n);
    expect(at('MV2')?.y).toBe((at('POC')?.y as number) + GEOMETRY.tier);
    const band04 = l.bands[1];
    for (const n of ['LV1', 'LV2']) {
      expect(at(n)?.y).toBeGreaterThan(band04?.top as number);
      expect(at(n)?.y).toBeLessThan(band04?.bottom as number);
    }
  });

  it('stands a bus over its first child and keeps neighbouring bars apart', () => {
    const l = layoutDiagram(model(), new Set());
    const at = (n: string) => l.buses.find((p) => p.bus.name === n);
    expect(at('POC')?.x).toBe(at('LV1')?.x);
    expect(at('MV2')?.x).toBe(at('LV2')?.x);
    expect((at('LV1')?.barRight as number) < (at('LV2')?.barLeft as number)).toBe(true);
    expect(at('POC')?.barRight).toBeGreaterThanOrEqual(at('MV2')?.x as number);
    expect(l.width).toBeGreaterThan(at('MV2')?.x as number);
  });

  it('collapses the deepest level of a large site and counts what it hides, errors included', () => {
    // 8 feeders from the root, each feeding 10 buses: 89 buses in all.
    const rows = ['tag,bus,kind,to_bus,s_kva,uk_pct,p0_kw,pk_kw,i0_pct,u_kv,p_kw,cos_phi'];
    for (let f = 0; f < 8; f++) {
      rows.push(`TF${f},POC,transformer,F${f},1000,6,1,10,1,6.6,,`);
      for (let b = 0; b < 10; b++) rows.push(`T${f}-${b},F${f},transformer,B${f}-${b},500,4,0.5,5,1,0.4,,`);
    }
    rows.push('X1,B3-4,load,,,,,,,0.4,10,1.7');
    const m = model(rows.join('\n'));
    expect(m.buses.size).toBe(89);
    const collapsed = defaultCollapsed(m);
    expect([...collapsed].sort()).toEqual(['F0', 'F1', 'F2', 'F3', 'F4', 'F5', 'F6', 'F7']);
    const l = layoutDiagram(m, collapsed);
    expect(l.shown).toBe(9);
    expect(l.total).toBe(89);
    const f3 = l.buses.find((p) => p.bus.name === 'F3');
    expect(f3).toMatchObject({ collapsed: true, hidden: 10, hiddenErrors: 1 });
    // Opening one branch shows its buses.
    collapsed.delete('F3');
    expect(layoutDiagram(m, collapsed).shown).toBe(19);
  });
});
