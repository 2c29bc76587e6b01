import { ArgumentError } from './ArgumentError';
import { assertMaterial } from './assertMaterial';
import { ConvergenceError } from './ConvergenceError';
import type { Material } from './Material';

const MAX_ITERATIONS = 60;

/**
 * Stress on the cyclic stress-strain curve for a strain: the inverse of {@link cyclicStrain},
 * solving σ/E + sign(σ)(|σ|/K')^(1/n') = ε for σ.
 *
 * Method: with s = ln|σ| the equation is ln(e^(s − ln E) + e^((s − ln K')/n')) = ln|ε|, whose
 * left side is convex and increasing in s. Newton's method started from the smaller of the two
 * single-term solutions (which lies on the high side of the root) therefore decreases
 * monotonically onto the root: bracketed by construction, no NaN, converged to about 1e-15
 * relative in σ, in one to a few steps. Sign-aware, exact at 0 (and -0 gives -0).
 *
 * Reference: the curve as in {@link cyclicStrain}; Newton's monotone convergence for convex
 * functions, e.g. J. M. Ortega and W. C. Rheinboldt, Iterative Solution of Nonlinear Equations
 * in Several Variables, Academic Press, 1970, section 13.3.
 *
 * @throws {ArgumentError} when `strain` is NaN or ±Infinity.
 * @example
 * cyclicStress(defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 }), 0.03375)
 * // returns 500 (to 1e-14 relative)
 */
export function cyclicStress(material: Material, strain: number): number {
  assertMaterial(material);
  if (!Number.isFinite(strain)) throw new ArgumentError('strain', strain, 'must be a finite number');
  if (strain === 0) return strain * material.E;
  const lnEps = Math.log(Math.abs(strain));
  const lnE = Math.log(material.E);
  const lnK = Math.log(material.K);
  const m = 1 / material.n;
  const sElastic = lnEps + lnE;
  const sPlastic = lnK + material.n * lnEps;
  let s = sElastic < sPlastic ? sElastic : sPlastic;
  // Error after a step is at most C·step² with C = max F'' / (2 min F') = (m − 1)² / 8.
  const c = ((m - 1) * (m - 1)) / 8;
  for (let k = 0; k < MAX_ITERATIONS; k++) {
    // The larger exponent is factored out: no term overflows or underflows to a NaN step.
    const ee = s - lnE - lnEps;
    const ep = m * (s - lnK) - lnEps;
    const top = ee > ep ? ee : ep;
    const te = Math.exp(ee - top);
    const tp = Math.exp(ep - top);
    const sum = te + tp;
    const step = ((top + Math.log(sum)) * sum) / (te + m * tp);
    // Every exact step from above the root is positive; one that is not is rounding at the root.
    const done = !(step > 0) || s - step === s; // a step below half an ulp leaves s where it is
    if (!done) s -= step;
    if (done || c * step * step <= 1e-15) {
      const sigma = Math.exp(s);
      return strain > 0 ? sigma : -sigma;
    }
  }
  throw new ConvergenceError('cyclicStress', MAX_ITERATIONS, s);
}
