import { checkReversalsOptions, type Material, type ReversalsOptions } from '@loopwise/material';
import type { DamageParameter, DamageResult } from './DamageParameter';
import { damageParameter, DEFAULT_DAMAGE_PARAMETER, type DamageParameterName } from './damageParameters';
import type { Loop } from './Loop';

/** Options of {@link loopReversalsToFailure}. */
export interface LoopReversalsOptions extends ReversalsOptions {
  /** The damage parameter, by name or object. Default {@link DEFAULT_DAMAGE_PARAMETER} (`'smithWatsonTopper'`). */
  parameter?: DamageParameterName | DamageParameter;
}

/**
 * Reversals to failure 2Nf (not cycles) of one closed loop with a mean-stress damage parameter:
 * the plain-name entry point, a documented alias of `damageParameters[DEFAULT_DAMAGE_PARAMETER]`
 * (Smith-Watson-Topper) unless `options.parameter` names another. Equations, references and
 * special cases: see the parameter (`none`, `morrow`, `modifiedMorrow`, `smithWatsonTopper`,
 * `walker`).
 *
 * @example
 * loopReversalsToFailure(aisi4340, { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 })
 * // returns { reversals: 8250.04..., value: 4, flags: [] }   (SWT)
 */
export function loopReversalsToFailure(material: Material, loop: Loop, options: LoopReversalsOptions = {}): DamageResult {
  checkReversalsOptions(options, 'loopReversalsToFailure options', ['parameter']);
  const p = options.parameter ?? DEFAULT_DAMAGE_PARAMETER;
  const parameter = typeof p === 'string' ? damageParameter(p) : p;
  const { parameter: _parameter, ...solve } = options;
  return parameter.reversalsToFailure(material, loop, solve);
}
