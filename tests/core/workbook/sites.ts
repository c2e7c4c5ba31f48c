// Invented sites for the workbook tests (demo data of our own, not from any source).
import type { EquipmentRow, Site } from '../../../src/core/site/model.ts';

type Partial = Omit<EquipmentRow, 'row' | 'values' | 'loads'> & {
  values?: EquipmentRow['values'];
  loads?: EquipmentRow['loads'];
};

function rows(list: Partial[]): EquipmentRow[] {
  return list.map((r, i) => ({ ...r, row: i + 2, values: r.values ?? {}, loads: r.loads ?? {} }));
}

/**
 * A small plant on an 11 kV supply: two unit transformers (one a pair in parallel), an
 * overhead line to a remote pump bus, motors, loads, a standby generator, an MV cable, a
 * detuned capacitor step and a shunt reactor. Three cases; blanks and zeros on purpose.
 */
export const PLANT: Site = {
  settings: {
    name: 'Invented plant',
    hz: 50,
    cases: ['day', 'night', 'outage'],
    requirement: { kind: 'cosphi', target: 0.95 },
    sscMva: 250,
    notes: ['Motor no-load current assumed where not given.'],
  },
  equipment: rows([
    {
      tag: 'T1',
      bus: 'MV',
      kind: 'transformer',
      to_bus: 'LV1',
      values: { s_kva: 1600, uk_pct: 6, p0_kw: 1.9, pk_kw: 14, i0_pct: 0.8, u_kv: 0.4 },
    },
    {
      tag: 'T2',
      bus: 'MV',
      kind: 'transformer',
      to_bus: 'LV2',
      values: { qty: 2, s_kva: 1000, uk_pct: 6, p0_kw: 1.3, pk_kw: 10.5, i0_pct: 1, u_kv: 0.4 },
    },
    {
      tag: 'OHL1',
      bus: 'MV',
      kind: 'line',
      to_bus: 'PUMP',
      values: { u_kv: 11, l_mh_km: 1.2, c_nf_km: 9.5, len_km: 6.5 },
    },
    {
      tag: 'C-MV1',
      bus: 'MV',
      kind: 'cable',
      values: { u_kv: 11, c_uf_km: 0.28, len_km: 1.4 },
      loads: { outage: 0 },
    },
    {
      tag: 'M1',
      description: 'Compressor',
      bus: 'LV1',
      kind: 'motor',
      values: { qty: 2, p_kw: 160, eff: 0.95, cos_phi: 0.86, load: 0.8, i0_pct: 32, u_kv: 0.4 },
      loads: { night: 0.5, outage: 0 },
    },
    {
      tag: 'M2',
      bus: 'LV1',
      kind: 'motor',
      values: { qty: 3, running: 2, p_kw: 75, eff: 0.94, cos_phi: 0.85 },
      loads: { night: 0.3 },
    },
    {
      tag: 'L1',
      description: 'Lighting',
      bus: 'LV1',
      kind: 'load',
      values: { p_kw: 120, cos_phi: 0.9 },
      loads: { day: 0.6 },
    },
    {
      tag: 'CB1',
      bus: 'LV1',
      kind: 'capacitor',
      values: { q_kvar: 300, u_rated_kv: 0.44, u_kv: 0.4, p_pct: 7 },
      loads: { night: 0.5 },
    },
    {
      tag: 'M3',
      bus: 'LV2',
      kind: 'motor',
      values: { qty: 4, p_kw: 55, eff: 0.93, cos_phi: 0.84, load: 0.9, u_kv: 0.4 },
      loads: { outage: 0.2 },
    },
    {
      tag: 'L2',
      bus: 'LV2',
      kind: 'load',
      // Rectifiers: 350 kVA of 6-pulse sources against 2 × 1000 kVA, so the design detunes LV2.
      supply: 'rectifier/UPS',
      values: { qty: 2, p_kw: 200, cos_phi: 0.8, load: 0.7 },
    },
    {
      tag: 'CB2',
      description: 'Old plain capacitor',
      bus: 'LV2',
      kind: 'capacitor',
      values: { q_kvar: 50, u_rated_kv: 0.4 },
    },
    {
      tag: 'G1',
      description: 'Standby set',
      bus: 'LV2',
      kind: 'generator',
      values: { p_kw: 400, cos_phi: 0.8 },
      loads: { day: 0, night: 0, outage: 0.9 },
    },
    {
      tag: 'P1',
      bus: 'PUMP',
      kind: 'motor',
      values: { p_kw: 450, eff: 0.955, cos_phi: 0.87, load: 0.85, u_kv: 11 },
      loads: { night: 1 },
    },
    { tag: 'R1', bus: 'PUMP', kind: 'reactor', values: { q_kvar: 150, u_rated_kv: 11 }, loads: { day: 0 } },
  ]),
};
