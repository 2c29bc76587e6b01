import { resolveLifeJob, type LifeJob, type ResolvedJob } from '@loopwise/engine';
import { createWalker, damageParameters, type DamageParameter } from '@loopwise/mean-stress';
import { damageInto, residueHalfCycles } from '@loopwise/miner';
import { RepeatingNotchTracker, type NotchTrackerOptions } from '@loopwise/notch';
import { ReversalFilter } from '@loopwise/rainflow';
import type { OutputSink } from './OutputSet';
import { SpoolFile } from './SpoolFile';

/** A sink that begins every line with `prefix`. */
function prefixed(sink: OutputSink, prefix: string): OutputSink {
  if (prefix === '') return sink;
  let atStart = true;
  return {
    write: (text: string) => {
      const out = (atStart ? prefix : '') + text.replace(/\n(?=.)/gs, `\n${prefix}`);
      atStart = text.endsWith('\n');
      return sink.write(out);
    },
  };
}

/** Rows between two noted byte offsets of the spool (memory: 8 bytes per this many loops). */
const CHECKPOINT = 256;

/** A sink that passes on only the lines `[from, to)`, counting lines from row `first`. */
function rowsOf(sink: OutputSink, first: number, from: number, to: number): OutputSink {
  let row = first;
  let carry = '';
  return {
    write: async (text: string) => {
      const lines = (carry + text).split('\n');
      carry = lines.pop() as string;
      const keep: string[] = [];
      for (const line of lines) {
        if (row >= from && row < to) keep.push(line + '\n');
        row++;
      }
      if (keep.length > 0) await sink.write(keep.join(''));
    },
  };
}

/** Samples per block through the gate (as the engine's life session). */
const BLOCK = 65536;

/** The loop columns one CSV row is written from. */
interface RowColumns {
  stressMax: ArrayLike<number>;
  stressMin: ArrayLike<number>;
  strainMax: ArrayLike<number>;
  strainMin: ArrayLike<number>;
  startIndex: ArrayLike<number>;
  turnIndex: ArrayLike<number>;
  closeIndex: ArrayLike<number>;
  count: ArrayLike<number>;
}

/**
 * The loops of one channel for `--cycles-out`, written to a spool on disk as they close, so the
 * loop table never sits in memory (issue 16). It follows the stages of the engine's
 * `LifeSession` step by step with the same public pieces — the gate (`ReversalFilter`), the
 * notch package's `RepeatingNotchTracker` (which owns the repeating pass: what the second pass
 * needs and which rows make the stabilised pass), the mean-stress kernels, miner's
 * `damageInto` and `residueHalfCycles` — and writes every row of both passes to the spool with
 * its byte offset noted; at the end the rows of the stabilised pass (or, for a one-off history,
 * of the first pass and its residue half cycles) are copied into the output. Its rows equal the
 * loop table of a `LifeSession` with `keepLoops: true` value for value (a test checks it).
 *
 * This duplicates the session's short recipe until the engine offers a loop sink (see the CLI
 * docs); the damage in the report does not come from here but from the session's totals.
 */
export class LoopStream {
  private readonly job: ResolvedJob;
  private readonly gate: number;
  private readonly tracker: RepeatingNotchTracker;
  private filter: ReversalFilter;
  private readonly parameter: DamageParameter;
  private readonly tv = new Float64Array(BLOCK + 2);
  private readonly ti = new Float64Array(BLOCK + 2);
  private readonly spool = new SpoolFile('the loops of --cycles-out');
  /** Byte offset in the spool of every CHECKPOINT-th row (row k·CHECKPOINT at index k). */
  private offsets = new Float64Array(1024);
  private rows = 0;
  private bytes = 0;
  private stage: 'first' | 'second' | 'done' = 'first';
  private samples = 0;
  private secondNeeded = 0;
  private secondSeen = 0;
  private range: [number, number] = [0, 0];
  private residueRows = 0;

  constructor(lifeJob: LifeJob) {
    const j = resolveLifeJob(lifeJob);
    this.job = j;
    this.gate = j.gate ?? (j.gateFraction !== undefined ? j.gateFraction * (j.fullScale as number) : 0);
    this.filter = new ReversalFilter({ gate: this.gate, keepLeadingExtremes: true });
    const o: NotchTrackerOptions = { material: j.material, input: j.input, rule: j.rule, loadToStress: j.loadToStress, initial: j.initial, offset: j.offset, tolerance: j.tolerance, recordReversals: false };
    if (j.Kt !== undefined) o.Kt = j.Kt;
    if (j.Kf !== undefined) o.Kf = j.Kf;
    this.tracker = new RepeatingNotchTracker(o);
    this.parameter = j.meanStress === 'walker' ? createWalker({ gamma: j.walkerGamma ?? 'steel-from-Su' }) : (damageParameters[j.meanStress] as DamageParameter);
  }

  /** Next samples of the first pass (the engine session has checked them already). */
  push(chunk: ArrayLike<number>): void {
    for (let s = 0; s < chunk.length; s += BLOCK) {
      const e = Math.min(chunk.length, s + BLOCK);
      this.feed(this.filter.pushRange(chunk, s, e, this.tv, this.ti, 0), false);
    }
    this.samples += chunk.length;
  }

  /** Ends the first pass; the samples from 0 to push again (0 for a one-off history). */
  endFirstPass(): number {
    if (this.stage !== 'first') return this.secondNeeded;
    this.feed(this.filter.pendingInto(this.tv, this.ti, 0), false);
    if (this.samples === 0 || !this.job.repeating) {
      this.stage = 'done';
      return 0;
    }
    const need = this.tracker.endFirstPass();
    this.secondNeeded = need.whole ? this.samples : need.throughIndex + 1;
    this.filter = new ReversalFilter({ gate: this.gate, keepLeadingExtremes: true });
    this.stage = 'second';
    return this.secondNeeded;
  }

  /** The samples to push again, known once the first pass has ended. */
  get secondPassSamples(): number {
    return this.secondNeeded;
  }

  /** The history's samples again, from sample 0 on; samples past the need are ignored. */
  pushSecondPass(chunk: ArrayLike<number>): void {
    if (this.stage !== 'second') return;
    const want = Math.min(chunk.length, this.secondNeeded - this.secondSeen);
    for (let s = 0; s < want; s += BLOCK) this.feed(this.filter.pushRange(chunk, s, Math.min(want, s + BLOCK), this.tv, this.ti, 0), true);
    this.secondSeen += want;
    if (this.secondSeen === this.secondNeeded) {
      this.feed(this.filter.pendingInto(this.tv, this.ti, 0), true);
      this.stage = 'done';
    }
  }

  /** Ends the tracking (which spooled rows the output holds); returns this stream. */
  finish(): this {
    this.endFirstPass();
    const r = this.tracker.finish();
    this.take(r.loops.columns());
    if (this.job.repeating && r.stabilised !== null) this.range = [r.stabilised.loopFrom, r.stabilised.loopTo];
    else {
      this.range = [r.first.loopFrom, r.first.loopTo];
      if (!this.job.repeating) {
        // a one-off history: its open loops as half cycles, after its closed loops
        const half = residueHalfCycles(r.first.residue.columns());
        const from = this.rows;
        this.write(half);
        this.residueRows = this.rows - from;
      }
    }
    this.spool.close();
    return this;
  }

  /**
   * Copies the rows of the output into `sink`, each line begun with `prefix` (the channel's
   * CSV field and its comma; the spool holds the rows without it).
   */
  async copyTo(sink: OutputSink, prefix = ''): Promise<void> {
    const [from, to] = this.range;
    const residueStart = this.rows - this.residueRows;
    const lines = prefixed(sink, prefix);
    await this.copyRows(lines, from, Math.min(to, residueStart));
    // a one-off history: the residue half cycles, written after every other row
    if (this.residueRows > 0) await this.copyRows(lines, residueStart, this.rows);
  }

  /** Copies spooled rows `[from, to)`: from the checkpoint at or before `from` to the one at or after `to`, lines filtered. */
  private async copyRows(sink: OutputSink, from: number, to: number): Promise<void> {
    if (to <= from) return;
    const a = Math.floor(from / CHECKPOINT);
    const b = Math.ceil(to / CHECKPOINT);
    const end = b * CHECKPOINT >= this.rows ? this.bytes : this.offsets[b];
    await this.spool.copyRangeTo(rowsOf(sink, a * CHECKPOINT, from, to), this.offsets[a], end);
  }

  /**
   * Calls `each(strainRange, meanStress, count)` for every loop of the output, read back from
   * the spool (for the HTML's loop matrix and loop count).
   */
  async forEachLoop(each: (strainRange: number, meanStress: number, count: number) => void): Promise<void> {
    let carry = '';
    await this.copyTo({
      write: async (text: string) => {
        const lines = (carry + text).split('\n');
        carry = lines.pop() as string;
        for (const line of lines) {
          // start_sample … close_sample, start_event, turn_event, count, stress_max, stress_min, strain_max, strain_min, …
          const f = line.split(',');
          each(Number(f[8]) - Number(f[9]), (Number(f[6]) + Number(f[7])) / 2, Number(f[5]));
        }
      },
    });
  }

  /** Removes the spool. */
  remove(): void {
    this.spool.remove();
  }

  private feed(k: number, again: boolean): void {
    if (k === 0) return;
    if (again) this.tracker.pushAgain(this.tv, this.ti, 0, k);
    else this.tracker.push(this.tv, this.ti, 0, k);
    this.take(this.tracker.takeLoops().loops.columns());
  }

  private take(cols: RowColumns & { count: Float64Array }): void {
    if (cols.count.length > 0) this.write(cols);
  }

  /** Evaluates loop rows and appends them to the spool, noting each row's byte offset. */
  private write(cols: RowColumns): void {
    const n = cols.count.length;
    if (n === 0) return;
    const j = this.job;
    const rev = new Float64Array(n);
    const flags = new Uint8Array(n);
    const value = new Float64Array(n);
    const local = { stressMax: Float64Array.from(cols.stressMax), stressMin: Float64Array.from(cols.stressMin), strainMax: Float64Array.from(cols.strainMax), strainMin: Float64Array.from(cols.strainMin) };
    this.parameter.reversalsToFailureInto(j.material, local, rev, flags);
    this.parameter.parameterValueInto(j.material, local, value);
    const life = new Float64Array(n);
    for (let i = 0; i < n; i++) life[i] = rev[i] / 2;
    const damage = new Float64Array(n);
    damageInto(cols.count, life, damage, j.cutoffCycles === undefined ? {} : { cutoff: { cycles: j.cutoffCycles } });
    const need = Math.floor((this.rows + n) / CHECKPOINT) + 2;
    if (need > this.offsets.length) {
      const bigger = new Float64Array(Math.max(2 * this.offsets.length, need));
      bigger.set(this.offsets);
      this.offsets = bigger;
    }
    const ev = (x: number) => (x < 0 ? '' : 'history');
    for (let i = 0; i < n; i++) {
      const line =
        `${cols.startIndex[i]},${cols.turnIndex[i]},${cols.closeIndex[i]},${ev(cols.startIndex[i])},${ev(cols.turnIndex[i])},` +
        `${cols.count[i]},${local.stressMax[i]},${local.stressMin[i]},${local.strainMax[i]},${local.strainMin[i]},${value[i]},${life[i] === Infinity ? 'inf' : life[i]},${damage[i]}\n`;
      if (this.rows % CHECKPOINT === 0) this.offsets[this.rows / CHECKPOINT] = this.bytes;
      this.rows++;
      this.bytes += Buffer.byteLength(line);
      this.spool.append(line);
    }
  }
}
