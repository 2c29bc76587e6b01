import type { Material } from '@loopwise/material';
import type { DamageParameter } from './DamageParameter';
import type { LoopColumns } from './Loop';
import { OWN_LN_A, twoTermParameter, type TwoTermTerms } from './twoTermParameter';

/** The constants of Morrow's equation with the σf' and E that make each loop's ln A. */
interface MorrowTerms extends TwoTermTerms {
  readonly sigmaF: number;
  readonly E: number;
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
export const morrow: DamageParameter<'morrow'> = twoTermParameter({
  name: 'morrow' as const,
  label: 'Morrow',
  valueUnit: 'strain',
  varies: OWN_LN_A,
  special: { reversals: 1, bit: 8 }, // mean-stress-at-or-above-sigmaF: σm ≥ σf'

  // εa = (σf' − σm)/E·x^b + εf'·x^c: ln A = ln((σf' − σm)/E) is the loop's own
  terms(m: Material): MorrowTerms {
    return { lnA: Math.log(m.sigmaF / m.E), p: m.b, lnB: Math.log(m.epsilonF), q: m.c, sigmaF: m.sigmaF, E: m.E };
  },

  targetsInto(t: MorrowTerms, loops: LoopColumns, count: number, lnTarget: Float64Array, lnA: Float64Array): void {
    const { stressMax, stressMin, strainMax, strainMin } = loops;
    const { sigmaF, E } = t;
    for (let i = 0; i < count; i++) {
      const elastic = sigmaF - (stressMax[i] + stressMin[i]) / 2;
      if (elastic > 0) {
        lnTarget[i] = Math.log((strainMax[i] - strainMin[i]) / 2);
        lnA[i] = Math.log(elastic / E);
      } else lnTarget[i] = NaN;
    }
  },

  // εa
  valuesInto(_t: MorrowTerms, loops: LoopColumns, count: number, out: Float64Array): void {
    const { strainMax, strainMin } = loops;
    for (let i = 0; i < count; i++) out[i] = (strainMax[i] - strainMin[i]) / 2;
  },
});
