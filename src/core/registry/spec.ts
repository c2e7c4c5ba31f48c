// The one shape every catalogue function is defined in. Everything else (engine plugin,
// help panel, autocomplete, validation, tests, plain-formula expansion, generated reference)
// is derived from a FunctionSpec.

/**
 * The sizes a number argument may have, besides 0: the rule every catalogue function follows, in
 * the engine and in its plain-formula expansion alike. No physical input of the catalogue comes
 * near them, and inside them no step of any expansion overflows or underflows the double range
 * in any spreadsheet program (outside them the engine's compute and another program's formula
 * gave different answers: a number against #NUM!).
 */
export const MAGNITUDE = { min: 1e-30, max: 1e30 } as const;

/** A closed or open interval; a missing bound is unbounded on that side. */
export interface Interval {
  readonly lo?: number;
  readonly hi?: number;
  /** true: lo itself is not allowed. */
  readonly loOpen?: boolean;
  /** true: hi itself is not allowed. */
  readonly hiOpen?: boolean;
}

/** Default of an optional argument: a constant, the value of another argument, or "omitted". */
export type ParamDefault = number | boolean | { readonly sameAs: string } | { readonly omitted: string };

export interface ParamSpec {
  /** snake_case with unit suffix, as FUNCTIONS.md lists them (e.g. p_out_kw). */
  readonly name: string;
  /** Display unit: 'kW', 'kvar', 'kVA', 'kV', 'A', '%', 'Hz', 'km', 'MVA', 'µF/km', '1' (plain number), 'TRUE/FALSE'. */
  readonly unit: string;
  /** One line for the help panel and the autocomplete hint. */
  readonly doc: string;
  readonly type?: 'number' | 'boolean';
  readonly domain?: Interval;
  /** Present only for optional arguments. `{omitted: why}` means the compute sees undefined. */
  readonly default?: ParamDefault;
}

export type SourceKind = 'published' | 'common practice' | 'from memory';

export interface SourceRef {
  readonly kind: SourceKind;
  /** The standard, handbook or regulation and where in it. */
  readonly ref: string;
}

/** A worked example: arguments as a user would type them, the stated result, how close it must be. */
export interface Example {
  /** undefined = argument not given (optional); booleans for TRUE/FALSE. */
  readonly args: ReadonlyArray<number | boolean | undefined>;
  /** Expected value, or the start of the expected error message tail (after "NAME: "). */
  readonly expect: number | { readonly error: string };
  /** Relative tolerance of the stated value (rounding in the source); default 1e-9. */
  readonly tol?: number;
  /** Where the value comes from (source and kind) or what the example shows. */
  readonly note: string;
}

/** Argument values after validation and defaults: numbers, booleans, or undefined for "omitted". */
export type Args = ReadonlyArray<number | boolean | undefined>;
/** Formula text of each argument after defaults; undefined for "omitted". */
export type ArgTexts = ReadonlyArray<string | undefined>;

export interface FunctionSpec {
  /** Upper-case, dotted, unique (e.g. KVAR.MOTOR). */
  readonly name: string;
  /** Family heading for the reference (e.g. 'Power triangle'). */
  readonly family: string;
  /** One line: what it returns. */
  readonly summary: string;
  /** A few sentences: the formula in words, conventions, assumptions. */
  readonly description: string;
  readonly params: readonly ParamSpec[];
  readonly result: { readonly unit: string; readonly doc: string };
  readonly source: SourceRef;
  readonly examples: readonly Example[];
  /**
   * Checks that involve several arguments, after each one passed its own domain.
   * Returns the message tail (without "NAME: ") or undefined when fine.
   */
  readonly check?: (a: Args) => string | undefined;
  /** The physics: a pure function of validated numbers. */
  readonly compute: (a: Args) => number;
  /**
   * The same as a plain formula of classic spreadsheet functions (no leading '='), from the
   * argument texts. Each argument text is already parenthesised when it is not atomic.
   */
  readonly expand: (a: ArgTexts) => string;
  /**
   * Plain-formula conditions (each TRUE = error) for the cross-argument `check`; the per-argument
   * domain guards are generated from the params and need not be repeated here.
   */
  readonly expandGuards?: (a: ArgTexts) => string[];
}

export function defineFunction(spec: FunctionSpec): FunctionSpec {
  return Object.freeze(spec);
}

export function isOptional(p: ParamSpec): boolean {
  return p.default !== undefined;
}

export function minArgs(spec: FunctionSpec): number {
  return spec.params.filter((p) => !isOptional(p)).length;
}
