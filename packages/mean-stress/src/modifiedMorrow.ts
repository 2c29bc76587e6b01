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

/** Internal: reversals by modified Morrow; 1 when σm ≥ σf' (flagged by the caller). */
function modifiedMorrowReversals(
  material: Material, lnEpsilonF: number, sMax: number, sMin: number, ea: number, cutoff: number, maxIt: number,
): number {
  const elastic = material.sigmaF - (sMax + sMin) / 2;
  if (!(elastic > 0)) return 1;
  const lnRatio = Math.log(elastic / material.sigmaF);
  return solveTwoTermReversals(
    lnRatio + Math.log(material.sigmaF / material.E), material.b,
    lnEpsilonF + (material.c / material.b) * lnRatio, material.c,
    Math.log(ea), cutoff, maxIt,
  );
}

function flagBits(material: Material, sMax: number, sMin: number, r: number): number {
  if (r === Infinity) return 1;
  if (r !== 1) return 0;
  return material.sigmaF - (sMax + sMin) / 2 > 0 ? 2 : 8;
}

/**
 * Modified Morrow (Manson-Halford) mean-stress correction: the mean stress scales both terms,
 * keeping the ratio of elastic to plastic strain of the fully reversed curve at each life.
 *
 *     εa = (σf' − σm)/E·(2Nf)^b + εf'·((σf' − σm)/σf')^(c/b)·(2Nf)^c
 *
 * Returns reversals 2Nf (cycles Nf = 2Nf/2). `value` is εa. At σm = 0 it is exactly `none`.
 * Special cases as {@link morrow}: σm ≥ σf' → 1 with `mean-stress-at-or-above-sigmaF`;
 * εa = 0 or beyond the cut-off → Infinity (`below-cutoff`). More severe than Morrow in the
 * low-cycle range.
 *
 * Reference: S. S. Manson and G. R. Halford, "Practical implementation of the double linear
 * damage rule and damage curve approach for treating cumulative fatigue damage", International
 * Journal of Fracture 17 (1981) 169-192, doi:10.1007/BF00053519; as presented in N. E. Dowling,
 * Fatigue Fract. Eng. Mater. Struct. 32 (2009) 1004-1019, doi:10.1111/j.1460-2695.2009.01404.x.
 *
 * @example
 * modifiedMorrow.reversalsToFailure(aisi4340, { stressMax: 1000, stressMin: -600, strainMax: 0.007, strainMin: -0.003 })
 * // returns { reversals: 3195.64..., value: 0.005, flags: [] }   (σm = 200 MPa)
 */
export const modifiedMorrow: DamageParameter<'modifiedMorrow'> = Object.freeze({
  name: 'modifiedMorrow' as const,
  label: 'modified Morrow (Manson-Halford)',
  valueUnit: 'strain' as const,

  reversalsToFailure(material: Material, loop: Loop, options: ReversalsOptions = {}): DamageResult {
    assertMaterial(material);
    const { stressMax: sMax, stressMin: sMin, strainMax: eMax, strainMin: eMin } = loop;
    checkLoop(sMax, sMin, eMax, eMin, undefined);
    const ea = (eMax - eMin) / 2;
    const r = modifiedMorrowReversals(
      material, Math.log(material.epsilonF), sMax, sMin, ea,
      options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS, options.maxIterations ?? DEFAULT_MAX_ITERATIONS,
    );
    return { reversals: r, value: ea, flags: flagNames(flagBits(material, sMax, sMin, r), DAMAGE_FLAG_BITS) };
  },

  reversalsToFailureInto(
    material: Material, loops: LoopColumns, out: Float64Array, flags?: Uint8Array, options: ReversalsOptions = {},
  ): Float64Array {
    assertMaterial(material);
    const count = checkColumns(loops, out, flags);
    const cutoff = options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
    const maxIt = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
    const lnEpsilonF = Math.log(material.epsilonF);
    const { stressMax, stressMin, strainMax, strainMin } = loops;
    if (count < REVERSALS_TABLE_MIN_COUNT) {
      for (let i = 0; i < count; i++) {
        const sMax = stressMax[i];
        const sMin = stressMin[i];
        const eMax = strainMax[i];
        const eMin = strainMin[i];
        checkLoop(sMax, sMin, eMax, eMin, i);
        const r = modifiedMorrowReversals(material, lnEpsilonF, sMax, sMin, (eMax - eMin) / 2, cutoff, maxIt);
        out[i] = r;
        if (flags !== undefined) flags[i] = flagBits(material, sMax, sMin, r);
      }
      return out;
    }
    // Many loops: with w = x·r^(1/b), r = (σf' − σm)/σf', the equation is the fully reversed
    // curve in w, so one table of it serves every mean stress (solve with shift ln(r)/b).
    // Check every loop and find the ranges of εa and σm, then solve from a table start.
    const { sigmaF, E, b, c } = material;
    let yMin = Infinity;
    let yMax = 0;
    let mLo = Infinity;
    let mHi = -Infinity;
    for (let i = 0; i < count; i++) {
      const sMax = stressMax[i];
      const sMin = stressMin[i];
      const eMax = strainMax[i];
      const eMin = strainMin[i];
      checkLoop(sMax, sMin, eMax, eMin, i);
      const sm = (sMax + sMin) / 2;
      if (sigmaF - sm > 0) {
        const y = (eMax - eMin) / 2;
        if (y > 0 && y < yMin) yMin = y;
        if (y > yMax) yMax = y;
        if (sm < mLo) mLo = sm;
        if (sm > mHi) mHi = sm;
      }
    }
    const ranged = mLo <= mHi;
    const table = new TwoTermReversalsTable(Math.log(sigmaF / E), b, lnEpsilonF, c, {
      cutoffReversals: cutoff,
      maxIterations: maxIt,
      lnTargetMin: Math.log(yMin),
      lnTargetMax: Math.log(yMax),
      minShift: ranged ? Math.log((sigmaF - mLo) / sigmaF) / b : 0,
      maxShift: ranged ? Math.log((sigmaF - mHi) / sigmaF) / b : 0,
    });
    for (let i = 0; i < count; i++) {
      const sMax = stressMax[i];
      const sMin = stressMin[i];
      const elastic = sigmaF - (sMax + sMin) / 2;
      const r = elastic > 0 ? table.solve(Math.log((strainMax[i] - strainMin[i]) / 2), Math.log(elastic / sigmaF) / b) : 1;
      out[i] = r;
      if (flags !== undefined) flags[i] = flagBits(material, sMax, sMin, r);
    }
    return out;
  },
});
