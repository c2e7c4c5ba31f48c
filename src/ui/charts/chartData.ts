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
  /** The engine gave an error instead of a number for this bus: the code and message. */
  readonly error?: string;
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
  /** Per case: why the point of connection has no triangle (its P or Q is an error). */
  readonly triangleErrors: ReadonlyMap<string, string>;
}

const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** An engine error value (code like '#N/A' and its message), or undefined for anything else. */
export function cellError(v: unknown): { code: string; message: string } | undefined {
  if (typeof v !== 'object' || v === null) return undefined;
  const code = (v as { value?: unknown }).value;
  if (typeof code !== 'string' || !code.startsWith('#')) return undefined;
  const message = (v as { message?: unknown }).message;
  return {
    code,
    message: typeof message === 'string' && message !== '' ? message : `the formula evaluates to ${code}`,
  };
}

function firstError(
  row: ReadonlyArray<unknown>,
  cols: ReadonlyArray<number | undefined>,
): string | undefined {
  for (const c of cols) {
    const e = c === undefined ? undefined : cellError(row[c]);
    if (e) return `${e.code} ${e.message}`;
  }
  return undefined;
}

function headerIndex(rows: Grid | undefined): Map<string, number> {
  const m = new Map<string, number>();
  (rows?.[0] ?? []).forEach((h, i) => {
    if (typeof h === 'string') m.set(h.trim().toLowerCase(), i);
  });
  return m;
}

/**
 * Case names from the 'Q absorbed <case> (kvar)' headers of the Buses sheet, in sheet order. The
 * sheet also has 'Q absorbed after <case> (kvar)' for each case: a name is that column when
 * "after " + a case found too (a case may itself be called "after hours").
 */
export function casesOf(buses: Grid | undefined): string[] {
  const all: string[] = [];
  for (const h of buses?.[0] ?? []) {
    const m = typeof h === 'string' ? /^Q absorbed (.+) \(kvar\)$/.exec(h.trim()) : null;
    if (m && !/^own items /.test(m[1] as string)) all.push(m[1] as string);
  }
  return all.filter((c) => !(c.startsWith('after ') && all.includes(c.slice('after '.length))));
}

export function readChartData(buses: Grid | undefined, compensation: Grid | undefined): ChartData {
  const cases = casesOf(buses);
  const bh = headerIndex(buses);
  const ch = headerIndex(compensation);
  const bars = new Map<string, BusBar[]>();
  const triangles = new Map<string, Triangle>();
  const triangleErrors = new Map<string, string>();
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
      // An error is shown as an error, never as 0 kvar.
      const error = firstError(row, [iAbs, iDel, iQ]);
      list.push(
        error ? { bus, absorbed: 0, delivered: 0, net: 0, error } : { bus, absorbed, delivered, net },
      );
    }
    bars.set(c, list);
    // The point of connection is the first bus of the Buses sheet.
    const root = buses?.[1];
    const p = iP === undefined ? undefined : num(root?.[iP]);
    const q = iQ === undefined ? undefined : num(root?.[iQ]);
    const rootError = root ? firstError(root, [iP, iQ]) : undefined;
    if (rootError && typeof root?.[0] === 'string') triangleErrors.set(c, `${root[0]}: ${rootError}`);
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
  return { cases, bars, triangles, triangleErrors };
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
  // Buses in error come first: a hidden error would read as a quiet bus.
  const weight = (b: BusBar) => (b.error ? Number.MAX_VALUE : b.absorbed + b.delivered);
  const keep = new Set([...rest].sort((a, b) => weight(b) - weight(a)).slice(0, limit - 1));
  return [...(root ? [root] : []), ...rest.filter((b) => keep.has(b))];
}
