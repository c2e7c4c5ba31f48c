// Short-circuit power at every bus, for resonance and voltage-rise screening. The root has the
// supply's sscMva from the settings; below a transformer SC.MVA.XFMR puts its impedance in
// series (units in parallel: n·S at the same uk); below a line its reactance X = 2π·f·L·len
// adds U²/X in series. Reactances only, as in the catalogue function (IEC 60909-0 simplified).
import type { Site } from './model.ts';
import { runCall } from './calls.ts';
import { unitsRunning } from './cases.ts';
import type { BusGraph } from './graph.ts';

export interface BusShortCircuit {
  readonly ssc_mva: number;
  /** true when the supply's sscMva was not given and an infinite supply was assumed upstream. */
  readonly infiniteSupplyAssumed: boolean;
}

/** Short-circuit power per bus; absent for the root (and lines below it) when the supply's is not given. */
export function busShortCircuit(site: Site, graph: BusGraph): Map<string, BusShortCircuit> {
  const out = new Map<string, BusShortCircuit>();
  const hz = site.settings.hz;
  if (graph.root !== undefined && site.settings.sscMva !== undefined) {
    out.set(graph.root, { ssc_mva: site.settings.sscMva, infiniteSupplyAssumed: false });
  }
  for (const bus of graph.order) {
    const feeder = graph.feeder.get(bus);
    if (!feeder) continue;
    const up = out.get(feeder.bus);
    const n = Math.max(unitsRunning(feeder), 1);
    if (feeder.kind === 'transformer') {
      const s = feeder.values.s_kva;
      const uk = feeder.values.uk_pct;
      if (s === undefined || uk === undefined) continue;
      const r = runCall({
        fn: 'SC.MVA.XFMR',
        args: [s * n, uk, up?.ssc_mva],
        columns: ['s_kva', 'uk_pct', undefined],
      });
      if (r.ok)
        out.set(bus, {
          ssc_mva: r.value,
          infiniteSupplyAssumed: up === undefined || up.infiniteSupplyAssumed,
        });
    } else if (up !== undefined) {
      const { l_mh_km: l, len_km: len, u_kv: u } = feeder.values;
      if (l === undefined || len === undefined || u === undefined) continue;
      const xOhm = (2 * Math.PI * hz * l * 1e-3 * len) / n;
      out.set(bus, {
        ssc_mva: xOhm === 0 ? up.ssc_mva : 1 / (1 / up.ssc_mva + xOhm / (u * u)),
        infiniteSupplyAssumed: up.infiniteSupplyAssumed,
      });
    }
  }
  return out;
}
