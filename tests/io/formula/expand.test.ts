// Expansion of catalogue calls into plain formulas. Values are compared between the engine with
// our plugin and an engine without it (the plain formula must stand on its own).
import { afterAll, describe, expect, it } from 'vitest';
import { CATALOGUE } from '../../../src/core/functions/index.ts';
import { createEngine, createPlainEngine, evaluateFormula } from '../../../src/engine/index.ts';
import { expandFormula, referencedFunctions } from '../../../src/io/formula/expand.ts';
import { significantTokens } from '../../../src/io/formula/tokenize.ts';

const cells = [[240, 320, null, 'txt', 0.9], ['=1/0']];
const withPlugin = createEngine([
  { name: 'Sheet1', cells },
  { name: 'My list', cells: [[300, 400]] },
]);
const plain = createPlainEngine([
  { name: 'Sheet1', cells },
  { name: 'My list', cells: [[300, 400]] },
]);
afterAll(() => {
  withPlugin.destroy();
  plain.destroy();
});

function expanded(formula: string): string {
  const r = expandFormula(formula);
  if (!r.ok) throw new Error(r.message);
  return r.formula;
}

/** Same value (or same error code) with the plugin and as a plain formula without it. */
function agree(formula: string): void {
  const plainFormula = expanded(formula);
  expect(referencedFunctions(plainFormula), plainFormula).toEqual([]);
  const a = evaluateFormula(withPlugin, formula);
  const b = evaluateFormula(plain, plainFormula);
  if (a.ok && typeof a.value === 'number') {
    expect(b.ok, `${formula} → ${plainFormula}: ${JSON.stringify(b)}`).toBe(true);
    expect(b.ok && (b.value as number)).toBeCloseTo(a.value, 10);
  } else if (a.ok) {
    expect(b).toEqual(a);
  } else {
    expect(a.ok).toBe(false);
    expect(b.ok).toBe(false);
    expect(!b.ok && b.error, plainFormula).toBe(!a.ok && a.error);
  }
}

describe('expandFormula', () => {
  it('rewrites a call into classic functions', () => {
    expect(expanded('=KVA.TOTAL(3,4)')).toBe('=SQRT(POWER(3,2)+POWER(4,2))');
    expect(expanded('kva.total(3,4)')).toBe('SQRT(POWER(3,2)+POWER(4,2))');
  });
  it('parenthesises argument texts that are not atomic', () => {
    expect(expanded('=KVA.TOTAL(1+2,-B1)')).toContain(',SQRT(POWER((1+2),2)+POWER((-B1),2))');
    expect(expanded('=-KVA.TOTAL(A1,B1)^2')).toMatch(/^=-IF\(.*\)\^2$/);
  });
  it('rewrites nested calls, inner first, and keeps the rest of the formula', () => {
    const f = '=ROUND(COSPHI(KVA.TOTAL(A1,B1),300),3)&" pf"';
    expect(expanded(f)).toMatch(/^=ROUND\(IF\(.*\),3\)&" pf"$/);
    agree(f);
    agree('=1+TANPHI(KVA.TOTAL(A1,B1),KVAR.LOAD(A1,E1))*2');
  });
  it('keeps references with sheet names, quotes and $ as written', () => {
    const f = "=KVA.TOTAL('My list'!$A$1,'My list'!B1)";
    expect(expanded(f)).toContain("ISBLANK('My list'!$A$1)");
    agree(f);
  });
  it('leaves strings with commas and parentheses alone', () => {
    const f = '=IF("a,(b)"="a,(b)",KVA.TOTAL(3,4),"x,)")';
    expect(expanded(f)).toBe('=IF("a,(b)"="a,(b)",SQRT(POWER(3,2)+POWER(4,2)),"x,)")');
  });
  it('returns a formula without catalogue calls exactly as given', () => {
    for (const f of ['=SUM( A1:A3 )', '=IF(A1, "x" ,1)', 'plain text?']) {
      const r = expandFormula(f);
      if (f === 'plain text?') expect(r.ok).toBe(false);
      else expect(r).toEqual({ ok: true, formula: f });
    }
  });
  it('errors where the plugin errors: blanks, text, errors, ranges, domain', () => {
    for (const f of [
      '=KVA.TOTAL(A1,C1)',
      '=KVA.TOTAL(D1,1)',
      '=KVA.TOTAL(A2,1)',
      '=COSPHI(0,0)',
      '=KVAR.LOAD(A1,B1)',
    ]) {
      const a = evaluateFormula(withPlugin, f);
      const b = evaluateFormula(plain, expanded(f));
      expect(a.ok, f).toBe(false);
      expect(b.ok, `${f} → ${expanded(f)}`).toBe(false);
    }
    agree('=KVA.TOTAL(A1,C1)');
    agree('=KVA.TOTAL(A2,1)');
    agree('=COSPHI(0,0)');
  });
  it('an omitted or blank optional argument means its default, as in the engine', () => {
    agree('=KVAR.LOAD(400,0.8,)');
    agree('=KVAR.LOAD(400,0.8,C1)');
    agree('=KVAR.MOTOR(75,0.95,0.86,,C1)');
  });
  it('refuses a range or array where one value belongs, as the plugin does', () => {
    expect(expandFormula("=2*KVA.TOTAL('My list'!A1:B1,1)")).toEqual({
      ok: false,
      message:
        "KVA.TOTAL: argument 1 (p_kw) must be one value or one cell; got the range 'My list'!A1:B1 (the call at character 4)",
    });
    expect(expandFormula('=KVA.TOTAL(1,{1,2})')).toMatchObject({
      ok: false,
      message: expect.stringContaining(
        'argument 2 (q_kvar) must be one value or one cell; got the array {1,2}',
      ),
    });
    expect(evaluateFormula(withPlugin, '=KVA.TOTAL(A1:B1,1)')).toMatchObject({ ok: false, error: '#N/A' });
    expect(expanded('=KVA.TOTAL(SUM(A1:B1),1)')).toContain('SUM(A1:B1)');
  });
  it('reports argument-count mistakes with the function and where the call is', () => {
    expect(expandFormula('=1+KVA.TOTAL(1,2,3)')).toEqual({
      ok: false,
      message: 'KVA.TOTAL: takes at most 2 arguments; got 3 (the call at character 4)',
    });
    expect(expandFormula('=KVA.TOTAL(,2)')).toEqual({
      ok: false,
      message: 'KVA.TOTAL: argument 1 (p_kw) is missing (the call at character 2)',
    });
  });
  it('passes on parse errors with their position', () => {
    expect(expandFormula('=KVA.TOTAL(1,2')).toMatchObject({
      ok: false,
      message: expect.stringContaining('after character 14'),
    });
  });
});

describe('every catalogue function expands to classic functions only', () => {
  // Functions of the 1997–2003 file format (no _xlfn. prefix needed in xlsx).
  const CLASSIC = new Set([
    'ABS',
    'ACOS',
    'AND',
    'ASIN',
    'ATAN',
    'CEILING',
    'COS',
    'EXP',
    'FALSE',
    'FLOOR',
    'IF',
    'INT',
    'ISBLANK',
    'ISLOGICAL',
    'ISTEXT',
    'LN',
    'LOG',
    'LOG10',
    'MAX',
    'MIN',
    'MOD',
    'NA',
    'NOT',
    'OR',
    'PI',
    'POWER',
    'ROUND',
    'ROUNDDOWN',
    'ROUNDUP',
    'SIN',
    'SQRT',
    'TAN',
    'TRUE',
  ]);
  it.each(CATALOGUE.map((f) => [f.name, f] as const))(
    '%s, arguments as sheet references, stays within the xlsx formula limit',
    (_n, spec) => {
      const refs = spec.params.map((_, i) => `'Compensation list'!$${'ABCDEFGHIJ'[i]}$1200`);
      const f = `=${spec.name}(${refs.join(',')})`;
      const plainFormula = expanded(f);
      const used = significantTokens(plainFormula)
        .filter((t) => t.kind === 'func')
        .map((t) => t.text.toUpperCase());
      expect(used.filter((n) => !CLASSIC.has(n))).toEqual([]);
      expect(plainFormula.length).toBeLessThanOrEqual(8192);
    },
  );
});

describe('referencedFunctions', () => {
  it('lists catalogue names once, canonical, in order; ignores others', () => {
    expect(referencedFunctions('=kva.total(1,COSPHI(1,2))+SUM(KVA.TOTAL(1,2))')).toEqual([
      'KVA.TOTAL',
      'COSPHI',
    ]);
    expect(referencedFunctions('=SUM(A1)+"KVA.TOTAL(1,2)"')).toEqual([]);
  });
});
