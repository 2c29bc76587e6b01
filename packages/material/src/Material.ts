/**
 * The fields of a strain-life material, as given to {@link defineMaterial}.
 *
 * Units are the caller's but must be consistent: `E`, `sigmaF`, `K` and `Su` in one stress
 * unit (MPa throughout the published tables and estimation methods), strains dimensionless.
 *
 * - Strain-life (Coffin-Manson-Basquin): εa = σf'/E·(2Nf)^b + εf'·(2Nf)^c
 * - Cyclic stress-strain (Ramberg-Osgood): εa = σa/E + (σa/K')^(1/n')
 */
export interface MaterialInput {
  /** Young's modulus E (stress unit), > 0. */
  E: number;
  /** Fatigue strength coefficient σf' (stress unit), > 0. */
  sigmaF: number;
  /** Fatigue strength exponent b (Basquin), < 0. */
  b: number;
  /** Fatigue ductility coefficient εf' (dimensionless), > 0. */
  epsilonF: number;
  /** Fatigue ductility exponent c (Coffin-Manson), < 0. */
  c: number;
  /** Cyclic strength coefficient K' (stress unit), > 0. */
  K: number;
  /** Cyclic strain-hardening exponent n', 0.01 <= n' <= 0.5 (see docs/material.md, accepted domain). */
  n: number;
  /** Ultimate tensile strength Su (stress unit), optional, > 0. Used by Walker's γ estimate. */
  Su?: number;
  /** Brinell hardness HB, optional, > 0. */
  hardnessHB?: number;
  /** A name for reports, optional. */
  name?: string;
  /** Where the values come from (full citation), optional. */
  source?: string;
  /** Free-text note: provenance, scatter, validity range. Optional. */
  note?: string;
}

/**
 * A warning about a legal material. `incompatible-cyclic-curve`: K' and n' disagree with the
 * fatigue constants (compatibility n' = b/c, K' = σf'/εf'^n'), so the cyclic curve evaluated at
 * a strain amplitude on the strain-life curve does not give σf'(2Nf)^b; mean-stress parameters
 * that use the stress (Smith-Watson-Topper, Walker) then disagree with the uncorrected life even
 * at zero mean stress.
 */
export interface MaterialWarning {
  /** Stable machine-readable code. */
  readonly code: 'incompatible-cyclic-curve';
  /** `"n"` or `"K"`. */
  readonly field: 'n' | 'K';
  /** The value given. */
  readonly value: number;
  /** The value compatibility would give (b/c, or σf'/εf'^n'). */
  readonly expected: number;
  /** A sentence for reports. */
  readonly message: string;
}

/**
 * A validated, frozen strain-life material made by {@link defineMaterial}. `warnings` lists
 * what is legal but suspicious (see {@link MaterialWarning}); it is empty for a consistent set.
 */
export interface Material extends Readonly<MaterialInput> {
  readonly warnings: readonly MaterialWarning[];
}
