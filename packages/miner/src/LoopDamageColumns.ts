import { checkLength } from './checks';
import { MinerError } from './MinerError';
import { MinerSum } from './MinerSum';

/**
 * Per-loop damage with the sample indices of the loop's two reversals: what the attribution
 * functions read. `MinerSum.columns()` has this shape, and so can an engine's own loop table.
 */
export interface LoopDamageColumns {
  /** Damage of each loop (finite, ≥ 0). */
  damage: ArrayLike<number>;
  /** Sample index of each loop's first reversal (finite integer ≥ 0). */
  startIndex: ArrayLike<number>;
  /** Sample index of each loop's second reversal point, where it turned (finite integer ≥ 0). */
  turnIndex: ArrayLike<number>;
}

/** A sum or columns, as columns with equal lengths (internal). */
export function loopColumns(loops: MinerSum | LoopDamageColumns): LoopDamageColumns {
  const c = loops instanceof MinerSum ? loops.columns() : loops;
  if (c === null || typeof c !== 'object') throw new MinerError('invalid-argument', 'loops', c, 'must be a MinerSum or { damage, startIndex, turnIndex }');
  const n = c.damage?.length;
  if (typeof n !== 'number') throw new MinerError('invalid-argument', 'damage', c.damage, 'must be an array-like column of numbers');
  checkLength(c.startIndex, n, 'startIndex');
  checkLength(c.turnIndex, n, 'turnIndex');
  return c;
}

/** Throws unless a damage value is finite and ≥ 0 (internal). */
export function checkDamage(v: number, index: number): void {
  if (!(v >= 0 && v < Infinity)) throw new MinerError('invalid-argument', 'damage', v, 'must be a finite number >= 0', index);
}
