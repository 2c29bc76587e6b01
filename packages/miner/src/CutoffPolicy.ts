import { MinerError } from './MinerError';

/**
 * What a cycle with a long life contributes to the Palmgren-Miner sum:
 * - `'none'` (default): every cycle damages, count / Nf, however long its life (Haibach's
 *   "elementary" Miner rule);
 * - `{ cycles: Nc }`: a cycle whose life Nf exceeds Nc cycles is taken as infinite life and does
 *   no damage; Nf ≤ Nc damages as usual (Miner's original rule with a cut-off at the endurance
 *   limit, in Haibach's terms). Nc is in cycles, not reversals (Nc = 2Nc'/2 for a cut-off
 *   given in reversals).
 *
 * A life of Infinity does no damage under either policy (count / ∞ = 0).
 *
 * Reference: E. Haibach, Betriebsfestigkeit, 3rd ed., Springer, 2006, on the original,
 * elementary and modified forms of the Miner rule (chapter from memory).
 */
export type CutoffPolicy = 'none' | { readonly cycles: number };

/** The life in cycles above which damage is zero: Infinity for `'none'`. Validates the policy. */
export function cutoffLimit(policy: CutoffPolicy | undefined, field = 'cutoff'): number {
  if (policy === undefined || policy === 'none') return Infinity;
  if (policy === null || typeof policy !== 'object' || typeof policy.cycles !== 'number') {
    throw new MinerError('invalid-cutoff', field, policy, "must be 'none' or { cycles } with cycles > 0");
  }
  const c = policy.cycles;
  if (!(c > 0)) throw new MinerError('invalid-cutoff', `${field}.cycles`, c, 'must be a number > 0 (Infinity means no cut-off)');
  return c;
}
