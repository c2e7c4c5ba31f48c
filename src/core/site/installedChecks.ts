// Checks on the site as given, before any bank: the supply's short-circuit power when it is
// missing (supplyStrength.ts), then the capacitors already in the equipment list: voltage across
// them against their rating, parallel resonance with the supply, plain and detuned units on one
// bus, and the motor self-excitation limit.
//
// Self-excitation rule (stated here, applied by the design too): a bus that holds exactly one
// motor row, one or more capacitor rows and nothing else (no loads, generators, cables, reactors,
// and no transformer or line leaving it) is taken as individual motor compensation: the
// capacitors are switched with the motor. Their output at the operating voltage, per running
// motor unit, must not exceed KVAR.MOTORCAP.MAX = 0.9·√3·U·I0 of one motor, with I0 from the
// nameplate i0_pct, or a conservative default when it is blank (selfExcitation.ts).
import type { EquipmentRow, Site } from './model.ts';
import { unitsRunning } from './cases.ts';
import type { BusGraph } from './graph.ts';
import type { BusShortCircuit } from './shortCircuit.ts';
import {
  CAP_OVERVOLTAGE_LIMIT,
  CAP_UNDERUSE,
  CAP_VOLTAGE_MARGIN,
  capacitorRatedVoltage,
  capacitorVoltage,
  ratedBelowMargin,
  nearHarmonic,
  outputPerNameplateKvarIfValid,
  resonanceOrderOf,
  RESONANCE_MARGIN,
} from './bankRules.ts';
import { infiniteSupplyNote, supplyWarnings } from './supplyStrength.ts';
import { designWarning, type DesignWarning } from './warnings.ts';
import { formatNumber } from '../registry/messages.ts';
import { soleMotorOf } from './individualCompensation.ts';

export { soleMotorOf } from './individualCompensation.ts';
export { motorCapacitorLimit } from './selfExcitation.ts';
import { assumedI0Text, motorCapacitorLimit } from './selfExcitation.ts';
import { isCapacitorKind } from '../kinds/index.ts';

const f = (x: number, digits = 1) => x.toFixed(digits);

/** Output of an installed capacitor row at its operating voltage, all running units, kvar (> 0). */
export function installedCapacitorKvar(row: EquipmentRow, hz: number): number {
  const { q_kvar: q, u_rated_kv: ur, u_kv: u, p_pct: p } = row.values;
  if (q === undefined || ur === undefined) return 0;
  // A row the catalogue refuses (e.g. detuned at or past resonance) is an error of validation,
  // which runs the same call; here it delivers nothing. Anything thrown is a bug and propagates.
  const perKvar = outputPerNameplateKvarIfValid(ur, u ?? ur, p ?? 0, hz);
  return perKvar === undefined ? 0 : q * perKvar * unitsRunning(row);
}

export function checkInstalled(
  site: Site,
  graph: BusGraph,
  ssc: ReadonlyMap<string, BusShortCircuit>,
  voltages: ReadonlyMap<string, { u_kv: number }>,
): DesignWarning[] {
  const out: DesignWarning[] = [...supplyWarnings(site, graph, voltages)];
  const hz = site.settings.hz;
  const caps = site.equipment.filter((r) => isCapacitorKind(r.kind));
  for (const row of caps) {
    const { u_rated_kv: ur, u_kv: u, p_pct: p } = row.values;
    if (ur === undefined) continue;
    const uc = capacitorVoltage(u ?? ur, p ?? 0);
    const where = { row: row.row, column: 'u_rated_kv', tag: row.tag, bus: row.bus };
    if (uc > CAP_OVERVOLTAGE_LIMIT * ur) {
      out.push(
        designWarning(
          'error',
          'capacitor-overvoltage',
          where,
          `capacitor ${row.tag} sees ${f(uc, 3)} kV (CAPBANK.UCAP) but is rated ${formatNumber(ur)} kV: above the ${CAP_OVERVOLTAGE_LIMIT} × rating it may stand only 8 h a day (IEC 60831-1); choose a higher rated voltage`,
        ),
      );
    } else if (uc > ur * (1 + 1e-9)) {
      out.push(
        designWarning(
          'warning',
          'capacitor-overvoltage',
          where,
          `capacitor ${row.tag} sees ${f(uc, 3)} kV continuously, above its rating of ${formatNumber(ur)} kV; choose a higher rated voltage`,
        ),
      );
    } else if (ratedBelowMargin(uc, ur)) {
      out.push(ratingMarginWarning(`capacitor ${row.tag}`, where, uc, ur, p ?? 0, hz));
    } else if (uc < CAP_UNDERUSE * ur) {
      // Output per nameplate kvar of a detuned step is (Uc/Ur)²·(1 − p): KVAR.CAPBANK per kvar.
      const share = outputPerNameplateKvarIfValid(ur, u ?? ur, p ?? 0, hz);
      if (share !== undefined)
        out.push(
          designWarning(
            'info',
            'capacitor-underrated-use',
            where,
            `capacitor ${row.tag} runs at ${f(uc, 3)} kV, well below its ${formatNumber(ur)} kV rating: it gives only ${f(100 * share, 1)} % of its nameplate kvar ((Uc/Ur)²·(1 − p) with p = ${formatNumber(p ?? 0)} %)`,
          ),
        );
    }
  }
  const buses = [...new Set(caps.map((r) => r.bus))];
  for (const bus of buses) {
    const onBus = caps.filter((r) => r.bus === bus);
    const plain = onBus.filter((r) => !(r.values.p_pct && r.values.p_pct > 0));
    const detuned = onBus.filter((r) => r.values.p_pct && r.values.p_pct > 0);
    if (plain.length > 0 && detuned.length > 0) {
      out.push(
        designWarning(
          'warning',
          'detuned-and-plain-mixed',
          { bus, row: (plain[0] as EquipmentRow).row, column: 'p_pct' },
          `plain capacitors (${plain.map((r) => r.tag).join(', ')}) share bus ${bus} with detuned ones (${detuned.map((r) => r.tag).join(', ')}); the plain ones can resonate with the detuning reactors and overload them: detune all or none`,
        ),
      );
    }
    out.push(...checkResonance(bus, plain, ssc.get(bus), hz));
    const motor = soleMotorOf(bus, graph);
    const u = voltages.get(bus)?.u_kv;
    if (motor && u !== undefined) {
      const limit = motorCapacitorLimit(motor, u);
      const perMotor =
        onBus.reduce((s, r) => s + installedCapacitorKvar(r, hz), 0) / Math.max(unitsRunning(motor), 1);
      if (limit !== undefined && perMotor > limit.kvar * (1 + 1e-9)) {
        const first = onBus[0] as EquipmentRow;
        out.push(
          designWarning(
            'error',
            'self-excitation',
            { bus, row: first.row, column: 'q_kvar', tag: first.tag },
            `capacitors switched with motor ${motor.tag} give ${f(perMotor)} kvar per motor, above KVAR.MOTORCAP.MAX = ${f(limit.kvar)} kvar (90 % of its no-load kvar${assumedI0Text(motor, limit)}): the motor can self-excite when switched off; reduce the capacitor or switch it separately`,
          ),
        );
      }
    }
  }
  return out;
}

/** Capacitors rated below the rule (rated voltage ≥ 1.1 × the voltage across them): a warning naming the rating wanted. */
export function ratingMarginWarning(
  what: string,
  where: Parameters<typeof designWarning>[2],
  uCapKv: number,
  uRatedKv: number,
  pPct: number,
  hz: number,
): DesignWarning {
  const across = pPct > 0 ? ` with ${formatNumber(pPct)} % detuning` : '';
  return designWarning(
    'warning',
    'capacitor-rating-margin',
    where,
    `${what} is rated ${formatNumber(uRatedKv)} kV, less than ${1 + CAP_VOLTAGE_MARGIN} × the ${f(uCapKv, 3)} kV across it${across} (CAPBANK.UCAP): harmonics and a rise of the supply voltage leave it no margin; choose at least ${formatNumber(capacitorRatedVoltage(uCapKv, hz))} kV`,
  );
}

function checkResonance(
  bus: string,
  plain: readonly EquipmentRow[],
  sc: BusShortCircuit | undefined,
  hz: number,
): DesignWarning[] {
  if (plain.length === 0) return [];
  const q = plain.reduce((s, r) => s + installedCapacitorKvar(r, hz), 0);
  if (!sc) {
    return [
      designWarning(
        'info',
        'resonance-not-assessed',
        { bus },
        `resonance of the ${f(q)} kvar of plain capacitors on bus ${bus} not assessed: give the supply's short-circuit power (sscMva) in the settings`,
      ),
    ];
  }
  const h = resonanceOrderOf(sc.ssc_mva, q, 0);
  const n = h === undefined ? undefined : nearHarmonic(h);
  if (h === undefined || n === undefined) return [];
  const first = plain[0] as EquipmentRow;
  return [
    designWarning(
      'warning',
      'resonance',
      { bus, row: first.row, column: 'q_kvar', tag: first.tag },
      `${f(q)} kvar of plain capacitors on bus ${bus} (short-circuit power ${f(sc.ssc_mva, 2)} MVA${infiniteSupplyNote(sc)}) resonate at order ${h.toFixed(2)} (RESONANCE.ORDER), within ${RESONANCE_MARGIN * 100} % of the ${n}th harmonic: harmonic currents there are amplified; detune the bank or change its size`,
    ),
  ];
}
