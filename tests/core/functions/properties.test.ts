// Property tests (fast-check): robustness of every function against any input, and the
// identities and sign conventions the catalogue promises.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CATALOGUE, findFunction } from '../../../src/core/functions/index.ts';
import { evaluate, inMagnitude, type RawArg } from '../../../src/core/registry/evaluate.ts';
import type { FunctionSpec } from '../../../src/core/registry/spec.ts';
import { value } from './helpers.ts';

const fn = (name: string): FunctionSpec => findFunction(name) as FunctionSpec;

/** Anything a cell or a caller can hand over, weighted towards awkward numbers. */
const rawArg: fc.Arbitrary<RawArg> = fc.oneof(
  fc.double(), // includes NaN, ±Infinity, ±0, subnormals
  fc.constantFrom(
    0,
    1,
    -1,
    0.5,
    100,
    1e-300,
    1e300,
    -1e300,
    Number.MAX_VALUE,
    Number.MIN_VALUE,
    Number.NaN,
    Infinity,
    -Infinity,
  ),
  fc.double({ min: -1000, max: 1000, noNaN: true }),
  fc.string({ maxLength: 6 }),
  fc.boolean(),
  fc.constant(null),
  fc.constant(undefined),
);

describe('robustness', () => {
  it.each(CATALOGUE.map((s) => [s.name, s] as const))(
    '%s never throws; results are finite numbers or named errors',
    (_n, spec) => {
      fc.assert(
        fc.property(fc.array(rawArg, { minLength: 0, maxLength: spec.params.length + 1 }), (args) => {
          const r = evaluate(spec, args);
          if (r.ok) return Number.isFinite(r.value);
          return (
            r.message.startsWith(`${spec.name}: `) &&
            !r.message.includes('internal error') &&
            !r.message.includes('undefined')
          );
        }),
        { numRuns: 300 },
      );
    },
  );
});

/** Numbers only, mixing plausible values with extremes, so that many calls reach the compute. */
// Plausible values weigh most, so that with every argument drawn some calls pass the size rule.
const numericArg = fc.oneof(
  { arbitrary: fc.constantFrom(0, 0.5, 0.8, 0.95, 1, 1.2, 7, 14, 50, 60, 100, 400, 1000), weight: 4 },
  {
    arbitrary: fc.constantFrom(1e-300, 1e300, Number.MAX_VALUE, Number.MIN_VALUE, 5e-324, -1e300),
    weight: 1,
  },
  { arbitrary: fc.double({ min: -1e3, max: 1e3, noNaN: true }), weight: 1 },
);

describe('robustness at extreme magnitudes', () => {
  it.each(CATALOGUE.map((s) => [s.name, s] as const))(
    '%s: huge and tiny numbers give finite results or named errors',
    (_n, spec) => {
      let computed = 0;
      fc.assert(
        fc.property(
          // Each argument: half the time the value of the spec's first worked example (valid), so
          // enough calls pass validation to reach the compute with the others extreme.
          fc.tuple(
            ...spec.params.map((_, i) => {
              const valid = spec.examples.find((e) => typeof e.expect === 'number')?.args[i];
              return valid === undefined ? numericArg : fc.oneof(fc.constant(valid as RawArg), numericArg);
            }),
          ),
          (args) => {
            const r = evaluate(spec, args);
            if (r.ok) computed++;
            return r.ok
              ? Number.isFinite(r.value)
              : r.message.startsWith(`${spec.name}: `) && !r.message.includes('internal error');
          },
        ),
        { numRuns: 400 },
      );
      expect(computed).toBeGreaterThan(0); // the property reached the compute, not only validation
    },
  );
});

/**
 * Doubles in [min, max] that the catalogue takes: 0 or between 1e-30 and 1e30 in size (evaluate.ts
 * MAGNITUDE). Subnormal and other tiny values are refused by rule, so the identities skip them.
 */
const finite = (min: number, max: number) =>
  fc.double({ min, max, noNaN: true, noDefaultInfinity: true }).filter(inMagnitude);
const cos = fc.double({ min: 0.01, max: 1, noNaN: true });

describe('identities', () => {
  it('KVA.TOTAL² = P² + Q² (relative 1e-9)', () => {
    // the whole range of sizes the catalogue takes (0 or 1e-30 … 1e30)
    const power = finite(-1e30, 1e30);
    fc.assert(
      fc.property(power, power, (p, q) => {
        const s = value(fn('KVA.TOTAL'), p, q);
        const sum = p * p + q * q;
        return Math.abs(s * s - sum) <= 1e-9 * sum;
      }),
    );
  });
  it('COSPHI and TANPHI agree: cos = 1/√(1 + tan²)', () => {
    fc.assert(
      fc.property(
        finite(-1e6, 1e6).filter((p) => Math.abs(p) > 1e-6),
        finite(-1e6, 1e6),
        (p, q) => {
          const c = value(fn('COSPHI'), p, q);
          const t = value(fn('TANPHI'), p, q);
          return Math.abs(c - 1 / Math.sqrt(1 + t * t)) <= 1e-12;
        },
      ),
    );
  });
  it('KVAR.PERKW(a, b) = −KVAR.PERKW(b, a)', () => {
    fc.assert(
      fc.property(cos, cos, (a, b) => value(fn('KVAR.PERKW'), a, b) === -value(fn('KVAR.PERKW'), b, a)),
    );
  });
  it('KVAR.CAPBANK and KVAR.REACTOR scale with U²', () => {
    fc.assert(
      fc.property(finite(1, 1e4), finite(0.1, 100), finite(0.2, 5), finite(0, 14), (q, ur, k, p) => {
        const u = ur * 0.9;
        const bank1 = value(fn('KVAR.CAPBANK'), q, ur, u, p);
        const bank2 = value(fn('KVAR.CAPBANK'), q, ur, k * u, p);
        const re1 = value(fn('KVAR.REACTOR'), q, ur, u);
        const re2 = value(fn('KVAR.REACTOR'), q, ur, k * u);
        return (
          Math.abs(bank2 - k * k * bank1) <= 1e-9 * Math.abs(bank2) &&
          Math.abs(re2 - k * k * re1) <= 1e-9 * re2
        );
      }),
    );
  });
  it('KVAR.CAPBANK with a detuning reactor delivers more than without, by 1/(1 − p/100) at rated frequency', () => {
    fc.assert(
      fc.property(finite(1, 1e4), finite(0.1, 100), finite(0.5, 14), (q, ur, p) => {
        const plain = value(fn('KVAR.CAPBANK'), q, ur, ur);
        const detuned = value(fn('KVAR.CAPBANK'), q, ur, ur, p);
        return Math.abs(detuned - plain / (1 - p / 100)) <= 1e-9 * Math.abs(detuned);
      }),
    );
  });
  it('BANK.ROUNDUP gives whole steps, at least the need, less than one step more', () => {
    fc.assert(
      fc.property(finite(1e-3, 1e5), finite(0.5, 500), (q, step) => {
        const built = value(fn('BANK.ROUNDUP'), q, step);
        const steps = built / step;
        return Math.abs(steps - Math.round(steps)) < 1e-6 && built >= q * (1 - 1e-9) && built < q + step;
      }),
    );
  });
  it('RESONANCE.ORDER without detuning is √(Ssc·1000/Qc) and VRISE.PCT = 100/h²', () => {
    fc.assert(
      fc.property(finite(1, 1e4), finite(1, 1e5), (ssc, qc) => {
        const h = value(fn('RESONANCE.ORDER'), ssc, qc);
        return (
          Math.abs(h - Math.sqrt((ssc * 1000) / qc)) <= 1e-12 * h &&
          Math.abs(value(fn('VRISE.PCT'), qc, ssc) - 100 / (h * h)) <= 1e-9 * (100 / (h * h))
        );
      }),
    );
  });
});

describe('sign convention (load reference: Q > 0 absorbed, Q < 0 delivered)', () => {
  it('capacitor banks deliver (< 0) and reactors absorb (> 0)', () => {
    fc.assert(
      fc.property(finite(1, 1e4), finite(0.1, 100), finite(0.5, 1.2), finite(0, 14), (q, ur, k, p) => {
        return (
          value(fn('KVAR.CAPBANK'), q, ur, k * ur, p) < 0 && value(fn('KVAR.REACTOR'), q, ur, k * ur) > 0
        );
      }),
    );
  });
  it('cables deliver (< 0)', () => {
    fc.assert(
      fc.property(
        finite(0.4, 400),
        finite(0.05, 1),
        finite(0.01, 100),
        (u, c, len) => value(fn('KVAR.CABLE'), u, c, len) < 0,
      ),
    );
  });
  it('over-excited generators deliver (≤ 0); under-excited absorb (≥ 0)', () => {
    fc.assert(
      fc.property(
        finite(0, 1e5),
        cos,
        (p, c) => value(fn('KVAR.GEN'), p, c) <= 0 && value(fn('KVAR.GEN'), p, c, true) >= 0,
      ),
    );
  });
  it('motors and transformers absorb (≥ 0); lagging loads absorb, leading loads deliver', () => {
    fc.assert(
      fc.property(
        finite(0, 1e4),
        finite(0.5, 1),
        fc.double({ min: 0.5, max: 0.99, noNaN: true }),
        finite(0, 1.5),
        (p, eff, c, x) => {
          const i0 = 50 * Math.sqrt(1 - c * c); // half of the largest consistent no-load current
          return (
            value(fn('KVAR.MOTOR'), p, eff, c, x) >= 0 &&
            value(fn('KVAR.MOTOR'), p, eff, c, x, i0) >= 0 &&
            value(fn('KVAR.LOAD'), p, c) >= 0 &&
            value(fn('KVAR.LOAD'), p, c, true) <= 0
          );
        },
      ),
    );
    fc.assert(
      fc.property(finite(10, 1e5), finite(0.2, 3), finite(3, 15), finite(0, 2), (s, i0, uk, x) => {
        return (
          value(fn('KVAR.XFMR.MAG'), s, i0) > 0 &&
          value(fn('KVAR.XFMR.LEAK'), s, uk, x * s, (uk * s) / 400) >= 0
        );
      }),
    );
  });
});
