import { checkSamples } from './checkSamples';
import { NotchOptionError } from './NotchOptionError';
import type { LoopTable } from './LoopTable';
import { NotchStateError } from './NotchStateError';
import type { NotchTrackerOptions, ResolvedTrackerOptions } from './NotchTrackerOptions';
import { ReversalTable } from './ReversalTable';
import { TrackerCore, type LargestPoint, type TrackerSnapshot } from './TrackerCore';

/** Points pushed before the tables are sized for the whole history (from the rate seen so far). */
const SIZING_POINTS = 65536;

/** Options of {@link RepeatingNotchTracker}: the tracker's options and a size hint. */
export interface RepeatingTrackerOptions extends NotchTrackerOptions {
  /**
   * Points the first pass is expected to push, repeats counted once (optional). With it the
   * event tables are sized once, after the first 65,536 points, instead of doubling.
   */
  expectedPoints?: number;
}

/** What the second pass needs: the points to push again with {@link RepeatingNotchTracker.pushAgain}. */
export interface SecondPassNeed {
  /**
   * Sample index of the last point the second pass needs (the first point of largest |value|),
   * or the last index of the history when `whole` is true; -1 for an empty history.
   */
  throughIndex: number;
  /**
   * True when the whole history is needed again: no point exceeds |initial| in magnitude, or the
   * history starts at its largest |value| and ends on the same value (the plateau across the
   * seam then carries the end's index, and the passes' memories differ in that index).
   */
  whole: boolean;
}

/** Rows of one pass in a {@link RepeatingTrackResult}'s tables, and the pass's residue. */
export interface PassRows {
  /** Loop rows `loopFrom` … `loopTo − 1`, numbered from the start of the tracking (see `loopRowOffset`). */
  loopFrom: number;
  loopTo: number;
  /** Reversal rows (empty ranges when reversals are not recorded). */
  reversalFrom: number;
  reversalTo: number;
  /** The open loops at the end of the pass: memory points, then the end point of the path. */
  residue: ReversalTable;
}

/** What {@link RepeatingNotchTracker.finish} returns. */
export interface RepeatingTrackResult {
  /**
   * Every loop row of both passes that was not taken by {@link RepeatingNotchTracker.takeLoops}:
   * the first pass's rows, then the second pass's own rows. Row r of the tracking is row
   * `r − loopRowOffset` here. The table belongs to this result alone.
   */
  loops: LoopTable;
  /** Row number of `loops`' first row (the rows taken before it). */
  loopRowOffset: number;
  /** Every reversal of both passes (empty unless `recordReversals`), numbered like the loops. */
  reversals: ReversalTable;
  /** The first pass, from the unloaded state (or `initial`). */
  first: PassRows;
  /**
   * The stabilised pass: the history again from the memory the first pass left; every later
   * pass equals it. Null when no second pass was made (a one-off history). When the first pass
   * was reused (`reusedFirstPass`), its rows are the first pass's from just after the largest
   * |value| to the end, then the second pass's up to that value (the same cyclic sequence,
   * started where ASTM E1049-85 5.4.5 starts a repeating history, at its largest peak); the
   * rows form one run, so `loopFrom` may be below `first.loopTo`.
   */
  stabilised: PassRows | null;
  /**
   * Sample index of the first point of largest |value| (after offset); -1 when no point exceeds
   * |initial| in magnitude (the tracker notes the largest point only above it) or nothing was pushed.
   */
  largestIndex: number;
  /** True when the stabilised pass reused the first pass from the largest |value| on. */
  reusedFirstPass: boolean;
  /** Points pushed in the first pass (a repeated block counts once). */
  points: number;
  /** True when some local strain amplitude exceeded `strainLimit`; the sample index of the first. */
  beyondStrainLimit: boolean;
  firstBeyondIndex: number;
}

/** What {@link RepeatingNotchTracker.takeLoops} hands over. */
export interface TakenLoops {
  /** The loops closed since the last take (a table of their own). */
  loops: LoopTable;
  /** Row number (from the start of the tracking) of `loops`' first row. */
  firstRow: number;
  /**
   * Row number at the first pass's largest |value| so far: rows before it belong to the first
   * pass only; from it on, the first pass's rows are reused by the stabilised pass.
   */
  largestRow: number;
  /** True for loops of the second pass. */
  secondPass: boolean;
}

/**
 * The whole recipe of a history that repeats, in one place: a first pass from the unloaded
 * state, then a second pass from the memory the first pass left, tracked only as far as it can
 * differ from the first; life per repeat comes from that stabilised pass, whose loops are the
 * `repeat` rainflow cycles of the history. It also counts blocks that run several times in a
 * row (the events of a duty cycle) without running every repeat.
 *
 * Use: `push` the history's points (raw samples, or turning points with their sample indices)
 * in any chunks; `endFirstPass()` says which points are needed again; `pushAgain` those points
 * (the same values and indices; points past the need are ignored); `finish()`. For a one-off
 * history, `finish()` right after the first pass.
 *
 * Method. (1) Only the part before the history's first point of largest |value| can differ
 * between the passes: reaching that value closes every loop back to the first-loading curve
 * (memories 1 to 3 of Clormann and Seeger's model), so both passes then hold the same memory,
 * empty and on the first-loading curve towards that point. The second pass is tracked up to it;
 * if its memory then equals the first pass's exactly, the rest of the first pass is reused,
 * otherwise the second pass goes on (and needs the whole history). (2) A block pushed with
 * `repeats` > 1 runs again only until the memory after a repeat equals the memory after the one
 * before: every further repeat starts from the same memory and closes the same loops, so that
 * repeat's loops get the remaining repeats as their count (usually after two or three repeats:
 * the first repeat's largest excursion closes all smaller memory). (3) A fraction of a repeat:
 * `repeats` = n + f (n >= 1, 0 < f < 1) runs n + 1 repeats as in (2), the loops closed in the
 * last one counting f times: the damage lies on the line between n and n + 1 repeats, and the
 * memory the event leaves is that of n + 1 repeats. A part of a repeat is a share of a repeat's
 * loops, not a cut history (our own rule, documented in docs/engine.md).
 *
 * The tracker notes the largest point at its reversals as it goes, so no scan of its own.
 *
 * Reference: U. H. Clormann and T. Seeger, Stahlbau 55(3), 1986, 65-71; repeating histories as
 * in ASTM E1049-85 (reapproved 2017), 5.4.5.
 *
 * @example
 * const t = new RepeatingNotchTracker({ material, Kt: 2.5 });
 * t.push(block);
 * const need = t.endFirstPass(); // need.throughIndex: the last sample index needed again
 * t.pushAgain(block); // points past the need are ignored
 * const r = t.finish(); // r.stabilised.loopFrom … loopTo: rows of r.loops
 */
export class RepeatingNotchTracker {
  private readonly core: TrackerCore;
  private readonly expected: number;
  private reserved = false;
  private stage: 'first' | 'second' | 'done' = 'first';
  private secondMade = false;
  /** Next raw sample index of the pass (for pushes without indices). */
  private base = 0;
  private firstIndex = -1;
  private lastIndex = -1;
  private firstPoints = 0;
  private firstLoopEnd = 0;
  private firstReversalEnd = 0;
  private firstResidue: ReversalTable | null = null;
  private peak: LargestPoint | null = null;
  private whole = false;
  private reused = false;
  private secondPoints = 0;
  private finished = false;

  constructor(options: RepeatingTrackerOptions) {
    if (options === null || typeof options !== 'object') throw new NotchOptionError('options', options, 'must be an object');
    const { expectedPoints, ...rest } = options;
    if (expectedPoints !== undefined && !(Number.isInteger(expectedPoints) && expectedPoints >= 0)) {
      throw new NotchOptionError('expectedPoints', expectedPoints, 'must be an integer >= 0');
    }
    this.core = new TrackerCore(rest);
    this.expected = expectedPoints ?? 0;
  }

  /** The checked tracker options. */
  get options(): Readonly<ResolvedTrackerOptions> {
    return this.core.options;
  }

  /**
   * Pushes points of the first pass: `values[from]` … `values[to − 1]` with their sample
   * indices (`indices` null: consecutive indices, counting on from the pass's last raw push).
   * With `repeats` other than 1 the points are one whole block that runs that many times in a
   * row (an event of a duty cycle; a fraction allowed); its loops are counted as described in the
   * class comment. NaN or
   * ±Infinity throws NotchSampleError naming the sample index.
   */
  push(values: ArrayLike<number>, indices: ArrayLike<number> | null = null, from = 0, end?: number, repeats = 1): this {
    checkSamples(values, indices, from, end ?? Infinity, this.base);
    const to = end ?? values.length;
    if (this.stage !== 'first') throw new NotchStateError('push', this.finished ? 'the tracking has finished' : 'the first pass has ended; use pushAgain or finish');
    if (to <= from) return this;
    checkRepeats(repeats);
    if (this.firstIndex < 0) this.firstIndex = indices === null ? this.base : indices[from];
    this.lastIndex = indices === null ? this.base + (to - from) - 1 : indices[to - 1];
    this.firstPoints += to - from;
    this.block(values, indices, from, to, repeats);
    return this;
  }

  /**
   * Ends the first pass and says which points the second pass needs (see {@link SecondPassNeed}).
   * Calling it again returns the same answer.
   */
  endFirstPass(): SecondPassNeed {
    if (this.stage === 'first') {
      const c = this.core;
      this.firstLoopEnd = c.loopRows;
      this.firstReversalEnd = c.reversalRows;
      this.firstResidue = c.residue();
      const peak = c.largestPoint();
      this.peak = peak;
      // the plateau across the seam: the history starts at its largest |value| and ends on it
      const end = c.snapshot();
      const seam = peak !== null && peak.index === this.firstIndex && end.extIndex !== peak.index && end.ext === peak.value;
      this.whole = peak === null || seam;
      this.stage = 'second';
      this.base = 0;
    }
    return { throughIndex: this.whole || this.peak === null ? this.lastIndex : this.peak.index, whole: this.whole };
  }

  /**
   * Pushes points of the second pass: the same points as the first pass (the same values,
   * indices and repeats), in any chunks, from the start of the history. Points past the need
   * of {@link endFirstPass} are ignored, so a caller may push the whole history again.
   */
  pushAgain(values: ArrayLike<number>, indices: ArrayLike<number> | null = null, from = 0, end?: number, repeats = 1): this {
    checkSamples(values, indices, from, end ?? Infinity, this.base);
    const to = end ?? values.length;
    if (this.stage === 'first') throw new NotchStateError('pushAgain', 'call endFirstPass first');
    if (this.finished) throw new NotchStateError('pushAgain', 'the tracking has finished');
    if (this.stage === 'done' || to <= from) return this;
    checkRepeats(repeats);
    this.secondMade = true;
    this.secondPoints += to - from;
    const peak = this.peak;
    if (this.whole || peak === null) {
      this.block(values, indices, from, to, repeats);
      return this;
    }
    // where the largest point falls in this block, if it does
    const first = indices === null ? this.base : indices[from];
    const last = indices === null ? this.base + (to - from) - 1 : indices[to - 1];
    if (peak.index > last) {
      this.block(values, indices, from, to, repeats);
      return this;
    }
    if (peak.index < first) {
      throw new NotchStateError('pushAgain', `the second pass skipped sample ${peak.index} (the largest |value|); push the history again from its start`);
    }
    const at = indices === null ? from + (peak.index - this.base) : search(indices, from, to, peak.index);
    // the first repeat up to the point, then the memories are compared
    const blockBase = this.base;
    this.feed(values, indices, from, at + 1);
    if (this.core.matches(peak.after)) {
      this.reused = true;
      this.stage = 'done';
      return this;
    }
    // They differ only when the memory model was left (not expected); the second pass goes on.
    this.whole = true;
    this.feed(values, indices, at + 1, to);
    this.afterFirstRepeat(values, indices, from, to, repeats, blockBase);
    if (indices === null) this.base = blockBase + (to - from);
    return this;
  }

  /**
   * Hands over the loops closed since the last take (for a caller that folds loops into running
   * totals instead of keeping them: memory then does not grow with the history). The state is
   * unchanged; {@link finish} then lists only the rows not taken.
   */
  takeLoops(): TakenLoops {
    const c = this.core;
    const firstRow = c.loopRows - c.loopTable.length;
    const secondPass = this.stage !== 'first';
    let largestRow = -1;
    if (!secondPass) {
      const p = c.largestPoint();
      largestRow = p === null ? -1 : p.loopRow;
    } else if (this.peak !== null) largestRow = this.peak.loopRow;
    return { loops: c.takeLoops(), firstRow, largestRow, secondPass };
  }

  /**
   * Ends the tracking: the tables and the rows of each pass. Throws NotchStateError when a
   * second pass was begun but did not reach the point it needs.
   */
  finish(): RepeatingTrackResult {
    if (this.finished) throw new NotchStateError('finish', 'the tracking has finished: its tables were handed over');
    const c = this.core;
    if (this.stage === 'second' && !this.secondMade && this.lastIndex >= 0) {
      throw new NotchStateError('pushAgain', `the second pass needs the points up to sample ${this.endFirstPass().throughIndex}; none were pushed`);
    }
    if (this.stage === 'first') {
      // a one-off history: the first pass only
      const r = c.takeResult(16, 16);
      const offset = c.loopRows - r.loops.length;
      const first: PassRows = { loopFrom: 0, loopTo: c.loopRows, reversalFrom: 0, reversalTo: c.reversalRows, residue: r.residue };
      const p = c.largestPoint();
      return this.result(r.loops, offset, r.reversals, first, null, p === null ? -1 : p.index, false, r.beyondStrainLimit, r.firstBeyondIndex);
    }
    if (this.stage === 'second' && (!this.whole || this.secondPoints < this.firstPoints)) {
      throw new NotchStateError('pushAgain', `the second pass needs the points up to sample ${this.endFirstPass().throughIndex}; it ended before`);
    }
    // the stabilised residue is its own table even when it equals the first pass's
    const endResidue = this.reused ? copyOf(this.firstResidue as ReversalTable) : c.residue();
    const r = c.takeResult(16, 16);
    const offset = c.loopRows - r.loops.length;
    const first: PassRows = { loopFrom: 0, loopTo: this.firstLoopEnd, reversalFrom: 0, reversalTo: this.firstReversalEnd, residue: this.firstResidue as ReversalTable };
    const peak = this.peak;
    const stabilised: PassRows =
      this.reused && peak !== null
        ? { loopFrom: peak.loopRow, loopTo: c.loopRows, reversalFrom: peak.reversalRow, reversalTo: c.reversalRows, residue: endResidue }
        : { loopFrom: this.firstLoopEnd, loopTo: c.loopRows, reversalFrom: this.firstReversalEnd, reversalTo: c.reversalRows, residue: endResidue };
    return this.result(r.loops, offset, r.reversals, first, stabilised, peak === null ? -1 : peak.index, this.reused, r.beyondStrainLimit, r.firstBeyondIndex);
  }

  private result(
    loops: LoopTable,
    loopRowOffset: number,
    reversals: ReversalTable,
    first: PassRows,
    stabilised: PassRows | null,
    largestIndex: number,
    reusedFirstPass: boolean,
    beyondStrainLimit: boolean,
    firstBeyondIndex: number,
  ): RepeatingTrackResult {
    this.stage = 'done';
    this.finished = true;
    return { loops, loopRowOffset, reversals, first, stabilised, largestIndex, reusedFirstPass, points: this.firstPoints, beyondStrainLimit, firstBeyondIndex };
  }

  /** A block of points, run `repeats` times in a row with the repeat shortcut. */
  private block(values: ArrayLike<number>, indices: ArrayLike<number> | null, from: number, to: number, repeats: number): void {
    const blockBase = this.base;
    this.feed(values, indices, from, to);
    this.afterFirstRepeat(values, indices, from, to, repeats, blockBase);
    if (indices === null) this.base = blockBase + (to - from);
  }

  /**
   * The repeats after the first of a block (its loops from row `firstRow` on): the whole ones by
   * {@link repeatRest}, and a fraction of a repeat as a weight on the last repeat run (its
   * loops count 1 + fraction times; see the class comment).
   */
  private afterFirstRepeat(values: ArrayLike<number>, indices: ArrayLike<number> | null, from: number, to: number, repeats: number, blockBase: number): void {
    const whole = Math.floor(repeats);
    const fraction = repeats - whole;
    // a fraction runs one more repeat, whose loops count `fraction` times
    const runs = fraction > 0 ? whole + 1 : whole;
    if (runs > 1) this.repeatRest(values, indices, from, to, runs, fraction, blockBase);
  }

  /**
   * Repeats 2 … `runs` of a block whose first repeat was just pushed: each from the block's own
   * indices, until the memory after a repeat equals the memory after the one before; that
   * repeat's loops then count for every repeat left. With a `fraction` > 0 the last run stands
   * for that fraction of a repeat (its loops count `fraction` times).
   */
  private repeatRest(values: ArrayLike<number>, indices: ArrayLike<number> | null, from: number, to: number, runs: number, fraction: number, blockBase: number): void {
    const c = this.core;
    let previous: TrackerSnapshot = c.snapshot();
    for (let r = 2; r <= runs; r++) {
      const before = c.loopTable.length;
      this.base = blockBase;
      this.feed(values, indices, from, to);
      if (r === runs) {
        if (fraction > 0) c.loopTable.scaleCounts(before, c.loopTable.length, fraction);
        return;
      }
      if (c.matches(previous)) {
        // this run and the ones left: runs − r whole ones (the last of them the fraction, if any)
        c.loopTable.scaleCounts(before, c.loopTable.length, 1 + runs - r - (fraction > 0 ? 1 - fraction : 0));
        return;
      }
      previous = c.snapshot();
    }
  }

  /** Points into the core, from this.base for raw pushes; sizes the tables after the first points. */
  private feed(values: ArrayLike<number>, indices: ArrayLike<number> | null, from: number, to: number): void {
    const c = this.core;
    if (!this.reserved && this.expected > 0 && c.sampleCount + (to - from) > SIZING_POINTS) {
      const head = from + Math.max(0, SIZING_POINTS - c.sampleCount);
      this.run(values, indices, from, head);
      c.reserveFor(this.expected * (this.stage === 'first' ? 1.5 : 1));
      this.reserved = true;
      from = head;
    }
    this.run(values, indices, from, to);
  }

  private run(values: ArrayLike<number>, indices: ArrayLike<number> | null, from: number, to: number): void {
    if (to <= from) return;
    if (indices === null) {
      this.core.restartIndex(this.base);
      this.core.pushRange(values, from, to);
      this.base += to - from;
    } else this.core.pushIndexed(values, indices, from, to);
  }
}

function copyOf(t: ReversalTable): ReversalTable {
  const out = new ReversalTable(t.length);
  out.appendRange(t, 0, t.length);
  return out;
}

function checkRepeats(repeats: number): void {
  if (!(typeof repeats === 'number' && repeats >= 1 && repeats < 2 ** 53)) throw new NotchStateError('repeats', `must be a finite number >= 1 (a fraction allowed), got ${String(repeats)}`);
}

/** Position of `index` in the increasing `indices[from..to)` (the last position at or below it). */
function search(indices: ArrayLike<number>, from: number, to: number, index: number): number {
  let lo = from;
  let hi = to - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >>> 1;
    if (indices[mid] <= index) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}
