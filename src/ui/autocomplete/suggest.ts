// Typing help for formulas, without the DOM: which function name is being typed at the cursor,
// which functions match it, what accepting one does to the text, and the signature of the call
// the cursor is in with the current argument marked.
import { CATALOGUE, findFunction } from '../../core/functions/index.ts';
import { describeInterval } from '../../core/registry/messages.ts';
import { isOptional, type FunctionSpec, type ParamSpec } from '../../core/registry/spec.ts';
// Straight from the modules it needs: the barrel would bring the parser and the expansion into
// the page's first download.
import { callAtCursor } from '../../io/formula/cursor.ts';
import { tokenize } from '../../io/formula/tokenize.ts';

export interface Suggestion {
  readonly name: string;
  /** One line: summary for catalogue functions, 'standard function' for the engine's own. */
  readonly detail: string;
  readonly catalogue: boolean;
}

export interface NameAtCursor {
  readonly start: number;
  readonly end: number;
  readonly prefix: string;
}

/** The function name being typed just before the cursor, if the text is a formula and it is one. */
export function nameAtCursor(text: string, cursor: number): NameAtCursor | undefined {
  if (!text.startsWith('=')) return undefined;
  const before = text.slice(0, cursor);
  const m = /[A-Za-z_][A-Za-z0-9_.]*$/.exec(before);
  if (!m) return undefined;
  const start = cursor - m[0].length;
  const prev = text[start - 1];
  if (prev !== undefined && !/[=(,;+\-*/^&<>%\s{]/.test(prev)) return undefined;
  // Not inside a string literal, and not a cell reference such as B12.
  const inside = tokenize(text).find((t) => t.start < cursor && cursor <= t.end);
  if (inside && (inside.kind === 'string' || (inside.kind === 'ref' && inside.end === cursor)))
    return undefined;
  let end = cursor;
  while (end < text.length && /[A-Za-z0-9_.]/.test(text[end] as string)) end++;
  return { start, end, prefix: m[0].toUpperCase() };
}

function rank(name: string, prefix: string): number {
  if (name.startsWith(prefix)) return 0;
  if (name.split('.').some((part) => part.startsWith(prefix))) return 1;
  return name.includes(prefix) ? 2 : -1;
}

/** Catalogue functions first, then standard ones; prefix matches before part matches. */
export function suggestions(prefix: string, standardNames: readonly string[] = [], limit = 12): Suggestion[] {
  const p = prefix.toUpperCase();
  if (p === '') return [];
  const ours = CATALOGUE.map((f) => ({ f, r: rank(f.name, p) }))
    .filter((x) => x.r >= 0)
    .sort((a, b) => a.r - b.r || a.f.name.localeCompare(b.f.name))
    .map(({ f }): Suggestion => ({ name: f.name, detail: f.summary, catalogue: true }));
  const taken = new Set(ours.map((s) => s.name));
  const standard = standardNames
    .filter((n) => !taken.has(n) && n.startsWith(p))
    .sort()
    .map((n): Suggestion => ({ name: n, detail: 'standard function', catalogue: false }));
  return [...ours, ...standard].slice(0, limit);
}

/** The text after accepting `name` for the word at the cursor, and where the cursor goes. */
export function accept(text: string, at: NameAtCursor, name: string): { text: string; cursor: number } {
  const hasParen = text[at.end] === '(';
  const insert = hasParen ? name : `${name}(`;
  const next = text.slice(0, at.start) + insert + text.slice(at.end);
  return { text: next, cursor: at.start + insert.length + (hasParen ? 1 : 0) };
}

export interface SignaturePart {
  readonly text: string;
  readonly active: boolean;
  readonly optional: boolean;
}

export interface Signature {
  readonly spec: FunctionSpec;
  readonly parts: readonly SignaturePart[];
  readonly argIndex: number;
  /** The argument in progress: its doc, unit and allowed range; undefined past the last one. */
  readonly current?: { readonly param: ParamSpec; readonly range: string; readonly default?: string };
}

export function paramLabel(p: ParamSpec): string {
  const unit = p.unit && p.unit !== '1' ? ` ${p.unit}` : '';
  return `${p.name}${unit}`;
}

function defaultText(p: ParamSpec): string | undefined {
  const d = p.default;
  if (d === undefined) return undefined;
  if (typeof d === 'number') return String(d);
  if (typeof d === 'boolean') return d ? 'TRUE' : 'FALSE';
  return 'sameAs' in d ? `same as ${d.sameAs}` : d.omitted;
}

export function signatureOf(spec: FunctionSpec, argIndex = -1): Signature {
  const parts: SignaturePart[] = spec.params.map((p, i) => ({
    text: isOptional(p) ? `[${paramLabel(p)}]` : paramLabel(p),
    active: i === argIndex,
    optional: isOptional(p),
  }));
  const param = spec.params[argIndex];
  const dflt = param ? defaultText(param) : undefined;
  return {
    spec,
    parts,
    argIndex,
    ...(param
      ? { current: { param, range: p2range(param), ...(dflt !== undefined ? { default: dflt } : {}) } }
      : {}),
  };
}

function p2range(p: ParamSpec): string {
  return p.type === 'boolean' ? 'TRUE or FALSE' : describeInterval(p.domain);
}

/** The catalogue call the cursor is in, with the argument in progress. */
export function signatureAtCursor(text: string, cursor: number): Signature | undefined {
  if (!text.startsWith('=')) return undefined;
  const call = callAtCursor(text, cursor);
  if (!call) return undefined;
  const spec = findFunction(call.name);
  return spec ? signatureOf(spec, call.argIndex) : undefined;
}

/** 'KVAR.MOTOR(p_out_kw kW, eff, …) → kvar' as one line of text. */
export function signatureText(spec: FunctionSpec): string {
  const args = signatureOf(spec)
    .parts.map((p) => p.text)
    .join(', ');
  const unit = spec.result.unit && spec.result.unit !== '1' ? ` → ${spec.result.unit}` : '';
  return `${spec.name}(${args})${unit}`;
}
