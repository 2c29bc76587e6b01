import { LoopTable, NotchSampleError, NotchTracker, ReversalTable } from '@loopwise/notch';
import { ReversalFilter } from '@loopwise/rainflow';
import { emptyColumns, gateBoundAt, reportFrame, reportFrom, trackerOptionsOf, warningsOf, type IndexMap } from './assessDutyCycle';
import { LoopAggregate } from './LoopAggregate';
import { EngineError } from './EngineError';
import { resolveLifeJob, type LifeJob, type ResolvedJob } from './LifeJob';
import type { LifeReport } from './LifeReport';
import type { LoopSegment } from './trackSchedule';

const BLOCK = 65536;
/** Points per piece of the first pass's largest-|value| search. */
const PIECE = 16384;

/** Options of {@link LifeSession}. */
export interface LifeSessionOptions {
  /**
   * Keep every closed loop for the report's loop table (default true: the report then equals
   * `assessLife`'s). With false, loops are folded into running totals as they close and the
   * report's loop columns are empty: memory no longer grows with the history.
   */
  keepLoops?: boolean;
  /** Samples per bin of the damage timeline when loops are not kept; default 65536. */
  timelineBinSize?: number;
}

/**
 * A streaming assessment of one history that arrives in chunks (a file larger than memory):
 * `push` the samples once; for a repeating history (the default) push its first
 * `secondPassSamples` samples once more with `pushSecondPass` (re-read the file; it is not held);
 * then `finish()` returns the report that {@link assessLife} gives for the whole history.
 *
 * Memory: the gate's and the tracker's O(1) state and memory, one chunk of turning points, and
 * the closed loops the report lists (about 120 bytes per loop), not the samples.
 *
 * Why a second pass: the stabilised pass starts from the memory the first pass left and is
 * tracked up to the history's first sample of largest |value|; from there on it equals the
 * first pass. That sample is known only at the end of the first pass, and the samples before it
 * are needed again. When the initial value is at least as large as every sample, the whole
 * history is needed again (`secondPassSamples` is then the sample count).
 *
 * @example
 * const session = new LifeSession({ material, notch: { Kt: 2 }, gateFraction: 0.01, fullScale: 800 });
 * for await (const chunk of readChunks(file)) session.push(chunk);
 * let left = session.secondPassSamples;
 * for await (const chunk of readChunks(file)) { if (left <= 0) break; session.pushSecondPass(chunk); left -= chunk.length; }
 * const report = session.finish();
 */
export class LifeSession {
  private readonly job: ResolvedJob;
  private readonly gate: number;
  private readonly tracker: NotchTracker;
  private filter: ReversalFilter;
  private readonly tv = new Float64Array(BLOCK + 2);
  private readonly ti = new Float64Array(BLOCK + 2);
  private readonly loops = new LoopTable();
  private stage: 'first' | 'second' | 'done' = 'first';
  private samples = 0;
  private best = -1;
  private peakIndex = -1;
  private peakValue = 0;
  private peakRow = -1;
  private peakSnapshot: ReturnType<NotchTracker['snapshot']> | null = null;
  private firstRows = 0;
  private firstResidue: ReversalTable | null = null;
  private removed = 0;
  private secondNeeded = 0;
  private secondSeen = 0;
  private secondFull = false;
  private reused = false;
  // The first three turning points of the first pass (gated histories): the first sample and
  // the extremes the gate kept before its first reversal, for a second read that ends before it.
  private readonly leadValues = new Float64Array(3);
  private readonly leadIndices = new Float64Array(3);
  private leadCount = 0;
  private beyond = false;
  private firstBeyond = -1;

  private readonly keepLoops: boolean;
  private readonly binSize: number;
  private before: LoopAggregate | null = null;
  private current: LoopAggregate | null = null;
  private second: LoopAggregate | null = null;

  constructor(job: LifeJob, options: LifeSessionOptions = {}) {
    this.job = resolveLifeJob(job);
    const j = this.job;
    this.keepLoops = options.keepLoops ?? true;
    if (typeof this.keepLoops !== 'boolean') throw new EngineError('invalid-job', 'keepLoops', this.keepLoops, 'must be true or false');
    this.binSize = options.timelineBinSize ?? 65536;
    if (!Number.isInteger(this.binSize) || this.binSize < 1) {
      throw new EngineError('invalid-job', 'timelineBinSize', this.binSize, 'must be an integer >= 1');
    }
    if (!this.keepLoops) {
      this.before = this.aggregate();
      this.current = this.aggregate();
      this.second = this.aggregate();
    }
    if (j.gateFraction !== undefined && j.fullScale === undefined) {
      throw new EngineError('invalid-job', 'fullScale', undefined, 'a streamed history needs a declared fullScale for gateFraction');
    }
    this.gate = j.gate ?? (j.gateFraction !== undefined ? j.gateFraction * (j.fullScale as number) : 0);
    this.filter = new ReversalFilter({ gate: this.gate, keepLeadingExtremes: true });
    this.tracker = new NotchTracker({ ...trackerOptionsOf(j), recordReversals: false });
  }

  /** Samples pushed in the first pass so far. */
  get sampleCount(): number {
    return this.samples;
  }

  /**
   * Samples of the history to push again with {@link pushSecondPass} (0 for a one-off history).
   * Known once the first pass has ended, that is after the first call of `pushSecondPass` or
   * of this getter, which ends it.
   */
  get secondPassSamples(): number {
    this.endFirstPass();
    return this.secondNeeded;
  }

  /** Pushes the next samples of the first pass. NaN or ±Infinity throws with the sample index. */
  push(chunk: ArrayLike<number>): this {
    if (this.stage !== 'first') throw new EngineError('session-state', 'push', undefined, 'the first pass has ended; use pushSecondPass or finish');
    if (this.gate === 0) {
      try {
        this.feedFirstPass(chunk, null, chunk.length, this.samples);
      } catch (err) {
        if (err instanceof NotchSampleError) {
          throw new EngineError('invalid-history', 'history', err.value, `sample ${err.index} of event 'history' is ${err.value}`, err.index);
        }
        throw err;
      }
      this.samples += chunk.length;
      return this;
    }
    for (let s = 0; s < chunk.length; s += BLOCK) {
      const e = Math.min(chunk.length, s + BLOCK);
      const k = this.filter.pushRange(chunk, s, e, this.tv, this.ti, 0);
      this.keepLeading(k);
      this.feedFirstPass(this.tv, this.ti, k, 0);
    }
    this.samples += chunk.length;
    return this;
  }

  /** Pushes the history's samples again, from sample 0 on; samples past `secondPassSamples` are ignored. */
  pushSecondPass(chunk: ArrayLike<number>): this {
    this.endFirstPass();
    if (this.stage !== 'second') throw new EngineError('session-state', 'pushSecondPass', undefined, 'no second pass is open');
    const want = Math.min(chunk.length, this.secondNeeded - this.secondSeen);
    if (this.gate === 0) {
      if (want > 0) this.tracker.pushRange(chunk, 0, want);
      this.drain();
    }
    for (let s = 0; this.gate > 0 && s < want; s += BLOCK) {
      const e = Math.min(want, s + BLOCK);
      const k = this.filter.pushRange(chunk, s, e, this.tv, this.ti, 0);
      this.feed(k);
    }
    this.secondSeen += want;
    if (this.secondSeen === this.secondNeeded) this.endSecondPass();
    return this;
  }

  /** Ends the assessment and returns the report (the same as `assessLife` on the whole history). */
  finish(): LifeReport {
    this.endFirstPass();
    if (this.stage === 'second') {
      throw new EngineError(
        'session-state',
        'pushSecondPass',
        this.secondSeen,
        `the second pass needs samples 0 to ${this.secondNeeded - 1} again; ${this.secondSeen} were pushed`,
      );
    }
    if (this.stage === 'done' && this.samples === 0) {
      throw new EngineError('invalid-event', 'history', '[]', "event 'history' has no samples");
    }
    if (!this.keepLoops) return this.aggregateReport();
    const n = this.loops.length;
    const first: LoopSegment[] = [{ from: 0, to: this.firstRows, weight: 1 }];
    let stabilised: LoopSegment[] = first;
    if (this.job.repeating) {
      // from just after the largest |value| on, as in trackSchedule
      stabilised = this.reused
        ? [
            { from: this.peakRow, to: this.firstRows, weight: 1 },
            { from: this.firstRows, to: n, weight: 1 },
          ]
        : [{ from: this.firstRows, to: n, weight: 1 }];
    }
    const identity: IndexMap = (src, from, to, out, at, events) => {
      for (let i = from, j = at; i < to; i++, j++) {
        out[j] = src[i];
        events[j] = src[i] < 0 ? -1 : 0;
      }
    };
    return reportFrom(
      {
        events: [{ name: 'history', history: { length: this.samples } as ArrayLike<number>, repeats: 1 }],
        eventStarts: [0],
        gate: this.gate,
        removed: this.removed,
        totalSamples: this.samples,
        largestKept: Math.max(this.best, Math.abs(this.job.initial)),
        toSample: identity,
        track: {
          loops: this.loops,
          beyondStrainLimit: this.beyond,
          firstBeyondIndex: this.firstBeyond,
          first,
          stabilised,
          firstResidue: this.firstResidue as ReversalTable,
          reusedFirstPass: this.reused,
        },
      },
      this.job,
    );
  }

  private aggregate(): LoopAggregate {
    return new LoopAggregate(this.binSize, this.job.worstLoopCount, this.job.cutoffCycles ?? Infinity);
  }

  /** Loops closed before a new largest |value| belong to the first pass only. */
  private newPeak(): void {
    if (this.keepLoops) return;
    this.before!.merge(this.current!);
    this.current = this.aggregate();
  }

  /**
   * Pushes points of the first pass: raw samples (indices null: sample indices from `base`) or
   * turning points with their indices. In pieces that stay in cache, a piece whose largest
   * |value| beats every earlier one is split there: loops closed so far belong to the first
   * pass only, and the memory at that point is saved for the second pass. One split per piece
   * at most, so a steadily growing history costs no more than any other.
   */
  private feedFirstPass(values: ArrayLike<number>, indices: Float64Array | null, count: number, base: number): void {
    const off = this.job.offset;
    for (let s = 0; s < count; s += PIECE) {
      const end = Math.min(count, s + PIECE);
      let j = -1;
      let top = this.best;
      for (let i = s; i < end; i++) {
        const x = values[i] + off;
        const a = x < 0 ? -x : x;
        if (a > top) {
          top = a;
          j = i;
        }
      }
      if (j < 0) {
        this.pushPart(values, indices, s, end);
        continue;
      }
      this.pushPart(values, indices, s, j + 1);
      this.drain();
      this.newPeak();
      this.best = top;
      this.peakIndex = indices === null ? base + j : indices[j];
      this.peakValue = values[j];
      this.peakRow = this.loops.length;
      this.peakSnapshot = this.tracker.snapshot();
      this.pushPart(values, indices, j + 1, end);
    }
    this.drain();
  }

  private pushPart(values: ArrayLike<number>, indices: Float64Array | null, from: number, to: number): void {
    if (to <= from) return;
    if (indices === null) this.tracker.pushRange(values, from, to);
    else this.tracker.pushIndexed(values, indices, from, to);
  }

  /** Keeps the first pass's first three turning points (from tv/ti, k of them now). */
  private keepLeading(k: number): void {
    for (let i = 0; i < k && this.leadCount < 3; i++) {
      this.leadValues[this.leadCount] = this.tv[i];
      this.leadIndices[this.leadCount++] = this.ti[i];
    }
  }

  private feed(k: number): void {
    if (k > 0) this.tracker.pushIndexed(this.tv, this.ti, 0, k);
    this.drain();
  }

  /** Moves the tracker's new loops into the session's table and keeps the highest-stress reversal. */
  private drain(): void {
    const r = this.tracker.takeResult();
    if (this.keepLoops) this.loops.appendRange(r.loops, 0, r.loops.length);
    else {
      const into = this.stage === 'first' ? this.current! : this.second!;
      into.add(r.loops.columns(), this.job.material, this.job.meanStress, this.job.walkerGamma);
    }
    if (r.beyondStrainLimit && !this.beyond) {
      this.beyond = true;
      this.firstBeyond = r.firstBeyondIndex;
    }
  }

  private endFirstPass(): void {
    if (this.stage !== 'first') return;
    if (this.samples === 0) {
      this.stage = 'done';
      return;
    }
    // the last extreme is a turning point too
    if (this.gate > 0) {
      const k = this.filter.pendingInto(this.tv, this.ti, 0);
      this.keepLeading(k);
      this.feedFirstPass(this.tv, this.ti, k, 0);
    }
    this.removed = this.filter.removedCount;
    this.firstRows = this.loops.length;
    this.firstResidue = this.tracker.residue();
    if (!this.job.repeating) {
      this.stage = 'done';
      return;
    }
    // A full second read when the initial value reaches the history's largest |value| (initial
    // is a value after the offset, as the samples are here), or when the history starts at that
    // value and ends on it too: the plateau across the seam then keeps the end's sample index,
    // so the memories at the largest |value| differ in that index.
    const end = this.tracker.snapshot();
    const seamPlateau = this.peakIndex === 0 && end.extIndex !== 0 && end.ext === this.peakValue + this.job.offset;
    this.secondFull = !(Math.abs(this.job.initial) < this.best) || seamPlateau;
    this.secondNeeded = this.secondFull ? this.samples : this.peakIndex + 1;
    this.filter = new ReversalFilter({ gate: this.gate, keepLeadingExtremes: true });
    if (this.gate === 0) this.tracker.restartIndex(0);
    this.stage = 'second';
  }

  private endSecondPass(): void {
    if (this.secondFull) {
      if (this.gate > 0) this.feed(this.filter.pendingInto(this.tv, this.ti, 0));
      this.stage = 'done';
      return;
    }
    if (this.gate > 0 && this.filter.confirmedCount > 1) {
      // The samples up to the largest |value| confirm every turning point before it again; the
      // one at it was confirmed by later samples in the first pass, so it is pushed as found there.
      this.tv[0] = this.peakValue;
      this.ti[0] = this.peakIndex;
      this.feed(1);
    } else if (this.gate > 0) {
      // The read ended before the gate's first reversal (only the first sample is out): the first
      // pass kept the extremes before it when that reversal came, the largest |value| among them.
      // Those up to the largest |value| are pushed as the first pass found them.
      let k = 0;
      for (let i = 1; i < this.leadCount; i++) {
        if (this.leadIndices[i] > this.peakIndex) break;
        this.tv[k] = this.leadValues[i];
        this.ti[k++] = this.leadIndices[i];
      }
      this.feed(k);
    }
    if (this.peakSnapshot !== null && this.tracker.matches(this.peakSnapshot)) {
      this.reused = true;
      this.stage = 'done';
      return;
    }
    // The memory rules make both passes equal from the largest |value| on unless the initial
    // value exceeds the history, which is handled by a full second pass.
    throw new EngineError(
      'session-state',
      'pushSecondPass',
      this.peakIndex,
      `the two passes hold different memories at sample ${this.peakIndex}; assess this history with assessLife`,
    );
  }

  /** The report from the running totals (loops not kept). */
  private aggregateReport(): LifeReport {
    const job = this.job;
    const residue = (this.firstResidue as ReversalTable).columns();
    const stab = this.aggregate();
    const firstPass = this.aggregate();
    firstPass.merge(this.before!);
    firstPass.merge(this.current!);
    if (job.repeating) {
      stab.merge(this.second!);
      if (this.reused) stab.merge(this.current!);
    } else {
      // a one-off history: the first pass, and its open loops as half cycles
      const m = residue.index.length - 1;
      if (m > 0) {
        const half = {
          stressMax: new Float64Array(m),
          stressMin: new Float64Array(m),
          strainMax: new Float64Array(m),
          strainMin: new Float64Array(m),
          startIndex: residue.index.slice(0, m),
          turnIndex: residue.index.slice(1),
          closeIndex: residue.index.slice(1),
          count: new Float64Array(m).fill(0.5),
        };
        for (let i = 0; i < m; i++) {
          half.stressMax[i] = Math.max(residue.stress[i], residue.stress[i + 1]);
          half.stressMin[i] = Math.min(residue.stress[i], residue.stress[i + 1]);
          half.strainMax[i] = Math.max(residue.strain[i], residue.strain[i + 1]);
          half.strainMin[i] = Math.min(residue.strain[i], residue.strain[i + 1]);
        }
        firstPass.add(half, job.material, job.meanStress, job.walkerGamma);
      }
      stab.merge(firstPass);
    }
    const damage = stab.total();
    const events = [{ name: 'history', history: { length: this.samples } as ArrayLike<number>, repeats: 1 }];
    const bins = Math.max(1, Math.ceil(this.samples / this.binSize));
    const timeline = new Float64Array(bins);
    timeline.set(stab.timeline.subarray(0, Math.min(bins, stab.timeline.length)));
    const worstLoops = stab.worst.map((w) => ({ ...w, share: damage > 0 ? w.damage / damage : 0 }));
    return {
      ...reportFrame(job, events, this.gate, { perRepeat: damage, firstPass: firstPass.total(), reusedFirstPass: this.reused }),
      loops: emptyColumns(0),
      worstLoops,
      timeline: { binSize: this.binSize, samples: this.samples, damage: timeline },
      events: [{ name: 'history', repeats: 1, samples: this.samples, damage, share: damage > 0 ? 1 : 0 }],
      gate: { range: this.gate, removedReversals: this.removed },
      warnings: warningsOf(job, {
        damage,
        gate: this.gate,
        removed: this.removed,
        gateBound: this.removed > 0 ? gateBoundAt(job, Math.max(this.best, Math.abs(job.initial)), this.gate, this.removed) : 0,
        cutoff:
          job.cutoffCycles === undefined
            ? null
            : { removedCount: stab.removedCount, removedDamage: stab.removedDamage, nearFactor: 2, nearCutoffShare: damage > 0 ? stab.nearDamage / damage : 0 },
        beyondStrainLimit: this.beyond,
        firstBeyondIndex: this.firstBeyond,
        firstReversal: stab.firstReversal,
      }),
    };
  }
}
