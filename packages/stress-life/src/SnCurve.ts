/**
 * What the stresses of an S-N curve mean: `'range'` (Δσ = σmax − σmin, the weld standards) or
 * `'amplitude'` (σa = Δσ/2, material curves such as σa = σf'(2Nf)^b).
 */
export type StressMeasure = 'range' | 'amplitude';

/** A knee point of an S-N curve: where it is (cycles) and the slope of the segment after it. */
export interface SnKnee {
  /** Cycles at the knee (not reversals), finite, > 0, increasing from knee to knee. */
  cycles: number;
  /** Slope m of the segment beyond the knee (S^m·N = const), finite, > 0. */
  slope: number;
}

/** Input of {@link defineSnCurve}. */
export interface SnCurveInput {
  /** What `stress` means, see {@link StressMeasure}. Default `'range'`. */
  measure?: StressMeasure;
  /** S_ref: a stress on the first segment (finite, > 0), in the caller's unit. */
  stress: number;
  /** N_ref: the cycles (not reversals) at which the first segment passes through `stress`. */
  cycles: number;
  /** Slope m of the first segment: S^m·N = S_ref^m·N_ref (finite, > 0). */
  slope: number;
  /** Knee points in increasing cycles, each with the slope beyond it. Default none. */
  knees?: readonly SnKnee[];
  /**
   * Cut-off in cycles: stresses below the curve's stress at this life do no damage (infinite
   * life). `Infinity` (the default) for none.
   */
  cutoffCycles?: number;
}

/**
 * A resolved S-N curve in cycles (never reversals): a chain of power-law segments
 * S^m_i·N = const with their knees, and an optional cut-off. Build it with
 * {@link defineSnCurve} or a function of a standard; it is frozen.
 */
export interface SnCurve {
  readonly measure: StressMeasure;
  /** The reference point the first segment passes through. */
  readonly referenceStress: number;
  readonly referenceCycles: number;
  /** Slopes of the segments, first to last (one more than the knees). */
  readonly slopes: readonly number[];
  /** Cycles at each knee. */
  readonly kneeCycles: readonly number[];
  /** Stress at each knee (decreasing). */
  readonly kneeStresses: readonly number[];
  /** Cut-off life in cycles (`Infinity` for none). */
  readonly cutoffCycles: number;
  /** Stress at the cut-off (0 without one): below it, infinite life. */
  readonly cutoffStress: number;
}
