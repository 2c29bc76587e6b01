import {
  assertMaterial,
  checkReversalsOptions,
  DEFAULT_CUTOFF_REVERSALS,
  DEFAULT_MAX_ITERATIONS,
  REVERSALS_TABLE_MIN_COUNT,
  solveTwoTermReversals,
  TwoTermReversalsTable,
  type Material,
  type ReversalsOptions,
} from '@loopwise/material';
import { checkColumns, checkLoop, checkLoopRows, flagNames } from './checkLoop';
import { DAMAGE_FLAG_BITS, type DamageParameter, type DamageResult } from './DamageParameter';
import type { Loop, LoopColumns } from './Loop';
import { MeanStressError } from './MeanStressError';

/**
 * Internal: the constants of a two-term strain-life equation A·x^p + B·x^q = Y for one material,
 * in logarithms (as `solveTwoTermReversals` takes them), plus whatever else the correction needs.
 */
export interface TwoTermTerms {
  readonly lnA: number;
  readonly p: number;
  readonly lnB: number;
  readonly q: number;
}

/**
 * Internal: what varies from loop to loop besides the target Y.
 * - `TARGET_ONLY`: nothing (none, SWT, Walker): one table of the material's equation serves all.
 * - `SHIFT`: the loop's x is scaled, A·(x·e^s)^p + B·(x·e^s)^q = Y with s per loop (modified
 *   Morrow): one table over the range of shifts.
 * - `OWN_LN_A`: ln A per loop (Morrow): no one-dimensional table; each loop from the bracket.
 */
export const TARGET_ONLY = 0;
export const SHIFT = 1;
export const OWN_LN_A = 2;

/**
 * Internal: the part of a damage parameter that is its own. Everything else (checks of material,
 * loops and columns, the solve, the table start, flags, results) is {@link twoTermParameter}'s.
 */
export interface TwoTermCorrection<Name extends string, T extends TwoTermTerms> {
  readonly name: Name;
  readonly label: string;
  readonly valueUnit: DamageParameter['valueUnit'];
  /** What varies per loop besides the target: {@link TARGET_ONLY}, {@link SHIFT} or {@link OWN_LN_A}. */
  readonly varies: typeof TARGET_ONLY | typeof SHIFT | typeof OWN_LN_A;
  /**
   * The result of a loop whose target is NaN (the correction's special case: SWT or Walker with
   * σmax ≤ 0 → Infinity, Morrow with σm ≥ σf' → 1) and its flag bit.
   */
  readonly special: { readonly reversals: number; readonly bit: number };
  /** The constants of the equation for `material` (checked); may throw for a missing property. */
  terms(material: Material): T;
  /**
   * Writes, for the checked loops 0 … count − 1, ln Y into `lnTarget[i]` (NaN for the special
   * case) and, unless `varies` is TARGET_ONLY, the shift or ln A into `aux[i]`. One loop of the
   * correction's own over all rows: it stays monomorphic, and nothing is allocated per loop.
   */
  targetsInto(t: T, loops: LoopColumns, count: number, lnTarget: Float64Array, aux: Float64Array): void;
  /** Writes the parameter's value of the checked loops 0 … count − 1 into `out[i]`. */
  valuesInto(t: T, loops: LoopColumns, count: number, out: Float64Array): void;
}

const NO_AUX = new Float64Array(0);

function ordinaryBits(r: number): number {
  return r === Infinity ? 1 : r === 1 ? 2 : 0;
}

/**
 * Solves the loops 0 … count − 1 (checked, targets in `lnTarget`, `aux`) loop by loop from the
 * bracket (`solveTwoTermReversals`), writing reversals (`out` may be `lnTarget`) and flag bits.
 */
function solvePlain<T extends TwoTermTerms>(
  c: TwoTermCorrection<string, T>, t: T, lnTarget: Float64Array, aux: Float64Array, count: number,
  out: Float64Array, flags: Uint8Array | undefined, cutoff: number, maxIt: number,
): void {
  const { lnA, p, lnB, q } = t;
  const varies = c.varies;
  const special = c.special.reversals;
  const specialBit = c.special.bit;
  for (let i = 0; i < count; i++) {
    const y = lnTarget[i];
    let r: number;
    let bits: number;
    if (y !== y) {
      r = special;
      bits = specialBit;
    } else {
      if (varies === TARGET_ONLY) r = solveTwoTermReversals(lnA, p, lnB, q, y, cutoff, maxIt);
      else if (varies === SHIFT) r = solveTwoTermReversals(lnA + p * aux[i], p, lnB + q * aux[i], q, y, cutoff, maxIt);
      else r = solveTwoTermReversals(aux[i], p, lnB, q, y, cutoff, maxIt);
      bits = ordinaryBits(r);
    }
    out[i] = r;
    if (flags !== undefined) flags[i] = bits;
  }
}

/**
 * Internal: the damage parameter of a correction, the one skeleton every parameter shares.
 *
 * Scalar: check the material and the loop, take the correction's target and value, solve
 * A·x^p + B·x^q = Y by `solveTwoTermReversals`, flags. It runs the kernel's code on a one-loop
 * column, so the scalar result equals the kernel's below the table size exactly.
 *
 * Kernel: check the material, the columns and every loop (a bad loop throws before anything is
 * written); the correction writes each loop's target into `out` itself, and the solves overwrite
 * the targets in place. Below `REVERSALS_TABLE_MIN_COUNT` loops (and always for `OWN_LN_A`), each
 * loop is solved from the bracket. From there on, the range of the targets (and shifts) sizes one
 * `TwoTermReversalsTable`, which gives each loop's Newton iteration its start. The only column
 * of our own is the shift or ln A of `SHIFT` and `OWN_LN_A` (one per call, not per loop).
 */
export function twoTermParameter<Name extends string, T extends TwoTermTerms>(c: TwoTermCorrection<Name, T>): DamageParameter<Name> {
  function reversalsToFailureInto(
    material: Material, loops: LoopColumns, out: Float64Array, flags?: Uint8Array, options: ReversalsOptions = {},
  ): Float64Array {
    assertMaterial(material);
    checkReversalsOptions(options, `${c.name}.reversalsToFailureInto options`);
    const count = checkColumns(loops, out, flags);
    const t = c.terms(material);
    const cutoff = options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
    const maxIt = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
    // Every loop is checked before anything is written; then the correction writes the targets
    // into `out` itself (no column of our own), and the solves overwrite them in place.
    checkLoopRows(loops, count);
    const aux = c.varies === TARGET_ONLY ? NO_AUX : new Float64Array(count);
    c.targetsInto(t, loops, count, out, aux);
    if (count < REVERSALS_TABLE_MIN_COUNT || c.varies === OWN_LN_A) {
      solvePlain(c, t, out, aux, count, out, flags, cutoff, maxIt);
      return out;
    }
    // Many loops: the range of the targets (ln Y > −∞ for the lower end) and of the shifts, then
    // one table start for every loop.
    const shifted = c.varies === SHIFT;
    let yLo = Infinity;
    let yHi = -Infinity;
    let sLo = Infinity;
    let sHi = -Infinity;
    for (let i = 0; i < count; i++) {
      const y = out[i];
      if (y !== y) continue;
      if (y > -Infinity && y < yLo) yLo = y;
      if (y > yHi) yHi = y;
      if (shifted) {
        const s = aux[i];
        if (s < sLo) sLo = s;
        if (s > sHi) sHi = s;
      }
    }
    const ranged = shifted && sLo <= sHi;
    const table = new TwoTermReversalsTable(t.lnA, t.p, t.lnB, t.q, {
      cutoffReversals: cutoff,
      maxIterations: maxIt,
      lnTargetMin: yLo,
      lnTargetMax: yHi,
      minShift: ranged ? sLo : 0,
      maxShift: ranged ? sHi : 0,
    });
    const special = c.special.reversals;
    const specialBit = c.special.bit;
    for (let i = 0; i < count; i++) {
      const y = out[i];
      let r: number;
      let bits: number;
      if (y !== y) {
        r = special;
        bits = specialBit;
      } else {
        r = shifted ? table.solve(y, aux[i]) : table.solve(y);
        bits = ordinaryBits(r);
      }
      out[i] = r;
      if (flags !== undefined) flags[i] = bits;
    }
    return out;
  }

  function parameterValueInto(material: Material, loops: LoopColumns, out: Float64Array): Float64Array {
    assertMaterial(material);
    const count = checkColumns(loops, out, undefined);
    const t = c.terms(material);
    checkLoopRows(loops, count);
    c.valuesInto(t, loops, count, out);
    return out;
  }

  /** One loop as a column of one row (for the scalar functions, which run the kernels' code). */
  function oneRow(loop: Loop): LoopColumns {
    if (loop === null || typeof loop !== 'object') {
      throw new MeanStressError('invalid-loop', 'loop', loop, 'must be an object { stressMax, stressMin, strainMax, strainMin }');
    }
    const { stressMax, stressMin, strainMax, strainMin } = loop;
    checkLoop(stressMax, stressMin, strainMax, strainMin, undefined);
    return { stressMax: [stressMax], stressMin: [stressMin], strainMax: [strainMax], strainMin: [strainMin] };
  }

  return Object.freeze({
    name: c.name,
    label: c.label,
    valueUnit: c.valueUnit,

    reversalsToFailure(material: Material, loop: Loop, options: ReversalsOptions = {}): DamageResult {
      assertMaterial(material);
      checkReversalsOptions(options, `${c.name}.reversalsToFailure options`);
      const row = oneRow(loop);
      const t = c.terms(material);
      const reversals = new Float64Array(1);
      const aux = new Float64Array(1);
      const value = new Float64Array(1);
      const bits = new Uint8Array(1);
      c.targetsInto(t, row, 1, reversals, aux);
      solvePlain(
        c, t, reversals, aux, 1, reversals, bits,
        options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS, options.maxIterations ?? DEFAULT_MAX_ITERATIONS,
      );
      c.valuesInto(t, row, 1, value);
      return { reversals: reversals[0], value: value[0], flags: flagNames(bits[0], DAMAGE_FLAG_BITS) };
    },

    reversalsToFailureInto,

    parameterValue(material: Material, loop: Loop): number {
      assertMaterial(material);
      const row = oneRow(loop);
      const out = new Float64Array(1);
      c.valuesInto(c.terms(material), row, 1, out);
      return out[0];
    },

    parameterValueInto,
  });
}
