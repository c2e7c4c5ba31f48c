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

/** An optional argument whose default is "omitted" changes the formula itself, not a value. */
function defaultIsOmitted(p: ParamSpec): boolean {
  return typeof p.default === 'object' && 'omitted' in p.default;
}

/**
 * Expand one call. `args` are the argument formula texts (already expanded and parenthesised
 * where needed); undefined for arguments not given. A bare cell reference given for an optional
 * argument is treated like the engine treats it: blank means "use the default".
 */
export function expandCall(spec: FunctionSpec, args: ArgTexts): string {
  // A blank reference for an "omitted" default selects a different formula: split the call.
  const blankOmitted = spec.params.findIndex(
    (p, i) => defaultIsOmitted(p) && args[i] !== undefined && isCellReference(args[i] as string),
  );
  if (blankOmitted >= 0) {
    const ref = args[blankOmitted] as string;
    const without = args.map((a, i) => (i === blankOmitted ? undefined : a));
    return `IF(ISBLANK(${ref}),${expandCall(spec, without)},${expandCall(
      spec,
      args.map((a, i) => (i === blankOmitted ? `(${ref}+0)` : a)),
    )})`;
  }
  const texts: Array<string | undefined> = spec.params.map((_, i) => args[i]);
  const defaultText = (p: ParamSpec, bool: (b: boolean) => string): string | undefined => {
    const d = p.default;
    if (typeof d === 'number') return formatNumber(d);
    if (typeof d === 'boolean') return bool(d);
    if (d && 'sameAs' in d) return texts[spec.params.findIndex((q) => q.name === d.sameAs)];
    return undefined;
  };
  // Defaults of arguments not given: constants become literals; sameAs copies the other text.
  spec.params.forEach((p, i) => {
    if (texts[i] === undefined) texts[i] = defaultText(p, (b) => (b ? 'TRUE' : 'FALSE'));
  });
  // A blank reference for a constant or sameAs default: the value is chosen inline, which keeps
  // the formula linear in the number of such arguments (splitting the call doubled it for each).
  spec.params.forEach((p, i) => {
    const t = args[i];
    if (!isOptional(p) || t === undefined || !isCellReference(t)) return;
    const fallback = defaultText(p, (b) => (b ? 'TRUE()' : 'FALSE()'));
    if (fallback !== undefined) texts[i] = `IF(ISBLANK(${t}),${fallback},${t})`;
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
  const checked =
    cross.length === 0 ? spec.expand(texts) : `IF(OR(${cross.join(',')}),NA(),${spec.expand(texts)})`;
  if (guards.length === 0) return checked;
  return `IF(OR(${guards.join(',')}),NA(),${checked})`;
}

export { isOptional };
