// Invented sites of a chosen size for the benchmarks: one point of connection, a ring of MV
// buses fed from it, LV buses fed by unit transformers, and equipment spread over the LV buses.
// Deterministic (a small linear congruential generator) so every run measures the same site.
import type { EquipmentRow, Site } from '../../src/core/site/model.ts';

export interface SiteSize {
  readonly rows: number;
  readonly buses: number;
}

function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

const MV_SHARE = 20; // one MV bus per this many buses

export function generateSite({ rows, buses }: SiteSize, seed = 7): Site {
  const rnd = lcg(seed);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)] as T;
  const root = 'POC-33';
  const mvCount = Math.max(1, Math.floor(buses / MV_SHARE));
  const lvCount = Math.max(1, buses - 1 - mvCount);
  const mv = Array.from({ length: mvCount }, (_, i) => `MV-${i + 1}`);
  const lv = Array.from({ length: lvCount }, (_, i) => `LV-${i + 1}`);
  const equipment: EquipmentRow[] = [];
  let row = 2;
  const push = (r: Omit<EquipmentRow, 'row'>) => equipment.push({ ...r, row: row++ });
  mv.forEach((bus, i) =>
    push({
      tag: `TX-M${i + 1}`,
      bus: root,
      kind: 'transformer',
      to_bus: bus,
      values: { s_kva: 20000, uk_pct: 10, p0_kw: 12, pk_kw: 90, i0_pct: 0.4, u_kv: 33 },
      loads: {},
    }),
  );
  lv.forEach((bus, i) =>
    push({
      tag: `TX-L${i + 1}`,
      bus: mv[i % mvCount] as string,
      kind: 'transformer',
      to_bus: bus,
      values: {
        s_kva: pick([1000, 1600, 2000, 2500]),
        uk_pct: 6,
        p0_kw: 1.1,
        pk_kw: 12,
        i0_pct: 0.8,
        u_kv: 11,
      },
      loads: {},
    }),
  );
  const remaining = Math.max(0, rows - equipment.length);
  for (let i = 0; i < remaining; i++) {
    const bus = lv[i % lvCount] as string;
    const k = rnd();
    const light = 0.3 + 0.4 * rnd();
    if (k < 0.55) {
      push({
        tag: `M-${i + 1}`,
        bus,
        kind: 'motor',
        values: {
          p_kw: pick([5.5, 11, 22, 37, 55, 75]),
          eff: 0.9 + 0.05 * rnd(),
          cos_phi: 0.8 + 0.08 * rnd(),
          u_kv: 0.4,
        },
        loads: { normal: 0.6 + 0.35 * rnd(), light },
      });
    } else if (k < 0.85) {
      push({
        tag: `L-${i + 1}`,
        bus,
        kind: 'load',
        values: { p_kw: 5 + Math.round(80 * rnd()), cos_phi: 0.85 + 0.13 * rnd(), u_kv: 0.4 },
        loads: { normal: 1, light },
      });
    } else if (k < 0.95) {
      push({
        tag: `C-${i + 1}`,
        bus,
        kind: 'cable',
        values: { u_kv: 0.4, c_uf_km: 0.5 + 0.3 * rnd(), len_km: 0.05 + 0.3 * rnd() },
        loads: {},
      });
    } else {
      push({
        tag: `Q-${i + 1}`,
        bus,
        kind: 'capacitor',
        values: { q_kvar: pick([25, 50, 100]), u_rated_kv: 0.44, u_kv: 0.4, p_pct: pick([0, 7]) },
        loads: {},
      });
    }
  }
  return {
    settings: {
      name: `Bench site ${rows} rows / ${buses} buses`,
      hz: 50,
      cases: ['normal', 'light'],
      requirement: { kind: 'cosphi', target: 0.95 },
      sscMva: 500,
    },
    equipment,
  };
}
