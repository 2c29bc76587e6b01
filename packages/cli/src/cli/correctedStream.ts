import { NeumaierAdder } from '@loopwise/base';
import type { ChannelArtefacts, IngestChunk, IngestReport, ReaderOptions } from '@loopwise/ingest';
import { removeOffset, zeroPhaseLowPassInto, type CorrectionRecord } from '@loopwise/signal';
import { UsageError } from './CliError';
import type { CorrectionJob, SampleCut, TimeCut } from './CliJob';
import { spikeInterpolatedReader } from './spikeInterpolation';
import { checkCutoff, DEFAULT_LOW_PASS_ORDER, offsetInEngineUnit, offsetInOwnUnit, offsetRecord, recordOf, settingName, spikeRecord } from './signalCorrections';
import { rateOfStep, timeBaseOf } from './timeBase';

type Read = (options: ReaderOptions) => Promise<IngestReport>;

/** What the single-file route needs of a first read (progress and the memory guard). */
export interface CorrectionContext {
  /**
   * The reader options of the job (channels, name, time, dialect). The samples are in the unit
   * these channels convert to: the engine unit when they are the job's channels (assess), the
   * file's own unit when they read the values as they are (count); a given offset, in the job
   * channel's own unit, is converted like the samples.
   */
  options: Omit<ReaderOptions, 'onChunk'>;
  /**
   * What the caller also gives in the file's sample numbers after a cut, for the cut's record
   * (its sample numbers count the samples kept); default `'the worst loops'`, null for nothing.
   */
  alsoInFileNumbers?: string | null;
  check: (where: () => string) => void;
  at: (chunk: { firstSample: number; length: number }) => () => string;
  progress?: (samples: number, pass: 1 | 2 | 3) => void;
}

/** The reads of a single file with the job's corrections applied, and what they did. */
export interface CorrectedStream {
  /** Reads the corrected samples (the same every time; a partial read with `stopAfterSamples` counts corrected samples). */
  read: Read;
  /** The spikes interpolated on each channel (the first read's signal checks), or null when not asked. */
  spikes: Float64Array[] | null;
  /** Whether ranges are cut out: the corrected history's sample numbers then count the samples kept. */
  cut: boolean;
  /** The places cut out, flat [first, length] in the file's sample numbers (known after the first full read; empty without a cut). */
  cutOut(): Float64Array;
  /** Samples of the corrected history (known after the first full read). */
  samples(): number;
  /** The corrections applied to channel k, in the order applied (known after the first full read). */
  records(k: number): CorrectionRecord[];
  /** A channel's flagged samples in the corrected history's numbering (those cut out dropped). */
  artefactsAfterCut(a: ChannelArtefacts): ChannelArtefacts;
}

/**
 * The single file's reads with the corrections the job asks for, in this order: spikes
 * interpolated (at the file's sample numbers; a first read finds them), sample and time ranges
 * cut out (the history joined across each cut), an offset subtracted (the mean needs a first
 * read of the kept samples), and the zero-phase low-pass (the whole channel held in memory, then
 * filtered, then handed on from memory: the file is read once for it). Streams (memory flat)
 * unless the low-pass is asked. The command and the browser page both read through here.
 */
export async function correctedStream(job: CorrectionJob, givenRead: Read, ctx: CorrectionContext): Promise<CorrectedStream> {
  const channels = job.channels;
  const extra: CorrectionRecord[][] = channels.map(() => []);
  let read = givenRead;
  let spikes: Float64Array[] | null = null;
  let flatRuns: number[] = [];
  if (job.interpolateSpikes || job.excludeFlatRuns) {
    // one first read with the signal checks finds the spikes and the flat runs
    const pre = await givenRead({ ...ctx.options, onChunk: (chunk) => { ctx.check(ctx.at(chunk)); ctx.progress?.(chunk.firstSample + chunk.length, 3); } });
    if (job.interpolateSpikes) {
      spikes = channels.map((_, k) => pre.artefacts?.[k]?.spikes ?? new Float64Array(0));
      read = spikeInterpolatedReader(givenRead, spikes);
    }
    if (job.excludeFlatRuns) flatRuns = unionOfRuns(channels.map((_, k) => pre.artefacts?.[k]?.runs ?? new Float64Array(0)));
  }
  const samplesCut = job.excludeSamples ?? [];
  const timesCut = job.excludeTimes ?? [];
  const cut = samplesCut.length > 0 || timesCut.length > 0 || flatRuns.length > 0 ? new RangeCut(job, samplesCut, timesCut, flatRuns, ctx.alsoInFileNumbers === undefined ? 'the worst loops' : ctx.alsoInFileNumbers) : null;
  if (cut !== null) read = cut.reader(read);
  // samples of the corrected history, from the first full read
  const counted = { samples: -1 };
  const countingRead = read;
  read = async (options) => {
    let n = 0;
    const report = await countingRead({ ...options, ...(options.onChunk ? { onChunk: (c: IngestChunk) => { n += c.length; options.onChunk?.(c); } } : {}) });
    if (options.stopAfterSamples === undefined && options.onChunk && counted.samples < 0) counted.samples = n;
    return report;
  };
  const offsetRecords: ((n: number) => CorrectionRecord)[] = [];
  if (job.subtractOffset !== undefined) {
    // each channel as read: its samples' unit (engine units, or the file's own for a count)
    const asRead = ctx.options.channels;
    let offsets: number[];
    if (job.subtractOffset === 'mean') {
      const sums = channels.map(() => new NeumaierAdder());
      let n = 0;
      await read({
        ...ctx.options,
        checks: false,
        onChunk: (chunk) => {
          chunk.channels.forEach((v, k) => {
            const s = sums[k];
            for (let i = 0; i < chunk.length; i++) s.add(v[i]);
          });
          n += chunk.length;
          ctx.check(ctx.at(chunk));
          ctx.progress?.(chunk.firstSample + chunk.length, 3);
        },
      });
      offsets = sums.map((s) => (n === 0 ? 0 : s.valueOf() / n));
    } else {
      const given = job.subtractOffset;
      offsets = channels.map((_, k) => offsetInEngineUnit(asRead[k], given));
    }
    const mean = job.subtractOffset === 'mean';
    // the record in the job channel's own unit (µε for a microstrain channel), as the offset is given
    channels.forEach((c, k) => offsetRecords.push((n) => offsetRecord(c, mean ? offsetInOwnUnit(asRead[k], offsets[k]) : (job.subtractOffset as number), n, mean)));
    read = offsetReader(read, offsets);
  }
  if (job.lowPass !== undefined) read = lowPassHeld(job, read, ctx, extra);
  const samples = () => counted.samples;
  return {
    read,
    spikes,
    cut: cut !== null,
    cutOut: () => Float64Array.from(cut?.placesCut() ?? []),
    samples,
    records: (k) => [
      ...(spikes !== null && spikes[k].length > 0 ? [spikeRecord(spikes[k])] : []),
      ...(cut !== null ? [cut.record(samples())] : []),
      ...(offsetRecords.length > 0 ? [offsetRecords[k](samples())] : []),
      ...extra[k],
    ],
    artefactsAfterCut: (a) => (cut === null ? a : cut.artefacts(a)),
  };
}

/**
 * The union of the channels' flat runs (each flat [first, length] pairs in increasing order) as
 * flat [first, length] pairs in increasing order, runs that overlap or touch made one.
 *
 * @example
 * unionOfRuns([Float64Array.of(10, 5, 40, 3), Float64Array.of(12, 8)]);
 * // returns [10, 10, 40, 3]
 */
export function unionOfRuns(runs: readonly ArrayLike<number>[]): number[] {
  const all: [number, number][] = [];
  for (const r of runs) for (let p = 0; p + 1 < r.length; p += 2) if (r[p + 1] > 0) all.push([r[p], r[p] + r[p + 1]]);
  all.sort((a, b) => a[0] - b[0]);
  const out: number[] = [];
  for (const [from, to] of all) {
    const m = out.length;
    if (m > 0 && from <= out[m - 2] + out[m - 1]) out[m - 1] = Math.max(out[m - 2] + out[m - 1], to) - out[m - 2];
    else out.push(from, to - from);
  }
  return out;
}

/**
 * A reader whose chunks have every channel's samples less `offsets[k]` (in the chunk's unit),
 * by @loopwise/signal's removeOffset on each chunk. Any chunking gives the same samples.
 */
export function offsetReader(read: Read, offsets: readonly number[]): Read {
  return (options) => {
    const onChunk = options.onChunk;
    if (!onChunk) return read(options);
    return read({
      ...options,
      onChunk: (chunk) => {
        const shifted = chunk.channels.map((v, k) => removeOffset(v.subarray(0, chunk.length), { offset: offsets[k] }).values);
        onChunk({ firstSample: chunk.firstSample, length: chunk.length, channels: shifted, time: chunk.time });
      },
    });
  };
}

/**
 * Sample and time ranges cut out of a file's samples as they stream. The first full read finds
 * the places (sample number and length in the file) and checks the ranges against the record;
 * every read after it cuts those places. The chunks handed on are numbered in the corrected
 * (joined) history, so a partial read's `stopAfterSamples` counts kept samples.
 */
export class RangeCut {
  /** The places cut out, flat [first, length] in the file's sample numbers, once a full read found them. */
  private places: number[] | null = null;
  private fileSamples = 0;

  /**
   * @param alsoInFileNumbers - what the caller also gives in the file's sample numbers, for the
   *   record's summary (`'the worst loops'`), or null for nothing; default null
   */
  constructor(
    private readonly job: CorrectionJob,
    private readonly samples: readonly SampleCut[],
    private readonly times: readonly TimeCut[],
    /** The flat runs found by the signal checks, flat [first, length] in increasing order (`excludeFlatRuns`). */
    private readonly flatRuns: readonly number[] = [],
    private readonly alsoInFileNumbers: string | null = null,
  ) {}

  /** A reader of the kept samples from `read`, the reader of the file (or of its corrected samples). */
  reader(read: Read): Read {
    return async (options) => {
      const onChunk = options.onChunk;
      if (!onChunk) return read(options);
      const places = this.places;
      if (places === null) {
        if (options.stopAfterSamples !== undefined) throw new Error('RangeCut: a partial read before the first full one');
        return this.firstRead(read, options, onChunk);
      }
      let stop: number | undefined;
      if (options.stopAfterSamples !== undefined) stop = this.fileEndOf(options.stopAfterSamples);
      let p = 0;
      let kept = 0;
      return read({
        ...options,
        ...(stop !== undefined ? { stopAfterSamples: stop } : {}),
        onChunk: (chunk) => {
          const keep = new Uint8Array(chunk.length);
          for (let j = 0; j < chunk.length; j++) {
            const i = chunk.firstSample + j;
            while (p < places.length && places[p] + places[p + 1] <= i) p += 2;
            keep[j] = p < places.length && places[p] <= i ? 0 : 1;
          }
          kept = this.handOn(chunk, keep, kept, onChunk);
        },
      });
    };
  }

  private async firstRead(read: Read, options: ReaderOptions, onChunk: (c: IngestChunk) => void): Promise<IngestReport> {
    const s = this.samples;
    const t = this.times;
    const rate = this.job.time !== undefined && 'sampleRate' in this.job.time ? this.job.time.sampleRate : null;
    const places: number[] = [];
    const caught = t.map(() => false);
    const runs = this.flatRuns;
    let lo = Infinity;
    let hi = -Infinity;
    let sp = 0;
    let rp = 0;
    let kept = 0;
    const report = await read({
      ...options,
      onChunk: (chunk) => {
        const keep = new Uint8Array(chunk.length);
        const time = chunk.time;
        for (let j = 0; j < chunk.length; j++) {
          const i = chunk.firstSample + j;
          let out = false;
          while (sp < s.length && s[sp].last < i) sp++;
          if (sp < s.length && s[sp].first <= i) out = true;
          while (rp < runs.length && runs[rp] + runs[rp + 1] <= i) rp += 2;
          if (rp < runs.length && runs[rp] <= i) out = true;
          if (t.length > 0) {
            // as excludeRanges of @loopwise/signal: t = i / rate with a sample rate, else the column's value
            const ti = time !== null ? time[j] : i / (rate as number);
            if (ti < lo) lo = ti;
            if (ti > hi) hi = ti;
            for (let k = 0; k < t.length; k++) {
              if (ti >= t[k].startTime && ti <= t[k].endTime) {
                out = true;
                caught[k] = true;
              }
            }
          }
          if (out) {
            const m = places.length;
            if (m > 0 && places[m - 2] + places[m - 1] === i) places[m - 1]++;
            else places.push(i, 1);
          }
          keep[j] = out ? 0 : 1;
        }
        kept = this.handOn(chunk, keep, kept, onChunk);
      },
    });
    const n = report.samples;
    const name = options.name ?? 'the file';
    s.forEach((r, k) => {
      if (r.last > n - 1) throw new UsageError(`${settingName(this.job, `excludeSamples[${k}]`, 'exclude-samples')}: ${r.first}..${r.last} goes beyond the record: ${name} has samples 0 to ${n - 1}`);
    });
    t.forEach((r, k) => {
      if (!caught[k]) {
        const span = lo <= hi ? `its time runs from ${lo} to ${hi}` : 'it has no samples';
        throw new UsageError(`${settingName(this.job, `excludeTimes[${k}]`, 'exclude-time')}: ${r.startTime}..${r.endTime} holds no sample of ${name} (${span}${rate !== null ? ' s' : ", in the time column's unit"})`);
      }
    });
    if (kept === 0) {
      const [field, flag] = s.length > 0 ? ['excludeSamples', 'exclude-samples'] : t.length > 0 ? ['excludeTimes', 'exclude-time'] : ['excludeFlatRuns', 'exclude-flat-runs'];
      throw new UsageError(`${settingName(this.job, field, flag)}: cuts out every sample of ${name}; nothing is left to assess`);
    }
    this.places = places;
    this.fileSamples = n;
    return report;
  }

  /** Hands on the kept samples of a chunk, numbered from `kept` (the kept samples before it); returns the kept samples after it. */
  private handOn(chunk: IngestChunk, keep: Uint8Array, kept: number, onChunk: (c: IngestChunk) => void): number {
    let m = 0;
    for (let j = 0; j < keep.length; j++) m += keep[j];
    const pick = (v: Float64Array) => {
      const out = new Float64Array(m);
      let q = 0;
      for (let j = 0; j < keep.length; j++) if (keep[j] === 1) out[q++] = v[j];
      return out;
    };
    if (m > 0) onChunk({ firstSample: kept, length: m, channels: chunk.channels.map(pick), time: chunk.time ? pick(chunk.time) : null });
    return kept + m;
  }

  /** The file samples to read for the first `kept` samples of the corrected history. */
  private fileEndOf(kept: number): number {
    if (kept <= 0) return 0;
    const places = this.places as number[];
    let f = kept - 1;
    for (let p = 0; p < places.length && places[p] <= f; p += 2) f += places[p + 1];
    return f + 1;
  }

  /** The places cut out, flat [first, length] in the file's sample numbers (empty before the first full read). */
  placesCut(): readonly number[] {
    return this.places ?? [];
  }

  /** The record of the cut: the places in the file's sample numbers, the samples cut, and the ranges asked. */
  record(keptSamples: number): CorrectionRecord {
    const places = this.places ?? [];
    let removed = 0;
    for (let p = 1; p < places.length; p += 2) removed += places[p];
    const shown = (list: string[]) => list.join(', ');
    const parameters: Record<string, string> = { joined: 'the history is joined across each cut' };
    if (this.samples.length > 0) parameters.sampleRanges = shown(this.samples.map((r) => `${r.first}..${r.last}`));
    if (this.times.length > 0) parameters.timeRanges = shown(this.times.map((r) => `${r.startTime}..${r.endTime}`)) + (this.job.time !== undefined && 'sampleRate' in this.job.time ? ' s' : " (time column's unit)");
    if (this.flatRuns.length > 0) {
      let inRuns = 0;
      for (let p = 1; p < this.flatRuns.length; p += 2) inRuns += this.flatRuns[p];
      parameters.flatRuns = `${this.flatRuns.length / 2} flat run(s) the signal checks found, ${inRuns} samples: ${shown(placesText(this.flatRuns))}`;
    }
    const where = places.length === 0 ? '' : `: samples ${shown(placesText(places))}`;
    return recordOf(
      'ranges-excluded',
      places,
      removed,
      parameters,
      `${places.length / 2} range(s) cut out (${removed} of ${this.fileSamples} samples${where}${this.flatRuns.length > 0 ? `; they hold the ${this.flatRuns.length / 2} flat run(s) the signal checks found` : ''}); the history is joined across each cut, ${keptSamples} samples kept; its sample numbers count the samples kept${this.alsoInFileNumbers === null ? '' : ` (${this.alsoInFileNumbers} are also given in the file's)`}`,
    );
  }

  /** Flagged samples in the corrected history's numbering: those cut out are dropped, the others move down by the samples cut before them. */
  artefacts(a: ChannelArtefacts): ChannelArtefacts {
    const places = this.places ?? [];
    const map = (i: number): number => {
      let before = 0;
      for (let p = 0; p < places.length; p += 2) {
        if (places[p] > i) break;
        if (i < places[p] + places[p + 1]) return -1;
        before += places[p + 1];
      }
      return i - before;
    };
    const spikes = Array.from(a.spikes, map).filter((i) => i >= 0);
    const runs: number[] = [];
    for (let r = 0; r < a.runs.length; r += 2) {
      // the run's kept samples, each piece between cuts as a run of its own
      let start = -1;
      let length = 0;
      for (let i = a.runs[r]; i < a.runs[r] + a.runs[r + 1]; i++) {
        const j = map(i);
        if (j >= 0 && start >= 0 && j === start + length) length++;
        else if (j >= 0) {
          if (length > 0) runs.push(start, length);
          start = j;
          length = 1;
        }
      }
      if (length > 0) runs.push(start, length);
    }
    return { spikes: Float64Array.from(spikes), runs: Float64Array.from(runs) };
  }
}

/** Places as `first..last` texts, the first five and how many more. */
function placesText(places: readonly number[]): string[] {
  const out: string[] = [];
  for (let p = 0; p < places.length && p < 10; p += 2) out.push(`${places[p]}..${places[p] + places[p + 1] - 1}`);
  if (places.length > 10) out.push(`… (${places.length / 2 - 5} more)`);
  return out;
}

/** Samples handed on per chunk from a channel held in memory. */
const HELD_CHUNK = 65536;

/**
 * The zero-phase low-pass of a streamed file: the first read holds every channel's samples in
 * memory with the time column, if any (8 bytes a sample and column, growing by doubling; the
 * command checks the file's size against its memory limit first and its memory guard stops the
 * read beyond it), finds the sample rate (given, or 1 / the mean step of an evenly stepped time
 * column), filters each channel in place (`zeroPhaseLowPassInto` of @loopwise/signal) and hands
 * it on; every read after it hands on the filtered samples from memory.
 */
function lowPassHeld(job: CorrectionJob, read: Read, ctx: CorrectionContext, records: CorrectionRecord[][]): Read {
  const lp = job.lowPass!;
  let held: { report: IngestReport; channels: Float64Array[]; time: Float64Array | null; length: number } | null = null;
  return async (options) => {
    if (held === null) {
      let length = 0;
      let channels = ctx.options.channels.map(() => new Float64Array(HELD_CHUNK));
      // the time column too, when the chunks carry one (a caller may draw against it)
      let time: Float64Array | null = null;
      // the report every read returns from here on: read with the signal checks on whatever the
      // first caller asked (a range pre-read asks none), so the warnings are there
      const { checks: _checks, stopAfterSamples: _stop, ...whole } = options;
      void _checks;
      void _stop;
      const report = await read({
        ...whole,
        onChunk: (chunk) => {
          if (length === 0 && chunk.time !== null) time = new Float64Array(channels[0].length);
          if (length + chunk.length > channels[0].length) {
            const grown = Math.max(length + chunk.length, 2 * channels[0].length);
            const grow = (v: Float64Array) => {
              const w = new Float64Array(grown);
              w.set(v.subarray(0, length));
              return w;
            };
            channels = channels.map(grow);
            if (time !== null) time = grow(time);
          }
          chunk.channels.forEach((v, k) => channels[k].set(v.subarray(0, chunk.length), length));
          if (time !== null && chunk.time !== null) time.set(chunk.time.subarray(0, chunk.length), length);
          length += chunk.length;
          ctx.check(() => `while holding ${options.name ?? 'the file'} in memory for ${settingName(job, 'lowPass', 'low-pass')} (sample ${length})`);
          ctx.progress?.(length, 3);
        },
      });
      const rate = sampleRateOf(job, report, options.name ?? 'the file');
      checkCutoff(job, rate);
      const order = lp.order ?? DEFAULT_LOW_PASS_ORDER;
      channels = channels.map((v, k) => {
        const x = v.subarray(0, length);
        const { correction } = zeroPhaseLowPassInto(x, x, { cutoff: lp.cutoffHz, sampleRate: rate, order });
        records[k].push(correction);
        return x;
      });
      held = { report, channels, time: time === null ? null : (time as Float64Array).subarray(0, length), length };
    }
    const h = held;
    const onChunk = options.onChunk;
    if (onChunk) {
      const end = options.stopAfterSamples === undefined ? h.length : Math.min(h.length, options.stopAfterSamples);
      for (let first = 0; first < end; first += HELD_CHUNK) {
        const m = Math.min(HELD_CHUNK, h.length - first);
        onChunk({ firstSample: first, length: m, channels: h.channels.map((v) => v.subarray(first, first + m)), time: h.time === null ? null : h.time.subarray(first, first + m) });
      }
    }
    return h.report;
  };
}

/** The sample rate of a file for the low-pass: the one given, or 1 / the mean step of an evenly stepped time column (in seconds). */
function sampleRateOf(job: CorrectionJob, report: IngestReport, name: string): number {
  if (job.time !== undefined && 'sampleRate' in job.time) return job.time.sampleRate;
  const base = timeBaseOf(report, job.timeSecondsPerUnit);
  if (base === null || !(base.step > 0)) {
    throw new UsageError(`${settingName(job, 'lowPass', 'low-pass')}: needs the sample rate, and the time column of ${name} does not give one (its steps are not even, or time does not increase): ${job.jobShown ? 'set "time" to { "sampleRate": … }' : 'give --sample-rate'}`);
  }
  return rateOfStep(base.step);
}
