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

function flagBits(sMax: number, r: number): number {
  if (!(sMax > 0)) return 4;
  return r === Infinity ? 1 : r === 1 ? 2 : 0;
}

/**
 * Smith-Watson-Topper damage parameter: the product of the peak stress and the strain amplitude
 * equals its fully reversed value on the strain-life curve.
 *
 *     σmax·εa = σf'²/E·(2Nf)^(2b) + σf'·εf'·(2Nf)^(b+c)
 *
 * Returns reversals 2Nf (cycles Nf = 2Nf/2). `value` is σmax·εa (stress unit × strain).
 * Special cases: σmax ≤ 0 → Infinity with `compressive-no-damage` (documented practice: a loop
 * that stays in compression is taken to do no damage); εa = 0 or beyond the cut-off → Infinity
 * (`below-cutoff`); a parameter at or above its one-reversal value → 1
 * (`at-or-above-first-reversal`).
 *
 * At zero mean stress SWT equals `none` only when the material's cyclic curve is compatible with
 * its fatigue constants (n' = b/c, K' = σf'/εf'^n'), because σmax then equals σf'(2Nf)^b;
 * otherwise the material carries an `incompatible-cyclic-curve` warning.
 *
 * Reference: K. N. Smith, P. Watson and T. H. Topper, "A stress-strain function for the fatigue
 * of metals", Journal of Materials, JMLSA 5 (1970) 767-778.
 *
 * @example
 * smithWatsonTopper.reversalsToFailure(aisi4340, { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 })
 * // returns { reversals: 8250.04..., value: 4, flags: [] }
 */
export const smithWatsonTopper: DamageParameter<'smithWatsonTopper'> = Object.freeze({
  name: 'smithWatsonTopper' as const,
  label: 'Smith-Watson-Topper',
  valueUnit: 'stress*strain' as const,

  reversalsToFailure(material: Material, loop: Loop, options: ReversalsOptions = {}): DamageResult {
    assertMaterial(material);
    const { stressMax: sMax, stressMin: sMin, strainMax: eMax, strainMin: eMin } = loop;
    checkLoop(sMax, sMin, eMax, eMin, undefined);
    const ea = (eMax - eMin) / 2;
    const { sigmaF, E, b, c, epsilonF } = material;
    const r = sMax > 0
      ? solveTwoTermReversals(
          2 * Math.log(sigmaF) - Math.log(E), 2 * b, Math.log(sigmaF * epsilonF), b + c, Math.log(sMax * ea),
          options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS, options.maxIterations ?? DEFAULT_MAX_ITERATIONS,
        )
      : Infinity;
    return { reversals: r, value: sMax * ea, flags: flagNames(flagBits(sMax, r), DAMAGE_FLAG_BITS) };
  },

  reversalsToFailureInto(
    material: Material, loops: LoopColumns, out: Float64Array, flags?: Uint8Array, options: ReversalsOptions = {},
  ): Float64Array {
    assertMaterial(material);
    const count = checkColumns(loops, out, flags);
    const cutoff = options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
    const maxIt = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
    const { sigmaF, E, b, c, epsilonF } = material;
    const lnA = 2 * Math.log(sigmaF) - Math.log(E);
    const p = 2 * b;
    const lnB = Math.log(sigmaF * epsilonF);
    const q = b + c;
    const { stressMax, stressMin, strainMax, strainMin } = loops;
    if (count < REVERSALS_TABLE_MIN_COUNT) {
      for (let i = 0; i < count; i++) {
        const sMax = stressMax[i];
        const eMax = strainMax[i];
        const eMin = strainMin[i];
        checkLoop(sMax, stressMin[i], eMax, eMin, i);
        const r = sMax > 0 ? solveTwoTermReversals(lnA, p, lnB, q, Math.log((sMax * (eMax - eMin)) / 2), cutoff, maxIt) : Infinity;
        out[i] = r;
        if (flags !== undefined) flags[i] = flagBits(sMax, r);
      }
      return out;
    }
    // Many loops: check them all and find the range of σmax·εa, then solve from a table start.
    let yMin = Infinity;
    let yMax = 0;
    for (let i = 0; i < count; i++) {
      const sMax = stressMax[i];
      const eMax = strainMax[i];
      const eMin = strainMin[i];
      checkLoop(sMax, stressMin[i], eMax, eMin, i);
      if (sMax > 0) {
        const y = (sMax * (eMax - eMin)) / 2;
        if (y > 0 && y < yMin) yMin = y;
        if (y > yMax) yMax = y;
      }
    }
    const table = new TwoTermReversalsTable(lnA, p, lnB, q, {
      cutoffReversals: cutoff, maxIterations: maxIt, lnTargetMin: Math.log(yMin), lnTargetMax: Math.log(yMax),
    });
    for (let i = 0; i < count; i++) {
      const sMax = stressMax[i];
      const r = sMax > 0 ? table.solve(Math.log((sMax * (strainMax[i] - strainMin[i])) / 2)) : Infinity;
      out[i] = r;
      if (flags !== undefined) flags[i] = flagBits(sMax, r);
    }
    return out;
  },
});
