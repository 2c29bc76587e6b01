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

function flagBits(r: number): number {
  return r === Infinity ? 1 : r === 1 ? 2 : 0;
}

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
export const none: DamageParameter<'none'> = Object.freeze({
  name: 'none' as const,
  label: 'none (fully reversed strain-life curve)',
  valueUnit: 'strain' as const,

  reversalsToFailure(material: Material, loop: Loop, options: ReversalsOptions = {}): DamageResult {
    assertMaterial(material);
    checkLoop(loop.stressMax, loop.stressMin, loop.strainMax, loop.strainMin, undefined);
    const ea = (loop.strainMax - loop.strainMin) / 2;
    const r = solveTwoTermReversals(
      Math.log(material.sigmaF / material.E), material.b, Math.log(material.epsilonF), material.c, Math.log(ea),
      options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS, options.maxIterations ?? DEFAULT_MAX_ITERATIONS,
    );
    return { reversals: r, value: ea, flags: flagNames(flagBits(r), DAMAGE_FLAG_BITS) };
  },

  reversalsToFailureInto(
    material: Material, loops: LoopColumns, out: Float64Array, flags?: Uint8Array, options: ReversalsOptions = {},
  ): Float64Array {
    assertMaterial(material);
    const count = checkColumns(loops, out, flags);
    const cutoff = options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
    const maxIt = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
    const lnA = Math.log(material.sigmaF / material.E);
    const lnB = Math.log(material.epsilonF);
    const b = material.b;
    const c = material.c;
    const { stressMax, stressMin, strainMax, strainMin } = loops;
    if (count < REVERSALS_TABLE_MIN_COUNT) {
      for (let i = 0; i < count; i++) {
        const eMax = strainMax[i];
        const eMin = strainMin[i];
        checkLoop(stressMax[i], stressMin[i], eMax, eMin, i);
        const r = solveTwoTermReversals(lnA, b, lnB, c, Math.log((eMax - eMin) / 2), cutoff, maxIt);
        out[i] = r;
        if (flags !== undefined) flags[i] = flagBits(r);
      }
      return out;
    }
    // Many loops: check them all and find the range of amplitudes, then solve from a table start.
    let yMin = Infinity;
    let yMax = 0;
    for (let i = 0; i < count; i++) {
      const eMax = strainMax[i];
      const eMin = strainMin[i];
      checkLoop(stressMax[i], stressMin[i], eMax, eMin, i);
      const y = (eMax - eMin) / 2;
      if (y > 0 && y < yMin) yMin = y;
      if (y > yMax) yMax = y;
    }
    const table = new TwoTermReversalsTable(lnA, b, lnB, c, {
      cutoffReversals: cutoff, maxIterations: maxIt, lnTargetMin: Math.log(yMin), lnTargetMax: Math.log(yMax),
    });
    for (let i = 0; i < count; i++) {
      const r = table.solve(Math.log((strainMax[i] - strainMin[i]) / 2));
      out[i] = r;
      if (flags !== undefined) flags[i] = flagBits(r);
    }
    return out;
  },
});
