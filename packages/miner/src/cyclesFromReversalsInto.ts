import { checkLife } from './checks';
import { MinerError } from './MinerError';

/**
 * Typed-array kernel of {@link cyclesFromReversals}: writes Nf = 2Nf / 2 for every element of
 * `reversals` into the caller-owned `out` (which may be `reversals` itself) and returns it.
 *
 * @throws {MinerError} `invalid-life` naming the index of a reversal count that is NaN or ≤ 0;
 *   `invalid-argument` when `out` is shorter than `reversals`.
 * @example
 * cyclesFromReversalsInto(Float64Array.of(2, 1e6, Infinity), new Float64Array(3));
 * // returns Float64Array [1, 500000, Infinity]
 */
export function cyclesFromReversalsInto(reversals: ArrayLike<number>, out: Float64Array): Float64Array {
  const n = reversals.length;
  if (!(out.length >= n)) throw new MinerError('invalid-argument', 'out.length', out.length, `must be >= ${n}`);
  for (let i = 0; i < n; i++) {
    const r = reversals[i];
    checkLife(r, 'reversals', i);
    out[i] = r / 2;
  }
  return out;
}
