import { checkPositive } from './checks';
import { defineSnCurve } from './defineSnCurve';
import type { SnCurve, SnKnee } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/** Options of {@link basquinCurveFromMaterial}. */
export interface BasquinMaterialOptions {
  /** Knee points in cycles (not reversals), each with the slope beyond it. Default none. */
  knees?: readonly SnKnee[];
  /** Cut-off in cycles. Default none (Infinity). */
  cutoffCycles?: number;
}

/**
 * The stress-amplitude curve of a material's Basquin constants, in cycles:
 *
 *     σa = σf'·(2Nf)^b      (reversals 2Nf)   ⇔   σa^m·Nf = (σf'·2^b)^m,  m = −1/b   (cycles Nf)
 *
 * so the curve passes through σa = σf'·2^b at Nf = 1 cycle with slope m = −1/b, in the
 * amplitude measure. `sigmaF` and `b` are the fields of a `@loopwise/material` Material.
 *
 * Reference: O. H. Basquin, Proc. ASTM 10 (1910) 625-630; N. E. Dowling, Mechanical Behavior
 * of Materials, Pearson, 4th ed. (2013), section 9.6 (σa = σf'(2Nf)^b; section number value from
 * memory).
 *
 * @throws {StressLifeError} `invalid-curve` for σf' ≤ 0 or b ≥ 0 (field `sigmaF`, `b`).
 * @example
 * const c = basquinCurveFromMaterial({ sigmaF: 1000, b: -0.1 });
 * cyclesToFailure(c, 1000 * Math.pow(2e6, -0.1)).toPrecision(6);
 * // returns '1.00000e+6'
 */
export function basquinCurveFromMaterial(material: { sigmaF: number; b: number }, options: BasquinMaterialOptions = {}): SnCurve {
  if (material === null || typeof material !== 'object') throw new StressLifeError('invalid-curve', 'material', material, 'must be { sigmaF, b }');
  checkPositive(material.sigmaF, 'sigmaF', 'invalid-curve');
  if (!(material.b < 0 && material.b > -Infinity)) throw new StressLifeError('invalid-curve', 'b', material.b, 'must be a finite number < 0');
  return defineSnCurve({
    measure: 'amplitude',
    stress: material.sigmaF * Math.pow(2, material.b),
    cycles: 1,
    slope: -1 / material.b,
    knees: options.knees ?? [],
    cutoffCycles: options.cutoffCycles ?? Infinity,
  });
}
