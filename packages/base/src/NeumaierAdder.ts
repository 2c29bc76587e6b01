/**
 * A running sum with Neumaier's compensation ("improved Kahan-Babuška" summation): the rounding
 * error of every addition is computed exactly and kept in a second term, so millions of small
 * terms (damages of 1e-12 beside a total of 1e-3) and terms that cancel add up as if the sum
 * were carried in twice the working precision and rounded once, in any order of size.
 *
 * Method: t = s + x; c += (|s| >= |x|) ? (s − t) + x : (x − t) + s; s = t; the value is s + c.
 * The bracket is the exact rounding error of s + x (Dekker's fast two-sum, exact when the larger
 * term comes first). Error bound: |result − exact| <= u·|exact| + γ(n−1)²·Σ|xᵢ|, with u = 2⁻⁵³
 * and γ(k) = k·u / (1 − k·u) (Ogita, Rump and Oishi 2005, whose Sum2 accumulates the same exact
 * errors); the plain sum's bound is γ(n−1)·Σ|xᵢ|. Not exact in general: when two large terms
 * of different size are open at once, the errors they leave can swamp small terms.
 *
 * Non-finite terms: once a term or a partial sum is ±Infinity or NaN, the compensation would
 * turn an infinite sum into NaN (∞ − ∞), so the adder then returns the plain sum: a sum with an
 * Infinity term is ±Infinity, one with both infinities or a NaN is NaN, and a sum of finite terms
 * whose partial sums overflow is ±Infinity. The value of no terms is 0; -0 terms give 0.
 *
 * References: A. Neumaier, "Rundungsfehleranalyse einiger Verfahren zur Summation endlicher
 * Summen", Z. Angew. Math. Mech. 54 (1974) 39-51, doi:10.1002/zamm.19740540106;
 * T. Ogita, S. M. Rump and S. Oishi, "Accurate sum and dot product", SIAM J. Sci. Comput. 26(6)
 * (2005) 1955-1988 (the error bound).
 *
 * @example
 * const a = new NeumaierAdder();
 * a.add(1).add(1e100).add(1).add(-1e100).valueOf()
 * // returns 2
 */
export class NeumaierAdder {
  private s = 0;
  private c = 0;
  private finite = true;

  /** Adds one term; returns this. */
  add(x: number): this {
    const s = this.s;
    const t = s + x;
    // t is NaN or ±Infinity whenever x is, or when the partial sum overflows
    if (t - t !== 0) this.finite = false;
    this.c += (s < 0 ? -s : s) >= (x < 0 ? -x : x) ? s - t + x : x - t + s;
    this.s = t;
    return this;
  }

  /** The compensated sum of the terms added so far (0 for none). Does not change the sum. */
  valueOf(): number {
    return this.finite ? this.s + this.c : this.s;
  }
}

/**
 * Σ x[from … to − 1] with Neumaier's compensation: the same operations, in the same order, as
 * adding the terms to a {@link NeumaierAdder} (same result, same bound, same non-finite rules),
 * without an object. No allocation. `from` and `to` default to the whole array.
 *
 * @example
 * neumaierSum([1, 1e100, 1, -1e100])
 * // returns 2
 * neumaierSum([0.1, 0.2, 0.3], 1)
 * // returns 0.5
 */
export function neumaierSum(x: ArrayLike<number>, from = 0, to = x.length): number {
  let s = 0;
  let c = 0;
  let finite = true;
  for (let i = from; i < to; i++) {
    const v = x[i];
    const t = s + v;
    if (t - t !== 0) finite = false;
    c += (s < 0 ? -s : s) >= (v < 0 ? -v : v) ? s - t + v : v - t + s;
    s = t;
  }
  return finite ? s + c : s;
}
