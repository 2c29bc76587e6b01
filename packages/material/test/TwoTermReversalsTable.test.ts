import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ArgumentError, ConvergenceError, solveTwoTermReversals, TwoTermReversalsTable } from '@loopwise/material';
import { checkProperty } from '../../../test/property';
import { realisticMaterial } from './arbitraries';

const ln = Math.log;
const range = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
/** Relative difference; 0 for equal values (including equal infinities). */
const rel = (a: number, b: number) => (a === b ? 0 : Math.abs(a / b - 1));

/**
 * The two-term equations of loopwise for a material: fully reversed curve (A = σf'/E, p = b,
 * B = εf', q = c), SWT (A = σf'²/E, p = 2b, B = σf'εf', q = b + c) and Walker raised to 1/γ.
 */
const equation = fc
  .tuple(realisticMaterial, fc.constantFrom('none', 'swt', 'walker'), range(0.2, 1))
  .map(([m, kind, gamma]) => {
    if (kind === 'none') return { lnA: ln(m.sigmaF / m.E), p: m.b, lnB: ln(m.epsilonF), q: m.c };
    if (kind === 'swt') return { lnA: 2 * ln(m.sigmaF) - ln(m.E), p: 2 * m.b, lnB: ln(m.sigmaF * m.epsilonF), q: m.b + m.c };
    const k = (1 - gamma) / gamma;
    return { lnA: ln(m.sigmaF) / gamma - ln(m.E), p: m.b / gamma, lnB: k * ln(m.sigmaF) + ln(m.epsilonF), q: m.b * k + m.c };
  });

/** ln Y of the equation at ln x = u. */
const lnTargetAt = (e: { lnA: number; p: number; lnB: number; q: number }, u: number) =>
  ln(Math.exp(e.lnA + e.p * u) + Math.exp(e.lnB + e.q * u));

describe('new TwoTermReversalsTable(lnA, p, lnB, q, options?).solve(lnTarget, shift?)', () => {
  it('equals solveTwoTermReversals to 1e-12 relative over the whole bracket, the table ends and beyond them', () => {
    checkProperty(
      'table = plain solver',
      fc.property(equation, fc.array(range(-3, 50), { minLength: 1, maxLength: 40 }), (e, us) => {
        // Arrange: the whole bracket (default range) and a range cut to the generated targets
        const targets = us.map((u) => lnTargetAt(e, u));
        const whole = new TwoTermReversalsTable(e.lnA, e.p, e.lnB, e.q);
        const cut = new TwoTermReversalsTable(e.lnA, e.p, e.lnB, e.q, {
          lnTargetMin: Math.min(...targets), lnTargetMax: Math.max(...targets),
        });
        // the ends of both tables, just inside and outside them, and the special targets
        const ends = [lnTargetAt(e, 0), lnTargetAt(e, ln(1e20)), Math.min(...targets), Math.max(...targets)];
        const all = [...targets, ...ends.flatMap((t) => [t, t * (1 + 1e-15), t * (1 - 1e-15), t + 1e-6, t - 1e-6])];
        all.push(-Infinity, Infinity, -1e300, 1e300);
        for (const t of all) {
          // Act
          const expected = solveTwoTermReversals(e.lnA, e.p, e.lnB, e.q, t);
          // Assert: 1 and Infinity exactly, roots to the solver's tolerance, never NaN
          for (const table of [whole, cut]) {
            const got = table.solve(t);
            expect(Number.isNaN(got)).toBe(false);
            if (expected === 1 || expected === Infinity) expect(got).toBe(expected);
            else expect(rel(got, expected)).toBeLessThan(1e-12);
          }
        }
      }),
      { numRuns: 200 },
    );
  });

  it('solve(lnTarget, shift) equals solveTwoTermReversals(lnA + p·shift, p, lnB + q·shift, q, lnTarget)', () => {
    checkProperty(
      'shifted table = plain solver',
      fc.property(equation, range(-4, 4), range(0, 6), fc.array(range(-1, 48), { minLength: 1, maxLength: 20 }), (e, s0, ds, us) => {
        const table = new TwoTermReversalsTable(e.lnA, e.p, e.lnB, e.q, { minShift: s0, maxShift: s0 + ds });
        for (const u of us) {
          const shift = s0 + ds * ((u + 1) / 49);
          const lnA = e.lnA + e.p * shift;
          const lnB = e.lnB + e.q * shift;
          const t = ln(Math.exp(lnA + e.p * u) + Math.exp(lnB + e.q * u));
          const expected = solveTwoTermReversals(lnA, e.p, lnB, e.q, t);
          const got = table.solve(t, shift);
          if (expected === 1 || expected === Infinity) expect(got).toBe(expected);
          else expect(rel(got, expected)).toBeLessThan(1e-12);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('one Newton step from the table start passes the stopping rule (maxIterations 1) where the plain solver needs more', () => {
    // Coffin-Manson-Basquin with σf'/E = 0.005, b = -0.1, εf' = 1, c = -0.5 (invented values)
    const table = new TwoTermReversalsTable(ln(0.005), -0.1, ln(1), -0.5, { maxIterations: 1 });
    expect(() => solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(0.01), 1e20, 1)).toThrow(ConvergenceError);
    expect(rel(table.solve(ln(0.01)), solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, ln(0.01)))).toBeLessThan(1e-12);
  });

  it('the iteration cap is enforced from the table start: maxIterations 0 throws ConvergenceError', () => {
    const table = new TwoTermReversalsTable(ln(0.005), -0.1, ln(1), -0.5, { maxIterations: 0 });
    expect(table.cells).toBeGreaterThan(0);
    expect(() => table.solve(ln(0.01))).toThrow(ConvergenceError);
    try {
      table.solve(ln(0.01));
    } catch (err) {
      expect((err as ConvergenceError).code).toBe('not-converged');
      expect((err as ConvergenceError).maxIterations).toBe(0);
    }
  });

  it('an empty or inverted target range gives a table without cells that still solves every target', () => {
    const t = ln(0.01);
    for (const options of [{ lnTargetMin: t, lnTargetMax: t }, { lnTargetMin: 1, lnTargetMax: -1 }, { lnTargetMin: Infinity, lnTargetMax: -Infinity }]) {
      const table = new TwoTermReversalsTable(ln(0.005), -0.1, ln(1), -0.5, options);
      expect(table.cells).toBe(0);
      expect(table.solve(t)).toBe(solveTwoTermReversals(ln(0.005), -0.1, ln(1), -0.5, t));
    }
  });

  it('rejects bad exponents, infinite or NaN logarithms, a cut-off below 1, inverted shifts and NaN targets', () => {
    expect(() => new TwoTermReversalsTable(0, 0, 0, -0.5)).toThrow(ArgumentError);
    expect(() => new TwoTermReversalsTable(0, -0.1, 0, 0.2)).toThrow(/q/);
    expect(() => new TwoTermReversalsTable(NaN, -0.1, 0, -0.5)).toThrow(/lnA/);
    expect(() => new TwoTermReversalsTable(0, -0.1, Infinity, -0.5)).toThrow(/lnB/);
    expect(() => new TwoTermReversalsTable(0, -0.1, 0, -0.5, { cutoffReversals: 0.5 })).toThrow(/cutoffReversals/);
    expect(() => new TwoTermReversalsTable(0, -0.1, 0, -0.5, { minShift: 1, maxShift: 0 })).toThrow(/minShift/);
    expect(() => new TwoTermReversalsTable(0, -0.1, 0, -0.5, { lnTargetMin: NaN })).toThrow(/lnTargetMin/);
    const table = new TwoTermReversalsTable(ln(0.005), -0.1, ln(1), -0.5);
    expect(() => table.solve(NaN)).toThrow(/NaN/);
    expect(() => table.solve(ln(0.01), NaN)).toThrow(ArgumentError);
  });
});
