import type { DamageParameter } from './DamageParameter';
import { MeanStressError } from './MeanStressError';
import { modifiedMorrow } from './modifiedMorrow';
import { morrow } from './morrow';
import { none } from './none';
import { smithWatsonTopper } from './smithWatsonTopper';
import { walker } from './walker';

/** Names of the registered damage parameters. */
export type DamageParameterName = 'none' | 'morrow' | 'modifiedMorrow' | 'smithWatsonTopper' | 'walker';

/**
 * Registry of the damage parameters by name; each entry's `name` equals its key, so selection by
 * name is type-safe (`damageParameters[name]` has the type of that parameter). `walker` here
 * estimates γ from the material's Su for steels; use `createWalker` for a given γ.
 *
 * @example
 * damageParameters.smithWatsonTopper.label
 * // returns 'Smith-Watson-Topper'
 */
export const damageParameters: { readonly [N in DamageParameterName]: DamageParameter<N> } = Object.freeze({
  none,
  morrow,
  modifiedMorrow,
  smithWatsonTopper,
  walker,
});

/**
 * The default damage parameter: `'smithWatsonTopper'`. Chosen because it needs no constant
 * beyond the strain-life curve, uses the local σmax that the notch tracker provides, behaves
 * reasonably for steels and aluminium alloys alike (Dowling 2009, doi:10.1111/j.1460-2695.2009.01404.x),
 * and treats fully compressive loops as harmless. Changing the default never changes what a
 * named parameter computes.
 */
export const DEFAULT_DAMAGE_PARAMETER: DamageParameterName = 'smithWatsonTopper';

/**
 * The damage parameter registered under `name` (type-safe for literal names; a runtime check
 * guards untyped callers, e.g. names read from a job file).
 *
 * @throws {MeanStressError} `unknown-damage-parameter` for a name not in {@link damageParameters}.
 * @example
 * damageParameter('morrow').name
 * // returns 'morrow'
 */
export function damageParameter<N extends DamageParameterName>(name: N): DamageParameter<N> {
  if (typeof name !== 'string' || !Object.prototype.hasOwnProperty.call(damageParameters, name)) {
    throw new MeanStressError(
      'unknown-damage-parameter', 'name', name, `must be one of ${Object.keys(damageParameters).join(', ')}`,
    );
  }
  return damageParameters[name] as DamageParameter<N>;
}
