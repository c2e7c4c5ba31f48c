import { describe, expect, it } from 'vitest';
import { CATALOGUE } from '../../../src/core/functions/index.ts';
import { KVAR_CAPBANK } from '../../../src/core/functions/compensation.ts';
import { KVAR_GEN_MAX } from '../../../src/core/functions/loads.ts';
import { checkCatalogue } from '../../../src/core/registry/checks.ts';
import type { FunctionSpec, ParamSpec } from '../../../src/core/registry/spec.ts';

/** A copy of a spec with some fields replaced (specs are frozen). */
const variant = (spec: FunctionSpec, change: Partial<FunctionSpec>): FunctionSpec => ({ ...spec, ...change });
const withParam = (spec: FunctionSpec, i: number, change: Partial<ParamSpec>): FunctionSpec =>
  variant(spec, { params: spec.params.map((p, j) => (j === i ? { ...p, ...change } : p)) });

describe('checkCatalogue', () => {
  it('finds nothing wrong in the catalogue', () => {
    expect(checkCatalogue(CATALOGUE)).toEqual([]);
  });

  it('holds the 34 catalogue functions, each once, in reference order', () => {
    expect(CATALOGUE.map((f) => f.name)).toEqual([
      'KVA.TOTAL',
      'COSPHI',
      'TANPHI',
      'KVAR.LOAD',
      'KW.MOTOR',
      'KVAR.MOTOR',
      'KVAR.MOTORCAP.MAX',
      'KVAR.GEN',
      'KVAR.GEN.MAX',
      'KVAR.XFMR.MAG',
      'KVAR.XFMR.LEAK',
      'KW.XFMR.LOSS',
      'XFMR.UKMIN',
      'KVAR.CABLE',
      'CABLE.CAP',
      'KVAR.LINE',
      'LINE.SIL',
      'KW.LINE.LOSS',
      'KVAR.SERIES',
      'CABLE.R.CU',
      'CABLE.R.AL',
      'KVAR.CAPBANK',
      'CAPBANK.UCAP',
      'CAPBANK.TUNE',
      'CAPBANK.URATED',
      'CAPBANK.USERIES',
      'KVAR.REACTOR',
      'KVAR.PERKW',
      'KVAR.TOPF',
      'KVAR.TOTAN',
      'BANK.ROUNDUP',
      'SC.MVA.XFMR',
      'RESONANCE.ORDER',
      'VRISE.PCT',
    ]);
  });

  const planted: Array<[string, FunctionSpec[], string]> = [
    ['duplicate name', [KVAR_GEN_MAX, KVAR_GEN_MAX], 'duplicate function name'],
    ['lower-case name', [variant(KVAR_GEN_MAX, { name: 'kvar.gen.max' })], 'name does not match'],
    ['trailing dot', [variant(KVAR_GEN_MAX, { name: 'KVAR.' })], 'name does not match'],
    ['camelCase parameter', [withParam(KVAR_GEN_MAX, 0, { name: 'sKva' })], 'not snake_case'],
    ['duplicate parameter', [withParam(KVAR_GEN_MAX, 1, { name: 's_kva' })], 'duplicate parameter name'],
    [
      'required after optional',
      [withParam(KVAR_GEN_MAX, 0, { default: 1 })],
      'required parameter after an optional one',
    ],
    [
      'sameAs unknown',
      [withParam(KVAR_CAPBANK, 2, { default: { sameAs: 'u_nominal_kv' } })],
      "default sameAs 'u_nominal_kv'",
    ],
    [
      'sameAs itself',
      [withParam(KVAR_CAPBANK, 2, { default: { sameAs: 'u_kv' } })],
      'is not another parameter',
    ],
    ['default outside domain', [withParam(KVAR_CAPBANK, 3, { default: 100 })], 'outside its own domain'],
    [
      'no numeric example',
      [
        variant(KVAR_GEN_MAX, {
          examples: KVAR_GEN_MAX.examples.filter((e) => typeof e.expect !== 'number'),
        }),
      ],
      'no numeric example',
    ],
    [
      'no error example',
      [
        variant(KVAR_GEN_MAX, {
          examples: KVAR_GEN_MAX.examples.filter((e) => typeof e.expect === 'number'),
        }),
      ],
      'no error example',
    ],
    [
      'empty source',
      [variant(KVAR_GEN_MAX, { source: { kind: 'published', ref: '  ' } })],
      'source is empty',
    ],
    ['check without guards', [variant(KVAR_GEN_MAX, { expandGuards: undefined })], 'no expandGuards'],
    [
      'example with too many args',
      [
        variant(KVAR_GEN_MAX, {
          examples: [...KVAR_GEN_MAX.examples, { args: [1, 2, 3], expect: 0, note: 'x' }],
        }),
      ],
      'more than 2',
    ],
  ];
  it.each(planted)('detects a planted fault: %s', (_label, list, expected) => {
    const problems = checkCatalogue(list);
    expect(problems.length).toBeGreaterThan(0);
    expect(problems.join('\n')).toContain(expected);
  });
});
