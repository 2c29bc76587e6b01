/**
 * How a compressive mean stress enters Goodman and Gerber: `'neutral'` (σm < 0 gives no
 * benefit: σar = σa; Shigley's rule that with compressive midrange stress failure occurs when
 * σa reaches the fatigue strength) or `'equation'` (the equation on both sides of zero).
 */
export type CompressiveMean = 'neutral' | 'equation';

/** IIW mean-stress enhancement categories (3.5.2 of the recommendations): see {@link iiwMeanStressFactor}. */
export type IiwResidualCategory = 'I' | 'II' | 'III';

/**
 * A mean-stress correction of the amplitude in the stress-life route. Each maps a cycle's
 * amplitude σa and mean σm to the equivalent fully reversed amplitude σar (and so the range
 * 2σar). Strengths are in the stress unit of the cycles.
 */
export type AmplitudeCorrection =
  | { method: 'none' }
  | { method: 'goodman'; ultimateStrength: number; compressiveMean?: CompressiveMean }
  | { method: 'gerber'; ultimateStrength: number; compressiveMean?: CompressiveMean }
  | { method: 'morrow'; sigmaF: number }
  | { method: 'smithWatsonTopper' }
  | { method: 'walker'; gamma: number }
  | { method: 'iiw'; category: IiwResidualCategory };
