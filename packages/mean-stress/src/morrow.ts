import {
  assertMaterial,
  DEFAULT_CUTOFF_REVERSALS,
  DEFAULT_MAX_ITERATIONS,
  solveTwoTermReversals,
  type Material,
  type ReversalsOptions,
} from '@loopwise/material';
import { checkColumns, checkLoop, flagNames } from './checkLoop';
import { DAMAGE_FLAG_BITS, type DamageParameter, type DamageResult } from './DamageParameter';
import type { Loop, LoopColumns } from './Loop';

/** Internal: reversals by Morrow; 1 when σm ≥ σf' (flagged by the caller). */
function morrowReversals(
  material: Material, lnB: number, sMax: number, sMin: number, ea: number, cutoff: number, maxIt: number,
): number {
  const elastic = material.sigmaF - (sMax + sMin) / 2;
  if (!(elastic > 0)) return 1;
  return solveTwoTermReversals(Math.log(elastic / material.E), material.b, lnB, material.c, Math.log(ea), cutoff, maxIt);
}

function flagBits(material: Material, sMax: number, sMin: number, r: number): number {
  if (r === Infinity) return 1;
  if (r !== 1) return 0;
  return material.sigmaF - (sMax + sMin) / 2 > 0 ? 2 : 8;
}

/**
 * Morrow's mean-stress correction: the mean stress σm = (σmax + σmin)/2 lowers the fatigue
 * strength coefficient in the elastic term only.
 *
 *     εa = (σf' − σm)/E·(2Nf)^b + εf'·(2Nf)^c
 *
 * Returns reversals 2Nf (cycles Nf = 2Nf/2). `value` is εa. At σm = 0 it is exactly `none`.
 * A compressive mean lengthens life. Special cases: σm ≥ σf' → 1 with the flag
 * `mean-stress-at-or-above-sigmaF` (the elastic term vanishes; failure on the first reversal,
 * a defined and conservative result); εa = 0 or beyond the cut-off → Infinity (`below-cutoff`).
 * Suited to steels; for aluminium alloys it is known to be non-conservative (Dowling 2009).
 *
 * Reference: J. Morrow, "Fatigue properties of metals", section 3.2 of Fatigue Design Handbook,
 * Advances in Engineering vol. 4, SAE, Warrendale PA, 1968, pp. 21-29; strain-life form as in
 * N. E. Dowling, "Mean stress effects in strain-life fatigue", Fatigue and Fracture of
 * Engineering Materials and Structures 32 (2009) 1004-1019, doi:10.1111/j.1460-2695.2009.01404.x.
 *
 * @example
 * morrow.reversalsToFailure(aisi4340, { stressMax: 1000, stressMin: -600, strainMax: 0.007, strainMin: -0.003 })
 * // returns { reversals: 8677.64..., value: 0.005, flags: [] }   (σm = 200 MPa)
 */
export const morrow: DamageParameter<'morrow'> = Object.freeze({
  name: 'morrow' as const,
  label: 'Morrow',
  valueUnit: 'strain' as const,

  reversalsToFailure(material: Material, loop: Loop, options: ReversalsOptions = {}): DamageResult {
    assertMaterial(material);
    const { stressMax: sMax, stressMin: sMin, strainMax: eMax, strainMin: eMin } = loop;
    checkLoop(sMax, sMin, eMax, eMin, undefined);
    const ea = (eMax - eMin) / 2;
    const r = morrowReversals(
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
    const lnB = Math.log(material.epsilonF);
    const { stressMax, stressMin, strainMax, strainMin } = loops;
    for (let i = 0; i < count; i++) {
      const sMax = stressMax[i];
      const sMin = stressMin[i];
      const eMax = strainMax[i];
      const eMin = strainMin[i];
      checkLoop(sMax, sMin, eMax, eMin, i);
      const r = morrowReversals(material, lnB, sMax, sMin, (eMax - eMin) / 2, cutoff, maxIt);
      out[i] = r;
      if (flags !== undefined) flags[i] = flagBits(material, sMax, sMin, r);
    }
    return out;
  },
});
