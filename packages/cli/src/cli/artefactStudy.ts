import { LifeSession, type LifeJob, type LifeLoopColumns, type LifeReport } from '@loopwise/engine';
import type { ChannelArtefacts, SignalWarning } from '@loopwise/ingest';
import { formatNumber } from '../report/formatNumber.js';

/**
 * Which samples the signal checks flagged, for lookups by sample index: the spikes (one sample
 * each) and the runs (flat lines and dropouts), both sorted. Lookups cost a binary search, so
 * they are for loops (a few per hundred samples), not for every sample.
 */
export class FlaggedSamples {
  private readonly runFirst: Float64Array;
  private readonly runEnd: Float64Array;

  constructor(readonly artefacts: ChannelArtefacts) {
    const n = artefacts.runs.length / 2;
    this.runFirst = new Float64Array(n);
    this.runEnd = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      this.runFirst[k] = artefacts.runs[2 * k];
      this.runEnd[k] = artefacts.runs[2 * k] + artefacts.runs[2 * k + 1];
    }
  }

  get spikeCount(): number {
    return this.artefacts.spikes.length;
  }

  get runCount(): number {
    return this.runFirst.length;
  }

  get runSamples(): number {
    let s = 0;
    for (let k = 0; k < this.runFirst.length; k++) s += this.runEnd[k] - this.runFirst[k];
    return s;
  }

  get empty(): boolean {
    return this.spikeCount === 0 && this.runCount === 0;
  }

  /** Whether sample `i` is a spike or lies in a run. */
  has(i: number): boolean {
    const s = this.artefacts.spikes;
    if (s.length > 0 && s[lastAtOrBelow(s, i)] === i) return true;
    if (this.runFirst.length === 0) return false;
    const k = lastAtOrBelow(this.runFirst, i);
    return k >= 0 && this.runFirst[k] <= i && i < this.runEnd[k];
  }
}

/** The last position of a sorted array whose value is <= x (-1 when none). */
function lastAtOrBelow(a: Float64Array, x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo - 1;
}

/**
 * The history with its flagged samples removed, chunk by chunk: a spike is replaced by the
 * straight line between the samples on either side of it (its neighbours; adjacent spikes share
 * one line), and the samples of a run are cut out, so the samples on either side of it meet. A
 * spike waits for its right neighbour, so a chunk may come out shorter and the next one longer;
 * `finish()` gives what is still held (a spike at the very end takes its left neighbour's value).
 * Chunks without a flagged sample pass through without a copy.
 */
export class ArtefactRemover {
  private nextSpike = 0;
  private nextRun = 0;
  private held = 0;
  private left = NaN;

  constructor(private readonly flagged: FlaggedSamples) {}

  /** The cleaned samples of `values` (samples `first` … `first + values.length − 1` of the history). */
  push(values: Float64Array, first: number): Float64Array {
    const spikes = this.flagged.artefacts.spikes;
    const runs = this.flagged.artefacts.runs;
    const end = first + values.length;
    const spikeHere = this.nextSpike < spikes.length && spikes[this.nextSpike] < end;
    const runHere = this.nextRun < runs.length / 2 && runs[2 * this.nextRun] < end;
    if (!spikeHere && !runHere && this.held === 0) {
      if (values.length > 0) this.left = values[values.length - 1];
      return values;
    }
    const out = new Float64Array(values.length + this.held);
    let w = 0;
    for (let j = 0; j < values.length; j++) {
      const i = first + j;
      while (this.nextRun < runs.length / 2 && runs[2 * this.nextRun] + runs[2 * this.nextRun + 1] <= i) this.nextRun++;
      if (this.nextRun < runs.length / 2 && runs[2 * this.nextRun] <= i) continue; // inside a run: cut out
      while (this.nextSpike < spikes.length && spikes[this.nextSpike] < i) this.nextSpike++;
      if (this.nextSpike < spikes.length && spikes[this.nextSpike] === i) {
        this.held++;
        continue;
      }
      const v = values[j];
      w = this.release(out, w, v);
      out[w++] = v;
      this.left = v;
    }
    return out.subarray(0, w);
  }

  /** The spikes still held at the end of the history, at their left neighbour's value. */
  finish(): Float64Array {
    const out = new Float64Array(this.held);
    out.fill(this.left === this.left ? this.left : 0);
    this.held = 0;
    return out;
  }

  /** Writes the held spikes on the line from the last kept sample to `right`. */
  private release(out: Float64Array, w: number, right: number): number {
    const h = this.held;
    if (h === 0) return w;
    const left = this.left === this.left ? this.left : right;
    for (let k = 1; k <= h; k++) {
      const t = k / (h + 1);
      out[w++] = (1 - t) * left + t * right;
    }
    this.held = 0;
    return w;
  }
}

/**
 * What the flagged samples of one channel do to its damage: the share of the damage per repeat
 * carried by the loops that start or turn at a flagged sample (on the measured history), and the
 * life with the flagged samples removed ({@link ArtefactRemover}). Two life sessions of the
 * channel's main correction, fed by the caller's reads: `push` every chunk of a read of the whole
 * file, then `endFirstPass()`; for a repeating history read again and `pushSecondPass` while
 * `secondPassNeeded()` says so; then `finish()`.
 */
export class ArtefactStudy {
  private readonly measured: LifeSession;
  private readonly cleaned: LifeSession;
  private readonly flaggedRows: number[] = [];
  private readonly flaggedDamage: number[] = [];
  private remover: ArtefactRemover;
  private cleanedNeed = 0;
  private cleanedSeen = 0;
  private measuredNeed = 0;
  private samples = 0;

  constructor(
    readonly channel: string,
    job: LifeJob,
    readonly flagged: FlaggedSamples,
  ) {
    this.measured = new LifeSession(job, { onLoops: (loops, firstRow) => this.note(loops, firstRow) });
    this.cleaned = new LifeSession(job, { keepLoops: false });
    this.remover = new ArtefactRemover(flagged);
  }

  push(values: Float64Array, first: number): void {
    this.samples = first + values.length;
    this.measured.push(values);
    this.cleaned.push(this.remover.push(values, first));
  }

  /**
   * Ends the first read; returns how many samples from the start the second read must give (0:
   * none). The cleaned history is shorter by the samples cut out, so its need is met at most that
   * many samples later in the file.
   */
  endFirstPass(): number {
    this.cleaned.push(this.remover.finish());
    this.measuredNeed = this.measured.endFirstPass();
    this.cleanedNeed = this.cleaned.endFirstPass();
    this.remover = new ArtefactRemover(this.flagged);
    const cleanedBound = this.cleanedNeed > 0 ? Math.min(this.samples, this.cleanedNeed + this.flagged.runSamples + this.flagged.spikeCount) : 0;
    return Math.max(this.measuredNeed, cleanedBound);
  }

  pushSecondPass(values: Float64Array, first: number): void {
    const left = this.measuredNeed - first;
    if (left > 0) this.measured.pushSecondPass(left >= values.length ? values : values.subarray(0, left));
    const want = this.cleanedNeed - this.cleanedSeen;
    if (want > 0) {
      const c = this.remover.push(values, first);
      const take = want >= c.length ? c : c.subarray(0, want);
      this.cleaned.pushSecondPass(take);
      this.cleanedSeen += take.length;
    }
  }

  /** The study as a warning of the channel (kind 'artefact-damage'), with both lives side by side, and its figures. */
  finish(measuredReport: LifeReport): { warning: SignalWarning; figures: ArtefactFigures } {
    const want = this.cleanedNeed - this.cleanedSeen;
    if (want > 0) {
      // the held spikes at the very end of the history
      const rest = this.remover.finish().subarray(0, want);
      if (rest.length > 0) this.cleaned.pushSecondPass(rest);
    }
    const measured = this.measured.finish();
    const cleaned = this.cleaned.finish();
    let flagged = 0;
    for (const r of this.measured.reportedLoopRows) {
      for (let k = lowerBound(this.flaggedRows, r.from); k < this.flaggedRows.length && this.flaggedRows[k] < r.to; k++) flagged += this.flaggedDamage[k];
    }
    const total = measured.damage.perRepeat;
    const share = total > 0 ? flagged / total : 0;
    const f = this.flagged;
    const what = [f.spikeCount > 0 ? `${f.spikeCount} spike(s) interpolated` : '', f.runCount > 0 ? `${f.runCount} flat or zero run(s) of ${f.runSamples} samples cut out` : ''].filter(Boolean).join(' and ');
    const lifeOf = (l: LifeReport['life']) => `${formatNumber(l.repeats)} repeats` + (l.service !== undefined && l.unit !== undefined ? ` (${formatNumber(l.service)} ${l.unit})` : '');
    const ratio = cleaned.life.repeats / measuredReport.life.repeats;
    const change = Number.isFinite(ratio) && ratio > 0 ? `, ${formatNumber(ratio, 3)} × the life as measured` : '';
    const figures: ArtefactFigures = {
      spikes: f.spikeCount,
      runs: f.runCount,
      runSamples: f.runSamples,
      shareOfDamage: share,
      repeatsAsMeasured: measuredReport.life.repeats,
      repeatsCleaned: cleaned.life.repeats,
    };
    // flagged samples that change nothing (no damaging loop at them, the same life to 1e-3) say so in few words
    const idle = share < 1e-3 && Number.isFinite(ratio) && Math.abs(ratio - 1) < 1e-3;
    const warning: SignalWarning = {
      kind: 'artefact-damage',
      channel: this.channel,
      samples: f.spikeCount + f.runSamples,
      ranges: [],
      rangesOmitted: 0,
      message: idle
        ? `${this.channel}: no damaging loop starts or turns at a flagged sample, and with them removed (${what}) the life is the same, ${lifeOf(measuredReport.life)}.`
        : `${this.channel}: loops that start or turn at a flagged sample carry ${formatNumber(100 * share, 3)} % of the damage; ` +
        `with the flagged samples removed (${what}) the life is ${lifeOf(cleaned.life)}${change} (as measured: ${lifeOf(measuredReport.life)}). ` +
        'Look at the flagged samples before trusting either figure.',
    };
    return { warning, figures };
  }

  private note(loops: LifeLoopColumns, firstRow: number): void {
    const n = loops.count.length;
    for (let i = 0; i < n; i++) {
      if (loops.damage[i] > 0 && (this.flagged.has(loops.startIndex[i]) || this.flagged.has(loops.turnIndex[i]))) {
        this.flaggedRows.push(firstRow + i);
        this.flaggedDamage.push(loops.damage[i]);
      }
    }
  }
}

/** The figures of one channel's artefact study, for the JSON (`channels[].artefactStudy`). */
export interface ArtefactFigures {
  /** One-sample spikes, interpolated between their neighbours. */
  spikes: number;
  /** Flat or zero runs, cut out, and their samples. */
  runs: number;
  runSamples: number;
  /** Share (0…1) of the damage per repeat carried by loops that start or turn at a flagged sample. */
  shareOfDamage: number;
  /** Life in repeats as measured and with the flagged samples removed. */
  repeatsAsMeasured: number;
  repeatsCleaned: number;
}

/** The first position of a sorted array whose value is >= x. */
function lowerBound(a: number[], x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
