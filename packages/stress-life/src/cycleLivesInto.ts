import { unknownField } from '@loopwise/base';
import type { AmplitudeCorrection } from './AmplitudeCorrection';
import { checkColumn } from './checks';
import { checkedLife, cyclesAt } from './cyclesToFailure';
import { checkCycles, resolveCorrection, writeEquivalent } from './equivalentAmplitudeInto';
import type { SnCurve } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/** Options of the cycle route ({@link cycleLivesInto}, {@link stressLifeDamage}, {@link stressLifeKernel}). */
export interface CycleLifeOptions {
  /** Mean-stress correction of the amplitude. Default `{ method: 'none' }`. */
  meanStress?: AmplitudeCorrection;
  /**
   * Fatigue notch factor Kf (>= 1) applied to the nominal range and mean alike (Shigley, 9th
   * ed., p. 346: "apply Kf to both stresses"). Default 1. From geometry and material:
   * `fatigueNotchFactor(Kt, petersonSensitivity(r, petersonConstantMm(Su)))` of `@loopwise/notch`.
   */
  kf?: number;
  /** A factor on every range and mean, e.g. a load partial factor. Default 1. */
  stressFactor?: number;
}

/** Checks the options of the cycle route and returns [the correction with its defaults, the stress scale Kf·f]; errors name the option. */
export function resolveCycleOptions(options: CycleLifeOptions): [AmplitudeCorrection, number] {
  if (options === null || typeof options !== 'object') throw new StressLifeError('invalid-option', 'options', options, 'must be an options object');
  const unknown = unknownField(options, ['meanStress', 'kf', 'stressFactor'], 'the cycle options');
  if (unknown !== undefined) throw new StressLifeError('invalid-option', unknown.field, unknown.value, unknown.rule);
  const c = resolveCorrection(options.meanStress);
  const kf = options.kf ?? 1;
  const sf = options.stressFactor ?? 1;
  if (!(kf >= 1 && kf < Infinity)) throw new StressLifeError('invalid-option', 'kf', kf, 'must be a finite number >= 1');
  if (!(sf > 0 && sf < Infinity)) throw new StressLifeError('invalid-option', 'stressFactor', sf, 'must be a finite number > 0');
  return [c, kf * sf];
}

/**
 * Kernel of the stress-life route: cycles to failure Nf (cycles, never reversals) of rainflow
 * cycles given by range and mean, into caller-owned `out` (no allocation; `out` may be
 * `ranges`). Per cycle:
 *
 *     Δ = Kf·f·range,  σm = Kf·f·mean,  σa = Δ/2
 *     σar = correction(σa, σm)                         (see {@link equivalentAmplitudeInto})
 *     S = 2·σar (curve measure 'range') or σar ('amplitude');  Nf = N(S) on the curve
 *
 * Every cycle is checked before anything is written. A cycle of zero range, or of zero
 * equivalent amplitude (SWT or Walker with σmax <= 0), has infinite life.
 *
 * References: see the correction and the curve; the order (notch factor on both stresses,
 * then the mean-stress correction, then the S-N curve) is that of R. G. Budynas and J. K.
 * Nisbett, Shigley's Mechanical Engineering Design, 9th ed., 2011, 6-18 (pp. 345-346).
 *
 * @throws {StressLifeError} `invalid-stress` (a range NaN, ±Infinity or negative, naming the
 *   index), `invalid-mean`, `invalid-option`, `invalid-argument` (lengths).
 * @example
 * const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 });
 * Array.from(cycleLivesInto(c, [100, 50], [0, 0], new Float64Array(2)));
 * // returns [2000000, 16000000]
 */
export function cycleLivesInto(
  curve: SnCurve,
  ranges: ArrayLike<number>,
  means: ArrayLike<number>,
  out: Float64Array,
  options: CycleLifeOptions = {},
): Float64Array {
  const [c, scale] = resolveCycleOptions(options);
  checkColumn(ranges, 'ranges');
  const n = ranges.length;
  checkColumn(means, 'means', n);
  checkColumn(out, 'out', n, false);
  checkCycles(c, ranges, means, scale, 'ranges');
  writeEquivalent(c, ranges, means, 0.5, scale, out);
  const k = curve.measure === 'range' ? 2 : 1;
  for (let i = 0; i < n; i++) {
    const life = cyclesAt(curve, k * out[i]);
    if (!(life > 0)) checkedLife(life, ranges[i], 'ranges', i);
    out[i] = life;
  }
  return out;
}
