/**
 * The exact sum of finite doubles, rounded once: J. R. Shewchuk's exact partials ("Adaptive
 * precision floating-point arithmetic and fast robust geometric predicates", Discrete Comput.
 * Geom. 18 (1997) 305-363; the same recipe as Python's math.fsum). Slow and literal, a test
 * oracle only. The partials are non-overlapping, so summing them from the smallest up rounds
 * the exact sum to within one unit in the last place, which is all the tests need.
 */
export function exactSum(terms: ArrayLike<number>): number {
  const partials: number[] = [];
  for (let k = 0; k < terms.length; k++) {
    let x = terms[k];
    let i = 0;
    for (let j = 0; j < partials.length; j++) {
      let y = partials[j];
      if (Math.abs(x) < Math.abs(y)) [x, y] = [y, x];
      const hi = x + y;
      const lo = y - (hi - x);
      if (lo !== 0) partials[i++] = lo;
      x = hi;
    }
    partials.length = i;
    partials.push(x);
  }
  let s = 0;
  for (const p of partials) s += p;
  return s;
}
