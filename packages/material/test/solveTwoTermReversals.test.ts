import { describe, expect, it } from 'vitest';
import { ArgumentError, ConvergenceError, solveTwoTermReversals } from '@loopwise/material';

const ln = Math.log;

describe('solveTwoTermReversals(lnA, p, lnB, q, lnTarget, cutoffReversals?, maxIterations?)', () => {
  it('solves A x^p + B x^q = Y to 1e-10 relative', () => {
    const x = solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(0.01));
    expect(Math.abs((0.005 * x ** -0.1 + x ** -0.5) / 0.01 - 1)).toBeLessThan(1e-12);
  });
  it('returns exactly 1 when Y >= A + B and Infinity beyond the cut-off or for Y = 0', () => {
    expect(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(1.005))).toBe(1);
    expect(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(50))).toBe(1);
    expect(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, Infinity)).toBe(1);
    expect(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, -Infinity)).toBe(Infinity);
    expect(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(1e-9))).toBe(Infinity);
    // a custom cut-off: at Y for x = 1e6 the solve just passes a cut-off of 1e6 (within rounding)
    const y = 0.005 * 1e6 ** -0.1 + 1e6 ** -0.5;
    expect(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(y * 0.999), 1e6)).toBe(Infinity);
    expect(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(y * 1.001), 1e6)).toBeLessThan(1e6);
  });
  it('the iteration cap is enforced: maxIterations 1 throws ConvergenceError on a case needing more', () => {
    expect(() => solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(0.01), 1e20, 1)).toThrow(ConvergenceError);
    try {
      solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(0.01), 1e20, 1);
    } catch (e) {
      expect((e as ConvergenceError).code).toBe('not-converged');
      expect((e as ConvergenceError).maxIterations).toBe(1);
    }
    expect(() => solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(0.01), 1e20, 8)).not.toThrow();
  });
  it('rejects exponents that are not negative, NaN inputs and a cut-off below 1', () => {
    expect(() => solveTwoTermReversals(0, 0, 0, -0.5, 0)).toThrow(ArgumentError);
    expect(() => solveTwoTermReversals(0, -0.1, 0, 0.2, 0)).toThrow(ArgumentError);
    expect(() => solveTwoTermReversals(NaN, -0.1, 0, -0.5, 0)).toThrow(/NaN/);
    expect(() => solveTwoTermReversals(0, -0.1, 0, -0.5, NaN)).toThrow(ArgumentError);
    expect(() => solveTwoTermReversals(0, -0.1, 0, -0.5, -1, 0.5)).toThrow(/cutoffReversals/);
  });
});
