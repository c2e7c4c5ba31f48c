// Random valid sites for the living-model property test: 1–4 voltage levels, 1–40 buses in a
// tree fed by transformers and lines, every kind of equipment, 1–4 cases, 50 or 60 Hz, and banks
// typed on some buses. Invented data within the catalogue's domains; nothing here is a check value.
import fc from 'fast-check';
import type { BankChoice } from '../../../src/core/site/bankChoice.ts';
import type { EquipmentRow, Requirement, Site } from '../../../src/core/site/model.ts';

const LEVEL_KV = [33, 11, 0.69, 0.4];

export interface ArbSite {
  readonly site: Site;
  readonly banks: BankChoice[];
}

type RowSpec = Omit<EquipmentRow, 'row'>;

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
/**
 * A power factor as a nameplate or list gives it, to three decimals. Unrounded doubles put
 * cos φ one ulp below 1, where √(1 − cos²φ) is all rounding and spreadsheet programs rightly
 * differ (LibreOffice snaps such differences to 0); no site has such a value.
 */
const cosPhi = (min: number, max: number) => num(min, max).map((c) => Math.round(c * 1000) / 1000);
/** A load factor: off, or a real share (no subnormal numbers a site never has). */
const loadFactor = (range: [number, number]) =>
  fc.oneof(fc.constant(0), num(Math.max(range[0], 0.01), range[1]));
const loadsArb = (cases: readonly string[], range: [number, number]) =>
  fc
    .array(fc.option(loadFactor(range), { nil: undefined }), {
      minLength: cases.length,
      maxLength: cases.length,
    })
    .map((xs) => {
      const out: Record<string, number> = {};
      xs.forEach((x, i) => {
        if (x !== undefined && i > 0) out[cases[i] as string] = x;
      });
      return out;
    });

/** Supply cells as an estimator types them: blank, the defaults, drives and other spellings. */
export const MOTOR_SUPPLY_TEXTS = [
  'direct-on-line',
  'DOL',
  'star-delta',
  'VSD 6-pulse',
  'vsd-6-PULSE',
  'VSD AFE',
];
export const LOAD_SUPPLY_TEXTS = ['linear', 'Rectifier/UPS', 'electronic lighting', 'VSD 6-pulse'];
const supplyArb = (texts: readonly string[]) =>
  fc.option(fc.constantFrom(...texts), { nil: undefined }).map((s) => (s ? { supply: s } : {}));

function shuntArb(bus: string, u: number, cases: readonly string[]): fc.Arbitrary<RowSpec> {
  const units = fc
    .record({ qty: fc.option(fc.integer({ min: 1, max: 4 }), { nil: undefined }) })
    .map(({ qty }) => (qty ? { qty } : {}));
  const motor = fc
    .record({
      p: num(1, 400),
      eff: num(0.8, 0.97),
      cos: cosPhi(0.7, 0.92),
      load: fc.option(loadFactor([0, 1.2]), { nil: undefined }),
      units,
      loads: loadsArb(cases, [0, 1.2]),
      supply: supplyArb(MOTOR_SUPPLY_TEXTS),
    })
    .map(({ p, eff, cos, load, units, loads, supply }) => ({
      tag: '',
      bus,
      kind: 'motor',
      ...supply,
      values: { p_kw: p, eff, cos_phi: cos, u_kv: u, ...units, ...(load !== undefined ? { load } : {}) },
      loads,
    }));
  const load = fc
    .record({
      p: num(1, 600),
      cos: cosPhi(0.6, 1),
      units,
      loads: loadsArb(cases, [0, 1.5]),
      supply: supplyArb(LOAD_SUPPLY_TEXTS),
    })
    .map(({ p, cos, units, loads, supply }) => ({
      tag: '',
      bus,
      kind: 'load',
      ...supply,
      values: { p_kw: p, cos_phi: cos, ...units },
      loads,
    }));
  const generator = fc
    .record({ p: num(10, 500), cos: cosPhi(0.8, 1), loads: loadsArb(cases, [0, 1]) })
    .map(({ p, cos, loads }) => ({
      tag: '',
      bus,
      kind: 'generator',
      values: { p_kw: p, cos_phi: cos, u_kv: u },
      loads,
    }));
  const cable = fc
    .record({ c: num(0.15, 0.6), len: num(0.05, 5), loads: loadsArb(cases, [0, 1]) })
    .map(({ c, len, loads }) => ({
      tag: '',
      bus,
      kind: 'cable',
      values: { u_kv: u, c_uf_km: c, len_km: len },
      loads,
    }));
  const capacitor = fc
    .record({ q: num(5, 300), p: fc.constantFrom(undefined, 7), loads: loadsArb(cases, [0, 1]) })
    .map(({ q, p, loads }) => ({
      tag: '',
      bus,
      kind: 'capacitor',
      values: { q_kvar: q, u_rated_kv: u * 1.1, u_kv: u, ...(p ? { p_pct: p } : {}) },
      loads,
    }));
  const reactor = fc.record({ q: num(10, 300), loads: loadsArb(cases, [0, 1]) }).map(({ q, loads }) => ({
    tag: '',
    bus,
    kind: 'reactor',
    values: { q_kvar: q, u_rated_kv: u, u_kv: u },
    loads,
  }));
  return fc.oneof(
    { arbitrary: motor, weight: 4 },
    { arbitrary: load, weight: 3 },
    { arbitrary: generator, weight: 1 },
    { arbitrary: cable, weight: 1 },
    { arbitrary: capacitor, weight: 1 },
    { arbitrary: reactor, weight: 1 },
  );
}

const limitsArb: fc.Arbitrary<Requirement> = fc.oneof(
  num(0.9, 0.99).map((target) => ({ kind: 'cosphi' as const, target })),
  num(0.9, 0.99).map((target) => ({ kind: 'cosphi' as const, target, lagOnly: true })),
  fc
    .record({ lagMax: num(0.2, 0.5), leadMax: num(0.1, 0.4) })
    .map((r) => ({ kind: 'tanphi' as const, ...r })),
);

/** The limits, one time in four referred to a rated power (a site that generates). */
const requirementArb: fc.Arbitrary<Requirement> = fc
  .tuple(limitsArb, fc.option(num(50, 50_000), { freq: 3 }))
  .map(([r, refKw]) => (refKw === null ? r : { ...r, refKw }));

export const siteArb: fc.Arbitrary<ArbSite> = fc
  .record({
    buses: fc.integer({ min: 1, max: 40 }),
    levels: fc.integer({ min: 1, max: 4 }),
    cases: fc.integer({ min: 1, max: 4 }),
    hz: fc.constantFrom(50 as const, 60 as const),
    requirement: requirementArb,
    ssc: fc.option(num(50, 2000), { nil: undefined }),
    seed: fc.array(fc.nat(), { minLength: 40, maxLength: 40 }),
  })
  .chain((p) => {
    const cases = ['base', 'night', 'peak', 'outage'].slice(0, p.cases);
    // A tree: bus i (i > 0) hangs from an earlier bus, one level down when that leaves a level, else on the same level by a line.
    const tree: Array<{ name: string; level: number; parent?: number; line?: boolean }> = [
      { name: 'B0', level: 0 },
    ];
    for (let i = 1; i < p.buses; i++) {
      const parent = (p.seed[i] as number) % i;
      const up = tree[parent] as { level: number };
      const down = up.level + 1 < p.levels;
      tree.push({ name: `B${i}`, level: down ? up.level + 1 : up.level, parent, line: !down });
    }
    const uOf = (level: number) => LEVEL_KV[Math.min(LEVEL_KV.length - 1, level + (4 - p.levels))] as number;
    const branches: RowSpec[] = tree.flatMap((b, i): RowSpec[] => {
      if (b.parent === undefined) return [];
      // A line's resistance: blank for one in three (losses not counted), else 0.05–0.65 Ω/km.
      const k = Math.floor((p.seed[i] as number) / 64);
      const r = k % 3 === 0 ? undefined : 0.05 + 0.1 * (k % 7);
      const from = tree[b.parent] as { name: string };
      const u = uOf(b.level);
      // Where R is blank, one time in two the conductor's section gives it instead (copper or
      // aluminium, at 20 °C or a conductor temperature).
      const section =
        r !== undefined || k % 2 === 0
          ? {}
          : {
              [k % 4 === 1 ? 'cu_mm2' : 'al_mm2']: [16, 50, 95, 185, 240][k % 5] as number,
              ...(Math.floor(k / 6) % 2 === 0 ? {} : { theta_c: 70 }),
            };
      // A rated current one time in three (loading and overload), low enough to overload at times.
      const rating = k % 3 === 2 ? { i_rated_a: 20 + 60 * (k % 7) } : {};
      // One line in four is a feeder cable instead, its X and C each blank one time in three.
      const len = u < 1 ? 0.05 + 0.05 * (b.level % 3) : 0.5 + (b.level % 3);
      if (b.line && k % 4 === 1)
        return [
          {
            tag: '',
            bus: from.name,
            kind: 'feeder',
            to_bus: b.name,
            values: {
              u_kv: u,
              ...(r === undefined ? section : { r_ohm_km: r }),
              ...(k % 3 === 1 ? {} : { x_ohm_km: 0.06 + 0.02 * (k % 5) }),
              ...(k % 9 === 5 ? {} : { c_uf_km: 0.2 + 0.1 * (k % 4) }),
              len_km: len,
              ...rating,
            },
            loads: {},
          },
        ];
      return b.line
        ? [
            {
              tag: '',
              bus: from.name,
              kind: 'line',
              to_bus: b.name,
              values: {
                u_kv: u,
                ...(r === undefined ? section : { r_ohm_km: r }),
                l_mh_km: 1.1,
                c_nf_km: 10,
                len_km: len,
                ...rating,
              },
              loads: {},
            },
          ]
        : [
            {
              tag: '',
              bus: from.name,
              kind: 'transformer',
              to_bus: b.name,
              values: { s_kva: 2500, uk_pct: 6, p0_kw: 2.2, pk_kw: 20, i0_pct: 0.8, u_kv: u },
              loads: {},
            },
          ];
    });
    const shunts = fc.tuple(
      ...tree.map((b) =>
        fc.array(shuntArb(b.name, uOf(b.level), cases), {
          minLength: b.level === 0 && p.buses === 1 ? 1 : 0,
          maxLength: 4,
        }),
      ),
    );
    const banks = fc.array(
      fc.record({
        bus: fc.constantFrom(...tree.map((b) => b.name)),
        step: num(5, 100),
        steps: fc.integer({ min: 1, max: 6 }),
        // Blank (equal stages) or a step series; a binary one within its 4 stages.
        series: fc.constantFrom(undefined, '1:1:1' as const, '1:2:2' as const, '1:2:4' as const),
        fixed: fc.option(num(1, 50), { nil: undefined }),
        reactor: fc.option(num(10, 200), { nil: undefined }),
        // Detuning and the capacitor rating, so the priced schedule has capacitors to count.
        p: fc.constantFrom(0, 5.67, 7, 14),
        urFactor: fc.option(fc.constantFrom(1.05, 1.1, 1.2), { nil: undefined }),
      }),
      { maxLength: 3 },
    );
    const levelOf = (bus: string) => tree.find((b) => b.name === bus)?.level ?? 0;
    const ratedKv = (factor: number, level: number) => Math.round(factor * uOf(level) * 1000) / 1000;
    return fc.tuple(shunts, banks).map(([rowsPerBus, bankSpecs]) => {
      const all = [...branches, ...rowsPerBus.flat()];
      const equipment: EquipmentRow[] = all.map((r, i) => ({
        ...r,
        row: i + 2,
        tag: `${r.kind.slice(0, 1).toUpperCase()}${i + 1}`,
      }));
      const seen = new Set<string>();
      const banks: BankChoice[] = bankSpecs
        .filter((b) => !seen.has(b.bus) && (seen.add(b.bus), true))
        .map((b) => ({
          bus: b.bus,
          step_kvar: b.step,
          steps: b.series === '1:2:4' ? Math.min(b.steps, 4) : b.steps,
          ...(b.series ? { series: b.series } : {}),
          ...(b.fixed ? { fixed_kvar: b.fixed } : {}),
          ...(b.reactor ? { reactor_kvar: b.reactor } : {}),
          ...(b.p > 0 ? { p_pct: b.p } : {}),
          ...(b.urFactor ? { u_rated_kv: ratedKv(b.urFactor, levelOf(b.bus)) } : {}),
        }));
      const site: Site = {
        settings: {
          name: 'Random site',
          hz: p.hz,
          cases,
          requirement: p.requirement,
          ...(p.ssc ? { sscMva: p.ssc } : {}),
        },
        equipment,
      };
      return { site, banks };
    });
  });
