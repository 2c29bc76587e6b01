/** The cyclic constants a Masing branch needs: E, K', n' (stress in one unit, strain dimensionless). */
export interface CyclicConstants {
  E: number;
  K: number;
  n: number;
}

/** Points of a closed hysteresis loop drawn from the material model, and how well it closes. */
export interface MasingLoop {
  /** Local strain of each point (dimensionless): the rising branch, then the falling branch. */
  strain: Float64Array;
  /** Local stress of each point. */
  stress: Float64Array;
  /** |end of the rising branch − εmax| / |εmax − εmin| (0 when the loop is exactly Masing). */
  closureError: number;
}

/** Masing strain range Δε = Δσ/E + 2(Δσ/2K')^(1/n') for Δσ ≥ 0. */
function strainRange(m: CyclicConstants, stressRange: number): number {
  return stressRange / m.E + 2 * Math.pow(stressRange / (2 * m.K), 1 / m.n);
}

/**
 * A hysteresis loop between its corners (σmin, εmin) and (σmax, εmax) drawn as two Masing
 * branches of the material model: the rising branch from the lower corner,
 * ε = εmin + Δε(σ − σmin), and the falling branch from the upper corner,
 * ε = εmax − Δε(σmax − σ), with Δε(Δσ) = Δσ/E + 2(Δσ/2K')^(1/n'), each sampled at
 * `pointsPerBranch` stresses (default 40). For display: the loop's own corners are the
 * assessment's; the curve between them is the model's.
 *
 * Reference: G. Masing, Proc. 2nd Int. Congress of Applied Mechanics, Zürich, 1926, pp. 332-335.
 */
export function masingLoop(m: CyclicConstants, stressMax: number, stressMin: number, strainMax: number, strainMin: number, pointsPerBranch = 40): MasingLoop {
  const k = Math.max(2, pointsPerBranch);
  const strain = new Float64Array(2 * k);
  const stress = new Float64Array(2 * k);
  const range = stressMax - stressMin;
  for (let i = 0; i < k; i++) {
    const ds = (range * i) / (k - 1);
    stress[i] = stressMin + ds;
    strain[i] = strainMin + strainRange(m, ds);
    stress[k + i] = stressMax - ds;
    strain[k + i] = strainMax - strainRange(m, ds);
  }
  const span = Math.abs(strainMax - strainMin);
  const closureError = span > 0 ? Math.abs(strain[k - 1] - strainMax) / span : 0;
  return { strain, stress, closureError };
}
