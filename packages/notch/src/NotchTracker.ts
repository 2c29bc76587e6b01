import { NotchOptionError } from './NotchOptionError';
import { checkSamples } from './checkSamples';
import type { NotchTrackerOptions, ResolvedTrackerOptions } from './NotchTrackerOptions';
import { TrackerCore, type NotchTrackerState, type NotchTrackResult } from './TrackerCore';

export type { NotchTrackerState, NotchTrackResult } from './TrackerCore';

/**
 * The memory-aware local stress-strain tracker at a notch root, streaming: push chunks of the
 * history in any sizes (chunk size 1 included) and get the same events as one batch call.
 *
 * Model (Clormann and Seeger's hysteresis-counting memory model): the part starts unloaded
 * (or at `initial`, reached by first loading). First loading follows the cyclic curve; after a
 * reversal each branch is the Masing curve from its origin, with the notch rule applied to the
 * pseudo-elastic range from the same origin. Memory 1: a branch that reaches the value of the
 * origin of the branch it interrupted (ties close) closes that loop; both reversal points leave
 * the memory and the path continues on the older branch. Memory 2: when the older branch is the
 * first-loading curve, the path continues on it. Memory 3: a branch that starts on the
 * first-loading curve and goes beyond the mirror of its start continues on the first-loading
 * curve of the other sign (a branch that turns exactly at the mirror keeps its start in memory,
 * and the loop closes when the path returns to it, ties closing as in memory 1). Because a
 * branch's local stress and strain grow monotonically with its pseudo-elastic range, closing in
 * the history's value is closing in σ–ε space; after a closure the live state is exactly the
 * stored memory point.
 *
 * Per sample the work is a comparison with the running extreme and with the closure level;
 * notch-rule solves run only at reversals. Every sample is checked: NaN or ±Infinity throws
 * {@link NotchSampleError} with its index. For a history that repeats (life per repeat from the
 * stabilised pass) use {@link RepeatingNotchTracker} or {@link trackNotchRepeating}.
 *
 * Reference: U. H. Clormann and T. Seeger, "Rainflow-HCM, ein Hysteresisschleifen-Zählalgorithmus
 * auf werkstoffmechanischer Grundlage", Stahlbau 55(3), 1986, 65-71; Masing's hypothesis:
 * G. Masing, Proc. 2nd Int. Congress of Applied Mechanics, Zürich, 1926, 332-335.
 *
 * @example
 * const t = new NotchTracker({ material, Kt: 2.5 });
 * t.push([0, 300]).push([-240, 360]);
 * t.end().loops.length
 * // returns 1 (the loop 300/-240 closes on the first pass)
 */
export class NotchTracker {
  private core: TrackerCore;

  constructor(options: NotchTrackerOptions) {
    this.core = new TrackerCore(options);
  }

  /** The checked options. */
  get options(): Readonly<ResolvedTrackerOptions> {
    return this.core.options;
  }

  /** Index the next pushed sample gets. */
  get nextIndex(): number {
    return this.core.nextIndex;
  }

  /** Samples (or points, see {@link pushIndexed}) pushed so far. */
  get sampleCount(): number {
    return this.core.sampleCount;
  }

  /** Pushes a chunk of samples (indices count on from {@link nextIndex}); returns this. */
  push(chunk: ArrayLike<number>): this {
    checkSamples(chunk, null, 0, Infinity, this.core.nextIndex);
    this.core.pushRange(chunk, 0, chunk.length);
    return this;
  }

  /**
   * Pushes `values[from]` … `values[to − 1]` as consecutive points whose sample indices are
   * `indices[from]` … `indices[to − 1]`, for points that were thinned before (turning points,
   * a hysteresis gate). Events are those that pushing the raw samples would give, provided the
   * points keep every turning point of the raw history; reversals and loops carry the given
   * indices, and a loop's `closeIndex` is the index of the point that closed it (so it does not
   * depend on how the points were thinned). After the call `nextIndex` is the last given
   * index + 1; `sampleCount` counts the points pushed.
   *
   * The indices should be strictly increasing (and follow the indices pushed before). They are
   * recorded as given and not checked: the memory model does not read them, so other indices
   * change no σ or ε, only the indices the events carry. NaN or ±Infinity in `values` throws
   * {@link NotchSampleError} naming `indices[k]`. No allocation per point.
   *
   * @example
   * const tp = turningPoints(history); // @loopwise/rainflow: values and source indices
   * tracker.pushIndexed(tp.values, tp.indices, 0, tp.values.length);
   * // same σ and ε, start and turn indices as tracker.push(history)
   */
  pushIndexed(values: ArrayLike<number>, indices: ArrayLike<number>, from = 0, to?: number): this {
    checkSamples(values, indices ?? null, from, to ?? Infinity, 0);
    if (indices == null) throw new NotchOptionError('indices', indices, 'must be an array or typed array of sample indices');
    this.core.pushIndexed(values, indices, from, to ?? values.length);
    return this;
  }

  /**
   * Ends the history here: returns copies of the events so far (every reversal, every closed
   * loop) and the residue. Does not change the state, so pushing may continue (the history is
   * then longer) and each call's result is independent of the others.
   */
  end(): NotchTrackResult {
    return this.core.end();
  }

  /** The state as JSON-safe data (-0 and non-finite numbers encoded). Events already emitted are not part of it. */
  toJSON(): NotchTrackerState {
    return this.core.toJSON();
  }

  /** Rebuilds a tracker from {@link toJSON} output; it continues exactly (with no events). */
  static fromJSON(state: NotchTrackerState): NotchTracker {
    const t = Object.create(NotchTracker.prototype) as { core: TrackerCore };
    t.core = TrackerCore.fromJSON(state);
    return t as unknown as NotchTracker;
  }
}
