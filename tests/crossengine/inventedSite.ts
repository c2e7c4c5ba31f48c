// An invented site for the cross-engine check (not a real plant): a quarry's crushing plant on a
// 6.6 kV supply with every kind of equipment (a feeder cable among them), drive-fed motors among them, and two operating cases. The faulty variant gives one
// motor a no-load current inconsistent with its power factor, so error cells (and their spread
// into the bus totals) are compared as well.
import type { EquipmentRow, Site } from '../../src/core/site/model.ts';

let rowNo = 1;
function item(
  tag: string,
  bus: string,
  kind: EquipmentRow['kind'],
  values: EquipmentRow['values'],
  loads: Record<string, number> = {},
  extra: Partial<EquipmentRow> = {},
): EquipmentRow {
  rowNo += 1;
  return { row: rowNo, tag, bus, kind, values, loads, ...extra };
}

export function inventedQuarry(faulty = false): Site {
  rowNo = 1;
  return {
    settings: {
      name: 'Quarry crushing plant (invented for the cross-engine check)',
      hz: 50,
      cases: ['crushing', 'maintenance'],
      requirement: { kind: 'cosphi', target: 0.95 },
      sscMva: 120,
      notes: ['Invented scenario for tests only.'],
    },
    equipment: [
      item('INC', 'MV', 'cable', { u_kv: 6.6, c_uf_km: 0.42, len_km: 1.6 }),
      item(
        'OHL-PIT',
        'MV',
        'line',
        // 0.32 Ω/km: 95 mm² aluminium (IEC 60228 class 2 at 20 °C, from memory).
        { u_kv: 6.6, r_ohm_km: 0.32, l_mh_km: 1.1, c_nf_km: 10.5, len_km: 3.2, i_rated_a: 200 },
        {},
        { to_bus: 'PIT' },
      ),
      item(
        'TX1',
        'MV',
        'transformer',
        { s_kva: 2000, uk_pct: 6, p0_kw: 1.9, pk_kw: 17, i0_pct: 0.7, u_kv: 0.69 },
        {},
        { to_bus: 'LV1' },
      ),
      item(
        'CR-1',
        'LV1',
        'motor',
        { p_kw: 315, eff: 0.955, cos_phi: 0.87, i0_pct: 30, u_kv: 0.69 },
        { crushing: 0.9, maintenance: 0 },
        // Supply spellings as typed: the formulas read case and hyphens as the core does.
        { supply: 'VSD AFE' },
      ),
      item(
        'CV',
        'LV1',
        'motor',
        { qty: 4, running: 3, p_kw: 30, eff: 0.93, cos_phi: 0.84, u_kv: 0.69 },
        { crushing: 0.8, maintenance: 0.2 },
        { supply: 'vsd-6-PULSE' },
      ),
      item(
        'SCR',
        'LV1',
        'motor',
        { p_kw: 55, eff: 0.94, cos_phi: 0.85, i0_pct: faulty ? 95 : 32, u_kv: 0.69 },
        { crushing: 1, maintenance: 0.5 },
      ),
      item(
        'LT',
        'LV1',
        'load',
        { p_kw: 45, cos_phi: 0.95 },
        { crushing: 1, maintenance: 0.6 },
        { supply: 'electronic lighting' },
      ),
      // A 690 V feeder cable to the washing plant: 250 m of 185 mm² copper at 90 °C, R from the
      // section (IEC 60228 class 2); X 0.08 Ω/km typical of LV cables (common practice).
      item(
        'FDR-WSH',
        'LV1',
        'feeder',
        { u_kv: 0.69, cu_mm2: 185, theta_c: 90, x_ohm_km: 0.08, c_uf_km: 0.6, len_km: 0.25, i_rated_a: 400 },
        {},
        { to_bus: 'WASH' },
      ),
      item(
        'WSH-P',
        'WASH',
        'motor',
        { qty: 2, running: 2, p_kw: 75, eff: 0.94, cos_phi: 0.85, i0_pct: 32, u_kv: 0.69 },
        { crushing: 0.9, maintenance: 0.3 },
      ),
      item('WSH-L', 'WASH', 'load', { p_kw: 30, cos_phi: 0.9 }, { crushing: 1, maintenance: 0.5 }),
      item('DG', 'LV1', 'generator', { p_kw: 400, cos_phi: 0.8 }, { crushing: 0, maintenance: 0.5 }),
      item(
        'CB1',
        'LV1',
        'capacitor',
        { q_kvar: 150, u_rated_kv: 0.76, u_kv: 0.69, p_pct: 7 },
        { crushing: 1, maintenance: 1 },
      ),
      // A motor on a transformer of its own with nothing else on the bus: the design gives it its
      // own capacitor, which the Compensation sheet switches out with the motor in maintenance.
      item(
        'TX2',
        'MV',
        'transformer',
        { s_kva: 250, uk_pct: 4, p0_kw: 0.4, pk_kw: 3.2, i0_pct: 1.5, u_kv: 0.4 },
        {},
        { to_bus: 'LV-CR2' },
      ),
      item(
        'CR-2',
        'LV-CR2',
        'motor',
        { p_kw: 110, eff: 0.95, cos_phi: 0.85, i0_pct: 30, u_kv: 0.4 },
        { crushing: 1, maintenance: 0 },
      ),
      item(
        'PMP',
        'PIT',
        'motor',
        { p_kw: 400, eff: 0.96, cos_phi: 0.88, i0_pct: 25, u_kv: 6.6 },
        { crushing: 0.85, maintenance: 0.4 },
      ),
      item(
        'SR',
        'PIT',
        'reactor',
        { q_kvar: 100, u_rated_kv: 6.6, u_kv: 6.6 },
        { crushing: 0, maintenance: 1 },
      ),
    ],
  };
}
