// The one place the formula engine is configured. Every engine the app, the CLI and the tests
// build gets its settings from here, so a value computed in the grid, printed by the CLI and
// cached in an export is the same number.
import type { ConfigParams } from 'hyperformula';
import { MAX_SHEET_COLUMNS, MAX_SHEET_ROWS } from '../core/site/limits.ts';

/**
 * The engine is used under the GPL v3 (the whole program is GPL-3.0-only). Without a key every
 * function returns a licence error.
 */
export const ENGINE_LICENSE_KEY = 'gpl-v3';

/** The language whose function names formulas are written in; our plugin translates into it. */
export const ENGINE_LANGUAGE = 'enGB';

/**
 * Settings shared by every engine instance.
 *
 * smartRounding: false. By default the engine rounds every result to 10 significant digits and
 * compares numbers with a relative tolerance. We keep full double precision in values instead:
 * - what the grid shows is decided by each column's number format, not by the engine;
 * - an export caches the full value, so a program that recalculates the file on load agrees
 *   with the cached number to the last digit rather than to 10 digits;
 * - the catalogue's worked examples are checked to 1e-12 relative through the engine and
 *   through the plain-formula expansion, which 10-digit rounding would blur.
 * Switching smartRounding off also switches off the engine's comparison tolerance
 * (precisionEpsilon is only used with smartRounding), so `=` and the domain guards of an
 * expansion compare exactly, like the pure compute does. precisionRounding is then unused and
 * stays at the engine default. (With smartRounding on, results near 1e-308 even came out as
 * NaN: the rounding multiplies by 10^(10 − exponent), which overflows.)
 *
 * evaluateNullToZero: true. A formula that refers to an empty cell gives 0, as in every other
 * spreadsheet program (the engine would give an empty value), so the page, the export's cached
 * values and a program that recalculates them agree.
 *
 * useArrayArithmetic: false. Catalogue functions take one value per argument and report a range
 * as a clear error; spilling arrays from ordinary formulas is not something the workbook uses.
 *
 * maxRows / maxColumns: the engine's own default (40,000 rows) is below the supported site size;
 * an equipment sheet of 50,000 rows threw "Sheet size limit exceeded". The limits are the ones
 * every door checks (src/core/site/limits.ts), so a workbook that passed the door fits.
 */
const SHARED: Partial<ConfigParams> = {
  licenseKey: ENGINE_LICENSE_KEY,
  language: ENGINE_LANGUAGE,
  smartRounding: false,
  useArrayArithmetic: false,
  evaluateNullToZero: true,
  maxRows: MAX_SHEET_ROWS,
  maxColumns: MAX_SHEET_COLUMNS,
};

/** Engine settings, with optional overrides for a caller that knows why it needs them. */
export function engineConfig(overrides: Partial<ConfigParams> = {}): Partial<ConfigParams> {
  return { ...SHARED, ...overrides };
}
