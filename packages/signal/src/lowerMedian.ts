/** Ranges at and below this many elements are finished by insertion sort. */
const SMALL = 16;

/**
 * The lower median of `values[0 … count)`: the element of rank ⌊(count − 1)/2⌋ in ascending
 * order, found by Hoare's selection (quickselect; C. A. R. Hoare, "Algorithm 65: Find",
 * Communications of the ACM 4(7), 1961, p. 321, doi:10.1145/366622.366647). `values` is not
 * changed; the work is done in `scratch` and `spare` (Float64Arrays of at least `count` elements
 * each, overwritten; allocated when not given); O(count) expected time. NaN for count 0; NaN
 * elements are not allowed (the result is then unspecified).
 *
 * Each step splits the range three ways about a pivot (the median of its first, middle and last
 * element) into the other array: smaller elements from the front, larger from the back, equal
 * ones counted between. The split has no branch that depends on the data (both ends are written,
 * and the two write positions advance by the comparisons as numbers 0 or 1), because on a few
 * hundred values in no order a mispredicted branch per comparison is what a selection costs
 * (common practice, no source). The value is the same as any exact selection's.
 *
 * @example
 * lowerMedian(Float64Array.of(5, 1, 4, 2), 4);
 * // returns 2
 */
export function lowerMedian(values: Float64Array, count: number, scratch: Float64Array = new Float64Array(count), spare: Float64Array = new Float64Array(count)): number {
  if (count <= 0) return NaN;
  const k = (count - 1) >> 1;
  // the first split reads `values`; the later ones go back and forth between scratch and spare
  let src = values;
  let dst = scratch;
  let lo = 0;
  let hi = count - 1;
  while (hi - lo >= SMALL) {
    const mid = (lo + hi) >> 1;
    const a = src[lo];
    const b = src[mid];
    const c = src[hi];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    // [lo, l) < pivot, [l, r] = pivot (not written), (r, hi] > pivot; l ≤ r + 1 throughout, so
    // the two writes of a step land in the part not yet claimed
    let l = lo;
    let r = hi;
    for (let i = lo; i <= hi; i++) {
      const v = src[i];
      dst[l] = v;
      dst[r] = v;
      l += +(v < pivot);
      r -= +(v > pivot);
    }
    if (k >= l && k <= r) return pivot;
    if (k < l) hi = l - 1;
    else lo = r + 1;
    src = dst;
    dst = src === scratch ? spare : scratch;
  }
  if (src === values) {
    for (let i = lo; i <= hi; i++) dst[i] = values[i];
    src = dst;
  }
  for (let i = lo + 1; i <= hi; i++) {
    const v = src[i];
    let j = i - 1;
    while (j >= lo && src[j] > v) {
      src[j + 1] = src[j];
      j--;
    }
    src[j + 1] = v;
  }
  return src[k];
}
