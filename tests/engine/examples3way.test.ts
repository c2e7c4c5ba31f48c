// Every worked example of every catalogue function, three independent ways:
//   1. the catalogue's compute (`evaluate`, the physics in src/core/elements);
//   2. the plain-formula expansion (the same maths written again in classic spreadsheet
//      functions), evaluated by an engine WITHOUT our plugin, so a catalogue name leaking into
//      an expansion shows as an unknown-name error;
//   3. the test's own recomputation by another route (tests/core/functions/recomputed.ts).
// The engine WITH our plugin is checked too, but it calls the same compute as (1): it shows the
// plugin serves the compute faithfully (arguments, blanks, errors), not a fourth computation.
// Each call is run with literal arguments and again with the arguments in cells (omitted optional
// arguments as references to blank cells). The stated values and their sources are in the specs.
import { afterAll, describe, expect, it } from 'vitest';
import type { HyperFormula } from 'hyperformula';
import { CATALOGUE } from '../../src/core/functions/index.ts';
import { evaluate, type RawArg } from '../../src/core/registry/evaluate.ts';
import type { Example, FunctionSpec } from '../../src/core/registry/spec.ts';
import {
  createEngine,
  createPlainEngine,
  evaluateFormula,
  readCell,
  type CellResult,
} from '../../src/engine/index.ts';
import { expandFormula } from '../../src/io/formula/expand.ts';
import { exampleKey, RECOMPUTED } from '../core/functions/recomputed.ts';

const AGREE = 1e-12;
/** The recomputation takes other routes (bisection, phasors), so it agrees to rounding, not to the bit. */
const AGREE_INDEPENDENT = 1e-9;

function literal(a: number | boolean | undefined): string {
  if (a === undefined) return '';
  if (typeof a === 'boolean') return a ? 'TRUE' : 'FALSE';
  return String(a);
}

/** =NAME(a,b,...) with omitted trailing arguments dropped and inner ones left empty. */
function literalCall(spec: FunctionSpec, args: Example['args']): string {
  let n = args.length;
  while (n > 0 && args[n - 1] === undefined) n--;
  return `=${spec.name}(${args.slice(0, n).map(literal).join(',')})`;
}

const COLS = 'ABCDEFGHIJ';
/** =NAME(A1,B1,...) over row 1, where an omitted argument's cell stays blank. */
function referenceCall(spec: FunctionSpec, args: Example['args']): string {
  return `=${spec.name}(${args.map((_, i) => `${COLS[i]}1`).join(',')})`;
}
function argumentRow(args: Example['args']): (number | boolean | null)[] {
  return args.map((a) => (a === undefined ? null : a));
}

function closeTo(a: number, b: number, rel: number): boolean {
  return Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b));
}

const engines: HyperFormula[] = [];
afterAll(() => engines.forEach((e) => e.destroy()));

/** Run one formula in a fresh engine whose Sheet1 row 1 holds `row`; the formula goes in row 2. */
function runInCells(
  make: typeof createEngine | typeof createPlainEngine,
  row: (number | boolean | null)[],
  formula: string,
): CellResult {
  const hf = make([{ name: 'Sheet1', cells: [row, [formula]] }]);
  engines.push(hf);
  return readCell(hf, 'Sheet1', 1, 0);
}

const pluginEngine = createEngine([{ name: 'Sheet1', cells: [] }]);
const plainEngine = createPlainEngine([{ name: 'Sheet1', cells: [] }]);
engines.push(pluginEngine, plainEngine);

function expectSame(
  spec: FunctionSpec,
  ex: Example,
  pure: ReturnType<typeof evaluate>,
  viaPlugin: CellResult,
  viaPlain: CellResult,
  plainFormula: string,
): void {
  const label = `${spec.name} ${JSON.stringify(ex.args)}`;
  if (typeof ex.expect === 'number') {
    expect(pure, `${label} pure`).toMatchObject({ ok: true });
    expect(viaPlugin, `${label} plugin`).toMatchObject({ ok: true });
    expect(viaPlain, `${label} plain ${plainFormula}`).toMatchObject({ ok: true });
    if (!pure.ok || !viaPlugin.ok || !viaPlain.ok) return;
    const tol = ex.tol ?? 1e-9;
    expect(
      closeTo(pure.value, ex.expect, tol) || (ex.expect === 0 && Math.abs(pure.value) < 1e-12),
      `${label}: ${pure.value} vs stated ${ex.expect} (${ex.note})`,
    ).toBe(true);
    const recompute = RECOMPUTED.get(exampleKey(spec.name, ex.args));
    expect(recompute, `${label}: no independent recomputation`).toBeDefined();
    const independent = recompute ? recompute() : Number.NaN;
    expect(
      closeTo(pure.value, independent, AGREE_INDEPENDENT) ||
        (independent === 0 && Math.abs(pure.value) < 1e-12),
      `${label} compute ${pure.value} vs independent ${independent}`,
    ).toBe(true);
    expect(typeof viaPlugin.value).toBe('number');
    expect(typeof viaPlain.value).toBe('number');
    expect(
      closeTo(viaPlugin.value as number, pure.value, AGREE),
      `${label} plugin ${String(viaPlugin.value)} vs ${pure.value}`,
    ).toBe(true);
    expect(
      closeTo(viaPlain.value as number, pure.value, AGREE),
      `${label} plain ${String(viaPlain.value)} vs ${pure.value}: ${plainFormula}`,
    ).toBe(true);
  } else {
    expect(pure.ok, `${label} pure should fail`).toBe(false);
    if (pure.ok) return;
    expect(pure.message.startsWith(`${spec.name}: ${ex.expect.error}`), `${label}: "${pure.message}"`).toBe(
      true,
    );
    expect(viaPlugin, `${label} plugin`).toEqual({ ok: false, error: '#N/A', message: pure.message });
    // Guards give NA(); only a floating-point overflow in the body cannot be guarded, and
    // spreadsheet programs report that as #NUM!.
    const overflow = pure.message.includes('is not a finite number');
    expect(viaPlain, `${label} plain ${plainFormula}`).toMatchObject({
      ok: false,
      error: overflow ? '#NUM!' : '#N/A',
    });
  }
}

describe.each(CATALOGUE.map((spec) => [spec.name, spec] as const))('%s examples', (_name, spec) => {
  it('has worked examples, at least one with a value', () => {
    expect(spec.examples.length).toBeGreaterThan(0);
    expect(spec.examples.some((e) => typeof e.expect === 'number')).toBe(true);
  });

  it.each(spec.examples.map((ex) => [literalCall(spec, ex.args), ex] as const))(
    '%s with literal arguments',
    (formula, ex) => {
      const pure = evaluate(spec, ex.args as RawArg[]);
      const plugin = evaluateFormula(pluginEngine, formula);
      const expanded = expandFormula(formula);
      expect(expanded.ok, JSON.stringify(expanded)).toBe(true);
      if (!expanded.ok) return;
      expect(expanded.formula).not.toContain(spec.name + '(');
      expectSame(spec, ex, pure, plugin, evaluateFormula(plainEngine, expanded.formula), expanded.formula);
    },
  );

  it.each(spec.examples.map((ex) => [referenceCall(spec, ex.args), ex] as const))(
    '%s with arguments in cells',
    (formula, ex) => {
      const row = argumentRow(ex.args);
      const pure = evaluate(spec, row);
      const expanded = expandFormula(formula);
      expect(expanded.ok, JSON.stringify(expanded)).toBe(true);
      if (!expanded.ok) return;
      expectSame(
        spec,
        ex,
        pure,
        runInCells(createEngine, row, formula),
        runInCells(createPlainEngine, row, expanded.formula),
        expanded.formula,
      );
    },
  );
});

describe('blank cells for arguments', () => {
  it.each(CATALOGUE.map((spec) => [spec.name, spec] as const))(
    '%s: a blank required argument is an error all three ways',
    (_name, spec) => {
      const ex = spec.examples.find((e) => typeof e.expect === 'number') as Example;
      const required = spec.params.findIndex((p) => p.default === undefined);
      const row = argumentRow(ex.args);
      while (row.length < spec.params.length) row.push(null);
      row[required] = null;
      const formula = `=${spec.name}(${spec.params.map((_, i) => `${COLS[i]}1`).join(',')})`;
      const pure = evaluate(spec, row);
      expect(pure.ok).toBe(false);
      expect(!pure.ok && pure.message).toContain(
        `argument ${required + 1} (${spec.params[required]?.name}) is a blank cell`,
      );
      expect(runInCells(createEngine, row, formula)).toEqual({
        ok: false,
        error: '#N/A',
        message: pure.ok ? '' : pure.message,
      });
      const expanded = expandFormula(formula);
      expect(expanded.ok && runInCells(createPlainEngine, row, expanded.formula)).toMatchObject({
        ok: false,
        error: '#N/A',
      });
    },
  );
});
