/**
 * A closed hysteresis loop, by its extremes: the stresses (in the material's stress unit) and
 * strains (dimensionless) at its two reversal points. Requires σmax ≥ σmin and εmax ≥ εmin.
 * Derived: strain amplitude εa = (εmax − εmin)/2, mean stress σm = (σmax + σmin)/2.
 */
export interface Loop {
  readonly stressMax: number;
  readonly stressMin: number;
  readonly strainMax: number;
  readonly strainMin: number;
}

/**
 * Many loops as struct-of-arrays columns of equal length (Float64Array preferred), the input of
 * the typed-array kernels `reversalsToFailureInto`.
 */
export interface LoopColumns {
  readonly stressMax: ArrayLike<number>;
  readonly stressMin: ArrayLike<number>;
  readonly strainMax: ArrayLike<number>;
  readonly strainMin: ArrayLike<number>;
}
