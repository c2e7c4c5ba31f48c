// An independent recomputation of bus totals, straight from the published formulas, written out
// here on purpose: it imports nothing from src, so a slip in the catalogue or the roll-up cannot
// hide in both. Sources:
//   motor input P = P_out·x/η; Q(x) = Q0 + (Qr − Q0)·x², Qr = P_out/η·tan φ, Q0 = i0/100·P_out/(η·cos φ)
//     (or 0.7·Qr when i0 is not given: the catalogue's stated common-practice assumption);
//   a motor fed by a drive: Q = P·tan(acos DPF), DPF 0.96 behind a 6-pulse drive, 1 behind an
//     active front end (common practice, from memory: 6-pulse drives draw 0.95–0.98);
//   load Q = P·tan φ; generator Q = −P·tan φ (over-excited); power triangle S² = P² + Q²
//     (IEC 60050-131);
//   transformer: losses P0 + Pk·(S/Sr)², magnetising √((i0/100·Sr)² − P0²),
//     leakage √(uk² − ur²)/100·Sr·(S/Sr)², ur = 100·Pk/Sr (IEC 60076-1 quantities);
//   cable charging ω·C·U² (U line-to-line), capacitor Qr·(U/Ur)²/(1 − p/100), reactor Qr·(U/Ur)²;
//   line 3·I²·R in kW and 3·I²·X − ω·C·U² in kvar with I = S/(√3·U).
// Semantics as stated in src/core/site/cases.ts: per unit × running; load 0 = off;
// capacitor/reactor load = share in service; transformers with n units share the load.

export interface HandRow {
  tag: string;
  bus: string;
  kind: string;
  to_bus?: string;
  supply?: string;
  [key: string]: string | number | undefined;
}

export interface HandTotals {
  p: number;
  q: number;
  s: number;
}

const tanOf = (cos: number) => Math.sqrt(1 - cos * cos) / cos;
const n = (r: HandRow, k: string): number | undefined =>
  typeof r[k] === 'number' ? (r[k] as number) : undefined;

function loadOf(r: HandRow, caseName: string): number {
  return n(r, `load:${caseName}`) ?? n(r, 'load') ?? 1;
}

/** P and Q of one shunt item in a case (all running units), kW and kvar, load reference. */
export function itemPower(r: HandRow, caseName: string, hz: number): { p: number; q: number } {
  const units = n(r, 'running') ?? n(r, 'qty') ?? 1;
  const x = loadOf(r, caseName);
  if (x === 0) return { p: 0, q: 0 };
  const g = (k: string) => n(r, k) as number;
  switch (r.kind) {
    case 'motor': {
      const fed = (r.supply ?? '').replace(/-/g, ' ').replace(/ +/g, ' ').trim().toLowerCase();
      const dpf = fed === 'vsd 6 pulse' ? 0.96 : fed === 'vsd afe' ? 1 : undefined;
      if (dpf !== undefined) {
        const p = units * ((g('p_kw') * x) / g('eff'));
        return { p, q: p * tanOf(dpf) };
      }
      const qr = (g('p_kw') / g('eff')) * tanOf(g('cos_phi'));
      const i0 = n(r, 'i0_pct');
      const q0 = i0 === undefined ? 0.7 * qr : (i0 / 100) * (g('p_kw') / (g('eff') * g('cos_phi')));
      return { p: units * ((g('p_kw') * x) / g('eff')), q: units * (q0 + (qr - q0) * x * x) };
    }
    case 'load':
      return { p: units * g('p_kw') * x, q: units * g('p_kw') * x * tanOf(g('cos_phi')) };
    case 'generator':
      return { p: -units * g('p_kw') * x, q: -units * g('p_kw') * x * tanOf(g('cos_phi')) };
    case 'cable':
      return {
        p: 0,
        q: (-units * 2 * Math.PI * hz * g('c_uf_km') * 1e-6 * g('len_km') * (g('u_kv') * 1e3) ** 2) / 1e3,
      };
    case 'capacitor': {
      const u = n(r, 'u_kv') ?? g('u_rated_kv');
      const p = (n(r, 'p_pct') ?? 0) / 100;
      return { p: 0, q: (-units * x * g('q_kvar') * (u / g('u_rated_kv')) ** 2) / (1 - p) };
    }
    case 'reactor': {
      const u = n(r, 'u_kv') ?? g('u_rated_kv');
      return { p: 0, q: units * x * g('q_kvar') * (u / g('u_rated_kv')) ** 2 };
    }
    default:
      throw new Error(`handCalc: ${r.kind} is not a shunt item`);
  }
}

/** Losses of a transformer or line carrying sKva (all units), kW and kvar. */
export function branchLosses(r: HandRow, sKva: number, hz: number): { p: number; q: number } {
  const units = n(r, 'running') ?? n(r, 'qty') ?? 1;
  const g = (k: string) => n(r, k) as number;
  if (r.kind === 'transformer') {
    const sr = g('s_kva');
    const ratio = sKva / units / sr;
    const ur = (100 * g('pk_kw')) / sr;
    const mag = Math.sqrt(((g('i0_pct') / 100) * sr) ** 2 - g('p0_kw') ** 2);
    const leak = (Math.sqrt(g('uk_pct') ** 2 - ur ** 2) / 100) * sr * ratio * ratio;
    return { p: units * (g('p0_kw') + g('pk_kw') * ratio * ratio), q: units * (mag + leak) };
  }
  // Line: per circuit, series 3·I²·R (none counted when R is blank) and 3·I²·X minus charging ω·C·U².
  const u = g('u_kv') * 1e3;
  const i = ((sKva / units) * 1e3) / (Math.sqrt(3) * u);
  const x = 2 * Math.PI * hz * g('l_mh_km') * 1e-3 * g('len_km');
  const resistance = (n(r, 'r_ohm_km') ?? 0) * g('len_km');
  const charging = 2 * Math.PI * hz * g('c_nf_km') * 1e-9 * g('len_km') * u * u;
  return { p: (units * 3 * i * i * resistance) / 1e3, q: (units * (3 * i * i * x - charging)) / 1e3 };
}

/** Totals of every bus (own items, fed buses and their feeders' losses), by recursion from the leaves. */
export function handTotals(rows: readonly HandRow[], caseName: string, hz: number): Map<string, HandTotals> {
  const out = new Map<string, HandTotals>();
  const total = (bus: string): HandTotals => {
    const known = out.get(bus);
    if (known) return known;
    let p = 0;
    let q = 0;
    for (const r of rows.filter((x) => x.bus === bus)) {
      if (r.kind === 'transformer' || r.kind === 'line') {
        const child = total(r.to_bus as string);
        const l = branchLosses(r, child.s, hz);
        p += child.p + l.p;
        q += child.q + l.q;
      } else {
        const e = itemPower(r, caseName, hz);
        p += e.p;
        q += e.q;
      }
    }
    const t = { p, q, s: Math.sqrt(p * p + q * q) };
    out.set(bus, t);
    return t;
  };
  for (const r of rows) total(r.bus);
  return out;
}
