import { checkSamples } from './checkSamples';
import type { NotchTrackResult } from './NotchTracker';
import { TrackerCore } from './TrackerCore';
import type { NotchTrackerOptions } from './NotchTrackerOptions';

/**
 * Tracks the local stress-strain path at a notch root through a whole history (one pass, from
 * the unloaded state or `options.initial`): every reversal and every closed hysteresis loop,
 * and the residue of open loops. The batch form of {@link NotchTracker}; identical events.
 *
 * Special cases: an empty or constant history (equal to the initial value) gives no reversals
 * and no loops, and a residue of one point, the initial state; NaN or ±Infinity throws
 * `NotchSampleError` naming the sample index; Kt < 1 throws `NotchOptionError`.
 *
 * Reference: the memory model of U. H. Clormann and T. Seeger, Stahlbau 55(3), 1986, 65-71.
 *
 * @param history samples (nominal, pseudo-elastic or local strain, see `options.input`)
 * @example
 * trackNotch([0, 300, -240, 360], { material, Kt: 2.5 }).loops.length
 * // returns 1
 */
export function trackNotch(history: ArrayLike<number>, options: NotchTrackerOptions): NotchTrackResult {
  const t = new TrackerCore(options);
  checkSamples(history, null, 0, Infinity, 0);
  t.pushRange(history, 0, history.length);
  return t.takeResult(16, 16); // the tracker is discarded: its tables need no copy
}
