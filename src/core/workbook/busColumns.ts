// The columns of the Buses sheet: the bus and what feeds it, then per case the totals before
// compensation, the totals after it (banks and reactors in, losses at the compensated loading),
// and the bus's own items.
import type { ColumnInfo } from './document.ts';
import { BUS_HEADERS, FORMATS } from './layout.ts';

export interface BusColumns {
  readonly bus: 0;
  readonly level: 1;
  readonly fedBy: 2;
  readonly upstream: 3;
  readonly u: 4;
  readonly p: readonly number[];
  readonly q: readonly number[];
  readonly qAbs: readonly number[];
  readonly qDel: readonly number[];
  readonly s: readonly number[];
  readonly cos: readonly number[];
  readonly tan: readonly number[];
  readonly sense: readonly number[];
  readonly pAfter: readonly number[];
  readonly qAfter: readonly number[];
  readonly qAbsAfter: readonly number[];
  readonly qDelAfter: readonly number[];
  readonly sAfter: readonly number[];
  readonly cosAfter: readonly number[];
  readonly pOwn: readonly number[];
  readonly qAbsOwn: readonly number[];
  readonly qDelOwn: readonly number[];
  readonly qOwn: readonly number[];
  /** tan φ after compensation per case, Q after ÷ P after (signed: negative leading). */
  readonly tanAfter: readonly number[];
  readonly columns: readonly ColumnInfo[];
}

export function planBusColumns(cases: readonly string[]): BusColumns {
  const columns: ColumnInfo[] = [
    { header: BUS_HEADERS.bus, width: 14 },
    { header: BUS_HEADERS.level, format: FORMATS.count, width: 6 },
    { header: BUS_HEADERS.fedBy, width: 12 },
    { header: BUS_HEADERS.upstream, width: 14 },
    { header: BUS_HEADERS.u, format: FORMATS.kv, width: 8, computed: true },
  ];
  const add = (header: string, format: string | undefined, width: number) =>
    columns.push({
      header,
      ...(format ? { format } : {}),
      width: Math.max(width, Math.min(header.length + 1, 18)),
      computed: true,
    }) - 1;
  const per = (header: (c: string) => string, format: string | undefined, width: number) =>
    cases.map((c) => add(header(c), format, width));
  const [p, q, qAbs, qDel, s, cos, tan, sense] = Array.from({ length: 8 }, () => [] as number[]) as [
    number[],
    number[],
    number[],
    number[],
    number[],
    number[],
    number[],
    number[],
  ];
  for (const c of cases) {
    p.push(add(BUS_HEADERS.p(c), FORMATS.kw, 10));
    q.push(add(BUS_HEADERS.q(c), FORMATS.kvar, 10));
    qAbs.push(add(BUS_HEADERS.qAbs(c), FORMATS.kvar, 10));
    qDel.push(add(BUS_HEADERS.qDel(c), FORMATS.kvar, 10));
    s.push(add(BUS_HEADERS.s(c), FORMATS.kva, 10));
    cos.push(add(BUS_HEADERS.cos(c), FORMATS.pf, 8));
    tan.push(add(BUS_HEADERS.tan(c), FORMATS.pf, 8));
    sense.push(add(BUS_HEADERS.sense(c), undefined, 9));
  }
  const after = {
    pAfter: [] as number[],
    qAfter: [] as number[],
    qAbsAfter: [] as number[],
    qDelAfter: [] as number[],
    sAfter: [] as number[],
    cosAfter: [] as number[],
  };
  for (const c of cases) {
    after.pAfter.push(add(BUS_HEADERS.pAfter(c), FORMATS.kw, 10));
    after.qAfter.push(add(BUS_HEADERS.qAfter(c), FORMATS.kvar, 10));
    after.qAbsAfter.push(add(BUS_HEADERS.qAbsAfter(c), FORMATS.kvar, 10));
    after.qDelAfter.push(add(BUS_HEADERS.qDelAfter(c), FORMATS.kvar, 10));
    after.sAfter.push(add(BUS_HEADERS.sAfter(c), FORMATS.kva, 10));
    after.cosAfter.push(add(BUS_HEADERS.cosAfter(c), FORMATS.pf, 8));
  }
  const pOwn = per(BUS_HEADERS.pOwn, FORMATS.kw, 10);
  const qAbsOwn = per(BUS_HEADERS.qAbsOwn, FORMATS.kvar, 10);
  const qDelOwn = per(BUS_HEADERS.qDelOwn, FORMATS.kvar, 10);
  const qOwn = per(BUS_HEADERS.qOwn, FORMATS.kvar, 10);
  // Last, so the columns of workbooks saved before it (and values typed over them) stay put.
  const tanAfter = per(BUS_HEADERS.tanAfter, FORMATS.pf, 8);
  return {
    bus: 0,
    level: 1,
    fedBy: 2,
    upstream: 3,
    u: 4,
    p,
    q,
    qAbs,
    qDel,
    s,
    cos,
    tan,
    sense,
    ...after,
    pOwn,
    qAbsOwn,
    qDelOwn,
    qOwn,
    tanAfter,
    columns,
  };
}
