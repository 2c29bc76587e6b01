import type { MaterialInput, MaterialWarning } from './Material';

/**
 * Relative disagreement between a given K' or n' and its compatible value above which
 * {@link materialWarnings} warns: 10 %. Chosen so that the six steels of the handbook table
 * (fitted constants, within about 6 %) pass and a clearly inconsistent set warns; common
 * practice, no source.
 */
export const COMPATIBILITY_TOLERANCE = 0.1;

/**
 * Warnings for a material that is legal but inconsistent: when n' differs from b/c, or K'
 * from σf'/εf'^n', by more than {@link COMPATIBILITY_TOLERANCE} (relative), the cyclic curve
 * and the strain-life curve describe different stress amplitudes at the same life. Then the
 * Smith-Watson-Topper and Walker parameters disagree with the uncorrected strain-life curve
 * even at zero mean stress (Morrow-type corrections do not use the cyclic curve and still
 * agree). {@link defineMaterial} stores the result as `material.warnings`.
 *
 * Compatibility relations: see {@link compatibleCyclicCurve}.
 *
 * @example
 * materialWarnings({ E: 2e5, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.3 })
 *   .map((w) => w.field)
 * // returns ['n']
 */
export function materialWarnings(material: MaterialInput): MaterialWarning[] {
  const warnings: MaterialWarning[] = [];
  const { sigmaF, b, epsilonF, c, K, n } = material;
  const nCompatible = b / c;
  if (Math.abs(n / nCompatible - 1) > COMPATIBILITY_TOLERANCE) {
    warnings.push({
      code: 'incompatible-cyclic-curve',
      field: 'n',
      value: n,
      expected: nCompatible,
      message:
        `n' = ${n} differs from b/c = ${nCompatible.toPrecision(4)} by more than ` +
        `${COMPATIBILITY_TOLERANCE * 100} %: SWT and Walker will not reduce to the uncorrected life at zero mean stress`,
    });
  }
  const kCompatible = sigmaF / Math.pow(epsilonF, n);
  if (Math.abs(K / kCompatible - 1) > COMPATIBILITY_TOLERANCE) {
    warnings.push({
      code: 'incompatible-cyclic-curve',
      field: 'K',
      value: K,
      expected: kCompatible,
      message:
        `K' = ${K} differs from sigmaF/epsilonF^n' = ${kCompatible.toPrecision(4)} by more than ` +
        `${COMPATIBILITY_TOLERANCE * 100} %: SWT and Walker will not reduce to the uncorrected life at zero mean stress`,
    });
  }
  return warnings;
}
