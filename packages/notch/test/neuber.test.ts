import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ConvergenceError, handbookSteels } from '@loopwise/material';
import { glinka, glinkaRange, linearRule, linearRuleRange, neuber, neuberRange, NotchOptionError } from '@loopwise/notch';
import { checkProperty } from '../../../test/property';
import { bisect, curveStrain, realisticMaterial, sae1045 } from './support';

describe('neuber(material, pseudoStress)', () => {
  it('satisfies the product identity σ·ε = (Kt·S)²/E and lies on the cyclic curve to 1e-10', () => {
    checkProperty(
      'neuber product identity',
      fc.property(realisticMaterial, fc.double({ min: 1, max: 3000, noNaN: true }), (m, e) => {
        const r = neuber(m, e);
        expect(Math.abs((r.stress * r.strain * m.E) / (e * e) - 1)).toBeLessThan(1e-10);
        expect(Math.abs(curveStrain(m, r.stress) / r.strain - 1)).toBeLessThan(1e-10);
      }),
    );
  });

  it('published check: SAE 1045 at Kt·S = 600 MPa matches an independent bisection (expected value computed from the equations)', () => {
    // Constants: N. E. Dowling, Mechanical Behavior of Materials, Pearson, Table 14.1 (handbookSteels).
    // The expected value is computed here from Neuber's equation by bisection, not taken from a book.
    const m = handbookSteels.find((x) => x.name === 'SAE 1045 (hot rolled and normalized)')!;
    const want = bisect((s) => s * curveStrain(m, s) - (600 * 600) / m.E, 0, 600);
    expect(neuber(m, 600).stress).toBeCloseTo(want, 9);
    expect(Math.abs(neuber(m, 600).stress / want - 1)).toBeLessThan(1e-12);
  });

  it('is odd and exact at 0 and -0', () => {
    expect(neuber(sae1045, -500).stress).toBe(-neuber(sae1045, 500).stress);
    expect(Object.is(neuber(sae1045, -0).stress, -0)).toBe(true);
    expect(neuber(sae1045, 0)).toEqual({ stress: 0, strain: 0 });
  });

  it('elastic limit (huge K\'): σ = Kt·S exactly', () => {
    const m = { ...sae1045, K: 1e12, warnings: [] };
    expect(neuber(m, 400)).toEqual({ stress: 400, strain: 400 / m.E });
  });

  it('neuberRange is twice the first-loading solution at half the range', () => {
    const r = neuberRange(sae1045, -1200);
    expect(r.stressRange).toBe(-2 * neuber(sae1045, 600).stress);
    expect(r.stressRange * r.strainRange * sae1045.E).toBeCloseTo(1200 * 1200, 4);
  });

  it('bad input: NaN, Infinity, bad options; an iteration cap that is too low throws ConvergenceError', () => {
    expect(() => neuber(sae1045, NaN)).toThrow(NotchOptionError);
    expect(() => neuber(sae1045, Infinity)).toThrow(/pseudoStress/);
    expect(() => neuber(sae1045, 1, { tolerance: 0 })).toThrow(NotchOptionError);
    expect(() => neuber(sae1045, 2000, { maxIterations: 1 })).toThrow(ConvergenceError);
    // a huge load gives finite numbers, never NaN
    const r = neuber(sae1045, 1e12);
    expect(Number.isFinite(r.stress) && Number.isFinite(r.strain)).toBe(true);
  });
});

describe('glinka(material, pseudoStress)', () => {
  it('energy identity: ∫σ dε along the cyclic curve (numerical integration in the test) equals (Kt·S)²/(2E) to 1e-10', () => {
    checkProperty(
      'glinka energy identity',
      fc.property(realisticMaterial, fc.double({ min: 50, max: 2500, noNaN: true }), (m, e) => {
        const r = glinka(m, e);
        // ∫0^σ s dε(s) = ∫0^σ s ε'(s) ds, Gauss-Legendre on 64 panels (independent of the closed form).
        const g = [-0.906179845938664, -0.5384693101056831, 0, 0.5384693101056831, 0.906179845938664];
        const wts = [0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891];
        const dEps = (s: number) => 1 / m.E + Math.pow(s / m.K, 1 / m.n) / (m.n * s);
        let W = 0;
        const P = 64;
        for (let p = 0; p < P; p++) {
          const a = (r.stress * p) / P;
          const b = (r.stress * (p + 1)) / P;
          for (let q = 0; q < 5; q++) {
            const s = 0.5 * (a + b) + 0.5 * (b - a) * g[q];
            W += 0.5 * (b - a) * wts[q] * s * dEps(s);
          }
        }
        expect(Math.abs(W / ((e * e) / (2 * m.E)) - 1)).toBeLessThan(1e-10);
      }),
    );
  });

  it('gives less local strain than Neuber and more than the linear rule', () => {
    const g = glinka(sae1045, 900).strain;
    expect(g).toBeLessThan(neuber(sae1045, 900).strain);
    expect(g).toBeGreaterThan(linearRule(sae1045, 900).strain);
    expect(glinkaRange(sae1045, 1800).strainRange).toBe(2 * g);
  });
});

describe('linearRule(material, pseudoStress)', () => {
  it('local strain equals the pseudo-elastic strain; stress on the cyclic curve', () => {
    const r = linearRule(sae1045, 700);
    expect(r.strain).toBe(700 / sae1045.E);
    expect(curveStrain(sae1045, r.stress)).toBeCloseTo(r.strain, 15);
    expect(linearRuleRange(sae1045, 1400).strainRange).toBe(1400 / sae1045.E);
  });
});
