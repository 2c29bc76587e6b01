import { cycleLivesInto, resolveCycleOptions, type CycleLifeOptions } from './cycleLivesInto';
import type { SnCurve } from './SnCurve';

/** The column life mapping of the stress-life route: miner's `MatrixLifeKernel` shape. */
export interface StressLifeKernel {
  /** Nf in cycles of (ranges[k], means[k]) into out; see {@link cycleLivesInto}. */
  cyclesToFailureInto(ranges: Float64Array, means: Float64Array, out: Float64Array): Float64Array;
}

/**
 * The stress-life route as a life mapping for stored matrices: pass it as `life` to
 * `damageFromMatrix` of `@loopwise/miner`, which takes every range-mean bin at its centre. The
 * options are checked once, here.
 *
 * @example
 * const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 });
 * Array.from(stressLifeKernel(c).cyclesToFailureInto(Float64Array.of(100), Float64Array.of(0), new Float64Array(1)));
 * // returns [2000000]
 */
export function stressLifeKernel(curve: SnCurve, options: CycleLifeOptions = {}): StressLifeKernel {
  resolveCycleOptions(options);
  const fixed: CycleLifeOptions = { ...options };
  return {
    cyclesToFailureInto(ranges: Float64Array, means: Float64Array, out: Float64Array): Float64Array {
      return cycleLivesInto(curve, ranges, means, out, fixed);
    },
  };
}
