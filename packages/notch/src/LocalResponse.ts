/** Local stress and strain at the notch root, returned by the first-loading form of a notch rule. */
export interface LocalResponse {
  /** Local stress σ (the material's stress unit). */
  stress: number;
  /** Local strain ε (dimensionless). */
  strain: number;
}

/** Local stress and strain ranges on a Masing branch, returned by the range form of a notch rule. */
export interface LocalRangeResponse {
  /** Local stress range Δσ from the branch origin (signed like the input range). */
  stressRange: number;
  /** Local strain range Δε from the branch origin (signed like the input range). */
  strainRange: number;
}

/** Options of the notch-rule solves. */
export interface NotchSolveOptions {
  /**
   * Relative tolerance on the local stress; default 1e-14. The solve stops when a bound on the
   * remaining relative error is below it; values below 1e-15 are raised to 1e-15.
   */
  tolerance?: number;
  /** Iteration cap of the Newton solve; default 60. Reaching it throws `ConvergenceError`. */
  maxIterations?: number;
}
