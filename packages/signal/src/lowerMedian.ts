/**
 * The lower median of `values[0 … count)`: the element of rank ⌊(count − 1)/2⌋ in ascending
 * order, found by Hoare's selection (quickselect; C. A. R. Hoare, "Algorithm 65: Find",
 * Communications of the ACM 4(7), 1961, p. 321, doi:10.1145/366622.366647). Reorders the
 * elements in place; O(count) expected time, no allocation. NaN for count 0.
 *
 * @example
 * lowerMedian(Float64Array.of(5, 1, 4, 2), 4);
 * // returns 2
 */
export function lowerMedian(values: Float64Array, count: number): number {
  if (count <= 0) return NaN;
  const k = (count - 1) >> 1;
  let lo = 0;
  let hi = count - 1;
  while (hi > lo) {
    // median of three as the pivot keeps sorted and reversed input linear
    const mid = (lo + hi) >> 1;
    const a = values[lo];
    const b = values[mid];
    const c = values[hi];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const t = values[i];
        values[i] = values[j];
        values[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return values[k];
  }
  return values[k];
}
