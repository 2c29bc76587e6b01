import type { CycleSink } from './CycleSink';
import { RangeOverflowError } from './errors';
import { ReversalFilter } from './ReversalFilter';

/**
 * Closes the residue of a history that repeats, so that every range belongs to a full cycle.
 *
 * Method (ASTM E1049-85, 5.4.5, simplified rainflow counting for repeating histories): the
 * residue is read as circular and rearranged to start at its point of largest magnitude (the
 * highest peak or lowest valley, an end of the largest cycle), and that point closes the
 * sequence. Points that are not reversals across the seam, or whose reversal is smaller than the
 * gate, drop out. Then, whenever the newest range X is at least the one before it, Y, the range
 * Y is one full cycle and its two points leave the list. The sample indices stay those of the
 * block; a cycle's close index is that of the point that closed it.
 *
 * The four-point count of the whole block plus these cycles equals the standard's repeating
 * count of the block (tested against a literal implementation of 5.4.5).
 *
 * @param values residue values, in time order (at least two)
 * @param indices their sample indices
 * @param gate gate range of the count
 * @param sink receives the full cycles
 */
export function closeRepeatingResidue(values: Float64Array, indices: Float64Array, gate: number, sink: CycleSink): void {
  const m = values.length;
  if (m < 2) return;
  let j = 0;
  for (let k = 1; k < m; k++) if (Math.abs(values[k]) > Math.abs(values[j])) j = k;
  const ringV = new Float64Array(m + 1);
  const ringI = new Float64Array(m + 1);
  for (let k = 0; k <= m; k++) {
    ringV[k] = values[(j + k) % m];
    ringI[k] = indices[(j + k) % m];
  }
  const filter = new ReversalFilter({ gate });
  const tv = new Float64Array(m + 2);
  const ti = new Float64Array(m + 2);
  let n = filter.pushIndexed(ringV, ringI, 0, m + 1, tv, ti, 0);
  n += filter.pendingInto(tv, ti, n);
  // three-point closure on a list kept in place at the front of tv / ti
  let top = 0;
  for (let k = 0; k < n; k++) {
    tv[top] = tv[k];
    ti[top] = ti[k];
    top++;
    if (top >= 2) checkRange(tv, ti, top);
    while (top >= 3) {
      const x = Math.abs(tv[top - 1] - tv[top - 2]);
      const y = Math.abs(tv[top - 2] - tv[top - 3]);
      if (x < y) break;
      sink.addCycle(tv[top - 3], tv[top - 2], 1, ti[top - 3], ti[top - 2], ti[top - 1]);
      tv[top - 3] = tv[top - 1];
      ti[top - 3] = ti[top - 1];
      top -= 2;
      if (top >= 2) checkRange(tv, ti, top);
    }
  }
}

/** The range between the last two points of the list (a pair that just formed) must be finite. */
function checkRange(tv: Float64Array, ti: Float64Array, top: number): void {
  const r = tv[top - 1] - tv[top - 2];
  if (!(r - r === 0)) throw new RangeOverflowError(ti[top - 2], ti[top - 1], tv[top - 2], tv[top - 1]);
}
