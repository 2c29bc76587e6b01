import {
  assertMaterial,
  DEFAULT_CUTOFF_REVERSALS,
  DEFAULT_MAX_ITERATIONS,
  REVERSALS_TABLE_MIN_COUNT,
  solveTwoTermReversals,
  TwoTermReversalsTable,
  type Material,
  type ReversalsOptions,
} from '@loopwise/material';
import { checkColumns, checkLoop, flagNames } from './checkLoop';
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
   * Writes, for the checked loops `from` … `to − 1`, ln Y into `lnTarget[i − from]` (NaN for the
   * special case) and, unless `varies` is TARGET_ONLY, the shift or ln A into `aux[i − from]`.
   */
  targetsInto(t: T, loops: LoopColumns, from: number, to: number, lnTarget: Float64Array, aux: Float64Array): void;
  /** Writes the parameter's value of the checked loops `from` … `to − 1` into `out[from … to − 1]`. */
  valuesInto(t: T, loops: LoopColumns, from: number, to: number, out: Float64Array): void;
}

/**
 * Loops per block of the kernels: the correction's own code computes the targets of a block into
 * a small scratch (in cache), the shared code solves them. The correction is called once per
 * block, not per loop, so its loop stays monomorphic and nothing is allocated per loop.
 */
const BLOCK = 512;

function ordinaryBits(r: number): number {
  return r === Infinity ? 1 : r === 1 ? 2 : 0;
}

function checkRows(loops: LoopColumns, from: number, to: number, indexed: boolean): void {
  const { stressMax, stressMin, strainMax, strainMin } = loops;
  for (let i = from; i < to; i++) checkLoop(stressMax[i], stressMin[i], strainMax[i], strainMin[i], indexed ? i : undefined);
}

/**
 * Solves the loops `from` … `to − 1` (checked, targets in `lnTarget`, `aux`) loop by loop from the
 * bracket (`solveTwoTermReversals`), writing reversals and flag bits.
 */
function solvePlain<T extends TwoTermTerms>(
  c: TwoTermCorrection<string, T>, t: T, lnTarget: Float64Array, aux: Float64Array, from: number, to: number,
  out: Float64Array, flags: Uint8Array | undefined, cutoff: number, maxIt: number,
): void {
  const { lnA, p, lnB, q } = t;
  const varies = c.varies;
  const special = c.special.reversals;
  const specialBit = c.special.bit;
  for (let i = from, j = 0; i < to; i++, j++) {
    const y = lnTarget[j];
    let r: number;
    let bits: number;
    if (y !== y) {
      r = special;
      bits = specialBit;
    } else {
      if (varies === TARGET_ONLY) r = solveTwoTermReversals(lnA, p, lnB, q, y, cutoff, maxIt);
      else if (varies === SHIFT) r = solveTwoTermReversals(lnA + p * aux[j], p, lnB + q * aux[j], q, y, cutoff, maxIt);
      else r = solveTwoTermReversals(aux[j], p, lnB, q, y, cutoff, maxIt);
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
 * Kernel: check the material and the columns; then block by block, check the loops, let the
 * correction write the targets into a scratch block, and solve. Below
 * `REVERSALS_TABLE_MIN_COUNT` loops (and always for `OWN_LN_A`), each loop is solved from the
 * bracket. From there on, a first pass checks every loop (a bad loop throws before anything is
 * written) and finds the range of the targets (and shifts), then one `TwoTermReversalsTable`
 * gives each loop's Newton iteration its start; the targets are computed again block by block
 * (cheaper than keeping them: no column per call).
 */
export function twoTermParameter<Name extends string, T extends TwoTermTerms>(c: TwoTermCorrection<Name, T>): DamageParameter<Name> {
  function reversalsToFailureInto(
    material: Material, loops: LoopColumns, out: Float64Array, flags?: Uint8Array, options: ReversalsOptions = {},
  ): Float64Array {
    assertMaterial(material);
    const count = checkColumns(loops, out, flags);
    const t = c.terms(material);
    const cutoff = options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
    const maxIt = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
    const size = count < BLOCK ? count : BLOCK;
    const lnTarget = new Float64Array(size);
    const aux = new Float64Array(c.varies === TARGET_ONLY ? 0 : size);
    if (count < REVERSALS_TABLE_MIN_COUNT || c.varies === OWN_LN_A) {
      for (let from = 0; from < count; from += BLOCK) {
        const to = from + BLOCK < count ? from + BLOCK : count;
        checkRows(loops, from, to, true);
        c.targetsInto(t, loops, from, to, lnTarget, aux);
        solvePlain(c, t, lnTarget, aux, from, to, out, flags, cutoff, maxIt);
      }
      return out;
    }
    // Many loops: check them all and find the range of the targets (ln Y > −∞ for the lower end)
    // and of the shifts, then solve from a table start.
    const shifted = c.varies === SHIFT;
    let yLo = Infinity;
    let yHi = -Infinity;
    let sLo = Infinity;
    let sHi = -Infinity;
    for (let from = 0; from < count; from += BLOCK) {
      const to = from + BLOCK < count ? from + BLOCK : count;
      checkRows(loops, from, to, true);
      c.targetsInto(t, loops, from, to, lnTarget, aux);
      for (let j = 0, m = to - from; j < m; j++) {
        const y = lnTarget[j];
        if (y !== y) continue;
        if (y > -Infinity && y < yLo) yLo = y;
        if (y > yHi) yHi = y;
        if (shifted) {
          const s = aux[j];
          if (s < sLo) sLo = s;
          if (s > sHi) sHi = s;
        }
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
    for (let from = 0; from < count; from += BLOCK) {
      const to = from + BLOCK < count ? from + BLOCK : count;
      c.targetsInto(t, loops, from, to, lnTarget, aux);
      for (let i = from, j = 0; i < to; i++, j++) {
        const y = lnTarget[j];
        let r: number;
        let bits: number;
        if (y !== y) {
          r = special;
          bits = specialBit;
        } else {
          r = shifted ? table.solve(y, aux[j]) : table.solve(y);
          bits = ordinaryBits(r);
        }
        out[i] = r;
        if (flags !== undefined) flags[i] = bits;
      }
    }
    return out;
  }

  function parameterValueInto(material: Material, loops: LoopColumns, out: Float64Array): Float64Array {
    assertMaterial(material);
    const count = checkColumns(loops, out, undefined);
    const t = c.terms(material);
    checkRows(loops, 0, count, true);
    c.valuesInto(t, loops, 0, count, out);
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
      const row = oneRow(loop);
      const t = c.terms(material);
      const lnTarget = new Float64Array(1);
      const aux = new Float64Array(1);
      const reversals = new Float64Array(1);
      const value = new Float64Array(1);
      const bits = new Uint8Array(1);
      c.targetsInto(t, row, 0, 1, lnTarget, aux);
      solvePlain(
        c, t, lnTarget, aux, 0, 1, reversals, bits,
        options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS, options.maxIterations ?? DEFAULT_MAX_ITERATIONS,
      );
      c.valuesInto(t, row, 0, 1, value);
      return { reversals: reversals[0], value: value[0], flags: flagNames(bits[0], DAMAGE_FLAG_BITS) };
    },

    reversalsToFailureInto,

    parameterValue(material: Material, loop: Loop): number {
      assertMaterial(material);
      const row = oneRow(loop);
      const out = new Float64Array(1);
      c.valuesInto(c.terms(material), row, 0, 1, out);
      return out[0];
    },

    parameterValueInto,
  });
}
