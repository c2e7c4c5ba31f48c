// Every message text a catalogue function can produce lives here, so wording stays one voice:
// "<FUNCTION>: argument <n> (<name>) <what is wrong>; got <value>".
import type { Interval, ParamSpec } from './spec.ts';

export function formatNumber(x: number): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? 'infinity' : '-infinity';
  return String(Number.parseFloat(x.toPrecision(12)));
}

/** "(0, 1]", "[0, 1.5]", "> 0", "≥ 0", "< 100", "any number". */
export function describeInterval(d: Interval | undefined): string {
  if (!d || (d.lo === undefined && d.hi === undefined)) return 'any number';
  if (d.lo !== undefined && d.hi !== undefined) {
    return `${d.loOpen ? '(' : '['}${formatNumber(d.lo)}, ${formatNumber(d.hi)}${d.hiOpen ? ')' : ']'}`;
  }
  if (d.lo !== undefined) return `${d.loOpen ? '>' : '≥'} ${formatNumber(d.lo)}`;
  return `${d.hiOpen ? '<' : '≤'} ${formatNumber(d.hi as number)}`;
}

/** "must be in (0, 1]" or "must be > 0". */
export function mustBe(d: Interval | undefined): string {
  const text = describeInterval(d);
  return text.startsWith('(') || text.startsWith('[') ? `must be in ${text}` : `must be ${text}`;
}

export function argLabel(position: number, p: ParamSpec): string {
  return `argument ${position} (${p.name})`;
}

export function describeGiven(v: unknown): string {
  if (typeof v === 'string') return `text "${v.length > 40 ? v.slice(0, 40) + '…' : v}"`;
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (typeof v === 'number') return formatNumber(v);
  if (v === null) return 'a blank cell';
  return String(v);
}

export const msg = {
  outOfDomain: (pos: number, p: ParamSpec, v: number) => `${argLabel(pos, p)} ${mustBe(p.domain)}; got ${formatNumber(v)}`,
  notANumber: (pos: number, p: ParamSpec, v: unknown) => `${argLabel(pos, p)} must be a number in ${p.unit}; got ${describeGiven(v)}`,
  notABoolean: (pos: number, p: ParamSpec, v: unknown) => `${argLabel(pos, p)} must be TRUE or FALSE; got ${describeGiven(v)}`,
  missing: (pos: number, p: ParamSpec) => `${argLabel(pos, p)} is missing`,
  blank: (pos: number, p: ParamSpec) => `${argLabel(pos, p)} is a blank cell; a value in ${p.unit} is required`,
  tooMany: (max: number, got: number) => `takes at most ${max} arguments; got ${got}`,
  tooFew: (min: number, got: number) => `needs at least ${min} arguments; got ${got}`,
  notFinite: (v: number) => `the result is not a finite number (${formatNumber(v)}); check the arguments`,
  internal: (e: unknown) => `internal error: ${e instanceof Error ? e.message : String(e)}`,
  /** A cross-argument rule, e.g. "argument 2 (p_kw) must not exceed argument 1 (s_kva); got 120 > 100". */
  relation: (text: string) => text,
} as const;

export function withFunction(name: string, tail: string): string {
  return `${name}: ${tail}`;
}
