import { ArgumentError } from './ArgumentError';
import { assertMaterial } from './assertMaterial';
import { checkReversalsOptions } from './checkReversalsOptions';
import type { Material } from './Material';
import { DEFAULT_CUTOFF_REVERSALS, DEFAULT_MAX_ITERATIONS, solveTwoTermReversals } from './solveTwoTermReversals';

/**
 * Why a reversals result is not an ordinary root:
 * - `below-cutoff`: the amplitude is 0 or its life lies beyond the cut-off; reversals = Infinity.
 * - `at-or-above-first-reversal`: the amplitude reaches the curve's value at one reversal,
 *   σf'/E + εf'; reversals = 1 (failure in the first reversal, the curve is not extrapolated).
 */
export type StrainLifeFlag = 'below-cutoff' | 'at-or-above-first-reversal';

/** Options of the reversals solves. */
export interface ReversalsOptions {
  /** Reversals beyond which the result is Infinity. Default {@link DEFAULT_CUTOFF_REVERSALS} (1e20). */
  cutoffReversals?: number;
  /** Iteration cap of the solver. Default {@link DEFAULT_MAX_ITERATIONS} (40). */
  maxIterations?: number;
}

/** Result of {@link reversalsToFailure}. */
export interface ReversalsResult {
  /** Reversals to failure 2Nf (twice the cycles Nf), in [1, cutoff] or Infinity. */
  readonly reversals: number;
  /** Empty for an ordinary root; otherwise why the value is 1 or Infinity. */
  readonly flags: readonly StrainLifeFlag[];
}

const NO_FLAGS: readonly StrainLifeFlag[] = Object.freeze([]);
const BELOW: readonly StrainLifeFlag[] = Object.freeze(['below-cutoff'] as StrainLifeFlag[]);
const ABOVE: readonly StrainLifeFlag[] = Object.freeze(['at-or-above-first-reversal'] as StrainLifeFlag[]);

/**
 * Reversals to failure 2Nf for a fully reversed strain amplitude: the inverse of
 * {@link strainAmplitudeAtReversals}, solving
 *
 *     εa = σf'/E·(2Nf)^b + εf'·(2Nf)^c
 *
 * for 2Nf. The result is reversals, not cycles: cycles Nf = reversals / 2.
 *
 * Method: {@link solveTwoTermReversals} (monotone bracketed Newton in ln 2Nf, converged to
 * 1e-10 relative, iteration cap). Monotone: a larger amplitude never gives more reversals.
 *
 * Special cases (never NaN): εa = 0 → Infinity, flag `below-cutoff`; εa below the amplitude at
 * the cut-off (see {@link strainAmplitudeAtReversals} at `cutoffReversals`) → Infinity, flag
 * `below-cutoff`; εa ≥ σf'/E + εf' (the amplitude at one reversal) → 1, flag
 * `at-or-above-first-reversal`.
 *
 * Reference: the strain-life curve as in {@link strainAmplitudeAtReversals}.
 *
 * @throws {ArgumentError} when `strainAmplitude` is NaN, ±Infinity or negative.
 * @example
 * reversalsToFailure(defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 }), 0.0131548)
 * // returns { reversals: 1e4 (to 1e-5 relative, the amplitude being rounded), flags: [] }
 */
export function reversalsToFailure(
  material: Material,
  strainAmplitude: number,
  options: ReversalsOptions = {},
): ReversalsResult {
  assertMaterial(material);
  checkReversalsOptions(options, 'reversalsToFailure options');
  if (!(strainAmplitude >= 0 && strainAmplitude < Infinity)) {
    throw new ArgumentError('strainAmplitude', strainAmplitude, 'must be a finite number >= 0');
  }
  const reversals = solveTwoTermReversals(
    Math.log(material.sigmaF / material.E),
    material.b,
    Math.log(material.epsilonF),
    material.c,
    Math.log(strainAmplitude),
    options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS,
    options.maxIterations ?? DEFAULT_MAX_ITERATIONS,
  );
  const flags = reversals === Infinity ? BELOW : reversals === 1 ? ABOVE : NO_FLAGS;
  return { reversals, flags };
}
