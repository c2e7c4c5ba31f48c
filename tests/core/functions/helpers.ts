// Shared helpers for the catalogue tests.
import { expect } from 'vitest';
import { evaluate, type RawArg } from '../../../src/core/registry/evaluate.ts';
import type { FunctionSpec } from '../../../src/core/registry/spec.ts';

/** The value of a call that must succeed (fails the test with the message otherwise). */
export function value(spec: FunctionSpec, ...args: RawArg[]): number {
  const r = evaluate(spec, args);
  if (!r.ok) expect.fail(r.message);
  return r.value;
}

/** The error message of a call that must fail. */
export function failure(spec: FunctionSpec, ...args: RawArg[]): string {
  const r = evaluate(spec, args);
  if (r.ok) expect.fail(`${spec.name}(${args.join(', ')}) gave ${r.value}, expected an error`);
  return r.message;
}

/** |actual − expected| ≤ tol·|expected| (relative), with a message that shows both. */
export function expectRel(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected), `${actual} vs ${expected} (rel tol ${tol})`).toBeLessThanOrEqual(
    tol * Math.abs(expected),
  );
}

/** |actual − expected| ≤ tol (absolute). */
export function expectAbs(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected), `${actual} vs ${expected} (abs tol ${tol})`).toBeLessThanOrEqual(tol);
}
