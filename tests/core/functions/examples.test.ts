// Every spec's worked examples through the pure compute path (evaluate). The same examples are
// run through the engine and as expanded plain formulas by the engine's tests.
import { describe, expect, it } from 'vitest';
import { CATALOGUE } from '../../../src/core/functions/index.ts';
import { evaluate } from '../../../src/core/registry/evaluate.ts';

describe.each(CATALOGUE.map((spec) => [spec.name, spec] as const))('%s examples', (_name, spec) => {
  it('has examples', () => {
    expect(spec.examples.length).toBeGreaterThanOrEqual(2);
  });
  it.each(spec.examples.map((ex) => [ex.note, ex] as const))('%s', (_note, ex) => {
    const r = evaluate(spec, ex.args);
    if (typeof ex.expect === 'number') {
      expect(r.ok, r.ok ? '' : r.message).toBe(true);
      const value = r.ok ? r.value : Number.NaN;
      const tol = ex.tol ?? 1e-9;
      expect(Math.abs(value - ex.expect)).toBeLessThanOrEqual(tol * Math.max(Math.abs(ex.expect), 1e-300));
    } else {
      expect(r.ok).toBe(false);
      expect(r.ok ? '' : r.message).toMatch(new RegExp(`^${spec.name.replace(/\./g, '\\.')}: `));
      expect(r.ok ? '' : r.message.slice(spec.name.length + 2)).toContain(ex.expect.error);
      expect(r.ok ? '' : r.message.slice(spec.name.length + 2).startsWith(ex.expect.error)).toBe(true);
    }
  });
});
