/**
 * The p-quantile of sorted values by linear interpolation between order statistics: definition 7
 * of Hyndman and Fan, h = (n − 1)·p, Q = x[⌊h⌋] + (h − ⌊h⌋)·(x[⌊h⌋+1] − x[⌊h⌋]) (0-based), the
 * default of R's `quantile` and of NumPy's `percentile`. `sorted` must be in increasing order.
 *
 * Reference: R. J. Hyndman and Y. Fan, Sample quantiles in statistical packages, The American
 * Statistician 50(4) (1996) 361–365, doi:10.1080/00031305.1996.10473566.
 *
 * Special cases: no values gives NaN; one value gives that value for every p; p outside [0, 1]
 * is a RangeError.
 *
 * @example
 * quantileType7([1, 2, 3, 4], 0.25); // returns 1.75
 */
export function quantileType7(sorted: ArrayLike<number>, p: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`quantile: p must be in [0, 1], got ${p}`);
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  if (lo >= n - 1) return sorted[n - 1];
  return sorted[lo] + (h - lo) * (sorted[lo + 1] - sorted[lo]);
}

/** Alias of {@link quantileType7}, the fleet's default quantile. */
export const quantile = quantileType7;
