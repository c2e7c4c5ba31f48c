// Properties of the roll-up over random tree-shaped sites (fast-check):
// - the root's P is the sum of every element's P plus the transformer losses;
// - adding an element changes only its bus and the buses above it;
// - the order of the rows does not matter.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { EquipmentRow, Site } from '../../../src/core/site/model.ts';
import { rollUp } from '../../../src/core/site/rollup.ts';
import { validateSite } from '../../../src/core/site/validate.ts';
import { ancestors, buildBusGraph } from '../../../src/core/site/graph.ts';

// Every generated site has at least one transformer (the root feeds B1).
const CASES = ['a', 'b'];
// Load factors whose products stay within the sizes the catalogue takes (0, or 1e-30 and above):
// 1e-30 × 0.1 kW would give P = 1e-31, refused by rule.
const load = fc.record({
  a: fc.double({ min: 0, max: 1, noNaN: true }).filter((x) => x === 0 || x >= 1e-9),
  b: fc.constantFrom(0, 0.5, 1),
});

/** A shunt item of a random kind with values inside the catalogue domains. */
const shunt = fc.oneof(
  fc.record({
    kind: fc.constant('motor' as const),
    p_kw: fc.double({ min: 0.5, max: 500, noNaN: true }),
    eff: fc.double({ min: 0.8, max: 0.97, noNaN: true }),
    cos_phi: fc.double({ min: 0.7, max: 0.92, noNaN: true }),
    qty: fc.integer({ min: 1, max: 4 }),
    loads: load,
  }),
  fc.record({
    kind: fc.constant('load' as const),
    p_kw: fc.double({ min: 0.1, max: 800, noNaN: true }),
    cos_phi: fc.double({ min: 0.5, max: 1, noNaN: true }),
    qty: fc.constant(1),
    loads: load,
  }),
  fc.record({
    kind: fc.constant('generator' as const),
    p_kw: fc.double({ min: 0.1, max: 800, noNaN: true }),
    cos_phi: fc.double({ min: 0.8, max: 1, noNaN: true }),
    qty: fc.constant(1),
    loads: load,
  }),
  fc.record({
    kind: fc.constant('capacitor' as const),
    q_kvar: fc.double({ min: 5, max: 500, noNaN: true }),
    u_rated_kv: fc.constantFrom(0.44, 0.525),
    u_kv: fc.constant(0.4),
    p_pct: fc.constantFrom(0, 7),
    qty: fc.integer({ min: 1, max: 6 }),
    loads: load,
  }),
  fc.record({
    kind: fc.constant('cable' as const),
    u_kv: fc.constant(0.4),
    c_uf_km: fc.double({ min: 0.1, max: 0.6, noNaN: true }),
    len_km: fc.double({ min: 0.01, max: 3, noNaN: true }),
    qty: fc.constant(1),
    loads: load,
  }),
  fc.record({
    kind: fc.constant('reactor' as const),
    q_kvar: fc.double({ min: 5, max: 300, noNaN: true }),
    u_rated_kv: fc.constant(0.4),
    qty: fc.constant(1),
    loads: load,
  }),
);
type Shunt = typeof shunt extends fc.Arbitrary<infer T> ? T : never;

function toRow(s: Shunt, bus: string, tag: string, row: number): EquipmentRow {
  const { kind, loads, ...values } = s;
  return { row, tag, bus, kind, values, loads: { ...loads } };
}

/** Buses B0 (root) .. Bn, each Bi (i > 0) fed by a transformer from an earlier bus. */
const siteArb = fc
  .record({
    parents: fc.array(fc.nat(), { minLength: 1, maxLength: 4 }),
    items: fc.array(fc.tuple(fc.nat(), shunt), { minLength: 1, maxLength: 12 }),
    kva: fc.constantFrom(250, 630, 1000, 2500),
  })
  .map(({ parents, items, kva }) => {
    const rows: EquipmentRow[] = [];
    parents.forEach((p, i) => {
      rows.push({
        row: rows.length + 2,
        tag: `T${i + 1}`,
        bus: `B${p % (i + 1)}`,
        kind: 'transformer',
        to_bus: `B${i + 1}`,
        values: { s_kva: kva, uk_pct: 6, i0_pct: 1, p0_kw: 1, pk_kw: 8, u_kv: 0.4 },
        loads: {},
      });
    });
    items.forEach(([b, s], k) =>
      rows.push(toRow(s, `B${b % (parents.length + 1)}`, `E${k}`, rows.length + 2)),
    );
    const site: Site = {
      settings: { name: 'p', hz: 50, cases: CASES, requirement: { kind: 'cosphi', target: 0.95 } },
      equipment: rows,
    };
    return site;
  });

const rel = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

describe('roll-up properties', () => {
  it('generated sites are valid (so the properties test real balances)', () => {
    fc.assert(
      fc.property(siteArb, (site) => {
        expect(validateSite(site).filter((p) => p.severity === 'error')).toEqual([]);
      }),
      { numRuns: 50 },
    );
  });
  it('root P = Σ element P + transformer losses', () => {
    fc.assert(
      fc.property(siteArb, fc.constantFrom(...CASES), (site, c) => {
        const bal = rollUp(site, c);
        const sum = bal.elements.reduce((s, e) => s + e.p_kw, 0);
        const losses = bal.elements.filter((e) => e.kind === 'transformer').reduce((s, e) => s + e.p_kw, 0);
        expect(losses).toBeGreaterThan(0);
        expect(rel(bal.root.p_kw, sum)).toBe(true);
      }),
    );
  });
  it('adding an element changes only its bus and the buses above it', () => {
    fc.assert(
      fc.property(siteArb, shunt, fc.nat(), fc.constantFrom(...CASES), (site, extra, pick, c) => {
        const buses = buildBusGraph(site.equipment).order;
        const bus = buses[pick % buses.length] as string;
        // Switched off in this case (load 0), it changes nothing anywhere.
        const lf = (extra.loads as Record<string, number>)[c] as number;
        fc.pre(lf === 0 || lf > 1e-6);
        const more: Site = { ...site, equipment: [...site.equipment, toRow(extra, bus, 'NEW', 999)] };
        const before = rollUp(site, c);
        const after = rollUp(more, c);
        const touched = new Set(lf === 0 ? [] : [bus, ...ancestors(buildBusGraph(more.equipment), bus)]);
        for (const b of before.buses) {
          const a = after.buses.find((x) => x.bus === b.bus);
          if (touched.has(b.bus)) expect(a?.p_kw !== b.p_kw || a?.q_kvar !== b.q_kvar).toBe(true);
          else expect([a?.p_kw, a?.q_kvar]).toEqual([b.p_kw, b.q_kvar]);
        }
      }),
    );
  });
  it('the order of the rows does not matter', () => {
    fc.assert(
      fc.property(siteArb, fc.constantFrom(...CASES), fc.integer(), (site, c, seed) => {
        const shuffled = fc.sample(
          fc.shuffledSubarray([...site.equipment], { minLength: site.equipment.length }),
          { numRuns: 1, seed },
        )[0] as EquipmentRow[];
        const a = rollUp(site, c);
        const b = rollUp({ ...site, equipment: shuffled }, c);
        const byBus = new Map(b.buses.map((x) => [x.bus, x]));
        expect(a.root.bus).toBe(b.root.bus);
        for (const x of a.buses) {
          const y = byBus.get(x.bus);
          expect(rel(x.p_kw, y?.p_kw as number) && rel(x.q_kvar, y?.q_kvar as number)).toBe(true);
        }
      }),
    );
  });
});
