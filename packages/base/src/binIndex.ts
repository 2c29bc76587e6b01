/**
 * Index of the bin of `v` among strictly increasing `edges` (bins [e0, e1), [e1, e2), …, the
 * last bin closed: [e(n−1), e(n)]), or -1 when v is outside, NaN, or there are fewer than two
 * edges. A value on an inner edge belongs to the bin above it; -0 and 0 are the same value.
 * Binary search, O(log n), no allocation; the edges are not checked (the caller validated them
 * once, e.g. with rainflow's `binEdges`).
 *
 * @example
 * binIndex(Float64Array.of(0, 100, 200), 100)
 * // returns 1
 * binIndex(Float64Array.of(0, 100, 200), 200)
 * // returns 1 (the last bin includes its upper edge)
 */
export function binIndex(edges: ArrayLike<number>, v: number): number {
  const last = edges.length - 1;
  if (last < 1 || !(v >= edges[0] && v <= edges[last])) return -1;
  if (v === edges[last]) return last - 1;
  let lo = 0;
  let hi = last;
  while (hi - lo > 1) {
    const mid = (lo + hi) >>> 1;
    if (edges[mid] <= v) lo = mid;
    else hi = mid;
  }
  return lo;
}
