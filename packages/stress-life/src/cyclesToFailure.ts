import { checkStress } from './checks';
import type { SnCurve } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/**
 * Cycles to failure Nf (cycles, not reversals) of one stress on an S-N curve, in the curve's
 * measure (a range for `measure: 'range'`, an amplitude for `'amplitude'`).
 *
 * Method: the segment that holds S is found from the knee stresses, then
 * N = Nₖ·(Sₖ/S)^m (see {@link defineSnCurve}). Below the cut-off stress, and at S = 0, the life
 * is `Infinity` (no damage). At exactly the cut-off stress the life is the cut-off life.
 *
 * Reference: O. H. Basquin, Proc. ASTM 10 (1910) 625-630.
 *
 * @throws {StressLifeError} `invalid-stress` for a stress NaN, ±Infinity or negative, or so
 *   large that the life underflows to 0.
 * @example
 * const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 });
 * cyclesToFailure(c, 50);
 * // returns 16000000
 */
export function cyclesToFailure(curve: SnCurve, stress: number): number {
  checkStress(stress, 'stress');
  return checkedLife(cyclesAt(curve, stress), stress, 'stress');
}

/** A life of 0 cycles (an absurd stress whose life underflows) is an error, not a result. Internal. */
export function checkedLife(n: number, stress: number, field: string, index?: number): number {
  if (!(n > 0)) throw new StressLifeError('invalid-stress', field, stress, 'so large that the life underflows to 0 cycles', index);
  return n;
}

/** Nf of a checked stress. Internal: the one recipe of the curve lookup, used by every kernel. */
export function cyclesAt(curve: SnCurve, s: number): number {
  if (s < curve.cutoffStress || s === 0) return Infinity;
  const ks = curve.kneeStresses;
  let k = 0;
  while (k < ks.length && s < ks[k]) k++;
  const s0 = k === 0 ? curve.referenceStress : ks[k - 1];
  const n0 = k === 0 ? curve.referenceCycles : curve.kneeCycles[k - 1];
  const m = curve.slopes[k];
  const r = s0 / s;
  // integer slopes 3 and 5 (the weld standards' own) by multiplication: exact and cheaper than pow
  if (m === 3) return n0 * (r * r * r);
  if (m === 5) return n0 * (r * r * r * r * r);
  return n0 * Math.pow(r, m);
}
