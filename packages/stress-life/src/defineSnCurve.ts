import { unknownField } from '@loopwise/base';
import { checkPositive } from './checks';
import type { SnCurve, SnCurveInput, StressMeasure } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/**
 * Builds an S-N curve in cycles (never reversals) from a reference point, the first slope,
 * knee points and an optional cut-off: Basquin's power law, bilinear or trilinear.
 *
 * Method: the first segment is S^m₀·N = S_ref^m₀·N_ref (Basquin; S = S_ref·(N/N_ref)^(−1/m₀)).
 * At each knee Nₖ the curve is continuous and continues with the knee's slope:
 *
 *     S(Nₖ) = S(Nₖ₋₁)·(Nₖ₋₁/Nₖ)^(1/mₖ)          (S(N₀) from the reference point)
 *     N(S)  = Nₖ·(S(Nₖ)/S)^mₖ₊₁                 for S(Nₖ₊₁) <= S < S(Nₖ)
 *
 * With a cut-off N_L, every stress below S(N_L) gives infinite life (no damage); the curve is
 * otherwise extended without limit above the reference point (no static or low-cycle cap: the
 * caller warns about extrapolation).
 *
 * References: O. H. Basquin, "The exponential law of endurance tests", Proc. ASTM 10 (1910)
 * 625-630; the multi-slope form and cut-off as in EN 1993-1-9:2005, 7.1 and Figure 7.1.
 *
 * Special cases: knees must increase strictly; the reference point may lie beyond the first
 * knee (it then only anchors the line of the first segment).
 *
 * @throws {StressLifeError} `invalid-curve` naming the field: `stress`, `cycles`, `slope`,
 *   `knees[i].cycles`, `knees[i].slope`, `cutoffCycles`, `measure`.
 * @example
 * const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3, knees: [{ cycles: 5e6, slope: 5 }], cutoffCycles: 1e8 });
 * c.kneeStresses[0].toFixed(3);
 * // returns '73.681'
 */
export function defineSnCurve(input: SnCurveInput): SnCurve {
  if (input === null || typeof input !== 'object') throw new StressLifeError('invalid-curve', 'curve', input, 'must be { stress, cycles, slope, knees?, cutoffCycles? }');
  const unknown = unknownField(input, ['measure', 'stress', 'cycles', 'slope', 'knees', 'cutoffCycles'], 'the curve');
  if (unknown !== undefined) throw new StressLifeError('invalid-curve', unknown.field, unknown.value, unknown.rule);
  const measure: StressMeasure = input.measure ?? 'range';
  if (measure !== 'range' && measure !== 'amplitude') throw new StressLifeError('invalid-curve', 'measure', measure, "must be 'range' or 'amplitude'");
  checkPositive(input.stress, 'stress', 'invalid-curve');
  checkPositive(input.cycles, 'cycles', 'invalid-curve');
  checkPositive(input.slope, 'slope', 'invalid-curve');
  const knees = input.knees ?? [];
  if (!Array.isArray(knees)) throw new StressLifeError('invalid-curve', 'knees', knees, 'must be an array of { cycles, slope }');
  const slopes = [input.slope];
  const kneeCycles: number[] = [];
  const kneeStresses: number[] = [];
  let anchorS = input.stress;
  let anchorN = input.cycles;
  for (let k = 0; k < knees.length; k++) {
    const knee = knees[k];
    if (knee === null || typeof knee !== 'object') throw new StressLifeError('invalid-curve', `knees[${k}]`, knee, 'must be { cycles, slope }');
    checkPositive(knee.cycles, `knees[${k}].cycles`, 'invalid-curve');
    checkPositive(knee.slope, `knees[${k}].slope`, 'invalid-curve');
    if (k > 0 && !(knee.cycles > kneeCycles[k - 1])) {
      throw new StressLifeError('invalid-curve', `knees[${k}].cycles`, knee.cycles, `must exceed the knee before it (${kneeCycles[k - 1]} cycles)`);
    }
    const s = anchorS * Math.pow(anchorN / knee.cycles, 1 / slopes[k]);
    kneeCycles.push(knee.cycles);
    kneeStresses.push(s);
    slopes.push(knee.slope);
    anchorS = s;
    anchorN = knee.cycles;
  }
  const cutoffCycles = input.cutoffCycles ?? Infinity;
  if (!(cutoffCycles > 0)) throw new StressLifeError('invalid-curve', 'cutoffCycles', cutoffCycles, 'must be a number > 0 (Infinity for none)');
  const curve: SnCurve = {
    measure,
    referenceStress: input.stress,
    referenceCycles: input.cycles,
    slopes: Object.freeze(slopes),
    kneeCycles: Object.freeze(kneeCycles),
    kneeStresses: Object.freeze(kneeStresses),
    cutoffCycles,
    cutoffStress: 0,
  };
  const cutoffStress = cutoffCycles === Infinity ? 0 : curveStress(curve, cutoffCycles);
  return Object.freeze({ ...curve, cutoffStress });
}

/** Stress of the segments at N cycles (ignores the cut-off). Internal. */
export function curveStress(curve: SnCurve, cycles: number): number {
  const kn = curve.kneeCycles;
  let k = 0;
  while (k < kn.length && cycles > kn[k]) k++;
  const s0 = k === 0 ? curve.referenceStress : curve.kneeStresses[k - 1];
  const n0 = k === 0 ? curve.referenceCycles : kn[k - 1];
  return s0 * Math.pow(n0 / cycles, 1 / curve.slopes[k]);
}
