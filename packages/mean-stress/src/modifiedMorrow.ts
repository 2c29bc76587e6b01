import type { Material } from '@loopwise/material';
import type { DamageParameter } from './DamageParameter';
import type { LoopColumns } from './Loop';
import { SHIFT, twoTermParameter, type TwoTermTerms } from './twoTermParameter';

/** The fully reversed equation with the σf' and b that make each loop's shift. */
interface ModifiedMorrowTerms extends TwoTermTerms {
  readonly sigmaF: number;
  readonly b: number;
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
export const modifiedMorrow: DamageParameter<'modifiedMorrow'> = twoTermParameter({
  name: 'modifiedMorrow' as const,
  label: 'modified Morrow (Manson-Halford)',
  valueUnit: 'strain',
  varies: SHIFT,
  special: { reversals: 1, bit: 8 }, // mean-stress-at-or-above-sigmaF: σm ≥ σf'

  // With r = (σf' − σm)/σf' the equation is σf'/E·(x·r^(1/b))^b + εf'·(x·r^(1/b))^c = εa: the
  // fully reversed curve in x·e^s, shift s = ln(r)/b.
  terms(m: Material): ModifiedMorrowTerms {
    return { lnA: Math.log(m.sigmaF / m.E), p: m.b, lnB: Math.log(m.epsilonF), q: m.c, sigmaF: m.sigmaF, b: m.b };
  },

  targetsInto(t: ModifiedMorrowTerms, loops: LoopColumns, count: number, lnTarget: Float64Array, shift: Float64Array): void {
    const { stressMax, stressMin, strainMax, strainMin } = loops;
    const { sigmaF, b } = t;
    for (let i = 0; i < count; i++) {
      const elastic = sigmaF - (stressMax[i] + stressMin[i]) / 2;
      if (elastic > 0) {
        lnTarget[i] = Math.log((strainMax[i] - strainMin[i]) / 2);
        shift[i] = Math.log(elastic / sigmaF) / b;
      } else lnTarget[i] = NaN;
    }
  },

  // εa
  valuesInto(_t: ModifiedMorrowTerms, loops: LoopColumns, count: number, out: Float64Array): void {
    const { strainMax, strainMin } = loops;
    for (let i = 0; i < count; i++) out[i] = (strainMax[i] - strainMin[i]) / 2;
  },
});
