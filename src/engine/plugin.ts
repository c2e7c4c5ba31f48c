// The engine plugin for the function catalogue, generated from CATALOGUE: one metadata entry
// and one method per spec, all going through `evaluate` so the engine, the CLI and the site
// roll-up give the same numbers and the same messages.
//
// Arguments are evaluated here, not by the engine's own argument machinery: that machinery
// coerces text and blanks to numbers and reports a wrong argument count with its own wording,
// whereas we want text, booleans, blanks and omitted arguments to reach `evaluate` unchanged.
//
// Errors: a catalogue error becomes #N/A carrying our message. The plain-formula expansion
// (src/core/registry/expand.ts) guards with NA(), so a cell shows the same kind of error in the
// app, in the cached value of an export and after another program recalculates the export.
// An error value arriving in an argument (e.g. #DIV/0! from a referenced cell) is passed on
// unchanged, as spreadsheet functions do and as the expansion does.
import {
  CellError,
  EmptyValue,
  ErrorType,
  FunctionArgumentType,
  FunctionPlugin,
  SimpleRangeValue,
} from 'hyperformula';
import type { FunctionMetadata, ImplementedFunctions } from 'hyperformula';
import { CATALOGUE } from '../core/functions/index.ts';
import { evaluate, type RawArg } from '../core/registry/evaluate.ts';
import { msg, withFunction } from '../core/registry/messages.ts';
import { isOptional, type FunctionSpec } from '../core/registry/spec.ts';
import { ENGINE_LANGUAGE } from './config.ts';

/** The parts of the engine's call node we use: its argument nodes. */
interface CallNode {
  readonly args: ReadonlyArray<{ readonly type: string }>;
}

/** One argument after evaluation: a raw value for `evaluate`, or a reason to stop. */
type Evaluated =
  | { kind: 'raw'; raw: RawArg }
  | { kind: 'error'; error: CellError }
  | { kind: 'range'; rows: number; cols: number };

/** The engine's method name for a catalogue function (dots are not allowed in method names we look up). */
export function methodNameFor(functionName: string): string {
  return 'catalogue_' + functionName.replace(/\./g, '_');
}

function isNumberLike(v: unknown): v is { val: number } {
  return typeof v === 'object' && v !== null && typeof (v as { val?: unknown }).val === 'number';
}

export class CataloguePlugin extends FunctionPlugin {
  static override implementedFunctions: ImplementedFunctions = {};

  /** Evaluate one call of `spec`. Never throws: every failure becomes a cell error. */
  callCatalogue(spec: FunctionSpec, node: CallNode, state: unknown): number | CellError {
    try {
      const raw: RawArg[] = [];
      let range: { position: number; rows: number; cols: number } | undefined;
      for (const argNode of node.args) {
        const one = this.evaluateArgument(argNode, state);
        if (one.kind === 'error') return one.error;
        if (one.kind === 'range') {
          range ??= { position: raw.length + 1, rows: one.rows, cols: one.cols };
          raw.push(null);
        } else raw.push(one.raw);
      }
      const param = range ? spec.params[range.position - 1] : undefined;
      if (range && param) {
        const tail = msg.notOneValue(range.position, param, `a range of ${range.rows}×${range.cols} cells`);
        return new CellError(ErrorType.NA, withFunction(spec.name, tail));
      }
      // A range beyond the last parameter falls through: evaluate reports the argument count.
      const outcome = evaluate(spec, raw);
      if (!outcome.ok) return new CellError(ErrorType.NA, outcome.message);
      return outcome.value;
    } catch (e) {
      return new CellError(ErrorType.NA, withFunction(spec.name, msg.internal(e)));
    }
  }

  private evaluateArgument(argNode: { readonly type: string }, state: unknown): Evaluated {
    // `F(1,,3)`: a syntactically empty argument counts as not given.
    if (argNode.type === 'EMPTY') return { kind: 'raw', raw: undefined };
    const v: unknown = this.evaluateAst(argNode as never, state as never);
    if (v instanceof CellError) return { kind: 'error', error: v };
    if (v instanceof SimpleRangeValue) return { kind: 'range', rows: v.height(), cols: v.width() };
    if (v === EmptyValue) return { kind: 'raw', raw: null };
    if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean')
      return { kind: 'raw', raw: v };
    // Percentages, dates and currency amounts arrive as numbers wrapped with a display type.
    if (isNumberLike(v)) return { kind: 'raw', raw: v.val };
    return { kind: 'raw', raw: String(v) };
  }
}

function metadataFor(spec: FunctionSpec): FunctionMetadata {
  return {
    method: methodNameFor(spec.name),
    // Declared for the engine's function details; values are read in callCatalogue, not coerced.
    parameters: spec.params.map((p) => ({
      argumentType: FunctionArgumentType.ANY,
      ...(isOptional(p) ? { optionalArg: true } : {}),
    })),
    // One value per call: never spread a range argument into an array of results.
    vectorizationForbidden: true,
  };
}

/** Fill the plugin from the catalogue: metadata plus one ordinary prototype method per function. */
function installCatalogue(specs: readonly FunctionSpec[]): void {
  for (const spec of specs) {
    CataloguePlugin.implementedFunctions[spec.name] = metadataFor(spec);
    // The engine looks methods up on the plugin's own prototype (an instance field is not found).
    Object.defineProperty(CataloguePlugin.prototype, methodNameFor(spec.name), {
      value: function catalogueMethod(this: CataloguePlugin, node: CallNode, state: unknown) {
        return this.callCatalogue(spec, node, state);
      },
      writable: false,
      enumerable: false,
      configurable: false,
    });
  }
}

installCatalogue(CATALOGUE);

/** Name translations: the catalogue names are the same in every language we load. */
export const CATALOGUE_TRANSLATIONS: Record<string, Record<string, string>> = {
  [ENGINE_LANGUAGE]: Object.fromEntries(CATALOGUE.map((f) => [f.name, f.name])),
};
