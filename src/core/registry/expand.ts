// A spec's plain-formula expansion with generated domain guards, so that another spreadsheet
// program errors (#N/A) exactly where the catalogue function errors.
import { isOptional, type ArgTexts, type FunctionSpec, type ParamSpec } from './spec.ts';
import { formatNumber } from './messages.ts';

/** Matches a bare cell reference like A1, $B$2 or Sheet1!C3 / 'My sheet'!C3 (not a range). */
const CELL_REF = /^(?:(?:'(?:[^']|'')+'|[A-Za-z_][\w.]*)!)?\$?[A-Za-z]{1,3}\$?\d+$/;
export function isCellReference(text: string): boolean {
  return CELL_REF.test(text.trim());
}

function domainGuards(t: string, p: ParamSpec): string[] {
  const out: string[] = [];
  const d = p.domain;
  if (p.type === 'boolean' || !d) return out;
  if (d.lo !== undefined) out.push(`${t}${d.loOpen ? '<=' : '<'}${formatNumber(d.lo)}`);
  if (d.hi !== undefined) out.push(`${t}${d.hiOpen ? '>=' : '>'}${formatNumber(d.hi)}`);
  return out;
}

/**
 * Expand one call. `args` are the argument formula texts (already expanded and parenthesised
 * where needed); undefined for arguments not given. A bare cell reference given for an optional
 * argument is treated like the engine treats it: blank means "use the default".
 */
export function expandCall(spec: FunctionSpec, args: ArgTexts): string {
  const blankOptional = spec.params.findIndex((p, i) => isOptional(p) && args[i] !== undefined && isCellReference(args[i] as string));
  if (blankOptional >= 0) {
    const ref = args[blankOptional] as string;
    const without = args.map((a, i) => (i === blankOptional ? undefined : a));
    return `IF(ISBLANK(${ref}),${expandCall(spec, without)},${expandCall(spec, args.map((a, i) => (i === blankOptional ? `(${ref}+0)` : a)))})`;
  }
  const texts: Array<string | undefined> = spec.params.map((_, i) => args[i]);
  // Defaults: constants become literals; sameAs copies the other argument's text.
  spec.params.forEach((p, i) => {
    if (texts[i] !== undefined || p.default === undefined) return;
    const d = p.default;
    if (typeof d === 'number') texts[i] = formatNumber(d);
    else if (typeof d === 'boolean') texts[i] = d ? 'TRUE' : 'FALSE';
    else if ('sameAs' in d) texts[i] = texts[spec.params.findIndex((q) => q.name === d.sameAs)];
  });
  const guards: string[] = [];
  spec.params.forEach((p, i) => {
    const t = texts[i];
    if (t === undefined) return;
    if (!isOptional(p) && isCellReference(t)) guards.push(`ISBLANK(${t})`);
    guards.push(...domainGuards(t, p));
  });
  // Cross-argument guards only run once every argument passed its own guards, as in evaluate:
  // they may divide by an argument, and OR would pass that error on instead of giving NA().
  const cross = spec.expandGuards?.(texts) ?? [];
  const checked = cross.length === 0 ? spec.expand(texts) : `IF(OR(${cross.join(',')}),NA(),${spec.expand(texts)})`;
  if (guards.length === 0) return checked;
  return `IF(OR(${guards.join(',')}),NA(),${checked})`;
}

export { isOptional };
