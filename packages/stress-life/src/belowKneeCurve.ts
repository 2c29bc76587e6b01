import { defineSnCurve } from './defineSnCurve';
import type { SnCurve, SnKnee } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/**
 * How damage is counted below the knee (the fatigue limit of constant-amplitude tests):
 * - `'original'`: original Miner, no damage below the knee stress (a cut-off at the knee);
 * - `'elementary'`: elementary Miner, the first slope continues without a knee;
 * - `'haibach'`: Haibach's modification, slope 2m − 1 below the knee (m the first slope);
 * - `{ slope }`: a given second slope below the knee.
 */
export type BelowKneeRule = 'original' | 'elementary' | 'haibach' | { slope: number };

/** Options of {@link belowKneeCurve}. */
export interface BelowKneeOptions {
  /** Cycles of the knee. Default: the curve's first knee, else its cut-off. */
  kneeCycles?: number;
  /** Cut-off of the new curve for `'elementary'`, `'haibach'` and `{ slope }`. Default none (Infinity). */
  cutoffCycles?: number;
}

/**
 * A variable-amplitude curve from a constant-amplitude one by the rule of damage below the
 * knee (Miner's variants). Only the first segment of `curve` is kept (its reference point and
 * slope m); everything in cycles, never reversals.
 *
 * Equations (N_D the knee, S_D = S(N_D)):
 *
 *     original     N = ∞ for S < S_D
 *     elementary   N = N_D·(S_D/S)^m for every S
 *     haibach      N = N_D·(S_D/S)^(2m−1) for S < S_D
 *     second slope N = N_D·(S_D/S)^k for S < S_D
 *
 * For any S below the knee, original ≥ Haibach ≥ elementary in life (k > m), so the damage of
 * a spectrum under Haibach lies between original and elementary Miner.
 *
 * References: M. A. Miner, J. Appl. Mech. 12 (1945) A159-A164 (original); E. Haibach,
 * "Modifizierte lineare Schadensakkumulations-Hypothese zur Berücksichtigung des
 * Dauerfestigkeitsabfalls mit fortschreitender Schädigung", LBF Technische Mitteilungen TM 50/70
 * (1970) (slope 2m − 1); E. Haibach, Betriebsfestigkeit, Springer (elementary and modified
 * Miner); the IIW recommendations (A. Hobbacher, 2016), 4.3.1, recommend 2m − 1 for variable
 * amplitude (clause number value from memory).
 *
 * @throws {StressLifeError} `invalid-option` for an unknown rule or a curve with neither a knee
 *   nor a cut-off and no `kneeCycles`; `invalid-curve` for a bad slope or cut-off.
 * @example
 * const ca = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3, cutoffCycles: 1e7 });
 * belowKneeCurve(ca, 'haibach').slopes;
 * // returns [3, 5]
 */
export function belowKneeCurve(curve: SnCurve, rule: BelowKneeRule, options: BelowKneeOptions = {}): SnCurve {
  const knee = options.kneeCycles ?? (curve.kneeCycles.length > 0 ? curve.kneeCycles[0] : curve.cutoffCycles);
  if (!(knee > 0 && knee < Infinity)) {
    throw new StressLifeError('invalid-option', 'kneeCycles', knee, 'the curve has no knee and no cut-off: give kneeCycles (finite, > 0)');
  }
  const m = curve.slopes[0];
  const base = { measure: curve.measure, stress: curve.referenceStress, cycles: curve.referenceCycles, slope: m };
  const cutoffCycles = options.cutoffCycles ?? Infinity;
  let knees: SnKnee[];
  if (rule === 'original') return defineSnCurve({ ...base, cutoffCycles: knee });
  if (rule === 'elementary') return defineSnCurve({ ...base, cutoffCycles });
  if (rule === 'haibach') knees = [{ cycles: knee, slope: 2 * m - 1 }];
  else if (rule !== null && typeof rule === 'object' && typeof rule.slope === 'number') knees = [{ cycles: knee, slope: rule.slope }];
  else throw new StressLifeError('invalid-option', 'rule', rule, "must be 'original', 'elementary', 'haibach' or { slope }");
  return defineSnCurve({ ...base, knees, cutoffCycles });
}
