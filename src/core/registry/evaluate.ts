// Argument validation and evaluation of one spec: the single path from raw cell values to a
// number or an error message. The engine plugin, the CLI and the site roll-up all call this.
import {
  isOptional,
  MAGNITUDE,
  type Args,
  type FunctionSpec,
  type Interval,
  type ParamSpec,
} from './spec.ts';
import { msg, withFunction } from './messages.ts';

/** What a cell can hand over: null is a blank cell, undefined an argument not given at all. */
export type RawArg = number | boolean | string | null | undefined;

export type Outcome =
  { readonly ok: true; readonly value: number } | { readonly ok: false; readonly message: string };

export function inMagnitude(x: number): boolean {
  const a = Math.abs(x);
  return a === 0 || (a >= MAGNITUDE.min && a <= MAGNITUDE.max);
}

export function inInterval(x: number, d: Interval | undefined): boolean {
  if (!d) return true;
  if (d.lo !== undefined && (d.loOpen ? !(x > d.lo) : !(x >= d.lo))) return false;
  if (d.hi !== undefined && (d.hiOpen ? !(x < d.hi) : !(x <= d.hi))) return false;
  return true;
}

type One = { ok: true; value: number | boolean | undefined } | { ok: false; message: string };

function coerceOne(pos: number, p: ParamSpec, raw: RawArg): One {
  const optional = isOptional(p);
  if (raw === undefined || (raw === null && optional)) return { ok: true, value: undefined };
  if (raw === null) return { ok: false, message: msg.blank(pos, p) };
  if (p.type === 'boolean') {
    if (typeof raw === 'boolean') return { ok: true, value: raw };
    if (raw === 0 || raw === 1) return { ok: true, value: raw === 1 };
    return { ok: false, message: msg.notABoolean(pos, p, raw) };
  }
  if (typeof raw !== 'number' || !Number.isFinite(raw))
    return { ok: false, message: msg.notANumber(pos, p, raw) };
  if (!inInterval(raw, p.domain)) return { ok: false, message: msg.outOfDomain(pos, p, raw) };
  if (!inMagnitude(raw)) return { ok: false, message: msg.outOfMagnitude(pos, p, raw) };
  return { ok: true, value: raw };
}

/** Fill defaults: constants, or the value of another (earlier or later) argument. */
function applyDefaults(spec: FunctionSpec, vals: Array<number | boolean | undefined>): void {
  const params = spec.params;
  for (let i = 0; i < params.length; i++) {
    const d = (params[i] as ParamSpec).default;
    if (vals[i] !== undefined || d === undefined) continue;
    if (typeof d === 'number' || typeof d === 'boolean') vals[i] = d;
    else if ('sameAs' in d) vals[i] = vals[params.findIndex((q) => q.name === d.sameAs)];
  }
}

/**
 * Validate raw arguments and compute. Never throws. The common case (a finite number inside the
 * parameter's domain) takes a short path; every other value goes through coerceOne, so the
 * messages are built only when there is something to report.
 */
export function evaluate(spec: FunctionSpec, raw: readonly RawArg[]): Outcome {
  const r = settle(spec, raw);
  return typeof r === 'number' ? { ok: true, value: r } : { ok: false, message: withFunction(spec.name, r) };
}

/**
 * evaluate's value, or NaN where evaluate gives an error (its values are always finite), for
 * callers that need the number alone at every row and ask evaluate for the message.
 */
export function evaluateValue(spec: FunctionSpec, raw: readonly RawArg[]): number {
  const r = settle(spec, raw);
  return typeof r === 'number' ? r : NaN;
}

/** The value, or what failed (the message without the function's name). */
function settle(spec: FunctionSpec, raw: readonly RawArg[]): number | string {
  try {
    const params = spec.params;
    if (raw.length > params.length) return msg.tooMany(params.length, raw.length);
    const vals: Array<number | boolean | undefined> = new Array<number | boolean | undefined>(params.length);
    let blank = false; // an argument left to its default
    for (let i = 0; i < params.length; i++) {
      const p = params[i] as ParamSpec;
      const r = raw[i];
      if (
        typeof r === 'number' &&
        p.type !== 'boolean' &&
        Number.isFinite(r) &&
        inInterval(r, p.domain) &&
        inMagnitude(r)
      ) {
        vals[i] = r;
        continue;
      }
      if (r === undefined && !isOptional(p)) {
        const required = params.filter((q) => !isOptional(q)).length;
        return raw.length < required
          ? msg.tooFew(required, raw.length) + '; ' + msg.missing(i + 1, p)
          : msg.missing(i + 1, p);
      }
      const one = coerceOne(i + 1, p, r);
      if (!one.ok) return one.message;
      vals[i] = one.value;
      if (one.value === undefined) blank = true;
    }
    if (blank) applyDefaults(spec, vals);
    const cross = spec.check?.(vals);
    if (cross) return cross;
    const value = spec.compute(vals as Args);
    if (!Number.isFinite(value)) return msg.notFinite(value);
    return value === 0 ? 0 : value;
  } catch (e) {
    return msg.internal(e);
  }
}

/** Convenience for code that wants a number and has already validated its inputs. */
export function evaluateOrThrow(spec: FunctionSpec, raw: readonly RawArg[]): number {
  const r = evaluate(spec, raw);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}
