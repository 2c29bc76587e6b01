import type { Material } from '@loopwise/material';
import type { DamageParameter } from './DamageParameter';
import type { LoopColumns } from './Loop';
import { TARGET_ONLY, twoTermParameter, type TwoTermTerms } from './twoTermParameter';

/**
 * Smith-Watson-Topper damage parameter: the product of the peak stress and the strain amplitude
 * equals its fully reversed value on the strain-life curve.
 *
 *     σmax·εa = σf'²/E·(2Nf)^(2b) + σf'·εf'·(2Nf)^(b+c)
 *
 * Returns reversals 2Nf (cycles Nf = 2Nf/2). `value` is σmax·εa (stress unit × strain), 0 when
 * σmax ≤ 0.
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
export const smithWatsonTopper: DamageParameter<'smithWatsonTopper'> = twoTermParameter({
  name: 'smithWatsonTopper' as const,
  label: 'Smith-Watson-Topper',
  valueUnit: 'stress*strain',
  varies: TARGET_ONLY,
  special: { reversals: Infinity, bit: 4 }, // compressive-no-damage: σmax ≤ 0

  // σmax·εa = σf'²/E·x^(2b) + σf'·εf'·x^(b+c)
  terms(m: Material): TwoTermTerms {
    return { lnA: 2 * Math.log(m.sigmaF) - Math.log(m.E), p: 2 * m.b, lnB: Math.log(m.sigmaF * m.epsilonF), q: m.b + m.c };
  },

  targetsInto(_t: TwoTermTerms, loops: LoopColumns, count: number, lnTarget: Float64Array): void {
    const { stressMax, strainMax, strainMin } = loops;
    for (let i = 0; i < count; i++) {
      const sMax = stressMax[i];
      lnTarget[i] = sMax > 0 ? Math.log((sMax * (strainMax[i] - strainMin[i])) / 2) : NaN;
    }
  },

  // σmax·εa, 0 when σmax ≤ 0
  valuesInto(_t: TwoTermTerms, loops: LoopColumns, count: number, out: Float64Array): void {
    const { stressMax, strainMax, strainMin } = loops;
    for (let i = 0; i < count; i++) {
      const sMax = stressMax[i];
      out[i] = sMax > 0 ? (sMax * (strainMax[i] - strainMin[i])) / 2 : 0;
    }
  },
});
