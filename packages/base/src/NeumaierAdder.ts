/**
 * A running sum with Neumaier's compensation ("improved Kahan-Babuška"): the rounding error of
 * every addition is kept in a second term, so millions of small terms (damages of 1e-12 beside
 * a total of 1e-3) add up to within one rounding of the exact sum, whatever their order of size.
 *
 * Method: t = s + x; c += (|s| >= |x|) ? (s − t) + x : (x − t) + s; s = t; the value is s + c.
 * Non-finite terms: once a term is ±Infinity or NaN the compensation would turn an infinite sum
 * into NaN (∞ − ∞), so the adder then returns the plain sum (Infinity stays Infinity, NaN NaN).
 *
 * Reference: A. Neumaier, "Rundungsfehleranalyse einiger Verfahren zur Summation endlicher
 * Summen", Z. Angew. Math. Mech. 54 (1974) 39-51, doi:10.1002/zamm.19740540106.
 *
 * @example
 * const a = new NeumaierAdder();
 * a.add(1).add(1e100).add(1).add(-1e100);
 * a.valueOf()
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
    if (x - x !== 0 || t - t !== 0) this.finite = false;
    this.c += (s < 0 ? -s : s) >= (x < 0 ? -x : x) ? s - t + x : x - t + s;
    this.s = t;
    return this;
  }

  /** The compensated sum of the terms added so far (0 for none). */
  valueOf(): number {
    return this.finite ? this.s + this.c : this.s;
  }
}

/**
 * Σ x[from … to − 1] with Neumaier's compensation (see {@link NeumaierAdder}); the plain sum when
 * a term or a partial sum is not finite. No allocation.
 *
 * @example
 * neumaierSum([1, 1e100, 1, -1e100])
 * // returns 2
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
