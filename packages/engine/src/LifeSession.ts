import { unknownField } from '@loopwise/base';
import { NotchSampleError, RepeatingNotchTracker } from '@loopwise/notch';
import { NonFiniteSampleError, ReversalFilter } from '@loopwise/rainflow';
import { EngineError } from './EngineError';
import { resolveLifeJob, type LifeJob, type ResolvedJob } from './LifeJob';
import type { LifeLoopColumns, LifeReport } from './LifeReport';
import { LoopAggregate } from './LoopAggregate';
import { reportFromTracked, reportHead, type ReportEvent } from './reportAssembly';
import { emptyColumns, evaluatedColumns, residueHalfColumns } from './reportColumns';
import { StressCycleStream } from './StressCycleStream';
import { sampleText } from './schedule';
import { trackedFrom, trackerOptionsOf, type RowRange } from './trackHistory';
import { gateBoundAt, warningsOf } from './warnings';

/** A chunk must be an array or typed array of samples (its values are checked as they are read). */
function checkChunk(chunk: unknown, method: string): void {
  if (chunk === null || typeof chunk !== 'object' || !Number.isInteger((chunk as { length?: unknown }).length)) {
    throw new EngineError('invalid-event', method, typeof chunk === 'object' ? String(chunk) : chunk, 'expects an array or typed array of samples');
  }
}

/** Samples per block through the gate (the turning points of a block stay in cache). */
const BLOCK = 65536;

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
  /**
   * Receives the loops as they close, evaluated (the report's loop columns: local values, the
   * damage parameter, life and damage per repeat), with the row number of their first row in
   * the session's loop stream: every loop of the first pass and, for a repeating history, of
   * the second, then, for a one-off history, its residue half cycles at `finish()`. After
   * `finish()`, {@link LifeSession.reportedLoopRows} says which rows make the report's loop
   * table. For a caller that writes the loop table somewhere other than memory (a file); the
   * columns belong to the callback. Implies `keepLoops: false` (with `keepLoops: true`, an error).
   */
  onLoops?: (loops: LifeLoopColumns, firstRow: number) => void;
}

/**
 * A streaming assessment of one history that arrives in chunks (a file larger than memory):
 * `push` the samples once; for a repeating history (the default) call `endFirstPass()`, which
 * returns how many samples from the start are needed again, and push those with
 * `pushSecondPass` (re-read the file; it is not held); then `finish()` returns the report that
 * {@link assessLife} gives for the whole history.
 *
 * The same stages as the batch assessment: turning points with the gate (a streaming
 * ReversalFilter, gate 0 included), the notch package's RepeatingNotchTracker (which decides
 * what the second pass needs: the samples up to the first of largest |value|, or all of them),
 * the loop evaluation and the report assembly.
 *
 * Memory: the gate's and the tracker's O(1) state and memory, one block of turning points, and
 * the closed loops the report lists (about 120 bytes per loop), not the samples.
 *
 * @example
 * const session = new LifeSession({ material, notch: { Kt: 2 }, gateFraction: 0.01, fullScale: 800 });
 * for await (const chunk of readChunks(file)) session.push(chunk);
 * let left = session.endFirstPass();
 * for await (const chunk of readChunks(file)) { if (left <= 0) break; session.pushSecondPass(chunk); left -= chunk.length; }
 * const report = session.finish();
 */
export class LifeSession {
  private readonly job: ResolvedJob;
  private readonly gate: number;
  private readonly tracker: RepeatingNotchTracker | null;
  /** The stress-life route's counter (null on the strain-life route). */
  private readonly stress: StressCycleStream | null;
  private filter: ReversalFilter;
  private readonly tv = new Float64Array(BLOCK + 2);
  private readonly ti = new Float64Array(BLOCK + 2);
  private stage: 'first' | 'second' | 'done' = 'first';
  private samples = 0;
  private removed = 0;
  private largestKept = 0;
  private secondNeeded = 0;
  private secondSeen = 0;
  /**
   * Per block of the first pass that emitted turning points: the samples read when it ended and
   * the index of its last point. The second read must go on until the gate has settled the
   * points up to the tracker's need (a leading extreme pending at the need may be dropped by a
   * later sample): to the end of the first block that emitted a point past the need.
   */
  private emittedAt: number[] = [];
  private emittedLast: number[] = [];

  private readonly keepLoops: boolean;
  private readonly binSize: number;
  // running totals without kept loops: first-pass loops before the largest |value| so far,
  // after it (reused by the stabilised pass), and the second pass's
  private before: LoopAggregate | null = null;
  private current: LoopAggregate | null = null;
  private second: LoopAggregate | null = null;
  private currentFrom = 0;
  private readonly onLoops: ((loops: LifeLoopColumns, firstRow: number) => void) | null;
  /** Rows handed to onLoops so far. */
  private delivered = 0;
  private reported: RowRange[] | null = null;

  constructor(job: LifeJob, options: LifeSessionOptions = {}) {
    this.job = resolveLifeJob(job);
    const j = this.job;
    if (options === null || typeof options !== 'object') throw new EngineError('invalid-job', 'options', String(options), 'must be { keepLoops, timelineBinSize, onLoops }');
    const unknown = unknownField(options, ['keepLoops', 'timelineBinSize', 'onLoops'], 'the session options');
    if (unknown !== undefined) throw new EngineError('invalid-job', unknown.field, unknown.value, unknown.rule);
    this.onLoops = options.onLoops ?? null;
    if (this.onLoops !== null && typeof this.onLoops !== 'function') throw new EngineError('invalid-job', 'onLoops', String(this.onLoops), 'must be a function');
    this.keepLoops = options.keepLoops ?? this.onLoops === null;
    if (typeof this.keepLoops !== 'boolean') throw new EngineError('invalid-job', 'keepLoops', this.keepLoops, 'must be true or false');
    if (this.keepLoops && this.onLoops !== null) throw new EngineError('invalid-job', 'keepLoops', true, 'onLoops streams the loops: use keepLoops false with it');
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
    this.stress = j.route === 'stress-life' ? new StressCycleStream(j, this.gate, this.keepLoops, this.binSize, this.onLoops) : null;
    this.tracker = this.stress === null ? new RepeatingNotchTracker(trackerOptionsOf(j)) : null;
  }

  /** The gate range this session applies (`job.gate`, or `gateFraction × fullScale`), in the history's unit; 0 without a gate. */
  get gateRange(): number {
    return this.gate;
  }

  /** Samples pushed in the first pass so far. */
  get sampleCount(): number {
    return this.samples;
  }

  /**
   * Samples of the history to push again with {@link pushSecondPass}, from sample 0 (0 for a
   * one-off history). Known once the first pass has ended ({@link endFirstPass}); before, a
   * session-state error.
   */
  get secondPassSamples(): number {
    if (this.stage === 'first') throw new EngineError('session-state', 'secondPassSamples', undefined, 'known once the first pass has ended: call endFirstPass()');
    return this.secondNeeded;
  }

  /**
   * The rows of the loop stream given to `onLoops` that make the report's loop table, in its
   * order: the stabilised pass of a repeating history, or a one-off history's first pass and
   * then its residue half cycles. Known after {@link finish}; before, a session-state error.
   */
  get reportedLoopRows(): RowRange[] {
    if (this.reported === null) throw new EngineError('session-state', 'reportedLoopRows', undefined, 'known once the session has finished: call finish()');
    return this.reported.map((r) => ({ ...r }));
  }

  /** Pushes the next samples of the first pass. NaN or ±Infinity throws with the sample index. */
  push(chunk: ArrayLike<number>): this {
    if (this.stage !== 'first') throw new EngineError('session-state', 'push', undefined, 'the first pass has ended; use pushSecondPass or finish');
    checkChunk(chunk, 'push');
    if (this.stress !== null) {
      this.stress.push(chunk);
      this.samples += chunk.length;
      return this;
    }
    for (let s = 0; s < chunk.length; s += BLOCK) {
      const e = Math.min(chunk.length, s + BLOCK);
      const k = this.gated(chunk, s, e);
      this.noteEmitted(this.samples + e, k);
      this.feed(k, false);
    }
    this.samples += chunk.length;
    return this;
  }

  /**
   * Ends the first pass; returns the number of samples, from sample 0, to push again with
   * {@link pushSecondPass} (0 for a one-off history or an empty one). Calling it again returns
   * the same number.
   */
  endFirstPass(): number {
    if (this.stage !== 'first') return this.secondNeeded;
    if (this.stress !== null) {
      // the stress route closes a repeating history's residue at the end: no second read
      this.stage = 'done';
      return 0;
    }
    // the last extreme is a turning point too
    const last = this.filter.pendingInto(this.tv, this.ti, 0);
    this.noteEmitted(this.samples, last);
    this.feed(last, false);
    this.removed = this.filter.removedCount;
    if (this.samples === 0 || !this.job.repeating) {
      this.stage = 'done';
      return 0;
    }
    const need = (this.tracker as RepeatingNotchTracker).endFirstPass();
    this.secondNeeded = need.whole ? this.samples : this.settledThrough(need.throughIndex);
    this.emittedAt = [];
    this.emittedLast = [];
    this.filter = new ReversalFilter({ gate: this.gate, keepLeadingExtremes: true });
    this.stage = 'second';
    return this.secondNeeded;
  }

  /** Pushes the history's samples again, from sample 0 on; samples past the need are ignored. */
  pushSecondPass(chunk: ArrayLike<number>): this {
    this.endFirstPass();
    if (this.stage !== 'second') throw new EngineError('session-state', 'pushSecondPass', undefined, 'no second pass is open');
    checkChunk(chunk, 'pushSecondPass');
    const want = Math.min(chunk.length, this.secondNeeded - this.secondSeen);
    for (let s = 0; s < want; s += BLOCK) {
      const e = Math.min(want, s + BLOCK);
      this.feed(this.gated(chunk, s, e), true);
    }
    this.secondSeen += want;
    if (this.secondSeen === this.secondNeeded) {
      // at the history's end its pending extremes are turning points too; a read that ends
      // earlier has settled every point the tracker needs, and what is pending lies past them
      if (this.secondNeeded === this.samples) this.feed(this.filter.pendingInto(this.tv, this.ti, 0), true);
      this.stage = 'done';
    }
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
    if (this.samples === 0) throw new EngineError('invalid-event', 'history', '[]', "event 'history' has no samples");
    const events: ReportEvent[] = [{ name: 'history', repeats: 1, samples: this.samples }];
    if (this.stress !== null) {
      const report = this.stress.finish(this.samples, events);
      this.reported = this.stress.reported;
      return report;
    }
    if (!this.keepLoops) return this.aggregateReport(events);
    const tracked = trackedFrom(this.tracker as RepeatingNotchTracker, this.job.repeating, {
      eventStarts: [0],
      totalSamples: this.samples,
      gate: this.gate,
      removed: this.removed,
      largestKept: this.removed > 0 ? Math.max(this.largestKept, Math.abs(this.job.initial)) : 0,
    });
    return reportFromTracked(tracked, events, this.job);
  }

  /** Notes a first-pass block that emitted `k` points (tv/ti[0..k)) when `samplesRead` had been read. */
  private noteEmitted(samplesRead: number, k: number): void {
    if (k === 0) return;
    this.emittedAt.push(samplesRead);
    this.emittedLast.push(this.ti[k - 1]);
  }

  /**
   * Samples the second read needs for the points through sample index `through`: up to the end
   * of the first block of the first pass that emitted a point past it (the gate had settled
   * every point up to `through` by then, as it will again on the same samples), or all of them.
   */
  private settledThrough(through: number): number {
    if (through < 0) return through + 1;
    for (let b = 0; b < this.emittedLast.length; b++) if (this.emittedLast[b] > through) return this.emittedAt[b];
    return this.samples;
  }

  private aggregate(): LoopAggregate {
    return new LoopAggregate(this.binSize, this.job.worstLoopCount, this.job.cutoffCycles ?? Infinity);
  }

  /** Samples `chunk[s..e)` through the gate into tv/ti; returns the turning points written. */
  private gated(chunk: ArrayLike<number>, s: number, e: number): number {
    try {
      return this.filter.pushRange(chunk, s, e, this.tv, this.ti, 0);
    } catch (err) {
      if (err instanceof NonFiniteSampleError) {
        throw new EngineError('non-finite-sample', 'history', err.value, `sample ${err.index} of event 'history' is ${err.value}`, err.index as number);
      }
      throw err;
    }
  }

  /** Turning points tv/ti[0..k) into the tracker (first or second pass); loops folded when not kept. */
  private feed(k: number, again: boolean): void {
    if (k === 0) return;
    const off = this.job.offset;
    const tracker = this.tracker as RepeatingNotchTracker;
    try {
      if (again) tracker.pushAgain(this.tv, this.ti, 0, k);
      else {
        tracker.push(this.tv, this.ti, 0, k);
        for (let i = 0; i < k; i++) {
          const a = Math.abs(this.tv[i] + off);
          if (a > this.largestKept) this.largestKept = a;
        }
      }
    } catch (err) {
      if (err instanceof NotchSampleError) {
        throw new EngineError('non-finite-sample', 'history', err.value, `sample ${err.index} of event 'history' ${sampleText(err.value, off)}`, err.index);
      }
      throw err;
    }
    if (!this.keepLoops) this.fold();
  }

  /**
   * Folds the loops closed so far into the running totals: first-pass loops before the largest
   * |value| so far belong to the first pass only; those after it are reused by the stabilised
   * pass; second-pass loops are its own.
   */
  private fold(): void {
    const taken = (this.tracker as RepeatingNotchTracker).takeLoops();
    const n = taken.loops.length;
    // an empty first-pass take still moves the largest |value| (the split below)
    if (n === 0 && taken.secondPass) return;
    const rows = evaluatedColumns(taken.loops.columns(), this.job, [0]);
    if (n > 0) this.onLoops?.(rows, taken.firstRow);
    this.delivered = taken.firstRow + n;
    const part = (from: number, to: number) => {
      const out: LifeLoopColumns = { ...rows };
      for (const key of Object.keys(rows) as (keyof LifeLoopColumns)[]) out[key] = rows[key].subarray(from, to);
      return out;
    };
    if (taken.secondPass) {
      this.second!.add(rows);
      return;
    }
    const split = taken.largestRow - taken.firstRow;
    if (taken.largestRow > this.currentFrom) {
      // a new largest |value|: everything before it is the first pass's only
      this.before!.merge(this.current!);
      this.current = this.aggregate();
      this.currentFrom = taken.largestRow;
      const k = Math.min(n, Math.max(0, split));
      this.before!.add(part(0, k));
      this.current!.add(part(k, n));
    } else this.current!.add(rows);
  }

  /** The report from the running totals (loops not kept). */
  private aggregateReport(events: ReportEvent[]): LifeReport {
    const job = this.job;
    // every loop was folded as it closed: the tracked result holds the passes' facts only
    const result = trackedFrom(this.tracker as RepeatingNotchTracker, job.repeating, { eventStarts: [0], totalSamples: this.samples, gate: this.gate, removed: this.removed, largestKept: 0 });
    const stab = this.aggregate();
    const firstPass = this.aggregate();
    firstPass.merge(this.before!);
    firstPass.merge(this.current!);
    // rows of the tracked result are numbered from its first row not taken (every row was taken)
    const offset = this.delivered - result.loops.length;
    const at = (r: RowRange) => ({ from: r.from + offset, to: r.to + offset });
    if (job.repeating) {
      stab.merge(this.second!);
      if (result.reusedFirstPass) stab.merge(this.current!);
      this.reported = [at(result.stabilised)];
    } else {
      // a one-off history: the first pass, and its open loops as half cycles
      const half = residueHalfColumns(result.firstResidue, job, [0]);
      const m = half.count.length;
      this.reported = [at(result.first), { from: this.delivered, to: this.delivered + m }];
      if (m > 0) {
        this.onLoops?.(half, this.delivered);
        firstPass.add(half);
      }
      stab.merge(firstPass);
    }
    const damage = stab.total();
    const bins = Math.max(1, Math.ceil(this.samples / this.binSize));
    const timeline = new Float64Array(bins);
    timeline.set(stab.timeline.subarray(0, Math.min(bins, stab.timeline.length)));
    const worstLoops = stab.worst.map((w) => ({ ...w, share: damage > 0 ? w.damage / damage : 0 }));
    const largest = Math.max(this.largestKept, Math.abs(job.initial));
    return {
      ...reportHead(job, events, this.gate, { perRepeat: damage, firstPass: firstPass.total(), reusedFirstPass: result.reusedFirstPass }),
      loops: emptyColumns(0),
      worstLoops,
      timeline: { binSize: this.binSize, samples: this.samples, damage: timeline },
      events: [{ name: 'history', repeats: 1, samples: this.samples, damage, share: damage > 0 ? 1 : 0 }],
      gate: { range: this.gate, removedReversals: this.removed },
      warnings: warningsOf(job, {
        damage,
        gate: this.gate,
        removed: this.removed,
        gateBound: this.removed > 0 ? gateBoundAt(job, largest, this.gate, this.removed) : 0,
        cutoff: job.cutoffCycles === undefined ? null : stab.cutoff.value(),
        beyondStrainLimit: result.beyondStrainLimit,
        firstBeyondIndex: result.firstBeyondIndex,
        firstReversal: stab.firstReversal,
      }),
    };
  }
}
