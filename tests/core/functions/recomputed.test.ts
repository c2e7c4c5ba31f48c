// The catalogue's worked examples are stated numbers; this holds each stated number to an
// independent recomputation (recomputed.ts), so no example is the code's own output pasted in,
// and each example's note says where its number comes from.
import { describe, expect, it } from 'vitest';
import { CATALOGUE } from '../../../src/core/functions/index.ts';
import { agrees, exampleKey, RECOMPUTED } from './recomputed.ts';

const numeric = CATALOGUE.flatMap((spec) =>
  spec.examples.flatMap((ex) =>
    typeof ex.expect === 'number' ? [{ key: exampleKey(spec.name, ex.args), ex, stated: ex.expect }] : [],
  ),
);

/** A named document (with clause or table in the spec's source), or an honest kind. */
const NAMED_SOURCE = /IEC \d|IEEE Std|EU 548\/2014|FERC Order|Kundur|NEMA MG|common practice|from memory/;

describe('worked examples against independent recomputations', () => {
  it('every numeric example has a recomputation, and every recomputation an example', () => {
    expect(numeric.length).toBeGreaterThan(50);
    const keys = new Set(numeric.map((n) => n.key));
    expect(numeric.map((n) => n.key).filter((k) => !RECOMPUTED.has(k))).toEqual([]);
    expect([...RECOMPUTED.keys()].filter((k) => !keys.has(k))).toEqual([]);
  });

  it.each(numeric.map((n) => [n.key, n] as const))('%s', (key, { ex, stated }) => {
    const recomputed = (RECOMPUTED.get(key) as () => number)();
    const tol = ex.tol ?? 1e-9;
    expect(agrees(stated, recomputed, tol), `stated ${stated}, recomputed ${recomputed} (tol ${tol})`).toBe(
      true,
    );
  });

  it('each note names its source or kind, or says the value is recomputed in the tests', () => {
    const unsourced = numeric
      .filter(({ ex }) => !NAMED_SOURCE.test(ex.note) && !ex.note.includes('recomputed in the tests'))
      .map(({ key, ex }) => `${key}: ${ex.note}`);
    expect(unsourced).toEqual([]);
  });
});
