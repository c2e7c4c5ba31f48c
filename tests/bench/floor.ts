// The floor: the same bus totals as the roll-up, computed by a plain loop over typed arrays.
// Nothing can be much faster than this, so it is the yardstick for the engine and the CLI.
// Supports the kinds the bench sites use (motor, load, cable, capacitor, transformer).
import type { Site } from '../../src/core/site/model.ts';

const KIND = { motor: 0, load: 1, cable: 2, capacitor: 3 } as const;

export interface FloorInput {
  readonly busNames: readonly string[];
  /** Shunt elements. */
  readonly kind: Uint8Array;
  readonly bus: Int32Array;
  readonly n: Float64Array;
  readonly a: Float64Array;
  readonly b: Float64Array;
  readonly c: Float64Array;
  readonly d: Float64Array;
  readonly loadByCase: Float64Array[];
  /** Transformers, children before parents. */
  readonly txFrom: Int32Array;
  readonly txTo: Int32Array;
  readonly txS: Float64Array;
  readonly txP0: Float64Array;
  readonly txPk: Float64Array;
  readonly txI0: Float64Array;
  readonly txUk: Float64Array;
  readonly hz: number;
}

/** Unpack a site into typed arrays (not timed: the engine's build is measured separately). */
export function prepareFloor(site: Site): FloorInput {
  const busIndex = new Map<string, number>();
  const idx = (b: string) => {
    let i = busIndex.get(b);
    if (i === undefined) busIndex.set(b, (i = busIndex.size));
    return i;
  };
  const shunts = site.equipment.filter((r) => r.kind in KIND);
  const txs = site.equipment.filter((r) => r.kind === 'transformer');
  const m = shunts.length;
  const f = (n: number) => new Float64Array(n);
  const inp = {
    kind: new Uint8Array(m),
    bus: new Int32Array(m),
    n: f(m),
    a: f(m),
    b: f(m),
    c: f(m),
    d: f(m),
    loadByCase: site.settings.cases.map(() => f(m)),
  };
  shunts.forEach((r, i) => {
    const v = r.values;
    inp.kind[i] = KIND[r.kind as keyof typeof KIND];
    inp.bus[i] = idx(r.bus);
    inp.n[i] = v.running ?? v.qty ?? 1;
    site.settings.cases.forEach(
      (c, k) => ((inp.loadByCase[k] as Float64Array)[i] = r.loads[c] ?? v.load ?? 1),
    );
    if (r.kind === 'motor') [inp.a[i], inp.b[i], inp.c[i]] = [v.p_kw ?? 0, v.eff ?? 1, v.cos_phi ?? 1];
    if (r.kind === 'load') [inp.a[i], inp.c[i]] = [v.p_kw ?? 0, v.cos_phi ?? 1];
    if (r.kind === 'cable') [inp.a[i], inp.b[i], inp.c[i]] = [v.u_kv ?? 0, v.c_uf_km ?? 0, v.len_km ?? 0];
    if (r.kind === 'capacitor')
      [inp.a[i], inp.b[i], inp.c[i], inp.d[i]] = [
        v.q_kvar ?? 0,
        v.u_rated_kv ?? 1,
        v.u_kv ?? v.u_rated_kv ?? 1,
        v.p_pct ?? 0,
      ];
  });
  // Order transformers deepest first: a transformer's to_bus must be complete before it is used.
  const depth = new Map<string, number>();
  const parent = new Map(txs.map((t) => [t.to_bus as string, t.bus]));
  const depthOf = (b: string): number => {
    const known = depth.get(b);
    if (known !== undefined) return known;
    const p = parent.get(b);
    const d = p === undefined ? 0 : depthOf(p) + 1;
    depth.set(b, d);
    return d;
  };
  const ordered = [...txs].sort((x, y) => depthOf(y.to_bus as string) - depthOf(x.to_bus as string));
  const t = ordered.length;
  const tx = {
    txFrom: new Int32Array(t),
    txTo: new Int32Array(t),
    txS: f(t),
    txP0: f(t),
    txPk: f(t),
    txI0: f(t),
    txUk: f(t),
  };
  ordered.forEach((r, i) => {
    tx.txFrom[i] = idx(r.bus);
    tx.txTo[i] = idx(r.to_bus as string);
    tx.txS[i] = r.values.s_kva ?? 1;
    tx.txP0[i] = r.values.p0_kw ?? 0;
    tx.txPk[i] = r.values.pk_kw ?? 0;
    tx.txI0[i] = r.values.i0_pct ?? 0;
    tx.txUk[i] = r.values.uk_pct ?? 0;
  });
  return { busNames: [...busIndex.keys()], ...inp, ...tx, hz: site.settings.hz };
}

const tanOf = (c: number) => Math.sqrt(1 - c * c) / c;

/** Bus totals (P, Q) of one case, including transformer losses, rolled up to the root. */
export function floorTotals(x: FloorInput, caseIndex: number): { p: Float64Array; q: Float64Array } {
  const nb = x.busNames.length;
  const p = new Float64Array(nb);
  const q = new Float64Array(nb);
  const load = x.loadByCase[caseIndex] as Float64Array;
  const w = 2 * Math.PI * x.hz;
  for (let i = 0; i < x.kind.length; i++) {
    const lf = load[i] as number;
    if (lf === 0) continue;
    const n = x.n[i] as number,
      a = x.a[i] as number,
      b = x.b[i] as number,
      c = x.c[i] as number;
    let dp = 0,
      dq = 0;
    switch (x.kind[i]) {
      case KIND.motor: {
        const qr = (a / b) * tanOf(c);
        dp = (a * lf) / b;
        dq = qr * (0.7 + 0.3 * lf * lf);
        break;
      }
      case KIND.load:
        dp = a * lf;
        dq = dp * tanOf(c);
        break;
      case KIND.cable:
        dq = (-w * b * c * a * a) / 1000;
        break;
      case KIND.capacitor: {
        const fr = x.hz / 50;
        const d = x.d[i] as number;
        dq = ((-a * (c / b) ** 2 * fr) / (1 - (d / 100) * fr * fr)) * lf;
        break;
      }
    }
    const k = x.bus[i] as number;
    p[k] = (p[k] as number) + n * dp;
    q[k] = (q[k] as number) + n * dq;
  }
  for (let j = 0; j < x.txFrom.length; j++) {
    const to = x.txTo[j] as number,
      from = x.txFrom[j] as number;
    const s = x.txS[j] as number,
      p0 = x.txP0[j] as number,
      pk = x.txPk[j] as number;
    const uk = x.txUk[j] as number,
      i0 = x.txI0[j] as number;
    const load = Math.hypot(p[to] as number, q[to] as number) / s;
    const ur = (100 * pk) / s;
    const qMag = Math.sqrt(((i0 / 100) * s) ** 2 - p0 * p0);
    const qLeak = (Math.sqrt(uk * uk - ur * ur) / 100) * s * load * load;
    p[from] = (p[from] as number) + (p[to] as number) + p0 + pk * load * load;
    q[from] = (q[from] as number) + (q[to] as number) + qMag + qLeak;
  }
  return { p, q };
}

/** The point of connection: the bus that feeds others and is fed by none (the only bus when there are no transformers). */
export function floorRootIndex(x: FloorInput): number {
  const fed = new Set(x.txTo);
  for (const from of x.txFrom) if (!fed.has(from)) return from;
  return 0;
}

/** The root's P and Q in every case, by the floor (unpacking included; not for timing). */
export function floorRoots(site: Site): { bus: string; p: number[]; q: number[] } {
  const x = prepareFloor(site);
  const root = floorRootIndex(x);
  const totals = site.settings.cases.map((_, k) => floorTotals(x, k));
  return {
    bus: x.busNames[root] as string,
    p: totals.map((t) => t.p[root] as number),
    q: totals.map((t) => t.q[root] as number),
  };
}
