// The built-in equipment sheets. Several kinds may share a sheet (capacitors and reactors);
// each kind file names its sheet.
import { defineSheet, input } from './spec.ts';

const common = [input('tag'), input('description'), input('bus')];
const units = [input('qty'), input('running')];
// The cross-section and temperature that give R when it is blank (lines and feeder cables).
const conductor = [input('cu_mm2'), input('al_mm2'), input('theta_c')];

export const MOTORS_SHEET = defineSheet({
  id: 'motors',
  name: 'Motors',
  purpose:
    "Motors: rated output, efficiency and cos φ in; electrical P (KW.MOTOR) and Q (KVAR.MOTOR) at each case's load factor out, times the units running.",
  inputs: [
    ...common,
    ...units,
    input('p_kw', 'Rated output (kW)'),
    input('eff'),
    input('cos_phi'),
    input('i0_pct'),
    input('u_kv'),
    input('supply'),
  ],
});

export const LOADS_SHEET = defineSheet({
  id: 'loads',
  name: 'Loads',
  purpose: 'Other loads: P = rated P × load factor, Q from cos φ (KVAR.LOAD), times the units running.',
  inputs: [...common, ...units, input('p_kw'), input('cos_phi'), input('u_kv'), input('supply')],
});

export const GENERATORS_SHEET = defineSheet({
  id: 'generators',
  name: 'Generators',
  purpose: 'Generators: they deliver P (negative in bus totals) and, over-excited, deliver kvar (KVAR.GEN).',
  inputs: [...common, ...units, input('p_kw'), input('cos_phi'), input('u_kv')],
});

export const TRANSFORMERS_SHEET = defineSheet({
  id: 'transformers',
  name: 'Transformers',
  purpose:
    'Transformers: each carries the apparent power of the bus it feeds and adds its losses at that loading (KW.XFMR.LOSS, KVAR.XFMR.MAG, KVAR.XFMR.LEAK) to its upstream bus, before and after compensation; units in parallel share the load.',
  inputs: [
    ...common,
    input('to_bus'),
    ...units,
    input('s_kva'),
    input('uk_pct'),
    input('p0_kw'),
    input('pk_kw'),
    input('i0_pct', 'No-load current (%)'),
    input('u_kv', 'U secondary (kV)'),
  ],
});

export const LINES_SHEET = defineSheet({
  id: 'lines',
  name: 'Lines',
  purpose:
    'Overhead lines: each carries the bus it feeds; series resistance loses kW with the load (KW.LINE.LOSS, R as given or from the cross-section by CABLE.R.CU / CABLE.R.AL), series reactance absorbs kvar with the load, charging delivers kvar (KVAR.LINE).',
  inputs: [
    ...common,
    input('to_bus'),
    ...units,
    input('u_kv'),
    input('r_ohm_km'),
    ...conductor,
    input('l_mh_km'),
    input('c_nf_km'),
    input('len_km'),
    input('i_rated_a'),
  ],
});

export const CABLES_SHEET = defineSheet({
  id: 'cables',
  name: 'Cables',
  purpose:
    'Cables: charging kvar delivered while energised (KVAR.CABLE); load factor 0 = de-energised in that case.',
  inputs: [...common, ...units, input('u_kv'), input('c_uf_km'), input('len_km')],
});

export const FEEDERS_SHEET = defineSheet({
  id: 'feeders',
  name: 'Feeders',
  purpose:
    'Feeder cables: each carries the bus it feeds like a line; series resistance loses kW (KW.LINE.LOSS, R as given or from the cross-section by CABLE.R.CU / CABLE.R.AL) and series reactance absorbs kvar (KVAR.SERIES, when X is given) with the load, charging delivers kvar (KVAR.CABLE, when C is given). A cable that feeds no bus stays on the Cables sheet.',
  inputs: [
    ...common,
    input('to_bus'),
    ...units,
    input('u_kv'),
    input('r_ohm_km'),
    ...conductor,
    input('x_ohm_km'),
    input('c_uf_km'),
    input('len_km'),
    input('i_rated_a'),
  ],
});

export const BANKS_SHEET = defineSheet({
  id: 'banks',
  name: 'Capacitors and reactors',
  purpose:
    'Capacitor steps and shunt reactors already on site: output at the operating voltage (KVAR.CAPBANK, KVAR.REACTOR); the load factor is the share of the nameplate switched in.',
  inputs: [
    ...common,
    input('kind'),
    ...units,
    input('q_kvar'),
    input('u_rated_kv'),
    input('u_kv'),
    input('p_pct'),
  ],
});
