import type { Material } from '@loopwise/material';
import { createWalker, damageParameters, type DamageParameter, type DamageParameterName } from '@loopwise/mean-stress';

/** Local loop columns as the tracker gives them. */
export interface LocalLoopColumns {
  stressMax: Float64Array;
  stressMin: Float64Array;
  strainMax: Float64Array;
  strainMin: Float64Array;
}

/** Per-loop results of a damage parameter. */
export interface LoopLives {
  /** The parameter's value (εa, σmax·εa or the Walker stress; see `valueUnit`). */
  parameter: Float64Array;
  /** Reversals to failure 2Nf. */
  reversalsToFailure: Float64Array;
  /** Cycles to failure Nf = 2Nf / 2. */
  cyclesToFailure: Float64Array;
  /** Damage-parameter flags per loop (mean-stress DAMAGE_FLAG_BITS). */
  flags: Uint8Array;
}

/** The damage parameter object for a name (Walker with the job's γ or γ from Su). */
export function damageParameterFor(name: DamageParameterName, walkerGamma: number | undefined): DamageParameter {
  if (name === 'walker') return createWalker({ gamma: walkerGamma ?? 'steel-from-Su' });
  return damageParameters[name] as DamageParameter;
}

/**
 * Solves reversals to failure of every loop once with the damage parameter's typed-array kernel
 * and the parameter's value with its kernel too (εa, σmax·εa, or the Walker stress). Equations,
 * special cases and references: the mean-stress package.
 */
export function evaluateLoops(
  cols: LocalLoopColumns,
  material: Material,
  name: DamageParameterName,
  walkerGamma: number | undefined,
): LoopLives {
  const n = cols.stressMax.length;
  const parameter = new Float64Array(n);
  const reversalsToFailure = new Float64Array(n);
  const cyclesToFailure = new Float64Array(n);
  const flags = new Uint8Array(n);
  const p = damageParameterFor(name, walkerGamma);
  p.reversalsToFailureInto(material, cols, reversalsToFailure, flags);
  p.parameterValueInto(material, cols, parameter);
  for (let i = 0; i < n; i++) cyclesToFailure[i] = reversalsToFailure[i] / 2;
  return { parameter, reversalsToFailure, cyclesToFailure, flags };
}
