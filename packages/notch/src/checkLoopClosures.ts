import { branchResponse, type LocalPoint } from './branchResponse';
import type { NotchTrackResult } from './NotchTracker';
import type { NotchTrackerOptions } from './NotchTrackerOptions';

/**
 * The loop-closure invariant for one loop: recomputes the closing branch from the loop's turn
 * point (with {@link branchResponse}, not from stored values) up to the start point's value and
 * returns its relative distance from the start point in σ–ε space:
 * max(|σ − σ_start| / S, |ε − ε_start| / S_ε), S and S_ε the larger magnitudes of the loop's
 * stresses and strains. Memory 1 requires this to be at rounding level (the tests use 1e-12).
 *
 * @example
 * loopClosureError(options, start, turn) <= 1e-12
 * // returns true for every loop a correct tracker reports
 */
export function loopClosureError(options: NotchTrackerOptions, start: LocalPoint, turn: LocalPoint): number {
  const back = branchResponse(options, turn, start.value);
  const sScale = Math.max(Math.abs(start.stress), Math.abs(turn.stress), Number.MIN_VALUE);
  const eScale = Math.max(Math.abs(start.strain), Math.abs(turn.strain), Number.MIN_VALUE);
  return Math.max(Math.abs(back.stress - start.stress) / sScale, Math.abs(back.strain - start.strain) / eScale);
}

/** What {@link checkLoopClosures} returns. */
export interface LoopClosureReport {
  /** Largest {@link loopClosureError} over the loops (0 with no loops). */
  maxError: number;
  /** Row of the loop with that error, or -1. */
  worstLoop: number;
  /** Loops whose start or turn reversal is not in `result.reversals` (should be 0). */
  missing: number;
}

/**
 * Checks every closed loop of a tracker result: finds its start and turn reversals by sample
 * index in `result.reversals`, recomputes the closing branch from the turn point and reports
 * the largest distance from the start point (see {@link loopClosureError}). For embedders'
 * property tests.
 *
 * @example
 * checkLoopClosures(trackNotch(history, options), options).maxError <= 1e-12
 * // returns true
 */
export function checkLoopClosures(result: NotchTrackResult, options: NotchTrackerOptions): LoopClosureReport {
  const rev = result.reversals.columns();
  const byIndex = new Map<number, number>();
  for (let i = 0; i < rev.index.length; i++) byIndex.set(rev.index[i], i);
  const loops = result.loops.columns();
  let maxError = 0;
  let worstLoop = -1;
  let missing = 0;
  for (let l = 0; l < loops.count.length; l++) {
    const a = byIndex.get(loops.startIndex[l]);
    const b = byIndex.get(loops.turnIndex[l]);
    if (a === undefined || b === undefined) {
      missing++;
      continue;
    }
    const e = loopClosureError(
      options,
      { value: rev.value[a], stress: rev.stress[a], strain: rev.strain[a] },
      { value: rev.value[b], stress: rev.stress[b], strain: rev.strain[b] },
    );
    if (e > maxError || worstLoop < 0) {
      maxError = Math.max(maxError, e);
      worstLoop = l;
    }
  }
  return { maxError, worstLoop, missing };
}
