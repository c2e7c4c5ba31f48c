// What the charts draw, read from the engine's values of the Buses and Compensation sheets by
// their header texts (row 0), so the charts follow whatever the sheets compute.

export type Grid = ReadonlyArray<ReadonlyArray<unknown>>;

export interface BusBar {
  readonly bus: string;
  /** kvar absorbed (≥ 0). */
  readonly absorbed: number;
  /** kvar delivered, as a magnitude (≥ 0). */
  readonly delivered: number;
  /** Net kvar in the load convention (absorbed − delivered). */
  readonly net: number;
}

export interface TrianglePoint {
  readonly p: number;
  readonly q: number;
}

export interface Triangle {
  readonly bus: string;
  readonly before: TrianglePoint;
  readonly after?: TrianglePoint;
}

export interface ChartData {
  readonly cases: readonly string[];
  readonly bars: ReadonlyMap<string, readonly BusBar[]>;
  readonly triangles: ReadonlyMap<string, Triangle>;
}

const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

function headerIndex(rows: Grid | undefined): Map<string, number> {
  const m = new Map<string, number>();
  (rows?.[0] ?? []).forEach((h, i) => {
    if (typeof h === 'string') m.set(h.trim().toLowerCase(), i);
  });
  return m;
}

/** Case names from the 'Q absorbed <case> (kvar)' headers of the Buses sheet, in sheet order. */
export function casesOf(buses: Grid | undefined): string[] {
  const out: string[] = [];
  for (const h of buses?.[0] ?? []) {
    const m = typeof h === 'string' ? /^Q absorbed (.+) \(kvar\)$/.exec(h.trim()) : null;
    if (m && !/^own items /.test(m[1] as string)) out.push(m[1] as string);
  }
  return out;
}

export function readChartData(buses: Grid | undefined, compensation: Grid | undefined): ChartData {
  const cases = casesOf(buses);
  const bh = headerIndex(buses);
  const ch = headerIndex(compensation);
  const bars = new Map<string, BusBar[]>();
  const triangles = new Map<string, Triangle>();
  const col = (m: Map<string, number>, header: string) => m.get(header.toLowerCase());
  for (const c of cases) {
    const iAbs = col(bh, `Q absorbed ${c} (kvar)`),
      iDel = col(bh, `Q delivered ${c} (kvar)`);
    const iQ = col(bh, `Q ${c} (kvar)`),
      iP = col(bh, `P ${c} (kW)`);
    const list: BusBar[] = [];
    // The bus list runs from row 2 to the first row without a bus name (notes may follow).
    for (const row of (buses ?? []).slice(1)) {
      const bus = row[0];
      if (typeof bus !== 'string' || bus.trim() === '') break;
      const absorbed = Math.abs(num(iAbs === undefined ? undefined : row[iAbs]) ?? 0);
      const delivered = Math.abs(num(iDel === undefined ? undefined : row[iDel]) ?? 0);
      const net = num(iQ === undefined ? undefined : row[iQ]) ?? absorbed - delivered;
      list.push({ bus, absorbed, delivered, net });
    }
    bars.set(c, list);
    // The point of connection is the first bus of the Buses sheet.
    const root = buses?.[1];
    const p = iP === undefined ? undefined : num(root?.[iP]);
    const q = iQ === undefined ? undefined : num(root?.[iQ]);
    if (typeof root?.[0] === 'string' && p !== undefined && q !== undefined) {
      const rootName = root[0];
      const iAfter = col(ch, `Q after ${c} (kvar)`);
      const compRow = (compensation ?? [])
        .slice(1)
        .find((r) => typeof r[0] === 'string' && r[0].toLowerCase() === rootName.toLowerCase());
      const qAfter = iAfter === undefined ? undefined : num(compRow?.[iAfter]);
      triangles.set(c, {
        bus: rootName,
        before: { p, q },
        ...(qAfter !== undefined ? { after: { p, q: qAfter } } : {}),
      });
    }
  }
  return { cases, bars, triangles };
}

/** cos φ of a point; undefined with no power at all. */
export function cosPhi(t: TrianglePoint): number | undefined {
  const s = Math.hypot(t.p, t.q);
  return s === 0 ? undefined : Math.abs(t.p) / s;
}

/** A round axis end at or above `x` (1, 2, 2.5, 5 × 10ⁿ). */
export function niceCeil(x: number): number {
  if (!(x > 0)) return 1;
  const e = Math.pow(10, Math.floor(Math.log10(x)));
  for (const m of [1, 2, 2.5, 5, 10]) if (m * e >= x) return m * e;
  return 10 * e;
}

/** At most `limit` bars stay readable: the point of connection (first), then the buses with the most kvar, in sheet order. */
export function busesToDraw(bars: readonly BusBar[], limit = 30): BusBar[] {
  if (bars.length <= limit) return [...bars];
  const [root, ...rest] = bars;
  const keep = new Set(
    [...rest].sort((a, b) => b.absorbed + b.delivered - (a.absorbed + a.delivered)).slice(0, limit - 1),
  );
  return [...(root ? [root] : []), ...rest.filter((b) => keep.has(b))];
}
