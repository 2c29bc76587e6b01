import { NotchTracker, type NotchTrackResult } from './NotchTracker';
import type { NotchTrackerOptions } from './NotchTrackerOptions';

/** Samples of the first piece, whose reversal rate sizes the event tables for the whole block. */
const SIZING_PIECE = 16384;

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
   * repeating history at its largest peak); otherwise from sample 0. Its tables share storage
   * with the first pass's; adding to either copies it first.
   */
  stabilised: NotchTrackResult;
  /**
   * Index of the block's first sample of largest |value| (after offset), or -1 for an empty
   * block. From there on the stabilised pass was copied from the first pass.
   */
  largestIndex: number;
  /** True when the copy was taken (the memories of both passes agreed at `largestIndex`). */
  reusedFirstPass: boolean;
}

/**
 * Tracks a block that repeats: a first pass from the unloaded state and a stabilised pass that
 * starts from the memory the first pass left (the seam from the last sample to the first is
 * part of the history). Life per repeat comes from the stabilised pass, whose loops are the
 * `repeat` rainflow cycles of the block.
 *
 * Method: only the part of the block before its largest |value| can differ between the passes:
 * reaching that value closes every loop back to the first-loading curve (memories 1 to 3), so
 * both passes then hold the same memory. The stabilised pass is therefore tracked up to that
 * sample only; if its memory then equals the first pass's memory exactly (it does unless
 * `initial` exceeds the block), the rest of the first pass's events is reused, otherwise the
 * whole block is tracked again. The first pass notes that sample as it goes (it is a reversal
 * point or the last extreme), so the block is not scanned for it separately.
 *
 * Reference: U. H. Clormann and T. Seeger, Stahlbau 55(3), 1986, 65-71; repeating histories as
 * in ASTM E1049-85 (reapproved 2017), 5.4.5.
 *
 * @example
 * trackNotchRepeating([300, -240, 360, -100], { material, Kt: 2.5 }).stabilised.loops.length
 * // returns 2 (360/-240 and 300/-100 ... see the README for the worked example)
 */
export function trackNotchRepeating(block: ArrayLike<number>, options: NotchTrackerOptions): NotchRepeatingResult {
  const t = new NotchTracker(options);
  const n = block.length;
  const off = t.options.offset;
  if (n === 0) {
    const r = t.end();
    return { first: r, stabilised: t.end(), largestIndex: -1, reusedFirstPass: false };
  }
  // First pass. The tracker keeps the first sample of largest |value| and the memory right after
  // it as it goes (at its reversals), so the block is read once. The tables are sized for the
  // first pass and half a block more, the second pass's usual share.
  const head = n < SIZING_PIECE ? n : SIZING_PIECE;
  t.pushRange(block, 0, head);
  t.reserveFor(n + (n >> 1));
  t.pushRange(block, head, n);
  const peak = t.largestPoint();
  const m = peak !== null ? peak.index : largestMagnitudeIndex(block, off);
  const rev1 = t.reversals.length;
  const loops1 = t.loops.length;
  const first = t.viewResult(0, 0);
  // Second pass, into the same tables after the first pass's rows.
  t.restartIndex(0);
  let reused = false;
  if (peak !== null) {
    t.pushRange(block, 0, m + 1);
    reused = t.matches(peak.after);
  }
  if (!reused) t.pushRange(block, peak !== null ? m + 1 : 0, n);
  // Reused: the tables now hold the first pass, then the second up to the peak. The stabilised
  // pass starting just after the peak is one run of rows: the first pass's from the peak on, then
  // the second's; its residue is the first pass's. Otherwise the second pass is its own run.
  const end = reused && peak !== null ? t.viewResult(peak.reversalRow, peak.loopRow) : t.viewResult(rev1, loops1);
  const stabilised: NotchTrackResult = {
    reversals: end.reversals,
    loops: end.loops,
    residue: reused ? first.residue : end.residue,
    samples: n,
    beyondStrainLimit: end.beyondStrainLimit,
    firstBeyondIndex: end.firstBeyondIndex,
  };
  return { first, stabilised, largestIndex: m, reusedFirstPass: reused };
}

/** Index of the first sample of largest |value + offset| (the slow way, for the cases the tracker does not cover). */
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
