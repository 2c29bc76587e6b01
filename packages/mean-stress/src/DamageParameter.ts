import type { Material, ReversalsOptions } from '@loopwise/material';
import type { Loop, LoopColumns } from './Loop';

/**
 * Why a damage-parameter result is not an ordinary root:
 * - `below-cutoff`: zero strain amplitude, or a life beyond the cut-off: reversals = Infinity.
 * - `at-or-above-first-reversal`: the parameter reaches its value at one reversal: reversals = 1.
 * - `compressive-no-damage`: SWT or Walker (γ < 1) with σmax ≤ 0: reversals = Infinity by the
 *   documented practice that a loop entirely in compression does not grow a crack.
 * - `mean-stress-at-or-above-sigmaF`: Morrow or modified Morrow with σm ≥ σf': the elastic term
 *   vanishes; reversals = 1 (failure on the first reversal, conservative).
 */
export type DamageFlag =
  | 'below-cutoff'
  | 'at-or-above-first-reversal'
  | 'compressive-no-damage'
  | 'mean-stress-at-or-above-sigmaF';

/** Bits of the optional flags column of the kernels (OR-ed per loop; 0 for an ordinary root). */
export const DAMAGE_FLAG_BITS = Object.freeze({
  'below-cutoff': 1,
  'at-or-above-first-reversal': 2,
  'compressive-no-damage': 4,
  'mean-stress-at-or-above-sigmaF': 8,
} as const);

/** Result of a damage parameter for one loop. */
export interface DamageResult {
  /** Reversals to failure 2Nf (cycles Nf are half), in [1, cutoff] or Infinity. */
  readonly reversals: number;
  /** The parameter's own value for the loop (its unit depends on the parameter: see `valueUnit`). */
  readonly value: number;
  /** Empty for an ordinary root; otherwise why reversals is 1 or Infinity. */
  readonly flags: readonly DamageFlag[];
}

/**
 * A mean-stress damage parameter: maps a material and a closed loop to reversals to failure
 * (the material first, as in `@loopwise/material`).
 * All of them are strain-life equations of the two-term form solved by the material package's
 * `solveTwoTermReversals` (monotone bracketed Newton in ln 2Nf, 1e-10 relative, iteration cap).
 */
export interface DamageParameter<Name extends string = string> {
  /** Name in the registry, e.g. `"smithWatsonTopper"`. */
  readonly name: Name;
  /** Human-readable name for reports, e.g. `"Smith-Watson-Topper"`. */
  readonly label: string;
  /** Unit of `value`: `"strain"` (εa), `"stress*strain"` (σmax·εa) or `"stress"` (Walker). */
  readonly valueUnit: 'strain' | 'stress*strain' | 'stress';
  /** Reversals to failure 2Nf (not cycles) of one loop, with the parameter's value and flags. */
  reversalsToFailure(material: Material, loop: Loop, options?: ReversalsOptions): DamageResult;
  /**
   * Typed-array kernel: reversals to failure 2Nf of every loop of `loops` into the caller-owned
   * `out` (returned); optional `flags` gets {@link DAMAGE_FLAG_BITS} per loop. No allocation per
   * loop. Every loop is checked before anything is written; errors name the loop index.
   *
   * Method: below `REVERSALS_TABLE_MIN_COUNT` (256) loops, each loop is solved by
   * `solveTwoTermReversals` as in `reversalsToFailure`, with identical results. From 256 loops
   * on, none, SWT, Walker and modified Morrow find the range of their targets, then build one
   * `TwoTermReversalsTable` of the material's equation (cubic Hermite table of ln 2Nf against the
   * log of the target) and start each loop's Newton iteration from it: the same stopping rule
   * and cap certify the result, which agrees with the scalar function to the solver's
   * tolerance (1e-12 in ln 2Nf; 1 and Infinity exactly). Modified Morrow uses the fully
   * reversed table with the shift ln((σf' − σm)/σf')/b. Morrow (σm changes A alone) always
   * solves loop by loop. The iteration cap counts iterations from the start used (usually one
   * from the table).
   */
  reversalsToFailureInto(
    material: Material,
    loops: LoopColumns,
    out: Float64Array,
    flags?: Uint8Array,
    options?: ReversalsOptions,
  ): Float64Array;
  /**
   * The parameter's value for one loop (the left-hand side of its equation, the same number as
   * `reversalsToFailure(material, loop).value`): εa for none, Morrow and modified Morrow; σmax·εa
   * for SWT (0 when σmax ≤ 0); σmax^(1−γ)·(E·εa)^γ for Walker (0 when σmax ≤ 0 and γ < 1). Unit:
   * `valueUnit`. Errors as `reversalsToFailure`.
   */
  parameterValue(material: Material, loop: Loop): number;
  /**
   * Typed-array kernel of {@link DamageParameter.parameterValue}: the value of every loop of
   * `loops` into the caller-owned `out` (returned). Checks every loop before writing; errors
   * name the loop index. No allocation.
   */
  parameterValueInto(material: Material, loops: LoopColumns, out: Float64Array): Float64Array;
}
