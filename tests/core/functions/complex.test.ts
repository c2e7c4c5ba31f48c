// Independent reference: complex power S = √3·U·I* computed with a general-purpose complex-number
// library (complex.js) for random phasors, against the power-triangle and load functions.
import { describe, it } from 'vitest';
import fc from 'fast-check';
import Complex from 'complex.js';
import { findFunction } from '../../../src/core/functions/index.ts';
import type { FunctionSpec } from '../../../src/core/registry/spec.ts';
import { value } from './helpers.ts';

const fn = (name: string): FunctionSpec => findFunction(name) as FunctionSpec;

/** A line-to-line voltage phasor (kV) and a line current phasor (A): S in kVA. */
const phasors = fc.record({
  u: fc.double({ min: 0.1, max: 500, noNaN: true }),
  uArg: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
  i: fc.double({ min: 0.01, max: 5000, noNaN: true }),
  iArg: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
});

function complexPower({ u, uArg, i, iArg }: { u: number; uArg: number; i: number; iArg: number }) {
  const U = new Complex({ abs: u, arg: uArg });
  const I = new Complex({ abs: i, arg: iArg });
  const S = U.mul(I.conjugate()).mul(Math.sqrt(3));
  // Rounding residue (Q = 1e-33 for equal angles) is 0: the catalogue refuses sizes below 1e-30.
  const zeroed = (x: number) => (Math.abs(x) < 1e-30 ? 0 : x);
  return { p: zeroed(S.re), q: zeroed(S.im), s: S.abs(), phi: uArg - iArg };
}

const close = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol * Math.max(Math.abs(b), 1e-300);
/**
 * Q rebuilt from P and cos φ is ill-conditioned near cos φ = 1 (sin φ = √(1 − cos²φ) loses digits),
 * so compare it with the scale of S: √(2·ε) ≈ 2e-8 of |S| is the best any route can do.
 */
const closeToScale = (a: number, b: number, scale: number) => Math.abs(a - b) <= 1e-7 * scale;

describe('complex power S = √3·U·I* (complex.js) agrees with the catalogue', () => {
  it('KVA.TOTAL = |S|', () => {
    fc.assert(
      fc.property(phasors, (ph) => {
        const { p, q, s } = complexPower(ph);
        return close(value(fn('KVA.TOTAL'), p, q), s, 1e-12) && close(s, Math.sqrt(3) * ph.u * ph.i, 1e-12);
      }),
    );
  });
  it('COSPHI = |cos(φu − φi)| and TANPHI = tan(φu − φi)', () => {
    fc.assert(
      fc.property(phasors, (ph) => {
        const { p, q, phi } = complexPower(ph);
        if (Math.abs(Math.cos(phi)) < 1e-6) return true; // tan undefined near ±90°
        const t = Math.tan(phi);
        return (
          Math.abs(value(fn('COSPHI'), p, q) - Math.abs(Math.cos(phi))) <= 1e-12 &&
          Math.abs(value(fn('TANPHI'), p, q) - t) <= 1e-9 * (1 + Math.abs(t))
        );
      }),
    );
  });
  it('KVAR.LOAD(P, cos φ, leading = Q < 0) gives back Im(S) for consumed power', () => {
    fc.assert(
      fc.property(phasors, (ph) => {
        const { p, q, s } = complexPower(ph);
        if (p <= 0) return true; // KVAR.LOAD describes a consuming load
        const c = value(fn('COSPHI'), p, q);
        if (c < 1e-6) return true; // nearly pure reactive: tan φ amplifies the rounding of P
        return closeToScale(value(fn('KVAR.LOAD'), p, c, q < 0), q, s);
      }),
    );
  });
  it('KVAR.GEN(P, cos φ) gives back Im(S) of a machine delivering P and kvar (generator reference flipped)', () => {
    fc.assert(
      fc.property(phasors, (ph) => {
        const { p, q, s } = complexPower(ph);
        // a generator delivering P (load-reference P < 0) and kvar (load-reference Q < 0)
        if (p >= 0 || q >= 0) return true;
        const c = value(fn('COSPHI'), p, q);
        if (c < 1e-6) return true;
        return closeToScale(value(fn('KVAR.GEN'), -p, c), q, s);
      }),
    );
  });
});
