import { defineSnCurve } from './defineSnCurve';
import type { SnCurve } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/** FAT classes of steel for normal stress ranges (MPa at 2·10^6 cycles), IIW recommendations, S-N curve figure of 3.2 (value from memory). */
export const IIW_NORMAL_FAT_CLASSES: readonly number[] = Object.freeze([160, 140, 125, 112, 100, 90, 80, 71, 63, 56, 50, 45, 40, 36]);

/** FAT classes of steel for shear stress ranges (MPa at 2·10^6 cycles), IIW recommendations 3.2 (value from memory). */
export const IIW_SHEAR_FAT_CLASSES: readonly number[] = Object.freeze([100, 80]);

/**
 * The damage sum the IIW recommendations give for variable-amplitude assessment of steel (and
 * aluminium) by Palmgren-Miner: D = 0.5 (A. Hobbacher, Recommendations for Fatigue Design of
 * Welded Joints and Components, IIW document XIII-2460-13, 2nd ed., Springer 2016, 4.3.1;
 * value from memory; the same section gives D = 0.2 for spectra with widely changing mean
 * stress, also from memory). Use it as `criticalDamage` of miner's `lifeFromDamage`.
 */
export const IIW_DAMAGE_SUM = 0.5;

/** Below-knee rule of {@link iiwFatCurve} for variable amplitude. */
export type IiwBelowKnee = 'haibach' | 'veryHighCycle' | 'original' | 'elementary';

/** Options of {@link iiwFatCurve}. */
export interface IiwCurveOptions {
  /** `'normal'` (m = 3, knee at 10^7) or `'shear'` (m = 5, knee at 10^8). Default `'normal'`. */
  stress?: 'normal' | 'shear';
  /** `'variable'` (default) or `'constant'` amplitude (no damage below the knee). */
  loading?: 'variable' | 'constant';
  /**
   * Below the knee for variable amplitude: `'haibach'` (slope 2m − 1: 5 for normal, 9 for
   * shear; the recommendations' rule for Miner summation), `'veryHighCycle'` (slope 22, the
   * curve for very high cycle applications), `'original'`, `'elementary'`. Default `'haibach'`.
   */
  belowKnee?: IiwBelowKnee;
  /** Partial safety factor γM on the resistance (FAT/γM). Default 1.0 (the characteristic curve; choose γM per the recommendations' chapter 5, value range 1.0-1.4 from memory). */
  gammaM?: number;
  /** Thickness correction f(t) multiplying FAT (e.g. {@link iiwThicknessFactor}). Default 1. */
  thicknessFactor?: number;
}

/**
 * The S-N curve of an IIW FAT class, in stress ranges and cycles:
 *
 *     normal:  Δσ^3·N = FAT^3·2·10^6 up to the knee at N = 10^7 (Δσ_k = (1/5)^(1/3)·FAT = 0.585·FAT)
 *     shear:   Δτ^5·N = FAT^5·2·10^6 up to the knee at N = 10^8 (Δτ_k = (1/50)^(1/5)·FAT = 0.457·FAT)
 *
 * Constant amplitude: no damage below the knee. Variable amplitude: slope 2m − 1 below the knee
 * (Haibach), or slope 22 (very high cycles), or the Miner variants of {@link belowKneeCurve}.
 * FAT is multiplied by f(t) and divided by γM. Mean stress enhancement f(R) depends on each
 * cycle and is applied to the ranges ({@link iiwEnhancedAmplitude}), not to the curve.
 *
 * Reference: A. Hobbacher, Recommendations for Fatigue Design of Welded Joints and Components,
 * IIW document XIII-2460-13, 2nd ed., Springer 2016, 3.2 (S-N curves, knees, slope 22 for very
 * high cycles), 3.5.3 (thickness), 4.3.1 (Miner summation with 2m − 1); the 2008 edition (IIW
 * document XIII-2151r4-07 / XV-1254r4-07) has the same knees (clause numbers and the 2016
 * details value from memory). The recommendations, local codes and licensed review govern a
 * design; this curve is a computation aid.
 *
 * @throws {StressLifeError} `unknown-detail` (field `fat`) for a FAT class not listed;
 *   `invalid-option` for bad options.
 * @example
 * const c = iiwFatCurve(90, { loading: 'constant' });
 * c.cutoffStress.toFixed(2);
 * // returns '52.63'
 */
export function iiwFatCurve(fat: number, options: IiwCurveOptions = {}): SnCurve {
  const stress = options.stress ?? 'normal';
  if (stress !== 'normal' && stress !== 'shear') throw new StressLifeError('invalid-option', 'stress', stress, "must be 'normal' or 'shear'");
  const loading = options.loading ?? 'variable';
  if (loading !== 'variable' && loading !== 'constant') throw new StressLifeError('invalid-option', 'loading', loading, "must be 'variable' or 'constant'");
  const list = stress === 'normal' ? IIW_NORMAL_FAT_CLASSES : IIW_SHEAR_FAT_CLASSES;
  if (!list.includes(fat)) throw new StressLifeError('unknown-detail', 'fat', fat, `the IIW recommendations list ${stress} stress FAT classes ${list.join(', ')} for steel`);
  const gammaM = options.gammaM ?? 1.0;
  const ft = options.thicknessFactor ?? 1;
  if (!(gammaM >= 1 && gammaM < Infinity)) throw new StressLifeError('invalid-option', 'gammaM', gammaM, 'must be a finite number >= 1');
  if (!(ft > 0 && ft <= 1)) throw new StressLifeError('invalid-option', 'thicknessFactor', ft, 'must be a number in (0, 1]');
  const m = stress === 'normal' ? 3 : 5;
  const knee = stress === 'normal' ? 1e7 : 1e8;
  const base = { measure: 'range' as const, stress: (fat * ft) / gammaM, cycles: 2e6, slope: m };
  const rule = loading === 'constant' ? 'original' : (options.belowKnee ?? 'haibach');
  switch (rule) {
    case 'original':
      return defineSnCurve({ ...base, cutoffCycles: knee });
    case 'elementary':
      return defineSnCurve(base);
    case 'haibach':
      return defineSnCurve({ ...base, knees: [{ cycles: knee, slope: 2 * m - 1 }] });
    case 'veryHighCycle':
      return defineSnCurve({ ...base, knees: [{ cycles: knee, slope: 22 }] });
    default:
      throw new StressLifeError('invalid-option', 'belowKnee', rule, "must be 'haibach', 'veryHighCycle', 'original' or 'elementary'");
  }
}
