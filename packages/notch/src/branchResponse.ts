import type { Material } from '@loopwise/material';
import { glinka, glinkaRange } from './glinka';
import { linearRule, linearRuleRange } from './linearRule';
import { neuber, neuberRange } from './neuber';
import { cyclicStress, masingStressRange } from '@loopwise/material';
import { resolveTrackerOptions, type NotchTrackerOptions } from './NotchTrackerOptions';

/** A point of the local path: history value and local stress and strain. */
export interface LocalPoint {
  /** History value (after offset). */
  value: number;
  /** Local stress. */
  stress: number;
  /** Local strain. */
  strain: number;
}

/**
 * The local state at history value `value` on the Masing branch that starts at `origin`,
 * recomputed from the notch rule's range form (the pure functions `neuberRange`, `glinkaRange`,
 * `linearRuleRange`, or the Masing curve for local-strain input), independently of the
 * tracker's fast kernel: σ = σ0 + Δσ(k·(value − value0)), ε = ε0 + Δε(…), k the
 * history-to-pseudo-elastic factor. With `origin` null: the first-loading curve.
 *
 * @example
 * branchResponse(options, { value: 300, stress: 411.2, strain: 0.0049 }, -240).stress
 * // returns the local stress at -240 on the branch from 300
 */
export function branchResponse(options: NotchTrackerOptions, origin: LocalPoint | null, value: number): { stress: number; strain: number } {
  const o = resolveTrackerOptions(options);
  const mat: Material = o.material;
  if (origin === null) {
    const e = o.scale * value;
    if (o.kind === 'local-strain') return { stress: cyclicStress(mat, e), strain: e };
    if (o.kind === 'neuber') return neuber(mat, e, { tolerance: 1e-15 });
    if (o.kind === 'glinka') return glinka(mat, e, { tolerance: 1e-15 });
    return linearRule(mat, e);
  }
  const d = o.scale * (value - origin.value);
  let r: { stressRange: number; strainRange: number };
  if (o.kind === 'local-strain') r = { stressRange: masingStressRange(mat, d), strainRange: d };
  else if (o.kind === 'neuber') r = neuberRange(mat, d, { tolerance: 1e-15 });
  else if (o.kind === 'glinka') r = glinkaRange(mat, d, { tolerance: 1e-15 });
  else r = linearRuleRange(mat, d);
  return { stress: origin.stress + r.stressRange, strain: origin.strain + r.strainRange };
}
