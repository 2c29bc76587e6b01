import { checkSamples } from './checkSamples';
import { LoopTable } from './LoopTable';
import type { NotchTrackResult } from './NotchTracker';
import type { NotchTrackerOptions } from './NotchTrackerOptions';
import { RepeatingNotchTracker } from './RepeatingNotchTracker';
import { ReversalTable } from './ReversalTable';

/** What {@link trackNotchRepeating} returns. */
export interface NotchRepeatingResult {
  /** The first pass, from the unloaded state (or `initial`). */
  first: NotchTrackResult;
  /**
   * The stabilised pass: the block again, starting from the memory the first pass left. Every
   * later pass equals it. Sample indices are those of the block (0 … length − 1). When the first
   * pass was reused (`reusedFirstPass`), its reversals and loops are listed as they come in a
   * pass that starts just after the largest |value| (from there to the end of the block, then
   * from its start up to that value: the same cyclic sequence, as ASTM E1049-85 5.4.5 starts a
   * repeating history at its largest peak); otherwise from sample 0. Its tables are its own:
   * writing through one pass's columns never changes the other's.
   */
  stabilised: NotchTrackResult;
  /** Index of the block's first sample of largest |value| (after offset), or -1 for an empty block. */
  largestIndex: number;
  /** True when the stabilised pass reused the first pass from `largestIndex` on. */
  reusedFirstPass: boolean;
}

/**
 * Tracks a block that repeats: a first pass from the unloaded state and a stabilised pass that
 * starts from the memory the first pass left (the seam from the last sample to the first is
 * part of the history). Life per repeat comes from the stabilised pass, whose loops are the
 * `repeat` rainflow cycles of the block. The batch form of {@link RepeatingNotchTracker}, which
 * holds the method (the second pass runs only up to the largest |value|, then the first pass is
 * reused).
 *
 * Reference: U. H. Clormann and T. Seeger, Stahlbau 55(3), 1986, 65-71; repeating histories as
 * in ASTM E1049-85 (reapproved 2017), 5.4.5.
 *
 * @example
 * trackNotchRepeating([300, -240, 360, -100], { material, Kt: 2.5 }).stabilised.loops.length
 * // returns 2 (360/-240 and 300/-100 close in the stabilised pass)
 */
export function trackNotchRepeating(block: ArrayLike<number>, options: NotchTrackerOptions): NotchRepeatingResult {
  checkSamples(block, null, 0, Infinity, 0);
  const n = block.length;
  const t = new RepeatingNotchTracker({ ...options, expectedPoints: n });
  t.push(block);
  t.endFirstPass();
  t.pushAgain(block);
  const r = t.finish();
  const s = r.stabilised!;
  // both passes out of one pair of tables: honest splits, copied only when both are read
  const [firstLoops, stabilisedLoops] = LoopTable.split(r.loops, [
    [r.first.loopFrom, r.first.loopTo],
    [s.loopFrom, s.loopTo],
  ]);
  const [firstReversals, stabilisedReversals] = ReversalTable.split(r.reversals, [
    [r.first.reversalFrom, r.first.reversalTo],
    [s.reversalFrom, s.reversalTo],
  ]);
  const pass = (reversals: ReversalTable, loops: LoopTable, residue: ReversalTable): NotchTrackResult => ({
    reversals,
    loops,
    residue,
    samples: n,
    beyondStrainLimit: r.beyondStrainLimit,
    firstBeyondIndex: r.firstBeyondIndex,
  });
  return {
    first: pass(firstReversals, firstLoops, r.first.residue),
    stabilised: pass(stabilisedReversals, stabilisedLoops, s.residue),
    largestIndex: r.largestIndex >= 0 || n === 0 ? r.largestIndex : largestMagnitudeIndex(block, t.options.offset),
    reusedFirstPass: r.reusedFirstPass,
  };
}


/** Index of the first sample of largest |value + offset| (when no sample exceeds |initial|, the tracker notes none). */
function largestMagnitudeIndex(block: ArrayLike<number>, offset: number): number {
  let best = -1;
  let at = -1;
  for (let i = 0; i < block.length; i++) {
    const v = block[i] + offset;
    const a = v < 0 ? -v : v;
    if (a > best) {
      best = a;
      at = i;
    }
  }
  return at;
}
