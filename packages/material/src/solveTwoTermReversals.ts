import { ArgumentError } from './ArgumentError';
import { ConvergenceError } from './ConvergenceError';

/**
 * Default cut-off of every reversals solve: 10^20 reversals. A strain amplitude (or damage
 * parameter) whose solution lies beyond it gets `Infinity` reversals with the flag
 * `below-cutoff`. It is far beyond any tested life, so it only replaces an extrapolation that
 * has no physical meaning (and would overflow) by "no damage"; an endurance cut-off in cycles
 * belongs to the damage sum, not here.
 */
export const DEFAULT_CUTOFF_REVERSALS = 1e20;

/** Default iteration cap of {@link solveTwoTermReversals}; typical solves take 2 to 5. */
export const DEFAULT_MAX_ITERATIONS = 40;

let cachedCutoff = DEFAULT_CUTOFF_REVERSALS;
let cachedLnCutoff = Math.log(DEFAULT_CUTOFF_REVERSALS);

/**
 * Solves the two-term power law of strain-life curves for reversals x = 2Nf:
 *
 *     A·x^p + B·x^q = Y,    A, B, Y > 0,  p, q < 0
 *
 * given in logarithms (`lnA` = ln A, `lnB` = ln B, `lnTarget` = ln Y) so that no term
 * overflows. Every strain-life equation of loopwise has this form: Coffin-Manson-Basquin
 * (A = σf'/E, p = b, B = εf', q = c, Y = εa), Morrow, modified Morrow, Smith-Watson-Topper
 * (A = σf'²/E, p = 2b, B = σf'εf', q = b + c, Y = σmax·εa) and Walker raised to the power 1/γ.
 *
 * Method: with u = ln x the left side in logarithms, g(u) = ln(e^(lnA + pu) + e^(lnB + qu)), is
 * convex and strictly decreasing. Each single-term solution u_i = (lnY − lnA_i)/p_i lies at or
 * below the root, and u_i + ln 2/|p_i| at or above it, which brackets the root. Newton's method
 * on g − ln Y started at the larger single-term solution (the dominant term) approaches the
 * root monotonically from below; it stops when the bound C·step² on the remaining error
 * (C = (p − q)² / (8·min(|p|,|q|)), from g'' ≤ (p − q)²/4 and |g'| ≥ min(|p|,|q|)) is below
 * 1e-12, i.e. x converged to better than 1e-10 relative. Iterates are clamped to the bracket.
 *
 * Results: the root x, or exactly 1 when the root is at or below one reversal (Y at or above
 * A + B, within the solver tolerance of 1e-12 in ln x), or `Infinity` when it is beyond `cutoffReversals` (including Y = 0, lnTarget = −∞).
 * Never NaN.
 *
 * Reference: Coffin-Manson-Basquin form as in ASTM E606/E606M, Standard Test Method for
 * Strain-Controlled Fatigue Testing, appendix X1; Newton's monotone convergence on convex
 * functions as in J. M. Ortega and W. C. Rheinboldt, Iterative Solution of Nonlinear Equations
 * in Several Variables, Academic Press, 1970, section 13.3.
 *
 * @param lnA ln A (finite)
 * @param p exponent of the first term (< 0)
 * @param lnB ln B (finite)
 * @param q exponent of the second term (< 0)
 * @param lnTarget ln Y; −∞ gives Infinity, +∞ gives 1
 * @param cutoffReversals reversals above which `Infinity` is returned; default {@link DEFAULT_CUTOFF_REVERSALS}
 * @param maxIterations iteration cap; default {@link DEFAULT_MAX_ITERATIONS}
 * @throws {ConvergenceError} when the cap is reached (only with a cap set far too low).
 * @throws {ArgumentError} when p or q is not < 0 or an input is NaN.
 * @example
 * // Coffin-Manson-Basquin with σf'/E = 0.005, b = -0.1, εf' = 1, c = -0.5 at εa = 0.01
 * solveTwoTermReversals(Math.log(0.005), -0.1, Math.log(1), -0.5, Math.log(0.01))
 * // returns 2Nf ≈ 2016.0 (reversals)
 */
export function solveTwoTermReversals(
  lnA: number,
  p: number,
  lnB: number,
  q: number,
  lnTarget: number,
  cutoffReversals: number = DEFAULT_CUTOFF_REVERSALS,
  maxIterations: number = DEFAULT_MAX_ITERATIONS,
): number {
  if (!(p < 0 && p > -Infinity)) throw new ArgumentError('p', p, 'must be a finite number < 0');
  if (!(q < 0 && q > -Infinity)) throw new ArgumentError('q', q, 'must be a finite number < 0');
  if (cutoffReversals !== cachedCutoff) {
    if (!(cutoffReversals >= 1)) throw new ArgumentError('cutoffReversals', cutoffReversals, 'must be a number >= 1');
    cachedCutoff = cutoffReversals;
    cachedLnCutoff = Math.log(cutoffReversals);
  }
  const lnCutoff = cachedLnCutoff;
  const a = lnA - lnTarget;
  const b = lnB - lnTarget;
  const ua = -a / p;
  const ub = -b / q;
  const lo = ua > ub ? ua : ub;
  if (ua !== ua || ub !== ub) {
    // one of the logs is NaN, or lnTarget is an infinity that another equal infinity cancels
    const field = lnA !== lnA ? 'lnA' : lnB !== lnB ? 'lnB' : 'lnTarget';
    throw new ArgumentError(
      field,
      field === 'lnA' ? lnA : field === 'lnB' ? lnB : lnTarget,
      'must not be NaN, and lnA − lnTarget and lnB − lnTarget must be numbers',
    );
  }
  if (lo >= lnCutoff) return Infinity;
  const ha = ua - Math.LN2 / p;
  const hb = ub - Math.LN2 / q;
  const hi = ha > hb ? ha : hb;
  if (hi <= 0) return 1;
  const d = p - q;
  const c = (d * d) / (8 * (p > q ? -p : -q));
  let u = lo > 0 ? lo : 0;
  for (let k = 0; k < maxIterations; k++) {
    const ta = Math.exp(a + p * u);
    const tb = Math.exp(b + q * u);
    const s = ta + tb;
    const g = Math.log(s);
    if (u === 0 && g <= 0) return 1;
    const step = (-g * s) / (p * ta + q * tb);
    // From the low end of the bracket every exact step is positive (monotone Newton on a convex
    // decreasing function); one that is not is rounding at the root.
    // A step below half an ulp of u leaves u where it is: converged as far as binary64 goes.
    if (!(step > 0) || u + step === u) return u <= 1e-12 ? 1 : Math.exp(u);
    u += step;
    if (u > hi) u = hi;
    if (u >= lnCutoff) return Infinity;
    // A root within the solver's tolerance of one reversal is reported as exactly 1.
    if (c * step * step <= 1e-12) return u <= 1e-12 ? 1 : Math.exp(u);
  }
  throw new ConvergenceError('solveTwoTermReversals', maxIterations, u);
}
