// Building formula engines and reading results out of them. The app, the CLI and the tests all
// build engines here, so the configuration and the plugin registration happen in one way.
import { DetailedCellError, HyperFormula } from 'hyperformula';
import type { CellValue, ConfigParams, SerializedNamedExpression } from 'hyperformula';
import type { CellContent } from '../core/workbook/document.ts';
import { nameTable } from '../core/text/nameTable.ts';
import { ENGINE_LANGUAGE, engineConfig } from './config.ts';
import { registerCataloguePlugin, registerOwnPlugin, standardPlugins, type OwnPlugin } from './plugins.ts';
import { BUS_ROLLUP_PLUGIN } from './rollupPlugin.ts';
import { installFastTopSort } from './topSort.ts';
import { installArrayNodeIndex } from './arrayNodes.ts';

export { CATALOGUE_PLUGIN, registerOwnPlugin, type OwnPlugin } from './plugins.ts';
export { engineConfig, ENGINE_LICENSE_KEY } from './config.ts';
// The engine library's types, for modules that hold an engine or read its values. Only src/engine
// imports the library itself (tests/architecture.test.ts holds that line).
export type { CellValue, ExportedChange, HyperFormula, SimpleCellRange } from 'hyperformula';

export interface SheetInput {
  readonly name: string;
  /** Row-major cell contents; formulas start with '='. */
  readonly cells: readonly (readonly CellContent[])[];
}

export interface EngineOptions {
  /** Further plugins of ours (e.g. the bus roll-up) to register before building. */
  readonly plugins?: readonly OwnPlugin[];
  /** Engine settings that differ from src/engine/config.ts, for a caller that knows why. */
  readonly config?: Partial<ConfigParams>;
}

/**
 * The engine reads TRUE and FALSE only as the functions TRUE() and FALSE(); a bare TRUE is an
 * unknown name to it. Every other spreadsheet program, our own parser and users write the bare
 * words, so each engine defines them as workbook-level names for the two values.
 */
export const BOOLEAN_NAMES: readonly SerializedNamedExpression[] = Object.freeze([
  { name: 'TRUE', expression: '=TRUE()' },
  { name: 'FALSE', expression: '=FALSE()' },
]);

function build(sheets: readonly SheetInput[], config: Partial<ConfigParams>): HyperFormula {
  // The recalculation walk over typed arrays (topSort.ts): same order, a fraction of the time.
  installFastTopSort();
  // Row and column inserts find the array formulas from a kept list (arrayNodes.ts), not a search.
  installArrayNodeIndex();
  const names = BOOLEAN_NAMES.map((n) => ({ ...n }));
  if (sheets.length === 0) return HyperFormula.buildEmpty(config, names);
  const seen = new Map<string, string>();
  // Keyed by sheet name: no prototype, so a sheet may be called "__proto__" like any other.
  const data = nameTable<CellContent[][]>();
  for (const s of sheets) {
    const key = s.name.toLowerCase();
    const earlier = seen.get(key);
    if (earlier !== undefined)
      throw new Error(
        `two sheets are named "${earlier}" and "${s.name}"; sheet names must differ (ignoring case)`,
      );
    seen.set(key, s.name);
    data[s.name] = s.cells.map((row) => [...row]);
  }
  return HyperFormula.buildFromSheets(data, config, names);
}

/** An engine with the function catalogue (and any further plugins of ours) registered. */
export function createEngine(sheets: readonly SheetInput[] = [], opts: EngineOptions = {}): HyperFormula {
  registerCataloguePlugin();
  // The bus roll-up (BUS.SUMS) that 'live' workbooks use for their bus totals.
  registerOwnPlugin(BUS_ROLLUP_PLUGIN);
  for (const p of opts.plugins ?? []) registerOwnPlugin(p);
  return build(sheets, engineConfig(opts.config));
}

/**
 * An engine with the standard functions only: the evaluator for plain-formula expansions, where
 * a catalogue name that leaked through shows as an unknown-name error.
 */
export function createPlainEngine(sheets: readonly SheetInput[] = []): HyperFormula {
  return build(sheets, engineConfig({ functionPlugins: standardPlugins() }));
}

export type ScalarValue = number | string | boolean | null;
/** A cell's result: a value, or an error code (e.g. '#N/A') with its message. */
export type CellResult =
  | { readonly ok: true; readonly value: ScalarValue }
  | { readonly ok: false; readonly error: string; readonly message: string };

/** Turn an engine value into a CellResult; an error without a message gets one naming the code. */
export function toResult(v: CellValue | CellValue[][]): CellResult {
  if (Array.isArray(v)) {
    const cols = v[0]?.length ?? 0;
    return {
      ok: false,
      error: '#VALUE!',
      message: `the formula gives an array of ${v.length}×${cols} values; one value was expected`,
    };
  }
  if (v instanceof DetailedCellError)
    return { ok: false, error: v.value, message: v.message || `the formula evaluates to ${v.value}` };
  return { ok: true, value: v };
}

/** Is this engine value an error (e.g. #N/A with our message)? */
export function isEngineError(v: unknown): boolean {
  return v instanceof DetailedCellError;
}

/** Every function name the engine knows now, in the language formulas are written in. */
export function registeredFunctionNames(): string[] {
  return HyperFormula.getRegisteredFunctionNames(ENGINE_LANGUAGE);
}

function sheetIdOf(hf: HyperFormula, sheet: string | number): number {
  if (typeof sheet === 'number') return sheet;
  const id = hf.getSheetId(sheet);
  if (id === undefined) throw new Error(`no sheet named "${sheet}"`);
  return id;
}

/** The result in a cell (0-based row and column). */
export function readCell(hf: HyperFormula, sheet: string | number, row: number, col: number): CellResult {
  return toResult(hf.getCellValue({ sheet: sheetIdOf(hf, sheet), row, col }));
}

/**
 * Evaluate a formula (starting with '=') without writing it into a cell; references point into
 * `sheet` (an empty sheet is added when the engine has none).
 */
export function evaluateFormula(hf: HyperFormula, formula: string, sheet: string | number = 0): CellResult {
  if (hf.countSheets() === 0) hf.addSheet('Sheet1');
  try {
    return toResult(hf.calculateFormula(formula, sheetIdOf(hf, sheet)));
  } catch (e) {
    // The engine throws (instead of returning an error value) when it cannot parse the formula.
    return {
      ok: false,
      error: '#ERROR!',
      message: `the formula could not be read: ${e instanceof Error ? e.message : String(e)}`,
    };
  }
}
