import { ArgumentError } from './ArgumentError';

/** The cyclic curve constants implied by the strain-life constants. */
export interface CompatibleCyclicCurve {
  /** K' = σf' / εf'^n' (stress unit of σf'). */
  readonly K: number;
  /** n' = b / c. */
  readonly n: number;
}

/**
 * The cyclic stress-strain constants compatible with the strain-life constants.
 *
 * Eliminating 2Nf between the elastic and plastic terms of the Coffin-Manson-Basquin equation,
 * σa = σf'(2Nf)^b and εpa = εf'(2Nf)^c, gives σa = K'·εpa^n' with
 *
 *     n' = b / c,    K' = σf' / εf'^n'
 *
 * With these constants the cyclic curve passes exactly through the stress and strain amplitudes
 * of the strain-life curve, so mean-stress parameters that use σmax agree with the uncorrected
 * life at zero mean stress. Fitted K', n' usually differ somewhat; estimation methods that give
 * no cyclic curve use this one.
 *
 * Reference: J. Morrow, "Cyclic plastic strain energy and fatigue of metals", in Internal
 * Friction, Damping, and Cyclic Plasticity, ASTM STP 378, 1965, pp. 45-87; N. E. Dowling,
 * Mechanical Behavior of Materials, Pearson, section 14.3 (the compatibility relations).
 *
 * @example
 * compatibleCyclicCurve({ sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5 })
 * // returns { K: 1000, n: 0.2 }
 */
export function compatibleCyclicCurve(constants: {
  sigmaF: number;
  b: number;
  epsilonF: number;
  c: number;
}): CompatibleCyclicCurve {
  const { sigmaF, b, epsilonF, c } = constants;
  if (!(sigmaF > 0 && sigmaF < Infinity)) throw new ArgumentError('sigmaF', sigmaF, 'must be a finite number > 0');
  if (!(b < 0 && b > -Infinity)) throw new ArgumentError('b', b, 'must be a finite number < 0');
  if (!(epsilonF > 0 && epsilonF < Infinity)) throw new ArgumentError('epsilonF', epsilonF, 'must be a finite number > 0');
  if (!(c < 0 && c > -Infinity)) throw new ArgumentError('c', c, 'must be a finite number < 0');
  const n = b / c;
  return { K: sigmaF / Math.pow(epsilonF, n), n };
}
