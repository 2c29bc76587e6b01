import type { Material } from '@loopwise/material';
import type { DamageParameter } from './DamageParameter';
import type { LoopColumns } from './Loop';
import { TARGET_ONLY, twoTermParameter, type TwoTermTerms } from './twoTermParameter';

/**
 * No mean-stress correction: the fully reversed strain-life curve (Coffin-Manson-Basquin) at the
 * loop's strain amplitude, ignoring its mean stress.
 *
 *     εa = σf'/E·(2Nf)^b + εf'·(2Nf)^c,    εa = (εmax − εmin)/2
 *
 * Returns reversals 2Nf (cycles Nf = 2Nf/2). `value` is εa (dimensionless). Special cases:
 * εa = 0 or a life beyond the cut-off → Infinity (`below-cutoff`); εa ≥ σf'/E + εf' → 1
 * (`at-or-above-first-reversal`).
 *
 * Reference: Coffin-Manson-Basquin as in ASTM E606/E606M, appendix X1; N. E. Dowling,
 * Mechanical Behavior of Materials, Pearson, section 14.2.
 *
 * @example
 * none.reversalsToFailure(sae1045, { stressMax: 500, stressMin: -300, strainMax: 0.004, strainMin: -0.004 })
 * // returns { reversals: 43494.70..., value: 0.004, flags: [] }
 */
export const none: DamageParameter<'none'> = twoTermParameter({
  name: 'none' as const,
  label: 'none (fully reversed strain-life curve)',
  valueUnit: 'strain',
  varies: TARGET_ONLY,
  special: { reversals: Infinity, bit: 0 }, // never: every target is a number

  // εa = σf'/E·x^b + εf'·x^c
  terms(m: Material): TwoTermTerms {
    return { lnA: Math.log(m.sigmaF / m.E), p: m.b, lnB: Math.log(m.epsilonF), q: m.c };
  },

  targetsInto(_t: TwoTermTerms, loops: LoopColumns, count: number, lnTarget: Float64Array): void {
    const { strainMax, strainMin } = loops;
    for (let i = 0; i < count; i++) lnTarget[i] = Math.log((strainMax[i] - strainMin[i]) / 2);
  },

  // εa
  valuesInto(_t: TwoTermTerms, loops: LoopColumns, count: number, out: Float64Array): void {
    const { strainMax, strainMin } = loops;
    for (let i = 0; i < count; i++) out[i] = (strainMax[i] - strainMin[i]) / 2;
  },
});
