// Every message text a catalogue function can produce lives here, so wording stays one voice:
// "<FUNCTION>: argument <n> (<name>) <what is wrong>; got <value>".
import { MAGNITUDE, type Interval, type ParamSpec } from './spec.ts';

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

/**
 * "a number in kW" for a quantity with a unit; for a plain ratio (unit '1') its allowed range
 * instead, "a number in (0, 1]" or "a number > 0" ("a number in 1" read as garbled).
 */
export function numberPhrase(p: ParamSpec): string {
  if (p.unit !== '1' && p.unit !== '') return `a number in ${p.unit}`;
  const range = describeInterval(p.domain);
  if (range === 'any number') return 'a number';
  return range.startsWith('(') || range.startsWith('[') ? `a number in ${range}` : `a number ${range}`;
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
  outOfDomain: (pos: number, p: ParamSpec, v: number) =>
    `${argLabel(pos, p)} ${mustBe(p.domain)}; got ${formatNumber(v)}`,
  outOfMagnitude: (pos: number, p: ParamSpec, v: number) =>
    `${argLabel(pos, p)} must be 0 or between ${formatNumber(MAGNITUDE.min)} and ${formatNumber(MAGNITUDE.max)} in size; got ${formatNumber(v)}`,
  notANumber: (pos: number, p: ParamSpec, v: unknown) =>
    `${argLabel(pos, p)} must be ${numberPhrase(p)}; got ${describeGiven(v)}`,
  notABoolean: (pos: number, p: ParamSpec, v: unknown) =>
    `${argLabel(pos, p)} must be TRUE or FALSE; got ${describeGiven(v)}`,
  missing: (pos: number, p: ParamSpec) => `${argLabel(pos, p)} is missing`,
  blank: (pos: number, p: ParamSpec) => `${argLabel(pos, p)} is a blank cell; ${numberPhrase(p)} is required`,
  tooMany: (max: number, got: number) => `takes at most ${max} arguments; got ${got}`,
  tooFew: (min: number, got: number) => `needs at least ${min} arguments; got ${got}`,
  notFinite: (v: number) => `the result is not a finite number (${formatNumber(v)}); check the arguments`,
  internal: (e: unknown) => `internal error: ${e instanceof Error ? e.message : String(e)}`,
  /** A cross-argument rule, e.g. "argument 2 (p_kw) must not exceed argument 1 (s_kva); got 120 > 100". */
  relation: (text: string) => text,
  /** A range where one value belongs; `what` is e.g. "a range of 2×3 cells" or "the range A1:B3". */
  notOneValue: (pos: number, p: ParamSpec, what: string) =>
    `${argLabel(pos, p)} must be one value or one cell; got ${what}`,
} as const;

export function withFunction(name: string, tail: string): string {
  return `${name}: ${tail}`;
}

/** One argument as a cross-argument message refers to it: its position, spec and value. */
export interface ArgValue {
  readonly position: number;
  readonly param: ParamSpec;
  readonly value: number;
}

/** ArgValue for the parameter at zero-based `index` of a spec's params. */
export function argAt(params: readonly ParamSpec[], index: number, value: number): ArgValue {
  const param = params[index];
  if (!param) throw new Error(`no parameter at index ${index}`);
  return { position: index + 1, param, value };
}

/** Builders for cross-argument rules (message tails, without "NAME: "). */
export const relation = {
  /** "argument 2 (p_kw) must not exceed argument 1 (s_kva); got 120 > 100" */
  notAbove: (a: ArgValue, b: ArgValue) =>
    `${argLabel(a.position, a.param)} must not exceed ${argLabel(b.position, b.param)}; got ${formatNumber(a.value)} > ${formatNumber(b.value)}`,
  /** "argument 3 (d_cond_mm) must be less than argument 2 (d_ins_mm); got 30 ≥ 25" */
  below: (a: ArgValue, b: ArgValue) =>
    `${argLabel(a.position, a.param)} must be less than ${argLabel(b.position, b.param)}; got ${formatNumber(a.value)} ≥ ${formatNumber(b.value)}`,
  /** "argument 3 (p0_kw) must not exceed i0/100·S = 10 (why); got 12" */
  notAboveLimit: (a: ArgValue, limitText: string, limit: number, why: string) =>
    `${argLabel(a.position, a.param)} must not exceed ${limitText} = ${formatNumber(limit)} (${why}); got ${formatNumber(a.value)}`,
  /** "argument 4 (pk_kw) must be below limitText = 60 (why); got 70" */
  belowLimit: (a: ArgValue, limitText: string, limit: number, why: string) =>
    `${argLabel(a.position, a.param)} must be below ${limitText} = ${formatNumber(limit)} (${why}); got ${formatNumber(a.value)}`,
} as const;
