// Header words that clients' equipment lists use for our interchange columns. Our own table,
// gathered from common practice in tender documents; compared after normalising (lower case,
// punctuation to spaces, units removed), so 'Tag No.' and 'tag no' are the same entry.

export const HEADER_SYNONYMS: Readonly<Record<string, readonly string[]>> = {
  tag: ['tag', 'tag no', 'tag number', 'tag nr', 'tag id', 'item', 'item no', 'item number', 'item tag', 'equipment tag', 'equipment no', 'equipment number', 'equipment id', 'id', 'ref', 'ref no', 'reference', 'designation', 'kks', 'consumer no', 'load no', 'load tag', 'motor tag', 'position', 'pos'],
  description: ['description', 'desc', 'name', 'equipment name', 'equipment description', 'item description', 'service', 'duty', 'title', 'consumer', 'load description', 'remarks', 'comment', 'comments'],
  bus: ['bus', 'busbar', 'bus bar', 'bus name', 'board', 'switchboard', 'switch board', 'panel', 'mcc', 'fed from', 'supplied from', 'supply from', 'source', 'source bus', 'from bus', 'from', 'connected to', 'upstream bus', 'feeder', 'distribution board', 'db'],
  kind: ['kind', 'type', 'equipment type', 'item type', 'category', 'class', 'load type', 'consumer type', 'element', 'element type'],
  qty: ['qty', 'quantity', 'no off', 'nos', 'no of units', 'number of units', 'units', 'count', 'installed', 'installed qty', 'installed quantity', 'number installed', 'total qty'],
  running: ['running', 'running qty', 'running quantity', 'in service', 'duty qty', 'operating', 'operating qty', 'working', 'working qty', 'number running', 'no running', 'in operation'],
  p_kw: ['p', 'power', 'rated power', 'motor power', 'motor', 'motor rating', 'motor output', 'active power', 'output', 'rated output', 'shaft power', 'mechanical power', 'absorbed power', 'installed power', 'load power', 'consumed power', 'demand', 'kw rating', 'power rating', 'rating', 'pn', 'p rated', 'generator power'],
  eff: ['eff', 'efficiency', 'eta', 'η', 'motor efficiency', 'rated efficiency', 'full load efficiency'],
  cos_phi: ['cos phi', 'cosphi', 'cos φ', 'cosφ', 'cos ϕ', 'cos', 'pf', 'p f', 'power factor', 'rated power factor', 'displacement power factor', 'dpf', 'full load pf', 'full load power factor'],
  load: ['load', 'load factor', 'lf', 'loading', 'utilisation', 'utilization', 'utilisation factor', 'utilization factor', 'usage factor', 'duty factor', 'load ratio', 'load fraction'],
  i0_pct: ['i0', 'io', 'i0 pct', 'no load current', 'noload current', 'magnetising current', 'magnetizing current', 'excitation current', 'idle current'],
  s_kva: ['s', 'apparent power', 'rated apparent power', 'kva rating', 'transformer rating', 'transformer size', 'sn', 's rated', 'nameplate kva', 'capacity'],
  uk_pct: ['uk', 'ukr', 'u k', 'z', '%z', 'pct z', 'impedance', 'impedance voltage', 'short circuit impedance', 'short circuit voltage', 'vk', 'ez', 'zk'],
  p0_kw: ['p0', 'po', 'no load loss', 'no load losses', 'noload loss', 'iron loss', 'iron losses', 'core loss', 'core losses', 'fe loss'],
  pk_kw: ['pk', 'pcu', 'load loss', 'load losses', 'copper loss', 'copper losses', 'short circuit loss', 'short circuit losses', 'cu loss'],
  to_bus: ['to bus', 'to', 'feeds', 'feeding', 'secondary bus', 'downstream bus', 'load bus', 'to board', 'supplies', 'destination'],
  u_kv: ['u', 'un', 'voltage', 'rated voltage', 'operating voltage', 'system voltage', 'nominal voltage', 'bus voltage', 'supply voltage', 'line voltage', 'u operating'],
  c_uf_km: ['c', 'capacitance', 'cable capacitance', 'c per km', 'capacitance per km', 'cable c'],
  len_km: ['len', 'length', 'route length', 'cable length', 'line length', 'distance', 'run length'],
  l_mh_km: ['l', 'inductance', 'line inductance', 'l per km', 'inductance per km'],
  c_nf_km: ['line capacitance', 'line c', 'overhead line capacitance'],
  q_kvar: ['q', 'reactive power', 'rated reactive power', 'kvar rating', 'bank size', 'bank rating', 'capacitor rating', 'reactor rating', 'capacitor size', 'qn', 'q rated', 'nameplate kvar', 'compensation'],
  u_rated_kv: ['u rated', 'ur', 'capacitor voltage', 'capacitor rated voltage', 'rated capacitor voltage', 'nameplate voltage', 'bank rated voltage', 'design voltage'],
  p_pct: ['p pct', 'detuning', 'detuning factor', 'detuning ratio', 'detuning percent', 'reactor ratio', 'tuning factor', 'choke factor', 'blocking factor', 'p factor'],
};

/** Lower case; φ/ϕ to 'phi', η kept; punctuation to spaces; runs of spaces collapsed. */
export function normaliseWords(text: string): string {
  return text
    .toLowerCase()
    .replace(/[φϕ]/g, ' phi ')
    .replace(/[_\-./:;,#'"*()[\]{}|\\]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

const INDEX: ReadonlyMap<string, string> = (() => {
  const m = new Map<string, string>();
  for (const [target, words] of Object.entries(HEADER_SYNONYMS)) {
    for (const w of words) {
      const key = normaliseWords(w);
      if (!m.has(key)) m.set(key, target);
    }
  }
  return m;
})();

/** The target a normalised header name stands for, by our synonym table. */
export function targetBySynonym(name: string): string | undefined {
  return INDEX.get(normaliseWords(name));
}
