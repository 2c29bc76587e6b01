/**
 * A closed hysteresis loop, by its extremes: the stresses (in the material's stress unit) and
 * strains (dimensionless) at its two reversal points. Requires σmax ≥ σmin and εmax ≥ εmin.
 * Derived: strain amplitude εa = (εmax − εmin)/2, mean stress σm = (σmax + σmin)/2.
 */
export interface Loop {
  readonly sigmaMax: number;
  readonly sigmaMin: number;
  readonly epsilonMax: number;
  readonly epsilonMin: number;
}

/**
 * Many loops as struct-of-arrays columns of equal length (Float64Array preferred), the input of
 * the typed-array kernels `reversalsToFailureInto`.
 */
export interface LoopColumns {
  readonly sigmaMax: ArrayLike<number>;
  readonly sigmaMin: ArrayLike<number>;
  readonly epsilonMax: ArrayLike<number>;
  readonly epsilonMin: ArrayLike<number>;
}
