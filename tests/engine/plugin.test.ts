// The catalogue plugin inside the engine: what reaches `evaluate` (optional and empty arguments,
// TRUE/FALSE, references, text, blanks, ranges), that our message comes out as the cell's
// error message, and that nothing throws or leaves NaN/Infinity in a cell.
// Values used: the 3-4-5 triangle (exact: cos φ = 0.8, tan φ = 0.75).
import { describe, expect, it } from 'vitest';
import { CellError, ErrorType, HyperFormula } from 'hyperformula';
import { CATALOGUE } from '../../src/core/functions/index.ts';
import { defineFunction } from '../../src/core/registry/spec.ts';
import { createEngine, createPlainEngine, evaluateFormula, readCell } from '../../src/engine/index.ts';
import { CataloguePlugin } from '../../src/engine/plugin.ts';
import { standardPlugins } from '../../src/engine/plugins.ts';

function one(formula: string, cells: (number | string | boolean | null)[][] = [[]]) {
  const hf = createEngine([{ name: 'Sheet1', cells: [...cells, [formula]] }]);
  const r = readCell(hf, 'Sheet1', cells.length, 0);
  hf.destroy();
  return r;
}

describe('arguments as the engine hands them over', () => {
  it('omitted and empty optional arguments take their default', () => {
    expect(one('=KVAR.LOAD(400,0.8)')).toEqual({ ok: true, value: expect.closeTo(300, 10) });
    expect(one('=KVAR.LOAD(400,0.8,)')).toEqual({ ok: true, value: expect.closeTo(300, 10) });
  });
  it('TRUE and FALSE, as bare words, as functions and in cells', () => {
    expect(one('=KVAR.LOAD(400,0.8,TRUE)')).toEqual({ ok: true, value: expect.closeTo(-300, 10) });
    expect(one('=KVAR.LOAD(400,0.8,true())')).toEqual({ ok: true, value: expect.closeTo(-300, 10) });
    expect(one('=KVAR.LOAD(400,0.8,FALSE)')).toEqual({ ok: true, value: expect.closeTo(300, 10) });
    expect(one('=KVAR.LOAD(A1,B1,C1)', [[400, 0.8, true]])).toEqual({
      ok: true,
      value: expect.closeTo(-300, 10),
    });
  });
  it('a boolean where a number belongs is our message, not a silent 1', () => {
    expect(one('=KVA.TOTAL(TRUE,4)')).toEqual({
      ok: false,
      error: '#N/A',
      message: 'KVA.TOTAL: argument 1 (p_kw) must be a number in kW; got TRUE',
    });
  });
  it('cell references, including other sheets and absolute ones', () => {
    const hf = createEngine([
      { name: 'Inputs here', cells: [[300, 400]] },
      { name: 'Calc', cells: [["=KVA.TOTAL('Inputs here'!$A$1,'Inputs here'!B1)"]] },
    ]);
    expect(readCell(hf, 'Calc', 0, 0)).toEqual({ ok: true, value: 500 });
    hf.setCellContents({ sheet: hf.getSheetId('Inputs here') as number, row: 0, col: 1 }, 0);
    expect(readCell(hf, 'Calc', 0, 0)).toEqual({ ok: true, value: 300 });
    hf.destroy();
  });
  it('a blank optional reference means the default; a blank required one is our message', () => {
    expect(one('=KVAR.LOAD(A1,B1,C1)', [[400, 0.8, null]])).toEqual({
      ok: true,
      value: expect.closeTo(300, 10),
    });
    expect(one('=KVA.TOTAL(A1,B1)', [[300, null]])).toEqual({
      ok: false,
      error: '#N/A',
      message: 'KVA.TOTAL: argument 2 (q_kvar) is a blank cell; a number in kvar is required',
    });
  });
  it('text, literal or in a cell, is our message naming the argument', () => {
    expect(one('=COSPHI("400",300)')).toEqual({
      ok: false,
      error: '#N/A',
      message: 'COSPHI: argument 1 (p_kw) must be a number in kW; got text "400"',
    });
    expect(one('=COSPHI(A1,300)', [['four hundred']])).toEqual({
      ok: false,
      error: '#N/A',
      message: 'COSPHI: argument 1 (p_kw) must be a number in kW; got text "four hundred"',
    });
  });
  it('a range or an inline array is our message', () => {
    expect(
      one('=KVA.TOTAL(300,A1:B2)', [
        [1, 2],
        [3, 4],
      ]),
    ).toEqual({
      ok: false,
      error: '#N/A',
      message: 'KVA.TOTAL: argument 2 (q_kvar) must be one value or one cell; got a range of 2×2 cells',
    });
    expect(one('=KVA.TOTAL({1,2,3},4)')).toMatchObject({
      ok: false,
      error: '#N/A',
      message: expect.stringContaining('argument 1 (p_kw) must be one value or one cell; got a range of 1×3'),
    });
  });
  it('argument counts are our messages', () => {
    expect(one('=KVA.TOTAL(1,2,3)')).toEqual({
      ok: false,
      error: '#N/A',
      message: 'KVA.TOTAL: takes at most 2 arguments; got 3',
    });
    expect(one('=KVA.TOTAL(1)')).toEqual({
      ok: false,
      error: '#N/A',
      message: 'KVA.TOTAL: needs at least 2 arguments; got 1; argument 2 (q_kvar) is missing',
    });
    expect(one('=KVA.TOTAL(,4)')).toEqual({
      ok: false,
      error: '#N/A',
      message: 'KVA.TOTAL: argument 1 (p_kw) is missing',
    });
  });
  it('an error value in an argument is passed on unchanged, like spreadsheet functions do', () => {
    expect(one('=KVA.TOTAL(1/0,4)')).toMatchObject({ ok: false, error: '#DIV/0!' });
    expect(one('=KVA.TOTAL(A1,4)', [['=NA()']])).toMatchObject({ ok: false, error: '#N/A' });
  });
  it('nested catalogue calls and percent literals', () => {
    expect(one('=COSPHI(KVA.TOTAL(240,320),300)')).toEqual({ ok: true, value: expect.closeTo(0.8, 12) });
    expect(one('=TANPHI(400,75000%)')).toEqual({ ok: true, value: expect.closeTo(1.875, 12) });
  });
  it('keeps full precision (no 10-digit rounding of results)', () => {
    const r = one('=KVA.TOTAL(650,-760)');
    expect(r).toEqual({ ok: true, value: Math.hypot(650, -760) });
    expect(r.ok && r.value).not.toBe(1000.04999875);
  });
});

describe('registration', () => {
  it('registers every catalogue name in enGB, and building twice is harmless', () => {
    createEngine().destroy();
    createEngine().destroy();
    const names = HyperFormula.getRegisteredFunctionNames('enGB');
    for (const f of CATALOGUE) expect(names).toContain(f.name);
  });
  it('no catalogue name shadows a standard function', () => {
    const standard = new Set(standardPlugins().flatMap((p) => Object.keys(p.implementedFunctions)));
    expect(standard.size).toBeGreaterThan(300);
    for (const f of CATALOGUE) expect(standard.has(f.name), f.name).toBe(false);
  });
  it('the plain engine does not know catalogue names but knows the classic ones', () => {
    createEngine().destroy();
    const plain = createPlainEngine();
    expect(evaluateFormula(plain, '=KVA.TOTAL(3,4)')).toMatchObject({ ok: false, error: '#NAME?' });
    expect(evaluateFormula(plain, '=IF(TRUE,SQRT(POWER(3,2)+POWER(4,2)),NA())')).toEqual({
      ok: true,
      value: 5,
    });
    plain.destroy();
  });
});

describe('nothing throws and no NaN or infinity reaches a cell', () => {
  const awkward = [
    '0',
    '-0.0',
    '1e308',
    '-1e308',
    '1e-308',
    '-1',
    '0.5',
    '100',
    'TRUE',
    '"x"',
    '""',
    'A1',
    'A1:A2',
    '1/0',
  ];
  it.each(CATALOGUE.map((f) => [f.name, f] as const))('%s with awkward arguments', (_n, spec) => {
    const hf = createEngine([{ name: 'Sheet1', cells: [[null, null]] }]);
    for (const a of awkward) {
      for (let pos = 0; pos < spec.params.length; pos++) {
        // Start from a working example and spoil one argument.
        const base = (spec.examples.find((e) => typeof e.expect === 'number')?.args ?? []).map((x) =>
          x === undefined
            ? ''
            : String(x)
                .replace(/^true$/, 'TRUE')
                .replace(/^false$/, 'FALSE'),
        );
        while (base.length < spec.params.length) base.push('');
        base[pos] = a;
        const formula = `=${spec.name}(${base.join(',')})`;
        const r = evaluateFormula(hf, formula);
        if (r.ok) {
          expect(typeof r.value, formula).toBe('number');
          expect(Number.isFinite(r.value), formula).toBe(true);
        } else {
          expect(r.message.length, formula).toBeGreaterThan(0);
        }
      }
    }
    hf.destroy();
  });

  it('an exception while reading arguments becomes #N/A with an internal-error message', () => {
    const spec = defineFunction({
      name: 'TEST.PROBE',
      family: 'test',
      summary: '',
      description: '',
      params: [{ name: 'x', unit: '1', doc: '' }],
      result: { unit: '1', doc: '' },
      source: { kind: 'common practice', ref: 'test' },
      examples: [],
      compute: ([x]) => x as number,
      expand: ([x]) => x as string,
    });
    const broken = Object.create(CataloguePlugin.prototype) as CataloguePlugin;
    Object.defineProperty(broken, 'evaluateAst', {
      value: () => {
        throw new Error('engine hiccup');
      },
    });
    const r = broken.callCatalogue(spec, { args: [{ type: 'NUMBER' }] }, {});
    expect(r).toBeInstanceOf(CellError);
    expect(r instanceof CellError && [r.type, r.message]).toEqual([
      ErrorType.NA,
      'TEST.PROBE: internal error: engine hiccup',
    ]);
  });

  it('a compute that gives NaN or throws becomes our message', () => {
    const base = {
      family: 'test',
      summary: '',
      description: '',
      params: [],
      result: { unit: '1', doc: '' },
      source: { kind: 'common practice' as const, ref: 'test' },
      examples: [],
      expand: () => '0',
    };
    const plugin = Object.create(CataloguePlugin.prototype) as CataloguePlugin;
    const nan = plugin.callCatalogue(
      defineFunction({ ...base, name: 'TEST.NAN', compute: () => Number.NaN }),
      { args: [] },
      {},
    );
    expect(nan instanceof CellError && nan.message).toBe(
      'TEST.NAN: the result is not a finite number (NaN); check the arguments',
    );
    const boom = plugin.callCatalogue(
      defineFunction({
        ...base,
        name: 'TEST.BOOM',
        compute: () => {
          throw new Error('boom');
        },
      }),
      { args: [] },
      {},
    );
    expect(boom instanceof CellError && boom.message).toBe('TEST.BOOM: internal error: boom');
  });
});
