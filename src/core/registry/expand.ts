// A spec's plain-formula expansion with generated guards, so that another spreadsheet program
// errors (#N/A) exactly where the catalogue function errors. The rules (ARGUMENT_RULES) are the
// engine's (evaluate.ts), written as formulas:
//   IF(OR(type guards),NA(),IF(OR(domain and size guards),NA(),IF(OR(cross guards),NA(),formula)))
// Each IF is taken only when the one before passed, so a size guard may use ABS (text would
// make it an error) and a cross guard may divide by an argument.
import { isOptional, MAGNITUDE, type ArgTexts, type FunctionSpec, type ParamSpec } from './spec.ts';
import { formatNumber } from './messages.ts';

/** How every catalogue function reads its arguments, in the engine and in the expansion alike. */
export const ARGUMENT_RULES: readonly string[] = [
  `A number argument takes a number: a number typed in the formula, a cell holding a number, or a formula that gives one. TRUE and FALSE, text (also text that looks like a number, such as "50") and a blank cell for a required argument give #N/A with a message naming the argument.`,
  `A number must lie in the argument's allowed range and be 0 or between ${formatNumber(MAGNITUDE.min)} and ${formatNumber(MAGNITUDE.max)} in size; beyond that no physical quantity of the catalogue lies, and the plain formula in another program would overflow where the function does not.`,
  'A TRUE/FALSE argument takes TRUE or FALSE, or the numbers 1 and 0 for them. Any other number (2, 0.5) or text gives #N/A, although spreadsheet programs would otherwise read 2 as TRUE.',
  'A blank cell or an omitted optional argument means its default.',
  'An error value in an argument (e.g. #DIV/0! from another cell) passes through unchanged.',
  'The plain formula written into an exported xlsx follows these rules with ISBLANK, ISTEXT, ISLOGICAL and range tests, so another program shows #N/A in the same cells.',
  'One difference remains, for an argument written as a formula (not a cell or a number): there other programs cannot tell TRUE/FALSE from 1/0 alike (LibreOffice holds TRUE as the number 1), so a formula giving TRUE where a number is due, or 2 for a TRUE/FALSE argument, gives #N/A in the app but counts as 1 (or TRUE) in the exported plain formula. Put such a value in a cell of its own to have it checked everywhere.',
];

const NUMBER_LITERAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const BOOLEAN_LITERAL = /^(?:TRUE|FALSE)(?:\(\))?$/i;

/**
 * A guard (TRUE = error) for an argument whose value is not a number or a TRUE/FALSE as allowed.
 * An error value is not caught here (ISTEXT and ISLOGICAL of an error are FALSE): it passes on,
 * as it does in the engine.
 *
 * TRUE/FALSE is told from a number only where every program tells it the same way: a cell (its
 * type is stored) and the words TRUE and FALSE. For an argument written as a formula, LibreOffice
 * answers ISLOGICAL from the type of the last value it computed anywhere in the formula (so
 * ISLOGICAL(1) after an ISTEXT is TRUE), and it holds TRUE as the number 1: there the plain formula
 * checks only for text, and a TRUE/FALSE from such a formula counts as 1/0 (FUNCTIONS.md says so).
 */
function typeGuard(given: string, p: ParamSpec): string | undefined {
  // "(A1)" is how an omitted-default argument's cell comes back in its non-blank branch.
  const bare = /^\((.*)\)$/.exec(given.trim())?.[1];
  const raw = bare !== undefined && isCellReference(bare) ? bare : given;
  const t = raw.trim();
  const ref = isCellReference(t);
  if (p.type === 'boolean') {
    if (BOOLEAN_LITERAL.test(t)) return undefined;
    // A number or text typed in the formula is judged here: only 0 and 1 stand for FALSE and TRUE.
    if (NUMBER_LITERAL.test(t)) return Number(t) === 0 || Number(t) === 1 ? undefined : 'TRUE()';
    if (t.startsWith('"')) return 'TRUE()';
    return ref ? `AND(NOT(ISLOGICAL(${raw})),${raw}<>0,${raw}<>1)` : undefined;
  }
  if (NUMBER_LITERAL.test(t)) return undefined;
  if (BOOLEAN_LITERAL.test(t)) return 'TRUE()';
  if (!ref) return `ISTEXT(${raw})`;
  // A blank cell is an error only for a required argument; for an optional one it means the default.
  return isOptional(p)
    ? `OR(ISLOGICAL(${raw}),ISTEXT(${raw}))`
    : `OR(ISLOGICAL(${raw}),ISTEXT(${raw}),ISBLANK(${raw}))`;
}

/** Guards (TRUE = error) for a number outside the sizes of MAGNITUDE; none for a literal inside. */
function sizeGuards(raw: string, value: string, p: ParamSpec): string[] {
  if (p.type === 'boolean') return [];
  const t = raw.trim();
  if (NUMBER_LITERAL.test(t)) {
    const x = Math.abs(Number(t));
    if (x === 0 || (x >= MAGNITUDE.min && x <= MAGNITUDE.max)) return [];
  }
  // Lower-case exponents: the app's formula engine reads 1e+30 but not 1E+30.
  const max = formatNumber(MAGNITUDE.max);
  const min = formatNumber(MAGNITUDE.min);
  return [`ABS(${value})>${max}`, `AND(${value}<>0,ABS(${value})<${min})`];
}

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
      // In brackets: read as the value it holds, no longer as a blank-or-not reference.
      args.map((a, i) => (i === blankOmitted ? `(${ref})` : a)),
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
  // An error value in an argument wins over every other problem, the first in argument order,
  // as in the engine: x<>x is FALSE for any value and the error itself for an error, and OR
  // passes on the first error it meets.
  const errors: string[] = [];
  const types: string[] = [];
  const values: string[] = [];
  spec.params.forEach((p, i) => {
    const t = texts[i];
    if (t === undefined) return;
    // Types and sizes are checked on what the user gave; a default is a number in range.
    const given = args[i];
    if (given !== undefined) {
      const g = typeGuard(given, p);
      if (g !== undefined) {
        errors.push(`${given}<>${given}`);
        types.push(g);
      }
      for (const x of sizeGuards(given, t, p)) values.push(x);
    }
    for (const x of domainGuards(t, p)) values.push(x);
  });
  if (types.length > 0) types.unshift(...errors);
  // Cross-argument guards only run once every argument passed its own guards, as in evaluate:
  // they may divide by an argument, and OR would pass that error on instead of giving NA().
  const cross = spec.expandGuards?.(texts) ?? [];
  const guarded = (conditions: readonly string[], inner: string) =>
    conditions.length === 0 ? inner : `IF(OR(${conditions.join(',')}),NA(),${inner})`;
  return guarded(types, guarded(values, guarded(cross, spec.expand(texts))));
}

export { isOptional };
