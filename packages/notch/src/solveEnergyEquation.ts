import { ConvergenceError } from '@loopwise/material';

/** Default iteration cap of the notch-rule solves. */
export const DEFAULT_NOTCH_MAX_ITERATIONS = 60;
/** Default relative tolerance of the notch-rule solves. */
export const DEFAULT_NOTCH_TOLERANCE = 1e-14;

/**
 * Solves ln(e^(p1·s + c1) + e^(p2·s + c2)) = target for s (s = ln σ), with 0 < p1 < p2.
 *
 * Neuber (σ² /E + σ(σ/K')^(1/n') = a²/E) and Glinka (σ²/(2E) + σ(σ/K')^(1/n')/(1 + n') =
 * a²/(2E)) both have this form with p1 = 2, p2 = 1 + 1/n'. The left side is convex and
 * increasing in s; each single-term solution lies at or above the root, so Newton started from
 * the smaller of them decreases monotonically onto the root (bracketed, no NaN). The bound
 * C·step² on the remaining error, C = (p2 − p1)²/(8·p1) (from F'' ≤ (p2 − p1)²/4 and F' ≥ p1),
 * stops it; a step that is not positive (rounding at the root) stops it too. The larger term is
 * factored out of the sum, so no intermediate overflows for any finite target. Not exported
 * from the package.
 */
export function solveEnergyEquation(
  p1: number,
  c1: number,
  p2: number,
  c2: number,
  target: number,
  tolerance: number,
  maxIterations: number,
  solver: string,
): number {
  const s1 = (target - c1) / p1;
  const s2 = (target - c2) / p2;
  let s = s1 < s2 ? s1 : s2;
  const d = p2 - p1;
  const c = (d * d) / (8 * p1);
  const tol = tolerance > 1e-15 ? tolerance : 1e-15;
  const a1 = c1 - target;
  const a2 = c2 - target;
  for (let k = 0; k < maxIterations; k++) {
    // The larger exponent is factored out, so neither term overflows (1/n' up to 100 and
    // amplitudes from subnormal to overflow keep every intermediate finite).
    const e1 = p1 * s + a1;
    const e2 = p2 * s + a2;
    const top = e1 > e2 ? e1 : e2;
    const t1 = Math.exp(e1 - top);
    const t2 = Math.exp(e2 - top);
    const sum = t1 + t2;
    const step = ((top + Math.log(sum)) * sum) / (p1 * t1 + p2 * t2);
    // From above the root every exact step is positive (monotone Newton on a convex increasing
    // function); a step that is not is rounding at the root: converged as far as binary64 goes.
    if (!(step > 0) || s - step === s) return s; // (or below half an ulp of s: it stays where it is)
    s -= step;
    if (c * step * step <= tol) return s;
  }
  throw new ConvergenceError(solver, maxIterations, s);
}
