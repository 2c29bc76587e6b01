import { checkColumn, checkStress } from './checks';
import { checkedLife, cyclesAt } from './cyclesToFailure';
import type { SnCurve } from './SnCurve';

/**
 * Kernel of {@link cyclesToFailure}: writes Nf (cycles, not reversals) of every stress (in the
 * curve's measure) into caller-owned `out` and returns it. No allocation; `out` may be
 * `stresses` itself (in place).
 *
 * @throws {StressLifeError} `invalid-stress` naming the element index; `invalid-argument` when
 *   `out` is shorter than `stresses`.
 * @example
 * const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3, cutoffCycles: 1e8 });
 * Array.from(cyclesToFailureInto(c, Float64Array.of(100, 200, 10), new Float64Array(3)));
 * // returns [2000000, 250000, Infinity]
 */
export function cyclesToFailureInto(curve: SnCurve, stresses: ArrayLike<number>, out: Float64Array): Float64Array {
  checkColumn(stresses, 'stresses');
  checkColumn(out, 'out', stresses.length, false);
  for (let i = 0; i < stresses.length; i++) checkStress(stresses[i], 'stresses', i);
  for (let i = 0; i < stresses.length; i++) {
    const n = cyclesAt(curve, stresses[i]);
    if (!(n > 0)) checkedLife(n, stresses[i], 'stresses', i);
    out[i] = n;
  }
  return out;
}
